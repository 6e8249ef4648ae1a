import { describe, expect, it } from 'vitest';
import { copperResistanceRatio } from '@shared/engine/copper';
import {
  AC_TEMPERATURE_NODES,
  AcTemperatureGrid,
  acLossSums,
  acLossTable,
  interpolateAtTemperature,
  rippleResistanceWeight,
  rippleWeightNodes,
} from '@shared/engine/copper-loss';
import { coreLossTemperatureFactor } from '@shared/engine/core-loss';
import { roundWireDelta } from '@shared/engine/dowell';
import { evaluateDesign, type EvaluateInput } from '@shared/engine/evaluate';
import { harmonicWeights } from '@shared/engine/harmonics';
import { copperSkinDepth } from '@shared/engine/skin-depth';
import { searchCandidates } from '@shared/engine/search';
import { etd44Like, ferriteA, roundWire, sectionOneSpec, wireSet } from './fixtures';

// Dowell, "Effects of eddy currents in transformer windings", Proc. IEE 113(8), 1966: Fr(Δ, m) per harmonic, with
// Δ = h/δ and δ = √(ρ/(π·f·μ0)) ∝ √ρ(T) (IEC 60028 ρ20, α20 from memory). "Direct" below sums the harmonics again at
// the copper temperature itself.
describe('the ripple AC factor read at the copper temperature from prepared sums', () => {
  function worstError(ambient: number): number {
    const reference = ambient + 50;
    const grid = new AcTemperatureGrid(reference, ambient, 250);
    const nodes = new Float64Array(AC_TEMPERATURE_NODES);
    let worst = 0;
    for (const delta of [0.05, 0.3, 1, 2, 5, 20]) {
      for (const duty of [0.1, 0.33, 0.5, 0.9]) {
        const weights = harmonicWeights(1, duty);
        const table = acLossTable(delta, weights, grid);
        for (const layers of [1, 3, 8, 16]) {
          rippleWeightNodes(table, layers, nodes);
          for (let t = ambient; t <= 250; t += 7) {
            const scaled = delta * Math.sqrt(copperResistanceRatio(reference) / copperResistanceRatio(t));
            const direct = rippleResistanceWeight(acLossSums(scaled, weights), layers);
            worst = Math.max(worst, Math.abs(interpolateAtTemperature(grid, nodes, t) / direct - 1));
          }
        }
      }
    }
    return worst;
  }

  it('stays within 0.05 % of a direct recomputation from 40 °C ambient to 250 °C (measured 8.2e-5)', () => {
    expect(worstError(40)).toBeLessThan(5e-4);
  });

  it('stays within 0.1 % from −40 °C ambient to 250 °C (measured 6.2e-4)', () => {
    expect(worstError(-40)).toBeLessThan(1e-3);
  });
});

describe('evaluateDesign temperatures', () => {
  // Two layers of 2.0 mm wire at 100 kHz (Δ ≈ 7): proximity loss dominates the ripple loss; the worked buck example runs cool on ETD44.
  const input: EvaluateInput = {
    spec: sectionOneSpec,
    limits: { inductanceTolerance: 0 },
    core: etd44Like,
    material: ferriteA,
    turns: 14,
    gap: 'auto',
    wire: roundWire(2.0e-3),
  };
  const result = evaluateDesign(input);
  const wire = input.wire;
  const weights = harmonicWeights(result.operatingPoint.rippleAtVinMax, result.operatingPoint.dutyAtVinMax);
  const porosity = wire.strandDiameter / wire.overallDiameter;
  const rippleWeightAt = (temperature: number) =>
    rippleResistanceWeight(
      acLossSums(roundWireDelta(wire.strandDiameter, copperSkinDepth(100e3, temperature), porosity), weights),
      result.winding.layers,
    );

  it('takes the AC factor at the part temperature, not at ambient + max rise', () => {
    expect(result.thermal.rise).toBeLessThan(40);
    expect(result.winding.layers).toBeGreaterThan(1);
    const direct = result.copper.resistanceHot * rippleWeightAt(result.thermal.surfaceTemperature);
    expect(Math.abs(result.copper.acLoss / direct - 1)).toBeLessThan(0.01);
    // the old shortcut (copper at 40 + 50 °C) under-predicts the proximity loss of this cooler part
    const shortcut = result.copper.resistanceHot * rippleWeightAt(90);
    expect(result.copper.acLoss / shortcut).toBeGreaterThan(1.02);
  });

  it('takes the DC resistance at the hot spot (surface + 5 K)', () => {
    expect(result.copper.resistanceHot / result.copper.resistance20).toBeCloseTo(copperResistanceRatio(result.thermal.hotSpot), 3);
  });
});

describe('a temperature factor that is negative where the core works', () => {
  // ct2·T² − ct1·T + ct0 = 1e-4·T² − 0.03·T + 1.5 (invented): 1 at 20 °C … −0.5 at 100 °C.
  const broken = { ...ferriteA, id: 'broken', name: 'broken fit', tempCoefficients: { ct2: 1e-4, ct1: 0.03, ct0: 1.5 } };
  const input: EvaluateInput = {
    spec: sectionOneSpec,
    limits: { ambient: 100 },
    core: etd44Like,
    material: broken,
    turns: 'auto',
    gap: 'auto',
    wire: roundWire(1.0e-3, 3),
  };

  it('gives no negative core loss and marks the part infeasible, naming the material and temperature', () => {
    expect(coreLossTemperatureFactor(broken.tempCoefficients, 100)).toBeCloseTo(-0.5, 12);
    const result = evaluateDesign(input);
    expect(result.coreLoss.loss).toBeGreaterThan(0);
    expect(result.coreLoss.temperatureFactor).toBeGreaterThan(0);
    expect(result.feasible).toBe(false);
    expect(result.issues.find((i) => i.code === 'temperature-factor')?.message).toMatch(
      /^The core-loss temperature factor of broken fit \(ct2·T² − ct1·T \+ ct0\) is -\d\.\d{3} at 1\d\d °C/,
    );
  });

  it('is never ranked: the search returns it as infeasible', () => {
    const search = searchCandidates({
      spec: sectionOneSpec,
      limits: { ambient: 100 },
      cores: [etd44Like],
      materials: [broken],
      wires: wireSet,
    });
    expect(search.candidates).toEqual([]);
    expect(search.infeasible.some((c) => c.reasons.some((r) => r.code === 'temperature-factor'))).toBe(true);
  });
});
