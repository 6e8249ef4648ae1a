import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import type { UploadedFile } from '../../../server/http/csv-upload.ts';
import { readLossPointFile } from '../../../server/loss-points/loss-point-csv.ts';
import { coreLossTemperatureFactor, steinmetzLoss } from '@shared/engine/core-loss';
import type { LossPoint } from '@shared/fitting/loss-points';
import { fitSteinmetz } from '@shared/fitting/steinmetz-fit';
import { behaviourFactor, fitTemperatureBehaviour, referToLowestLoss } from '@shared/fitting/temperature-fit';
import { fitMaterial } from '../../../server/loss-points/material-fit.ts';
import { noiseFactor, relative, seededUniform } from './support';

// An invented material (no real grade): k referred to its lowest-loss temperature 90 °C, curvature 1.2e-4 /K².
const truth = { k: 4.1, alpha: 1.38, beta: 2.55 };
const behaviour = { lowestLossTemperature: 90, lowestLossFactor: 1, curvature: 1.2e-4 };
const loss = (frequency: number, peakFlux: number, temperature: number): LossPoint => ({
  frequency,
  peakFlux,
  temperature,
  lossDensity: steinmetzLoss(truth, frequency, peakFlux) * behaviourFactor(behaviour, temperature),
  source: 'invented',
});

describe('worked example: Steinmetz at 25 °C, then the temperature sweep, then k referred to T0 (the three fits in turn)', () => {
  const at25 = [30e3, 100e3, 300e3].flatMap((f) => [0.03, 0.1, 0.2].map((b) => loss(f, b, 25)));
  const sweep = [25, 50, 75, 100, 125].map((t) => loss(100e3, 0.1, t));

  it('recovers the invented material exactly, and the engine reproduces every point', () => {
    const steinmetz = fitSteinmetz(at25);
    // Fitted at 25 °C, k carries that temperature's factor; the sweep is measured relative to it.
    const temperature = fitTemperatureBehaviour(sweep, steinmetz);
    const referred = referToLowestLoss(steinmetz.k, temperature.behaviour);
    expect(relative(referred.k, truth.k)).toBeLessThan(1e-9);
    expect(Math.abs(referred.behaviour.lowestLossTemperature - 90)).toBeLessThan(1e-9);
    expect(relative(referred.behaviour.curvature, 1.2e-4)).toBeLessThan(1e-9);
    for (const p of [...at25, ...sweep]) {
      const predicted = steinmetzLoss(steinmetz, p.frequency, p.peakFlux) * coreLossTemperatureFactor(temperature.quadratic, p.temperature);
      expect(relative(predicted, p.lossDensity)).toBeLessThan(1e-9);
    }
  });
});

/**
 * A second invented material whose frequency exponent rises from 1.3 below 200 kHz to 1.9 above it (as ferrite loss
 * steepens with frequency; common practice, no source), with a factor 1 + 1.5e-4·(T − 85)², points on a 5 × 4 × 3 grid
 * of frequency, flux and temperature, ±3 % seeded noise and four significant digits, as read off a curve. One
 * Steinmetz fit cannot follow the bend; two frequency bands can. The figures are quoted in the README.
 */
describe('worked example: a bend in α needs frequency bands', () => {
  const uniform = seededUniform(2026);
  const points: LossPoint[] = [50, 100, 200, 400, 800].flatMap((kHz) =>
    [25, 50, 100, 200].flatMap((mT) =>
      [25, 60, 100].map((temperature) => {
        const [frequency, peakFlux] = [kHz * 1e3, mT / 1e3];
        const exact =
          2.0 * frequency ** 1.3 * peakFlux ** 2.6 * Math.max(1, frequency / 200e3) ** 0.6 * (1 + 1.5e-4 * (temperature - 85) ** 2);
        const lossDensity = Number(((exact * noiseFactor(uniform, 0.03)) / 1000).toPrecision(4)) * 1000;
        return { frequency, peakFlux, temperature, lossDensity, source: 'invented' };
      }),
    ),
  );

  it('one fit over the whole range misses by more than 20 %; two bands meet 5 % with α near 1.3 and 1.9', () => {
    const whole = fitMaterial(points, { mode: 'whole', maxWorstError: 0.1, temperature: true });
    expect(whole.fits[0]!.worstRelativeError).toBeGreaterThan(0.2);

    const bands = fitMaterial(points, { mode: 'bands', maxWorstError: 0.1, temperature: true });
    expect(bands.fits.map((f) => f.fittedFrequency)).toEqual([
      [50e3, 200e3],
      [200e3, 800e3],
    ]);
    expect(Math.abs(bands.fits[0]!.alpha - 1.3)).toBeLessThan(0.02);
    expect(Math.abs(bands.fits[1]!.alpha - 1.9)).toBeLessThan(0.02);
    for (const band of bands.fits) {
      expect(Math.abs(band.beta - 2.6)).toBeLessThan(0.02);
      expect(band.worstRelativeError).toBeLessThan(0.05);
    }
    // The behaviour comes back within the noise, and with bands its quality is judged against each point's band.
    expect(Math.abs(bands.temperature!.lowestLossTemperature - 85)).toBeLessThan(1);
    expect(relative(bands.temperature!.curvature, 1.5e-4)).toBeLessThan(0.05);
    expect(bands.temperature!.worstRelativeError).toBeLessThan(0.05);
    expect(whole.temperature!.worstRelativeError).toBeGreaterThan(0.2);
  });

  it('is the file shipped for users to try (core-data/examples/worked-example-loss-points.csv)', () => {
    const text = readFileSync(join(import.meta.dirname, '../../../core-data/examples/worked-example-loss-points.csv'));
    const file = readLossPointFile({ originalname: 'worked-example-loss-points.csv', buffer: text, size: text.length } as UploadedFile);
    expect(file.preview.summary).toMatchObject({ rows: 60, valid: 60, errors: 0 });
    expect(file.points.map((p) => [p.frequency, p.peakFlux, p.temperature, p.lossDensity])).toEqual(
      points.map((p) => [p.frequency, p.peakFlux, p.temperature, p.lossDensity]),
    );
  });
});
