// A material's temperature limit (max_temperature) and the check of its temperature factor, through the CSV import,
// the export, the edit and the engine. Every material here is invented.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MATERIAL_CSV_COLUMNS } from '@shared/schemas/materials';
import { TEMPLATE_ROWS } from '../../server/materials/material-template.ts';
import { signedInAs, type ApiClient } from './support/api-client.ts';
import { tableCounts, uploadCsv } from './support/csv-import.ts';
import { createTestApp, type TestApp } from './support/test-app.ts';

const TABLES = ['materials', 'material_imports', 'audit_log', 'designs', 'design_revisions'];

let t: TestApp;
let engineer: ApiClient;
beforeAll(async () => {
  t = await createTestApp();
  engineer = await signedInAs(t.app, 'engineer');
});
afterAll(() => t.close());

const counts = () => tableCounts(t.db, TABLES);
const upload = (step: 'preview' | 'commit', text: string) => uploadCsv(engineer, `/api/materials/import/${step}`, text, 'limits.csv');

/** A CSV file of the template's ferrite under other names, each row with its own changed cells. */
function csvFile(rows: Record<string, string>[]): string {
  const lines = rows.map((overrides) => {
    const cells: Record<string, string> = { ...TEMPLATE_ROWS[0]!, provenance: 'Invented test row', ...overrides };
    return MATERIAL_CSV_COLUMNS.map((c) => cells[c]).join(',');
  });
  return `${MATERIAL_CSV_COLUMNS.join(',')}\n${lines.join('\n')}\n`;
}

interface Listed {
  id: number;
  name: string;
  maxTemperature?: number;
  tempCoefficients?: { ct0: number; ct1: number; ct2: number };
  temperatureBehaviour: { lowestLossTemperature: number; lowestLossFactor: number; curvature: number } | null;
  cells: Record<string, string>;
}
const library = async () => (await engineer.get('/api/materials/library')).body.materials as Listed[];
const named = async (name: string) => (await library()).find((m) => m.name === name)!;

// A loss factor F0 of 0 is outside its range (F0 > 0 keeps the factor positive everywhere; algebra, no source).
const ZERO_FACTOR = { lowest_loss_temperature: '90', lowest_loss_factor: '0', loss_curvature: '0.0001' };

