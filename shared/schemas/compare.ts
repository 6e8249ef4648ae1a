// Requests of the material comparison: loss curves of several materials, and one design's losses
// with every current material. SI units (Hz, T).
import * as z from 'zod';
import { text } from './text';
import { converterSpecSchema, designLimitsSchema, wireRequestSchema } from './calc';
import { GAP_PLACEMENTS } from '@shared/engine/types';
import { storedIdSchema, storedIdTextSchema, uniqueListSchema } from './ids';

const finite = (field: string) => z.number({ error: `${field} must be a finite number` });
function range(field: string, min: number, max: number, unit: string) {
  const message = `${field} must be between ${min} and ${max}${unit ? ` ${unit}` : ''}`;
  return finite(field).min(min, { error: message }).max(max, { error: message });
}
const materialIdSchema = storedIdTextSchema();

export const sweepRangeSchema = (field: string, min: number, max: number, unit: string) =>
  z
    .object({ min: range(`${field}.min`, min, max, unit), max: range(`${field}.max`, min, max, unit) })
    .strict()
    .refine((r) => r.min < r.max, { path: ['min'], message: `${field}.min must be below ${field}.max` });

/**
 * Limits (SI, temperature in °C) of the flux swing, frequency and core temperature of the loss curves, and how many
 * materials one drawing takes; the Compare page's fields use them too.
 */
export const CURVE_LIMITS = {
  deltaB: { min: 1e-4, max: 2 },
  frequency: { min: 1e3, max: 10e6 },
  temperature: { min: -60, max: 250 },
  materials: 12,
} as const;
const { deltaB: DELTA_B, frequency: FREQUENCY } = CURVE_LIMITS;

export const compareCurvesRequestSchema = z
  .object({
    materialIds: uniqueListSchema(materialIdSchema, CURVE_LIMITS.materials, 'materialIds', 1),
    deltaB: range('deltaB', DELTA_B.min, DELTA_B.max, 'T')
      .default(0.2)
      .meta({ description: 'Peak-to-peak flux swing of the frequency sweep (T)' }),
    frequency: range('frequency', FREQUENCY.min, FREQUENCY.max, 'Hz')
      .default(100e3)
      .meta({ description: 'Frequency of the flux sweep (Hz)' }),
    duty: finite('duty')
      .gt(0, { error: 'duty must be between 0 and 1 (exclusive)' })
      .lt(1, { error: 'duty must be between 0 and 1 (exclusive)' })
      .default(0.5),
    temperature: range('temperature', CURVE_LIMITS.temperature.min, CURVE_LIMITS.temperature.max, '°C').optional().meta({
      description:
        "Core temperature (°C): each loss times the material's temperature factor there, as the engine does; without it, the loss at each material's reference temperature (factor 1)",
    }),
    frequencyRange: sweepRangeSchema('frequencyRange', FREQUENCY.min, FREQUENCY.max, 'Hz').default({ min: 10e3, max: 2e6 }),
    fluxRange: sweepRangeSchema('fluxRange', DELTA_B.min, DELTA_B.max, 'T').default({ min: 0.01, max: 0.6 }),
    points: z
      .number()
      .int('points must be a whole number')
      .min(5, 'points must be between 5 and 200')
      .max(200, 'points must be between 5 and 200')
      .default(41),
  })
  .strict()
  .meta({ description: 'Core-loss density of materials over a frequency sweep and a ΔB sweep (Steinmetz and triangular iGSE)' });
export type CompareCurvesRequest = z.infer<typeof compareCurvesRequestSchema>;

export const curvePointSchema = z.object({
  x: z.number().meta({ description: 'Frequency (Hz) on the frequency sweep, peak-to-peak ΔB (T) on the flux sweep' }),
  steinmetz: z.number(),
  igse: z.number(),
  extrapolated: z.boolean().meta({ description: 'Outside the range the coefficients were fitted on (frequency, or peak flux ΔB/2)' }),
});
export type CurvePoint = z.infer<typeof curvePointSchema>;
export const materialCurvesSchema = z.object({
  id: z.string(),
  name: z.string(),
  family: z.string(),
  version: z.number().int(),
  fit: z.object({ frequencyMin: z.number(), frequencyMax: z.number(), fluxMin: z.number(), fluxMax: z.number() }),
  versusFrequency: z.array(curvePointSchema),
  versusFlux: z.array(curvePointSchema),
});
export type MaterialCurves = z.infer<typeof materialCurvesSchema>;
export const compareCurvesResponseSchema = z.object({
  deltaB: z.number(),
  frequency: z.number(),
  duty: z.number(),
  temperature: z.number().nullable().meta({ description: 'The core temperature the curves are at (°C), null when none was given' }),
  materials: z.array(materialCurvesSchema),
});
export type CompareCurvesResponse = z.infer<typeof compareCurvesResponseSchema>;

