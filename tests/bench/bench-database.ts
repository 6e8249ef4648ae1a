import { eq } from 'drizzle-orm';
import pg from 'pg';
import { loadConfig } from '../../server/config.ts';
import { createDb, type Db } from '../../server/db/client.ts';
import { users } from '../../server/db/schema.ts';
import type { Actor } from '../../server/http/access.ts';
import { ensureCluster, ensureDatabase } from '../../server/ops/postgres.ts';
import { resetDatabase } from '../api/support/test-app.ts';

/**
 * A freshly reset and seeded database of the bench's own (`name` in the own cluster, or BENCH_DATABASE_URL when set)
 * with the demo engineer as the actor; the pool is ended after `run`.
 */
export async function withBenchDatabase<T>(name: string, run: (db: Db, engineer: Actor) => Promise<T>): Promise<T> {
  let url = process.env['BENCH_DATABASE_URL'];
  if (!url) {
    const cluster = ensureCluster();
    ensureDatabase(name);
    url = cluster.urlFor(name);
  }
  const config = loadConfig({
    NODE_ENV: 'test',
    DATABASE_URL: url,
    SESSION_SECRET: 'bench-session-secret-that-is-long-enough-0123456789',
    LOG_LEVEL: 'silent',
  });
  const pool = new pg.Pool({ connectionString: config.databaseUrl, max: 4 });
  try {
    const db = createDb(pool);
    await resetDatabase(db, config);
    const [engineer] = await db.select().from(users).where(eq(users.role, 'engineer')).limit(1);
    return await run(db, { id: engineer!.id, username: engineer!.username, displayName: engineer!.displayName, role: engineer!.role });
  } finally {
    await pool.end();
  }
}
