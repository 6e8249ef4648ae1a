import * as z from 'zod';
import { DESIGN_STATUSES } from './designs';
import { text } from './text';

export const transitionRequestSchema = z
  .object({ comment: text().trim().max(2000, { error: 'At most 2000 characters' }).optional() })
  .strict();
export type TransitionRequest = z.infer<typeof transitionRequestSchema>;

export const returnRequestSchema = z
  .object({
    comment: text({ error: 'Say what needs to change' })
      .trim()
      .min(1, { error: 'Say what needs to change' })
      .max(2000, { error: 'At most 2000 characters' }),
  })
  .strict();

export const releaseRequestSchema = z
  .object({
    quantity: z
      .number({ error: 'quantity must be a whole number' })
      .int({ error: 'quantity must be a whole number' })
      .min(1, { error: 'quantity must be between 1 and 100000' })
      .max(100000, { error: 'quantity must be between 1 and 100000' }),
    comment: text().trim().max(2000, { error: 'At most 2000 characters' }).optional(),
  })
  .strict();
export type ReleaseRequest = z.infer<typeof releaseRequestSchema>;

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
    hipot: z.enum(['pass', 'fail', 'not_tested'], { error: 'hipot must be pass, fail or not_tested' }),
    notes: text().trim().max(2000, { error: 'At most 2000 characters' }).optional(),
  })
  .strict();
export type UnitMeasurementRequest = z.infer<typeof unitMeasurementSchema>;

// Answers of the review routes.

export const timelineEntrySchema = z.object({
  id: z.number().int(),
  revisionId: z.number().int(),
  fromStatus: z.string().nullable(),
  toStatus: z.string(),
  comment: z.string().nullable(),
  at: z.string(),
  actor: z.string().nullable().meta({ description: 'Display name; null when the user was removed' }),
});
export type TimelineEntry = z.infer<typeof timelineEntrySchema>;

export const timelineSchema = z.object({ designId: z.number().int(), entries: z.array(timelineEntrySchema) });
export type Timeline = z.infer<typeof timelineSchema>;

export const transitionOutcomeSchema = z.object({
  revisionId: z.number().int(),
  status: z.enum(DESIGN_STATUSES),
  orderId: z.number().int().optional().meta({ description: 'On release: the build order written' }),
  orderNumber: z.string().optional(),
  superseded: z.array(z.number().int()).optional().meta({ description: 'On release: ids of the revisions it superseded' }),
});
export type TransitionOutcome = z.infer<typeof transitionOutcomeSchema>;
