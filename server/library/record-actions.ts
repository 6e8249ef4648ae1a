import { may } from '@shared/api/permissions';
import type { Role } from '@shared/schemas/auth';
import type { RecordActions } from '@shared/schemas/record-actions';

/** Nothing may be done with it: a shipped core, or a version that is no longer current. */
export const NO_ACTIONS: RecordActions = { canEdit: false, canRetire: false, canRestore: false };

/**
 * What a user with `role` may do with a stored version: only the current version of a lineage is edited,
 * retired or restored, by the roles the permission table gives ("upload" edits, "curate" retires).
 */
export function recordActions(role: Role, version: { current: boolean; retired: boolean }): RecordActions {
  if (!version.current) return NO_ACTIONS;
  const curate = may(role, 'curate');
  return { canEdit: may(role, 'upload'), canRetire: curate && !version.retired, canRestore: curate && version.retired };
}
