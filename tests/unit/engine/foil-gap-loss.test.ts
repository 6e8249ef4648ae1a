import { describe, expect, it } from 'vitest';
import { MU0 } from '@shared/engine/constants';
import { foilGapLowFrequencyScale, foilGapResistance, type FoilGapLayout, type FoilGapSources } from '@shared/engine/foil-gap-loss';

// The foil gap-field model (shared/engine/foil-gap-loss.ts: Rabins' axial Fourier series with the foil turns as
// conducting slabs) against closed forms derived here in its limits; against the 2-D field solution in
// tests/unit/solvers/foil-gap-loss.test.ts.

const RHO = 1.7241e-8; // copper at 20 °C (IEC 60028)
const skinDepth = (f: number) => Math.sqrt(RHO / (Math.PI * f * MU0));

const layout = (over: Partial<FoilGapLayout> = {}): FoilGapLayout => ({
  layers: 6,
  thickness: 0.1e-3,
  pitch: 0.15e-3,
  keepOut: 0.5e-3,
  windowWidth: 5e-3,
  windowHeight: 11e-3,
  legPerimeter: 0.035,
  ...over,
});
const ground = (gap = 0.5e-3, share = 0.95): FoilGapSources => ({ centreGap: gap, centreShare: share, outerGap: 0, outerShare: 0 });

/**
 * The thin-foil low-frequency form: a foil of thickness t at distance x from the leg face carries
 * J(z) = −jωσμ0·(Ψ(z) − Ψ̄), Ψ(z) = ∫Hx dz, with its mean over the turn removed (the turn's net current is Dowell's), so
 * it loses (ω²σμ0²t/2)·∫(Ψ − Ψ̄)² dz per unit length at the peak MMF F. The field: Roshen's half-plane field of the gap
 * (W. A. Roshen, IEEE Trans. Magnetics 43(8), 2007, from memory) with the yokes as mirrors, the gap repeated every
 * window height H and the row summed in closed form (gap-field-loss.ts, fringingFieldNormalSquaredInWindow; the method
 * of images, J. Hu and C. R. Sullivan, IEEE Trans. Power Electronics 16(4), 2001, from memory):
 *   Hx = (F/(2πg))·ln[(sinh²(πx/H) + sin²(π(z + g/2)/H))/(sinh²(πx/H) + sin²(π(z − g/2)/H))].
 * Summed over one period by the trapezoid rule; the foil spans the window height, as the model takes it.
 */
function imagedThinFoil(x: number, t: number, gap: number, H: number, mmfPeak: number, frequency: number, length: number): number {
  const steps = 200_000;
  const dz = H / steps;
  const h = gap / 2;
  const s = Math.sinh((Math.PI * x) / H) ** 2;
  const hx = (z: number) =>
    (mmfPeak / (2 * Math.PI * gap)) * Math.log((s + Math.sin((Math.PI * (z + h)) / H) ** 2) / (s + Math.sin((Math.PI * (z - h)) / H) ** 2));
  let psi = 0;
  let sum = 0;
  let sumSquare = 0;
  let previous = hx(-H / 2);
  for (let i = 1; i <= steps; i++) {
    const value = hx(-H / 2 + i * dz);
    psi += ((previous + value) / 2) * dz;
    previous = value;
    sum += psi * dz;
    sumSquare += psi * psi * dz;
  }
  const integral = sumSquare - (sum * sum) / H;
  const omega = 2 * Math.PI * frequency;
  return ((omega * omega * MU0 * MU0 * t) / (2 * RHO)) * integral * length;
}

