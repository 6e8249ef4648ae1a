import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Role } from '@shared/schemas/auth';
import { ROLES } from '@shared/schemas/auth';
import { routeKey } from '@shared/api/endpoint';
import { ENDPOINTS } from '@shared/api/index';
import { PERMISSIONS } from '@shared/api/permissions';
import { ApiClient, signedInAs } from './support/api-client.ts';
import { insertEvaluatedDesign } from './support/design-fixture.ts';
import { listRoutes } from './support/route-list.ts';
import { createTestApp, type TestApp } from './support/test-app.ts';

// Who may get past the access check of every API route. "allowed" means the answer is not 401/403
// (it may still be 400/404/409 for the placeholder ids and bodies used here); the others must get
// 403, and anonymous visitors 401 — each refusal written to the audit log (OWASP ASVS 8.2.1).
type Policy = 'public' | 'signed-in' | readonly Role[];

// Routes bound to the owner: the placeholder id 1 is a demo design (and revision) owned by the demo
// engineer, so only that engineer passes; reviewers pass on their own designs (tests/api/designs.test.ts).
const OWNER_OF_DESIGN_1 = ['engineer'] as const;

// Routes declared in shared/api: the policy is the declaration's permission.
const DECLARED: Record<string, Policy> = Object.fromEntries(
  ENDPOINTS.map((endpoint) => {
    const access = PERMISSIONS[endpoint.access];
    return [routeKey(endpoint), access === 'anyone' ? 'public' : access === 'signedIn' ? 'signed-in' : access];
  }),
);

// Declared routes whose service adds the ownership rule: only the owner of design 1 passes.
const OWNER_BOUND: Record<string, Policy> = {
  'POST /api/designs/:id/revisions': OWNER_OF_DESIGN_1,
  'PATCH /api/designs/:id/revisions/:rev': OWNER_OF_DESIGN_1,
  'POST /api/revisions/:id/submit': OWNER_OF_DESIGN_1,
};

const POLICY: Record<string, Policy> = { ...DECLARED, ...OWNER_BOUND };

// Bodies valid enough to reach the ownership rule, where one is needed to get past validation.
const BODIES: Record<string, unknown> = {
  'PATCH /api/designs/:id/revisions/:rev': { note: 'access matrix probe' },
};

const concrete = (pattern: string) =>
  pattern
    .replace(':kind', 'spice')
    .replace(':index', '1')
    .replace(/:[a-z]+/g, '1');

let t: TestApp;
const clients = {} as Record<Role | 'anonymous', ApiClient>;

beforeAll(async () => {
  t = await createTestApp();
  for (const who of [...ROLES, 'anonymous'] as const) clients[who] = await signedInAs(t.app, who);
});
afterAll(() => t.close());

async function denialsFor(target: string): Promise<number> {
  const { rows } = await t.pool.query<{ n: number }>(
    "select count(*)::int as n from audit_log where action = 'access.denied' and target = $1",
    [target],
  );
  return rows[0].n;
}

describe('the access-control matrix', () => {
  it('has a policy for every API route the app mounts', () => {
    const routes = listRoutes(t.app);
    expect(routes.filter((r) => !(r in POLICY))).toEqual([]);
    expect(Object.keys(POLICY).filter((r) => !routes.includes(r))).toEqual([]);
  });

  const cases = Object.entries(POLICY).flatMap(([route, policy]) =>
    ([...ROLES, 'anonymous'] as const).map((who) => {
      const allowed =
        policy === 'public' ||
        (policy === 'signed-in' ? who !== 'anonymous' : who !== 'anonymous' && (policy as readonly string[]).includes(who));
      const expected = allowed ? 'allowed' : who === 'anonymous' ? 401 : 403;
      return { route, who, expected };
    }),
  );

  it.each(cases)('$route as $who → $expected', async ({ route, who, expected }) => {
    const [method, pattern] = route.split(' ');
    const url = concrete(pattern);
    // Sign-out would end the shared session of this client; give it one of its own.
    const client = route === 'POST /api/auth/sign-out' ? await signedInAs(t.app, who) : clients[who];
    const target = `${method} ${url}`;
    const before = await denialsFor(target);
    const res = await client.send(method.toLowerCase() as 'get', url, method === 'GET' ? undefined : (BODIES[route] ?? {}));
    if (expected === 'allowed') {
      expect([401, 403]).not.toContain(res.status);
    } else {
      expect(res.status).toBe(expected);
      expect(res.body.error.code).toBe(expected === 401 ? 'unauthenticated' : 'forbidden');
      await expect.poll(() => denialsFor(target)).toBe(before + 1);
    }
  });
});

describe('an engineer touching another engineer’s draft', () => {
  it('may read it, but not change it, revise it or submit it — each refusal audited', async () => {
    const { design, revision } = await insertEvaluatedDesign(t, 'erin');
    const tomas = new ApiClient(t.app);
    await tomas.signIn('tomas', 'demo-engineer-2026');
    expect((await tomas.get(`/api/designs/${design.id}`)).status).toBe(200);
    const attempts = [
      await tomas.patch(`/api/designs/${design.id}/revisions/1`, { title: 'Mine now' }),
      await tomas.post(`/api/designs/${design.id}/revisions`, {}),
      await tomas.post(`/api/revisions/${revision.id}/submit`, {}),
    ];
    for (const res of attempts) {
      expect(res.status).toBe(403);
      expect(res.body.error.code).toBe('forbidden');
    }
    expect(await denialsFor(`POST /api/revisions/${revision.id}/submit`)).toBe(1);
  });
});
