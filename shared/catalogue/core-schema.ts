// Validation of core shapes: the CoreShape the engine uses (SI units) and the rows of
// the shipped core tables (trade units: mm, mm², mm³). Pure zod, so the server can
// validate user-added cores with the same rules.

import * as z from 'zod';
import { text } from '@shared/schemas/text';
import { CORE_FAMILIES, type CoreFamily, type CoreShape } from '@shared/engine/types';

/** Ve may differ from Ae·le by this fraction (published tables round each figure separately). */
export const VOLUME_CONSISTENCY_TOLERANCE = 0.05;
/** A rectangular window's area may differ from height × width by this fraction (rounding, radii). */
export const WINDOW_CONSISTENCY_TOLERANCE = 0.1;
const RING_GEOMETRY_TOLERANCE = 0.01;

export const RING_FAMILIES: readonly CoreFamily[] = ['RING', 'POWDER_TOROID'];
export const ESTIMATED_SOURCE_NOTE = 'estimated from nominal outline dimensions';
export const IEC60205_SOURCE_NOTE = 'computed by IEC 60205 from nominal dimensions';

export function isRingFamily(family: CoreFamily): boolean {
  return RING_FAMILIES.includes(family);
}

function relativeDifference(value: number, reference: number): number {
  return Math.abs(value - reference) / Math.abs(reference);
}

const positiveNumber = z.number().finite().positive();

export const coreShapeSchema = z
  .object({
    id: text().trim().min(1).max(60),
    family: z.enum(CORE_FAMILIES),
    gapKind: z.enum(['air-gap', 'distributed']),
    ae: positiveNumber,
    amin: positiveNumber.optional(),
    le: positiveNumber,
    ve: positiveNumber,
    windowArea: positiveNumber,
    windowHeight: positiveNumber,
    bobbinWidth: positiveNumber,
    bobbinHeight: positiveNumber,
    mlt: positiveNumber,
    surfaceArea: positiveNumber,
    centreToOuterLegAreaRatio: positiveNumber.optional(),
    outline: z.object({ width: positiveNumber, height: positiveNumber, depth: positiveNumber }).optional(),
    ring: z.object({ od: positiveNumber, id: positiveNumber, height: positiveNumber }).optional(),
    source: text().trim().min(1, 'must say where the numbers come from'),
  })
  .superRefine((core, ctx) => {
    const issue = (path: string, message: string) => ctx.addIssue({ code: 'custom', path: [path], message });

    const volumeError = relativeDifference(core.ve, core.ae * core.le);
    if (volumeError > VOLUME_CONSISTENCY_TOLERANCE) {
      issue('ve', `Ve differs from Ae·le by ${(volumeError * 100).toFixed(1)} % (at most ${VOLUME_CONSISTENCY_TOLERANCE * 100} % allowed)`);
    }
    if (core.amin !== undefined && core.amin > core.ae) {
      issue('amin', 'Amin must not exceed Ae');
    }

    if (isRingFamily(core.family)) {
      if (core.gapKind !== 'distributed') issue('gapKind', 'ring cores have no discrete air gap: use "distributed"');
      if (core.outline) issue('outline', 'ring cores give their ring dimensions, not an outline');
      if (!core.ring) {
        issue('ring', 'ring cores need their outer diameter, inner diameter and height');
        return;
      }
      const { od, id, height } = core.ring;
      if (id >= od) issue('ring', 'inner diameter must be smaller than outer diameter');
      const ringChecks: [keyof CoreShape, number, number][] = [
        ['windowArea', core.windowArea, (Math.PI * id ** 2) / 4],
        ['windowHeight', core.windowHeight, height],
        ['bobbinWidth', core.bobbinWidth, Math.PI * id],
        ['bobbinHeight', core.bobbinHeight, id / 2],
      ];
      for (const [field, value, expected] of ringChecks) {
        if (relativeDifference(value, expected) > RING_GEOMETRY_TOLERANCE) {
          issue(field, `${field} of a ring core must follow from its inner diameter and height`);
        }
      }
    } else {
      if (core.gapKind !== 'air-gap') issue('gapKind', `${core.family} sets are gapped: use "air-gap"`);
      if (core.ring) issue('ring', 'only ring cores have ring dimensions');
      if (core.bobbinWidth > core.windowHeight) issue('bobbinWidth', 'bobbin winding width cannot exceed the window height');
      if (core.bobbinWidth * core.bobbinHeight > core.windowArea) {
        issue('bobbinHeight', 'bobbin winding area (width × height) cannot exceed the window area');
      }
    }
  });

