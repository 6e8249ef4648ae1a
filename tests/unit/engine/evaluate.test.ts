import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { evaluateDesign, lossVersusFrequency, type EvaluateInput } from '@shared/engine/evaluate';
import { EngineInputError } from '@shared/engine/errors';
import { COPPER_RESISTIVITY_20C } from '@shared/engine/constants';
import { copperResistivity } from '@shared/engine/copper';
import { coreLossTemperatureFactor, igseTriangleLoss } from '@shared/engine/core-loss';
import { THERMAL_MODEL_LIMIT, coreVolumeThermalResistance, surfaceDissipationRise } from '@shared/engine/thermal';
import { NetworkSolution, solveNetwork, thermalNetwork } from '@shared/engine/thermal-network';
import { e25Like, etd34Like, ferriteA, powderP, powderRing, roundWire, sectionOneSpec, tinyLike } from './fixtures';

const base: EvaluateInput = {
  spec: sectionOneSpec,
  limits: { inductanceTolerance: 0 },
  core: etd34Like,
  material: ferriteA,
  turns: 'auto',
  gap: 'auto',
  wire: roundWire(0.8e-3, 3),
};

describe('evaluateDesign on a gapped ferrite core', () => {
  const result = evaluateDesign(base);

  it('chooses 11 turns and a gap that meets 26.67 µH with fringing', () => {
    expect(result.turns).toBe(11);
    expect(result.inductance.nominal / (8e-5 / 3)).toBeCloseTo(1, 3);
    // fringing widens the 0.518 mm unfringed gap (McLyman, Transformer and Inductor Design Handbook, fringing factor F = 1 + (lg/√Ae)·ln(2G/lg) — from memory)
    expect(result.gap.total).toBeGreaterThan(0.5179e-3);
    expect(result.gap.fringingFactor).toBeGreaterThan(1);
    // a spacer makes two gaps that each fringe less than the ground gap: thinner than half of it (gap-placement.test.ts)
    expect(result.gap.spacer).toBeLessThan(result.gap.total / 2);
  });

  it("computes flux from volt-seconds and L·I/(N·Ae) (Faraday's law and N·Φ = L·I, derived algebraically)", () => {
    // ΔB = (Vin − Vout)·D/(fs·N·Ae) = 24·(1/3)/(1e5·11·97.1e-6) = 74.9 mT
    expect(result.flux.swing * 1e3).toBeCloseTo(74.9, 1);
    // Bpk = L·Ipk/(N·Ae) = 26.67e-6·11.5/(11·97.1e-6) = 0.2871 T
    expect(result.flux.peak).toBeCloseTo(0.2871, 3);
    expect(result.flux.acPeak).toBeCloseTo(result.flux.swing / 2, 15);
  });

  it('computes Rdc from ρ20·N·MLT/A and scales it with ρ(T) at the hot spot (IEC 60028 ρ20; α20 from memory)', () => {
    const area = (3 * Math.PI * 0.8e-3 ** 2) / 4;
    expect(result.copper.resistance20).toBeCloseTo((COPPER_RESISTIVITY_20C * 11 * 60e-3) / area, 12);
    const winding = result.thermal.hotSpot;
    expect(result.copper.resistanceHot / result.copper.resistance20).toBeCloseTo(copperResistivity(winding) / COPPER_RESISTIVITY_20C, 3);
    expect(result.copper.dcLoss).toBeCloseTo(result.copper.resistanceHot * 100, 9);
  });

  it('reports the iGSE below Steinmetz at D = 1/3 for α = 1.4 and adds the losses up', () => {
    expect(result.coreLoss.igseDensity).toBeLessThan(result.coreLoss.steinmetzDensity);
    expect(result.totalLoss).toBeCloseTo(result.copper.dcLoss + result.copper.acLoss + result.copper.gapLoss! + result.coreLoss.loss, 12);
    // the rise is the hotter node's; the hot spot is the winding node
    expect(result.thermal.rise).toBe(Math.max(result.thermal.coreTemperature!, result.thermal.windingTemperature!) - 40);
    expect(result.thermal.hotSpot).toBe(result.thermal.windingTemperature);
  });

  it('checks saturation in the minimum section Amin (common practice, no source)', () => {
    // Bpk·Ae/Amin = 0.2871·97.1/91.6 = 0.3044 T
    expect(result.flux.peakAtMinimumSection).toBeCloseTo(0.3044, 3);
    expect(result.flux.saturationMargin).toBeCloseTo(1 - result.flux.peakAtMinimumSection / result.flux.saturationAtHotSpot, 12);
    // Bsat linear through (25 °C, 0.50 T) and (100 °C, 0.39 T) of the invented material, at the hotter node
    expect(result.flux.saturationAtHotSpot).toBeCloseTo(0.5 - (0.11 * (result.thermal.surfaceTemperature - 25)) / 75, 12);
  });

  it('uses the same thermal network, laws and temperature factor as the stand-alone modules', () => {
    expect(result.thermal.riseBySurface).toBeCloseTo(surfaceDissipationRise(result.totalLoss, etd34Like.surfaceArea), 9);
    expect(result.thermal.riseByVolume).toBeCloseTo(result.totalLoss * coreVolumeThermalResistance(etd34Like.ve), 9);
    // the network solved on its own at the reported core and copper losses gives the reported nodes (within 0.1 K)
    const nodes = new NetworkSolution();
    nodes.coreTemperature = 40;
    nodes.windingTemperature = 40;
    const copper = result.copper.dcLoss + result.copper.acLoss + result.copper.gapLoss!;
    solveNetwork(thermalNetwork(etd34Like), { ambient: 40 }, result.coreLoss.loss, copper, nodes, 1e-9, 100);
    expect(Math.abs(nodes.coreTemperature - result.thermal.coreTemperature!)).toBeLessThan(0.1);
    expect(Math.abs(nodes.windingTemperature - result.thermal.windingTemperature!)).toBeLessThan(0.1);
    // the last pass evaluated losses less than 0.1 K away from the reported core temperature
    const factor = coreLossTemperatureFactor(ferriteA.tempCoefficients, result.thermal.coreTemperature!);
    expect(Math.abs(result.coreLoss.temperatureFactor - factor)).toBeLessThan(0.01);
    const igse = igseTriangleLoss(ferriteA, 100e3, result.flux.swing, 1 / 3);
    expect(result.coreLoss.igseDensity / (igse * result.coreLoss.temperatureFactor)).toBeCloseTo(1, 12);
    expect(result.coreLoss.loss).toBeCloseTo(result.coreLoss.igseDensity * etd34Like.ve, 12);
  });

  it('is feasible with no errors', () => {
    expect(result.feasible).toBe(true);
    expect(result.issues.filter((i) => i.severity === 'error')).toEqual([]);
  });
});

