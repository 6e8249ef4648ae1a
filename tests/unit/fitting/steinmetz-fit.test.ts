import { describe, expect, it } from 'vitest';
import { steinmetzLoss } from '@shared/engine/core-loss';
import type { LossPoint } from '@shared/fitting/loss-points';
import { fitInBands, fitSteinmetz } from '@shared/fitting/steinmetz-fit';
import { noiseFactor, refusal, relative, seededUniform } from './support';

// Invented coefficients (no real material): 100 kW/m³ at 100 kHz and 0.1 T peak, α = 1.45, β = 2.6.
const ALPHA = 1.45;
const BETA = 2.6;
const K = 100e3 / (100e3 ** ALPHA * 0.1 ** BETA);
const FREQUENCIES = [20e3, 50e3, 100e3, 200e3, 500e3];
const FLUXES = [0.02, 0.05, 0.1, 0.2];

function grid(lossAt: (f: number, b: number) => number, frequencies = FREQUENCIES, fluxes = FLUXES): LossPoint[] {
  return frequencies.flatMap((frequency) =>
    fluxes.map((peakFlux) => ({ frequency, peakFlux, temperature: 25, lossDensity: lossAt(frequency, peakFlux), source: 'generated' })),
  );
}
const exactPoints = () => grid((f, b) => steinmetzLoss({ k: K, alpha: ALPHA, beta: BETA }, f, b));

/** The assertion of a refused fit: a FitInputError whose message matches, naming `field` when given. */
function refused(run: () => unknown, message: RegExp, field?: string): void {
  const error = refusal(run);
  expect(error.message).toMatch(message);
  if (field) expect(error.field).toBe(field);
}

describe('Steinmetz fit by weighted least squares on ln Pv (log-linear least squares: a power law fitted as a straight line in the logarithms, N. R. Draper and H. Smith, Applied Regression Analysis, 3rd ed., Wiley 1998, on transformations, from memory; power law of C. P. Steinmetz, "On the law of hysteresis", Trans. AIEE 9, 1892)', () => {
  it('recovers invented k, α, β to 1e-9 from noiseless points', () => {
    const fit = fitSteinmetz(exactPoints());
    expect(relative(fit.k, K)).toBeLessThan(1e-9);
    expect(relative(fit.alpha, ALPHA)).toBeLessThan(1e-9);
    expect(relative(fit.beta, BETA)).toBeLessThan(1e-9);
    expect(fit.rmsRelativeError).toBeLessThan(1e-9);
    expect(fit.worstRelativeError).toBeLessThan(1e-9);
    expect(fit.pointCount).toBe(20);
  });

  it('reports exactly the frequency and flux ranges of the points used', () => {
    const points = exactPoints().filter((p) => p.frequency !== 20e3 && p.peakFlux !== 0.2);
    const fit = fitSteinmetz(points);
    expect(fit.fittedFrequency).toEqual([50e3, 500e3]);
    expect(fit.fittedFlux).toEqual([0.02, 0.1]);
  });

  it('recovers k within 15 %, α and β within 0.05 from points with ±5 % uniform noise (5 seeds)', () => {
    for (const seed of [1, 2, 3, 14, 2026]) {
      const uniform = seededUniform(seed);
      const points = grid((f, b) => steinmetzLoss({ k: K, alpha: ALPHA, beta: BETA }, f, b) * noiseFactor(uniform, 0.05));
      const fit = fitSteinmetz(points);
      expect(relative(fit.k, K)).toBeLessThan(0.15);
      expect(Math.abs(fit.alpha - ALPHA)).toBeLessThan(0.05);
      expect(Math.abs(fit.beta - BETA)).toBeLessThan(0.05);
      // Noise of ±5 % cannot leave a worst error much beyond 10 % after a fit through it.
      expect(fit.rmsRelativeError).toBeGreaterThan(0.005);
      expect(fit.worstRelativeError).toBeLessThan(0.1);
    }
  });

  it('names the worst point, and a tiny weight on it lets the others decide', () => {
    const points = exactPoints();
    points[7] = { ...points[7]!, lossDensity: points[7]!.lossDensity * 2 };
    const equal = fitSteinmetz(points);
    expect(equal.worstPoint).toBe(7);
    expect(relative(equal.alpha, ALPHA)).toBeGreaterThan(1e-3);
    const weights = points.map((_, i) => (i === 7 ? 1e-12 : 1));
    const weighted = fitSteinmetz(points, { weights });
    expect(relative(weighted.alpha, ALPHA)).toBeLessThan(1e-9);
    expect(weighted.worstPoint).toBe(7);
    expect(weighted.worstRelativeError).toBeCloseTo(0.5, 9);
  });

  it('divides out a temperature factor so points at several temperatures share one k', () => {
    const factor = (t: number) => 0.9 + 1e-4 * (t - 90) ** 2;
    const points = [25, 60, 100].flatMap((temperature) =>
      exactPoints().map((p) => ({ ...p, temperature, lossDensity: p.lossDensity * factor(temperature) })),
    );
    const fit = fitSteinmetz(points, { temperatureFactor: factor });
    expect(relative(fit.k, K)).toBeLessThan(1e-9);
    expect(relative(fit.beta, BETA)).toBeLessThan(1e-9);
  });

  it('refuses fewer than 3 points, one frequency, one flux, and frequency tied to flux', () => {
    const points = exactPoints();
    refused(() => fitSteinmetz(points.slice(0, 2)), /at least 3 points, got 2/, 'points');
    refused(() => fitSteinmetz(points.filter((p) => p.frequency === 100e3)), /one frequency/, 'frequency');
    refused(() => fitSteinmetz(points.filter((p) => p.peakFlux === 0.1)), /one peak flux/, 'peakFlux');
    const tied = [1, 2, 4, 8].map((s) => ({ frequency: 25e3 * s, peakFlux: 0.01 * s, temperature: 25, lossDensity: 1e4 * s }));
    refused(() => fitSteinmetz(tied), /vary together/, 'points');
  });

  it('refuses NaN, infinite, zero and negative values, naming the field and point', () => {
    const points = exactPoints();
    const broken = (i: number, change: Partial<LossPoint>) => points.map((p, j) => (j === i ? { ...p, ...change } : p));
    refused(() => fitSteinmetz(broken(3, { lossDensity: NaN })), /point 3: lossDensity is not a finite number/, 'lossDensity');
    refused(() => fitSteinmetz(broken(5, { lossDensity: -120 })), /point 5: lossDensity must be positive, got -120/, 'lossDensity');
    refused(() => fitSteinmetz(broken(0, { frequency: 0 })), /point 0: frequency must be positive/, 'frequency');
    refused(() => fitSteinmetz(broken(1, { peakFlux: Infinity })), /point 1: peakFlux is not a finite number/, 'peakFlux');
    refused(() => fitSteinmetz(broken(2, { temperature: NaN })), /point 2: temperature/, 'temperature');
    refused(() => fitSteinmetz(points, { weights: [1, 2] }), /weights: 2 given for 20 points/, 'weights');
    refused(() => fitSteinmetz(points, { weights: points.map((_, i) => (i === 4 ? 0 : 1)) }), /weight 4 must be a positive/, 'weights');
  });
});

