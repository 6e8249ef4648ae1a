import { describe, expect, it } from 'vitest';
import { COPPER_RESISTIVITY_20C } from '@shared/engine/constants';
import { evaluateDesign } from '@shared/engine/evaluate';
import {
  fringingFieldNormalSquared,
  fringingFieldNormalSquaredInWindow,
  fringingFieldSquared,
  gapFieldSum,
  gapFieldSumInWindow,
  latticeField,
  SERIES_ARGUMENT,
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
    // Continuity where the power series hands over to the continued fraction (a/δ = 4) and that to the asymptotic
    // series (|τa| = 30).
    const b = SERIES_ARGUMENT * skinDepthForResistivity(RHO, 1e6);
    expect(transverseFieldLoss(2 * b * (1 - 1e-9), 1e6, RHO) / transverseFieldLoss(2 * b * (1 + 1e-9), 1e6, RHO)).toBeCloseTo(1, 8);
    const a = (30 / Math.SQRT2) * skinDepthForResistivity(RHO, 1e6);
    expect(transverseFieldLoss(2 * a * 0.9999, 1e6, RHO) / transverseFieldLoss(2 * a * 1.0001, 1e6, RHO)).toBeCloseTo(1, 3);
  });

  it("the gap's field: F/(π·r) far away, no normal component on the mid-plane", () => {
    const g = 1e-3;
    const r = 50e-3;
    expect(Math.sqrt(fringingFieldSquared(r * Math.SQRT1_2, r * Math.SQRT1_2, g)) * Math.PI * r).toBeCloseTo(1, 3);
    expect(fringingFieldNormalSquared(2e-3, 0, g)).toBe(0);
    expect(fringingFieldNormalSquared(2e-3, 1e-3, g)).toBeGreaterThan(fringingFieldNormalSquared(4e-3, 1e-3, g));
    // With the yokes as mirrors: Roshen's field in a tall window, e^(−2πx/H) far out in a short one (the row of images
    // of period H has Fourier terms e^(−2πkx/H); the first one's coefficient ∝ sin(2πz/H)·sin(πg/H)).
    expect(fringingFieldNormalSquaredInWindow(2e-3, 1e-3, g, 10) / fringingFieldNormalSquared(2e-3, 1e-3, g)).toBeCloseTo(1, 6);
    const H = 10e-3;
    const far = (x: number) => Math.sqrt(fringingFieldNormalSquaredInWindow(x, 2e-3, g, H));
    expect(far(20e-3) / far(15e-3)).toBeCloseTo(Math.exp((-2 * Math.PI * 5e-3) / H), 4);
    expect(fringingFieldNormalSquaredInWindow(2e-3, 0, g, H)).toBe(0);
  });
});

describe('gap-field sum', () => {
  it('equals the sum over every conductor of L·share²·Hx² (full and partial layers, both gaps)', () => {
    const layout = {
      turns: 23,
      turnsPerLayer: 7,
      layers: 4,
      conductorsPerTurn: 2,
      overallDiameter: 0.6e-3,
      keepOut: 0.7e-3,
      legPerimeter: 40e-3,
    };
    const sources = { centreGap: 0.4e-3, centreShare: 0.45, outerGap: 0.4e-3, outerShare: 0.5, windowWidth: 9e-3 };
    let direct = 0;
    const d = layout.overallDiameter;
    for (let layer = 0; layer < layout.layers; layer++) {
      const x = layout.keepOut + (layer + 0.5) * d;
      const inLayer = Math.min(layout.turnsPerLayer, layout.turns - layer * layout.turnsPerLayer);
      for (let t = 0; t < inLayer; t++) {
        for (let k = 0; k < layout.conductorsPerTurn; k++) {
          const z = (-layout.turnsPerLayer * layout.conductorsPerTurn * d) / 2 + (t * layout.conductorsPerTurn + k + 0.5) * d;
          direct +=
            (layout.legPerimeter + 2 * Math.PI * x) *
            (sources.centreShare ** 2 * fringingFieldNormalSquared(x, z, sources.centreGap) +
              sources.outerShare ** 2 * fringingFieldNormalSquared(sources.windowWidth - x, z, sources.outerGap));
        }
      }
    }
    // Far from the gap's mouth the sum takes the logarithm from its atanh series (relative error below 2e-7).
    expect(gapFieldSum(layout, sources) / direct).toBeCloseTo(1, 7);
    // An odd count per layer (a conductor on the mid-plane, where Hx = 0).
    const odd = { ...layout, conductorsPerTurn: 1, turnsPerLayer: 9, turns: 9, layers: 1 };
    let oddDirect = 0;
    for (let t = 0; t < 9; t++) {
      const x = odd.keepOut + 0.5 * d;
      oddDirect += (odd.legPerimeter + 2 * Math.PI * x) * 0.45 ** 2 * fringingFieldNormalSquared(x, (t - 4) * d, 0.4e-3);
    }
    expect(gapFieldSum(odd, { ...sources, outerShare: 0 }) / oddDirect).toBeCloseTo(1, 7);
  });
});

