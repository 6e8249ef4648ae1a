import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CORE_CSV_COLUMNS } from '@shared/schemas/core-csv';
import { signedInAs, type ApiClient } from './support/api-client.ts';
import { expectRefusedFile, tableCounts, uploadCsv } from './support/csv-import.ts';
import { createTestApp, tableCount, type TestApp } from './support/test-app.ts';

const FIXTURES = join(import.meta.dirname, '../fixtures/core-csv');
const TABLES = ['user_cores', 'materials', 'material_imports', 'designs', 'design_revisions', 'users', 'audit_log'];
const HEADER = CORE_CSV_COLUMNS.join(',');
const RING_NAME = 'Example ring 20/10/7 (illustrative)';
const SHAPE_NAME = 'Example E-core EX-1 (illustrative)';

let t: TestApp;
let engineer: ApiClient;
beforeAll(async () => {
  t = await createTestApp();
  engineer = await signedInAs(t.app, 'engineer');
});
afterAll(() => t.close());

const IMPORT = '/api/catalogue/cores/import';
const counts = () => tableCounts(t.db, TABLES);
const upload = (
  client: ApiClient,
  step: 'preview' | 'commit',
  content: string,
  fileName = 'cores.csv',
  decisions?: Record<string, string> | string,
) => uploadCsv(client, `${IMPORT}/${step}`, content, fileName, decisions);

interface ListedCore {
  id: string;
  origin: string;
  version?: number;
  userCoreId?: number;
  le: number;
  ae: number;
  ve: number;
  amin?: number;
  windowArea: number;
  source: string;
}
const listCores = async () => (await engineer.get('/api/catalogue/cores')).body.cores as ListedCore[];

describe('the core template', () => {
  let template: string;

  it('is served as CSV with the columns of the format and two illustrative rows', async () => {
    const res = await engineer.get('/api/catalogue/cores/template.csv');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    template = res.text;
    const lines = template.trim().split('\n');
    expect(lines[0]).toBe(HEADER);
    expect(lines).toHaveLength(3);
    for (const line of lines.slice(1)) expect(line).toMatch(/^Example .*,"Invented example, illustrative only"$/);
  });

  it('previews as two new rows', async () => {
    const preview = await upload(engineer, 'preview', template, 'template.csv');
    expect(preview.status).toBe(200);
    expect(preview.body.summary).toEqual({ rows: 2, new: 2, exists: 0, errors: 0 });
    expect(preview.body.rows.map((r: { row: number; name: string }) => [r.row, r.name])).toEqual([
      [2, RING_NAME],
      [3, SHAPE_NAME],
    ]);
  });

  it('commits both; the ring is listed with its IEC 60205 values and the set with its own', async () => {
    const commit = await upload(engineer, 'commit', template, 'template.csv');
    expect(commit.status).toBe(201);
    expect(commit.body).toMatchObject({ fileName: 'template.csv', created: 2, versioned: 0, skipped: 0 });
    expect(commit.body.coreIds).toHaveLength(2);

    const cores = await listCores();
    const ring = cores.find((c) => c.id === RING_NAME)!;
    expect(ring).toMatchObject({ origin: 'user', version: 1 });
    // Computed from the IEC 60205 sharp-edged ring formulas (le = C1²/C2, Ae = C1/C2; formulas from memory) for 20/10/7 mm: le 43.55 mm, Ae 33.63 mm², Ve 1 465 mm³
    expect(ring.le * 1e3).toBeCloseTo(43.55, 1);
    expect(ring.ae * 1e6).toBeCloseTo(33.63, 1);
    expect(ring.ve * 1e9).toBeCloseTo(1465, -1);
    // window π·ID²/4 = 78.5 mm² for ID 10 mm (same table)
    expect(ring.windowArea * 1e6).toBeCloseTo(78.5, 1);
    expect(ring.source).toMatch(/IEC 60205.*illustrative only/);

    // The set keeps its own effective parameters, converted from mm², mm, mm³ to SI (SI prefixes).
    const set = cores.find((c) => c.id === SHAPE_NAME)!;
    expect(set.ae).toBeCloseTo(80e-6, 15);
    expect(set.amin).toBeCloseTo(75e-6, 15);
    expect(set.le).toBeCloseTo(70e-3, 12);
    expect(set.ve).toBeCloseTo(5600e-9, 18);
    expect(set.windowArea).toBeCloseTo(120e-6, 15);
  });

  it('makes the imported cores available to the search at once', async () => {
    const materials = (await engineer.get('/api/materials')).body.materials as { id: string; family: string }[];
    const res = await engineer.post('/api/calc/search', {
      spec: { vinMin: 24, vinMax: 36, vout: 12, ioutMax: 2, frequency: 100e3, rippleRatio: 0.4 },
      materialIds: materials.filter((m) => m.family === 'ferrite').map((m) => m.id),
      coreIds: [SHAPE_NAME],
      limit: 5,
    });
    expect(res.status).toBe(200);
    expect(res.body.counts.cores).toBe(1);
  });

  it('asks for a decision on names that exist, then makes a new version or leaves the core alone', async () => {
    const again = await upload(engineer, 'preview', template, 'template.csv');
    expect(again.body.summary).toEqual({ rows: 2, new: 0, exists: 2, errors: 0 });

    const before = await counts();
    const undecided = await upload(engineer, 'commit', template, 'template.csv', {});
    expect(undecided.status).toBe(400);
    expect(undecided.body.error.fields['row 2.name']).toMatch(/new-version.*skip/);
    expect(undecided.body.error.fields['row 3.name']).toMatch(/new-version.*skip/);
    const malformed = await upload(engineer, 'commit', template, 'template.csv', 'not json');
    expect(malformed.status).toBe(400);
    expect(malformed.body.error.fields.decisions).toMatch(/JSON object/);
    const unknownDecision = await upload(engineer, 'commit', template, 'template.csv', { [RING_NAME]: 'overwrite' });
    expect(unknownDecision.status).toBe(400);
    expect(await counts()).toEqual(before);

    const decided = await upload(engineer, 'commit', template, 'template.csv', {
      [RING_NAME.toUpperCase()]: 'new-version',
      [SHAPE_NAME]: 'skip',
    });
    expect(decided.status).toBe(201);
    expect(decided.body).toMatchObject({ created: 0, versioned: 1, skipped: 1 });

    const cores = await listCores();
    const ring = cores.find((c) => c.id === RING_NAME)!;
    expect(ring.version).toBe(2);
    expect(cores.find((c) => c.id === SHAPE_NAME)!.version).toBe(1);
    expect(cores.filter((c) => c.id === RING_NAME)).toHaveLength(1);
    const history = await engineer.get(`/api/catalogue/cores/${ring.userCoreId}/history`);
    expect(history.body.versions.map((v: { version: number }) => v.version)).toEqual([2, 1]);
  });

  it('writes one audit entry per import', async () => {
    const admin = await signedInAs(t.app, 'admin');
    const audit = await admin.get('/api/admin/audit?offset=0&limit=50');
    const imports = (audit.body.entries as { action: string; target: string }[]).filter((e) => e.action === 'cores.imported');
    expect(imports).toHaveLength(2);
    expect(imports[0]!.target).toBe('template.csv');
  });
});

