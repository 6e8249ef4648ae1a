// A design as an axisymmetric field model: the core as a body of revolution (revolvedCore: the centre leg a cylinder
// of the core's Ae, the window its height G and width Wa/G, the outer leg of area Ae/(Ac/Ao)), the gap ground into the
// centre leg or a spacer under every leg (the halves then stand apart by the spacer), and every conductor where the
// engine's layout puts it: layers outward from the centre leg, turns along the bobbin width centred on the gap's
// mid-plane, the last layer filled from the bottom. Each wire in hand is its own round conductor of its bare diameter
// carrying an equal share of the turn's current (parallel wires side by side in one layer share it nearly equally —
// an approximation, stated); a foil turn is a rectangle of its thickness across the foil width. The whole height is
// modelled (no symmetry plane), so uneven layers need no special case. Bad geometry is refused here, by field.
import type { CoreShape, GapPlacement, WireOption } from '@shared/engine/types';
import { foilWidth } from '@shared/engine/winding';
import { revolvedCore } from './gapped-core.ts';
import type { Outline, Surface } from './geo-builder.ts';

export interface FieldDesignInput {
  core: Pick<CoreShape, 'id' | 'ae' | 'windowArea' | 'windowHeight' | 'centreToOuterLegAreaRatio' | 'bobbinWidth'>;
  /** Relative permeability of the core (linear). */
  permeability: number;
  /** Ground: the total centre-leg gap; spacer: the spacer thickness, a gap in every leg (m). */
  gap: { placement: GapPlacement; length: number };
  turns: number;
  /** The engine's layout: turns per full layer and layers. */
  winding: { turnsPerLayer: number; layers: number };
  wire: Pick<WireOption, 'kind' | 'strandDiameter' | 'strands' | 'overallDiameter' | 'conductorsPerTurn'>;
  /** Clearance between conductors and core on every side: the bobbin wall (m); default 0.5 mm. */
  clearance?: number;
  /** Mesh refinement (1 = default; 2 halves every element size). */
  refinement?: number;
}

export class FieldGeometryError extends Error {
  constructor(
    readonly field: string,
    message: string,
  ) {
    super(message);
    this.name = 'FieldGeometryError';
  }
}

export interface ModelConductor {
  /** GetDP region number. */
  region: number;
  layer: number;
  turn: number;
  /** Fraction of the winding current this conductor carries. */
  share: number;
  outline: Outline;
  /** Bare copper area (m²). */
  area: number;
}

export interface DesignModel {
  surfaces: Surface[];
  conductors: ModelConductor[];
  /** The core's cross-section with a margin (m): what the field picture shows. */
  view: { rMax: number; zMin: number; zMax: number };
  sizeAt(r: number, z: number): number;
}

export const DEFAULT_CLEARANCE = 0.5e-3;
/** GetDP region numbers. */
export const REGION = { leg: 1, coreRest: 2, air: 3, axis: 4, boundary: 5, firstConductor: 101 } as const;

const refuse = (field: string, message: string): never => {
  throw new FieldGeometryError(field, message);
};

