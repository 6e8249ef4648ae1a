import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { LOSS_POINT_CSV_COLUMNS } from '@shared/schemas/loss-point-csv';
import type { LibraryMaterial } from '@shared/schemas/material-answers';
import { signedInAs, type ApiClient } from './support/api-client.ts';
import { uploadCsv } from './support/csv-import.ts';
import { createTestApp, type TestApp } from './support/test-app.ts';

// The library's loss-point figures: count, the stored coefficients' quality against the version's own points, and
// the temperature of lowest loss.
let t: TestApp;
let engineer: ApiClient;
/** A demo ferrite with a temperature behaviour, as the library lists it (engine coefficients in SI). */
let ferrite: LibraryMaterial;
beforeAll(async () => {
  t = await createTestApp();
  engineer = await signedInAs(t.app, 'engineer');
  const library = await engineer.get('/api/materials/library');
  ferrite = (library.body.materials as LibraryMaterial[]).find((m) => m.family === 'ferrite' && m.tempCoefficients)!;
});
afterAll(() => t.close());

const library = async () => (await engineer.get('/api/materials/library')).body.materials as LibraryMaterial[];
const commitUrl = (id: string) => `/api/materials/${id}/loss-points/commit`;

/**
 * A 3 × 3 × 3 grid of points at the material's own loss, k·f^α·B̂^β·(ct2·T² − ct1·T + ct0) — the Steinmetz form with
 * the parabolic temperature factor the library documents (common practice, no source) — with point `bumped` raised by
 * `factor`. Written in the file's units with 17 significant digits.
 */
function pointsCsv(m: LibraryMaterial, bumped = -1, factor = 1): string {
  const { ct0, ct1, ct2 } = m.tempCoefficients!;
  const lines = [LOSS_POINT_CSV_COLUMNS.join(',')];
  let n = 0;
  for (const kHz of [50, 100, 200])
    for (const mT of [50, 100, 150])
      for (const celsius of [25, 60, 100]) {
        const loss = m.k * (kHz * 1e3) ** m.alpha * (mT / 1e3) ** m.beta * (ct2 * celsius ** 2 - ct1 * celsius + ct0);
        lines.push(`${kHz},${mT},${celsius},${((loss * (n++ === bumped ? factor : 1)) / 1e3).toPrecision(17)},,test grid`);
      }
  return `${lines.join('\n')}\n`;
}

describe('GET /api/materials/library: loss-point figures per version', () => {
  it('gives a version without points no count and no quality, and its lowest-loss temperature', async () => {
    const listed = (await library()).find((m) => m.id === ferrite.id)!;
    expect(listed.lossPointCount).toBe(0);
    expect(listed.fitQuality).toBeNull();
    // The demo ferrites' parabola has its minimum at t_ref (server/seed/seed-demo.ts: invented data).
    expect(listed.lowestLossTemperature).toBeCloseTo(listed.referenceTemperature!, 9);
    // A powder without temperature coefficients has none.
    const powder = (await library()).find((m) => m.family === 'powder' && !m.tempCoefficients);
    expect(powder?.lowestLossTemperature).toBeNull();
  });

  it('meets points made from the material’s own coefficients exactly, and reports a point 10 % high', async () => {
    const exact = await uploadCsv(engineer, commitUrl(ferrite.id), pointsCsv(ferrite), 'own-grid.csv');
    expect(exact.status).toBe(201);
    const withPoints = (await library()).find((m) => m.id === String(exact.body.materialId))!;
    expect(withPoints.lossPointCount).toBe(27);
    expect(withPoints.fitQuality!.pointCount).toBe(27);
    expect(withPoints.fitQuality!.rmsRelativeError).toBeLessThan(1e-9);
    expect(withPoints.fitQuality!.worstRelativeError).toBeLessThan(1e-9);

    // Measured 1.1 × the model: the relative error (model − measured)/measured is 1/1.1 − 1 = −0.0909…
    // (shared/fitting/fit-quality.ts); the RMS over 27 points is that over √27 (arithmetic).
    const bumped = await uploadCsv(engineer, commitUrl(withPoints.id), pointsCsv(ferrite, 13, 1.1), 'one-high.csv');
    expect(bumped.status).toBe(201);
    const listed = (await library()).find((m) => m.id === String(bumped.body.materialId))!;
    expect(listed.lossPointCount).toBe(27);
    expect(listed.fitQuality!.worstRelativeError).toBeCloseTo(1 - 1 / 1.1, 9);
    expect(listed.fitQuality!.rmsRelativeError).toBeCloseTo((1 - 1 / 1.1) / Math.sqrt(27), 9);

    // History lists each version's own figures: the first had no points.
    const history = (await engineer.get(`/api/materials/${listed.id}/history`)).body.versions as LibraryMaterial[];
    expect(history.map((v) => v.lossPointCount)).toEqual([27, 27, 0]);
    expect(history[2]!.fitQuality).toBeNull();
  });

  it('gives an edited version the figures of the points it carries over', async () => {
    const current = (await library()).find((m) => m.lineage === ferrite.lineage)!;
    const res = await engineer.patch(`/api/materials/${current.id}`, { provenance: 'edited in a test' });
    expect(res.status).toBe(201);
    expect(res.body.lossPointCount).toBe(27);
    expect(res.body.fitQuality.worstRelativeError).toBeCloseTo(1 - 1 / 1.1, 9);
  });

  it('judges a version only on the points inside its fitted ranges, and says how many those are', async () => {
    const current = (await library()).find((m) => m.lineage === ferrite.lineage)!;
    // f_max 100 kHz (in the row's own unit set) leaves the 50 and 100 kHz points: 18 of 27, the bumped one among them.
    const fMax = current.unitSet === 'W/m3-Hz-T' ? 100e3 : 100;
    const narrowed = await engineer.patch(`/api/materials/${current.id}`, { f_max: fMax });
    expect(narrowed.status).toBe(201);
    expect(narrowed.body.lossPointCount).toBe(27);
    expect(narrowed.body.fitQuality.pointCount).toBe(18);
    expect(narrowed.body.fitQuality.worstRelativeError).toBeCloseTo(1 - 1 / 1.1, 9);
    expect(narrowed.body.fitQuality.rmsRelativeError).toBeCloseTo((1 - 1 / 1.1) / Math.sqrt(18), 9);
    // Above 200 kHz no point is left to judge by.
    const above = await engineer.patch(`/api/materials/${narrowed.body.id}`, {
      f_min: current.unitSet === 'W/m3-Hz-T' ? 250e3 : 250,
      f_max: current.unitSet === 'W/m3-Hz-T' ? 300e3 : 300,
    });
    expect(above.status).toBe(201);
    expect(above.body.fitQuality).toBeNull();
  });
});
