// What a request about materials may carry: an edit (changed cells), the export and list queries.
import * as z from 'zod';
import { storedIdTextSchema, uniqueListSchema } from './ids';
import { MATERIAL_CSV_COLUMNS, type MaterialCsvColumn } from './material-csv';
import { text } from './text';

/** Editing a material: the same cells as a CSV row (numbers may be sent as numbers), giving a new version. */
export const materialEditSchema = z
  .object(
    Object.fromEntries(MATERIAL_CSV_COLUMNS.map((c) => [c, z.union([text().max(500), z.number()]).optional()])) as Record<
      MaterialCsvColumn,
      z.ZodOptional<z.ZodUnion<[z.ZodString, z.ZodNumber]>>
    >,
  )
  .strict()
  .refine((edit) => Object.values(edit).some((v) => v !== undefined), { error: 'Give at least one column to change', path: ['(body)'] });
export type MaterialEdit = z.infer<typeof materialEditSchema>;

export const materialExportQuerySchema = z
  .object({
    ids: text()
      .max(20000, { error: 'ids must be a comma-separated list of material ids' })
      .transform((list) => list.split(','))
      .pipe(uniqueListSchema(storedIdTextSchema(), 1000, 'ids'))
      .meta({ description: 'Comma-separated material ids (at most 1000 distinct)' })
      .optional(),
  })
  .strict();

export const materialListQuerySchema = z.object({
  retired: z.enum(['include']).optional().meta({ description: '"include" lists retired materials too' }),
});