describe('foil gap-field loss', () => {
  it('thin foil at low frequency: the unshielded form ω²σ·scale', () => {
    // At 100 Hz (t/δ = 0.015, 2·N·t·x0/δ² = 1.4e-3) the foils' own field is negligible; by 1 kHz they shield 7 %.
    const l = layout();
    const scale = foilGapLowFrequencyScale(l, ground(), 6);
    const ratio = (f: number) => foilGapResistance(l, ground(), 6, f, RHO) / (((2 * Math.PI * f) ** 2 * scale) / RHO);
    expect(ratio(100)).toBeCloseTo(1, 4);
    expect(ratio(1e3)).toBeLessThan(0.95);
  });

  it("thin foil at low frequency: the squared-field-integral form with Roshen's field and the yokes' images", () => {
    // One 10 µm foil 1 mm from the leg face, window 20 mm high and 60 mm wide (the outer leg far away).
    const x0 = 1e-3;
    const t = 10e-6;
    const gap = 0.5e-3;
    const f = 200;
    const H = 20e-3;
    const l = layout({ layers: 1, thickness: t, pitch: t, keepOut: x0, windowWidth: 60e-3, windowHeight: H, legPerimeter: 0.03 });
    const engine = foilGapResistance(l, ground(gap, 1), 1, f, RHO);
    const x = x0 + t / 2;
    // 1 A r.m.s.: peak MMF √2 (one turn, the whole MMF across the gap).
    const closed = imagedThinFoil(x, t, gap, H, Math.SQRT2, f, 0.03 + 2 * Math.PI * x);
    expect(engine / closed).toBeGreaterThan(0.99);
    expect(engine / closed).toBeLessThan(1.01);
  });

  it('thick foil: the surface-resistance form Σ (Rs/4)·|h_m|²·sech²(k_m·x0)', () => {
    // One 1 mm foil (15 δ at 1 MHz) 5 mm from the face: the field does not pass it, and the face-to-foil channel
    // carries the harmonic m with Hz = h_m/cosh(k_m·x0) at the copper (derived here: a(x0) = 0 for a perfect shield).
    const f = 1e6;
    const delta = skinDepth(f);
    const x0 = 5e-3;
    const H = 0.05;
    const gap = 1e-3;
    const l = layout({ layers: 1, thickness: 1e-3, pitch: 1e-3, keepOut: x0, windowWidth: 0.03, windowHeight: H, legPerimeter: 1 });
    const engine = foilGapResistance(l, ground(gap, 1), 1, f, RHO);
    const rs = RHO / delta;
    const length = 1 + 2 * Math.PI * (x0 + 0.5e-3);
    let closed = 0;
    for (let m = 1; m < 2000; m++) {
      const k = (2 * Math.PI * m) / H;
      const h = ((2 * Math.SQRT2) / H) * (Math.sin((k * gap) / 2) / ((k * gap) / 2));
      closed += ((rs / 4) * h * h) / Math.cosh(k * x0) ** 2;
    }
    closed *= H * length;
    // The neglected terms are of order δ/x0 and k·δ (about 1 %).
    expect(engine / closed).toBeGreaterThan(0.98);
    expect(engine / closed).toBeLessThan(1.03);
  });

  it('a foil stack shields itself: far below the unshielded form at 100 kHz', () => {
    const l = layout();
    const omega = 2 * Math.PI * 100e3;
    const ratio = foilGapResistance(l, ground(), 6, 100e3, RHO) / ((omega * omega * foilGapLowFrequencyScale(l, ground(), 6)) / RHO);
    // Six 0.1 mm foils (δ = 0.21 mm) 0.5 mm from the face: δ²/(N·t) = 0.07 mm, far shorter than the field's reach.
    expect(ratio).toBeLessThan(0.02);
    expect(ratio).toBeGreaterThan(0);
  });

  it('the outer-leg gap mirrors the centre-leg gap', () => {
    // Turn lengths made equal (a long leg perimeter), so the window is symmetric: the centre gap at keep-out k and the
    // outer gap with the winding mirrored (keep-out W − build − k) lose the same.
    const l = layout({ legPerimeter: 1e4 });
    const build = l.layers * l.pitch;
    const centre = foilGapResistance(l, ground(), 6, 100e3, RHO);
    const mirrored = foilGapResistance(
      { ...l, keepOut: l.windowWidth - build - l.keepOut },
      { centreGap: 0, centreShare: 0, outerGap: 0.5e-3, outerShare: 0.95 },
      6,
      100e3,
      RHO,
    );
    expect(mirrored / centre).toBeCloseTo(1, 3);
    // Both at once (a spacer) with half the share each: the fields add, one winding between two gaps.
    const both = foilGapResistance(
      { ...l, keepOut: (l.windowWidth - build) / 2 },
      { ...ground(0.5e-3, 0.5), outerGap: 0.5e-3, outerShare: 0.5 },
      6,
      100e3,
      RHO,
    );
    expect(both).toBeGreaterThan(0);
  });

  it('falls with keep-out towards zero; nothing without a gap; finite as the gap closes', () => {
    const at = (keepOut: number) => foilGapResistance(layout({ keepOut, windowWidth: 20e-3 }), ground(), 6, 100e3, RHO);
    const near = at(0.5e-3);
    let previous = near;
    for (const keepOut of [1e-3, 2e-3, 4e-3, 8e-3]) {
      const r = at(keepOut);
      expect(r).toBeLessThan(previous);
      previous = r;
    }
    expect(previous).toBeLessThan(1e-3 * near);
    expect(foilGapResistance(layout(), ground(0, 1), 6, 100e3, RHO)).toBe(0);
    const line = foilGapResistance(layout(), ground(1e-9), 6, 100e3, RHO);
    expect(line / foilGapResistance(layout(), ground(1e-6), 6, 100e3, RHO)).toBeCloseTo(1, 4);
  });

  it('scales as the square of the MMF', () => {
    const one = foilGapResistance(layout(), ground(0.5e-3, 0.5), 6, 100e3, RHO);
    expect(foilGapResistance(layout(), ground(0.5e-3, 1), 6, 100e3, RHO) / one).toBeCloseTo(4, 9);
  });
});
