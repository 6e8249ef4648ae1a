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
  // The pool listens to its clients only while they are idle (and `pool.query` while it runs), so a client
  // checked out for a transaction or the session store had none: PostgreSQL going away under it emitted an
  // unhandled 'error' and ended the process. Every client gets a listener of its own for its whole life. pg
  // has already marked the client unqueryable by then, so the query in hand fails (the request answers 503)
  // and the pool discards the client when it is released instead of lending it out again.
  pool.on('connect', (client) => {
    client.on('error', (err) => logger.warn({ err: err.message, code: (err as { code?: string }).code }, 'database connection lost'));
  });
  return pool;
}
