import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MATERIAL_CSV_COLUMNS } from '@shared/schemas/materials';
import { TEMPLATE_ROWS } from '../../server/materials/material-template.ts';
import { signedInAs, type ApiClient } from './support/api-client.ts';
import { expectRefusedFile, tableCounts, uploadCsv } from './support/csv-import.ts';
import { createTestApp, type TestApp } from './support/test-app.ts';

const FIXTURES = join(import.meta.dirname, '../fixtures/csv');
const TABLES = ['materials', 'material_imports', 'user_cores', 'designs', 'design_revisions', 'revision_transitions', 'users'];

let t: TestApp;
let engineer: ApiClient;
let winder: ApiClient;
beforeAll(async () => {
  t = await createTestApp();
  engineer = await signedInAs(t.app, 'engineer');
  winder = await signedInAs(t.app, 'winder');
});
afterAll(() => t.close());

const IMPORT = '/api/materials/import';
const counts = () => tableCounts(t.db, TABLES);
const upload = (
  client: ApiClient,
  step: 'preview' | 'commit',
  content: Buffer | string,
  fileName = 'materials.csv',
  decisions?: Record<string, string>,
) => uploadCsv(client, `${IMPORT}/${step}`, content, fileName, decisions);

const HEADER = MATERIAL_CSV_COLUMNS.join(',');
/** The template's ferrite row as CSV text, under another name and with the given cells changed. */
function csvRow(name: string, overrides: Record<string, string> = {}): string {
  const cells: Record<string, string> = { ...TEMPLATE_ROWS[0]!, name, provenance: 'Invented test row', ...overrides };
  return MATERIAL_CSV_COLUMNS.map((c) => cells[c]).join(',');
}

// [file, the field that must be named, what its message must say]
const HOSTILE: [string, RegExp, RegExp][] = [
  ['empty.csv', /^file$/, /empty/],
  ['whitespace-only.csv', /^file$/, /empty/],
  ['header-only.csv', /^file$/, /No material rows/],
  ['semicolon-delimiter.csv', /^header$/, /comma/i],
  ['tab-delimiter.csv', /^header$/, /comma/i],
  ['bom-bad-alpha.csv', /^row 3\.alpha$/, /between 1 and 3/],
  ['crlf-non-numeric-k.csv', /^row 2\.k$/, /"abc" is not a number/],
  ['missing-column.csv', /^header\.beta$/, /Missing column "beta"/],
  ['non-numeric-permeability.csv', /^row 2\.mu_i$/, /"high" is not a number/],
  ['negative-k.csv', /^row 2\.k$/, /greater than 0/],
  ['alpha-out-of-range.csv', /^row 2\.alpha$/, /between 1 and 3/],
  ['beta-out-of-range.csv', /^row 2\.beta$/, /between 1.5 and 4/],
  ['duplicate-names.csv', /^row 4\.name$/, /already appears in row 2/],
  ['quoted-commas-bad-family.csv', /^row 3\.family$/, /must be one of/],
  ['formula-cells.csv', /^row 2\.name$/, /formula/],
  ['latin1-bytes.csv', /^file$/, /UTF-8/],
  ['binary-renamed.csv', /^file$/, /binary/],
  ['unknown-column.csv', /^header\.colour$/, /Unknown column "colour"/],
  ['ragged-row.csv', /^row 3\.\(row\)$/, /has 10 cells; the header has 21/],
  ['decimal-comma.csv', /^row 2\.alpha$/, /decimal separator/],
  ['unclosed-quote.csv', /^file$/, /never closed/],
  ['f-min-above-f-max.csv', /^row 2\.f_min$/, /must be below f_max \(400000 ≥ 300000\)/],
  ['unknown-unit-set.csv', /^row 2\.unit_set$/, /W\/m3-Hz-T or mW\/cm3-kHz-mT/],
  ['bsat-in-wrong-unit.csv', /^row 2\.bsat_25$/, /between 0.05 and 3 T/],
  ['partial-rolloff.csv', /^row 2\.rolloff_steepness$/, /required when rolloff_half_field is given \(both or none\)/],
  ['missing-required-cell.csv', /^row 2\.density$/, /is required/],
  ['duplicate-header.csv', /^header\.name$/, /appears twice/],
  ['infinite-number.csv', /^row 2\.k$/, /finite/],
  // The old-format file (ct0, ct1, ct2): 2e-4·T² − 0.04·T + 1.5 (invented) is −0.5 at its vertex, 100 °C (algebra, no
  // source), so it has no positive named form; row 2 converts, yet nothing is written.
  ['negative-temperature-factor.csv', /^row 3\.ct0$/, /lowest value at or below zero, so it cannot be positive at every temperature/],
  ['mixed-old-new-columns.csv', /^header\.ct0$/, /old column of the temperature behaviour and cannot be used with lowest_loss_temperature/],
  ['max-temperature-out-of-range.csv', /^row 2\.max_temperature$/, /between 50 and 400 \(got 450\)/],
];

