import { and, asc, desc, eq, inArray } from 'drizzle-orm';
import type { Db, Tx } from '../db/client.ts';
import { userCores, users } from '../db/schema.ts';
import { conflict } from '../http/errors.ts';

export type UserCoreRow = typeof userCores.$inferSelect;
export interface UserCoreWithAuthor extends UserCoreRow {
  createdByName: string | null;
}
export type NewUserCoreVersion = Omit<typeof userCores.$inferInsert, 'id' | 'createdAt' | 'current'>;

export class UserCoresRepository {
  constructor(readonly db: Db) {}

  async listCurrent(includeRetired = true): Promise<UserCoreWithAuthor[]> {
    const where = includeRetired ? eq(userCores.current, true) : and(eq(userCores.current, true), eq(userCores.retired, false));
    const rows = await this.db
      .select({ core: userCores, createdByName: users.displayName })
      .from(userCores)
      .leftJoin(users, eq(users.id, userCores.createdBy))
      .where(where)
      .orderBy(asc(userCores.name));
    return rows.map((r) => ({ ...r.core, createdByName: r.createdByName }));
  }

  async findById(id: number): Promise<UserCoreRow | undefined> {
    const [row] = await this.db.select().from(userCores).where(eq(userCores.id, id));
    return row;
  }

  async history(lineage: string): Promise<UserCoreWithAuthor[]> {
    const rows = await this.db
      .select({ core: userCores, createdByName: users.displayName })
      .from(userCores)
      .leftJoin(users, eq(users.id, userCores.createdBy))
      .where(eq(userCores.lineage, lineage))
      .orderBy(desc(userCores.version));
    return rows.map((r) => ({ ...r.core, createdByName: r.createdByName }));
  }

  /** Adds a version; the previous one (if any) stops being current, in one transaction. */
  async addVersion(tx: Tx, values: NewUserCoreVersion, previousId?: number): Promise<UserCoreRow> {
    if (previousId !== undefined) await this.supersede(tx, [previousId]);
    const [row] = await this.insertVersions(tx, [values]);
    return row!;
  }

  /** Current versions (retired ones too) by lower-case name; inside a transaction when given one. */
  async currentByLowerName(tx: Tx | Db = this.db): Promise<Map<string, UserCoreRow>> {
    const rows = await tx.select().from(userCores).where(eq(userCores.current, true));
    return new Map(rows.map((r) => [r.name.toLowerCase(), r]));
  }

  /**
   * The given versions stop being current (a new version of each is about to be inserted). As for materials,
   * a version a parallel writer replaced meanwhile is no longer current once its row lock is released: 409.
   */
  async supersede(tx: Tx, versionIds: number[]): Promise<void> {
    const ids = [...new Set(versionIds)];
    if (!ids.length) return;
    const rows = await tx
      .update(userCores)
      .set({ current: false })
      .where(and(inArray(userCores.id, ids), eq(userCores.current, true)))
      .returning({ id: userCores.id });
    if (rows.length < ids.length) {
      const what = ids.length === 1 ? 'this core' : 'one of these cores';
      throw conflict(`Someone else saved a new version of ${what} at the same moment. Reload and make your change again.`);
    }
  }

  async insertVersions(tx: Tx, rows: NewUserCoreVersion[]): Promise<UserCoreRow[]> {
    if (!rows.length) return [];
    return tx.insert(userCores).values(rows).returning();
  }

  async setRetired(id: number, retired: boolean, db: Tx | Db = this.db): Promise<UserCoreRow | undefined> {
    const [row] = await db
      .update(userCores)
      .set({ retired })
      .where(and(eq(userCores.id, id), eq(userCores.current, true)))
      .returning();
    return row;
  }
}
