import { rmSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ensureCluster, ensureDatabase, stopCluster, type ClusterLocation } from '../../server/ops/postgres.ts';
import { insertEvaluatedDesign } from './support/design-fixture.ts';
import { signedInAs, type ApiClient } from './support/api-client.ts';
import { createTestApp, type TestApp } from './support/test-app.ts';

// PostgreSQL is stopped and started under the app, so this file runs on a throwaway cluster of its own.
const location: ClusterLocation = { root: `/tmp/gapwright-outage-${process.pid}`, port: 54400 + (process.pid % 500) };

let t: TestApp;
let engineer: ApiClient;

async function revisionChecksum(): Promise<string> {
  const { rows } = await t.pool.query<{ n: number; sum: string | null }>(
    "select count(*)::int as n, md5(string_agg(id::text || ':' || status || ':' || coalesce(result::text, ''), ',' order by id)) as sum from design_revisions",
  );
  return `${rows[0].n}/${rows[0].sum}`;
}

beforeAll(async () => {
  const cluster = ensureCluster(location);
  ensureDatabase('gapwright_outage', location);
  t = await createTestApp({ DATABASE_URL: cluster.urlFor('gapwright_outage'), DB_CONNECT_TIMEOUT_MS: '1000' });
  engineer = await signedInAs(t.app, 'engineer');
  await insertEvaluatedDesign(t, 'erin');
}, 120_000);

afterAll(async () => {
  await t?.close();
  stopCluster(location, 'immediate');
  rmSync(location.root!, { recursive: true, force: true });
});

describe('PostgreSQL stopped and restarted under the running app', () => {
  it('fails fast with 503 in the error shape during the outage and recovers by itself afterwards', async () => {
    expect((await engineer.get('/api/materials')).status).toBe(200);
    const before = await revisionChecksum();

    // Load keeps running through the outage: eight request loops, every answer recorded.
    const statuses: number[] = [];
    let loading = true;
    const loops = Array.from({ length: 8 }, async () => {
      while (loading) {
        const res = await engineer.get('/api/materials');
        statuses.push(res.status);
      }
    });
    await new Promise((r) => setTimeout(r, 300));

    stopCluster(location, 'immediate');

    for (let i = 0; i < 5; i++) {
      const started = Date.now();
      const res = await engineer.get('/api/materials');
      const elapsed = Date.now() - started;
      expect(res.status).toBe(503);
      expect(res.body.error.code).toBe('database_unavailable');
      expect(res.text).not.toMatch(/ECONNREFUSED|at .+\.ts:\d+/); // no internals, no stack
      expect(elapsed).toBeLessThan(3000); // connection timeout 1 s: no hang
    }
    const health = await engineer.get('/api/health');
    expect(health.status).toBe(503);
    expect(health.body).toMatchObject({ status: 'degraded', database: 'down' });

    ensureCluster(location);

    let recovered = 0;
    for (let i = 0; i < 50 && recovered === 0; i++) {
      const res = await engineer.get('/api/materials');
      if (res.status === 200) recovered = i + 1;
      else await new Promise((r) => setTimeout(r, 200));
    }
    expect(recovered).toBeGreaterThan(0);
    await new Promise((r) => setTimeout(r, 300));
    loading = false;
    await Promise.all(loops);
    // Only answers, never hangs or crashes: 200 before and after, 503 in between, nothing else.
    expect(new Set(statuses)).toEqual(new Set([200, 503]));
    expect(statuses.at(-1)).toBe(200);
    expect((await engineer.get('/api/health')).body.database).toBe('up');
    // The session lived in PostgreSQL and survived; nothing was half-written.
    expect((await engineer.get('/api/auth/session')).body.user.username).toBe('erin');
    expect(await revisionChecksum()).toBe(before);
  });
});