describe('hostile and broken material CSV files', () => {
  it('has at least 20 files in the corpus', () => {
    expect(HOSTILE.length).toBeGreaterThanOrEqual(20);
  });

  it.each(HOSTILE)('%s: refused with row/column messages and no table changed', async (file, key, message) => {
    const before = await counts();
    // The commit is refused naming the field; the preview lists the same problem on its row and column, or is refused the same way.
    await expectRefusedFile(engineer, IMPORT, readFileSync(join(FIXTURES, file)), file, key, message);
    expect(await counts()).toEqual(before);
  });

  it('refuses a file over the size limit with 413 (generated, 2 MB + 1 byte)', async () => {
    const before = await counts();
    const big = Buffer.alloc(2 * 1024 * 1024 + 1, 'a');
    const res = await upload(engineer, 'commit', big);
    expect(res.status).toBe(413);
    expect(res.body.error.fields.file).toMatch(/Larger than 2 MB/);
    expect(await counts()).toEqual(before);
  });

  it('refuses more than 10,000 rows (generated)', async () => {
    const before = await counts();
    const rows = Array.from({ length: 10_001 }, (_, i) => `R${i},ferrite,W/m3-Hz-T,3,1.4,2.6,1,2,0,1,,,,,,0.5,0.4,2000,,,4800,x`);
    const res = await upload(engineer, 'commit', `${HEADER}\n${rows.join('\n')}\n`);
    expect(res.status).toBe(400);
    expect(res.body.error.fields.file).toMatch(/more than 10000 material rows/);
    expect(await counts()).toEqual(before);
  });

  it('refuses a record longer than the record size limit (generated)', async () => {
    const res = await upload(engineer, 'commit', `${HEADER}\n${csvRow('Long', { provenance: `"${'x'.repeat(9000)}"` })}\n`);
    expect(res.status).toBe(400);
    expect(res.body.error.fields.file).toMatch(/longer than 8192 characters/);
  });

  it('refuses two files and a missing file', async () => {
    const none = await engineer.agent
      .post(`${IMPORT}/preview`)
      .set('X-XSRF-TOKEN', engineer.csrfToken ?? '')
      .field('x', '1');
    expect(none.status).toBe(400);
    expect(none.body.error.fields.file).toMatch(/Choose a CSV file/);
    const two = await engineer.agent
      .post(`${IMPORT}/preview`)
      .set('X-XSRF-TOKEN', engineer.csrfToken ?? '')
      .attach('file', Buffer.from('a,b\n'), 'a.csv')
      .attach('file', Buffer.from('a,b\n'), 'b.csv');
    expect(two.status).toBe(400);
  });
});

