import { describe, expect, it } from 'vitest';
import { MU0 } from '@shared/engine/constants';
import { copperResistivity } from '@shared/engine/copper';
import { evaluateDesign, type EvaluateInput } from '@shared/engine/evaluate';
import { harmonicWeights } from '@shared/engine/harmonics';
import { litzAcFactor, litzProximitySum } from '@shared/engine/litz';
import { etd34Like, ferriteA, litz, sectionOneSpec } from './fixtures';

// Litz strand by strand: Sullivan and Zhang, "Simplified design method for litz wire" (IEEE APEC 2014):
// Fr = 1 + π²·ω²·μ0²·N²·n²·d⁶/(768·ρ²·b²), from each strand's low-frequency loss π·ω²·μ0²·Ĥ²·d⁴/(128·ρ) per metre
// (Sullivan, IEEE Trans. Power Electronics 16(1), 2001) in a field rising linearly to N·Î/b across the winding.

describe('litz proximity factor', () => {
  it('equals the strand loss summed over a linearly rising field (numerical integration, independent of the closed form)', () => {
    const [n, d, turns, breadth, rho, f] = [200, 0.1e-3, 20, 20e-3, 1.9e-8, 100e3];
    const omega = 2 * Math.PI * f;
    const peak = 1;
    // Strands spread evenly through the build; each sees H = (x/X)·N·Î/b at its depth x (1-D window field).
    const slices = 20000;
    let proximity = 0;
    for (let i = 0; i < slices; i++) {
      const h = ((i + 0.5) / slices) * ((turns * peak) / breadth);
      proximity += ((turns * n) / slices) * ((Math.PI * omega ** 2 * MU0 ** 2 * h ** 2 * d ** 4) / (128 * rho));
    }
    // DC loss per metre of mean turn for the same peak current: Î²/2 · ρ·N/(n·π·d²/4)
    const dc = ((peak ** 2 / 2) * rho * turns) / ((n * Math.PI * d ** 2) / 4);
    expect(litzAcFactor(n, d, turns, breadth, rho, f) - 1).toBeCloseTo(proximity / dc, 6);
  });

  it('grows as n²·d⁶·N²/b² and as f² (the scaling that sets litz design)', () => {
    const base = litzAcFactor(100, 0.1e-3, 10, 20e-3, 1.9e-8, 100e3) - 1;
    expect(litzAcFactor(200, 0.1e-3, 10, 20e-3, 1.9e-8, 100e3) - 1).toBeCloseTo(4 * base, 12);
    expect(litzAcFactor(100, 0.2e-3, 10, 20e-3, 1.9e-8, 100e3) - 1).toBeCloseTo(64 * base, 10);
    expect(litzAcFactor(100, 0.1e-3, 20, 40e-3, 1.9e-8, 100e3) - 1).toBeCloseTo(base, 12);
    expect(litzAcFactor(100, 0.1e-3, 10, 20e-3, 1.9e-8, 200e3) - 1).toBeCloseTo(4 * base, 12);
  });

  it('sums the ripple harmonics as Σ I_n²/2·n² (ω_n = n·ω1)', () => {
    const weights = harmonicWeights(3, 1 / 3);
    const sum = litzProximitySum(100, 0.1e-3, 1.9e-8, 100e3, weights);
    let byHand = 0;
    for (let k = 1; k <= weights.meanSquare.length; k++)
      byHand += weights.meanSquare[k - 1]! * (litzAcFactor(100, 0.1e-3, 1, 1, 1.9e-8, k * 100e3) - 1);
    expect(sum / byHand).toBeCloseTo(1, 9);
  });
});

describe('a litz design', () => {
  const input: EvaluateInput = {
    spec: sectionOneSpec,
    limits: { inductanceTolerance: 0 },
    core: etd34Like,
    material: ferriteA,
    turns: 'auto',
    gap: 'auto',
    wire: litz(420, 0.1e-3),
  };

  it("carries the strand-level proximity loss in the ripple's AC factor, at the copper's temperature", () => {
    const result = evaluateDesign(input);
    const turns = result.turns;
    const weights = harmonicWeights(result.operatingPoint.rippleAtVinMax, result.operatingPoint.dutyAtVinMax);
    const meanSquare = weights.meanSquare.reduce((a, b) => a + b, 0);
    // The copper's temperature: Rdc is taken at the hot spot, the AC factor at the part's surface (hot spot − 5 K).
    const surface = result.thermal.surfaceTemperature;
    const proximity = litzProximitySum(420, 0.1e-3, copperResistivity(surface), sectionOneSpec.frequency, weights);
    const expected = (proximity * turns ** 2) / etd34Like.bobbinWidth ** 2 / meanSquare;
    // The skin term of 0.1 mm strands at 100 kHz is 1 to within 1e-4; the grid interpolation holds 0.1 %.
    expect(result.copper.acFactor - 1).toBeGreaterThan(0);
    expect((result.copper.acFactor - 1) / expected).toBeCloseTo(1, 2);
  });
});
