import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { CoreMaterial, CoreShape } from '@shared/engine/types';
import { ferriteA } from '../unit/engine/fixtures.ts';
import { signedInAs, type ApiClient } from './support/api-client.ts';
import { createTestApp, type TestApp } from './support/test-app.ts';

// Searches run in worker threads (server/calc/search-pool.ts): the answer must be the one the main thread would
// have computed, an engine refusal must still name its field, and a full pool must refuse with a 503 in the API's
// error shape rather than fail with a 500.

// 24–36 V → 12 V, 10 A, 100 kHz, ripple 0.3 (the worked example of tests/api/calc.test.ts).
const SPEC = { vinMin: 24, vinMax: 36, vout: 12, ioutMax: 10, frequency: 100e3, rippleRatio: 0.3 };

let pooled: TestApp;
let inline: TestApp;
let full: TestApp;
let onPool: ApiClient;
let onInline: ApiClient;
let onFull: ApiClient;
let materialIds: string[];
let fullClosed = false;

beforeAll(async () => {
  // Each app resets the shared database, so all three are built before anybody signs in.
  pooled = await createTestApp({ SEARCH_WORKERS: '1' });
  inline = await createTestApp({ SEARCH_WORKERS: '0' });
  full = await createTestApp({ SEARCH_WORKERS: '1', SEARCH_QUEUE: '0' });
  onPool = await signedInAs(pooled.app, 'engineer');
  onInline = await signedInAs(inline.app, 'engineer');
  onFull = await signedInAs(full.app, 'engineer');
  materialIds = (await onPool.get('/api/materials')).body.materials.map((m: { id: string }) => m.id);
});

afterAll(async () => {
  await Promise.all([pooled?.close(), inline?.close(), fullClosed ? undefined : full?.close()]);
});

describe('a search in the worker pool', () => {
  it('answers exactly what the inline search answers', async () => {
    const body = { spec: SPEC, materialIds, materials: [ferriteA], limit: 30 };
    const [viaPool, viaInline] = await Promise.all([onPool.post('/api/calc/search', body), onInline.post('/api/calc/search', body)]);
    expect(viaPool.status).toBe(200);
    expect(viaPool.headers['content-type']).toBe('application/json; charset=utf-8');
    expect(viaPool.headers['content-encoding']).toBe('gzip'); // supertest, like browsers, accepts gzip
    expect(viaPool.body.candidates.length).toBe(30);
    expect(viaPool.body).toEqual(viaInline.body);
    expect(pooled.services.searchPool.threads).toBe(1);
    expect(inline.services.searchPool.threads).toBe(0);
  });

  it('sends the answer uncompressed to a client that does not take gzip', async () => {
    const body = { spec: SPEC, materialIds, limit: 3 };
    const plain = await onPool.agent
      .post('/api/calc/search')
      .set('X-XSRF-TOKEN', onPool.csrfToken!)
      .set('Accept-Encoding', 'identity')
      .send(body);
    expect(plain.status).toBe(200);
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(Number(plain.headers['content-length'])).toBe(Buffer.byteLength(JSON.stringify(plain.body)));
    expect(plain.body).toEqual((await onInline.post('/api/calc/search', body)).body);
  });

  it('compares one design across materials in the pool with the inline figures', async () => {
    const best = (await onInline.post('/api/calc/search', { spec: SPEC, materialIds, limit: 1 })).body.candidates[0];
    const body = {
      spec: SPEC,
      coreId: best.result.core.id,
      turns: best.result.turns,
      wire: { kind: best.wire.kind, strandDiameter: best.wire.strandDiameter, strands: best.wire.strands },
    };
    const [viaPool, viaInline] = await Promise.all([onPool.post('/api/compare/design', body), onInline.post('/api/compare/design', body)]);
    expect(viaPool.status).toBe(200);
    expect(viaPool.body.rows.length).toBe(materialIds.length);
    expect(viaPool.body).toEqual(viaInline.body);
  });

  it('turns an engine refusal inside the worker into a 400 naming the field', async () => {
    // Ripple ratio 2 reaches zero current at full load: the schema allows it, the engine refuses it (DCM).
    const res = await onPool.post('/api/calc/search', { spec: { ...SPEC, rippleRatio: 2 }, materialIds });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
    expect(res.body.error.fields).toHaveProperty(['spec.rippleRatio']);
  });
});

describe('a full pool', () => {
  it('refuses another search with a 503 in the error shape, then searches again once free', async () => {
    const pool = full.services.searchPool;
    // One thread, no queue: a search given straight to the pool holds the only place. The thread's start-up (about a
    // second) and forty copies of the catalogue × 20 materials keep it busy well past the HTTP request.
    const cores: CoreShape[] = full.services.catalogue.cores();
    const held = pool.search({
      spec: { ...SPEC, rectifier: 'ideal' },
      cores: Array.from({ length: 40 }, (_, copy) => cores.map((core) => ({ ...core, id: `${core.id}~${copy}` }))).flat(),
      materials: Array.from({ length: 20 }, (_, i): CoreMaterial => ({ ...ferriteA, id: `held-${i}`, k: 2 + i / 4 })),
      wires: full.services.catalogue.standardWires(),
    });
    expect(pool.pending).toBe(1);

    const body = { spec: SPEC, materialIds, limit: 5 };
    const refused = await onFull.post('/api/calc/search', body);
    expect(pool.pending).toBe(1); // still held: the refusal was the full pool's, not a race
    expect(refused.status).toBe(503);
    expect(refused.body).toEqual({ error: { code: 'busy', message: expect.stringMatching(/busy.*try again/i) } });

    await held;
    expect(pool.pending).toBe(0);
    const answered = await onFull.post('/api/calc/search', body);
    expect(answered.status).toBe(200);
    expect(answered.body.candidates.length).toBe(5);
    // The held search runs in a thread at a lower priority: with the other API shards busy on two cores it can take
    // far longer than the 3–4 s it takes alone, and its length is not what this test is about.
  }, 60_000);

  it('ends its threads when the app closes', async () => {
    expect(full.services.searchPool.threads).toBe(1);
    await full.close();
    fullClosed = true;
    expect(full.services.searchPool.threads).toBe(0);
  });
});
