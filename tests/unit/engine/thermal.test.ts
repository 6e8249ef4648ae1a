import { describe, expect, it } from 'vitest';
import { copperResistanceRatio } from '@shared/engine/copper';
import { coreLossTemperatureFactor } from '@shared/engine/core-loss';
import {
  TEMPERATURE_FACTOR_FLOOR,
  THERMAL_MODEL_LIMIT,
  ThermalSolution,
  coreVolumeThermalResistance,
  emptyWoundCoreLoss,
  prepareThermalPart,
  solveTemperature,
  surfaceDissipationRise,
  type WoundCoreLoss,
} from '@shared/engine/thermal';
import { NetworkSolution, solveNetwork } from '@shared/engine/thermal-network';
import { etd34Like, powderRing, tinyLike } from './fixtures';

describe('surface-dissipation law ΔT = 450·ψ^0.826', () => {
  it('gives ≈25 °C at 0.03 W/cm² and ≈50 °C at 0.07 W/cm² (McLyman, Transformer and Inductor Design Handbook — from memory; anchor points computed from the formula)', () => {
    // At = 1e-4 m² = 1 cm², so ψ = P
    expect(Math.abs(surfaceDissipationRise(0.03, 1e-4) - 25)).toBeLessThan(0.5);
    expect(Math.abs(surfaceDissipationRise(0.07, 1e-4) - 50)).toBeLessThan(0.5);
  });

  it('takes the surface in cm² (a 1 W part with 50 cm² gives 450·0.02^0.826 = 17.9 K [C])', () => {
    expect(surfaceDissipationRise(1, 50e-4)).toBeCloseTo(450 * 0.02 ** 0.826, 9);
  });
});

describe('core-volume thermal resistance Rth = 53·Ve^−0.54', () => {
  it('matches the Encyclopedia Magnetica table for E25, E32, E42, E55 (Maniktala, Switching Power Supplies A–Z, 2nd ed., p. 155, via Encyclopedia Magnetica)', () => {
    const cases: [number, number][] = [
      [3.02e-6, 29],
      [6.14e-6, 20],
      [17.3e-6, 11],
      [43.7e-6, 7],
    ];
    for (const [ve, rth] of cases) expect(Math.abs(coreVolumeThermalResistance(ve) - rth)).toBeLessThan(0.5);
  });
});