// [file, the field that must be named, what its message must say]
const HOSTILE: [string, RegExp, RegExp][] = [
  ['empty.csv', /^file$/, /empty/],
  ['header-only.csv', /^file$/, /No core rows/],
  ['semicolon-delimiter.csv', /^header$/, /comma/i],
  ['missing-column.csv', /^header\.kind$/, /Missing column "kind"/],
  ['unknown-column.csv', /^header\.colour$/, /Unknown column "colour"/],
  ['non-numeric.csv', /^row 3\.od_mm$/, /"abc" is not a number/],
  ['negative.csv', /^row 3\.height_mm$/, /greater than 0 \(got -7\)/],
  ['inner-not-below-outer.csv', /^row 2\.id_mm$/, /id_mm must be smaller than od_mm/],
  ['shape-without-source.csv', /^row 2\.source$/, /where the numbers come from/],
  ['duplicate-names.csv', /^row 4\.name$/, /already appears in row 2/],
  ['shipped-name.csv', /^row 2\.name$/, /shipped core/],
  ['formula-name.csv', /^row 2\.name$/, /formula/],
  ['binary-renamed.csv', /^file$/, /binary/],
  ['latin1-bytes.csv', /^file$/, /UTF-8/],
  ['too-many-rows.csv', /^file$/, /more than 1000 core rows/],
  ['unused-cells.csv', /^row 2\.le_mm$/, /must be empty for a ring core/],
  ['unknown-kind.csv', /^row 2\.kind$/, /"ring" or "shape"/],
  ['ve-not-ae-times-le.csv', /^row 2\.ve_mm3$/, /differs from Ae·le/],
  ['family-not-of-kind.csv', /^row 2\.family$/, /one of E, ETD/],
  ['decimal-comma.csv', /^row 2\.od_mm$/, /decimal separator/],
  ['ragged-row.csv', /^row 3\.\(row\)$/, /has 5 cells; the header has 17/],
  ['too-large.csv', /^row 2\.od_mm$/, /at most 500 mm/],
];

describe('hostile and broken core CSV files', () => {
  it('has at least 10 files in the corpus', () => {
    expect(HOSTILE.length).toBeGreaterThanOrEqual(10);
  });

  it.each(HOSTILE)('%s: refused naming the row and column, no table changed', async (file, key, message) => {
    const before = await counts();
    await expectRefusedFile(engineer, IMPORT, readFileSync(join(FIXTURES, file)), file, key, message);
    expect(await counts()).toEqual(before);
  });

  it('refuses a whole file when one row of several is wrong', async () => {
    const before = await counts();
    const text = `${HEADER}\nGood ring A,ring,RING,20,10,7,,,,,,,,,,,invented\nBad ring B,ring,RING,20,10,,,,,,,,,,,,invented\n`;
    const res = await upload(engineer, 'commit', text);
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ 'row 3.height_mm': 'height_mm is required for a ring core' });
    expect(await counts()).toEqual(before);
  });
});

describe('roles', () => {
  it('winders may read the template but not upload; anonymous visitors are refused', async () => {
    const winder = await signedInAs(t.app, 'winder');
    const template = await winder.get('/api/catalogue/cores/template.csv');
    expect(template.status).toBe(200);
    const before = await tableCount(t.db, 'user_cores');
    expect((await upload(winder, 'preview', template.text)).status).toBe(403);
    expect((await upload(winder, 'commit', template.text)).status).toBe(403);
    expect(await tableCount(t.db, 'user_cores')).toBe(before);
    const anonymous = await signedInAs(t.app, 'anonymous');
    expect((await anonymous.get('/api/catalogue/cores/template.csv')).status).toBe(401);
  });

  it('reviewers may import', async () => {
    const reviewer = await signedInAs(t.app, 'reviewer');
    const res = await upload(
      reviewer,
      'commit',
      `${HEADER}\nReviewer ring,ring,POWDER_TOROID,25,15,10,,,,,,,,,,,our own sample\n`,
      'reviewer.csv',
    );
    expect(res.status).toBe(201);
    expect(res.body.created).toBe(1);
  });
});