export function checkFieldDesign(d: FieldDesignInput): void {
  const mm = (x: number) => `${(x * 1e3).toFixed(2)} mm`;
  if (!(Number.isInteger(d.turns) && d.turns >= 1)) refuse('turns', `Turns must be a whole number of at least 1, got ${d.turns}.`);
  if (!(d.permeability >= 1 && Number.isFinite(d.permeability))) refuse('permeability', `Permeability must be at least 1.`);
  if (!(d.gap.length >= 0 && Number.isFinite(d.gap.length))) refuse('gap', `Gap must be zero or positive, got ${d.gap.length}.`);
  if (d.gap.length >= d.core.windowHeight)
    refuse('gap', `Gap ${mm(d.gap.length)} is not smaller than the window height ${mm(d.core.windowHeight)} of ${d.core.id}.`);
  if (d.wire.kind === 'litz') refuse('wire', 'Litz bundles are not modelled by the field check (their strands are too many to mesh).');
  if (!(d.wire.strandDiameter > 0 && d.wire.overallDiameter >= d.wire.strandDiameter))
    refuse('wire', 'The wire needs a positive bare diameter no larger than its overall diameter.');
  const { turnsPerLayer, layers } = d.winding;
  if (!(Number.isInteger(turnsPerLayer) && turnsPerLayer >= 1 && Number.isInteger(layers) && layers >= 1))
    refuse('winding', `The layout needs whole turns per layer and layers of at least 1, got ${turnsPerLayer} and ${layers}.`);
  if (turnsPerLayer * layers < d.turns) refuse('winding', `${layers} layers of ${turnsPerLayer} turns do not hold ${d.turns} turns.`);
  const c = revolvedCore(d.core);
  const clearance = d.clearance ?? DEFAULT_CLEARANCE;
  const build = layers * d.wire.overallDiameter;
  const width = c.windowOuter - c.windowInner;
  if (build + 2 * clearance > width)
    refuse('winding', `${layers} layers build ${mm(build)}, more than the window width ${mm(width)} less ${mm(clearance)} each side.`);
  const span = d.wire.kind === 'foil' ? foilWidth(d.core as CoreShape) : turnsPerLayer * d.wire.conductorsPerTurn * d.wire.overallDiameter;
  const height = windowHeightOf(d);
  if (!(span > 0) || span + 2 * clearance > height)
    refuse('winding', `A layer spans ${mm(span)}, more than the window height ${mm(height)} less ${mm(clearance)} each side.`);
}

/** Window height of the model: the core's, plus the spacer that holds the halves apart. */
const windowHeightOf = (d: FieldDesignInput) => d.core.windowHeight + (d.gap.placement === 'spacer' ? d.gap.length : 0);

/** The model's surfaces and conductors; checks the design first. */
export function designModel(d: FieldDesignInput, skinDepth: number): DesignModel {
  checkFieldDesign(d);
  const c = revolvedCore(d.core);
  const refinement = d.refinement ?? 1;
  const clearance = d.clearance ?? DEFAULT_CLEARANCE;
  const spacer = d.gap.placement === 'spacer';
  const [R, Wo, Ro] = [c.legRadius, c.windowOuter, c.outerRadius];
  const zw = windowHeightOf(d) / 2;
  const hg = d.gap.length / 2;
  const top = zw + c.plate;
  const box = 4 * Math.max(Ro, top);
  const conductors = layConductors(d, R + clearance, skinDepth, refinement);

  const rect = (r0: number, z0: number, r1: number, z1: number): [number, number][] => [
    [r0, z0],
    [r1, z0],
    [r1, z1],
    [r0, z1],
  ];
  const polygon = (corners: [number, number][]): Outline => ({ kind: 'polygon', corners });
  const surfaces: Surface[] = [];
  // Centre leg: one piece when ungapped.
  if (hg > 0)
    surfaces.push(
      { group: REGION.leg, outline: polygon(rect(0, hg, R, zw)) },
      { group: REGION.leg, outline: polygon(rect(0, -zw, R, -hg)) },
    );
  else surfaces.push({ group: REGION.leg, outline: polygon(rect(0, -zw, R, zw)) });
  const outerGap = spacer && hg > 0;
  surfaces.push(
    {
      group: REGION.coreRest,
      outline: polygon([
        [0, zw],
        [R, zw],
        [Wo, zw],
        [Ro, zw],
        [Ro, top],
        [0, top],
      ]),
    },
    {
      group: REGION.coreRest,
      outline: polygon([
        [0, -top],
        [Ro, -top],
        [Ro, -zw],
        [Wo, -zw],
        [R, -zw],
        [0, -zw],
      ]),
    },
  );
  if (outerGap)
    surfaces.push(
      { group: REGION.coreRest, outline: polygon(rect(Wo, hg, Ro, zw)) },
      { group: REGION.coreRest, outline: polygon(rect(Wo, -zw, Ro, -hg)) },
    );
  else surfaces.push({ group: REGION.coreRest, outline: polygon(rect(Wo, -zw, Ro, zw)) });
  // The window (and the gaps opening into it), with the conductors as holes.
  const window: [number, number][] = [
    ...(hg > 0
      ? ([
          [0, -hg],
          [R, -hg],
        ] as [number, number][])
      : []),
    [R, -zw],
    [Wo, -zw],
    ...(outerGap
      ? ([
          [Wo, -hg],
          [Ro, -hg],
          [Ro, hg],
          [Wo, hg],
        ] as [number, number][])
      : []),
    [Wo, zw],
    [R, zw],
    ...(hg > 0
      ? ([
          [R, hg],
          [0, hg],
        ] as [number, number][])
      : []),
  ];
  surfaces.push({ group: REGION.air, outline: polygon(window), holes: conductors.map((k) => k.outline) });
  for (const k of conductors) surfaces.push({ group: k.region, outline: k.outline });
  const outside: [number, number][] = [
    [0, -box],
    [box, -box],
    [box, box],
    [0, box],
    [0, top],
    [Ro, top],
    [Ro, zw],
    ...(outerGap
      ? ([
          [Ro, hg],
          [Ro, -hg],
        ] as [number, number][])
      : []),
    [Ro, -zw],
    [Ro, -top],
    [0, -top],
  ];
  surfaces.push({ group: REGION.air, outline: polygon(outside) });

  const coarse = Math.min(Wo - R, zw) / (16 * refinement);
  const fine = hg > 0 ? Math.min(hg / 5, coarse) / refinement : coarse;
  const gapCorners: [number, number][] =
    hg > 0
      ? [
          [R, hg],
          [R, -hg],
          [0, hg],
          [0, -hg],
          ...(outerGap
            ? ([
                [Wo, hg],
                [Wo, -hg],
                [Ro, hg],
                [Ro, -hg],
              ] as [number, number][])
            : []),
        ]
      : [];
  return {
    surfaces,
    conductors,
    view: { rMax: 1.1 * Ro, zMin: -1.1 * top, zMax: 1.1 * top },
    sizeAt(r, z) {
      if (Math.abs(r) >= box * 0.999 || Math.abs(z) >= box * 0.999) return box / (8 * refinement);
      return gapCorners.some(([gr, gz]) => Math.abs(gr - r) < 1e-12 && Math.abs(gz - z) < 1e-12) ? fine : coarse;
    },
  };
}

