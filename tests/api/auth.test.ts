import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { ApiClient, demoUser, signedInAs } from './support/api-client.ts';
import { createTestApp, type TestApp } from './support/test-app.ts';

function cookieNamed(res: { headers: Record<string, unknown> }, name: string): string | undefined {
  return ([] as string[]).concat((res.headers['set-cookie'] as string[] | undefined) ?? []).find((c) => c.startsWith(`${name}=`));
}
const sidOf = (cookie: string | undefined) => cookie?.split(';')[0];

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

describe('sign-in', () => {
  it('signs in a demo engineer and returns the public user view without the password hash', async () => {
    const client = new ApiClient(t.app);
    const { username, password } = demoUser('engineer');
    const res = await client.signIn(username, password);
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ username, role: 'engineer', disabled: false });
    expect(JSON.stringify(res.body)).not.toMatch(/passwordHash|\$2[aby]\$/);
  });

  it('refuses a wrong password with 401 in the one error shape and records the failure in the audit log', async () => {
    const client = new ApiClient(t.app);
    const res = await client.signIn('erin', 'not-the-password');
    expect(res.status).toBe(401);
    expect(res.body).toEqual({ error: { code: 'invalid_credentials', message: expect.any(String) } });
    const admin = await signedInAs(t.app, 'admin');
    const audit = await admin.get('/api/admin/audit?limit=50');
    expect(
      audit.body.entries.some((e: { action: string; target: string }) => e.action === 'auth.sign_in_failed' && e.target === 'user:erin'),
    ).toBe(true);
  });

  it('stores passwords as bcrypt hashes with cost 12 (ASVS 11.4.2)', async () => {
    const result = await t.pool.query<{ password_hash: string }>("select password_hash from users where username = 'erin'");
    const hash = result.rows[0].password_hash;
    expect(hash).toMatch(/^\$2[ab]\$12\$/);
    expect(hash).not.toContain(demoUser('engineer').password);
  });

  it('issues HttpOnly, SameSite=Lax session cookies without Secure over plain HTTP', async () => {
    const client = new ApiClient(t.app);
    await client.session();
    const res = await client.signIn('erin', demoUser('engineer').password);
    const cookie = cookieNamed(res, 'gapwright.sid');
    expect(cookie).toBeDefined();
    expect(cookie).toMatch(/HttpOnly/);
    expect(cookie).toMatch(/SameSite=Lax/);
    expect(cookie).not.toMatch(/Secure/);
  });

  it('issues a new session id at sign-in (session fixation, ASVS 7.2.4)', async () => {
    // An anonymous visitor has no stored session, so the session to replace is that of an earlier sign-in.
    const client = new ApiClient(t.app);
    const before = sidOf(cookieNamed(await client.signIn('erin', demoUser('engineer').password), 'gapwright.sid'));
    const after = sidOf(cookieNamed(await client.signIn('erin', demoUser('engineer').password), 'gapwright.sid'));
    expect(before).toBeDefined();
    expect(after).toBeDefined();
    expect(after).not.toBe(before);
  });

  it('ends the server-side session at sign-out: the old cookie is refused afterwards (ASVS 7.4.1)', async () => {
    const client = await signedInAs(t.app, 'admin');
    const signedIn = await client.signIn('ada', demoUser('admin').password);
    const oldCookie = sidOf(cookieNamed(signedIn, 'gapwright.sid'))!;
    expect((await client.get('/api/admin/users')).status).toBe(200);
    expect((await client.post('/api/auth/sign-out')).status).toBe(204);
    const replay = await new ApiClient(t.app).agent.get('/api/admin/users').set('Cookie', oldCookie);
    expect(replay.status).toBe(401);
    expect(replay.body.error.code).toBe('unauthenticated');
  });

  it('refuses a write without the CSRF token with 403 (ASVS 3.5.1)', async () => {
    const client = new ApiClient(t.app);
    await client.session();
    const res = await client.send('post', '/api/auth/sign-in', { username: 'erin', password: 'x' }, { csrf: false });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('csrf_failed');
    const signedIn = await signedInAs(t.app, 'engineer');
    const write = await signedIn.send('patch', '/api/account/preferences', { theme: 'dark' }, { csrf: false });
    expect(write.status).toBe(403);
  });

  it('answers malformed JSON with 400 in the error shape and no stack trace', async () => {
    const client = new ApiClient(t.app);
    await client.session();
    const res = await client.agent
      .post('/api/auth/sign-in')
      .set('X-XSRF-TOKEN', client.csrfToken!)
      .set('Content-Type', 'application/json')
      .send('{"username": "erin", ');
    expect(res.status).toBe(400);
    expect(res.body).toEqual({ error: { code: 'malformed_json', message: expect.any(String) } });
    expect(res.text).not.toMatch(/\bat .+\.(ts|js):\d+/);
  });

  it('names the missing field when the sign-in body is incomplete', async () => {
    const client = new ApiClient(t.app);
    const res = await client.signIn('erin', '');
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('password');
  });

  it('gives a JSON 404 in the error shape for unknown API routes', async () => {
    const res = await new ApiClient(t.app).get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });

  it('reports app and database status on /api/health', async () => {
    const res = await new ApiClient(t.app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'ok', database: 'up' });
  });
});

