import { eq } from 'drizzle-orm';
import pg from 'pg';
import { pino } from 'pino';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createServices } from '../../server/app.ts';
import { createDb } from '../../server/db/client.ts';
import { capturedMail, mailDeliveries } from '../../server/db/schema.ts';
import { startFakeSmtp, type FakeSmtp } from '../../server/mail/fake-smtp.ts';
import { freePort, startServerProcess, type ServerProcess } from '../support/server-process.ts';
import { signedInAs } from './support/api-client.ts';
import { insertEvaluatedDesign } from './support/design-fixture.ts';
import { resetTestDatabase, testConfig, testDatabaseUrl, type TestApp } from './support/test-app.ts';

// A release mail still pending when the app stops is sent by the next start: the delivery lives in the job queue
// stored in PostgreSQL, not in the memory of the process that released the order.

let pool: pg.Pool;
let smtp: FakeSmtp | undefined;
let server: ServerProcess | undefined;
let smtpPort: number;

const db = () => createDb(pool);

async function until<T>(what: string, probe: () => Promise<T | undefined>): Promise<T> {
  for (let i = 0; i < 600; i++) {
    const value = await probe();
    if (value !== undefined) return value;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`gave up waiting for ${what}`);
}

async function startApp(): Promise<ServerProcess> {
  return startServerProcess(testDatabaseUrl(), {
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(smtpPort),
    MAIL_RETRY_DELAYS_MS: '1000,1000,1000,1000,1000,1000,1000,1000',
    JOBS_POLL_SECONDS: '0.5',
  });
}

async function stopApp(running: ServerProcess): Promise<number | null> {
  running.child.kill('SIGTERM');
  return running.exited;
}

beforeAll(async () => {
  await resetTestDatabase();
  pool = new pg.Pool({ connectionString: testDatabaseUrl(), max: 3 });
  smtpPort = await freePort(); // nobody listens there yet: the mail server is down
}, 60_000);

afterAll(async () => {
  if (server && server.child.exitCode === null) server.child.kill('SIGKILL');
  await smtp?.close();
  await pool.end();
});

describe('a release mail pending when the app stops', () => {
  it('is sent after a restart once the mail server is back', async () => {
    server = await startApp();
    // The fixture writes the design straight to the tables; services that are never started run no job worker.
    const config = testConfig();
    const services = createServices({
      config,
      pool,
      db: db(),
      logger: pino({ level: 'silent' }),
      mailTarget: { host: '127.0.0.1', port: smtpPort, secure: false, from: 'x@localhost' },
    });
    const { revision } = await insertEvaluatedDesign({ db: db(), services } as unknown as TestApp, 'erin');
    const author = await signedInAs(server.baseUrl, 'engineer');
    const reviewer = await signedInAs(server.baseUrl, 'reviewer');
    expect((await author.post(`/api/revisions/${revision.id}/submit`, {})).status).toBe(200);
    expect((await reviewer.post(`/api/revisions/${revision.id}/approve`, {})).status).toBe(200);
    const released = await reviewer.post(`/api/revisions/${revision.id}/release`, { quantity: 1 });
    expect(released.status).toBe(200);
    const { orderId, orderNumber } = released.body as { orderId: number; orderNumber: string };

    const delivery = () =>
      db()
        .select()
        .from(mailDeliveries)
        .where(eq(mailDeliveries.orderId, orderId))
        .then((rows) => rows[0]);
    // The first attempt fails (connection refused) and the delivery stays pending, to be retried.
    const failed = await until('a failed attempt', async () => {
      const row = await delivery();
      return row && row.attempts >= 1 ? row : undefined;
    });
    expect(failed.status).toBe('pending');
    expect(failed.lastError).toMatch(/ECONNREFUSED|connect/i);

    expect(await stopApp(server)).toBe(0);
    const stopped = await delivery();
    expect(stopped.status).toBe('pending');
    expect(await db().select().from(capturedMail)).toHaveLength(0);

    smtp = await startFakeSmtp(db(), smtpPort); // the mail server comes back while the app is down
    server = await startApp();

    const sent = await until('the delivery to be sent', async () => {
      const row = await delivery();
      return row?.status === 'sent' ? row : undefined;
    });
    expect(sent.attempts).toBeGreaterThan(failed.attempts);
    expect(sent.lastError).toBeNull();
    const mails = await db().select().from(capturedMail);
    expect(mails).toHaveLength(1);
    expect(mails[0].raw).toContain(orderNumber);
    expect(mails[0].envelopeTo).toBe('shop@harrow-lane.example');
    expect(await stopApp(server)).toBe(0);
  }, 120_000);
});
