// What the loss-point and fitting routes take and answer: a material version's points (SI units, °C), the
// preview of a loss-point file, the fit options, the fit with its quality, residuals and curves, and an accepted fit.
import * as z from 'zod';
import type { LossPoint } from '@shared/fitting/loss-points';
import { cellProblemSchema } from './csv-import';
import { libraryMaterialSchema } from './material-answers';

export const lossPointSchema = z.object({
  frequency: z.number().meta({ description: 'Hz' }),
  peakFlux: z.number().meta({ description: 'Peak flux density B̂ (T)' }),
  temperature: z.number().meta({ description: '°C' }),
  lossDensity: z.number().meta({ description: 'W/m³' }),
  dcBias: z.number().optional().meta({ description: 'A/m' }),
  source: z.string().optional(),
}) satisfies z.ZodType<LossPoint>;

/** The points of one material version, in file order, and whether the user may replace them or accept a fit. */
export const lossPointsAnswerSchema = z.object({
  materialId: z.number().int(),
  name: z.string(),
  version: z.number().int(),
  current: z.boolean(),
  canEdit: z.boolean(),
  points: z.array(lossPointSchema),
});

const rangeSchema = z.tuple([z.number(), z.number()]);

/** What a loss-point file would give; nothing is written. `fileProblems` are across rows (too few points, one frequency…). */
export const lossPointPreviewSchema = z.object({
  fileName: z.string(),
  rows: z.array(z.object({ row: z.number().int(), status: z.enum(['ok', 'error']), problems: z.array(cellProblemSchema) })),
  fileProblems: z.array(cellProblemSchema),
  summary: z.object({
    rows: z.number().int(),
    valid: z.number().int(),
    errors: z.number().int(),
    frequencies: z.number().int().meta({ description: 'Distinct frequencies among the valid rows' }),
    fluxes: z.number().int(),
    temperatures: z.number().int(),
    frequencyRange: rangeSchema.nullable().meta({ description: 'Hz' }),
    fluxRange: rangeSchema.nullable().meta({ description: 'T' }),
    temperatureRange: rangeSchema.nullable().meta({ description: '°C' }),
  }),
});
export type LossPointPreview = z.infer<typeof lossPointPreviewSchema>;

/** A committed loss-point file: the new material version that carries the points. */
export const lossPointCommitSchema = z.object({
  materialId: z.number().int(),
  version: z.number().int(),
  pointCount: z.number().int(),
});

/**
 * How to fit: one Steinmetz fit over all points or frequency bands until each meets `maxWorstError`; with the
 * temperature behaviour fitted too, or (off) the points at `atTemperature` only, the stored behaviour kept.
 */
export const fitOptionsSchema = z
  .object({
    mode: z.enum(['whole', 'bands']).default('whole'),
    maxWorstError: z
      .number()
      .gt(0)
      .max(10)
      .default(0.1)
      .meta({ description: 'Worst relative error a band must meet (bands mode), as a fraction' }),
    temperature: z.boolean().default(true).meta({ description: 'Fit the temperature behaviour (needs points at 3+ temperatures)' }),
    atTemperature: z
      .number()
      .min(-60)
      .max(250)
      .optional()
      .meta({ description: '°C; without temperature fitting, use only the points at this temperature' }),
  })
  .strict();
export type FitOptions = z.infer<typeof fitOptionsSchema>;

/** Accepting a fit: the same options (the server fits again), and the band to keep when there are several. */
export const fitAcceptSchema = fitOptionsSchema
  .extend({ band: z.number().int().min(0).max(1000).optional().meta({ description: 'Index of the band to keep (bands mode)' }) })
  .strict();
export type FitAccept = z.infer<typeof fitAcceptSchema>;

const qualityShape = {
  rmsRelativeError: z.number(),
  worstRelativeError: z.number(),
  worstPoint: z.number().int().meta({ description: 'Index into the version’s points' }),
  pointCount: z.number().int(),
};

export const steinmetzBandSchema = z.object({
  k: z.number().meta({ description: 'W/m³ with f in Hz, B̂ in T, at a temperature factor of 1' }),
  alpha: z.number(),
  beta: z.number(),
  fittedFrequency: rangeSchema.meta({ description: 'Hz: exactly the points’ range' }),
  fittedFlux: rangeSchema.meta({ description: 'T: exactly the points’ range' }),
  ...qualityShape,
  pointIndices: z.array(z.number().int()),
  meetsTarget: z.boolean(),
});

export const temperatureFitSchema = z.object({
  lowestLossTemperature: z.number().meta({ description: '°C' }),
  lowestLossFactor: z.number().meta({ description: '1: k is referred to the lowest-loss temperature' }),
  curvature: z.number().meta({ description: '1/K²' }),
  quadratic: z.object({ ct0: z.number(), ct1: z.number(), ct2: z.number() }).meta({ description: 'factor = ct2·T² − ct1·T + ct0' }),
  fittedTemperature: rangeSchema,
  ...qualityShape,
  constrained: z.boolean(),
});

export const fitAnswerSchema = z.object({
  materialId: z.number().int(),
  options: z.object({
    mode: z.enum(['whole', 'bands']),
    maxWorstError: z.number(),
    temperature: z.boolean(),
    atTemperature: z.number().optional(),
  }),
  /** Points used (all, or those at `atTemperature`). */
  pointCount: z.number().int(),
  fits: z.array(steinmetzBandSchema),
  temperature: temperatureFitSchema.nullable(),
  /**
   * Core loss under DC bias, 1 + (H/H₂)^m, from the points taken under bias (their loss over the zero-bias model); null
   * without such points or when they cannot say (one field, no rise). Its quality is over the biased points.
   */
  biasLoss: z
    .object({
      doublingField: z.number().meta({ description: 'H₂, A/m' }),
      steepness: z.number().meta({ description: 'm' }),
      ...qualityShape,
    })
    .nullable(),
  /** The whole model (band fit × temperature factor) against each point used (points under DC bias are not). */
  residuals: z.array(
    z.object({
      index: z.number().int(),
      band: z.number().int(),
      measured: z.number(),
      fitted: z.number(),
      relativeError: z.number(),
    }),
  ),
  /** The fitted loss along the band's flux range, per measured frequency and temperature. */
  curves: z.array(
    z.object({
      band: z.number().int(),
      frequency: z.number(),
      temperature: z.number(),
      samples: z.array(z.object({ peakFlux: z.number(), lossDensity: z.number() })),
    }),
  ),
  curvesTruncated: z.boolean(),
});
export type FitAnswer = z.infer<typeof fitAnswerSchema>;

export const fitAcceptAnswerSchema = z.object({ material: libraryMaterialSchema, fit: fitAnswerSchema, band: z.number().int() });
