// Copper foil by Dowell's one-dimensional model: a foil turn spanning the window is Dowell's layer itself, so
// Δ = h/δ with no porosity correction, and N turns wound one per layer make N layers.
// Dowell, "Effects of eddy currents in transformer windings", Proc. IEE 113(8), 1966, pp. 1387–1394:
// Fr = Δ·[(sinh 2Δ + sin 2Δ)/(cosh 2Δ − cos 2Δ) + (2(m² − 1)/3)·(sinh Δ − sin Δ)/(cosh Δ + cos Δ)].
import { describe, expect, it } from 'vitest';
import { standardFoilOptions } from '@shared/catalogue/foil';
import { dowellFactor, foilDelta, roundWireDelta } from '@shared/engine/dowell';
import { foilWidth, layWinding, type WindingGeometry } from '@shared/engine/winding';
import { etd34Like } from './fixtures';

/** Dowell's closed form written out independently of the engine's split into skin and proximity terms. */
function dowellClosedForm(delta: number, layers: number): number {
  const skin = (Math.sinh(2 * delta) + Math.sin(2 * delta)) / (Math.cosh(2 * delta) - Math.cos(2 * delta));
  const proximity = (Math.sinh(delta) - Math.sin(delta)) / (Math.cosh(delta) + Math.cos(delta));
  return delta * (skin + ((2 * (layers * layers - 1)) / 3) * proximity);
}

describe("copper foil in Dowell's model", () => {
  it('gives Fr = 1.0856 for one layer at Δ = 1 and 3.6486 for five layers (Dowell 1966, computed from the closed form)', () => {
    expect(dowellFactor(1, 1)).toBeCloseTo(1.0856, 4);
    expect(dowellFactor(1, 5)).toBeCloseTo(3.6486, 4);
    for (const delta of [0.05, 0.3, 1, 2.5, 8]) {
      for (const layers of [1, 2, 7, 20]) expect(dowellFactor(delta, layers) / dowellClosedForm(delta, layers) - 1).toBeCloseTo(0, 10);
    }
  });

  it('takes Δ = h/δ for foil, without the (π/4)^¾·√η correction a round wire needs', () => {
    const skinDepth = 0.2e-3; // copper near 100 kHz at 20 °C: δ ≈ 66/√f mm ≈ 0.21 mm (common practice, no source)
    expect(foilDelta(0.1e-3, skinDepth)).toBeCloseTo(0.5, 12);
    // A round wire of the same size, fully packed (η = 1), is a thinner equivalent layer: (π/4)^¾ ≈ 0.834.
    expect(roundWireDelta(0.1e-3, skinDepth, 1) / foilDelta(0.1e-3, skinDepth)).toBeCloseTo((Math.PI / 4) ** 0.75, 12);
  });

  it('winds N turns as N layers of one turn, as wide as the window less its edge margins', () => {
    const foil = standardFoilOptions().find((w) => Math.abs(w.strandDiameter - 0.1e-3) < 1e-9)!;
    const out: WindingGeometry = { turnsPerLayer: 0, layers: 0, buildHeight: 0, meanTurnLength: 0 };
    layWinding(12, foil, etd34Like, out);
    expect(out.turnsPerLayer).toBe(1);
    expect(out.layers).toBe(12);
    expect(foilWidth(etd34Like)).toBeGreaterThan(0);
    expect(foilWidth(etd34Like)).toBeLessThan(etd34Like.windowHeight);
  });

  it('loses more, turn for turn, as the foil thickens past about one skin depth (Dowell 1966: optimum Δ falls as m rises)', () => {
    const layers = 10;
    // Loss ∝ Fr/h for a fixed copper width: compare h = 0.5δ, δ and 2δ.
    const lossPerThickness = (delta: number) => dowellFactor(delta, layers) / delta;
    expect(lossPerThickness(0.5)).toBeLessThan(lossPerThickness(2));
  });
});
