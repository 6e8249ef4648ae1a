import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { LOSS_POINT_CSV_COLUMNS } from '@shared/schemas/loss-point-csv';
import { signedInAs, type ApiClient } from './support/api-client.ts';
import { tableCounts, uploadCsv } from './support/csv-import.ts';
import { createTestApp, type TestApp } from './support/test-app.ts';

const FIXTURES = join(import.meta.dirname, '../fixtures/csv/loss-points');
const TABLES = ['materials', 'material_loss_points', 'material_imports', 'audit_log', 'designs', 'users'];

let t: TestApp;
let engineer: ApiClient;
let winder: ApiClient;
/** A current demo ferrite stored in SI units (W/m3-Hz-T), the version the tests attach points to. */
let materialId: number;
beforeAll(async () => {
  t = await createTestApp();
  engineer = await signedInAs(t.app, 'engineer');
  winder = await signedInAs(t.app, 'winder');
  const library = await engineer.get('/api/materials/library');
  const ferrite = (library.body.materials as { id: string; family: string; unitSet: string }[]).find(
    (m) => m.family === 'ferrite' && m.unitSet === 'W/m3-Hz-T',
  );
  materialId = Number(ferrite!.id);
});
afterAll(() => t.close());

const counts = () => tableCounts(t.db, TABLES);
const url = (id: number, step: 'preview' | 'commit') => `/api/materials/${id}/loss-points/${step}`;
const relative = (actual: number, expected: number) => Math.abs(actual / expected - 1);

interface Problem {
  column: string;
  message: string;
}
interface PreviewRow {
  row: number;
  status: string;
  problems: Problem[];
}

// [file, the field that must be named ("file", "header.x" or "row N.column"), what its message must say, readable?]
const HOSTILE: [string, string, RegExp][] = [
  ['wrong-unit-header.csv', 'header.frequency_hz', /Wrong unit: this format takes frequency_khz \(kHz\)/],
  ['nan-loss.csv', 'row 3.loss_kw_per_m3', /"NaN" is not a number/],
  ['negative-loss.csv', 'row 2.loss_kw_per_m3', /must be greater than 0 \(got -120\)/],
  ['zero-loss.csv', 'row 4.loss_kw_per_m3', /must be greater than 0 \(got 0\)/],
  ['duplicate-points.csv', 'row 5.(row)', /\(100, 100, 25\) already appears in row 2/],
  ['one-point.csv', 'file', /has 1 point; a fit needs at least 3/],
  ['one-frequency.csv', 'file', /one frequency/],
  ['one-flux.csv', 'file', /one peak flux/],
  ['empty.csv', 'file', /empty/],
  ['header-only.csv', 'file', /No loss point rows/],
  ['formula-injection.csv', 'row 3.source', /formula/],
  ['too-many-rows.csv', 'file', /more than 10000 loss point rows/],
  ['latin1.csv', 'file', /UTF-8/],
  ['extra-column.csv', 'header.colour', /Unknown column "colour"/],
  ['missing-column.csv', 'header.temperature_c', /Missing column "temperature_c"/],
  ['temperature-out-of-range.csv', 'row 3.temperature_c', /between -60 and 250 \(got 300\)/],
  ['frequency-out-of-range.csv', 'row 4.frequency_khz', /between 0.01 and 100000 \(got 500000\)/],
  ['semicolon-delimiter.csv', 'header', /comma/],
  ['non-numeric-frequency.csv', 'row 3.frequency_khz', /"fast" is not a number/],
  ['negative-dc-bias.csv', 'row 2.dc_bias_a_per_m', /between 0 and 1000000 \(got -5\)/],
  ['ragged-row.csv', 'row 3.(row)', /has 4 cells; the header has 6/],
];

/** The preview names the problem at its row and column (or as a file problem), or refuses the file naming the same field. */
function expectPreviewNames(res: { status: number; body: Record<string, unknown> }, key: string, message: RegExp) {
  if (res.status !== 200) {
    expect(res.status).toBe(400);
    expect((res.body['error'] as { fields: Record<string, string> }).fields[key]).toMatch(message);
    return;
  }
  if (key === 'file') {
    expect((res.body['fileProblems'] as Problem[]).some((p) => message.test(p.message))).toBe(true);
    return;
  }
  const [, row, column] = /^row (\d+)\.(.+)$/.exec(key)!;
  const listed = (res.body['rows'] as PreviewRow[]).find((r) => r.row === Number(row))!;
  expect(listed.status).toBe('error');
  expect(listed.problems.find((p) => p.column === column)?.message).toMatch(message);
}

