import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signedInAs, type ApiClient } from './support/api-client.ts';
import { createTestApp, type TestApp } from './support/test-app.ts';

let t: TestApp;
let engineer: ApiClient;
let admin: ApiClient;
let winder: ApiClient;
let anonymous: ApiClient;

beforeAll(async () => {
  t = await createTestApp();
  [engineer, admin, winder, anonymous] = await Promise.all(
    (['engineer', 'admin', 'winder', 'anonymous'] as const).map((role) => signedInAs(t.app, role)),
  );
});
afterAll(() => t.close());

/** Row counts of every table except the ones requests legitimately touch (sessions, the audit log). */
async function rowCounts(): Promise<Record<string, number>> {
  const { rows } = await t.db.execute<{ table_name: string }>(
    sql`select table_name from information_schema.tables where table_schema = 'public' and table_type = 'BASE TABLE' and table_name not in ('session', 'audit_log')`,
  );
  const counts: Record<string, number> = {};
  for (const { table_name } of rows) {
    const r = await t.db.execute<{ n: number }>(sql`select count(*)::int as n from ${sql.identifier(table_name)}`);
    counts[table_name] = r.rows[0].n;
  }
  return counts;
}

const SPEC = { vinMin: 24, vinMax: 36, vout: 12, ioutMax: 10, frequency: 100e3, rippleRatio: 0.3 };
const nested = (depth: number) => '['.repeat(depth) + ']'.repeat(depth);

type Who = 'engineer' | 'admin' | 'winder' | 'anonymous';
interface HostileCase {
  name: string;
  who: Who;
  method: 'get' | 'post' | 'patch' | 'put';
  url: string;
  body?: unknown;
  raw?: { type: string; data: string | Buffer };
  status: number | number[];
  /** A field the error must name, when the input has one. */
  field?: string;
}

