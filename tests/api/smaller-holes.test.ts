import { eq, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { materials } from '../../server/db/schema.ts';
import { insertEvaluatedDesign } from './support/design-fixture.ts';
import { ApiClient, demoUser, signedInAs } from './support/api-client.ts';
import { createTestApp, tableCount, type TestApp } from './support/test-app.ts';
import { createAppCapturingLogs } from './support/log-capture.ts';

let t: TestApp;
let erin: ApiClient; // engineer
let wendell: ApiClient; // winder

beforeAll(async () => {
  t = await createTestApp();
  [erin, wendell] = await Promise.all([signedInAs(t.app, 'engineer'), signedInAs(t.app, 'winder')]);
});
afterAll(() => t.close());

const materialNamed = async (id: number) => (await t.db.select().from(materials).where(eq(materials.id, id)))[0];

describe('logs name the SQL but never the values bound to it', () => {
  it('a failed query is logged with its statement and without its parameters', async () => {
    const { app, db, services, logText, close } = createAppCapturingLogs(); // on the database createTestApp seeded
    const secret = '$2b$12$abcdefghijklmnopqrstuv0123456789ABCDEFGHIJKLMNOPQRSTU';
    services.users.list = async () => {
      await db.execute(sql`insert into no_such_table (password_hash) values (${secret})`);
      return [];
    };
    try {
      const admin = new ApiClient(app);
      await admin.signIn(demoUser('admin').username, demoUser('admin').password);
      expect((await admin.get('/api/admin/users')).status).toBe(500);
      const text = logText();
      expect(text).toContain('no_such_table');
      expect(text).not.toContain(secret);
      expect(text).not.toContain('abcdefghijklmnopqrstuv');
    } finally {
      await close();
    }
  });
});

describe('signed-in answers are not cached', () => {
  let orderId = 0;
  beforeAll(async () => {
    const ruth = await signedInAs(t.app, 'reviewer');
    const { revision } = await insertEvaluatedDesign(t, 'erin');
    expect((await erin.post(`/api/revisions/${revision.id}/submit`, {})).status).toBe(200);
    expect((await ruth.post(`/api/revisions/${revision.id}/approve`, {})).status).toBe(200);
    orderId = (await ruth.post(`/api/revisions/${revision.id}/release`, { quantity: 1 })).body.orderId;
  });

  it.each([
    ['JSON', () => erin.get('/api/designs'), 'application/json'],
    ['CSV', () => erin.get('/api/materials/export.csv'), 'text/csv'],
    ['PDF', () => wendell.get(`/api/shop/orders/${orderId}/sheet.pdf`), 'application/pdf'],
  ])('%s answers carry Cache-Control: no-store', async (_kind, get, type) => {
    const res = await get();
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toContain(type);
    expect(res.headers['cache-control']).toBe('no-store');
  });
});

describe('a write after the session ended', () => {
  it('is a 401 (sign in again), not a 403 from the CSRF check', async () => {
    const client = await signedInAs(t.app, 'engineer');
    expect((await client.post('/api/auth/sign-out')).status).toBe(204);
    const res = await client.post('/api/designs', {
      title: 'After sign-out',
      spec: { vinMin: 24, vinMax: 36, vout: 12, ioutMax: 10, frequency: 100e3, rippleRatio: 0.3 },
    });
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthenticated');
  });

  it('is a 401 when the session expired in the store', async () => {
    const client = await signedInAs(t.app, 'engineer');
    await t.db.execute(sql`delete from session where (sess->'passport'->>'user') = (select id::text from users where username = 'erin')`);
    const res = await client.patch('/api/account/preferences', { theme: 'dark' });
    expect(res.status).toBe(401);
    // Sign-in itself still runs its own checks: without a token it is still the CSRF refusal.
    expect(
      (await new ApiClient(t.app).send('post', '/api/auth/sign-in', { username: 'erin', password: 'x' }, { csrf: false })).status,
    ).toBe(403);
    erin = await signedInAs(t.app, 'engineer');
  });
});

describe('material edits', () => {
  it('an empty PATCH is a 400 and makes no new version', async () => {
    const versions = await tableCount(t.db, 'materials');
    const res = await erin.patch('/api/materials/1', {});
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/at least one column/);
    expect(await tableCount(t.db, 'materials')).toBe(versions);
  });

  it('a PATCH that changes nothing is a 400 and makes no new version', async () => {
    const versions = await tableCount(t.db, 'materials');
    const current = await materialNamed(1);
    const res = await erin.patch('/api/materials/1', { name: current.name });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/changes nothing/);
    expect(await tableCount(t.db, 'materials')).toBe(versions);
  });
});

describe('names that only look different are the same name', () => {
  const taken = 'Demo ferrite Amber (illustrative)';
  it.each([
    ['a Cyrillic look-alike letter', 'Demo ferrite \u0410mber (illustrative)'],
    ['a Greek look-alike letter', 'Demo ferrite \u0391mber (illustrative)'],
    ['a non-breaking space', 'Demo\u00a0ferrite Amber (illustrative)'],
    ['a zero-width space', 'Demo ferrite Am\u200bber (illustrative)'],
    ['full-width letters', 'Demo ferrite \uff21\uff4d\uff42\uff45\uff52 (illustrative)'],
  ])('renaming a material to the name of another with %s → 409 naming the clash', async (_how, name) => {
    expect((await materialNamed(1)).name).toBe(taken);
    const versions = await tableCount(t.db, 'materials');
    const res = await erin.patch('/api/materials/2', { name });
    expect(res.status).toBe(409);
    expect(res.body.error.fields.name).toContain(taken);
    expect(await tableCount(t.db, 'materials')).toBe(versions);
  });

  it('a user core named like an existing one with a look-alike letter → 409', async () => {
    const ring = {
      kind: 'ring',
      name: 'Lab ring A',
      family: 'POWDER_TOROID',
      outerDiameter: 25e-3,
      innerDiameter: 15e-3,
      height: 10e-3,
      source: 'our own sample',
    };
    expect((await erin.post('/api/catalogue/cores', ring)).status).toBe(201);
    const res = await erin.post('/api/catalogue/cores', { ...ring, name: 'Lab ring \u0410' }); // Cyrillic А
    expect(res.status).toBe(409);
    expect(res.body.error.fields.name).toContain('Lab ring A');
  });
});

describe('sign-in throttling per account as well as per address', () => {
  let limited: TestApp;
  beforeAll(async () => {
    limited = await createTestApp({ SIGN_IN_LIMIT: '3' });
  });
  afterAll(() => limited.close());

  it('failures for one account from a shared address do not lock out other accounts there', async () => {
    const attacker = new ApiClient(limited.app);
    for (let i = 0; i < 3; i++) expect((await attacker.signIn('erin', `wrong-${i}`)).status).toBe(401);
    expect((await attacker.signIn('erin', 'wrong-again')).status).toBe(429);
    // Same address (every supertest client comes from 127.0.0.1), another account: still signs in.
    const colleague = new ApiClient(limited.app);
    expect((await colleague.signIn(demoUser('reviewer').username, demoUser('reviewer').password)).status).toBe(200);
  });

  it('an account is throttled on its name however it is spelled (case, spaces)', async () => {
    const client = new ApiClient(limited.app);
    const spellings = ['tomas', 'TOMAS', ' tomas ', 'Tomas'];
    for (const name of spellings.slice(0, 3)) expect((await client.signIn(name, 'wrong')).status).toBe(401);
    expect((await client.signIn(spellings[3], 'wrong')).status).toBe(429);
  });
});
