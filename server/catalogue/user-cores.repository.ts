import { and, asc, desc, eq } from 'drizzle-orm';
import type { Db } from '../db/client.ts';
import { userCores, users } from '../db/schema.ts';

export type UserCoreRow = typeof userCores.$inferSelect;
export interface UserCoreWithAuthor extends UserCoreRow {
  createdByName: string | null;
}

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
  async addVersion(values: Omit<typeof userCores.$inferInsert, 'id' | 'createdAt' | 'current'>, previousId?: number): Promise<UserCoreRow> {
    return this.db.transaction(async (tx) => {
      if (previousId !== undefined) await tx.update(userCores).set({ current: false }).where(eq(userCores.id, previousId));
      const [row] = await tx.insert(userCores).values(values).returning();
      return row!;
    });
  }

  async setRetired(id: number, retired: boolean): Promise<UserCoreRow | undefined> {
    const [row] = await this.db.update(userCores).set({ retired }).where(and(eq(userCores.id, id), eq(userCores.current, true))).returning();
    return row;
  }
}
