// `npm run worker`: a check worker process. It needs only DATABASE_URL (the same database as the web server, from
// this machine or another) and works the revision checks the web server queues; ngspice must be installed.
import { createDb } from '../db/client.ts';
import { createPool } from '../db/pool.ts';
import { loadWorkerConfig } from '../config.ts';
import { createLogger } from '../logger.ts';
import { startCheckWorker } from './check-worker-loop.ts';
import { waitForSchema } from './wait-for-schema.ts';

const SHUTDOWN_GRACE_MS = 15_000;

const config = loadWorkerConfig();
const logger = createLogger(config.logLevel);
const pool = createPool(config.databaseUrl, config.dbConnectTimeoutMs, logger);
const db = createDb(pool);
// The web server applies the migrations; a worker started first waits for them rather than racing it.
await waitForSchema(db, logger);
const worker = await startCheckWorker({ pool, db, jobs: config.jobs, logger });
logger.info({ pid: process.pid }, 'check worker is waiting for jobs');

function shutdown(signal: string): void {
  logger.info(`${signal} received: finishing the check in hand, then stopping`);
  const force = setTimeout(() => process.exit(1), SHUTDOWN_GRACE_MS);
  force.unref();
  worker
    .stop()
    .then(() => pool.end())
    .then(
      () => process.exit(0),
      (err: unknown) => {
        logger.error({ err }, 'check worker did not stop cleanly');
        process.exit(1);
      },
    );
}
process.once('SIGTERM', () => shutdown('SIGTERM'));
process.once('SIGINT', () => shutdown('SIGINT'));
