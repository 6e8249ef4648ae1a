// Injection and privilege attempts: prototype pollution, SQL and markup fragments in ids and names, a
// spreadsheet formula as a name, a role sent where the caller may not set one.
import { describeHostileInput, SPEC, type HostileCase } from './support/hostile-input.ts';

const CASES: HostileCase[] = [
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
    name: 'role sent by a user (mass assignment)',
    who: 'engineer',
    method: 'patch',
    url: '/api/account/preferences',
    body: { theme: 'dark', role: 'admin' },
    status: 400,
    field: 'role',
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
];

describeHostileInput('hostile input: injection and privilege', CASES);