export const compareDesignRequestSchema = z
  .object({
    spec: converterSpecSchema,
    limits: designLimitsSchema.optional(),
    coreId: text().trim().min(1).max(80).meta({ description: 'Catalogue or user core id' }),
    turns: z
      .number({ error: 'turns must be a whole number' })
      .int('turns must be a whole number')
      .min(1, 'turns must be between 1 and 2000')
      .max(2000, 'turns must be between 1 and 2000'),
    wire: wireRequestSchema,
    placement: z
      .enum(GAP_PLACEMENTS)
      .optional()
      .meta({ description: 'Ground centre gap (default) or a spacer under all legs; the gap or spacer is re-solved per material' }),
    materialIds: uniqueListSchema(materialIdSchema, 200, 'materialIds')
      .optional()
      .meta({ description: 'Restrict to these materials (default: every current one)' }),
  })
  .strict()
  .meta({
    description: 'One design (same core, turns, wire, gap placement) evaluated with every current material; gap re-solved per material',
  });
export type CompareDesignRequest = z.infer<typeof compareDesignRequestSchema>;

export const compareSavedDesignRequestSchema = z
  .object({
    designId: storedIdSchema('design id'),
    revision: z
      .number({ error: 'revision must be a revision number' })
      .int('revision must be a revision number')
      .min(1, 'revision must be a revision number')
      .max(100_000, 'revision must be a revision number'),
    materialIds: uniqueListSchema(materialIdSchema, 200, 'materialIds')
      .optional()
      .meta({ description: "Restrict to these materials (default: every current one plus the revision's own)" }),
  })
  .strict()
  .meta({ description: "A saved revision's core, turns and wire evaluated with every current material; gap re-solved per material" });
export type CompareSavedDesignRequest = z.infer<typeof compareSavedDesignRequestSchema>;

const optionalNumber = z.number().optional();
export const designComparisonRowSchema = z.object({
  materialId: z.string(),
  usedByDesign: z.boolean().optional().meta({ description: 'The material version the saved revision was built with' }),
  name: z.string(),
  family: z.string(),
  status: z.enum(['ok', 'incompatible', 'error']),
  reason: z.string().optional(),
  feasible: z.boolean().optional(),
  gap: optionalNumber.meta({ description: 'Ground gap, or spacer thickness for a spacer design (m)' }),
  coreLoss: optionalNumber,
  copperLoss: optionalNumber,
  totalLoss: optionalNumber,
  coreLossDensity: optionalNumber,
  peakFlux: optionalNumber,
  temperatureRise: optionalNumber,
  extrapolated: z.boolean().optional(),
});
export type DesignComparisonRow = z.infer<typeof designComparisonRowSchema>;
export const comparedRevisionSchema = z.object({
  id: z.number().int(),
  number: z.string(),
  title: z.string(),
  revision: z.number().int(),
  materialId: z.string(),
});
export type ComparedRevision = z.infer<typeof comparedRevisionSchema>;
/** Where the design's core works: peak-to-peak flux swing (T), switching frequency (Hz), duty at Vin max. */
export const designFluxPointSchema = z.object({ deltaB: z.number(), frequency: z.number(), duty: z.number() });
export type DesignFluxPoint = z.infer<typeof designFluxPointSchema>;
export const compareDesignResponseSchema = z.object({
  engineVersion: z.string(),
  fluxPoint: designFluxPointSchema
    .optional()
    .meta({ description: 'The same for every material (same core and turns); absent when no material could be evaluated' }),
  design: comparedRevisionSchema.optional().meta({ description: 'Set when a saved revision was compared' }),
  coreId: z.string(),
  turns: z.number().int(),
  placement: z.enum(GAP_PLACEMENTS).meta({ description: "The gap placement every row was solved with (a saved revision's own)" }),
  rows: z.array(designComparisonRowSchema),
});
export type CompareDesignResponse = z.infer<typeof compareDesignResponseSchema>;