describe('valid uploads', () => {
  it('imports a BOM + CRLF file with quoted commas, then asks for a decision on existing names', async () => {
    const text = `\uFEFF${HEADER}\r\n${csvRow('"Lab ferrite, 2026 fit"', { provenance: '"our lab, 2026 fit"' })}\r\n${csvRow('Lab ferrite two', { unit_set: 'mW/cm3-kHz-mT', k: '0.0032', f_min: '50', f_max: '300', b_min: '20', b_max: '250', bsat_25: '500', bsat_100: '400' })}\r\n`;
    const preview = await upload(engineer, 'preview', text, 'lab.csv');
    expect(preview.status).toBe(200);
    expect(preview.body.summary).toEqual({ rows: 2, new: 2, exists: 0, errors: 0 });
    expect(preview.body.rows[0]).toMatchObject({ row: 2, name: 'Lab ferrite, 2026 fit', status: 'new', problems: [] });

    const commit = await upload(engineer, 'commit', text, 'lab.csv');
    expect(commit.status).toBe(201);
    expect(commit.body).toMatchObject({ created: 2, versioned: 0, skipped: 0 });

    const again = await upload(engineer, 'preview', text, 'lab.csv');
    expect(again.body.summary).toMatchObject({ exists: 2 });
    const before = await counts();
    const undecided = await upload(engineer, 'commit', text, 'lab.csv', {});
    expect(undecided.status).toBe(400);
    expect(undecided.body.error.fields['row 2.name']).toMatch(/new-version.*skip/);
    expect(await counts()).toEqual(before);

    const decided = await upload(engineer, 'commit', text, 'lab.csv', {
      'Lab ferrite, 2026 fit': 'new-version',
      'lab ferrite two': 'skip',
    });
    expect(decided.status).toBe(201);
    expect(decided.body).toMatchObject({ created: 0, versioned: 1, skipped: 1 });
    const [id] = decided.body.materialIds as number[];
    const history = await engineer.get(`/api/materials/${id}/history`);
    expect(history.body.versions.map((v: { version: number; current: boolean }) => [v.version, v.current])).toEqual([
      [2, true],
      [1, false],
    ]);

    const imports = await engineer.get('/api/materials/imports');
    expect(imports.body.imports[0]).toMatchObject({ fileName: 'lab.csv', rowCount: 2, versionedCount: 1, skippedCount: 1 });
    expect(imports.body.imports[0].uploadedBy).toBeTruthy();
  });

  it('converts mW/cm³–kHz–mT to SI on import (unit change in Pv = k·f^α·B̂^β, computed)', async () => {
    const res = await engineer.get('/api/materials/library');
    const two = res.body.materials.find((m: { name: string }) => m.name === 'Lab ferrite two');
    // Computed from the unit change in Pv = k·f^α·B̂^β (1 mW/cm³ = 10³ W/m³, 1 kHz = 10³ Hz, 1 mT = 10⁻³ T): k_SI = k′·10^(3·(1 − α + β)) = 0.0032·10^(3·2.2) = 0.0032·3 981 071.7 = 12 739.4 W/m³ (Hz, T), by hand
    expect(two.k).toBeCloseTo(12739.43, 1);
    expect(two.kUploaded).toBe(0.0032);
    expect(two.unitSet).toBe('mW/cm3-kHz-mT');
    // 50 kHz = 50 000 Hz, 250 mT = 0.25 T, 500 mT = 0.5 T (SI prefixes)
    expect(two.fitFrequencyMin).toBeCloseTo(50000, 6);
    expect(two.fitFluxMax).toBeCloseTo(0.25, 12);
    expect(two.bsat25).toBeCloseTo(0.5, 12);
  });

  it('serves the template, which imports cleanly', async () => {
    const template = await engineer.get('/api/materials/template.csv');
    expect(template.status).toBe(200);
    expect(template.headers['content-type']).toMatch(/text\/csv/);
    expect(template.text.split('\n')[0]).toBe(HEADER);
    const preview = await upload(engineer, 'preview', template.text, 'template.csv');
    expect(preview.body.summary).toEqual({ rows: 2, new: 2, exists: 0, errors: 0 });
  });

  it('round-trips export → import with the same SI values', async () => {
    const library = (await engineer.get('/api/materials/library')).body.materials as Record<string, unknown>[];
    const exported = await engineer.get('/api/materials/export.csv');
    expect(exported.status).toBe(200);
    // Give every exported row a new name (quoted names keep their quotes) so the copy imports as new materials.
    const renamed = exported.text
      .split('\n')
      .map((line, i) => (i === 0 || !line ? line : line.startsWith('"') ? `"RT ${line.slice(1)}` : `RT ${line}`))
      .join('\n');
    const commit = await upload(engineer, 'commit', renamed, 'roundtrip.csv');
    expect(commit.status, JSON.stringify(commit.body)).toBe(201);
    const after = (await engineer.get('/api/materials/library')).body.materials as Record<string, number | string>[];
    for (const original of library) {
      const copy = after.find((m) => m['name'] === `RT ${String(original['name'])}`);
      expect(copy, String(original['name'])).toBeDefined();
      for (const key of [
        'k',
        'kUploaded',
        'alpha',
        'beta',
        'fitFrequencyMin',
        'fitFrequencyMax',
        'fitFluxMin',
        'fitFluxMax',
        'bsat25',
        'bsat100',
        'permeability',
        'density',
      ]) {
        const a = original[key] as number;
        const b = copy![key] as number;
        expect(Math.abs(a - b) / Math.abs(a || 1), `${String(original['name'])} ${key}`).toBeLessThan(1e-12);
      }
      expect(copy!['unitSet']).toBe(original['unitSet']);
      expect(copy!['tempCoefficients']).toEqual(original['tempCoefficients']);
      expect(copy!['rollOff']).toEqual(original['rollOff']);
      expect(copy!['temperatureBehaviour']).toEqual(original['temperatureBehaviour']);
      expect(copy!['rollOffCurve']).toEqual(original['rollOffCurve']);
    }
  });

  it('escapes formula-like cells on export', async () => {
    const list = (await engineer.get('/api/materials/library')).body.materials as { id: number; name: string }[];
    const target = list.find((m) => m.name === 'Lab ferrite two')!;
    const edited = await engineer.patch(`/api/materials/${target.id}`, {
      provenance: 'note: =1+1 inside is fine',
      lowest_loss_temperature: '-10',
      lowest_loss_factor: '1',
      loss_curvature: '0.0001',
    });
    expect(edited.status).toBe(201);
    const csv = await engineer.get(`/api/materials/export.csv?ids=${edited.body.id}`);
    // The negative number starts with "-", so the export prefixes it with an apostrophe.
    expect(csv.text).toContain(",'-10,");
    const reimport = await upload(engineer, 'preview', csv.text.replace('Lab ferrite two', 'Lab ferrite three'));
    expect(reimport.body.summary).toMatchObject({ new: 1, errors: 0 });
  });
});

