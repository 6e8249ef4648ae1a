// User-added cores: a ring from its nominal dimensions (IEC 60205 effective parameters), or a gapped
// set given by its effective parameters. SI units (m, m², m³); the form converts from mm.
import * as z from 'zod';
import { coreShapeSchema } from '@shared/catalogue/core-schema';
import { recordActionsSchema } from './record-actions';
import { text } from './text';
import { CORE_FAMILIES, type CoreShape } from '@shared/engine/types';

function dimension(field: string, max: number, unit: string) {
  return z
    .number({ error: `${field} must be a finite number` })
    .positive({ error: `${field} must be greater than 0` })
    .max(max, { error: `${field} must be at most ${max} ${unit}` });
}

const nameSchema = text()
  .trim()
  .min(1, 'name is required')
  .max(60, 'name must be at most 60 characters')
  .regex(/^[^=+\-@]/, 'name must not start with =, +, - or @');
const noteSchema = text().trim().max(300, 'source must be at most 300 characters');

export const ringCoreRequestSchema = z
  .object({
    kind: z.literal('ring'),
    name: nameSchema,
    family: z.enum(['RING', 'POWDER_TOROID'], { error: 'family must be RING or POWDER_TOROID' }),
    outerDiameter: dimension('outerDiameter', 0.5, 'm'),
    innerDiameter: dimension('innerDiameter', 0.5, 'm'),
    height: dimension('height', 0.5, 'm'),
    source: noteSchema.default(''),
  })
  .strict()
  .refine((r) => r.innerDiameter < r.outerDiameter, {
    path: ['innerDiameter'],
    message: 'innerDiameter must be smaller than outerDiameter',
  });

export const GAPPED_CORE_FAMILIES = [
  'E',
  'ETD',
  'EFD',
  'EQ',
  'PQ',
  'RM',
  'POT',
] as const satisfies readonly (typeof CORE_FAMILIES)[number][];

export const shapedCoreRequestSchema = z
  .object({
    kind: z.literal('shape'),
    name: nameSchema,
    family: z.enum(GAPPED_CORE_FAMILIES, { error: `family must be one of ${GAPPED_CORE_FAMILIES.join(', ')}` }),
    ae: dimension('ae', 0.1, 'm²'),
    amin: dimension('amin', 0.1, 'm²').optional(),
    le: dimension('le', 5, 'm'),
    ve: dimension('ve', 0.1, 'm³'),
    windowArea: dimension('windowArea', 0.1, 'm²'),
    windowHeight: dimension('windowHeight', 1, 'm'),
    bobbinWidth: dimension('bobbinWidth', 1, 'm'),
    bobbinHeight: dimension('bobbinHeight', 1, 'm'),
    mlt: dimension('mlt', 5, 'm'),
    surfaceArea: dimension('surfaceArea', 10, 'm²'),
    source: noteSchema.min(1, 'source must say where the numbers come from'),
  })
  .strict();

export const userCoreRequestSchema = z.discriminatedUnion('kind', [ringCoreRequestSchema, shapedCoreRequestSchema]);
export type UserCoreRequest = z.infer<typeof userCoreRequestSchema>;

/** The engine's CoreShape as an answer carries it: the fields only (the consistency checks ran when it was stored). */
export const coreShapeAnswerSchema = z.object(coreShapeSchema.shape) satisfies z.ZodType<CoreShape>;

/**
 * A core as GET /api/catalogue/cores lists it: shipped or user-added, with its area product (m⁴) and what the
 * signed-in user may do with it (nothing, for a shipped core).
 */
export const listedCoreSchema = coreShapeAnswerSchema
  .extend({
    areaProduct: z.number(),
    origin: z.enum(['shipped', 'user']),
    userCoreId: z.number().int().optional(),
    version: z.number().int().optional(),
    retired: z.boolean().optional(),
    createdBy: z.string().nullable().optional(),
    createdAt: z.string().optional(),
  })
  .extend(recordActionsSchema.shape);
export type ListedCore = z.infer<typeof listedCoreSchema>;
export const coreListResponseSchema = z.object({ cores: z.array(listedCoreSchema) });
export const coreHistoryResponseSchema = z.object({ versions: z.array(listedCoreSchema) });
/** What an import of a core CSV file did. */
export const coreImportResultSchema = z.object({
  fileName: z.string(),
  created: z.number().int(),
  versioned: z.number().int(),
  skipped: z.number().int(),
  coreIds: z.array(z.number().int()),
});
export type CoreImportResult = z.infer<typeof coreImportResultSchema>;
