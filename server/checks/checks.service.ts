import type { CheckKind, RevisionCheck, RevisionChecks } from '@shared/schemas/checks';
import type { DesignsService } from '../designs/designs.service.ts';
import type { Caller } from '../designs/revision-access.ts';
import { requireStoredResult } from '../designs/stored-result.ts';
import { conflict, notFound } from '../http/errors.ts';
import type { JobQueue } from '../jobs/job-queue.ts';
import { CHECK_JOB, type CheckJobData } from './check-jobs.ts';
import { checkView, FROZEN_STATUSES, type ChecksRepository } from './checks.repository.ts';

type Revision = Awaited<ReturnType<DesignsService['revision']>>;

/** Statuses whose figures are frozen: the checks then stay as they were at release. */
const FROZEN = new Set<string>(FROZEN_STATUSES);

const labelOf = (revision: Revision) => `Revision ${revision.revision} of ${revision.design.number}`;

function frozenReason(revision: Revision): string | null {
  if (!FROZEN.has(revision.status)) return null;
  return `${labelOf(revision)} is ${revision.status}: its checks are frozen with it. Start a new revision to check again.`;
}

/** Queues, lists and cancels a revision's independent checks; the work itself is done by check workers. */
export class ChecksService {
  constructor(
    private readonly repo: ChecksRepository,
    private readonly designs: DesignsService,
    private readonly jobs: JobQueue,
  ) {}

  async run(caller: Caller, designId: number, revisionNumber: number, kind: CheckKind): Promise<RevisionCheck> {
    const revision = await this.designs.revision(designId, revisionNumber);
    const frozen = frozenReason(revision);
    if (frozen) throw conflict(frozen);
    requireStoredResult(labelOf(revision), revision);
    const row = await this.repo.transaction(async (tx) => {
      const inserted = await this.repo.insertQueued(tx, revision.id, kind, caller.id);
      if (!inserted) return undefined;
      // The job exists only if the check row does: both are committed together.
      const data: CheckJobData = { checkId: inserted.id };
      const jobId = await this.jobs.sendInTransaction(tx, CHECK_JOB, data);
      await this.repo.setJobId(tx, inserted.id, jobId);
      return { ...inserted, jobId };
    });
    // Asking again while one is queued or running answers that one.
    const current = row ?? (await this.repo.openCheck(revision.id, kind));
    if (!current) throw conflict('The check finished while it was being queued again; ask once more.');
    return checkView(current, await this.repo.displayName(current.requestedBy));
  }

  async list(designId: number, revisionNumber: number): Promise<RevisionChecks> {
    const revision = await this.designs.revision(designId, revisionNumber);
    const rows = await this.repo.latestPerKind(revision.id);
    const frozen = frozenReason(revision);
    return { checks: rows.map((r) => checkView(r, r.requestedByName)), canRun: frozen === null, frozenReason: frozen };
  }

  async cancel(designId: number, revisionNumber: number, checkId: number): Promise<RevisionCheck> {
    const revision = await this.designs.revision(designId, revisionNumber);
    const existing = await this.repo.find(checkId, revision.id);
    if (!existing) throw notFound(`${labelOf(revision)} has no check ${checkId}.`);
    const frozen = frozenReason(revision);
    if (frozen) throw conflict(frozen);
    const cancelled = await this.repo.cancel(checkId);
    if (!cancelled) throw conflict(`Check ${checkId} has already finished (${existing.status}); there is nothing to cancel.`);
    // A queued job is taken off the queue; a running one finds its check cancelled and discards its result.
    if (existing.status === 'queued' && existing.jobId) await this.jobs.remove(CHECK_JOB, existing.jobId);
    return checkView(cancelled, await this.repo.displayName(cancelled.requestedBy));
  }
}
