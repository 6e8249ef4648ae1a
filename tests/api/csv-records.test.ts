import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CORE_CSV_COLUMNS } from '@shared/schemas/core-csv';
import { MATERIAL_CSV_COLUMNS } from '@shared/schemas/materials';
import { signedInAs, type ApiClient } from './support/api-client.ts';
import { tableCounts, uploadCsv } from './support/csv-import.ts';
import { createTestApp, type TestApp } from './support/test-app.ts';

// Row limits count records, not lines: a quoted cell may span lines and blank lines are skipped, so neither
// may make rows disappear. A file over the limit is refused as a whole; row numbers are a record's first line.
const TABLES = ['materials', 'material_imports', 'user_cores', 'designs', 'design_revisions', 'users', 'audit_log'];
const MATERIALS = '/api/materials/import';
const CORES = '/api/catalogue/cores/import';
const MATERIAL_HEADER = MATERIAL_CSV_COLUMNS.join(',');
const CORE_HEADER = CORE_CSV_COLUMNS.join(',');

let t: TestApp;
let engineer: ApiClient;
beforeAll(async () => {
  t = await createTestApp();
  engineer = await signedInAs(t.app, 'engineer');
});
afterAll(() => t.close());

const counts = () => tableCounts(t.db, TABLES);
const materialRow = (name: string, provenance: string) =>
  `${name},ferrite,W/m3-Hz-T,3,1.4,2.6,1,2,0,1,,,,,,0.5,0.4,2000,,,,,4800,${provenance}`;
const coreRow = (name: string, height = '7') => `${name},ring,RING,20,10,${height},,,,,,,,,,,invented`;
interface PreviewRow {
  row: number;
  name: string;
}

describe('row limits count records', () => {
  it('previews 6,000 material rows that each hold a quoted line break as 6,000 rows, numbered by their first line', async () => {
    const rows = Array.from({ length: 6_000 }, (_, i) => materialRow(`Split M${i}`, '"first line\nsecond line"'));
    const preview = await uploadCsv(engineer, `${MATERIALS}/preview`, `${MATERIAL_HEADER}\n${rows.join('\n')}\n`, 'split.csv');
    expect(preview.status).toBe(200);
    expect(preview.body.summary.rows).toBe(6_000);
    const listed = preview.body.rows as PreviewRow[];
    expect(listed.at(-1)).toMatchObject({ name: 'Split M5999', row: 2 + 2 * 5_999 });
    expect(listed[1]).toMatchObject({ name: 'Split M1', row: 4 });
    expect(preview.body.summary.errors).toBe(0);
  });

  it('commits all 700 rows of a core file whose rows are separated by blank lines', async () => {
    const before = await counts();
    const rows = Array.from({ length: 700 }, (_, i) => coreRow(`Spaced ring ${i}`));
    const commit = await uploadCsv(engineer, `${CORES}/commit`, `${CORE_HEADER}\n\n${rows.join('\n\n')}\n`, 'spaced.csv', {});
    expect(commit.status).toBe(201);
    expect(commit.body.created).toBe(700);
    expect((await counts()).user_cores).toBe(before.user_cores + 700);
  });

  it('names the first line of the record in a row problem after blank lines and quoted line breaks', async () => {
    const text = `${CORE_HEADER}\n\nLined ring A,ring,RING,20,10,7,,,,,,,,,,,"two\nlines"\n\n\n${coreRow('Lined ring B', '')}\n`;
    const commit = await uploadCsv(engineer, `${CORES}/commit`, text, 'lined.csv', {});
    expect(commit.status).toBe(400);
    expect(Object.keys(commit.body.error.fields)).toContain('row 7.height_mm');
    const preview = await uploadCsv(engineer, `${CORES}/preview`, text, 'lined.csv');
    expect((preview.body.rows as PreviewRow[]).map((r) => [r.row, r.name])).toEqual([
      [3, 'Lined ring A'],
      [7, 'Lined ring B'],
    ]);
  });

  it('refuses a core file one record over the limit as a whole, naming the limit, with every table unchanged', async () => {
    const before = await counts();
    const rows = Array.from({ length: 1_001 }, (_, i) => coreRow(`Over ring ${i}`));
    for (const step of ['preview', 'commit'] as const) {
      const res = await uploadCsv(
        engineer,
        `${CORES}/${step}`,
        `${CORE_HEADER}\n\n${rows.join('\n\n')}\n`,
        'over.csv',
        step === 'commit' ? {} : undefined,
      );
      expect(res.status).toBe(400);
      expect(res.body.error.fields.file).toMatch(/more than 1000 core rows \(the limit is 1000 per file\)/);
    }
    expect(await counts()).toEqual(before);
  });

  it('refuses a material file one record over the limit, naming the limit', async () => {
    const before = await counts();
    const rows = Array.from({ length: 10_001 }, (_, i) => materialRow(`Over M${i}`, 'x'));
    const res = await uploadCsv(engineer, `${MATERIALS}/commit`, `${MATERIAL_HEADER}\n${rows.join('\n')}\n`, 'over.csv', {});
    expect(res.status).toBe(400);
    expect(res.body.error.fields.file).toMatch(/the limit is 10000 per file/);
    expect(await counts()).toEqual(before);
  });
});

describe('line endings', () => {
  it('accepts a file that mixes CRLF and LF line endings', async () => {
    const rows = Array.from({ length: 6 }, (_, i) => coreRow(`Mixed ring ${i}`));
    const text = [CORE_HEADER, ...rows].map((line, i) => line + (i % 2 ? '\n' : '\r\n')).join('');
    const commit = await uploadCsv(engineer, `${CORES}/commit`, text, 'mixed.csv', {});
    expect(commit.status).toBe(201);
    expect(commit.body.created).toBe(6);
    const materials =
      [MATERIAL_HEADER, materialRow('Mixed M1', 'x'), materialRow('Mixed M2', 'x')].join('\r\n').replace(/\r\n$/, '') +
      '\n' +
      materialRow('Mixed M3', 'x') +
      '\r\n';
    const preview = await uploadCsv(engineer, `${MATERIALS}/preview`, materials, 'mixed.csv');
    expect(preview.status).toBe(200);
    expect((preview.body.rows as PreviewRow[]).map((r) => [r.row, r.name])).toEqual([
      [2, 'Mixed M1'],
      [3, 'Mixed M2'],
      [4, 'Mixed M3'],
    ]);
  });
});
