import { parse } from 'csv-parse/sync';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiClient, signedInAs } from './support/api-client.ts';
import { createTestApp, type TestApp } from './support/test-app.ts';

let t: TestApp;
let erin: ApiClient;
let winder: ApiClient;
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- the test reads whichever stored figure it checks
let design: { id: number; number: string; latest: { result: { evaluation: Record<string, any> } } };

const SPEC = {
  converter: { vinMin: 24, vinMax: 36, vout: 12, ioutMax: 10, frequency: 100e3, rippleRatio: 0.3, rectifier: 'synchronous' },
  families: ['ETD'],
};

beforeAll(async () => {
  t = await createTestApp();
  erin = await signedInAs(t.app, 'engineer');
  winder = await signedInAs(t.app, 'winder');
  const materials = await erin.get('/api/materials');
  const list = (materials.body.materials ?? materials.body) as { id: number | string; family: string }[];
  const materialId = String(list.find((m) => m.family === 'ferrite')!.id);
  const res = await erin.post('/api/designs', {
    title: '=HYPERLINK("http://example.invalid")',
    spec: { ...SPEC, materialIds: [materialId] },
    construction: { coreId: 'ETD39/20/13', materialId, turns: 'auto', gap: 'auto', wire: { kind: 'awg', awg: 16, strands: 2 } },
  });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  design = res.body;
}, 60_000);
afterAll(() => t.close());

const url = (kind: string) => `/api/designs/${design.id}/revisions/1/exports/${kind}`;

describe('exports', () => {
  it('SPICE: values match the stored result snapshot, file name chosen by the server', async () => {
    const res = await winder.get(url('spice.lib'));
    expect(res.status).toBe(200);
    expect(res.headers['content-disposition']).toBe(`attachment; filename=${design.number}-r1.lib`);
    const text = res.text;
    const value = (name: string) => Number(new RegExp(`^${name} \\S+ \\S+ (\\S+)$`, 'm').exec(text)![1]);
    const ev = design.latest.result.evaluation;
    expect(value('L1') / ev['inductance'].atLoad).toBeCloseTo(1, 5);
    expect(value('RDC') / ev['copper'].resistanceHot).toBeCloseTo(1, 5);
    expect(text).toMatch(/qualified review/);
  });

  it('design JSON re-imports as a new design with the same construction and figures', async () => {
    const res = await erin.get(url('design.json'));
    expect(res.status).toBe(200);
    expect(res.headers['content-disposition']).toContain(`${design.number}-r1.design.json`);
    const file = JSON.parse(res.text);
    expect(file.format).toBe('gapwright-design');
    const imported = await erin.post('/api/designs/import', file);
    expect(imported.status, JSON.stringify(imported.body)).toBe(201);
    expect(imported.body.number).not.toBe(design.number);
    expect(imported.body.latest.construction).toEqual(file.construction);
    expect(imported.body.latest.result.evaluation.totalLoss).toBeCloseTo(file.result.evaluation.totalLoss, 9);
    expect((await winder.post('/api/designs/import', file)).status).toBe(403);
    expect((await erin.post('/api/designs/import', { ...file, format: 'other' })).body.error.fields).toHaveProperty('format');
  });

  it('candidates CSV escapes formula cells and lists feasible and infeasible candidates', async () => {
    const res = await erin.get(url('candidates.csv'));
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    const rows = parse(res.text, { columns: true }) as Record<string, string>[];
    expect(rows.length).toBeGreaterThan(1);
    expect(rows[0]['design']).toBe(design.number);
    expect(rows[0]['title']).toBe(`'=HYPERLINK("http://example.invalid")`);
    expect(res.text).toContain(`'=HYPERLINK(""http://example.invalid"")`);
    // the last row is the sheet's caution, the others are candidates
    expect(rows.at(-1)!['design']).toBe('Caution');
    expect(rows.at(-1)!['title']).toMatch(/^Engineering estimate: .* must be verified on a prototype/);
    expect(rows.slice(0, -1).every((r) => r['core'].startsWith('ETD'))).toBe(true);
    expect(rows.some((r) => r['feasible'] === 'yes')).toBe(true);
  });

  it('bill of materials states the lead allowance', async () => {
    const res = await erin.get(url('bom.csv'));
    const rows = parse(res.text, { columns: true }) as Record<string, string>[];
    const wire = rows.find((r) => r['item'] === 'Wire')!;
    // Every conductor in hand, each the winding's length + two 50 mm leads, as on the winding sheet.
    const evaluation = design.latest.result.evaluation;
    const inHand = evaluation['wire'].kind === 'litz' || evaluation['wire'].kind === 'foil' ? 1 : evaluation['wire'].strands;
    expect(Number(wire['quantity'])).toBeCloseTo(inHand * (evaluation['winding'].wireLength + 0.1), 3);
    expect(wire['note']).toMatch(new RegExp(`total of ${inHand} conductor\\(s\\) in hand; .* 50 mm lead at each end`));
  });

  it('ends the bill of materials with the sheet’s caution row', async () => {
    const rows = parse((await erin.get(url('bom.csv'))).text, { columns: true }) as Record<string, string>[];
    expect(rows.at(-1)!['item']).toBe('Caution');
    expect(rows.at(-1)!['description']).toMatch(/^Engineering estimate: .* qualified engineer/);
  });

  it('refuses unknown export kinds (404) and exports of a revision without construction (409)', async () => {
    expect((await erin.get(url('report.pdf'))).status).toBe(404);
    const bare = await erin.post('/api/designs', { title: 'No construction yet', spec: SPEC });
    expect((await erin.get(`/api/designs/${bare.body.id}/revisions/1/exports/spice.lib`)).status).toBe(409);
  });
});