describe('evaluateDesign issues', () => {
  it('explains saturation in plain words when turns are too few', () => {
    const result = evaluateDesign({ ...base, turns: 7 });
    expect(result.feasible).toBe(false);
    const saturation = result.issues.find((i) => i.code === 'saturation');
    expect(saturation?.message).toMatch(
      /^Peak flux 0\.\d\d T \(in the narrowest section\) at \d+ °C exceeds 80 % of Bsat \(0\.\d\d T of 0\.\d\d T\)\.$/,
    );
  });

  it('explains a winding that does not fit the bobbin', () => {
    const result = evaluateDesign({ ...base, core: e25Like, turns: 60, wire: roundWire(1.0e-3) });
    const build = result.issues.find((i) => i.code === 'build');
    expect(build?.message).toMatch(/^Winding needs \d+\.\d\d mm build height \(\d+ layers\), the bobbin allows 4\.20 mm\.$/);
  });

  it('rejects a fixed turn count whose ungapped inductance is too low', () => {
    const lowPermeability = { ...ferriteA, permeability: 20 };
    const result = evaluateDesign({ ...base, material: lowPermeability, turns: 11 });
    expect(result.issues.map((i) => i.code)).toContain('negative-gap');
  });

  it('names the field of an impossible input', () => {
    expect(() => evaluateDesign({ ...base, turns: 0 })).toThrow(EngineInputError);
    try {
      evaluateDesign({ ...base, spec: { ...sectionOneSpec, vout: 30 } });
    } catch (error) {
      expect((error as EngineInputError).field).toBe('vout');
    }
  });

  it('never raises peak flux with more turns (gap re-solved each time)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 11, max: 40 }), fc.integer({ min: 1, max: 10 }), (turns, extra) => {
        const fewer = evaluateDesign({ ...base, turns });
        const more = evaluateDesign({ ...base, turns: turns + extra });
        expect(more.flux.peak).toBeLessThanOrEqual(fewer.flux.peak * (1 + 1e-12));
      }),
      { numRuns: 40 },
    );
  });
});