describe('files in the previous format version (ct0, ct1, ct2; rolloff_a, rolloff_b, rolloff_c)', () => {
  // Invented rows. 1e-4·T² − 0.018·T + 1.43 has its minimum 0.62 at 90 °C; 1/(1.25 + 2e-7·H^1.6) is the curve
  // 0.8/(1 + (H/H½)^1.6) with H½ = (1.25/2e-7)^(1/1.6) (algebra, no source).
  const OLD_HEADER =
    'name,family,unit_set,k,alpha,beta,f_min,f_max,b_min,b_max,ct0,ct1,ct2,t_ref,bsat_25,bsat_100,mu_i,rolloff_a,rolloff_b,rolloff_c,density,provenance';
  const OLD_FILE = [
    OLD_HEADER,
    'Old ferrite (invented),ferrite,W/m3-Hz-T,3.2,1.4,2.6,50000,300000,0.02,0.25,1.43,0.018,0.0001,90,0.5,0.4,2300,,,,4800,Invented old row',
    'Old powder (invented),powder,W/m3-Hz-T,60,1.3,2.2,10000,500000,0.005,0.4,,,,,1,0.95,60,1.25,2e-7,1.6,7000,Invented old row',
  ].join('\n');

  it('converts each row to the named parameters, says so in a notice per row, and stores the new form', async () => {
    const preview = await upload(engineer, 'preview', OLD_FILE, 'old.csv');
    expect(preview.status).toBe(200);
    expect(preview.body.summary).toEqual({ rows: 2, new: 2, exists: 0, errors: 0 });
    const [ferrite, powder] = preview.body.rows as { notices: { column: string; message: string }[] }[];
    expect(ferrite!.notices).toEqual([
      {
        column: 'ct0',
        message:
          'old columns ct0, ct1, ct2 converted to lowest-loss temperature 90 °C, factor 0.62, curvature 1.0e-4 /K²; ' +
          'this old format is read until the next format version',
      },
    ]);
    expect(powder!.notices[0]!.message).toMatch(
      /rolloff_a = 1\.25 is not 1, so mu_i is multiplied by 1\/a = 0\.8 to keep the curve exactly/,
    );

    const commit = await upload(engineer, 'commit', OLD_FILE, 'old.csv');
    expect(commit.status, JSON.stringify(commit.body)).toBe(201);
    const library = (await engineer.get('/api/materials/library')).body.materials as Record<string, unknown>[];
    const stored = library.find((m) => m['name'] === 'Old ferrite (invented)')!;
    const b = stored['temperatureBehaviour'] as { lowestLossTemperature: number; lowestLossFactor: number; curvature: number };
    expect(b.lowestLossTemperature).toBeCloseTo(90, 9);
    expect(b.lowestLossFactor).toBeCloseTo(0.62, 12);
    expect(b.curvature).toBe(1e-4);
    expect(Object.keys(stored['cells'] as object)).not.toContain('ct0');
    // The engine sees the old quadratic referred to t_ref = 90 °C: divided by 0.62 (algebra, no source).
    const q = stored['tempCoefficients'] as { ct0: number; ct1: number; ct2: number };
    expect(q.ct0).toBeCloseTo(1.43 / 0.62, 10);
    expect(q.ct1).toBeCloseTo(0.018 / 0.62, 12);
    const powderStored = library.find((m) => m['name'] === 'Old powder (invented)')!;
    expect(powderStored['permeability']).toBeCloseTo(48, 12);
    const curve = powderStored['rollOffCurve'] as { halfField: number; steepness: number };
    expect(curve.halfField).toBeCloseTo((1.25 / 2e-7) ** (1 / 1.6), 6);
    expect(curve.steepness).toBe(1.6);
    // The engine's constants are a = 1, b = H½^−n: μi′·μ% = 48/(1 + (1.25/2e-7)^−1·H^1.6) = 60/(1.25 + 2e-7·H^1.6).
    const rollOff = powderStored['rollOff'] as { a: number; b: number; c: number };
    expect(rollOff.a).toBe(1);
    expect(rollOff.b).toBeCloseTo(2e-7 / 1.25, 18);
  });

  it('refuses a row whose old quadratic opens downwards, naming ct2 and what to give instead', async () => {
    const text = `${OLD_HEADER}\nOld falling (invented),ferrite,W/m3-Hz-T,3.2,1.4,2.6,50000,300000,0.02,0.25,1,0,-0.0001,,0.5,0.4,2300,,,,4800,x\n`;
    const preview = await upload(engineer, 'preview', text, 'old.csv');
    const problems = (preview.body.rows[0] as { problems: { column: string; message: string }[] }).problems;
    expect(problems.map((p) => p.column)).toEqual(['ct2']);
    expect(problems[0]!.message).toMatch(/opens? downwards.*give lowest_loss_temperature \(°C\), lowest_loss_factor/);
  });
});