describe('sign-in rate limit', () => {
  let limited: TestApp;
  beforeAll(async () => {
    limited = await createTestApp({ SIGN_IN_LIMIT: '3' });
  });
  afterAll(() => limited.close());

  it('returns 429 after the allowed number of failed attempts, and a spoofed X-Forwarded-For does not reset it', async () => {
    const client = new ApiClient(limited.app);
    for (let i = 0; i < 3; i++) expect((await client.signIn('erin', `wrong-${i}`)).status).toBe(401);
    const blocked = await client.signIn('erin', 'wrong-again');
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.code).toBe('rate_limited');
    const spoofed = await client.agent
      .post('/api/auth/sign-in')
      .set('X-XSRF-TOKEN', client.csrfToken!)
      .set('X-Forwarded-For', '203.0.113.7')
      .send({ username: 'erin', password: demoUser('engineer').password });
    expect(spoofed.status).toBe(429);
  });
});

describe('cookies over HTTPS', () => {
  let secure: TestApp;
  beforeAll(async () => {
    secure = await createTestApp({ COOKIE_SECURE: 'true', TRUST_PROXY: '1' });
  });
  afterAll(() => secure.close());

  it('uses a Secure __Host- session cookie and sends HSTS (ASVS 3.3.1, 3.4.1)', async () => {
    const client = new ApiClient(secure.app);
    const session = await client.agent.get('/api/auth/session').set('X-Forwarded-Proto', 'https');
    client.csrfToken = /XSRF-TOKEN=([^;]*)/.exec(String(session.headers['set-cookie']))?.[1];
    // The cookie jar will not send a Secure cookie over plain HTTP, so pass it on as a browser on HTTPS would.
    expect(cookieNamed(session, 'XSRF-TOKEN')).toMatch(/; Secure/);
    const res = await client.agent
      .post('/api/auth/sign-in')
      .set('X-Forwarded-Proto', 'https')
      .set('Cookie', `XSRF-TOKEN=${client.csrfToken!}`)
      .set('X-XSRF-TOKEN', client.csrfToken!)
      .send({ username: 'erin', password: demoUser('engineer').password });
    expect(res.status).toBe(200);
    const cookie = cookieNamed(res, '__Host-gapwright.sid');
    expect(cookie).toMatch(/; Secure/);
    expect(cookie).toMatch(/HttpOnly/);
    expect(cookie).toMatch(/Path=\//);
    expect(cookie).not.toMatch(/Domain=/);
    expect(res.headers['strict-transport-security']).toMatch(/max-age=31536000/);
  });
});

describe('session lifetime', () => {
  afterEach(() => {
    vi.useRealTimers();
  });

  it('ends an idle session after the idle timeout (ASVS 7.3.1)', async () => {
    const client = await signedInAs(t.app, 'admin');
    vi.useFakeTimers({ toFake: ['Date'], now: Date.now() + (t.config.sessionIdleMs + 60_000) });
    expect((await client.get('/api/admin/users')).status).toBe(401);
  });

  it('keeps a session alive while it is used: the idle clock is renewed without a store write on every request', async () => {
    const client = await signedInAs(t.app, 'admin');
    const start = Date.now();
    // Two requests 0.6 of the idle time apart, then another 0.6 later: 1.2 idle times after sign-in, still signed in.
    vi.useFakeTimers({ toFake: ['Date'], now: start + 0.6 * t.config.sessionIdleMs });
    expect((await client.get('/api/admin/users')).status).toBe(200);
    vi.setSystemTime(start + 1.2 * t.config.sessionIdleMs);
    expect((await client.get('/api/admin/users')).status).toBe(200);
    // …and idle for a whole idle time after that last request, it ends.
    vi.setSystemTime(start + 2.3 * t.config.sessionIdleMs);
    expect((await client.get('/api/admin/users')).status).toBe(401);
  });

  it('ends an active session after its absolute lifetime (ASVS 7.3.2)', async () => {
    const longIdle = await createTestApp({ SESSION_IDLE_MINUTES: '100000', SESSION_ABSOLUTE_HOURS: '12' });
    try {
      const client = await signedInAs(longIdle.app, 'admin');
      vi.useFakeTimers({ toFake: ['Date'], now: Date.now() + 11 * 3_600_000 });
      expect((await client.get('/api/admin/users')).status).toBe(200);
      vi.setSystemTime(Date.now() + 2 * 3_600_000);
      expect((await client.get('/api/admin/users')).status).toBe(401);
    } finally {
      vi.useRealTimers();
      await longIdle.close();
    }
  });
});