/** Conductors as the engine lays them: layer k at radius inner + k·pitch, turns along z centred on the mid-plane. */
function layConductors(d: FieldDesignInput, inner: number, skinDepth: number, refinement: number): ModelConductor[] {
  const w = d.wire;
  const out: ModelConductor[] = [];
  const perLayer = d.winding.turnsPerLayer;
  if (w.kind === 'foil') {
    const width = foilWidth(d.core as CoreShape);
    const size = Math.min(w.strandDiameter / 3, skinDepth / 3) / refinement;
    for (let turn = 0; turn < d.turns; turn++) {
      const r0 = inner + turn * w.overallDiameter + (w.overallDiameter - w.strandDiameter) / 2;
      const corners: [number, number][] = [
        [r0, -width / 2],
        [r0 + w.strandDiameter, -width / 2],
        [r0 + w.strandDiameter, width / 2],
        [r0, width / 2],
      ];
      out.push({
        region: REGION.firstConductor + turn,
        layer: turn,
        turn,
        share: 1,
        outline: { kind: 'polygon', corners, size },
        area: w.strandDiameter * width,
      });
    }
    return out;
  }
  const inHand = w.conductorsPerTurn;
  const pitch = inHand * w.overallDiameter;
  const z0 = (-perLayer * pitch) / 2;
  const radius = w.strandDiameter / 2;
  // ~40 segments round the rim keep the polygon's copper area within 0.3 % of the circle's; three elements per skin depth.
  const size = Math.min((Math.PI * w.strandDiameter) / 40, skinDepth / 3) / refinement;
  for (let turn = 0; turn < d.turns; turn++) {
    const layer = Math.floor(turn / perLayer);
    const r = inner + (layer + 0.5) * w.overallDiameter;
    for (let k = 0; k < inHand; k++) {
      const z = z0 + (turn % perLayer) * pitch + (k + 0.5) * w.overallDiameter;
      out.push({
        region: REGION.firstConductor + out.length,
        layer,
        turn,
        share: 1 / inHand,
        outline: { kind: 'circle', centre: [r, z], radius, size },
        area: Math.PI * radius * radius,
      });
    }
  }
  return out;
}
