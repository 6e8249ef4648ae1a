import { describe, expect, it } from 'vitest';
import { MU0 } from '@shared/engine/constants';
import { biasedInductance, permeabilityFraction, powderInductanceFactor, powderTurns } from '@shared/engine/powder';
import { powderP, powderRing } from './fixtures';

const al = powderInductanceFactor(powderP.permeability, powderRing.ae, powderRing.le);

describe('distributed-gap toroid', () => {
  it('has AL = μ0·μi·Ae/le = 81.2 nH for μi 60 on the 26.9/14.7/11.2 ring (ungapped-core AL = μ0·μi·Ae/le on IEC 60205 values, computed)', () => {
    // 4π·1e-7·60·66.28e-6/61.53e-3 = 81.22 nH [C]
    expect(al * 1e9).toBeCloseTo(81.22, 1);
    expect(al).toBeCloseTo((MU0 * 60 * powderRing.ae) / powderRing.le, 20);
  });

  it('halves the permeability at H50 for the 1/(1 + (H/H50)^c) form (common practice, no source)', () => {
    expect(permeabilityFraction(powderP.rollOff, 8000)).toBeCloseTo(0.5, 12);
    expect(permeabilityFraction(undefined, 8000)).toBe(1);
  });

  it('returns the smallest N meeting L at the bias current (L = AL·N²·μ%(N·I/le), common practice, no source)', () => {
    for (const [target, current] of [
      [20e-6, 5],
      [30e-6, 11.5],
      [50e-6, 8],
    ] as const) {
      const result = powderTurns(target, current, al, powderRing.le, powderP.rollOff, 500);
      expect(result.feasible).toBe(true);
      expect(biasedInductance(result.turns, current, al, powderRing.le, powderP.rollOff)).toBeGreaterThanOrEqual(target);
      expect(biasedInductance(result.turns - 1, current, al, powderRing.le, powderP.rollOff)).toBeLessThan(target);
    }
  });

  it('finds L(N) falling for very large N when c > 2 and reports the target as infeasible (maximum of N²/(1 + k·N^c), derived algebraically)', () => {
    const steep = { a: 1, b: Math.pow(4000, -2.5), c: 2.5 };
    const current = 10;
    // N²/(1 + k·N^c) peaks where k·N^c = 2/(c − 2) [C]: k = b·(I/le)^c
    const k = steep.b * Math.pow(current / powderRing.le, steep.c);
    const peakTurns = Math.pow(2 / ((steep.c - 2) * k), 1 / steep.c);
    const lPeak = biasedInductance(Math.round(peakTurns), current, al, powderRing.le, steep);
    expect(biasedInductance(Math.round(2 * peakTurns), current, al, powderRing.le, steep)).toBeLessThan(lPeak);
    const result = powderTurns(lPeak * 1.2, current, al, powderRing.le, steep, 10_000);
    expect(result.feasible).toBe(false);
    expect(result.reason).toBe('L-maximum');
  });

  it('reports a full window as infeasible', () => {
    const result = powderTurns(1e-3, 1, al, powderRing.le, powderP.rollOff, 40);
    expect(result.feasible).toBe(false);
    expect(result.reason).toBe('turn-limit');
  });
});
