import { describe, expect, it } from 'vitest';
import { MU0 } from '@shared/engine/constants';
import { evaluateDesign, type EvaluateInput } from '@shared/engine/evaluate';
import { EXAMPLE_SPECS } from '../../support/example-specs';
import { etd34Like, ferriteA, powderP, powderRing, roundWire } from './fixtures';

// Spec C of issue 13: 36–60 V → 12 V, 10 A, 100 kHz, ripple ratio 0.3, diode 0.6 V, switch 0.3 V, inductor 20 mΩ.
const specC = EXAMPLE_SPECS.C;
const base: EvaluateInput = { spec: specC, core: etd34Like, material: ferriteA, turns: 'auto', gap: 'auto', wire: roundWire(1e-3, 3) };

// McLyman, Transformer and Inductor Design Handbook, 3rd ed., Marcel Dekker 2004, ch. 8: F = 1 + (lg/√A)·ln(2G/lg).
const F = (gap: number, area: number) => 1 + (gap / Math.sqrt(area)) * Math.log((2 * etd34Like.windowHeight) / gap);
const groundL = (turns: number, gap: number) =>
  (MU0 * turns * turns * etd34Like.ae * F(gap, etd34Like.ae)) / (gap + etd34Like.le / ferriteA.permeability);
/** A spacer t under all legs: gaps t across Ae and t across Ao = Ae (Ac/Ao = 1) in series, each with its own F. */
const spacerL = (turns: number, t: number) =>
  (MU0 * turns * turns) / (etd34Like.le / (ferriteA.permeability * etd34Like.ae) + (2 * t) / (etd34Like.ae * F(t, etd34Like.ae)));

describe('gap placement', () => {
  const ground = evaluateDesign(base);

  it("gives the ground design's spacer alternative from the two-gap model, not half the ground gap", () => {
    expect(ground.gap.placement).toBe('ground');
    expect(Math.abs(spacerL(ground.turns, ground.gap.spacer) / ground.inductance.nominal - 1)).toBeLessThan(0.005);
    // half the gap would be ≈12 % short
    expect(spacerL(ground.turns, ground.gap.total / 2) / ground.inductance.nominal).toBeLessThan(0.9);
  });

  it('builds a spacer design to the target: the flux crosses the spacer twice', () => {
    const spacer = evaluateDesign({ ...base, placement: 'spacer' });
    expect(spacer.gap.placement).toBe('spacer');
    expect(spacer.turns).toBe(ground.turns);
    expect(spacer.gap.total).toBeCloseTo(2 * spacer.gap.spacer, 15);
    expect(Math.abs(spacerL(spacer.turns, spacer.gap.spacer) / spacer.operatingPoint.inductanceNominal - 1)).toBeLessThan(0.005);
    expect(spacer.gap.spacer).toBeCloseTo(ground.gap.spacer, 9);
  });

  it('takes an explicit spacer thickness as the spacer, not as a ground gap', () => {
    const given = evaluateDesign({ ...base, placement: 'spacer', turns: 15, gap: 0.4e-3 });
    expect(given.gap.spacer).toBe(0.4e-3);
    expect(given.inductance.nominal / spacerL(15, 0.4e-3)).toBeCloseTo(1, 9);
  });
});

describe('minimum gap and gap sensitivity', () => {
  it('fails a ground gap below 50 µm and says so (the 50 µm default: common practice, no source)', () => {
    const thin = evaluateDesign({ ...base, gap: 30e-6 });
    expect(thin.feasible).toBe(false);
    expect(thin.issues.find((i) => i.code === 'gap-too-small')?.message).toMatch(/^Ground gap of 30\.0 µm is below the 50 µm/);
    expect(evaluateDesign({ ...base, gap: 30e-6, limits: { minGap: 20e-6 } }).issues.map((i) => i.code)).not.toContain('gap-too-small');
    expect(evaluateDesign(base).issues.map((i) => i.code)).not.toContain('gap-too-small');
  });

  it('applies the limit to a spacer too, and never to a distributed-gap core', () => {
    const spacer = evaluateDesign({ ...base, placement: 'spacer', gap: 40e-6 });
    expect(spacer.issues.map((i) => i.code)).toContain('gap-too-small');
    const powder = evaluateDesign({ ...base, core: powderRing, material: powderP, limits: { minGap: 1e-3 } });
    expect(powder.issues.map((i) => i.code)).not.toContain('gap-too-small');
    expect(powder.gap.sensitivity10um).toBe(0);
  });

  it('reports ΔL/L for 10 µm more gap by the McLyman gapped-core law and warns above 10 %', () => {
    const wide = evaluateDesign(base);
    const n = wide.turns;
    const expected = groundL(n, wide.gap.total + 10e-6) / groundL(n, wide.gap.total) - 1;
    expect(wide.gap.sensitivity10um).toBeCloseTo(expected, 9);
    expect(Math.abs(wide.gap.sensitivity10um)).toBeLessThan(0.1);
    expect(wide.issues.map((i) => i.code)).not.toContain('gap-sensitive');

    const thin = evaluateDesign({ ...base, gap: 40e-6, limits: { minGap: 0 } });
    const thinExpected = groundL(thin.turns, 50e-6) / groundL(thin.turns, 40e-6) - 1;
    expect(thin.gap.sensitivity10um).toBeCloseTo(thinExpected, 9);
    expect(thin.gap.sensitivity10um).toBeLessThan(-0.1);
    expect(thin.issues.find((i) => i.code === 'gap-sensitive')?.message).toMatch(/^10 µm more gap changes the inductance by -\d+\.\d %/);

    const spacer = evaluateDesign({ ...base, placement: 'spacer' });
    expect(spacer.gap.sensitivity10um).toBeCloseTo(
      spacerL(spacer.turns, spacer.gap.spacer + 10e-6) / spacerL(spacer.turns, spacer.gap.spacer) - 1,
      6,
    );
  });
});
