import { sql } from 'drizzle-orm';
import { parse } from 'csv-parse/sync';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signedInAs, type ApiClient } from './support/api-client.ts';
import { createTestApp, type TestApp } from './support/test-app.ts';

// Ids and lists in requests: an id beyond the database integer range is a 400 naming the field (it reached a
// query and failed with a 500); a list repeating one id is one id; a list over its cap is refused naming it.
const SPEC = { vinMin: 24, vinMax: 36, vout: 12, ioutMax: 10, frequency: 100e3, rippleRatio: 0.3 };
const WIRE = { kind: 'awg', awg: 18, strands: 2 };
const TOO_BIG = '2147483648';
const WAY_TOO_BIG = '99999999999';

let t: TestApp;
let engineer: ApiClient;
let winder: ApiClient;
let ferriteId: string;
let otherId: string;
beforeAll(async () => {
  t = await createTestApp();
  [engineer, winder] = await Promise.all([signedInAs(t.app, 'engineer'), signedInAs(t.app, 'winder')]);
  const materials = (await engineer.get('/api/materials')).body.materials as { id: number | string; family: string }[];
  const ferrites = materials.filter((m) => m.family === 'ferrite').map((m) => String(m.id));
  [ferriteId, otherId] = ferrites;
}, 60_000);
afterAll(() => t.close());

const expectFieldRefused = (
  res: { status: number; body: { error?: { fields?: Record<string, string> } } },
  field: string,
  message: RegExp,
) => {
  expect(res.status, JSON.stringify(res.body)).toBe(400);
  expect(res.body.error?.fields?.[field]).toMatch(message);
};

describe('ids beyond the database integer range', () => {
  it.each([TOO_BIG, WAY_TOO_BIG])('are refused with 400 naming the field: %s', async (id) => {
    const range = /whole numbers from 1 to 2147483647/;
    expectFieldRefused(await engineer.post('/api/calc/search', { spec: SPEC, materialIds: [id] }), 'materialIds.0', range);
    expectFieldRefused(
      await engineer.post('/api/calc/evaluate', {
        spec: SPEC,
        coreId: 'ETD34/17/11',
        materialId: id,
        turns: 'auto',
        gap: 'auto',
        wire: WIRE,
      }),
      'materialId',
      range,
    );
    expectFieldRefused(await engineer.post('/api/compare/curves', { materialIds: [ferriteId, id] }), 'materialIds.1', range);
    expectFieldRefused(
      await engineer.post('/api/compare/design', { spec: SPEC, coreId: 'ETD34/17/11', turns: 20, wire: WIRE, materialIds: [id] }),
      'materialIds.0',
      range,
    );
    expectFieldRefused(await engineer.post('/api/compare/saved-design', { designId: Number(id), revision: 1 }), 'designId', range);
    const design = await engineer.post('/api/designs', {
      title: 'Id range',
      spec: { converter: SPEC, materialIds: [ferriteId] },
      construction: { coreId: 'ETD34/17/11', materialId: id, turns: 'auto', gap: 'auto', wire: WIRE },
    });
    expectFieldRefused(design, 'construction.materialId', range);
    const exported = await winder.get(`/api/materials/export.csv?ids=${ferriteId},${id}`);
    expectFieldRefused(exported, 'ids.1', range);
  });

  it('still finds the largest id that fits, which names no material', async () => {
    const res = await engineer.post('/api/compare/curves', { materialIds: ['2147483647'] });
    expectFieldRefused(res, 'materialIds.0', /Unknown material/);
  });
});

describe('lists in requests', () => {
  it('searches a material named 200 times as one material, for any role that may search', async () => {
    const once = await engineer.post('/api/calc/search', { spec: SPEC, materialIds: [ferriteId], families: ['ETD'], limit: 20 });
    const repeated = await engineer.post('/api/calc/search', {
      spec: SPEC,
      materialIds: Array(200).fill(ferriteId),
      families: Array(50).fill('ETD'),
      limit: 20,
    });
    expect(repeated.status).toBe(200);
    expect(repeated.body.counts).toEqual(once.body.counts);
    expect(repeated.body.counts.materials).toBe(1);
    expect(repeated.text.length).toBe(once.text.length);
  });

  it('compares a material named twice as one curve', async () => {
    const res = await engineer.post('/api/compare/curves', { materialIds: [ferriteId, ferriteId, otherId, ferriteId] });
    expect(res.status).toBe(200);
    expect((res.body.materials as { id: string }[]).map((m) => String(m.id))).toEqual([ferriteId, otherId]);
  });

  it('refuses a list with more distinct values than its cap, naming the cap', async () => {
    const ids = Array.from({ length: 13 }, (_, i) => String(i + 1));
    expectFieldRefused(await engineer.post('/api/compare/curves', { materialIds: ids }), 'materialIds', /at most 12 distinct values/);
    const many = Array.from({ length: 201 }, (_, i) => String(i + 1));
    expectFieldRefused(
      await engineer.post('/api/calc/search', { spec: SPEC, materialIds: many }),
      'materialIds',
      /at most 200 distinct values/,
    );
    expectFieldRefused(
      await engineer.post('/api/compare/design', { spec: SPEC, coreId: 'ETD34/17/11', turns: 20, wire: WIRE, materialIds: many }),
      'materialIds',
      /at most 200 distinct values/,
    );
    const flood = Array(2001).fill(ferriteId);
    expectFieldRefused(
      await engineer.post('/api/calc/search', { spec: SPEC, materialIds: flood }),
      'materialIds',
      /at most 200 distinct values/,
    );
    const exportIds = Array.from({ length: 1001 }, (_, i) => i + 1).join(',');
    expectFieldRefused(await winder.get(`/api/materials/export.csv?ids=${exportIds}`), 'ids', /at most 1000 distinct values/);
  });

  it('exports a material named twice once', async () => {
    const res = await winder.get(`/api/materials/export.csv?ids=${ferriteId},${ferriteId}`);
    expect(res.status).toBe(200);
    expect(parse(res.text, { columns: true })).toHaveLength(1);
  });
});

describe('a design saved with an id that is not a stored material', () => {
  it('still exports its candidates, searching the materials that exist', async () => {
    const created = await engineer.post('/api/designs', {
      title: 'Stored bad id',
      spec: { converter: SPEC, families: ['ETD'], materialIds: [ferriteId] },
      construction: { coreId: 'ETD34/17/11', materialId: ferriteId, turns: 'auto', gap: 'auto', wire: WIRE },
    });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    // Saved before ids were range-checked: the stored spec names an id no integer column can hold, and one no material has.
    await t.db.execute(
      sql`update design_revisions set spec = jsonb_set(spec, '{materialIds}', ${JSON.stringify([WAY_TOO_BIG, ferriteId, '2147483647', ferriteId])}::jsonb) where design_id = ${created.body.id}`,
    );
    const res = await winder.get(`/api/designs/${created.body.id}/revisions/1/exports/candidates.csv`);
    expect(res.status, res.text).toBe(200);
    const rows = parse(res.text, { columns: true }) as Record<string, string>[];
    expect(rows.length).toBeGreaterThan(0);
    expect(new Set(rows.filter((r) => r['feasible'] === 'yes').map((r) => r['material'])).size).toBe(1);
  });
});
