import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Role } from '@shared/schemas/auth';
import { ApiClient, demoUser, signedInAs } from './support/api-client.ts';
import { createTestApp, tableCount, type TestApp } from './support/test-app.ts';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

/** A user an admin may create; tests change one part of it. */
const NEW_USER = { username: 'newbie', displayName: 'New', role: 'engineer', password: 'long-enough-pw' };
const createUser = (admin: ApiClient, change: Record<string, unknown>) => admin.post('/api/admin/users', { ...NEW_USER, ...change });

const ADMIN_ROUTES: { method: 'get' | 'post' | 'patch'; url: string; body?: unknown }[] = [
  { method: 'get', url: '/api/admin/users' },
  { method: 'post', url: '/api/admin/users', body: NEW_USER },
  { method: 'patch', url: '/api/admin/users/1', body: { role: 'admin' } },
  { method: 'get', url: '/api/admin/audit' },
];

describe.each<[Role | 'anonymous', number]>([
  ['anonymous', 401],
  ['engineer', 403],
  ['reviewer', 403],
  ['winder', 403],
])('admin routes as %s', (role, expected) => {
  it.each(ADMIN_ROUTES)(`$method $url is refused with ${expected} and changes nothing`, async ({ method, url, body }) => {
    const client = await signedInAs(t.app, role);
    const usersBefore = await tableCount(t.db, 'users');
    const res = await client.send(method, url, body);
    expect(res.status).toBe(expected);
    expect(res.body.error.code).toBe(expected === 401 ? 'unauthenticated' : 'forbidden');
    expect(await tableCount(t.db, 'users')).toBe(usersBefore);
    const denial = await t.pool.query("select 1 from audit_log where action = 'access.denied' and target like $1", [
      `${method.toUpperCase()} ${url}%`,
    ]);
    expect(denial.rowCount).toBeGreaterThan(0);
  });
});