describe('evaluateDesign on a powder toroid', () => {
  const result = evaluateDesign({ ...base, limits: {}, core: powderRing, material: powderP });

  it('meets L_min at the check peak with the smallest N and reports L at zero bias, load and peak', () => {
    expect(result.inductance.minimum).toBeGreaterThanOrEqual(result.inductance.required);
    const fewer = evaluateDesign({ ...base, limits: {}, core: powderRing, material: powderP, turns: result.turns - 1 });
    expect(fewer.inductance.minimum).toBeLessThan(result.inductance.required);
    expect(result.inductance.nominal).toBeGreaterThan(result.inductance.atLoad);
    expect(result.inductance.atLoad).toBeGreaterThan(result.inductance.atPeak);
    expect(result.inductance.permeabilityAtPeak).toBeCloseTo(result.inductance.atPeak / result.inductance.nominal, 12);
  });
});

describe('loss versus frequency', () => {
  it('keeps the built part and shows core loss rising with frequency at fixed ripple current', () => {
    const points = lossVersusFrequency(base, [50e3, 100e3, 200e3]);
    expect(points).toHaveLength(3);
    expect(points[1]!.total).toBeCloseTo(evaluateDesign(base).totalLoss, 6);
    // lower frequency → more ripple (ΔI ∝ 1/f) and larger flux swing → more core loss
    expect(points[0]!.core).toBeGreaterThan(points[1]!.core);
  });

  it('says at which frequencies the part saturates or overheats', () => {
    // At a quarter of fs the same 26.67 µH carries four times the ripple (ideal buck relations, computed):
    // ΔI = 12·(1 − 12/36)/(25e3·26.67e-6) = 12 A, peak 16 A instead of 11.5 A, so the part built for 100 kHz saturates.
    const points = lossVersusFrequency(base, [25e3, 100e3]);
    expect(points.map((p) => p.feasible)).toEqual([false, true]);
  });
});

describe('evaluateDesign when the losses outrun the cooling (thermal runaway)', () => {
  // A tiny core, many turns of thin wire at 10 A: the copper alone would heat it far past any real limit.
  const runaway = evaluateDesign({ ...base, core: tinyLike, turns: 60, gap: 'auto', wire: roundWire(0.2e-3, 1) });

  it('says so and marks the design infeasible instead of reporting a diverged iteration', () => {
    expect(runaway.feasible).toBe(false);
    expect(runaway.issues.map((i) => i.code)).toContain('thermal-runaway');
    expect(runaway.thermal.runaway).toBe(true);
    // reported where the model stops, not as the thousands of kelvin the surface law gives for 250 °C losses
    expect(runaway.thermal.rise + 40).toBe(THERMAL_MODEL_LIMIT);
    expect(runaway.issues.find((i) => i.code === 'thermal-runaway')?.message).toMatch(/The rise is shown as 210 K, where the model stops/);
    expect(runaway.issues.find((i) => i.code === 'temperature-rise')?.message).toMatch(
      /^Temperature rise of more than 210 K \(thermal runaway\)/,
    );
  });

  it('evaluates the losses at the 250 °C model limit: Rhot/R20 = ρ(250 °C)/ρ20 (copper α20, from memory)', () => {
    expect(runaway.copper.resistanceHot / runaway.copper.resistance20).toBeCloseTo(
      copperResistivity(THERMAL_MODEL_LIMIT) / COPPER_RESISTIVITY_20C,
      9,
    );
    for (const figure of [runaway.totalLoss, runaway.coreLoss.loss, runaway.thermal.rise, runaway.flux.saturationMargin]) {
      expect(Number.isFinite(figure)).toBe(true);
    }
    // Bsat is never extrapolated below zero (a negative Bsat is not a material property).
    expect(runaway.flux.saturationAtHotSpot).toBeGreaterThanOrEqual(0);
  });
});
