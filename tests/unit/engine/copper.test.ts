import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { copperResistivity, windingResistance } from '@shared/engine/copper';
import { copperSkinDepth, skinDepthForResistivity } from '@shared/engine/skin-depth';
import { dowellFactor, dowellProximityTerm, dowellSkinTerm, roundWireDelta } from '@shared/engine/dowell';
import { acCopperLoss, acLossSums, dcCopperLoss, effectiveAcFactor } from '@shared/engine/copper-loss';
import { harmonicWeights } from '@shared/engine/harmonics';

/** Independent per-layer summation of the one-dimensional layer model (Dowell, Proc. IEE 113(8), 1966 — from memory): Fr = (1/m)·Σ Δ[(k² + (k−1)²)G1 − 4k(k−1)G2]. */
function perLayerFr(delta: number, layers: number): number {
  const d2 = 2 * delta;
  const denominator = Math.cosh(d2) - Math.cos(d2);
  const g1 = (Math.sinh(d2) + Math.sin(d2)) / denominator;
  const g2 = (Math.sinh(delta) * Math.cos(delta) + Math.cosh(delta) * Math.sin(delta)) / denominator;
  let sum = 0;
  for (let k = 1; k <= layers; k++) sum += delta * ((k * k + (k - 1) * (k - 1)) * g1 - 4 * k * (k - 1) * g2);
  return sum / layers;
}

describe('copper resistivity', () => {
  it('is 1.7241e-8 Ω·m at 20 °C and 2.2662e-8 Ω·m at 100 °C', () => {
    // IEC 60028 (International Standard of Resistance for Copper): ρ20 = 1.7241e-8 Ω·m
    expect(copperResistivity(20)).toBe(1.7241e-8);
    // Computed from ρ(T) = ρ20·(1 + α20·(T − 20 °C)) with IEC 60028 α20 = 0.00393 /K (from memory): ρ(100 °C) = 2.2662e-8 Ω·m
    expect(copperResistivity(100) * 1e8).toBeCloseTo(2.2662, 4);
  });

  it('gives AWG 18 about 20.95 mΩ/m at 20 °C', () => {
    // Computed with IEC 60028 ρ20 (diameter from ASTM B258-02 via "American wire gauge" article: AWG 18 = 1.024 mm)
    expect(windingResistance(1, 1, (Math.PI * 1.024e-3 ** 2) / 4, 20) * 1e3).toBeCloseTo(20.95, 1);
  });
});

describe('skin depth', () => {
  it('is 0.2090 mm at 100 kHz, 20 °C and 0.2396 mm at 100 °C', () => {
    // Computed [C] from δ = sqrt(ρ/(π·f·μ0)) (Wikipedia "Skin effect" definition) with IEC 60028 ρ20 and α20 (α20 from memory)
    expect(copperSkinDepth(100e3, 20) * 1e3).toBeCloseTo(0.209, 4);
    expect(copperSkinDepth(100e3, 100) * 1e3).toBeCloseTo(0.2396, 4);
  });

  it('is 8.42 mm at 60 Hz with ρ = 1.68e-8 Ω·m', () => {
    // [S: Wikipedia "Skin effect"] ≈8.5 mm in copper at 60 Hz; 8.42 mm with ρ = 1.68e-8, computed from the same formula
    expect(skinDepthForResistivity(1.68e-8, 60) * 1e3).toBeCloseTo(8.42, 2);
  });
});

describe('Dowell factor', () => {
  it('equals the independent per-layer summation to 4 decimals (Dowell, Proc. IEE 113(8), 1966 — from memory; computed)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.05, max: 8, noNaN: true }), fc.integer({ min: 1, max: 12 }), (delta, layers) => {
        const expected = perLayerFr(delta, layers);
        expect(Math.abs(dowellFactor(delta, layers) - expected) / expected).toBeLessThan(5e-5);
      }),
    );
  });

  it('follows the small-Δ limit 1 + (5m² − 1)Δ⁴/45 (series expansion of Dowell 1966, derived algebraically)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-4, max: 0.08, noNaN: true }), fc.integer({ min: 1, max: 10 }), (delta, m) => {
        const excess = dowellFactor(delta, m) - 1;
        const limit = ((5 * m * m - 1) * delta ** 4) / 45;
        expect(Math.abs(excess - limit)).toBeLessThanOrEqual(0.02 * limit + 1e-15);
      }),
    );
  });

  it('tends to 1 as Δ → 0 and stays continuous across the series branch', () => {
    expect(dowellFactor(1e-6, 5)).toBeCloseTo(1, 12);
    expect(dowellSkinTerm(0.00999)).toBeCloseTo(dowellSkinTerm(0.01001), 8);
    expect(dowellProximityTerm(0.00999) / dowellProximityTerm(0.01001)).toBeCloseTo((0.00999 / 0.01001) ** 4, 6);
  });

  it('converts round wire with the (π/4)^(3/4) factor (Dowell 1966, porosity conversion from memory)', () => {
    // d = δ, η = 1 → Δ = (π/4)^0.75 = 0.83429 [C]
    expect(roundWireDelta(1e-3, 1e-3, 1)).toBeCloseTo(0.83429, 5);
  });
});

describe('ripple copper loss', () => {
  const ripple = 3;
  const duty = 1 / 3;
  const weights = harmonicWeights(ripple, duty);

  it('matches a direct 200-harmonic sum of Fr(Δ1√n, m)·I_n²/2 (Fourier series of the triangle with Dowell per harmonic, computed)', () => {
    for (const [delta1, m] of [
      [0.3, 1],
      [1.5, 3],
      [4, 6],
    ] as const) {
      let direct = 0;
      for (let n = 1; n <= 200; n++) direct += dowellFactor(delta1 * Math.sqrt(n), m) * weights.meanSquare[n - 1]!;
      const loss = acCopperLoss(1, acLossSums(delta1, weights), m);
      // The sum stops once a term is below 1e-6 of the running total, so the dropped tail is of order 1e-5.
      expect(Math.abs(loss - direct) / direct).toBeLessThan(1e-4);
    }
  });

  it('reduces to Rdc·ΔI²/12 for thin wire (Δ → 0) and reports Pdc separately', () => {
    const sums = acLossSums(1e-4, weights);
    // RMS of a triangle, derived algebraically: AC RMS² = ΔI²/12 = 0.75 A²
    expect(acCopperLoss(0.01, sums, 4)).toBeCloseTo(0.01 * 0.75, 6);
    expect(effectiveAcFactor(sums, 4)).toBeCloseTo(1, 6);
    expect(dcCopperLoss(0.01, 10)).toBeCloseTo(0.01 * 100, 12);
  });
});
