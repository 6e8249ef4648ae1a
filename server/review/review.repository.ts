import { and, desc, eq, getTableColumns, inArray, ne, sql } from 'drizzle-orm';
import type { Db, Tx } from '../db/client.ts';
import { designRevisions, designs, revisionTransitions, users } from '../db/schema.ts';

import type { DesignRow, RevisionRow } from '../designs/designs.repository.ts';

export type { Tx } from '../db/client.ts';
// The designs feature owns these tables; review reads and moves their rows.
export type { DesignRow, RevisionRow } from '../designs/designs.repository.ts';
type Status = RevisionRow['status'];

export class ReviewRepository {
  constructor(private readonly db: Db) {}

  transaction<T>(fn: (tx: Tx) => Promise<T>): Promise<T> {
    return this.db.transaction(fn);
  }

  /** The revision and its design, locked for the rest of the transaction. */
  async lockRevision(tx: Tx, id: number): Promise<{ revision: RevisionRow; design: DesignRow } | undefined> {
    const [row] = await revisionWithDesign(tx, id).for('update', { of: designRevisions });
    return row;
  }

  async setStatus(tx: Tx, id: number, status: Status, extra: Partial<RevisionRow> = {}): Promise<void> {
    await tx
      .update(designRevisions)
      .set({ status, updatedAt: new Date(), ...extra })
      .where(eq(designRevisions.id, id));
  }

  /** Earlier released revisions of the same design become superseded when a newer one is released. */
  async supersedeReleased(tx: Tx, designId: number, exceptId: number): Promise<number[]> {
    const rows = await tx
      .update(designRevisions)
      .set({ status: 'superseded', updatedAt: new Date() })
      .where(and(eq(designRevisions.designId, designId), eq(designRevisions.status, 'released'), ne(designRevisions.id, exceptId)))
      .returning({ id: designRevisions.id });
    return rows.map((r) => r.id);
  }

  async addTransition(tx: Tx | Db, t: typeof revisionTransitions.$inferInsert): Promise<void> {
    await tx.insert(revisionTransitions).values(t);
  }

  timeline(revisionIds: number[]) {
    if (!revisionIds.length) return Promise.resolve([]);
    // Every column of a transition but the actor's id, and the actor's name in its place.
    const { actorId: _actorId, ...transition } = getTableColumns(revisionTransitions);
    return this.db
      .select({ ...transition, actor: users.displayName })
      .from(revisionTransitions)
      .leftJoin(users, eq(users.id, revisionTransitions.actorId))
      .where(inArray(revisionTransitions.revisionId, revisionIds))
      .orderBy(revisionTransitions.at, revisionTransitions.id);
  }

  async revisionIdsOfDesign(designId: number): Promise<number[]> {
    const rows = await this.db.select({ id: designRevisions.id }).from(designRevisions).where(eq(designRevisions.designId, designId));
    return rows.map((r) => r.id);
  }

  async revision(id: number): Promise<{ revision: RevisionRow; design: DesignRow } | undefined> {
    const [row] = await revisionWithDesign(this.db, id);
    return row;
  }

  /** Revisions in a given state, newest first, with design and author names (for inboxes). */
  revisionsInStatus(statuses: Status[]) {
    return this.db
      .select({
        revisionId: designRevisions.id,
        revision: designRevisions.revision,
        status: designRevisions.status,
        designId: designs.id,
        designNumber: designs.number,
        title: designs.title,
        ownerId: designs.ownerId,
        createdBy: designRevisions.createdBy,
        updatedAt: designRevisions.updatedAt,
      })
      .from(designRevisions)
      .innerJoin(designs, eq(designs.id, designRevisions.designId))
      .where(inArray(designRevisions.status, statuses))
      .orderBy(desc(designRevisions.updatedAt));
  }

  /** Drafts of this owner whose latest transition was a return from review. */
  async returnedDraftsOf(ownerId: number) {
    const rows = await this.db.execute<{
      revision_id: number;
      revision: number;
      design_id: number;
      design_number: string;
      title: string;
      comment: string | null;
      at: Date;
    }>(sql`
      select r.id as revision_id, r.revision, d.id as design_id, d.number as design_number, d.title, t.comment, t.at
      from design_revisions r
      join designs d on d.id = r.design_id
      join lateral (
        select * from revision_transitions t where t.revision_id = r.id order by t.at desc, t.id desc limit 1
      ) t on true
      where d.owner_id = ${ownerId} and r.status = 'draft' and t.from_status in ('in_review', 'approved') and t.to_status = 'draft'
      order by t.at desc`);
    return rows.rows;
  }
}

function revisionWithDesign(executor: Db | Tx, id: number) {
  return executor
    .select({ revision: designRevisions, design: designs })
    .from(designRevisions)
    .innerJoin(designs, eq(designs.id, designRevisions.designId))
    .where(eq(designRevisions.id, id));
}
