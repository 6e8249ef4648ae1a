import { describe, expect, it } from 'vitest';
import type { LossPoint } from '@shared/fitting/loss-points';
import { fitSteinmetz } from '@shared/fitting/steinmetz-fit';
import { fitTemperatureBehaviour } from '@shared/fitting/temperature-fit';
import { fitMaterial, MAX_FIT_TEMPERATURES, temperatureFit } from '../../../server/loss-points/material-fit.ts';

/** Invented points on a grid, Pv = 4.5·f^1.35·B̂^2.7·factor(T), with a deterministic ±3 % ripple. */
function points(factor: (t: number) => number, temperatures = [25, 50, 70, 85, 100, 120]): LossPoint[] {
  const out: LossPoint[] = [];
  let n = 0;
  for (const temperature of temperatures) {
    for (const f of [20e3, 50e3, 100e3, 200e3]) {
      for (const b of [0.03, 0.06, 0.12]) {
        const ripple = 1 + 0.03 * Math.sin(7 * n++);
        out.push({ frequency: f, peakFlux: b, temperature, lossDensity: 4.5 * f ** 1.35 * b ** 2.7 * factor(temperature) * ripple });
      }
    }
  }
  return out;
}

describe('temperature fit on one weighted value per temperature', () => {
  // Σ (F − y)²/y² over a group equals W·(F − ȳ)² + const (W = Σ 1/y², ȳ = Σ(1/y)/W): expanding the square, algebra.
  it.each([
    ['opening upwards (free fit)', (t: number) => 1 + 1.2e-4 * (t - 85) ** 2],
    ['opening downwards (constrained search)', (t: number) => 1.5 - 1e-4 * (t - 60) ** 2],
  ])('gives the per-point fit: %s', (name, factor) => {
    const data = points(factor);
    const steinmetz = fitSteinmetz(data);
    const perPoint = fitTemperatureBehaviour(data, steinmetz);
    const grouped = temperatureFit(data, steinmetz);
    expect(grouped.constrained).toBe(perPoint.constrained);
    expect(grouped.constrained).toBe(name.includes('constrained'));
    expect(grouped.behaviour.lowestLossTemperature).toBeCloseTo(perPoint.behaviour.lowestLossTemperature, 6);
    expect(grouped.behaviour.lowestLossFactor / perPoint.behaviour.lowestLossFactor - 1).toBeLessThan(1e-9);
    expect(Math.abs(grouped.behaviour.curvature - perPoint.behaviour.curvature)).toBeLessThan(1e-12);
    expect(grouped.pointCount).toBe(data.length);
    expect(grouped.rmsRelativeError / perPoint.rmsRelativeError - 1).toBeLessThan(1e-9);
  });

  it('refuses more distinct temperatures than the limit, naming the field', () => {
    const many = Array.from({ length: MAX_FIT_TEMPERATURES + 1 }, (_, i) => -50 + i * 0.5);
    expect(() =>
      fitMaterial(
        points(() => 1, many),
        { mode: 'whole', maxWorstError: 0.1, temperature: true },
      ),
    ).toThrow(expect.objectContaining({ field: 'temperature', message: expect.stringMatching(/101 different temperatures/) }));
  });
});

describe('fitMaterial', () => {
  it('maps worst points, band indices and residuals back to the stored points when fitting at one temperature', () => {
    const data = points((t) => 1 + 1e-4 * (t - 80) ** 2);
    const at = fitMaterial(data, { mode: 'whole', maxWorstError: 0.1, temperature: false, atTemperature: 70 });
    const used = data.flatMap((p, i) => (p.temperature === 70 ? [i] : []));
    expect(at.pointCount).toBe(used.length);
    expect(at.fits[0]!.pointIndices).toEqual(used);
    expect(used).toContain(at.fits[0]!.worstPoint);
    expect(at.residuals.map((r) => r.index)).toEqual(used);
    const worst = at.residuals.reduce((a, b) => (Math.abs(b.relativeError) > Math.abs(a.relativeError) ? b : a));
    expect(worst.index).toBe(at.fits[0]!.worstPoint);
    expect(at.temperature).toBeNull();
  });
});

describe('points taken under DC bias', () => {
  it('stay out of the zero-bias fit and give the DC-bias loss curve (recovers an invented H₂ = 70 A/m, m = 1.6)', () => {
    const factor = (t: number) => 1 + 1.2e-4 * (t - 85) ** 2;
    const zeroBias = points(factor);
    const biasedPoints = [25, 50, 100, 200].flatMap((field) =>
      [50e3, 100e3].map((f) => ({
        frequency: f,
        peakFlux: 0.06,
        temperature: 85,
        dcBias: field,
        lossDensity: 4.5 * f ** 1.35 * 0.06 ** 2.7 * factor(85) * (1 + (field / 70) ** 1.6),
      })),
    );
    const withBias = fitMaterial([...zeroBias, ...biasedPoints], { mode: 'whole', maxWorstError: 0.1, temperature: true });
    const without = fitMaterial(zeroBias, { mode: 'whole', maxWorstError: 0.1, temperature: true });
    // The zero-bias model is exactly the one without the biased points.
    expect(withBias.fits[0]!.k).toBe(without.fits[0]!.k);
    expect(withBias.pointCount).toBe(zeroBias.length);
    expect(withBias.residuals.every((r) => r.index < zeroBias.length)).toBe(true);
    // The ±3 % ripple of the zero-bias points moves the model a little; H₂ and m come back within a few %.
    const bias = withBias.biasLoss!;
    expect(bias.pointCount).toBe(8);
    expect(Math.abs(bias.doublingField / 70 - 1)).toBeLessThan(0.05);
    expect(Math.abs(bias.steepness / 1.6 - 1)).toBeLessThan(0.05);
    expect(bias.worstPoint).toBeGreaterThanOrEqual(zeroBias.length);
    expect(without.biasLoss).toBeNull();
  });

  it('refuses a fit with only biased points, naming the points', () => {
    const only = points(() => 1, [25]).map((p) => ({ ...p, dcBias: 50 }));
    expect(() => fitMaterial(only, { mode: 'whole', maxWorstError: 0.1, temperature: false })).toThrow(/under DC bias/);
  });
});
