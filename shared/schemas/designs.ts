// Schemas of the designs API: a design's spec (converter + limits + allowed cores and materials), its
// construction (core, material, turns, gap, wire), list queries and the exported design file. SI units throughout.
import * as z from 'zod';
import { text } from './text';
import type { EvaluationResult } from '@shared/engine/evaluate';
import { CORE_FAMILIES, GAP_PLACEMENTS, type WireOption } from '@shared/engine/types';
import { converterSpecSchema, designLimitsSchema, keepOutSchema, wireRequestSchema } from './calc';
import { evaluationResultSchema, wireOptionSchema } from './calc-answers';
import { storedIdSchema, storedIdTextSchema, uniqueListSchema } from './ids';

export const DESIGN_STATUSES = ['draft', 'in_review', 'approved', 'released', 'superseded'] as const;
export type DesignStatus = (typeof DESIGN_STATUSES)[number];

const materialIdSchema = storedIdTextSchema();

export const designSpecSchema = z
  .object({
    converter: converterSpecSchema,
    limits: designLimitsSchema.optional(),
    families: uniqueListSchema(z.enum(CORE_FAMILIES), CORE_FAMILIES.length, 'families')
      .meta({ description: 'Core families to search' })
      .optional(),
    materialIds: uniqueListSchema(materialIdSchema, 200, 'materialIds')
      .meta({ description: 'Materials to search (stored material ids)' })
      .optional(),
  })
  .strict()
  .meta({ description: 'What the inductor must do: the converter, the limits, and which cores and materials may be used' });
export type DesignSpec = z.infer<typeof designSpecSchema>;

export const constructionSchema = z
  .object({
    coreId: text().trim().min(1).max(80).meta({ description: 'Catalogue core id' }),
    materialId: materialIdSchema.meta({ description: 'Stored material id' }),
    turns: z
      .number({ error: 'turns must be a whole number' })
      .int({ error: 'turns must be a whole number' })
      .min(1, { error: 'turns must be between 1 and 2000' })
      .max(2000, { error: 'turns must be between 1 and 2000' })
      .or(z.literal('auto'))
      .meta({ description: 'Turns (1…2000) or "auto"' }),
    gap: z
      .number({ error: 'gap must be a finite number' })
      .min(0, { error: 'gap must be between 0 and 0.02 m' })
      .max(0.02, { error: 'gap must be between 0 and 0.02 m' })
      .or(z.literal('auto'))
      .meta({ description: 'Ground gap, or the spacer thickness with placement "spacer" (m), or "auto"' }),
    placement: z
      .enum(GAP_PLACEMENTS)
      .default('ground')
      .meta({ description: 'Gap ground into the centre leg (default) or a spacer under all legs; ignored for distributed-gap cores' }),
    keepOut: keepOutSchema.optional(),
    wire: wireRequestSchema,
  })
  .strict()
  .meta({ description: 'The chosen build; the server evaluates it and stores turns and gap as resolved' });
export type Construction = z.infer<typeof constructionSchema>;

const titleSchema = text({ error: 'title is required' })
  .trim()
  .min(1, { error: 'title is required' })
  .max(120, { error: 'title must be at most 120 characters' });

export const createDesignRequestSchema = z
  .object({
    title: titleSchema,
    spec: designSpecSchema,
    construction: constructionSchema.optional(),
    note: text().trim().max(2000).optional(),
  })
  .strict()
  .meta({ description: 'A new design (revision 1, draft) owned by the caller' });
export type CreateDesignRequest = z.infer<typeof createDesignRequestSchema>;

export const updateRevisionRequestSchema = z
  .object({
    title: titleSchema.optional(),
    spec: designSpecSchema.optional(),
    construction: constructionSchema.nullable().optional(),
    note: text().trim().max(2000).nullable().optional(),
  })
  .strict()
  .refine((v) => Object.values(v).some((x) => x !== undefined), {
    error: 'Give at least one of title, spec, construction or note',
    path: ['spec'],
  })
  .meta({ description: 'Change a draft revision; the server re-evaluates the construction' });
export type UpdateRevisionRequest = z.infer<typeof updateRevisionRequestSchema>;

