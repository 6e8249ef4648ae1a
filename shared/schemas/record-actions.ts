// What the signed-in user may do with one library record (a material, a user core), as the server states it:
// the buttons follow these flags instead of working out roles and states themselves.
import * as z from 'zod';

export const recordActionsSchema = z.object({
  /** Make a new version (edit the current version). */
  canEdit: z.boolean(),
  /** Hide the current version from new searches. */
  canRetire: z.boolean(),
  /** Bring a retired current version back. */
  canRestore: z.boolean(),
});
export type RecordActions = z.infer<typeof recordActionsSchema>;
