import { and, asc, desc, eq, ilike, or, sql, type SQL } from 'drizzle-orm';
import type { DesignListQuery } from '@shared/schemas/designs';
import type { Db } from '../db/client.ts';
import { designRevisions, designs, users } from '../db/schema.ts';

export type DesignRow = typeof designs.$inferSelect;
export type RevisionRow = typeof designRevisions.$inferSelect;
export type NewRevisionRow = typeof designRevisions.$inferInsert;
type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
export type DbOrTx = Db | Tx;

export interface DesignWithOwner extends DesignRow {
  ownerName: string;
}

export interface ListedDesign extends DesignWithOwner {
  status: RevisionRow['status'];
  revision: number;
  spec: unknown;
}

/** Design numbers are the row id, padded: GW-0001. */
export const designNumber = (id: number) => `GW-${String(id).padStart(4, '0')}`;

export class DesignsRepository {
  constructor(readonly db: Db) {}

  async list(query: DesignListQuery, actorId: number): Promise<{ rows: ListedDesign[]; total: number }> {
    const latest = this.db
      .select({
        designId: designRevisions.designId,
        revision: sql<number>`max(${designRevisions.revision})`.as('latest_revision'),
      })
      .from(designRevisions)
      .groupBy(designRevisions.designId)
      .as('latest');
    const conditions: SQL[] = [];
    if (query.scope === 'mine') conditions.push(eq(designs.ownerId, actorId));
    if (query.status) conditions.push(eq(designRevisions.status, query.status));
    if (query.q) {
      const pattern = `%${query.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
      conditions.push(or(ilike(designs.title, pattern), ilike(designs.number, pattern), ilike(users.displayName, pattern))!);
    }
    const where = conditions.length ? and(...conditions) : undefined;
    const sortColumn = {
      number: designs.number,
      title: designs.title,
      updated: designs.updatedAt,
      owner: users.displayName,
      status: designRevisions.status,
    }[query.sort];
    const order = query.dir === 'asc' ? asc(sortColumn) : desc(sortColumn);
    const base = this.db
      .select({
        design: designs,
        ownerName: users.displayName,
        status: designRevisions.status,
        revision: designRevisions.revision,
        spec: designRevisions.spec,
        total: sql<number>`count(*) over ()`.mapWith(Number),
      })
      .from(designs)
      .innerJoin(users, eq(users.id, designs.ownerId))
      .innerJoin(latest, eq(latest.designId, designs.id))
      .innerJoin(designRevisions, and(eq(designRevisions.designId, designs.id), eq(designRevisions.revision, latest.revision)))
      .where(where)
      .orderBy(order, desc(designs.id))
      .limit(query.pageSize)
      .offset(query.page * query.pageSize);
    const found = await base;
    let total = found[0]?.total ?? 0;
    if (!found.length && query.page > 0) {
      const [{ n }] = await this.db
        .select({ n: sql<number>`count(*)`.mapWith(Number) })
        .from(designs)
        .innerJoin(users, eq(users.id, designs.ownerId))
        .innerJoin(latest, eq(latest.designId, designs.id))
        .innerJoin(designRevisions, and(eq(designRevisions.designId, designs.id), eq(designRevisions.revision, latest.revision)))
        .where(where);
      total = n;
    }
    return {
      rows: found.map((f) => ({ ...f.design, ownerName: f.ownerName, status: f.status, revision: f.revision, spec: f.spec })),
      total,
    };
  }

  async findDesign(id: number, db: DbOrTx = this.db): Promise<DesignWithOwner | undefined> {
    const [row] = await db
      .select({ design: designs, ownerName: users.displayName })
      .from(designs)
      .innerJoin(users, eq(users.id, designs.ownerId))
      .where(eq(designs.id, id));
    return row ? { ...row.design, ownerName: row.ownerName } : undefined;
  }

  revisions(designId: number, db: DbOrTx = this.db): Promise<RevisionRow[]> {
    return db.select().from(designRevisions).where(eq(designRevisions.designId, designId)).orderBy(asc(designRevisions.revision));
  }

  async revision(designId: number, revision: number, db: DbOrTx = this.db): Promise<RevisionRow | undefined> {
    const [row] = await db
      .select()
      .from(designRevisions)
      .where(and(eq(designRevisions.designId, designId), eq(designRevisions.revision, revision)));
    return row;
  }

  /** Inserts with a placeholder number, then sets GW-nnnn from the id so two creations never race for a number. */
  async insertDesign(tx: DbOrTx, title: string, ownerId: number): Promise<DesignRow> {
    const placeholder = `tmp-${Date.now().toString(36)}${Math.random().toString(36).slice(2, 8)}`.slice(0, 20);
    const [created] = await tx.insert(designs).values({ number: placeholder, title, ownerId }).returning();
    const [numbered] = await tx
      .update(designs)
      .set({ number: designNumber(created.id) })
      .where(eq(designs.id, created.id))
      .returning();
    return numbered;
  }

  async insertRevision(tx: DbOrTx, row: NewRevisionRow): Promise<RevisionRow> {
    const [created] = await tx.insert(designRevisions).values(row).returning();
    return created;
  }

  async updateRevision(tx: DbOrTx, id: number, changes: Partial<NewRevisionRow>): Promise<RevisionRow> {
    const [updated] = await tx
      .update(designRevisions)
      .set({ ...changes, updatedAt: new Date() })
      .where(and(eq(designRevisions.id, id), eq(designRevisions.status, 'draft')))
      .returning();
    return updated;
  }

  async touchDesign(tx: DbOrTx, id: number, title?: string): Promise<void> {
    await tx
      .update(designs)
      .set({ updatedAt: new Date(), ...(title !== undefined ? { title } : {}) })
      .where(eq(designs.id, id));
  }
}