describe('hostile and broken loss-point files', () => {
  it('has at least 15 hostile files in the corpus, each listed here', () => {
    const files = readdirSync(FIXTURES).filter((f) => f !== 'bom-crlf.csv');
    expect(files.length).toBeGreaterThanOrEqual(15);
    expect(files.sort()).toEqual(HOSTILE.map(([file]) => file).sort());
  });

  it.each(HOSTILE)('%s: refused naming %s, every table unchanged', async (file, key, message) => {
    const before = await counts();
    const content = readFileSync(join(FIXTURES, file));
    const commit = await uploadCsv(engineer, url(materialId, 'commit'), content, file);
    expect(commit.status).toBe(400);
    expect(commit.body.error.fields[key]).toMatch(message);
    expectPreviewNames(await uploadCsv(engineer, url(materialId, 'preview'), content, file), key, message);
    expect(await counts()).toEqual(before);
  });

  it('lists every problem of a row and of the file at once', async () => {
    const csv = `${LOSS_POINT_CSV_COLUMNS.join(',')}\nabc,0,400,-1,-2,=cmd\n100,100,25,120,,ok\n`;
    const preview = await uploadCsv(engineer, url(materialId, 'preview'), csv, 'many.csv');
    expect(preview.status).toBe(200);
    const columns = (preview.body.rows[0] as PreviewRow).problems.map((p) => p.column).sort();
    expect(columns).toEqual([...LOSS_POINT_CSV_COLUMNS].sort());
    expect(preview.body.fileProblems[0].message).toMatch(/1 valid of 2 points/);
    expect(preview.body.summary).toMatchObject({ rows: 2, valid: 1, errors: 1 });
  });

  it('refuses a winder (no upload permission) and an unknown material, writing nothing', async () => {
    const before = await counts();
    const content = readFileSync(join(FIXTURES, '../loss-points/bom-crlf.csv'));
    expect((await uploadCsv(winder, url(materialId, 'commit'), content, 'x.csv')).status).toBe(403);
    expect((await uploadCsv(engineer, url(999_999, 'commit'), content, 'x.csv')).status).toBe(404);
    expect((await uploadCsv(engineer, url(999_999, 'preview'), content, 'x.csv')).status).toBe(404);
    const { audit_log: _a, ...after } = await counts();
    const { audit_log: _b, ...earlier } = before;
    expect(after).toEqual(earlier);
  });
});

describe('a valid loss-point file', () => {
  it('accepts BOM + CRLF, and the commit makes a new version carrying the points (the earlier one keeps none)', async () => {
    const content = readFileSync(join(FIXTURES, 'bom-crlf.csv'));
    const preview = await uploadCsv(engineer, url(materialId, 'preview'), content, 'bom-crlf.csv');
    expect(preview.status).toBe(200);
    expect(preview.body.summary).toMatchObject({ rows: 9, valid: 9, errors: 0, frequencies: 3, fluxes: 3, temperatures: 1 });
    expect(preview.body.summary.frequencyRange).toEqual([50e3, 200e3]);
    expect(preview.body.fileProblems).toEqual([]);

    const before = await counts();
    const commit = await uploadCsv(engineer, url(materialId, 'commit'), content, 'bom-crlf.csv');
    expect(commit.status).toBe(201);
    expect(commit.body.pointCount).toBe(9);
    const after = await counts();
    expect(after['materials']).toBe(before['materials']! + 1);
    expect(after['material_loss_points']).toBe(before['material_loss_points']! + 9);

    const points = await engineer.get(`/api/materials/${commit.body.materialId}/loss-points`);
    const named = (await engineer.get('/api/materials/library')).body.materials.find(
      (m: { id: string }) => m.id === String(commit.body.materialId),
    );
    expect(points.body).toMatchObject({ current: true, canEdit: true, version: commit.body.version, name: named.name });
    // 50 kHz = 5e4 Hz, 50 mT = 0.05 T (SI prefixes)
    expect(points.body.points[0]).toMatchObject({ frequency: 50e3, peakFlux: 0.05, temperature: 25, source: 'invented bench read-off' });
    const earlier = await engineer.get(`/api/materials/${materialId}/loss-points`);
    expect(earlier.body).toMatchObject({ current: false, canEdit: false, points: [] });

    // Only the current version takes points.
    const stale = await uploadCsv(engineer, url(materialId, 'commit'), content, 'bom-crlf.csv');
    expect(stale.status).toBe(409);
    materialId = commit.body.materialId as number;
  });

  it('serves a template that previews without problems', async () => {
    const template = await engineer.get('/api/materials/loss-points/template.csv');
    expect(template.status).toBe(200);
    expect(template.text.split('\n')[0]).toBe(LOSS_POINT_CSV_COLUMNS.join(','));
    const preview = await uploadCsv(engineer, url(materialId, 'preview'), template.text, 'template.csv');
    expect(preview.body.summary).toMatchObject({ rows: 27, valid: 27, errors: 0, temperatures: 3 });
  });
});

