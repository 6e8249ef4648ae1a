import type { CoreShape } from '@shared/engine/types';
import type { Db } from '../db/client.ts';
import { userCores } from '../db/schema.ts';
import { VersionStore } from '../library/version-store.ts';

export type UserCoreRow = typeof userCores.$inferSelect;
/** A user core's own columns: its name, family and the engine's CoreShape (SI units). */
export interface UserCoreValues {
  name: string;
  family: string;
  shape: CoreShape;
}

/** The user cores table through the versioned library's queries. */
export class UserCoresRepository extends VersionStore<UserCoreRow, UserCoreValues> {
  constructor(db: Db) {
    super(db, userCores, 'core');
  }
}
