import { sql, type SQL } from 'drizzle-orm';
import PgBoss from 'pg-boss';
import plans from 'pg-boss/src/plans.js';
import type pg from 'pg';
import type { Logger } from 'pino';
import type { Tx } from '../db/client.ts';
import { databaseUnavailable } from '../http/database-errors.ts';

/** How a kind of job is retried: one attempt, then `retries` more, `delaySeconds` apart (doubling if `backoff`). */
export interface RetryPolicy {
  retries: number;
  delaySeconds: number;
  backoff: boolean;
}

/** One job as its handler sees it: what was sent, and which attempt this is (1 = the first). */
export interface JobRun<T> {
  data: T;
  attempt: number;
  /** True when a failure now is final: no retry follows. */
  lastAttempt: boolean;
}

interface Kind {
  retry: RetryPolicy;
  /** Absent for a kind this instance only sends: another process (a worker) works it. */
  handler?: (run: JobRun<never>) => Promise<void>;
  limits: KindLimits;
}

export interface KindLimits {
  /** Time limit of one attempt: an attempt still active after it (its worker died or hangs) is failed and retried. */
  expireInSeconds?: number;
}

export interface JobQueueOptions {
  pool: pg.Pool;
  /** The PostgreSQL schema that holds the queue's tables (tests may give each file its own). */
  schema: string;
  pollSeconds: number;
  logger: Logger;
}

/**
 * Background jobs stored in PostgreSQL (pg-boss): a job survives a restart, any app instance picks it up, and a job
 * can be sent inside the transaction whose outcome it belongs to, so the two are committed (or undone) together.
 * Each kind is registered once with its handler and retry policy; `start()` creates the queues and the workers.
 */
export class JobQueue {
  private readonly boss: PgBoss;
  private readonly kinds = new Map<string, Kind>();
  private started = false;

  constructor(private readonly options: JobQueueOptions) {
    const { pool, schema, logger } = options;
    // pg-boss 10 completes or fails a finished job without awaiting the statement (manager.js, onFetch): if the
    // database goes away at that moment the rejection is unhandled and ends the process. Those two statements are
    // logged instead; the job stays active, expires and is retried when the database is back.
    const unawaited = new Set([plans.completeJobs(schema), plans.failJobsById(schema)]);
    const executeSql = (text: string, values: unknown[]) => {
      const run = pool.query(text, values);
      if (!unawaited.has(text)) return run;
      return run.catch((err: unknown) => {
        logger.warn(
          { err: err instanceof Error ? err.message : String(err) },
          'job queue: a finished job could not be marked; it will be retried',
        );
        return { rows: [{ count: '0' }] };
      });
    };
    // pg-boss runs on the app's pool, so it needs no connections of its own.
    this.boss = new PgBoss({ db: { executeSql }, schema, schedule: false });
    this.boss.on('error', (err) => options.logger.warn({ err: err.message }, 'job queue error'));
  }

  /** Declares a kind of job; call before `start()`. */
  define<T extends object>(name: string, retry: RetryPolicy, handler: (run: JobRun<T>) => Promise<void>, limits: KindLimits = {}): void {
    if (this.started) throw new Error(`job kind ${name} defined after the queue started`);
    this.kinds.set(name, { retry, handler: handler as Kind['handler'], limits });
  }

  /** Declares a kind this instance sends but never works (worker processes define it with their handler). */
  declareSendOnly(name: string, retry: RetryPolicy, limits: KindLimits = {}): void {
    if (this.started) throw new Error(`job kind ${name} declared after the queue started`);
    this.kinds.set(name, { retry, limits });
  }

  async start(): Promise<void> {
    if (this.started) return;
    this.started = true;
    await whileConnecting(() => this.boss.start());
    for (const [name, { retry, handler, limits }] of this.kinds) {
      await whileConnecting(() =>
        this.boss.createQueue(name, {
          name,
          retryLimit: retry.retries,
          retryDelay: retry.delaySeconds,
          retryBackoff: retry.backoff,
          ...limits,
        }),
      );
      if (!handler) continue;
      await this.boss.work<object>(
        name,
        { includeMetadata: true, batchSize: 1, pollingIntervalSeconds: this.options.pollSeconds },
        async ([job]) => {
          await handler({ data: job.data as never, attempt: job.retryCount + 1, lastAttempt: job.retryCount >= job.retryLimit });
        },
      );
    }
  }

  /** Enqueues a job inside `tx`: it exists only if the transaction commits. */
  async sendInTransaction(tx: Tx, name: string, data: object, options: { singletonKey?: string } = {}): Promise<string | null> {
    const kind = this.kinds.get(name);
    if (!kind) throw new Error(`unknown job kind ${name}`);
    const { retries, delaySeconds, backoff } = kind.retry;
    return this.boss.send(name, data, {
      ...options,
      ...kind.limits,
      retryLimit: retries,
      retryDelay: delaySeconds,
      retryBackoff: backoff,
      db: { executeSql: async (text, values) => ({ rows: (await tx.execute(bound(text, values))).rows }) },
    });
  }

  /** Takes a job off the queue (a queued job is never worked; one already being worked finishes unnoticed). */
  async remove(name: string, id: string): Promise<void> {
    await this.boss.deleteJob(name, id);
  }

  /** Lets running jobs finish (up to `timeoutMs`), then stops polling. Pending jobs stay stored for the next start. */
  async stop(timeoutMs = 10_000): Promise<void> {
    if (!this.started) return;
    await this.boss.stop({ graceful: true, wait: true, close: false, timeout: timeoutMs });
  }
}

/** pg-boss's own statement ($1, $2 … placeholders) as a Drizzle query with the same values bound as parameters. */
function bound(text: string, values: unknown[]): SQL {
  const parts = text.split(/\$(\d+)/);
  const chunks: SQL[] = [];
  parts.forEach((part, i) => chunks.push(i % 2 === 0 ? sql.raw(part) : sql`${sql.param(values[Number(part) - 1])}`));
  return sql.join(chunks);
}

/** Our retry list (milliseconds between attempts) as pg-boss's policy: its count, first delay, and whether it grows. */
export function retryPolicyOf(delaysMs: number[]): RetryPolicy {
  return {
    retries: delaysMs.length,
    delaySeconds: Math.round((delaysMs[0] ?? 0) / 1000),
    backoff: delaysMs.length > 1 && delaysMs[1] > delaysMs[0],
  };
}

/** Tries a start-up statement again while the database cannot be reached (at most STARTUP_TRIES, a second apart). */
async function whileConnecting<T>(step: () => Promise<T>): Promise<T> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await step();
    } catch (err) {
      // A database that is slow to hand out a connection (a busy machine, PostgreSQL just restarted) is no reason
      // for the server to end at start-up; anything else is.
      if (attempt >= STARTUP_TRIES || !databaseUnavailable(err)) throw err;
      await new Promise((resolve) => setTimeout(resolve, 1000));
    }
  }
}

const STARTUP_TRIES = 10;
