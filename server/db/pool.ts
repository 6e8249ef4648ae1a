import pg from 'pg';
import type { Logger } from 'pino';

// One pool for Drizzle and the session store. A connection timeout turns an unreachable
// database into a fast error instead of a hung request (pg's default waits forever).
export function createPool(databaseUrl: string, connectTimeoutMs: number, logger: Logger): pg.Pool {
  const pool = new pg.Pool({
    connectionString: databaseUrl,
    max: 10,
    connectionTimeoutMillis: connectTimeoutMs,
    idleTimeoutMillis: 30_000,
  });
  // Without a listener an idle client's error (e.g. the server restarting) crashes the process.
  pool.on('error', (err) => logger.warn({ err: err.message }, 'idle database client error'));
  return pool;
}