interface Listed {
  id: number;
  canEdit: boolean;
  canRetire: boolean;
  canRestore: boolean;
}

describe('editing, retiring and roles', () => {
  it('an edit makes a new version and keeps the old row', async () => {
    const list = (await engineer.get('/api/materials/library')).body.materials as { id: number; name: string; version: number }[];
    const demo = list.find((m) => m.name.startsWith('Demo ferrite Amber'))!;
    const res = await engineer.patch(`/api/materials/${demo.id}`, { alpha: 1.45 });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ version: demo.version + 1, alpha: 1.45, current: true });
    expect(res.body.id).not.toBe(demo.id);
    const old = await engineer.patch(`/api/materials/${demo.id}`, { alpha: 1.5 });
    expect(old.status).toBe(409);
    const bad = await engineer.patch(`/api/materials/${res.body.id}`, { beta: 9 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.beta).toMatch(/between 1.5 and 4/);
  });

  it('winders may not upload or edit; engineers may not retire; reviewers may', async () => {
    const before = await counts();
    const template = (await engineer.get('/api/materials/template.csv')).text;
    expect((await upload(winder, 'preview', template)).status).toBe(403);
    expect((await upload(winder, 'commit', template)).status).toBe(403);
    const list = (await engineer.get('/api/materials/library')).body.materials as { id: number; name: string }[];
    expect((await winder.patch(`/api/materials/${list[0]!.id}`, { alpha: 1.3 })).status).toBe(403);
    expect((await engineer.post(`/api/materials/${list[0]!.id}/retire`)).status).toBe(403);
    expect(await counts()).toEqual(before);
    const reviewer = await signedInAs(t.app, 'reviewer');
    const retired = await reviewer.post(`/api/materials/${list[0]!.id}/retire`);
    expect(retired.status).toBe(200);
    expect(retired.body.retired).toBe(true);
    const search = (await engineer.get('/api/materials')).body.materials as { id: string }[];
    expect(search.map((m) => m.id)).not.toContain(String(list[0]!.id));
    expect((await reviewer.post(`/api/materials/${list[0]!.id}/unretire`)).body.retired).toBe(false);
  });

  it('states what each user may do with each material', async () => {
    const flags = (m: Listed) => [m.canEdit, m.canRetire, m.canRestore];
    const library = async (client: ApiClient) =>
      (await client.get('/api/materials/library')).body as { materials: Listed[]; canImport: boolean };
    const reviewer = await signedInAs(t.app, 'reviewer');
    const [forWinder, forEngineer, forReviewer] = await Promise.all([library(winder), library(engineer), library(reviewer)]);
    expect([forWinder.canImport, forEngineer.canImport, forReviewer.canImport]).toEqual([false, true, true]);
    const id = forEngineer.materials[0]!.id;
    const of = (answer: { materials: Listed[] }) => flags(answer.materials.find((m) => m.id === id)!);
    expect([of(forWinder), of(forEngineer), of(forReviewer)]).toEqual([
      [false, false, false],
      [true, false, false],
      [true, true, false],
    ]);
    const retired = await reviewer.post(`/api/materials/${id}/retire`);
    expect(flags(retired.body)).toEqual([true, false, true]);
    expect(of(await library(engineer))).toEqual([true, false, false]);
    expect(flags((await reviewer.post(`/api/materials/${id}/unretire`)).body)).toEqual([true, true, false]);
  });

  it('anonymous users are refused', async () => {
    const anonymous = await signedInAs(t.app, 'anonymous');
    expect((await anonymous.get('/api/materials/library')).status).toBe(401);
  });
});