export const newRevisionRequestSchema = z
  .object({
    from: storedIdSchema('revision number').optional().meta({ description: 'Revision to start from (default: the latest)' }),
    note: text().trim().max(2000).optional(),
  })
  .strict();
export type NewRevisionRequest = z.infer<typeof newRevisionRequestSchema>;

export const copyDesignRequestSchema = z
  .object({ title: titleSchema.optional(), revision: storedIdSchema('revision number').optional() })
  .strict();
export type CopyDesignRequest = z.infer<typeof copyDesignRequestSchema>;

const intFromQuery = (field: string, min: number, max: number, fallback: number) =>
  z.coerce
    .number({ error: `${field} must be a whole number` })
    .int({ error: `${field} must be a whole number` })
    .min(min, { error: `${field} must be between ${min} and ${max}` })
    .max(max, { error: `${field} must be between ${min} and ${max}` })
    .default(fallback);

export const DESIGN_SORT_KEYS = ['number', 'title', 'updated', 'owner', 'status'] as const;
export type DesignSortKey = (typeof DESIGN_SORT_KEYS)[number];

export const designListQuerySchema = z
  .object({
    scope: z.enum(['mine', 'all']).default('all'),
    q: text().trim().max(100).optional(),
    status: z.enum(DESIGN_STATUSES).optional(),
    sort: z.enum(DESIGN_SORT_KEYS).default('updated'),
    dir: z.enum(['asc', 'desc']).default('desc'),
    page: intFromQuery('page', 0, 100000, 0),
    pageSize: intFromQuery('pageSize', 1, 100, 20),
  })
  .strict();
export type DesignListQuery = z.infer<typeof designListQuerySchema>;

export const revisionDiffQuerySchema = z
  .object({ from: intFromQuery('from', 1, 100000, 1), to: intFromQuery('to', 1, 100000, 1) })
  .strict();

export const DESIGN_FILE_FORMAT = 'gapwright-design';

/** The exported design file; importing it creates a new design (the result is recomputed, never trusted). */
export const designFileSchema = z
  .object({
    format: z.literal(DESIGN_FILE_FORMAT, { error: `format must be "${DESIGN_FILE_FORMAT}"` }),
    formatVersion: z.literal(1, { error: 'formatVersion must be 1' }),
    title: titleSchema,
    spec: designSpecSchema,
    construction: constructionSchema.nullable().optional(),
  })
  .loose()
  .meta({ description: 'A design file as exported; extra fields (number, result, engine version) are ignored' });
export type DesignFile = z.infer<typeof designFileSchema>;

export const EXPORT_KINDS = ['design.json', 'candidates.csv', 'bom.csv', 'spice.lib'] as const;
export type ExportKind = (typeof EXPORT_KINDS)[number];

// Answer schemas: what the server sends and the client parses (the types are inferred from them).

const ownerSchema = z.object({ id: z.number().int(), displayName: z.string() });

export const designListItemSchema = z.object({
  id: z.number().int(),
  number: z.string(),
  title: z.string(),
  owner: ownerSchema,
  status: z.enum(DESIGN_STATUSES),
  revision: z.number().int(),
  summary: z.string(),
  updatedAt: z.string(),
});
export type DesignListItem = z.infer<typeof designListItemSchema>;

export const designListResponseSchema = z.object({
  items: z.array(designListItemSchema),
  total: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
});
export type DesignListResponse = z.infer<typeof designListResponseSchema>;

export const revisionSummarySchema = z.object({
  /** Database id of the revision: the review and release routes address revisions by it. */
  id: z.number().int().meta({ description: 'Database id of the revision: the review and release routes address revisions by it' }),
  revision: z.number().int(),
  status: z.enum(DESIGN_STATUSES),
  engineVersion: z.string().nullable(),
  note: z.string().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
  totalLoss: z.number().nullable(),
  canEdit: z.boolean().meta({ description: 'The caller may change this revision (their own draft)' }),
  canSubmit: z.boolean().meta({ description: 'The caller may submit it for review' }),
  canApprove: z.boolean().meta({ description: 'The caller may approve it' }),
  canReturn: z.boolean().meta({ description: 'The caller may return it to its author' }),
  canRelease: z.boolean().meta({ description: 'The caller may release it to the winding shop' }),
});
export type RevisionSummary = z.infer<typeof revisionSummarySchema>;

