// Requests and answers of the winding shop: build orders, built units and the measured-against-predicted report.
import * as z from 'zod';
import type { UnitFinding, UnitMeasurement } from '@shared/shop/measurement';
import { text } from './text';
import { windingSheetSchema } from './winding-sheet';

export const ORDER_STATUSES = ['open', 'complete'] as const;
export const HIPOT_RESULTS = ['pass', 'fail', 'not_tested'] as const;

export const ordersQuerySchema = z
  .object({
    status: z.enum([...ORDER_STATUSES, 'all']).default('open'),
    designId: z
      .string()
      .regex(/^[1-9][0-9]{0,9}$/, { error: 'designId must be a positive integer' })
      .transform(Number)
      .optional()
      .meta({ description: 'Only the orders of this design' }),
  })
  .strict();

const finite = (field: string, min: number, max: number, unit: string) =>
  z
    .number({ error: `${field} must be a number` })
    .min(min, { error: `${field} must be between ${min} and ${max} ${unit}` })
    .max(max, { error: `${field} must be between ${min} and ${max} ${unit}` });

/** One built unit's measurements, SI units (H, Hz, Ω, °C). */
export const unitMeasurementSchema = z
  .object({
    inductance: finite('inductance', 1e-9, 10, 'H'),
    testFrequency: finite('testFrequency', 10, 10e6, 'Hz'),
    resistance: finite('resistance', 1e-6, 1e4, 'Ω'),
    resistanceTemperature: finite('resistanceTemperature', -40, 150, '°C'),
    biasCurrent: finite('biasCurrent', 0.001, 1000, 'A').optional().meta({ description: 'DC bias current of the L-under-bias test (A)' }),
    biasInductance: finite('biasInductance', 1e-9, 10, 'H').optional().meta({ description: 'L measured at biasCurrent (H)' }),
    hipot: z.enum(HIPOT_RESULTS, { error: 'hipot must be pass, fail or not_tested' }),
    notes: text().trim().max(2000, { error: 'At most 2000 characters' }).optional(),
    unitNumber: z
      .number({ error: 'unitNumber must be a whole number' })
      .int({ error: 'unitNumber must be a whole number' })
      .min(1, { error: 'unitNumber must be at least 1' })
      .max(1_000_000, { error: 'unitNumber must be at most 1000000' })
      .optional()
      .meta({ description: 'Record again a unit number whose record was voided; the next number when left out' }),
  })
  .strict()
  .superRefine((m, ctx) => {
    if ((m.biasCurrent === undefined) !== (m.biasInductance === undefined)) {
      const path = m.biasCurrent === undefined ? 'biasCurrent' : 'biasInductance';
      ctx.addIssue({ code: 'custom', path: [path], message: `${path} is needed with the other L-under-bias figure` });
    }
  }) satisfies z.ZodType<UnitMeasurement>;
export type UnitMeasurementRequest = z.infer<typeof unitMeasurementSchema>;

export const unitFindingSchema = z.object({
  check: z.enum(['inductance', 'test-frequency', 'resistance', 'bias-inductance', 'hipot']),
  passed: z.boolean(),
  message: z.string(),
}) satisfies z.ZodType<UnitFinding>;

// Answers.

export const orderSummarySchema = z.object({
  id: z.number().int(),
  number: z.string(),
  quantity: z.number().int(),
  status: z.enum(ORDER_STATUSES),
  createdAt: z.string(),
  completedAt: z.string().nullable(),
  revisionId: z.number().int(),
  revision: z.number().int(),
  designId: z.number().int(),
  designNumber: z.string(),
  title: z.string(),
  built: z.number().int().meta({ description: 'Units recorded, voided records left out' }),
  passed: z.number().int().meta({ description: 'Units passed, voided records left out' }),
});
export type OrderSummary = z.infer<typeof orderSummarySchema>;
export const ordersAnswerSchema = z.object({ orders: z.array(orderSummarySchema) });

