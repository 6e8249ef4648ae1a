import type { KindLimits, RetryPolicy } from '../jobs/job-queue.ts';

/** The job queue's kind for revision checks: the web server sends it, check workers (other processes) work it. */
export const CHECK_JOB = 'revision-check';

export interface CheckJobData {
  checkId: number;
}

/**
 * A worker that dies mid-check leaves its job active; after the time limit the queue fails that attempt and offers
 * the job again, which starts the check over. Two retries, 5 s apart: a check that fails three times is reported.
 */
export const CHECK_RETRY: RetryPolicy = { retries: 2, delaySeconds: 5, backoff: false };
export const CHECK_LIMITS: KindLimits = { expireInSeconds: 120 };