describe('loss ↔ temperature iteration', () => {
  const etd = prepareThermalPart(etd34Like);
  const still = { ambient: 40, airSpeed: 0 };
  const loss = (over: Partial<WoundCoreLoss>): WoundCoreLoss => ({ ...emptyWoundCoreLoss(), ...over });

  it("takes the hotter node's rise; the surface law everywhere and the volume law only on E-type cores as cross-checks", () => {
    const solution = solveTemperature(still, loss({ coreLossReference: 2 }), etd);
    expect(solution.totalLoss).toBe(2);
    expect(solution.rise.design).toBe(Math.max(solution.coreTemperature, solution.windingTemperature) - 40);
    expect(solution.rise.bySurface).toBe(surfaceDissipationRise(2, etd34Like.surfaceArea));
    expect(solution.rise.byVolume).toBeCloseTo(2 * coreVolumeThermalResistance(etd34Like.ve), 12);
    // all the loss in the core: the core is the hotter node
    expect(solution.coreTemperature).toBeGreaterThan(solution.windingTemperature);
    const ring = solveTemperature(still, loss({ coreLossReference: 2 }), prepareThermalPart(powderRing));
    expect(ring.rise.byVolume).toBeNaN();
    expect(ring.rise.bySurface).toBe(surfaceDissipationRise(2, powderRing.surfaceArea));
  });

  it('settles where the network, solved again at the reported losses, gives the same temperatures (within 0.1 K)', () => {
    const solution = solveTemperature(still, loss({ resistance20: 0.012, dcCurrentSquare: 100, coreLossReference: 0.3 }), etd);
    expect(solution.converged).toBe(true);
    expect(solution.totalLoss).toBeCloseTo(solution.copperLoss + solution.coreLoss, 12);
    const again = new NetworkSolution();
    again.coreTemperature = 40;
    again.windingTemperature = 40;
    solveNetwork(etd.network, still, solution.coreLoss, solution.copperLoss, again, 1e-9, 100);
    expect(Math.abs(again.coreTemperature - solution.coreTemperature)).toBeLessThan(0.1);
    expect(Math.abs(again.windingTemperature - solution.windingTemperature)).toBeLessThan(0.1);
  });

  it('settles in a few passes: the surface-law start, then Newton steps on both node balances with the losses', () => {
    // The start and two steps are the usual count (the last step moves < 0.1 K); the old fixed-point scheme took about 3
    // passes of 2–3 network iterations each.
    const solution = solveTemperature(still, loss({ resistance20: 0.012, dcCurrentSquare: 100, coreLossReference: 0.3 }), etd);
    expect(solution.converged).toBe(true);
    expect(solution.passes).toBeLessThanOrEqual(4);
    expect(solution.network.iterations).toBe(solution.passes - 1);
  });

  it('takes the copper resistance at the winding node (copper α20, from memory)', () => {
    const solution = solveTemperature(still, loss({ resistance20: 0.012, dcCurrentSquare: 100, coreLossReference: 0.3 }), etd);
    const copperTemperature = 20 + (solution.resistance / 0.012 - 1) / 0.00393;
    expect(Math.abs(copperTemperature - solution.windingTemperature)).toBeLessThan(0.1);
    expect(solution.resistance / 0.012).toBeCloseTo(copperResistanceRatio(copperTemperature), 12);
    expect(solution.totalLoss).toBeCloseTo(solution.resistance * 100 + 0.3, 12);
  });

  it('never evaluates losses above the model limit and reports runaway when they would heat the part past it', () => {
    // A core loss that grows with T² (invented coefficients) on a small core: no steady state below the limit.
    const temperatureCoefficients = { ct2: 1e-3, ct1: 0, ct0: 1 };
    const solution = solveTemperature(still, loss({ coreLossReference: 0.5, temperatureCoefficients }), prepareThermalPart(tinyLike));
    expect(solution.runaway).toBe(true);
    expect(solution.temperatureFactor).toBe(coreLossTemperatureFactor(temperatureCoefficients, THERMAL_MODEL_LIMIT));
    // No absurd rise: every figure stops where the model stops (250 °C − 40 °C ambient).
    expect(solution.rise.design).toBe(THERMAL_MODEL_LIMIT - 40);
    expect(solution.rise.bySurface).toBeLessThanOrEqual(THERMAL_MODEL_LIMIT - 40);
    expect(solution.coreTemperature).toBeLessThanOrEqual(THERMAL_MODEL_LIMIT);
    const calm = solveTemperature(still, loss({ coreLossReference: 0.2 }), etd);
    expect(calm.runaway).toBe(false);
  });

  it('reuses the solution object it is given', () => {
    const reused = new ThermalSolution();
    expect(solveTemperature(still, loss({ coreLossReference: 0.2 }), etd, reused)).toBe(reused);
  });

  it('runs cooler with forced air and with a board path than in still air', () => {
    const heat = loss({ resistance20: 0.012, dcCurrentSquare: 100, coreLossReference: 0.5 });
    const calm = solveTemperature(still, heat, etd).rise.design;
    expect(solveTemperature({ ambient: 40, airSpeed: 2 }, heat, etd).rise.design).toBeLessThan(calm);
    expect(solveTemperature({ ambient: 40, airSpeed: 0, boardThermalResistance: 10 }, heat, etd).rise.design).toBeLessThan(calm);
  });

  it('never lets a temperature factor ≤ 0 make the core loss negative (a loss is ≥ 0 by definition)', () => {
    // ct2·T² − ct1·T + ct0 = 1e-4·T² − 0.03·T + 1.5 is −0.5 at 100 °C (invented coefficients)
    const temperatureCoefficients = { ct2: 1e-4, ct1: 0.03, ct0: 1.5 };
    expect(coreLossTemperatureFactor(temperatureCoefficients, 100)).toBeCloseTo(-0.5, 12);
    // at 100 °C ambient the floored loss (0.05 W) heats the core a little, and the factor stays ≤ 0 there
    const solution = solveTemperature({ ambient: 100, airSpeed: 0 }, loss({ coreLossReference: 5, temperatureCoefficients }), etd);
    expect(solution.rawTemperatureFactor).toBeLessThanOrEqual(0);
    expect(solution.temperatureFactor).toBe(TEMPERATURE_FACTOR_FLOOR);
    expect(solution.totalLoss).toBeGreaterThan(0);
  });
});
