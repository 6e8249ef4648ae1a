import type pg from 'pg';
import type { Logger } from 'pino';
import { CatalogueService } from '../catalogue/catalogue.service.ts';
import { coreById } from '../catalogue/user-cores.service.ts';
import { UserCoresRepository } from '../catalogue/user-cores.repository.ts';
import { CHECK_JOB, CHECK_LIMITS, CHECK_RETRY, type CheckJobData } from '../checks/check-jobs.ts';
import { createCheckHandler, type CheckHandlerDeps } from '../checks/check-job.ts';
import { ChecksRepository } from '../checks/checks.repository.ts';
import type { Db } from '../db/client.ts';
import { JobQueue } from '../jobs/job-queue.ts';
import { MaterialsRepository } from '../materials/materials.repository.ts';

export interface CheckWorkerOptions {
  pool: pg.Pool;
  db: Db;
  jobs: { schema: string; pollSeconds: number };
  logger: Logger;
  /** Replaces the circuit check (tests: fail an attempt as a killed worker would). */
  circuit?: CheckHandlerDeps['circuit'];
  /** Replaces the field check (tests: a stand-in that answers at once). */
  field?: CheckHandlerDeps['field'];
}

export interface CheckWorker {
  stop: () => Promise<void>;
}

/**
 * Works check jobs on a queue of its own (same database, same pg-boss schema as the web server, which only sends
 * them). The worker process runs this; an API test can run it in-process against its test database.
 */
export async function startCheckWorker(options: CheckWorkerOptions): Promise<CheckWorker> {
  const { pool, db, jobs, logger } = options;
  const queue = new JobQueue({ pool, schema: jobs.schema, pollSeconds: jobs.pollSeconds, logger });
  const catalogue = new CatalogueService();
  const userCores = new UserCoresRepository(db);
  const handler = createCheckHandler({
    repo: new ChecksRepository(db),
    materials: new MaterialsRepository(db),
    // Shipped cores and the user cores in the same database, as the web server reads them.
    cores: { core: (id) => coreById(catalogue, userCores, id), wire: (choice) => catalogue.wire(choice) },
    logger,
    circuit: options.circuit,
    field: options.field,
  });
  queue.define<CheckJobData>(CHECK_JOB, CHECK_RETRY, handler, CHECK_LIMITS);
  await queue.start();
  return { stop: () => queue.stop() };
}