export const builtUnitSchema = z.object({
  id: z.number().int(),
  orderId: z.number().int(),
  unitNumber: z.number().int(),
  inductance: z.number().meta({ description: 'Measured (H)' }),
  testFrequency: z.number().meta({ description: 'Hz' }),
  resistance: z.number().meta({ description: 'Measured DC resistance (Ω) at resistanceTemperature (°C)' }),
  resistanceTemperature: z.number(),
  resistanceAt20: z.number().meta({ description: 'The reading referred to 20 °C (Ω)' }),
  biasCurrent: z.number().nullable().meta({ description: 'DC bias current of the L-under-bias test (A)' }),
  biasInductance: z.number().nullable().meta({ description: 'L measured at biasCurrent (H)' }),
  hipot: z.enum(HIPOT_RESULTS),
  passed: z.boolean(),
  findings: z.array(unitFindingSchema),
  notes: z.string().nullable(),
  recordedBy: z.number().int().nullable(),
  recordedAt: z.string(),
  voidedAt: z.string().nullable().meta({ description: 'When the record was voided; null for a record that stands' }),
  voidedBy: z.number().int().nullable(),
  voidReason: z.string().nullable(),
  canVoid: z.boolean().meta({ description: 'The signed-in user may void this record now (its recorder, a reviewer or an admin)' }),
});
export type BuiltUnit = z.infer<typeof builtUnitSchema>;

export const buildOrderSchema = z.object({
  id: z.number().int(),
  number: z.string(),
  revisionId: z.number().int(),
  quantity: z.number().int(),
  status: z.enum(ORDER_STATUSES),
  createdBy: z.number().int().nullable(),
  createdAt: z.string(),
  completedAt: z.string().nullable(),
  sheet: windingSheetSchema,
  units: z.array(builtUnitSchema),
  canRecord: z.boolean().meta({ description: 'The signed-in user may record units on this order now (a winder, order open)' }),
});
export type BuildOrder = z.infer<typeof buildOrderSchema>;

export const recordedUnitSchema = z.object({
  unit: builtUnitSchema,
  orderStatus: z.enum(ORDER_STATUSES),
  passedUnits: z.number().int(),
});
export type RecordedUnit = z.infer<typeof recordedUnitSchema>;

export const voidUnitSchema = z
  .object({
    reason: text({ error: 'reason is required' })
      .trim()
      .min(3, { error: 'reason must be 3 to 500 characters' })
      .max(500, { error: 'reason must be 3 to 500 characters' }),
  })
  .strict();
export type VoidUnitRequest = z.infer<typeof voidUnitSchema>;

export const predictionSampleSchema = z.object({
  orderNumber: z.string(),
  designNumber: z.string(),
  revision: z.number().int(),
  material: z.string(),
  core: z.string(),
  predictedInductance: z.number().meta({ description: 'H' }),
  measuredInductance: z.number().meta({ description: 'H' }),
  predictedResistance20: z.number().meta({
    description: 'Ω at 20 °C at the pins: winding, leads and joints (the winding alone on sheets released before leads were counted)',
  }),
  measuredResistance20: z.number().meta({ description: 'Ω at 20 °C' }),
  passed: z.boolean(),
  inductanceRatio: z.number().meta({ description: 'Measured ÷ predicted' }),
  resistanceRatio: z.number().meta({ description: 'Measured ÷ predicted' }),
});
export type PredictionSample = z.infer<typeof predictionSampleSchema>;

const meanAndSpreadSchema = z.object({
  mean: z.number(),
  spread: z.number().meta({ description: 'Sample standard deviation; 0 for one unit' }),
});

/** Mean and spread of measured/predicted ratios of the units sharing a key (a material or a core). */
export const ratioSummarySchema = z.object({
  key: z.string(),
  units: z.number().int(),
  inductanceRatio: meanAndSpreadSchema,
  resistanceRatio: meanAndSpreadSchema,
});
export type RatioSummary = z.infer<typeof ratioSummarySchema>;

export const predictionReportSchema = z.object({
  units: z.array(predictionSampleSchema),
  byMaterial: z.array(ratioSummarySchema),
  byCore: z.array(ratioSummarySchema),
});
export type PredictionReport = z.infer<typeof predictionReportSchema>;
