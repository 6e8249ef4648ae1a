import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signedInAs, type ApiClient } from './support/api-client.ts';
import { createTestApp, tableCount, type TestApp } from './support/test-app.ts';

let t: TestApp;
let engineer: ApiClient;
beforeAll(async () => {
  t = await createTestApp();
  engineer = await signedInAs(t.app, 'engineer');
});
afterAll(() => t.close());

interface Flags {
  canEdit: boolean;
  canRetire: boolean;
  canRestore: boolean;
}

const RING = {
  kind: 'ring',
  name: 'Lab ring 25/15/10',
  family: 'POWDER_TOROID',
  outerDiameter: 25e-3,
  innerDiameter: 15e-3,
  height: 10e-3,
  source: 'our own sample',
};

describe('user cores', () => {
  it('computes a ring from its dimensions by IEC 60205 and lists it beside the shipped cores', async () => {
    const res = await engineer.post('/api/catalogue/cores', RING);
    expect(res.status).toBe(201);
    // Computed from the IEC 60205 sharp-edged ring formulas (le = C1²/C2, Ae = C1/C2; formulas from memory) for 25/15/10: le 60.18 mm, Ae 48.93 mm², Ve 2 944 mm³
    expect(res.body.le * 1e3).toBeCloseTo(60.18, 1);
    expect(res.body.ae * 1e6).toBeCloseTo(48.93, 1);
    expect(res.body.ve * 1e9).toBeCloseTo(2944, -1);
    expect(res.body).toMatchObject({ origin: 'user', version: 1, gapKind: 'distributed' });
    expect(res.body.source).toMatch(/IEC 60205/);
    const list = (await engineer.get('/api/catalogue/cores')).body.cores as { id: string; origin: string }[];
    expect(list.find((c) => c.id === 'ETD34/17/11')?.origin).toBe('shipped');
    expect(list.find((c) => c.id === 'Lab ring 25/15/10')?.origin).toBe('user');
  });

  it('edits make versions; the core is usable in the comparison', async () => {
    const list = (await engineer.get('/api/catalogue/cores')).body.cores as { id: string; userCoreId?: number }[];
    const mine = list.find((c) => c.id === 'Lab ring 25/15/10')!;
    const edited = await engineer.send('put', `/api/catalogue/cores/${mine.userCoreId}`, { ...RING, height: 12e-3 });
    expect(edited.status).toBe(201);
    expect(edited.body.version).toBe(2);
    const history = await engineer.get(`/api/catalogue/cores/${edited.body.userCoreId}/history`);
    expect(history.body.versions.map((v: { version: number }) => v.version)).toEqual([2, 1]);
    const compare = await engineer.post('/api/compare/design', {
      spec: { vinMin: 24, vinMax: 36, vout: 12, ioutMax: 2, frequency: 100e3, rippleRatio: 0.3 },
      coreId: 'Lab ring 25/15/10',
      turns: 30,
      wire: { kind: 'awg', awg: 22, strands: 1 },
    });
    expect(compare.status).toBe(200);
    const powder = compare.body.rows.find((r: { family: string }) => r.family === 'powder');
    expect(powder.status).toBe('ok');
    const ferrite = compare.body.rows.find((r: { family: string }) => r.family === 'ferrite');
    expect(ferrite.status).toBe('incompatible');
  });

  it('refuses inconsistent or clashing cores by field, and winders', async () => {
    const before = await tableCount(t.db, 'user_cores');
    const inverted = await engineer.post('/api/catalogue/cores', { ...RING, name: 'Bad ring', innerDiameter: 30e-3 });
    expect(inverted.status).toBe(400);
    expect(inverted.body.error.fields.innerDiameter).toMatch(/smaller than outerDiameter/);
    const shipped = await engineer.post('/api/catalogue/cores', { ...RING, name: 'ETD34/17/11' });
    expect(shipped.status).toBe(409);
    const taken = await engineer.post('/api/catalogue/cores', { ...RING, name: 'LAB RING 25/15/10' });
    expect(taken.status).toBe(409);
    expect(taken.body.error.fields.name).toMatch(/Same name as "Lab ring 25\/15\/10"/);
    const shaped = await engineer.post('/api/catalogue/cores', {
      kind: 'shape',
      name: 'Lab E',
      family: 'E',
      ae: 100e-6,
      le: 80e-3,
      ve: 12e-6,
      windowArea: 150e-6,
      windowHeight: 20e-3,
      bobbinWidth: 18e-3,
      bobbinHeight: 6e-3,
      mlt: 60e-3,
      surfaceArea: 3e-3,
      source: 'measured',
    });
    expect(shaped.status).toBe(400);
    expect(shaped.body.error.fields.ve).toMatch(/differs from Ae·le/);
    const winder = await signedInAs(t.app, 'winder');
    expect((await winder.post('/api/catalogue/cores', { ...RING, name: 'Winder ring' })).status).toBe(403);
    expect(await tableCount(t.db, 'user_cores')).toBe(before);
  });
});

describe('what the server says each user may do with a core', () => {
  const flags = (core: { canEdit: boolean; canRetire: boolean; canRestore: boolean }) => [core.canEdit, core.canRetire, core.canRestore];

  it('engineers edit user cores, reviewers also retire and restore them; shipped cores allow nothing', async () => {
    const reviewer = await signedInAs(t.app, 'reviewer');
    const byEngineer = (await engineer.get('/api/catalogue/cores')).body.cores as ({ id: string; userCoreId?: number } & Flags)[];
    expect(flags(byEngineer.find((c) => c.id === 'ETD34/17/11')!)).toEqual([false, false, false]);
    const mine = byEngineer.find((c) => c.id === 'Lab ring 25/15/10')!;
    expect(flags(mine)).toEqual([true, false, false]);
    const byReviewer = (await reviewer.get('/api/catalogue/cores')).body.cores as ({ id: string } & Flags)[];
    expect(flags(byReviewer.find((c) => c.id === 'Lab ring 25/15/10')!)).toEqual([true, true, false]);

    const retired = await reviewer.post(`/api/catalogue/cores/${mine.userCoreId}/retire`);
    expect(flags(retired.body)).toEqual([true, false, true]);
    const history = (await reviewer.get(`/api/catalogue/cores/${mine.userCoreId}/history`)).body.versions as Flags[];
    expect(history.map(flags)).toEqual([
      [true, false, true],
      [false, false, false],
    ]);
    expect(flags((await reviewer.post(`/api/catalogue/cores/${mine.userCoreId}/unretire`)).body)).toEqual([true, true, false]);
  });
});

describe('user cores in the search', () => {
  it('offers a current user core as a search candidate', async () => {
    const ring = { ...RING, name: 'Search ring 40/24/16', outerDiameter: 40e-3, innerDiameter: 24e-3, height: 16e-3 };
    expect((await engineer.post('/api/catalogue/cores', ring)).status).toBe(201);
    const materials = (await engineer.get('/api/materials')).body.materials as { id: string; family: string }[];
    const powder = materials.filter((m) => m.family === 'powder').map((m) => m.id);
    const res = await engineer.post('/api/calc/search', {
      spec: { vinMin: 24, vinMax: 36, vout: 12, ioutMax: 2, frequency: 100e3, rippleRatio: 0.4 },
      materialIds: powder,
      coreIds: ['Search ring 40/24/16'],
      limit: 5,
    });
    expect(res.status).toBe(200);
    expect(res.body.counts.cores).toBe(1);
  });
});
