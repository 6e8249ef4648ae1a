import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiClient, demoUser, signedInAs } from './support/api-client.ts';
import { createTestApp, tableCount, type TestApp } from './support/test-app.ts';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

/** The signed session cookie's value set by an answer. */
const sessionCookieOf = (res: request.Response) =>
  /^gapwright\.sid=([^;]*)/.exec(
    ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith('gapwright.sid=')) ?? '',
  )![1];

const sessionsOf = async (userId: number) =>
  (await t.pool.query(`select count(*)::int as n from session where sess->'passport'->>'user' = $1`, [String(userId)])).rows[0].n as number;

describe('anonymous visitors store no session', () => {
  it('50 anonymous session reads add no session row, and signing in with the token they gave still works', async () => {
    const before = await tableCount(t.db, 'session');
    const clients = Array.from({ length: 50 }, () => new ApiClient(t.app));
    for (const client of clients) {
      const res = await client.session();
      expect(res.status).toBe(200);
      expect(res.body.user).toBeNull();
      expect(client.csrfToken).toBeDefined();
    }
    expect(await tableCount(t.db, 'session')).toBe(before);
    const res = await clients[0].signIn('erin', demoUser('engineer').password);
    expect(res.status).toBe(200);
    expect(await tableCount(t.db, 'session')).toBe(before + 1);
  });

  it('a failed sign-in stores no session either', async () => {
    const before = await tableCount(t.db, 'session');
    const client = new ApiClient(t.app);
    expect((await client.signIn('erin', 'not-the-password')).status).toBe(401);
    expect(await tableCount(t.db, 'session')).toBe(before);
  });

  it('refuses a pre-sign-in token that is forged, not the cookie, or sent to a signed-in session', async () => {
    const client = new ApiClient(t.app);
    await client.session();
    const token = client.csrfToken!;
    const [issued, random] = token.split('.');
    const forged = `${issued}.${random}.${'A'.repeat(43)}`;
    const body = { username: 'erin', password: demoUser('engineer').password };
    const withForged = await client.agent
      .post('/api/auth/sign-in')
      .set('Cookie', `XSRF-TOKEN=${forged}`)
      .set('X-XSRF-TOKEN', forged)
      .send(body);
    expect(withForged.status).toBe(403);
    expect(withForged.body.error.code).toBe('csrf_failed');

    const other = new ApiClient(t.app);
    await other.session();
    // A valid token of another visitor in the header, this visitor's own in the cookie: refused.
    const mismatch = await client.agent.post('/api/auth/sign-in').set('X-XSRF-TOKEN', other.csrfToken!).send(body);
    expect(mismatch.status).toBe(403);

    // A signed-in session accepts only its own synchroniser token, never a pre-sign-in one.
    const signedIn = await signedInAs(t.app, 'engineer');
    const anonymousToken = other.csrfToken!;
    const write = await signedIn.agent
      .patch('/api/account/preferences')
      .set('Cookie', `XSRF-TOKEN=${anonymousToken}`)
      .set('X-XSRF-TOKEN', anonymousToken)
      .send({ theme: 'dark' });
    expect([401, 403]).toContain(write.status);
    const ownToken = await signedIn.patch('/api/account/preferences', { theme: 'dark' });
    expect(ownToken.status).toBe(200);
  });
});

describe('changing the password', () => {
  it('ends the user’s other sessions and keeps the current one', async () => {
    const { username, password } = demoUser('engineer');
    const here = await signedInAs(t.app, 'engineer');
    const elsewhere = await signedInAs(t.app, 'engineer');
    const someoneElse = await signedInAs(t.app, 'admin');
    const userId = (await here.get('/api/auth/session')).body.user.id as number;
    expect(await sessionsOf(userId)).toBeGreaterThanOrEqual(2);
    expect((await elsewhere.get('/api/materials')).status).toBe(200);

    const changed = await here.post('/api/account/password', { currentPassword: password, newPassword: 'a-new-long-passphrase-42' });
    expect(changed.status).toBe(204);

    expect(await sessionsOf(userId)).toBe(1);
    const replay = await elsewhere.get('/api/materials');
    expect(replay.status).toBe(401);
    expect(replay.body.error.code).toBe('unauthenticated');
    expect((await here.get('/api/materials')).status).toBe(200);
    expect((await here.patch('/api/account/preferences', { theme: 'light' })).status).toBe(200);
    expect((await someoneElse.get('/api/admin/users')).status).toBe(200);
    // The old password is gone, the new one signs in.
    expect((await new ApiClient(t.app).signIn(username, password)).status).toBe(401);
    expect((await new ApiClient(t.app).signIn(username, 'a-new-long-passphrase-42')).status).toBe(200);
  });
});

