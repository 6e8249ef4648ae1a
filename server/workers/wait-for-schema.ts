import { sql } from 'drizzle-orm';
import type { Logger } from 'pino';
import type { Db } from '../db/client.ts';

/** Waits (polling every 2 s, up to `timeoutMs`) until the checks table exists: the web server migrates the database. */
export async function waitForSchema(db: Db, logger: Logger, timeoutMs = 300_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  let told = false;
  for (;;) {
    const found = await db.execute(sql`select to_regclass('public.revision_checks') is not null as found`).then(
      (r) => (r.rows[0] as { found: boolean }).found,
      () => false,
    );
    if (found) return;
    if (Date.now() > deadline)
      throw new Error('The database has no revision_checks table: start the web server (npm start) once to migrate it.');
    if (!told) logger.info('waiting for the web server to migrate the database');
    told = true;
    await new Promise((resolve) => setTimeout(resolve, 2000));
  }
}