describe('gap-field sum by the method of images in the window', () => {
  it("a strip current on the leg face in a large window is Roshen's half-plane field; the images vanish on the walls", () => {
    // A gap of MMF 1 as a strip of −1 over its length, 200 line currents: within 2 mm of it in a 100 m window the
    // images are far (the lone strip's unbalanced current leaves a uniform ~1/(2W), here 6e-5 of the field), and the
    // field is Roshen's (W. A. Roshen, IEEE Trans. Magnetics 43(8), 2007).
    const g = 1e-3;
    const W = 100;
    const H = 100;
    const x = 1.5e-3;
    const z = 0.8e-3;
    let hx = 0;
    let hz = 0;
    for (let k = 0; k < 200; k++) {
      const [fx, fz] = latticeField(x, z, 0, (-0.5 + (k + 0.5) / 200) * g, W, H);
      hx -= fx / 200;
      hz -= fz / 200;
    }
    expect((hx * hx) / fringingFieldNormalSquared(x, z, g)).toBeCloseTo(1, 3);
    expect((hx * hx + hz * hz) / fringingFieldSquared(x, z, g)).toBeCloseTo(1, 3);
    // μ → ∞ walls: no tangential field on the leg face (x = 0) nor on a yoke (z = H/2) of a small window.
    expect(Math.abs(latticeField(0, 2e-3, 3e-3, 1e-3, 5e-3, 12e-3)[1])).toBeLessThan(1e-9);
    expect(Math.abs(latticeField(2e-3, 6e-3, 3e-3, 1e-3, 5e-3, 12e-3)[0])).toBeLessThan(1e-9);
  });
  it('is zero without a gap and grows as the winding nears the gap', () => {
    const layout = {
      turns: 12,
      turnsPerLayer: 6,
      layers: 2,
      conductorsPerTurn: 1,
      overallDiameter: 0.6e-3,
      keepOut: 0.5e-3,
      legPerimeter: 35e-3,
    };
    const sources = { centreGap: 0.5e-3, centreShare: 0.95, outerGap: 0, outerShare: 0, windowWidth: 6e-3 };
    expect(gapFieldSumInWindow(layout, { ...sources, centreGap: 0 }, { height: 12e-3 })).toBe(0);
    const near = gapFieldSumInWindow(layout, sources, { height: 12e-3 });
    expect(near).toBeGreaterThan(0);
    expect(gapFieldSumInWindow({ ...layout, keepOut: 2e-3 }, sources, { height: 12e-3 })).toBeLessThan(0.5 * near);
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
    expect(near.copper.gapLoss!).toBeGreaterThan(0);
    expect(far.copper.gapLoss).toBeLessThan(0.5 * near.copper.gapLoss!);
    expect(near.winding.keepOut).toBe(0.5e-3);
    expect(near.totalLoss).toBeCloseTo(near.copper.dcLoss + near.copper.acLoss + near.copper.gapLoss! + near.coreLoss.loss, 12);
    const foil = wireSet.find((w) => w.kind === 'foil');
    if (foil) expect(evaluateDesign({ ...base, wire: foil }).copper.gapLoss).toBe(0);
  });
  it('refuses a negative keep-out by field', () => {
    expect(() => evaluateDesign({ ...base, keepOut: -1e-3 })).toThrow(/Keep-out/);
  });
});
