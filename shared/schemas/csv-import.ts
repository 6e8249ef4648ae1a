// What a CSV import answers before anything is written (every row with its status and problems by column)
// and the decision a commit takes per existing name. Shared by every library that imports CSV files.
import * as z from 'zod';
import { text } from './text';

export const cellProblemSchema = z.object({ column: z.string(), message: z.string() });
export type CellProblem = z.infer<typeof cellProblemSchema>;

export const importDecisionSchema = z.enum(['new-version', 'skip']);
export type ImportDecision = z.infer<typeof importDecisionSchema>;
/** Per existing name (as written in the file): make a new version, or leave the stored one alone. */
export const importDecisionsSchema = z.record(text().max(80), importDecisionSchema);

export const previewRowSchema = z.object({
  row: z.number().int(),
  name: z.string(),
  status: z.enum(['new', 'exists', 'error']),
  problems: z.array(cellProblemSchema),
  /** What does not stop the import but the user should see beside the row (a conversion made, a value to check). */
  notices: z.array(cellProblemSchema).default([]),
});
export type PreviewRow = z.infer<typeof previewRowSchema>;
export type PreviewStatus = PreviewRow['status'];
/** What a CSV import would do with each row; nothing is written. */
export const importPreviewSchema = z.object({
  fileName: z.string(),
  rows: z.array(previewRowSchema),
  summary: z.object({ rows: z.number().int(), new: z.number().int(), exists: z.number().int(), errors: z.number().int() }),
});
export type ImportPreview = z.infer<typeof importPreviewSchema>;
