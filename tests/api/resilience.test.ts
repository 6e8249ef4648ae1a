import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { materials } from '../../server/db/schema.ts';
import { DEMO_USERS } from '../../server/seed/demo-scenario.ts';
import { ApiClient, signedInAs } from './support/api-client.ts';
import { createTestApp, resetDatabase, tableCount, type TestApp } from './support/test-app.ts';
import { createAppCapturingLogs } from './support/log-capture.ts';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

describe('failing transactions', () => {
  it('leave the pool usable: 100 transactions broken by a constraint, then a normal request succeeds', async () => {
    const [existing] = await t.db.select().from(materials).limit(1);
    const before = await tableCount(t.db, 'materials');
    const { id: _id, createdAt: _c, ...copy } = existing;
    for (let i = 0; i < 100; i++) {
      await expect(
        t.db.transaction(async (tx) => {
          await tx.insert(materials).values({ ...copy, lineage: `probe-${i}`, name: `Probe ${i}`, current: false });
          // Same lineage and version as an existing row: the unique index refuses it and the whole transaction rolls back.
          await tx.insert(materials).values({ ...copy, current: false });
        }),
      ).rejects.toThrow();
    }
    expect(await tableCount(t.db, 'materials')).toBe(before);
    expect(t.pool.waitingCount).toBe(0);
    const engineer = await signedInAs(t.app, 'engineer');
    expect((await engineer.get('/api/materials')).status).toBe(200);
  });
});

describe('security headers', () => {
  it('sends a strict CSP without inline scripts, nosniff, no-referrer and frame-ancestors (ASVS 3.4)', async () => {
    const res = await new ApiClient(t.app).get('/api/health');
    const csp = String(res.headers['content-security-policy']);
    const scriptSrc = /script-src ([^;]*)/.exec(csp)?.[1] ?? '';
    expect(scriptSrc).toBe("'self'");
    expect(csp).not.toMatch(/script-src[^;]*unsafe-inline/);
    expect(csp).toMatch(/frame-ancestors 'none'/);
    expect(csp).toMatch(/object-src 'none'/);
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['referrer-policy']).toBe('no-referrer');
    expect(res.headers['x-powered-by']).toBeUndefined();
    // HSTS only when the site is served over HTTPS (see the cookies-over-HTTPS test in auth.test.ts).
    expect(res.headers['strict-transport-security']).toBeUndefined();
  });
});

describe('logs', () => {
  it('never contain a password, the session secret or a session cookie', async () => {
    const { app, db, config, logText, close } = createAppCapturingLogs();
    await resetDatabase(db, config);
    try {
      for (const user of DEMO_USERS) {
        const client = new ApiClient(app);
        await client.signIn(user.username, user.password);
        await client.signIn(user.username, `${user.password}-wrong`);
        await client.post('/api/account/password', { currentPassword: user.password, newPassword: `${user.password}-new` });
        await client.get('/api/no-such-route');
      }
      const text = logText();
      expect(text.length).toBeGreaterThan(1000); // the requests really were logged
      for (const user of DEMO_USERS) expect(text).not.toContain(user.password);
      expect(text).not.toContain(config.sessionSecret);
      expect(text).not.toMatch(/gapwright\.sid=/);
      expect(text).not.toMatch(/XSRF-TOKEN=/);
    } finally {
      await close();
    }
    // Four accounts × three bcrypt operations plus a database reset: slow on a loaded 2-core machine.
  }, 60_000);
});
