import { describe, expect, it } from 'vitest';
import { copperResistanceRatio } from '@shared/engine/copper';
import { coreLossTemperatureFactor } from '@shared/engine/core-loss';
import {
  TEMPERATURE_FACTOR_FLOOR,
  THERMAL_MODEL_LIMIT,
  ThermalSolution,
  coreVolumeThermalResistance,
  emptyWoundCoreLoss,
  solveTemperature,
  surfaceDissipationRise,
  type WoundCoreLoss,
} from '@shared/engine/thermal';

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
  const rthVolume = coreVolumeThermalResistance(7.64e-6);
  const loss = (over: Partial<WoundCoreLoss>): WoundCoreLoss => ({ ...emptyWoundCoreLoss(), ...over });

  it('uses the larger rise of the two laws: the surface law and loss × Rth(Ve)', () => {
    const solution = solveTemperature(40, loss({ coreLossReference: 2 }), 40e-4, rthVolume);
    expect(solution.totalLoss).toBe(2);
    expect(solution.rise.bySurface).toBe(surfaceDissipationRise(2, 40e-4));
    expect(solution.rise.byVolume).toBeCloseTo(2 * rthVolume, 12);
    expect(solution.rise.design).toBe(Math.max(solution.rise.bySurface, solution.rise.byVolume));
  });

  it('settles to a self-consistent rise within 0.1 K, copper following ρ(T)/ρ20 (copper α20, from memory)', () => {
    const solution = solveTemperature(40, loss({ resistance20: 0.012, dcCurrentSquare: 100, coreLossReference: 0.3 }), 60e-4, rthVolume);
    expect(solution.converged).toBe(true);
    // The last pass evaluated the losses at a temperature within 0.1 K of the one reported.
    const lossTemperature = 20 + (solution.resistance / 0.012 - 1) / 0.00393;
    expect(Math.abs(lossTemperature - (40 + solution.rise.design))).toBeLessThan(0.1);
    expect(solution.resistance / 0.012).toBeCloseTo(copperResistanceRatio(lossTemperature), 12);
    expect(solution.totalLoss).toBeCloseTo(solution.resistance * 100 + 0.3, 12);
  });

  it('never evaluates losses above the model limit and reports runaway when they would heat the part past it', () => {
    // A core loss that grows with T² (invented coefficients): no steady state exists below the limit.
    const temperatureCoefficients = { ct2: 1e-3, ct1: 0, ct0: 1 };
    const solution = solveTemperature(
      40,
      loss({ coreLossReference: 0.5, temperatureCoefficients }),
      10e-4,
      coreVolumeThermalResistance(0.7e-6),
    );
    expect(solution.runaway).toBe(true);
    expect(solution.temperatureFactor).toBe(coreLossTemperatureFactor(temperatureCoefficients, THERMAL_MODEL_LIMIT));
    // No absurd rise: every figure stops where the model stops (250 °C − 40 °C ambient).
    expect(solution.rise.design).toBe(THERMAL_MODEL_LIMIT - 40);
    expect(solution.rise.bySurface).toBeLessThanOrEqual(THERMAL_MODEL_LIMIT - 40);
    expect(solution.rise.byVolume).toBeLessThanOrEqual(THERMAL_MODEL_LIMIT - 40);
    const calm = solveTemperature(40, loss({ coreLossReference: 0.2 }), 60e-4, rthVolume);
    expect(calm.runaway).toBe(false);
  });

  it('reuses the solution object it is given', () => {
    const reused = new ThermalSolution();
    expect(solveTemperature(40, loss({ coreLossReference: 0.2 }), 60e-4, rthVolume, reused)).toBe(reused);
  });

  it('takes the copper resistance at the hot spot, not at the surface (copper α20, from memory)', () => {
    const solution = solveTemperature(
      40,
      loss({ resistance20: 0.012, dcCurrentSquare: 100, coreLossReference: 0.3, copperAboveSurface: 5 }),
      60e-4,
      rthVolume,
    );
    const copperTemperature = 20 + (solution.resistance / 0.012 - 1) / 0.00393;
    expect(Math.abs(copperTemperature - (40 + solution.rise.design + 5))).toBeLessThan(0.2);
  });

  it('never lets a temperature factor ≤ 0 make the core loss negative (a loss is ≥ 0 by definition)', () => {
    // ct2·T² − ct1·T + ct0 = 1e-4·T² − 0.03·T + 1.5 is −0.5 at 100 °C (invented coefficients)
    const temperatureCoefficients = { ct2: 1e-4, ct1: 0.03, ct0: 1.5 };
    expect(coreLossTemperatureFactor(temperatureCoefficients, 100)).toBeCloseTo(-0.5, 12);
    const solution = solveTemperature(60, loss({ coreLossReference: 5, temperatureCoefficients }), 60e-4, rthVolume);
    expect(solution.rawTemperatureFactor).toBeLessThanOrEqual(0);
    expect(solution.temperatureFactor).toBe(TEMPERATURE_FACTOR_FLOOR);
    expect(solution.totalLoss).toBeGreaterThan(0);
  });
});