// Invented coefficients (no material's data): Pv = k·f^α·B̂^β·F(T), F(T) = 1 + c·(T − T0)², so k holds at T0.
const K = 4.5;
const ALPHA = 1.35;
const BETA = 2.7;
const T0 = 85;
const CURVATURE = 1.2e-4;
const FREQUENCIES_KHZ = [25, 50, 100, 200, 400];
const FLUXES_MT = [25, 50, 100, 200];
const TEMPERATURES = [25, 60, 85, 100, 120];

function generatedCsv(): string {
  const lines = [LOSS_POINT_CSV_COLUMNS.join(',')];
  for (const temperature of TEMPERATURES) {
    for (const kHz of FREQUENCIES_KHZ) {
      for (const mT of FLUXES_MT) {
        const loss = K * (kHz * 1e3) ** ALPHA * (mT * 1e-3) ** BETA * (1 + CURVATURE * (temperature - T0) ** 2);
        lines.push(`${kHz},${mT},${temperature},${loss / 1e3},,generated from invented coefficients`);
      }
    }
  }
  return `${lines.join('\n')}\n`;
}
const POINTS = FREQUENCIES_KHZ.length * FLUXES_MT.length * TEMPERATURES.length;
// The buck example of tests/api/calc.test.ts (100 kHz lies inside the fitted 25–400 kHz).
const EXAMPLE_SPEC = { vinMin: 24, vinMax: 36, vout: 12, ioutMax: 10, frequency: 100e3, rippleRatio: 0.3 };