/** What a revision keeps of the engine's answer: the wire option evaluated and every figure. */
export const storedResultSchema = z.object({ wire: wireOptionSchema, evaluation: evaluationResultSchema });
export type StoredResult = z.infer<typeof storedResultSchema>;

/**
 * A revision's saved `result` column read with today's answer schemas: `result` is null when nothing was saved;
 * `resultUnreadable` names the first mismatch when a record saved by an older version no longer reads (its
 * figures are then left out, never guessed at).
 */
export function readStoredResult(stored: unknown): { result: StoredResult | null; resultUnreadable: string | null } {
  if (stored === null || stored === undefined) return { result: null, resultUnreadable: null };
  const parsed = storedResultSchema.safeParse(stored);
  if (parsed.success) return { result: parsed.data, resultUnreadable: null };
  const [issue] = parsed.error.issues;
  return { result: null, resultUnreadable: `${issue.path.join('.') || 'result'}: ${issue.message}` };
}

/** A stored construction; one saved before the gap placement existed reads as a ground centre gap. */
export function readConstruction(stored: unknown): Construction | null {
  if (!stored || typeof stored !== 'object') return null;
  const construction = stored as Omit<Construction, 'placement'> & { placement?: Construction['placement'] };
  return { ...construction, placement: construction.placement ?? 'ground' };
}

/** The engine result saved on a revision, or null when none was chosen yet or the record no longer reads. */
export function storedEvaluation(stored: unknown): EvaluationResult | null {
  return readStoredResult(stored).result?.evaluation ?? null;
}

/** The wire option the saved result was evaluated with (null as for `storedEvaluation`). */
export function storedWire(stored: unknown): WireOption | null {
  return readStoredResult(stored).result?.wire ?? null;
}

export const revisionDetailSchema = revisionSummarySchema.extend({
  spec: designSpecSchema,
  construction: constructionSchema.nullable(),
  result: storedResultSchema.nullable(),
  resultUnreadable: z
    .string()
    .nullable()
    .meta({ description: 'Why the saved figures were left out: saved by an older version, they no longer read (null otherwise)' }),
  materialId: z.number().int().nullable(),
});
export type RevisionDetail = z.infer<typeof revisionDetailSchema>;

export const designDetailSchema = z.object({
  id: z.number().int(),
  number: z.string(),
  title: z.string(),
  owner: ownerSchema,
  createdAt: z.string(),
  updatedAt: z.string(),
  canEdit: z.boolean().meta({ description: 'The caller owns the design and may design: they may change its drafts' }),
  canRevise: z.boolean().meta({ description: 'The caller may start a new draft revision (the latest is no longer a draft)' }),
  revisions: z.array(revisionSummarySchema),
  latest: revisionDetailSchema,
});
export type DesignDetail = z.infer<typeof designDetailSchema>;

const diffEntrySchema = z.object({ path: z.string(), from: z.unknown(), to: z.unknown() });
export type DiffEntry = z.infer<typeof diffEntrySchema>;

export const revisionDiffSchema = z.object({
  from: z.number().int(),
  to: z.number().int(),
  spec: z.array(diffEntrySchema),
  construction: z.array(diffEntrySchema),
  result: z.array(diffEntrySchema),
});
export type RevisionDiff = z.infer<typeof revisionDiffSchema>;

/** The wire request that rebuilds a catalogue wire option: AWG sizes by gauge, others by bare diameter. */
export function wireRequestOf(wire: { id: string; kind: string; strandDiameter: number; strands: number }): Construction['wire'] {
  const aught = /^AWG (\d)\/0\b/.exec(wire.id);
  if (wire.kind === 'awg' && aught) return { kind: 'awg', awg: 1 - Number(aught[1]), strands: wire.strands };
  const gauge = /^AWG (\d+)\b/.exec(wire.id);
  if (wire.kind === 'awg' && gauge) return { kind: 'awg', awg: Number(gauge[1]), strands: wire.strands };
  if (wire.kind === 'foil') return { kind: 'foil', strandDiameter: wire.strandDiameter, strands: 1 };
  return { kind: wire.kind === 'litz' ? 'litz' : 'metric', strandDiameter: wire.strandDiameter, strands: wire.strands };
}
