import { describe, expect, it } from 'vitest';
import { solveAxiModel, skinDepthOf, type AxiModel } from '../../../server/solvers/field/design-field.ts';
import { REGION } from '../../../server/solvers/field/design-model.ts';
import type { Outline } from '../../../server/solvers/field/geo-builder.ts';
import { roundWireResistanceRatio } from '../../../server/solvers/field/round-wire.ts';

// The harmonic field model checked on closed forms before it is trusted on a design. A lone copper ring (wire 1 mm,
// ring radius 25 mm, in air) has the exact DC resistance R = 2πρ/∫(1/r)dA = ρ/(R0 − √(R0² − a²)) (Ohm's law over
// the ring's cross-section, from memory); its skin effect is that of a straight round wire,
// R_ac/R_dc = Re[(ka/2)·J0(ka)/J1(ka)], k = (1 − j)/δ (S. Ramo, J. R. Whinnery, T. Van Duzer, Fields and Waves in
// Communication Electronics, Wiley, the round wire's internal impedance — from memory), the ring's curvature
// (a/R0 = 0.02) changing it by far less than the 2 % allowed. Copper at 20 °C, ρ = 1.7241e-8 Ω·m (IEC 60028).

const RHO = 1.7241e-8;
const D = 1e-3;
const R0 = 25e-3;
const BOX = 100e-3;
/** Frequency at which the wire's diameter is `ratio` skin depths. */
const frequencyAt = (ratio: number) => (RHO * ratio * ratio) / (Math.PI * 4e-7 * Math.PI * D * D);

function loneRing(topFrequency: number): AxiModel {
  const delta = skinDepthOf(RHO, topFrequency);
  const outline: Outline = { kind: 'circle', centre: [R0, 0], radius: D / 2, size: Math.min((Math.PI * D) / 40, delta / 3) };
  const box: Outline = {
    kind: 'polygon',
    corners: [
      [0, -BOX],
      [BOX, -BOX],
      [BOX, BOX],
      [0, BOX],
    ],
  };
  return {
    hasCore: false,
    permeability: 1,
    view: { rMax: 2 * R0, zMin: -R0, zMax: R0 },
    surfaces: [
      { group: REGION.air, outline: box, holes: [outline] },
      { group: REGION.firstConductor, outline },
    ],
    sizeAt: () => BOX / 10,
    conductors: [{ region: REGION.firstConductor, layer: 0, turn: 0, share: 1, outline, area: (Math.PI * D * D) / 4 }],
  };
}

describe('round wire: exact skin effect', () => {
  it('has the known limits: 1 + x⁴/48 for small x = a/δ and x/2 + 1/4 for large', () => {
    expect(roundWireResistanceRatio(0.3, 1)).toBeCloseTo(1 + 0.3 ** 4 / 48, 6);
    expect(Math.abs(roundWireResistanceRatio(10, 1) / 5.25 - 1)).toBeLessThan(0.002);
    expect(roundWireResistanceRatio(2, 1)).toBeGreaterThan(1.2);
  });
});

describe('lone ring conductor: field solution against the closed forms', () => {
  it('DC within 0.5 % and AC within 2 % at d/δ = 1, 3 and 6', async () => {
    const ratios = [1, 3, 6];
    const field = await solveAxiModel(loneRing(frequencyAt(6)), { resistivity: RHO, frequencies: [1, ...ratios.map(frequencyAt)] });
    const exactDc = RHO / (R0 - Math.sqrt(R0 * R0 - (D / 2) ** 2));
    expect(Math.abs(field.dcResistance / exactDc - 1)).toBeLessThan(1e-9);
    // At 1 Hz the wire is 0.0067 skin depths: the harmonic solve is the DC resistance of the meshed section.
    expect(Math.abs(field.harmonics[0]!.resistance / exactDc - 1)).toBeLessThan(0.005);
    ratios.forEach((ratio, i) => {
      const exact = exactDc * roundWireResistanceRatio(D / 2, skinDepthOf(RHO, frequencyAt(ratio)));
      expect(Math.abs(field.harmonics[i + 1]!.resistance / exact - 1)).toBeLessThan(0.02);
    });
    // The check can tell: at d/δ = 6 the AC resistance is far from the DC one.
    expect(field.harmonics[3]!.resistance / exactDc).toBeGreaterThan(1.5);
  }, 60_000);
});
