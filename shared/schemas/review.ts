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