describe('fitting the points and accepting the fit', () => {
  it('refuses fits the points cannot give, with 400 naming the field', async () => {
    const none = await engineer.post('/api/materials/1/fit', {});
    expect(none.status).toBe(400);
    expect(none.body.error.fields.points).toMatch(/at least 3 points, got 0/);
    // The BOM + CRLF points are all at 25 °C: no temperature behaviour, but a fit at that temperature.
    const oneTemperature = await engineer.post(`/api/materials/${materialId}/fit`, { temperature: true });
    expect(oneTemperature.status).toBe(400);
    expect(oneTemperature.body.error.fields.temperature).toMatch(/3 or more temperatures/);
    const at = await engineer.post(`/api/materials/${materialId}/fit`, { temperature: false });
    expect(at.status).toBe(200);
    // Generated from 3.2·f^1.4·B̂^2.6 (the template's invented coefficients): recovered to rounding.
    expect(relative(at.body.fits[0].alpha, 1.4)).toBeLessThan(1e-9);
    const bad = await engineer.post(`/api/materials/${materialId}/fit`, { mode: 'bands', maxWorstError: 'x', extra: 1 });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(expect.arrayContaining(['maxWorstError']));
    expect((await winder.post(`/api/materials/${materialId}/fit`, {})).status).toBe(403);
  });

  it('recovers invented coefficients from generated points, and the accepted version carries them', async () => {
    const commit = await uploadCsv(engineer, url(materialId, 'commit'), generatedCsv(), 'generated.csv');
    expect(commit.status).toBe(201);
    const id = commit.body.materialId as number;

    const fit = await engineer.post(`/api/materials/${id}/fit`, { mode: 'whole', temperature: true });
    expect(fit.status).toBe(200);
    const [whole] = fit.body.fits;
    // Exact data from the model itself (log-linear least squares reproduces it; no outside value involved).
    expect(relative(whole.k, K)).toBeLessThan(1e-6);
    expect(relative(whole.alpha, ALPHA)).toBeLessThan(1e-6);
    expect(relative(whole.beta, BETA)).toBeLessThan(1e-6);
    expect(whole.fittedFrequency).toEqual([25e3, 400e3]);
    expect(whole.fittedFlux).toEqual([0.025, 0.2]);
    expect(whole.pointCount).toBe(POINTS);
    expect(whole.worstRelativeError).toBeLessThan(1e-9);
    const temperature = fit.body.temperature;
    expect(relative(temperature.lowestLossTemperature, T0)).toBeLessThan(1e-6);
    expect(temperature.lowestLossFactor).toBe(1);
    expect(relative(temperature.curvature, CURVATURE)).toBeLessThan(1e-6);
    expect(fit.body.residuals).toHaveLength(POINTS);
    expect(Math.max(...fit.body.residuals.map((r: { relativeError: number }) => Math.abs(r.relativeError)))).toBeLessThan(1e-9);
    expect(fit.body.curves).toHaveLength(FREQUENCIES_KHZ.length * TEMPERATURES.length);
    expect(fit.body.curves[0].samples[0].peakFlux).toBe(0.025);

    const tooFew = await engineer.post(`/api/materials/${id}/fit`, { temperature: false });
    expect(tooFew.status).toBe(400);
    expect(tooFew.body.error.fields.atTemperature).toMatch(/5 temperatures/);
    const atT0 = await engineer.post(`/api/materials/${id}/fit`, { temperature: false, atTemperature: 85 });
    expect(atT0.body.pointCount).toBe(FREQUENCIES_KHZ.length * FLUXES_MT.length);
    expect(relative(atT0.body.fits[0].k, K)).toBeLessThan(1e-6);

    const before = await counts();
    const accepted = await engineer.post(`/api/materials/${id}/fit/accept`, { mode: 'whole', temperature: true });
    expect(accepted.status).toBe(201);
    const material = accepted.body.material;
    expect(material.version).toBe(commit.body.version + 1);
    expect(relative(material.k, K)).toBeLessThan(1e-6);
    expect(relative(material.alpha, ALPHA)).toBeLessThan(1e-6);
    expect(relative(material.beta, BETA)).toBeLessThan(1e-6);
    expect(relative(material.referenceTemperature, T0)).toBeLessThan(1e-6);
    // The engine's quadratic of 1 + c·(T − T0)²: ct2 = c, ct1 = 2·c·T0, ct0 = 1 + c·T0² (expanded by hand).
    expect(relative(material.tempCoefficients.ct2, CURVATURE)).toBeLessThan(1e-6);
    expect(relative(material.tempCoefficients.ct1, 2 * CURVATURE * T0)).toBeLessThan(1e-6);
    expect(relative(material.tempCoefficients.ct0, 1 + CURVATURE * T0 * T0)).toBeLessThan(1e-6);
    expect([material.fitFrequencyMin, material.fitFrequencyMax, material.fitFluxMin, material.fitFluxMax]).toEqual([
      25e3, 400e3, 0.025, 0.2,
    ]);
    const after = await counts();
    expect(after['materials']).toBe(before['materials']! + 1);
    expect(after['material_loss_points']).toBe(before['material_loss_points']! + POINTS);
    const kept = await engineer.get(`/api/materials/${material.id}/loss-points`);
    expect(kept.body.points).toHaveLength(POINTS);
    const { rows } = await t.pool.query("select details from audit_log where action = 'material.fit-accepted'");
    expect(rows[0].details).toMatchObject({ id: Number(material.id), from: id, points: POINTS });
    expect((await engineer.post(`/api/materials/${id}/fit/accept`, {})).status).toBe(409);
    materialId = Number(material.id);

    const search = await engineer.post('/api/calc/search', { spec: EXAMPLE_SPEC, materialIds: [material.id], limit: 3 });
    expect(search.status).toBe(200);
    expect(search.body.candidates.length).toBeGreaterThan(0);
    expect(search.body.candidates[0].result.material.id).toBe(material.id);
  });
});