describe('Steinmetz fit in frequency bands (median split, our own rule, common practice, no source)', () => {
  // Invented two-regime material: α = 1.2 up to 100 kHz, 1.8 above, the two laws meeting at 100 kHz.
  const lowK = K;
  const highK = (K * 100e3 ** 1.2) / 100e3 ** 1.8;
  const twoRegimes = (f: number, b: number) =>
    f <= 100e3 ? steinmetzLoss({ k: lowK, alpha: 1.2, beta: BETA }, f, b) : steinmetzLoss({ k: highK, alpha: 1.8, beta: BETA }, f, b);
  const frequencies = [25e3, 50e3, 100e3, 200e3, 400e3];

  it('keeps one band when one fit is good enough', () => {
    const bands = fitInBands(exactPoints(), 0.01);
    expect(bands).toHaveLength(1);
    expect(bands[0]!.meetsTarget).toBe(true);
    expect(bands[0]!.fittedFrequency).toEqual([20e3, 500e3]);
  });

  it('splits a two-regime material at the median frequency and recovers each regime exactly', () => {
    const points = grid(twoRegimes, frequencies);
    expect(fitSteinmetz(points).worstRelativeError).toBeGreaterThan(0.05);
    const bands = fitInBands(points, 1e-6);
    expect(bands.map((b) => b.fittedFrequency)).toEqual([
      [25e3, 100e3],
      [100e3, 400e3],
    ]);
    expect(relative(bands[0]!.alpha, 1.2)).toBeLessThan(1e-9);
    expect(relative(bands[1]!.alpha, 1.8)).toBeLessThan(1e-9);
    expect(relative(bands[1]!.k, highK)).toBeLessThan(1e-9);
    expect(bands.every((b) => b.meetsTarget && b.fittedFlux[0] === 0.02 && b.fittedFlux[1] === 0.2)).toBe(true);
    // The 100 kHz points belong to both bands; every other point to exactly one.
    const shared = points.flatMap((p, i) => (p.frequency === 100e3 ? [i] : []));
    for (const i of shared) expect(bands.every((b) => b.pointIndices.includes(i))).toBe(true);
    expect(bands[0]!.pointCount + bands[1]!.pointCount).toBe(points.length + shared.length);
  });

  it('keeps a poor band whole when it has only two frequencies, and says it misses the target', () => {
    // β changing with frequency (2.4 at 50 kHz, 2.8 at 200 kHz): no single power law fits both.
    const points = grid((f, b) => steinmetzLoss({ k: K, alpha: ALPHA, beta: f < 100e3 ? 2.4 : 2.8 }, f, b), [50e3, 200e3]);
    const bands = fitInBands(points, 1e-6);
    expect(bands).toHaveLength(1);
    expect(bands[0]!.meetsTarget).toBe(false);
  });

  it('maps the worst point of a band to its index in the points passed', () => {
    const points = grid(twoRegimes, frequencies);
    points[18] = { ...points[18]!, lossDensity: points[18]!.lossDensity * 1.3 };
    const bands = fitInBands(points, 1e-6);
    const upper = bands.find((b) => b.pointIndices.includes(18))!;
    expect(upper.worstPoint).toBe(18);
  });

  it('refuses a target that is not a positive fraction', () => {
    refused(() => fitInBands(exactPoints(), 0), /maxWorstError must be a positive fraction/, 'maxWorstError');
    refused(() => fitInBands(exactPoints(), NaN), /maxWorstError/, 'maxWorstError');
  });
});
