import { describe, expect, it } from 'vitest';
import { COPPER_RESISTIVITY_20C } from '@shared/engine/constants';
import { evaluateDesign } from '@shared/engine/evaluate';
import {
  fringingFieldNormalSquared,
  fringingFieldSquared,
  transverseFieldLoss,
  transverseFieldLossLowFrequency,
} from '@shared/engine/gap-field-loss';
import { skinDepthForResistivity } from '@shared/engine/skin-depth';
import { etd34Like, ferriteA, sectionOneSpec, wireSet } from './fixtures';

// The gap-field loss's parts against their limits: the round conductor in a transverse field tends to
// π·σ·ω²·d⁴·B̂²/128 at low frequency (C. R. Sullivan, IEEE Trans. Power Electronics 16(1), 2001) and to the
// surface-resistance loss π·d·H0²/(σ·δ) of a shielding cylinder at high frequency (from memory); the gap's field to
// the line source F/(π·r) far away (W. A. Roshen, IEEE Trans. Magnetics 43(8), 2007, from memory). The comparison
// with the field solver is in tests/unit/solvers/gap-field-loss.test.ts.
const RHO = COPPER_RESISTIVITY_20C;

describe('gap-field loss: closed-form limits', () => {
  it('a round conductor in a transverse field: low- and high-frequency limits', () => {
    const low = transverseFieldLoss(0.1e-3, 10e3, RHO);
    expect(low / transverseFieldLossLowFrequency(0.1e-3, 10e3, RHO)).toBeCloseTo(1, 4);
    const d = 2e-3;
    const f = 10e6;
    const delta = skinDepthForResistivity(RHO, f);
    // The next term of the asymptotic series is of order δ/d (here 1 %).
    expect(transverseFieldLoss(d, f, RHO) / ((Math.PI * d * RHO) / delta)).toBeCloseTo(1, 1);
    // Continuity where the continued fraction hands over to the asymptotic series (|τa| = 30).
    const a = (30 / Math.SQRT2) * skinDepthForResistivity(RHO, 1e6);
    expect(transverseFieldLoss(2 * a * 0.9999, 1e6, RHO) / transverseFieldLoss(2 * a * 1.0001, 1e6, RHO)).toBeCloseTo(1, 3);
  });

  it("the gap's field: F/(π·r) far away, no normal component on the mid-plane", () => {
    const g = 1e-3;
    const r = 50e-3;
    expect(Math.sqrt(fringingFieldSquared(r * Math.SQRT1_2, r * Math.SQRT1_2, g)) * Math.PI * r).toBeCloseTo(1, 3);
    expect(fringingFieldNormalSquared(2e-3, 0, g)).toBe(0);
    expect(fringingFieldNormalSquared(2e-3, 1e-3, g)).toBeGreaterThan(fringingFieldNormalSquared(4e-3, 1e-3, g));
  });
});

describe('gap-field loss in an evaluated design', () => {
  const base = {
    spec: sectionOneSpec,
    core: etd34Like,
    material: ferriteA,
    turns: 'auto' as const,
    gap: 'auto' as const,
    // The thickest round wire: its turns fill the layers, centred on the gap.
    wire: wireSet.filter((w) => w.kind !== 'foil' && w.kind !== 'litz').sort((a, b) => b.strandDiameter - a.strandDiameter)[0]!,
  };
  it('falls with keep-out, is in the total loss and is zero for foil', () => {
    const near = evaluateDesign({ ...base, keepOut: 0.5e-3 });
    const far = evaluateDesign({ ...base, keepOut: 2e-3 });
    expect(near.copper.gapLoss).toBeGreaterThan(0);
    expect(far.copper.gapLoss).toBeLessThan(0.5 * near.copper.gapLoss);
    expect(near.winding.keepOut).toBe(0.5e-3);
    expect(near.totalLoss).toBeCloseTo(near.copper.dcLoss + near.copper.acLoss + near.copper.gapLoss + near.coreLoss.loss, 12);
    const foil = wireSet.find((w) => w.kind === 'foil');
    if (foil) expect(evaluateDesign({ ...base, wire: foil }).copper.gapLoss).toBe(0);
  });
  it('refuses a negative keep-out by field', () => {
    expect(() => evaluateDesign({ ...base, keepOut: -1e-3 })).toThrow(/Keep-out/);
  });
});