describe('bands and later versions', () => {
  // Invented two-regime data at 25 °C: α = 1.2 up to 100 kHz, 1.8 above (continuous there), β = 2.5 throughout.
  function twoRegimeCsv(): string {
    const lines = [LOSS_POINT_CSV_COLUMNS.join(',')];
    for (const kHz of [20, 40, 70, 100, 150, 250, 400]) {
      for (const mT of [30, 60, 120]) {
        const f = kHz * 1e3;
        const loss = 2 * (f <= 1e5 ? f ** 1.2 : 1e5 ** 1.2 * (f / 1e5) ** 1.8) * (mT * 1e-3) ** 2.5;
        lines.push(`${kHz},${mT},25,${loss / 1e3},,two-regime invented data`);
      }
    }
    return `${lines.join('\n')}\n`;
  }

  it('fits bands that meet the target, and accepting one needs its index', async () => {
    const commit = await uploadCsv(engineer, url(materialId, 'commit'), twoRegimeCsv(), 'bands.csv');
    expect(commit.status).toBe(201);
    const id = commit.body.materialId as number;
    materialId = id;
    const options = { mode: 'bands', maxWorstError: 0.01, temperature: false };
    const fit = await engineer.post(`/api/materials/${id}/fit`, options);
    expect(fit.status).toBe(200);
    const bands = fit.body.fits as { fittedFrequency: [number, number]; meetsTarget: boolean; alpha: number }[];
    expect(bands.length).toBeGreaterThanOrEqual(2);
    for (const band of bands) expect(band.meetsTarget).toBe(true);
    // Neighbouring bands share their edge frequency (the split frequency goes to both).
    for (let i = 1; i < bands.length; i++) expect(bands[i]!.fittedFrequency[0]).toBe(bands[i - 1]!.fittedFrequency[1]);
    expect(relative(bands[0]!.alpha, 1.2)).toBeLessThan(1e-6);
    expect(relative(bands.at(-1)!.alpha, 1.8)).toBeLessThan(1e-6);

    const undecided = await engineer.post(`/api/materials/${id}/fit/accept`, options);
    expect(undecided.status).toBe(400);
    expect(undecided.body.error.fields.band).toMatch(/Choose a band from 0 to/);
    const last = bands.length - 1;
    const accepted = await engineer.post(`/api/materials/${id}/fit/accept`, { ...options, band: last });
    expect(accepted.status).toBe(201);
    expect([accepted.body.material.fitFrequencyMin, accepted.body.material.fitFrequencyMax]).toEqual(bands[last]!.fittedFrequency);
    // Without a temperature fit, k holds at the points' temperature.
    expect(accepted.body.material.referenceTemperature).toBe(25);
    materialId = Number(accepted.body.material.id);
  });

  it('an edit of the material keeps its points on the new version', async () => {
    const before = (await engineer.get(`/api/materials/${materialId}/loss-points`)).body.points;
    const edited = await engineer.patch(`/api/materials/${materialId}`, { provenance: 'Invented, edited after the fit' });
    expect(edited.status).toBe(201);
    const after = await engineer.get(`/api/materials/${edited.body.id}/loss-points`);
    expect(after.body.points).toEqual(before);
    expect(before.length).toBe(21);
    materialId = Number(edited.body.id);
  });

  it('a material file uploaded again as a new version keeps the points too', async () => {
    const exported = await engineer.get(`/api/materials/export.csv?ids=${materialId}`);
    const name = (await engineer.get(`/api/materials/${materialId}/history`)).body.versions[0].name as string;
    const commit = await uploadCsv(engineer, '/api/materials/import/commit', exported.text, 'again.csv', { [name]: 'new-version' });
    expect(commit.status).toBe(201);
    const [id] = commit.body.materialIds as number[];
    expect(id).not.toBe(materialId);
    const kept = await engineer.get(`/api/materials/${id}/loss-points`);
    expect(kept.body.points).toEqual((await engineer.get(`/api/materials/${materialId}/loss-points`)).body.points);
    expect(kept.body.points).toHaveLength(21);
  });
});
