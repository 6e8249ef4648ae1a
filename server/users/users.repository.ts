import { asc, eq, sql } from 'drizzle-orm';
import type { Db, Tx } from '../db/client.ts';
import { session, users } from '../db/schema.ts';

export type UserRow = typeof users.$inferSelect;
export type NewUserRow = typeof users.$inferInsert;

export class UsersRepository {
  constructor(private readonly db: Db) {}

  async findById(id: number): Promise<UserRow | undefined> {
    const [row] = await this.db.select().from(users).where(eq(users.id, id));
    return row;
  }

  async findByUsername(username: string): Promise<UserRow | undefined> {
    const [row] = await this.db.select().from(users).where(eq(users.username, username));
    return row;
  }

  list(): Promise<UserRow[]> {
    return this.db.select().from(users).orderBy(asc(users.username));
  }

  async count(): Promise<number> {
    const [{ n }] = await this.db.select({ n: sql<number>`count(*)::int` }).from(users);
    return n;
  }

  transaction<T>(fn: (tx: Tx) => Promise<T>): Promise<T> {
    return this.db.transaction(fn);
  }

  async insert(row: NewUserRow, db: Tx | Db = this.db): Promise<UserRow> {
    const [created] = await db.insert(users).values(row).returning();
    return created;
  }

  async update(id: number, changes: Partial<NewUserRow>, db: Tx | Db = this.db): Promise<UserRow | undefined> {
    const [updated] = await db
      .update(users)
      .set({ ...changes, updatedAt: new Date() })
      .where(eq(users.id, id))
      .returning();
    return updated;
  }

  /** Stamps the sign-in and returns the row as it now is (one round trip instead of update + select). */
  async touchSignIn(id: number): Promise<UserRow | undefined> {
    const [row] = await this.db.update(users).set({ lastSignInAt: new Date() }).where(eq(users.id, id)).returning();
    return row;
  }

  /** Ends every session of a user at once (ASVS 7.4.2): passport keeps the user id in sess.passport.user. */
  async deleteSessionsOf(id: number, db: Tx | Db = this.db): Promise<void> {
    await db.delete(session).where(sql`(${session.sess}->'passport'->>'user') = ${String(id)}`);
  }
}
