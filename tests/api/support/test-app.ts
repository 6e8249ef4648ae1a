import { sql } from 'drizzle-orm';
import type { Express } from 'express';
import pg from 'pg';
import { pino } from 'pino';
import { createApp, type Services } from '../../../server/app.ts';
import { loadConfig, type Config } from '../../../server/config.ts';
import { createDb, type Db } from '../../../server/db/client.ts';
import { applyMigrations } from '../../../server/db/migrate.ts';
import { seedDemoOnce } from '../../../server/seed/seed-demo.ts';
import { startFakeSmtp } from '../../../server/mail/fake-smtp.ts';

export interface TestApp {
  app: Express;
  services: Services;
  db: Db;
  pool: pg.Pool;
  config: Config;
  close: () => Promise<void>;
}

export function testDatabaseUrl(): string {
  const url = process.env['TEST_DATABASE_URL'];
  if (!url) throw new Error('TEST_DATABASE_URL is not set: run the API tests through "npm test" (tests/run.ts).');
  return url;
}

export function testConfig(overrides: Record<string, string> = {}): Config {
  return loadConfig({
    NODE_ENV: 'test',
    DATABASE_URL: testDatabaseUrl(),
    SESSION_SECRET: 'test-session-secret-that-is-long-enough-0123456789',
    LOG_LEVEL: 'silent',
    STATIC_DIR: 'dist/gapwright/browser',
    JOBS_POLL_SECONDS: '0.5',
    ...overrides,
  });
}

/** Every table emptied and the demo scenario seeded again: each test file starts from the same state. */
export async function resetDatabase(db: Db, config: Config): Promise<void> {
  await applyMigrations(db);
  await db.execute(
    sql`truncate table audit_log, session, app_settings, captured_mail, mail_deliveries, build_units, build_orders, revision_transitions, design_revisions, designs, user_cores, material_imports, materials, users restart identity cascade`,
  );
  await clearJobs(db, config.jobs.schema);
  await seedDemoOnce(db, config.bcryptCost);
}

/** The job queue's stored jobs go with the rows they belong to (its tables exist once a queue has started). */
async function clearJobs(db: Db, schema: string): Promise<void> {
  const exists = await db.execute(sql`select to_regclass(${`${schema}.job`}) is not null as found`);
  if ((exists.rows[0] as { found: boolean }).found) {
    await db.execute(sql`truncate table ${sql.identifier(schema)}.job, ${sql.identifier(schema)}.archive`);
  }
}

/** Resets the suite's database on a short-lived pool, for tests whose server runs elsewhere (own process, harness). */
export async function resetTestDatabase(config: Config = testConfig()): Promise<void> {
  const pool = new pg.Pool({ connectionString: config.databaseUrl, max: 2 });
  try {
    await resetDatabase(createDb(pool), config);
  } finally {
    await pool.end();
  }
}

export async function createTestApp(overrides: Record<string, string> = {}): Promise<TestApp> {
  const config = testConfig(overrides);
  const pool = new pg.Pool({ connectionString: config.databaseUrl, max: 5, connectionTimeoutMillis: 3000 });
  pool.on('error', () => {});
  const db = createDb(pool);
  await resetDatabase(db, config);
  // A relay named in the overrides (e.g. one that is down) is used as given; otherwise a fake SMTP of its own.
  const smtp = config.smtp.host ? undefined : await startFakeSmtp(db, 0);
  const mailTarget = {
    host: config.smtp.host ?? '127.0.0.1',
    port: smtp?.port ?? config.smtp.port,
    secure: false,
    from: 'Gapwright tests <gapwright@localhost>',
  };
  const { app, start, close, services } = createApp({ config, pool, db, logger: pino({ level: 'silent' }), mailTarget });
  await start();
  return {
    app,
    db,
    pool,
    config,
    services,
    close: async () => {
      await close();
      await smtp?.close();
      await pool.end();
    },
  };
}

export async function tableCount(db: Db, table: string): Promise<number> {
  const result = await db.execute(sql`select count(*)::int as n from ${sql.identifier(table)}`);
  return (result.rows[0] as { n: number }).n;
}