// Compile-time check that the schema produces exactly what the engine consumes.
export type ValidatedCoreShape = z.infer<typeof coreShapeSchema>;
const schemaMatchesCoreShape: (shape: ValidatedCoreShape) => CoreShape = (shape) => shape;
void schemaMatchesCoreShape;

// ---- Rows of the shipped tables: every cell arrives as text. ----

const requiredCell = text()
  .trim()
  .min(1, 'is required')
  .transform(Number)
  .pipe(z.number({ error: 'must be a number' }).finite('must be a finite number').positive('must be positive'));

const optionalCell = text()
  .trim()
  .transform((text) => (text === '' ? undefined : Number(text)))
  .pipe(z.number({ error: 'must be a number or empty' }).finite('must be a finite number').positive('must be positive').optional());

const designationCell = text().trim().min(1, 'is required').max(60);
const sourceCell = text().trim().min(1, 'must say where the numbers come from');

/** A set of core halves (E, ETD, EFD, EQ, PQ, RM, POT), values in mm, mm², mm³. */
export const shapedCoreRowSchema = z
  .object({
    designation: designationCell,
    ae_mm2: requiredCell,
    amin_mm2: optionalCell,
    le_mm: requiredCell,
    ve_mm3: requiredCell,
    window_area_mm2: requiredCell,
    window_height_mm: requiredCell,
    window_width_mm: requiredCell,
    centre_leg: text()
      .trim()
      .pipe(z.enum(['round', 'rect'], { error: 'must be "round" or "rect"' })),
    centre_leg_width_mm: requiredCell,
    centre_leg_depth_mm: optionalCell,
    outline_width_mm: requiredCell,
    outline_height_mm: requiredCell,
    outline_depth_mm: requiredCell,
    bobbin_width_mm: optionalCell,
    bobbin_height_mm: optionalCell,
    mlt_mm: optionalCell,
    surface_area_mm2: optionalCell,
    ac_ao: optionalCell,
    source: sourceCell,
  })
  .superRefine((row, ctx) => {
    if (row.centre_leg === 'rect' && row.centre_leg_depth_mm === undefined) {
      ctx.addIssue({ code: 'custom', path: ['centre_leg_depth_mm'], message: 'is required for a rectangular centre leg' });
    }
    const windowError = relativeDifference(row.window_area_mm2, row.window_height_mm * row.window_width_mm);
    if (windowError > WINDOW_CONSISTENCY_TOLERANCE) {
      ctx.addIssue({
        code: 'custom',
        path: ['window_area_mm2'],
        message: `differs from window height × width by ${(windowError * 100).toFixed(1)} %`,
      });
    }
    const estimated = [row.bobbin_width_mm, row.bobbin_height_mm, row.mlt_mm, row.surface_area_mm2].some((v) => v === undefined);
    if (estimated && !row.source.includes(ESTIMATED_SOURCE_NOTE)) {
      ctx.addIssue({
        code: 'custom',
        path: ['source'],
        message: `must say "${ESTIMATED_SOURCE_NOTE}" when bobbin, MLT or surface cells are left to the estimate`,
      });
    }
  });
export type ShapedCoreRow = z.infer<typeof shapedCoreRowSchema>;
export const SHAPED_CORE_COLUMNS = Object.keys(shapedCoreRowSchema.shape) as (keyof ShapedCoreRow)[];

/** A ring core or powder toroid: nominal dimensions only, mm. */
export const ringCoreRowSchema = z
  .object({
    designation: designationCell,
    outer_diameter_mm: requiredCell,
    inner_diameter_mm: requiredCell,
    height_mm: requiredCell,
    source: sourceCell,
  })
  .superRefine((row, ctx) => {
    if (row.inner_diameter_mm >= row.outer_diameter_mm) {
      ctx.addIssue({ code: 'custom', path: ['inner_diameter_mm'], message: 'must be smaller than the outer diameter' });
    }
    if (!row.source.includes(IEC60205_SOURCE_NOTE)) {
      ctx.addIssue({ code: 'custom', path: ['source'], message: `must say "${IEC60205_SOURCE_NOTE}"` });
    }
  });
export type RingCoreRow = z.infer<typeof ringCoreRowSchema>;
export const RING_CORE_COLUMNS = Object.keys(ringCoreRowSchema.shape) as (keyof RingCoreRow)[];