describe('the checks of a row, all at once', () => {
  it('reports every problem of a row together (f_min above f_max among them), notes warnings, and writes nothing', async () => {
    const text = csvFile([
      { name: 'Limits good row' },
      { name: 'Limits bad row', ...ZERO_FACTOR, f_min: '400000', bsat_25: '7', max_temperature: '155' },
      // Invented: Bsat at 100 °C above Bsat at 25 °C is unusual for ferrite but not impossible (common practice, no source).
      { name: 'Limits swapped bsat', bsat_25: '0.4', bsat_100: '0.5' },
    ]);
    const before = await counts();
    const preview = await upload('preview', text);
    expect(preview.status).toBe(200);
    expect(preview.body.rows[0]).toMatchObject({ row: 2, status: 'new', problems: [], notices: [] });
    const bad = preview.body.rows[1] as { row: number; status: string; problems: { column: string; message: string }[] };
    expect(bad).toMatchObject({ row: 3, status: 'error' });
    const byColumn = Object.fromEntries(bad.problems.map((p) => [p.column, p.message]));
    expect(Object.keys(byColumn).sort()).toEqual(['bsat_25', 'f_min', 'lowest_loss_factor']);
    expect(byColumn['lowest_loss_factor']).toBe('lowest_loss_factor must be greater than 0 (got 0)');
    expect(byColumn['f_min']).toBe('f_min must be below f_max (400000 ≥ 300000)');
    expect(preview.body.rows[2]).toMatchObject({
      row: 4,
      status: 'new',
      problems: [],
      notices: [
        {
          column: 'bsat_100',
          message: 'exceeds bsat_25: ferrite saturation normally falls with temperature; check the columns are not swapped',
        },
      ],
    });

    const commit = await upload('commit', text);
    expect(commit.status).toBe(400);
    expect(Object.keys(commit.body.error.fields).sort()).toEqual(['row 3.bsat_25', 'row 3.f_min', 'row 3.lowest_loss_factor']);
    expect(await counts()).toEqual(before);
  });

  it('an edit outside a range is refused with a 400 naming the column, and nothing is written', async () => {
    const { id } = (await library())[0]!;
    const before = await counts();
    const res = await engineer.patch(`/api/materials/${id}`, { ...ZERO_FACTOR, loss_curvature: '-1e-4' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['loss_curvature', 'lowest_loss_factor']);
    expect(res.body.error.fields.loss_curvature).toMatch(/between 0 and 1/);
    expect(await counts()).toEqual(before);
  });
});

describe('max_temperature', () => {
  it('round-trips through CSV import, export and edit', async () => {
    const commit = await upload('commit', csvFile([{ name: 'Limits powder-like', max_temperature: '155' }]));
    expect(commit.status, JSON.stringify(commit.body)).toBe(201);
    const imported = await named('Limits powder-like');
    expect(imported.maxTemperature).toBe(155);
    expect(imported.cells.max_temperature).toBe('155');

    const exported = (await engineer.get(`/api/materials/export.csv?ids=${imported.id}`)).text.trim().split('\n');
    const column = exported[0]!.split(',').indexOf('max_temperature');
    expect(column).toBeGreaterThan(0);
    expect(exported[1]!.split(',')[column]).toBe('155');

    const edited = await engineer.patch(`/api/materials/${imported.id}`, { max_temperature: 170 });
    expect(edited.status).toBe(201);
    expect(edited.body).toMatchObject({ maxTemperature: 170, version: 2 });
    expect(edited.body.cells.max_temperature).toBe('170');

    // The edited version exported and imported again under another name keeps its limit.
    const again = (await engineer.get(`/api/materials/export.csv?ids=${edited.body.id}`)).text.replace('Limits powder-like', 'Limits copy');
    expect((await upload('commit', again)).status).toBe(201);
    expect((await named('Limits copy')).maxTemperature).toBe(170);

    const cleared = await engineer.patch(`/api/materials/${edited.body.id}`, { max_temperature: '' });
    expect(cleared.status).toBe(201);
    expect(cleared.body.maxTemperature).toBeUndefined();
    expect(cleared.body.cells.max_temperature).toBe('');
  });

  it('out of range is refused naming the column, at import and in an edit', async () => {
    const before = await counts();
    const commit = await upload('commit', csvFile([{ name: 'Limits too hot', max_temperature: '450' }]));
    expect(commit.status).toBe(400);
    expect(commit.body.error.fields['row 2.max_temperature']).toMatch(/between 50 and 400 \(got 450\)/);
    const { id } = await named('Limits copy');
    const edit = await engineer.patch(`/api/materials/${id}`, { max_temperature: 40 });
    expect(edit.status).toBe(400);
    expect(edit.body.error.fields.max_temperature).toMatch(/between 50 and 400 \(got 40\)/);
    expect(await counts()).toEqual(before);
  });

  it('reaches the engine: a hot spot above the stored limit fails, naming the limit', async () => {
    const commit = await upload(
      'commit',
      csvFile([{ name: 'Limits cool ferrite', max_temperature: '60' }, { name: 'Limits plain ferrite' }]),
    );
    expect(commit.status).toBe(201);
    const [limited, plain] = commit.body.materialIds as number[];
    // Ambient 70 °C puts any hot spot above 70 °C (hot spot = surface + 5 K; common practice, no source).
    const evaluate = (materialId: number) =>
      engineer.post('/api/calc/evaluate', {
        spec: { vinMin: 24, vinMax: 36, vout: 12, ioutMax: 10, frequency: 100e3, rippleRatio: 0.3 },
        limits: { ambient: 70 },
        coreId: 'ETD34/17/11',
        materialId: String(materialId),
        wire: { kind: 'awg', awg: 18, strands: 2 },
      });
    const hot = await evaluate(limited!);
    expect(hot.status).toBe(200);
    expect(hot.body.result.thermal.hotSpot).toBeGreaterThan(70);
    const issue = (hot.body.result.issues as { code: string; message: string }[]).find((i) => i.code === 'material-temperature');
    expect(issue?.message).toMatch(/exceeds the Limits cool ferrite limit of 60 °C\.$/);
    const ferriteDefault = await evaluate(plain!);
    expect((ferriteDefault.body.result.issues as { code: string }[]).map((i) => i.code)).not.toContain('material-temperature');
  });
});

describe('t_ref', () => {
  it('refers the behaviour to t_ref for the engine and keeps the cells as uploaded', async () => {
    // T0 = 150 °C, F0 = 0.55, c = 1e-4 (invented) is 1e-4·T² − 0.03·T + 2.8, 0.8 at 100 °C (algebra, no source), so the
    // engine's coefficients are these divided by 0.8.
    const behaviour = { lowest_loss_temperature: '150', lowest_loss_factor: '0.55', loss_curvature: '0.0001', t_ref: '100' };
    const commit = await upload('commit', csvFile([{ name: 'Limits referred', ...behaviour }]));
    expect(commit.status).toBe(201);
    const material = await named('Limits referred');
    expect(material.cells).toMatchObject(behaviour);
    expect(material.temperatureBehaviour).toEqual({ lowestLossTemperature: 150, lowestLossFactor: 0.55, curvature: 1e-4 });
    expect(material.tempCoefficients!.ct0).toBeCloseTo(3.5, 12);
    expect(material.tempCoefficients!.ct1).toBeCloseTo(0.0375, 12);
    expect(material.tempCoefficients!.ct2).toBeCloseTo(1.25e-4, 15);
  });
});
