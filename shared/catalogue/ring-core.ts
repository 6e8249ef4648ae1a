// A ring core (ferrite ring or powder toroid) as a CoreShape, from its nominal
// dimensions: IEC 60205 effective parameters plus the winding-space conventions of
// CoreShape for rings and the estimation rules written down in core-data/SOURCES.md.

import type { CoreShape } from '@shared/engine/types';
import { type RingDimensions, ringEffectiveParameters } from './iec60205';

export type RingFamily = 'RING' | 'POWDER_TOROID';

// Sizing of the winding for MLT and surface: a winding filling this fraction of the hole
// (typical machine-wound toroid fill is 30–50 %).
export const RING_REFERENCE_FILL = 0.4;

/** Radial build of a winding that fills `fill` of the hole area, measured on the inside. */
export function ringInnerBuild(innerDiameter: number, fill = RING_REFERENCE_FILL): number {
  return (innerDiameter / 2) * (1 - Math.sqrt(1 - fill));
}

export interface RingCoreInput {
  id: string;
  family: RingFamily;
  dimensions: RingDimensions;
  source: string;
}

export function ringCoreShape({ id, family, dimensions, source }: RingCoreInput): CoreShape {
  const { outerDiameter, innerDiameter, height } = dimensions;
  const { le, ae, ve } = ringEffectiveParameters(dimensions);
  const build = ringInnerBuild(innerDiameter);

  // One turn round the rectangular section, its wire offset by half the build all round.
  const mlt = outerDiameter - innerDiameter + 2 * height + 2 * Math.PI * (build / 2);

  // Wound toroid as a solid cylinder grown by the build on every face.
  const woundDiameter = outerDiameter + 2 * build;
  const woundHeight = height + 2 * build;
  const surfaceArea = (Math.PI * woundDiameter ** 2) / 2 + Math.PI * woundDiameter * woundHeight;

  return {
    id,
    family,
    // Rings have no discrete gap: the material's own permeability sets the inductance.
    gapKind: 'distributed',
    ae,
    le,
    ve,
    windowArea: (Math.PI * innerDiameter ** 2) / 4,
    windowHeight: height,
    bobbinWidth: Math.PI * innerDiameter,
    bobbinHeight: innerDiameter / 2,
    mlt,
    surfaceArea,
    ring: { od: outerDiameter, id: innerDiameter, height },
    source,
  };
}