describe('the signed-in path reads the user and the data fresh on every request', () => {
  it('a user disabled or demoted in the database (by any app instance) counts at the next request', async () => {
    const admin = await signedInAs(t.app, 'admin');
    const winder = await signedInAs(t.app, 'winder');
    expect((await admin.get('/api/admin/users')).status).toBe(200);
    const { username } = demoUser('admin');
    await t.pool.query(`update users set role = 'engineer' where username = $1`, [username]);
    expect((await admin.get('/api/admin/users')).status).toBe(403);
    await t.pool.query(`update users set role = 'admin' where username = $1`, [username]);
    expect((await admin.get('/api/admin/users')).status).toBe(200);
    await t.pool.query(`update users set disabled = true where username = $1`, [demoUser('winder').username]);
    expect((await winder.get('/api/materials')).status).toBe(401);
    await t.pool.query(`update users set disabled = false where username = $1`, [demoUser('winder').username]);
  });

  it('the materials list answered from cache follows a change written straight to the table', async () => {
    const client = await signedInAs(t.app, 'reviewer'); // the engineer's password was changed above
    const first = await client.get('/api/materials');
    expect((await client.get('/api/materials')).body).toEqual(first.body);
    const { id, name } = first.body.materials[0] as { id: string; name: string };
    await t.pool.query('update materials set name = $1 where id = $2', [`${name} (renamed)`, Number(id)]);
    const after = await client.get('/api/materials');
    expect(after.body.materials.find((m: { id: string }) => m.id === id).name).toBe(`${name} (renamed)`);
    expect(after.headers['etag']).not.toBe(first.headers['etag']);
    const revalidated = await client.agent.get('/api/materials').set('If-None-Match', after.headers['etag'] as string);
    expect(revalidated.status).toBe(304);
  });

  it('a signed-in read between idle renewals (no session write) still refuses a disabled, demoted or signed-out user and a forged cookie', async () => {
    const client = new ApiClient(t.app);
    const { username, password } = demoUser('admin');
    const signIn = await client.signIn(username, password);
    const sid = sessionCookieOf(signIn);
    const withCookie = (cookie: string) => request(t.app).get('/api/admin/users').set('Cookie', `gapwright.sid=${cookie}`);
    // The first read renews the idle clock (a session write); the reads after it, within the renewal interval, write nothing.
    expect((await withCookie(sid)).status).toBe(200);
    const answer = await withCookie(sid);
    expect(answer.status).toBe(200);
    expect(answer.headers['cache-control']).toBe('no-store');
    expect(answer.headers['set-cookie']).toBeUndefined();
    // A cookie whose signature is not ours, or an id without a signature, is no session.
    const [signedId, signature] = [sid.slice(0, sid.lastIndexOf('.')), sid.slice(sid.lastIndexOf('.') + 1)];
    expect((await withCookie(`${signedId}.${signature.slice(0, -1)}${signature.endsWith('A') ? 'B' : 'A'}`)).status).toBe(401);
    expect((await withCookie(signedId)).status).toBe(401);
    await t.pool.query(`update users set role = 'engineer' where username = $1`, [username]);
    expect((await withCookie(sid)).status).toBe(403);
    await t.pool.query(`update users set role = 'admin', disabled = true where username = $1`, [username]);
    expect((await withCookie(sid)).status).toBe(401);
    await t.pool.query(`update users set disabled = false where username = $1`, [username]);
    const again = new ApiClient(t.app);
    const second = await again.signIn(username, password);
    const sid2 = sessionCookieOf(second);
    expect((await withCookie(sid2)).status).toBe(200);
    expect((await withCookie(sid2)).status).toBe(200);
    expect((await again.post('/api/auth/sign-out')).status).toBe(204);
    expect((await withCookie(sid2)).status).toBe(401);
  });

  it('the designs list answered from cache follows changes to a design, a revision and an owner’s name written straight to the tables', async () => {
    const client = await signedInAs(t.app, 'reviewer');
    const first = await client.get('/api/designs?sort=number&dir=asc');
    expect(first.status).toBe(200);
    expect((await client.get('/api/designs?sort=number&dir=asc')).body).toEqual(first.body);
    const item = first.body.items[0] as { id: number; title: string; status: string; owner: { id: number; displayName: string } };
    await t.pool.query('update designs set title = $1 where id = $2', [`${item.title} (renamed)`, item.id]);
    const renamed = (await client.get('/api/designs?sort=number&dir=asc')).body.items[0];
    expect(renamed.title).toBe(`${item.title} (renamed)`);
    await t.pool.query('update users set display_name = $1 where id = $2', ['Someone Else', item.owner.id]);
    expect((await client.get('/api/designs?sort=number&dir=asc')).body.items[0].owner.displayName).toBe('Someone Else');
    const other = item.status === 'draft' ? 'in_review' : 'draft';
    await t.pool.query(
      'update design_revisions set status = $1 where design_id = $2 and revision = (select max(revision) from design_revisions where design_id = $2)',
      [other, item.id],
    );
    expect((await client.get('/api/designs?sort=number&dir=asc')).body.items[0].status).toBe(other);
    await t.pool.query('update users set display_name = $1 where id = $2', [item.owner.displayName, item.owner.id]);
  });
});