const CASES: HostileCase[] = [
  {
    name: 'string where a number belongs',
    who: 'engineer',
    method: 'post',
    url: '/api/calc/operating-point',
    body: { ...SPEC, frequency: '100k' },
    status: 400,
    field: 'frequency',
  },
  {
    name: 'NaN spelled as a string',
    who: 'engineer',
    method: 'post',
    url: '/api/calc/operating-point',
    body: { ...SPEC, vout: 'NaN' },
    status: 400,
    field: 'vout',
  },
  {
    name: 'Infinity through an overflowing literal',
    who: 'engineer',
    method: 'post',
    url: '/api/calc/operating-point',
    raw: { type: 'application/json', data: JSON.stringify(SPEC).replace('"ioutMax":10', '"ioutMax":1e999') },
    status: 400,
    field: 'ioutMax',
  },
  {
    name: 'huge number',
    who: 'engineer',
    method: 'post',
    url: '/api/calc/operating-point',
    body: { ...SPEC, ioutMax: 1e300 },
    status: 400,
    field: 'ioutMax',
  },
  {
    name: 'negative frequency',
    who: 'engineer',
    method: 'post',
    url: '/api/calc/operating-point',
    body: { ...SPEC, frequency: -250e3 },
    status: 400,
    field: 'frequency',
  },
  {
    name: 'zero frequency',
    who: 'engineer',
    method: 'post',
    url: '/api/calc/core-loss',
    body: { material: { k: 2, alpha: 1.5, beta: 2.5 }, frequency: 0, deltaB: 0.1, duty: 0.5, waveform: 'sine' },
    status: 400,
    field: 'frequency',
  },
  {
    name: 'negative Steinmetz k',
    who: 'engineer',
    method: 'post',
    url: '/api/calc/core-loss',
    body: { material: { k: -2, alpha: 1.5, beta: 2.5 }, frequency: 1e5, deltaB: 0.1, duty: 0.5, waveform: 'sine' },
    status: 400,
    field: 'material.k',
  },
  {
    name: 'unknown waveform',
    who: 'engineer',
    method: 'post',
    url: '/api/calc/core-loss',
    body: { material: { k: 2, alpha: 1.5, beta: 2.5 }, frequency: 1e5, deltaB: 0.1, duty: 0.5, waveform: 'square' },
    status: 400,
    field: 'waveform',
  },
  { name: 'array instead of an object', who: 'engineer', method: 'post', url: '/api/calc/operating-point', body: [SPEC], status: 400 },
  {
    name: 'null body',
    who: 'engineer',
    method: 'post',
    url: '/api/calc/operating-point',
    raw: { type: 'application/json', data: 'null' },
    status: 400,
  },
  {
    name: 'JSON sent as text/plain',
    who: 'engineer',
    method: 'post',
    url: '/api/calc/operating-point',
    raw: { type: 'text/plain', data: JSON.stringify(SPEC) },
    status: 400,
  },
  {
    name: 'malformed JSON',
    who: 'engineer',
    method: 'post',
    url: '/api/calc/search',
    raw: { type: 'application/json', data: '{"spec": {"vinMin": 24,,}}' },
    status: 400,
  },
  {
    name: 'a 10 MB body',
    who: 'engineer',
    method: 'post',
    url: '/api/calc/search',
    raw: { type: 'application/json', data: JSON.stringify({ spec: SPEC, padding: 'x'.repeat(10 * 1024 * 1024) }) },
    status: 413,
  },
  {
    name: 'JSON nested 5,000 deep',
    who: 'engineer',
    method: 'post',
    url: '/api/calc/search',
    raw: { type: 'application/json', data: `{"spec": ${nested(5000)}}` },
    status: 400,
    field: 'spec',
  },
  {
    name: 'unknown field alongside valid ones',
    who: 'engineer',
    method: 'post',
    url: '/api/calc/operating-point',
    body: { ...SPEC, debug: true },
    status: 400,
    field: 'debug',
  },
  {
    name: 'prototype pollution attempt',
    who: 'engineer',
    method: 'post',
    url: '/api/calc/operating-point',
    raw: { type: 'application/json', data: JSON.stringify(SPEC).replace('{', '{"__proto__":{"role":"admin"},') },
    status: 400,
    field: '__proto__',
  },
  {
    name: 'constructor as a body key',
    who: 'engineer',
    method: 'post',
    url: '/api/calc/operating-point',
    body: { ...SPEC, constructor: { prototype: { role: 'admin' } } },
    status: 400,
    field: 'constructor',
  },
  {
    name: 'nested object where a number belongs',
    who: 'engineer',
    method: 'post',
    url: '/api/calc/operating-point',
    body: { ...SPEC, vinMax: { $gt: 0 } },
    status: 400,
    field: 'vinMax',
  },
  {
    name: 'SQL fragment as a material id',
    who: 'engineer',
    method: 'post',
    url: '/api/calc/search',
    body: { spec: SPEC, materialIds: ['1; drop table users; --'] },
    status: 400,
    field: 'materialIds.0',
  },
  {
    name: 'SQL fragment as a core id',
    who: 'engineer',
    method: 'post',
    url: '/api/calc/evaluate',
    body: { spec: SPEC, coreId: "' or 1=1 --", materialId: '1', wire: { kind: 'awg', awg: 18, strands: 1 } },
    status: 400,
    field: 'coreId',
  },
  {
    name: 'script tag as a username',
    who: 'admin',
    method: 'post',
    url: '/api/admin/users',
    body: { username: '<script>alert(1)</script>', displayName: 'X', role: 'engineer', password: 'long-enough-pw' },
    status: 400,
    field: 'username',
  },
  {
    name: 'SQL fragment as a username',
    who: 'admin',
    method: 'post',
    url: '/api/admin/users',
    body: { username: "admin'--", displayName: 'X', role: 'engineer', password: 'long-enough-pw' },
    status: 400,
    field: 'username',
  },
  {
    name: 'null byte in a username',
    who: 'admin',
    method: 'post',
    url: '/api/admin/users',
    body: { username: 'eve\u0000', displayName: 'X', role: 'engineer', password: 'long-enough-pw' },
    status: 400,
    field: 'username',
  },
  {
    name: '10,000-character display name',
    who: 'admin',
    method: 'post',
    url: '/api/admin/users',
    body: { username: 'longname', displayName: 'x'.repeat(10_000), role: 'engineer', password: 'long-enough-pw' },
    status: 400,
    field: 'displayName',
  },
  {
    name: 'role sent by a user (mass assignment)',
    who: 'engineer',
    method: 'patch',
    url: '/api/account/preferences',
    body: { theme: 'dark', role: 'admin' },
    status: 400,
    field: 'role',
  },
  {
    name: 'non-numeric id in a path',
    who: 'admin',
    method: 'patch',
    url: '/api/admin/users/abc',
    body: { role: 'admin' },
    status: 400,
    field: 'id',
  },
  { name: 'overflowing id in a path', who: 'winder', method: 'get', url: '/api/shop/orders/99999999999', status: 400, field: 'id' },
  { name: 'exponent id in a path', who: 'winder', method: 'get', url: '/api/shop/orders/1e3', status: 400, field: 'id' },
  {
    name: 'path traversal in a path parameter',
    who: 'winder',
    method: 'get',
    url: '/api/shop/orders/..%2F..%2Fetc%2Fpasswd',
    status: [400, 404],
  },
  { name: 'non-numeric paging', who: 'admin', method: 'get', url: '/api/admin/audit?limit=abc', status: 400, field: 'limit' },
  { name: 'negative paging offset', who: 'admin', method: 'get', url: '/api/admin/audit?offset=-5', status: 400, field: 'offset' },
  {
    name: 'array in a query string',
    who: 'admin',
    method: 'get',
    url: '/api/admin/audit?limit[]=1&limit[]=2',
    status: 400,
    field: 'limit[]',
  },
  {
    name: 'unknown query parameter',
    who: 'winder',
    method: 'get',
    url: '/api/shop/orders?status=open&sort=evil',
    status: 400,
    field: 'sort',
  },
  { name: 'unknown order state', who: 'winder', method: 'get', url: '/api/shop/orders?status=everything', status: 400, field: 'status' },
  {
    name: 'negative measured inductance',
    who: 'winder',
    method: 'post',
    url: '/api/shop/orders/1/units',
    body: { inductance: -1e-6, testFrequency: 1e4, resistance: 0.01, resistanceTemperature: 25, hipot: 'pass' },
    status: 400,
    field: 'inductance',
  },
  {
    name: 'invalid UTF-8 in a JSON body',
    who: 'engineer',
    method: 'post',
    url: '/api/calc/operating-point',
    raw: {
      type: 'application/json; charset=utf-8',
      data: Buffer.concat([Buffer.from('{"vinMin": 24, "note": "'), Buffer.from([0xc3, 0x28, 0xff]), Buffer.from('"}')]),
    },
    status: 400,
  },
  {
    name: 'bad e-mail address for the shop',
    who: 'admin',
    method: 'put',
    url: '/api/admin/settings',
    body: { shopEmail: 'shop@@example' },
    status: 400,
    field: 'shopEmail',
  },
  {
    name: 'design number instead of a design id',
    who: 'engineer',
    method: 'post',
    url: '/api/compare/saved-design',
    body: { designId: 'GW-0001', revision: 1 },
    status: 400,
    field: 'designId',
  },
  {
    name: 'fractional revision number',
    who: 'engineer',
    method: 'post',
    url: '/api/compare/saved-design',
    body: { designId: 1, revision: 1.5 },
    status: 400,
    field: 'revision',
  },
  {
    name: 'overflowing design id',
    who: 'engineer',
    method: 'post',
    url: '/api/compare/saved-design',
    body: { designId: 1e12, revision: 1 },
    status: 400,
    field: 'designId',
  },
  {
    name: 'formula-like user core name',
    who: 'engineer',
    method: 'post',
    url: '/api/catalogue/cores',
    body: { kind: 'ring', name: '=HYPERLINK("x")', family: 'RING', outerDiameter: 0.02, innerDiameter: 0.01, height: 0.007 },
    status: 400,
    field: 'name',
  },
  {
    name: 'gapped core whose Ve contradicts Ae·le',
    who: 'engineer',
    method: 'post',
    url: '/api/catalogue/cores',
    body: {
      kind: 'shape',
      name: 'Contradiction',
      family: 'E',
      ae: 1e-4,
      le: 0.08,
      ve: 1e-5,
      windowArea: 1.5e-4,
      windowHeight: 0.02,
      bobbinWidth: 0.018,
      bobbinHeight: 0.006,
      mlt: 0.06,
      surfaceArea: 0.003,
      source: 'test',
    },
    status: 400,
    field: 've',
  },
  {
    name: 'material edit with a non-numeric α',
    who: 'engineer',
    method: 'patch',
    url: '/api/materials/1',
    body: { alpha: 'one point five' },
    status: 400,
    field: 'alpha',
  },
  // Text PostgreSQL cannot store (NUL, an unpaired UTF-16 surrogate), in every kind of free-text field.
  {
    name: 'NUL in a design title',
    who: 'engineer',
    method: 'post',
    url: '/api/designs',
    body: { title: 'Buck\u0000', spec: SPEC },
    status: 400,
    field: 'title',
  },
  {
    name: 'unpaired surrogate in a design title',
    who: 'engineer',
    method: 'post',
    url: '/api/designs',
    body: { title: 'Buck \ud800', spec: SPEC },
    status: 400,
    field: 'title',
  },
  {
    name: 'NUL in a design note',
    who: 'engineer',
    method: 'post',
    url: '/api/designs',
    body: { title: 'Buck', spec: SPEC, note: 'n\u0000' },
    status: 400,
    field: 'note',
  },
  {
    name: 'unpaired low surrogate in a revision note',
    who: 'engineer',
    method: 'patch',
    url: '/api/designs/1/revisions/1',
    body: { note: '\udc00 note' },
    status: 400,
    field: 'note',
  },
  {
    name: 'NUL in a unit note',
    who: 'winder',
    method: 'post',
    url: '/api/shop/orders/1/units',
    body: { inductance: 1e-5, testFrequency: 1e4, resistance: 0.01, resistanceTemperature: 25, hipot: 'pass', notes: 'ok\u0000' },
    status: 400,
    field: 'notes',
  },
  {
    name: 'unpaired surrogate in a unit note',
    who: 'winder',
    method: 'post',
    url: '/api/shop/orders/1/units',
    body: { inductance: 1e-5, testFrequency: 1e4, resistance: 0.01, resistanceTemperature: 25, hipot: 'pass', notes: 'ok \ud800' },
    status: 400,
    field: 'notes',
  },
  {
    name: 'NUL in a user core name',
    who: 'engineer',
    method: 'post',
    url: '/api/catalogue/cores',
    body: { kind: 'ring', name: 'Ring\u0000', family: 'RING', outerDiameter: 0.02, innerDiameter: 0.01, height: 0.007 },
    status: 400,
    field: 'name',
  },
  {
    name: 'NUL in a material name',
    who: 'engineer',
    method: 'patch',
    url: '/api/materials/1',
    body: { name: 'N87\u0000' },
    status: 400,
    field: 'name',
  },
  {
    name: 'unpaired surrogate in a material name',
    who: 'engineer',
    method: 'patch',
    url: '/api/materials/1',
    body: { name: 'N87 \udbff' },
    status: 400,
    field: 'name',
  },
  {
    name: 'NUL in a display name',
    who: 'admin',
    method: 'post',
    url: '/api/admin/users',
    body: { username: 'nulname', displayName: 'X\u0000', role: 'engineer', password: 'long-enough-pw' },
    status: 400,
    field: 'displayName',
  },
  { name: 'NUL in the search query ?q=', who: 'engineer', method: 'get', url: '/api/designs?q=buck%00', status: 400, field: 'q' },
  {
    name: 'NUL in limits.allowedMaterials',
    who: 'engineer',
    method: 'post',
    url: '/api/calc/search',
    body: { spec: SPEC, limits: { allowedMaterials: ['1\u0000'] } },
    status: 400,
    field: 'limits.allowedMaterials.0',
  },
  {
    name: 'unpaired surrogate in limits.allowedMaterials',
    who: 'engineer',
    method: 'post',
    url: '/api/calc/search',
    body: { spec: SPEC, limits: { allowedMaterials: ['\ud800'] } },
    status: 400,
    field: 'limits.allowedMaterials.0',
  },
  {
    name: 'NUL in the sign-in username',
    who: 'anonymous',
    method: 'post',
    url: '/api/auth/sign-in',
    body: { username: 'ruth\u0000', password: 'whatever-it-is' },
    status: 400,
    field: 'username',
  },
  {
    name: 'unpaired surrogate in the sign-in username',
    who: 'anonymous',
    method: 'post',
    url: '/api/auth/sign-in',
    body: { username: 'ruth\ud800', password: 'whatever-it-is' },
    status: 400,
    field: 'username',
  },
];

describe('hostile input', () => {
  it('has at least 30 cases', () => {
    expect(CASES.length).toBeGreaterThanOrEqual(30);
  });

  it.each(CASES)('$name → $status in the error shape, naming the field, with nothing written', async (c) => {
    const client = { engineer, admin, winder, anonymous }[c.who];
    const before = await rowCounts();
    let res;
    if (c.raw) {
      let req = client.agent[c.method](c.url).set('Content-Type', c.raw.type);
      if (c.method !== 'get') req = req.set('X-XSRF-TOKEN', client.csrfToken!);
      res = await req.send(c.raw.data as string);
    } else {
      res = await client.send(c.method, c.url, c.body);
    }
    expect([c.status].flat()).toContain(res.status);
    expect(res.body?.error).toEqual(expect.objectContaining({ code: expect.any(String), message: expect.any(String) }));
    if (c.field) expect(Object.keys(res.body.error.fields ?? {})).toContain(c.field);
    expect(res.text).not.toMatch(/\n\s+at |node_modules|\.ts:\d+:\d+/);
    expect(await rowCounts()).toEqual(before);
  });
});
