import { describe, expect, it } from 'vitest';
import {
  THERMAL_MODEL_LIMIT,
  ThermalSolution,
  coreVolumeThermalResistance,
  solveTemperature,
  surfaceDissipationRise,
} from '@shared/engine/thermal';

describe('surface-dissipation law ΔT = 450·ψ^0.826', () => {
  it('gives ≈25 °C at 0.03 W/cm² and ≈50 °C at 0.07 W/cm² (McLyman, from memory; anchor points [C] in magnetics.md §9.1)', () => {
    // At = 1e-4 m² = 1 cm², so ψ = P
    expect(Math.abs(surfaceDissipationRise(0.03, 1e-4) - 25)).toBeLessThan(0.5);
    expect(Math.abs(surfaceDissipationRise(0.07, 1e-4) - 50)).toBeLessThan(0.5);
  });

  it('takes the surface in cm² (a 1 W part with 50 cm² gives 450·0.02^0.826 = 17.9 K [C])', () => {
    expect(surfaceDissipationRise(1, 50e-4)).toBeCloseTo(450 * 0.02 ** 0.826, 9);
  });
});

describe('core-volume thermal resistance Rth = 53·Ve^−0.54', () => {
  it('matches the Encyclopedia Magnetica table for E25, E32, E42, E55 (Maniktala via Encyclopedia Magnetica [S], magnetics.md §12.2)', () => {
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

  it('uses the larger rise of the two laws: the surface law and loss × Rth(Ve)', () => {
    const solution = solveTemperature(40, { lossAt: () => 2 }, 40e-4, rthVolume);
    expect(solution.rise.bySurface).toBe(surfaceDissipationRise(2, 40e-4));
    expect(solution.rise.byVolume).toBeCloseTo(2 * rthVolume, 12);
    expect(solution.rise.design).toBe(Math.max(solution.rise.bySurface, solution.rise.byVolume));
  });

  it('settles to a self-consistent rise within 0.1 K', () => {
    const lossAt = (t: number) => 1.2 * (1 + 0.00393 * (t - 20)) + 0.3;
    const solution = solveTemperature(40, { lossAt }, 60e-4, rthVolume);
    expect(solution.converged).toBe(true);
    const again = solveTemperature(40, { lossAt: () => lossAt(40 + solution.rise.design) }, 60e-4, rthVolume).rise.design;
    expect(Math.abs(again - solution.rise.design)).toBeLessThan(0.1);
  });

  it('starts at ambient, and the reported rise comes from the last loss it asked for', () => {
    const asked: number[] = [];
    const lossAt = (t: number) => {
      asked.push(t);
      return 0.02 * t;
    };
    const solution = solveTemperature(40, { lossAt }, 60e-4, rthVolume);
    expect(asked[0]).toBe(40);
    expect(asked).toHaveLength(solution.passes);
    const last = lossAt(asked.at(-1)!);
    expect(solution.rise.design).toBe(Math.max(surfaceDissipationRise(last, 60e-4), last * rthVolume));
  });

  it('never evaluates losses above the model limit and reports runaway when they would heat the part past it', () => {
    const asked: number[] = [];
    // A loss that doubles every 10 K: no steady state exists below the limit.
    const lossAt = (t: number) => {
      asked.push(t);
      return 0.5 * 2 ** ((t - 40) / 10);
    };
    const solution = solveTemperature(40, { lossAt }, 10e-4, coreVolumeThermalResistance(0.7e-6));
    expect(solution.runaway).toBe(true);
    expect(Math.max(...asked)).toBeLessThanOrEqual(THERMAL_MODEL_LIMIT);
    expect(Number.isFinite(solution.rise.design)).toBe(true);
    const calm = solveTemperature(40, { lossAt: () => 0.2 }, 60e-4, rthVolume);
    expect(calm.runaway).toBe(false);
  });

  it('reuses the solution object it is given', () => {
    const reused = new ThermalSolution();
    expect(solveTemperature(40, { lossAt: () => 0.2 }, 60e-4, rthVolume, reused)).toBe(reused);
  });
});
