import { describe, expect, it } from 'vitest';
import { evaluateDesign, type EvaluateInput } from '@shared/engine/evaluate';
import { etd34Like, ferriteA, powderP, powderRing, roundWire, sectionOneSpec } from './fixtures';

// Worst case of the saturation check: the upper-tolerance part (L·(1 + tol): flux ∝ L at a given current,
// N·Φ = L·I) at the hottest temperature the limits allow (ambient 40 + rise 50 + hot-spot allowance 5 = 95 °C,
// the allowance common practice, no source). Bsat of the invented ferrite A is linear through (25 °C, 0.50 T) and
// (100 °C, 0.39 T): 0.5 − 0.11·70/75 = 0.3973 T at 95 °C. The 20 % margin and 10 % tolerance: common practice, no source.
const base: EvaluateInput = {
  spec: sectionOneSpec,
  core: etd34Like,
  material: ferriteA,
  turns: 12,
  gap: 'auto',
  wire: roundWire(0.8e-3, 3),
};
const bsat95 = 0.5 - (0.11 * 70) / 75;

describe('worst-case corners', () => {
  const result = evaluateDesign(base);
  const [nominal, low, high] = result.corners;

  it('checks saturation at +10 % inductance and 95 °C: 12 turns pass at nominal and fail there', () => {
    expect(nominal!.corner).toBe('nominal');
    expect(nominal!.pass).toBe(true);
    expect(nominal!.margin).toBeCloseTo(result.flux.saturationMargin, 12);
    expect(high!.corner).toBe('high');
    expect(high!.inductance).toBeCloseTo(nominal!.inductance * 1.1, 15);
    expect(high!.peakFlux).toBeCloseTo(nominal!.peakFlux * 1.1, 12);
    expect(high!.temperature).toBe(95);
    expect(high!.saturationFlux).toBeCloseTo(bsat95, 12);
    expect(high!.margin).toBeCloseTo(1 - high!.peakFlux / bsat95, 12);
    expect(high!.margin).toBeLessThan(0.2);
    expect(high!.pass).toBe(false);
    expect(result.feasible).toBe(false);
    expect(result.issues.find((i) => i.code === 'saturation')?.message).toMatch(
      /^At the upper tolerance \(\+10 % L\) the peak flux is 0\.34 T \(in the narrowest section\); at 95 °C, the hottest the limits allow/,
    );
  });

  it('checks the inductance at the lower tolerance: the low corner meets the required minimum exactly', () => {
    expect(low!.corner).toBe('low');
    expect(low!.inductance).toBeCloseTo(nominal!.inductance * 0.9, 15);
    expect(low!.inductance / result.inductance.required).toBeCloseTo(1, 6);
    expect(low!.pass).toBe(true);
  });

  it('chooses enough turns when asked to ("auto") for the worst corner to pass', () => {
    const auto = evaluateDesign({ ...base, turns: 'auto' });
    expect(auto.turns).toBe(13);
    expect(auto.corners.every((c) => c.pass)).toBe(true);
    expect(auto.feasible).toBe(true);
  });

  it('scales a powder core the same way (AL tolerance is a μi tolerance: B ∝ μi at a given H)', () => {
    const powder = evaluateDesign({ ...base, turns: 'auto', core: powderRing, material: powderP });
    expect(powder.corners[2]!.peakFlux).toBeCloseTo(powder.flux.peakAtMinimumSection * 1.1, 12);
  });
});