describe('admin routes as admin', () => {
  it('lists the demo users without password hashes', async () => {
    const admin = await signedInAs(t.app, 'admin');
    const res = await admin.get('/api/admin/users');
    expect(res.status).toBe(200);
    expect(res.body.users.map((u: { role: Role }) => u.role).sort()).toEqual(['admin', 'engineer', 'engineer', 'reviewer', 'winder']);
    expect(JSON.stringify(res.body)).not.toMatch(/password/i);
  });

  it('creates a user who can then sign in, and refuses a taken username with 409 naming the field', async () => {
    const admin = await signedInAs(t.app, 'admin');
    const created = await createUser(admin, { username: 'nadia', displayName: 'Nadia V.', role: 'winder', password: 'a long passphrase' });
    expect(created.status).toBe(201);
    expect(created.body.user).toMatchObject({ username: 'nadia', role: 'winder' });
    expect((await new ApiClient(t.app).signIn('nadia', 'a long passphrase')).status).toBe(200);
    const duplicate = await createUser(admin, { username: 'nadia', displayName: 'Again', role: 'winder', password: 'a long passphrase' });
    expect(duplicate.status).toBe(409);
    expect(duplicate.body.error.fields).toHaveProperty('username');
  });

  it('refuses unknown fields (mass assignment) and short passwords, naming each field', async () => {
    const admin = await signedInAs(t.app, 'admin');
    const extra = await createUser(admin, { username: 'mallory', displayName: 'M', passwordHash: 'x' });
    expect(extra.status).toBe(400);
    const short = await createUser(admin, { username: 'shorty', displayName: 'S', password: 'seven77' });
    expect(short.status).toBe(400);
    expect(short.body.error.fields.password).toMatch(/8 characters/);
    const longPass = await createUser(admin, { username: 'longpass', displayName: 'L', password: 'x'.repeat(64) });
    expect(longPass.status).toBe(201);
    const badRole = await createUser(admin, { username: 'roleless', displayName: 'R', role: 'superuser' });
    expect(badRole.status).toBe(400);
    expect(badRole.body.error.fields).toHaveProperty('role');
  });

  it('disabling a user ends their sessions at once (ASVS 7.4.2) and stops them signing in', async () => {
    const winder = await signedInAs(t.app, 'winder');
    expect((await winder.get('/api/auth/session')).body.user.username).toBe('wendell');
    const admin = await signedInAs(t.app, 'admin');
    const id = (await admin.get('/api/admin/users')).body.users.find((u: { username: string }) => u.username === 'wendell').id;
    const res = await admin.patch(`/api/admin/users/${id}`, { disabled: true });
    expect(res.status).toBe(200);
    expect(res.body.user.disabled).toBe(true);
    expect((await winder.get('/api/auth/session')).body.user).toBeNull();
    expect((await new ApiClient(t.app).signIn('wendell', demoUser('winder').password)).status).toBe(401);
    await admin.patch(`/api/admin/users/${id}`, { disabled: false });
  });

  it('does not let an admin disable their own account', async () => {
    const admin = await signedInAs(t.app, 'admin');
    const me = (await admin.get('/api/auth/session')).body.user;
    const res = await admin.patch(`/api/admin/users/${me.id}`, { disabled: true });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('disabled');
  });

  it('says on each listed account whether this admin may disable it or change its role: not their own', async () => {
    const admin = await signedInAs(t.app, 'admin');
    const me = (await admin.get('/api/auth/session')).body.user;
    const { users } = (await admin.get('/api/admin/users')).body as {
      users: { id: number; canDisable: boolean; canChangeRole: boolean }[];
    };
    const own = users.find((user) => user.id === me.id);
    expect(own).toMatchObject({ canDisable: false, canChangeRole: false });
    const others = users.filter((user) => user.id !== me.id);
    expect(others.length).toBeGreaterThan(0);
    for (const other of others) expect(other).toMatchObject({ canDisable: true, canChangeRole: true });
    const renamed = await admin.patch(`/api/admin/users/${me.id}`, { displayName: 'Site Admin' });
    expect(renamed.body.user).toMatchObject({ canDisable: false, canChangeRole: false });
  });

  it('pages the audit log', async () => {
    const admin = await signedInAs(t.app, 'admin');
    const res = await admin.get('/api/admin/audit?offset=0&limit=5');
    expect(res.status).toBe(200);
    expect(res.body.entries).toHaveLength(5);
    expect(res.body.total).toBeGreaterThan(5);
    const bad = await admin.get('/api/admin/audit?limit=9999');
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty('limit');
  });
});

describe('my account', () => {
  it('changes the own password: wrong current and too-short new are refused by field', async () => {
    const client = await signedInAs(t.app, 'reviewer');
    const wrong = await client.post('/api/account/password', { currentPassword: 'nope', newPassword: 'brand-new-pass' });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields).toHaveProperty('currentPassword');
    const short = await client.post('/api/account/password', { currentPassword: demoUser('reviewer').password, newPassword: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.error.fields).toHaveProperty('newPassword');
    const ok = await client.post('/api/account/password', {
      currentPassword: demoUser('reviewer').password,
      newPassword: 'brand-new-pass',
    });
    expect(ok.status).toBe(204);
    expect((await new ApiClient(t.app).signIn('ruth', 'brand-new-pass')).status).toBe(200);
  });

  it('remembers the theme per user and refuses a role sent along (mass assignment)', async () => {
    const client = await signedInAs(t.app, 'engineer');
    const res = await client.patch('/api/account/preferences', { theme: 'dark' });
    expect(res.status).toBe(200);
    expect(res.body.user.theme).toBe('dark');
    expect((await client.get('/api/auth/session')).body.user.theme).toBe('dark');
    const sneaky = await client.patch('/api/account/preferences', { theme: 'light', role: 'admin' });
    expect(sneaky.status).toBe(400);
    expect((await client.get('/api/auth/session')).body.user.role).toBe('engineer');
  });

  it('refuses account routes to anonymous visitors with 401', async () => {
    const anon = await signedInAs(t.app, 'anonymous');
    expect((await anon.post('/api/account/password', { currentPassword: 'a', newPassword: 'bbbbbbbbb' })).status).toBe(401);
  });
});
