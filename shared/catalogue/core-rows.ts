// Converts validated table rows (mm, mm², mm³) to CoreShape (SI), and names the table
// column each CoreShape field came from so errors can point at the cell to fix.

import type { CoreFamily, CoreShape } from '@shared/engine/types';
import { estimateBobbin } from './bobbin-estimate';
import type { RingCoreRow, ShapedCoreRow } from './core-schema';
import { type RingFamily, ringCoreShape } from './ring-core';

const MM = 1e-3;
const MM2 = 1e-6;
const MM3 = 1e-9;

const optionalScaled = (value: number | undefined, scale: number) => (value === undefined ? undefined : value * scale);

export function shapedCoreFromRow(row: ShapedCoreRow, family: CoreFamily): CoreShape {
  const windowHeight = row.window_height_mm * MM;
  const estimate = estimateBobbin({
    windowHeight,
    windowWidth: row.window_width_mm * MM,
    centreLeg:
      row.centre_leg === 'round'
        ? { shape: 'round', diameter: row.centre_leg_width_mm * MM }
        : { shape: 'rect', width: row.centre_leg_width_mm * MM, depth: (row.centre_leg_depth_mm ?? 0) * MM },
    outlineWidth: row.outline_width_mm * MM,
    outlineHeight: row.outline_height_mm * MM,
    outlineDepth: row.outline_depth_mm * MM,
  });
  const shape: CoreShape = {
    id: row.designation,
    family,
    gapKind: 'air-gap',
    ae: row.ae_mm2 * MM2,
    le: row.le_mm * MM,
    ve: row.ve_mm3 * MM3,
    windowArea: row.window_area_mm2 * MM2,
    windowHeight,
    bobbinWidth: optionalScaled(row.bobbin_width_mm, MM) ?? estimate.bobbinWidth,
    bobbinHeight: optionalScaled(row.bobbin_height_mm, MM) ?? estimate.bobbinHeight,
    mlt: optionalScaled(row.mlt_mm, MM) ?? estimate.mlt,
    surfaceArea: optionalScaled(row.surface_area_mm2, MM2) ?? estimate.surfaceArea,
    outline: { width: row.outline_width_mm * MM, height: row.outline_height_mm * MM, depth: row.outline_depth_mm * MM },
    source: row.source,
  };
  if (row.amin_mm2 !== undefined) shape.amin = row.amin_mm2 * MM2;
  if (row.ac_ao !== undefined) shape.centreToOuterLegAreaRatio = row.ac_ao;
  return shape;
}

export function ringCoreFromRow(row: RingCoreRow, family: RingFamily): CoreShape {
  return ringCoreShape({
    id: row.designation,
    family,
    dimensions: {
      outerDiameter: row.outer_diameter_mm * MM,
      innerDiameter: row.inner_diameter_mm * MM,
      height: row.height_mm * MM,
    },
    source: row.source,
  });
}

/** Table column behind each CoreShape field of a shaped-core row. */
export const SHAPED_CORE_FIELD_COLUMNS: Partial<Record<keyof CoreShape, keyof ShapedCoreRow>> = {
  id: 'designation',
  ae: 'ae_mm2',
  amin: 'amin_mm2',
  le: 'le_mm',
  ve: 've_mm3',
  windowArea: 'window_area_mm2',
  windowHeight: 'window_height_mm',
  bobbinWidth: 'bobbin_width_mm',
  bobbinHeight: 'bobbin_height_mm',
  mlt: 'mlt_mm',
  surfaceArea: 'surface_area_mm2',
  outline: 'outline_width_mm',
  centreToOuterLegAreaRatio: 'ac_ao',
  source: 'source',
};

/** Table column behind each CoreShape field of a ring row (derived fields point at the dimension they follow from). */
export const RING_CORE_FIELD_COLUMNS: Partial<Record<keyof CoreShape, keyof RingCoreRow>> = {
  id: 'designation',
  windowArea: 'inner_diameter_mm',
  windowHeight: 'height_mm',
  bobbinWidth: 'inner_diameter_mm',
  bobbinHeight: 'inner_diameter_mm',
  ring: 'inner_diameter_mm',
  source: 'source',
};
