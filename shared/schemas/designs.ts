// Schemas of the designs API: a design's spec (converter + limits + allowed cores and materials), its
// construction (core, material, turns, gap, wire), list queries and the exported design file. SI units throughout.
import * as z from 'zod';
import { text } from './text';
import type { EvaluationResult } from '@shared/engine/evaluate';
import { CORE_FAMILIES, type WireOption } from '@shared/engine/types';
import { converterSpecSchema, designLimitsSchema, wireRequestSchema } from './calc';
import { storedIdSchema, storedIdTextSchema, uniqueListSchema } from './ids';

export const DESIGN_STATUSES = ['draft', 'in_review', 'approved', 'released', 'superseded'] as const;
export type DesignStatus = (typeof DESIGN_STATUSES)[number];

const materialIdSchema = storedIdTextSchema();

export const designSpecSchema = z
  .object({
    converter: converterSpecSchema,
    limits: designLimitsSchema.optional(),
    families: uniqueListSchema(z.enum(CORE_FAMILIES), CORE_FAMILIES.length, 'families').meta({ description: 'Core families to search' }).optional(),
    materialIds: uniqueListSchema(materialIdSchema, 200, 'materialIds').meta({ description: 'Materials to search (stored material ids)' }).optional(),
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
      .meta({ description: 'Total gap in the magnetic path (m) or "auto"' }),
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
  .refine((v) => Object.values(v).some((x) => x !== undefined), { error: 'Give at least one of title, spec, construction or note', path: ['spec'] })
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

// Response shapes the client reads.

export interface DesignListItem {
  id: number;
  number: string;
  title: string;
  owner: { id: number; displayName: string };
  status: DesignStatus;
  revision: number;
  summary: string;
  updatedAt: string;
}

export interface DesignListResponse {
  items: DesignListItem[];
  total: number;
  page: number;
  pageSize: number;
}

export interface RevisionSummary {
  /** Database id of the revision: the review and release routes address revisions by it. */
  id: number;
  revision: number;
  status: DesignStatus;
  engineVersion: string | null;
  note: string | null;
  createdAt: string;
  updatedAt: string;
  totalLoss: number | null;
}

/** What a revision keeps of the engine's answer: the wire option evaluated and every figure. */
export interface StoredResult {
  wire: unknown;
  evaluation: unknown;
}

/** The engine result saved on a revision (the `result` column), or null when none was chosen yet. */
export function storedEvaluation(stored: unknown): EvaluationResult | null {
  return ((stored as StoredResult | null)?.evaluation as EvaluationResult | undefined) ?? null;
}

/** The wire option the saved result was evaluated with. */
export function storedWire(stored: unknown): WireOption | null {
  return ((stored as StoredResult | null)?.wire as WireOption | undefined) ?? null;
}

export interface RevisionDetail extends RevisionSummary {
  spec: DesignSpec;
  construction: Construction | null;
  result: StoredResult | null;
  materialId: number | null;
}

export interface DesignDetail {
  id: number;
  number: string;
  title: string;
  owner: { id: number; displayName: string };
  createdAt: string;
  updatedAt: string;
  canEdit: boolean;
  revisions: RevisionSummary[];
  latest: RevisionDetail;
}

export interface DiffEntry {
  path: string;
  from: unknown;
  to: unknown;
}

export interface RevisionDiff {
  from: number;
  to: number;
  spec: DiffEntry[];
  construction: DiffEntry[];
  result: DiffEntry[];
}

/** The wire request that rebuilds a catalogue wire option: AWG sizes by gauge, others by bare diameter. */
export function wireRequestOf(wire: { id: string; kind: string; strandDiameter: number; strands: number }): Construction['wire'] {
  const aught = /^AWG (\d)\/0\b/.exec(wire.id);
  if (wire.kind === 'awg' && aught) return { kind: 'awg', awg: 1 - Number(aught[1]), strands: wire.strands };
  const gauge = /^AWG (\d+)\b/.exec(wire.id);
  if (wire.kind === 'awg' && gauge) return { kind: 'awg', awg: Number(gauge[1]), strands: wire.strands };
  return { kind: wire.kind === 'litz' ? 'litz' : 'metric', strandDiameter: wire.strandDiameter, strands: wire.strands };
}
