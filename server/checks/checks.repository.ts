import { and, desc, eq, inArray, notExists } from 'drizzle-orm';
import { checkResultSchema, type CheckKind, type RevisionCheck } from '@shared/schemas/checks';
import type { Db, Tx } from '../db/client.ts';
import { designRevisions, revisionChecks, users } from '../db/schema.ts';

export type CheckRow = typeof revisionChecks.$inferSelect;
const OPEN = ['queued', 'running'] as const;

/** What a worker needs of the revision it checks. */
export interface CheckedRevision {
  spec: unknown;
  result: unknown;
  materialId: number | null;
}

export class ChecksRepository {
  constructor(private readonly db: Db) {}

  transaction<T>(fn: (tx: Tx) => Promise<T>): Promise<T> {
    return this.db.transaction(fn);
  }

  /** A new queued check, or undefined when one of that kind is already queued or running (the partial unique index). */
  async insertQueued(tx: Tx, revisionId: number, kind: CheckKind, requestedBy: number): Promise<CheckRow | undefined> {
    const [row] = await tx.insert(revisionChecks).values({ revisionId, kind, requestedBy }).onConflictDoNothing().returning();
    return row;
  }

  async setJobId(tx: Tx, id: number, jobId: string | null): Promise<void> {
    await tx.update(revisionChecks).set({ jobId }).where(eq(revisionChecks.id, id));
  }

  async openCheck(revisionId: number, kind: CheckKind): Promise<CheckRow | undefined> {
    const [row] = await this.db
      .select()
      .from(revisionChecks)
      .where(and(eq(revisionChecks.revisionId, revisionId), eq(revisionChecks.kind, kind), inArray(revisionChecks.status, OPEN)));
    return row;
  }

  async find(id: number, revisionId: number): Promise<CheckRow | undefined> {
    const [row] = await this.db
      .select()
      .from(revisionChecks)
      .where(and(eq(revisionChecks.id, id), eq(revisionChecks.revisionId, revisionId)));
    return row;
  }

  /** The newest check of each kind on a revision, with who asked for it. */
  async latestPerKind(revisionId: number): Promise<(CheckRow & { requestedByName: string | null })[]> {
    const rows = await this.db
      .selectDistinctOn([revisionChecks.kind], { check: revisionChecks, requestedByName: users.displayName })
      .from(revisionChecks)
      .leftJoin(users, eq(users.id, revisionChecks.requestedBy))
      .where(eq(revisionChecks.revisionId, revisionId))
      .orderBy(revisionChecks.kind, desc(revisionChecks.id));
    return rows.map((r) => ({ ...r.check, requestedByName: r.requestedByName })).sort((a, b) => b.id - a.id);
  }

  async displayName(userId: number | null): Promise<string | null> {
    if (userId === null) return null;
    const [row] = await this.db.select({ name: users.displayName }).from(users).where(eq(users.id, userId));
    return row?.name ?? null;
  }

  /** Cancels a check still open; undefined when it had already finished. */
  async cancel(id: number): Promise<CheckRow | undefined> {
    const [row] = await this.db
      .update(revisionChecks)
      .set({ status: 'cancelled', finishedAt: new Date() })
      .where(and(eq(revisionChecks.id, id), inArray(revisionChecks.status, OPEN)))
      .returning();
    return row;
  }

  // The worker's side. Every write names the state it expects, so a cancelled check is never brought back.

  /** Starts (or, for a retried job, starts over) an open check; undefined when it was cancelled meanwhile. */
  async markRunning(id: number): Promise<CheckRow | undefined> {
    const [row] = await this.db
      .update(revisionChecks)
      .set({ status: 'running', progress: 0, startedAt: new Date(), failure: null })
      .where(and(eq(revisionChecks.id, id), inArray(revisionChecks.status, OPEN)))
      .returning();
    return row;
  }

  /** False when the check is no longer running (cancelled). */
  async setProgress(id: number, progress: number): Promise<boolean> {
    const rows = await this.db
      .update(revisionChecks)
      .set({ progress: Math.min(1, Math.max(0, progress)) })
      .where(and(eq(revisionChecks.id, id), eq(revisionChecks.status, 'running')))
      .returning({ id: revisionChecks.id });
    return rows.length > 0;
  }

  /** The result and 'done' in one statement (one transaction); false when the check was cancelled meanwhile. */
  /**
   * Stores a finished check's result, unless it was cancelled meanwhile or its revision was released (or superseded)
   * while it ran: a released revision's checks stay as they were at release, so the late result is discarded and the
   * check marked cancelled with the reason.
   */
  async finish(id: number, result: unknown): Promise<'stored' | 'cancelled' | 'frozen'> {
    const frozenRevision = this.db
      .select({ id: designRevisions.id })
      .from(designRevisions)
      .where(and(eq(designRevisions.id, revisionChecks.revisionId), inArray(designRevisions.status, FROZEN_STATUSES)));
    const stored = await this.db
      .update(revisionChecks)
      .set({ status: 'done', progress: 1, result, finishedAt: new Date() })
      .where(and(eq(revisionChecks.id, id), eq(revisionChecks.status, 'running'), notExists(frozenRevision)))
      .returning({ id: revisionChecks.id });
    if (stored.length) return 'stored';
    const frozen = await this.db
      .update(revisionChecks)
      .set({ status: 'cancelled', failure: FROZEN_WHILE_RUNNING, finishedAt: new Date() })
      .where(and(eq(revisionChecks.id, id), eq(revisionChecks.status, 'running')))
      .returning({ id: revisionChecks.id });
    return frozen.length ? 'frozen' : 'cancelled';
  }

  async fail(id: number, failure: string): Promise<void> {
    await this.db
      .update(revisionChecks)
      .set({ status: 'failed', failure: failure.slice(0, 2000), finishedAt: new Date() })
      .where(and(eq(revisionChecks.id, id), inArray(revisionChecks.status, OPEN)));
  }

  async revisionOf(revisionId: number): Promise<CheckedRevision | undefined> {
    const [row] = await this.db
      .select({ spec: designRevisions.spec, result: designRevisions.result, materialId: designRevisions.materialId })
      .from(designRevisions)
      .where(eq(designRevisions.id, revisionId));
    return row;
  }
}

/** A stored check as the API answers it. */
/** Revision statuses whose checks are frozen. */
export const FROZEN_STATUSES = ['released', 'superseded'] as const;
export const FROZEN_WHILE_RUNNING =
  'The revision was released while the check ran; its checks stay as they were at release, so this result was discarded.';

export function checkView(row: CheckRow, requestedBy: string | null): RevisionCheck {
  return {
    id: row.id,
    revisionId: row.revisionId,
    kind: row.kind,
    status: row.status,
    progress: row.progress,
    // A result stored by an older version that no longer reads is shown as none rather than guessed at.
    result: checkResultSchema.safeParse(row.result).data ?? null,
    failure: row.failure,
    requestedBy,
    createdAt: row.createdAt.toISOString(),
    startedAt: row.startedAt?.toISOString() ?? null,
    finishedAt: row.finishedAt?.toISOString() ?? null,
  };
}
