import { describe, expect, it } from 'vitest';
import { MU0 } from '@shared/engine/constants';
import { evaluateDesign } from '@shared/engine/evaluate';
import {
  biasedFlux,
  biasedInductance,
  permeabilityFraction,
  powderInductanceFactor,
  powderTurns,
  rollOffIntegral,
} from '@shared/engine/powder';
import { powderP, powderRing, roundWire, sectionOneSpec } from './fixtures';

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

// A roll-off curve gives the incremental permeability μ_Δ = (1/μ0)·dB/dH at a bias (IEC 60050-221, "incremental
// permeability"), so B(H) = μ0·μi·∫₀^H μ%(h) dh. The closed forms below are plain calculus.
describe('flux of a distributed-gap core: the integral of the incremental permeability', () => {
  const h50 = 8000;
  const c1 = { a: 1, b: 1 / h50, c: 1 };

  it('gives H50·ln(1 + H/H50) for c = 1: at 50 % roll-off the flux is 2·ln 2 = 1.386 × μ%(H)·H', () => {
    for (const h of [100, 2000, h50, 5 * h50, 300 * h50]) {
      expect(rollOffIntegral(c1, h) / (h50 * Math.log(1 + h / h50))).toBeCloseTo(1, 10);
    }
    expect(rollOffIntegral(c1, h50) / (permeabilityFraction(c1, h50) * h50)).toBeCloseTo(2 * Math.LN2, 10);
  });

  it('gives H50·arctan(H/H50) for c = 2 and H/a without roll-off', () => {
    const c2 = { a: 1, b: Math.pow(h50, -2), c: 2 };
    for (const h of [500, h50, 20 * h50]) expect(rollOffIntegral(c2, h) / (h50 * Math.atan(h / h50))).toBeCloseTo(1, 10);
    expect(rollOffIntegral(undefined, 1234)).toBe(1234);
    expect(rollOffIntegral({ a: 2, b: 0, c: 1.3 }, 1234)).toBeCloseTo(617, 12);
  });

  it('rises with H and its slope is μ%(H) for the fixture exponent c = 1.3 (fundamental theorem of calculus)', () => {
    let previous = 0;
    for (let h = 10; h < 1e6; h *= 1.7) {
      const value = rollOffIntegral(powderP.rollOff, h);
      expect(value).toBeGreaterThan(previous);
      const step = h * 1e-5;
      const slope = (rollOffIntegral(powderP.rollOff, h + step) - rollOffIntegral(powderP.rollOff, h - step)) / (2 * step);
      expect(slope / permeabilityFraction(powderP.rollOff, h)).toBeCloseTo(1, 5);
      previous = value;
    }
  });

  it('keeps the inductance used for the ripple the incremental one: L(I) = dλ/dI with λ = N·Ae·B(N·I/le)', () => {
    const turns = 30;
    for (const current of [2, 8, 15]) {
      const step = current * 1e-6;
      const linkage = (i: number) => turns * powderRing.ae * biasedFlux(turns, i, powderP.permeability, powderRing.le, powderP.rollOff);
      const incremental = (linkage(current + step) - linkage(current - step)) / (2 * step);
      expect(incremental / biasedInductance(turns, current, al, powderRing.le, powderP.rollOff)).toBeCloseTo(1, 5);
    }
  });

  it('reports the integrated flux of a powder design, above the μ%(H)·H figure', () => {
    const result = evaluateDesign({
      spec: sectionOneSpec,
      core: powderRing,
      material: powderP,
      turns: 'auto',
      gap: 'auto',
      wire: roundWire(0.8e-3, 3),
    });
    const field = (result.turns * result.flux.checkCurrent) / powderRing.le;
    expect(result.flux.peak).toBeCloseTo(MU0 * 60 * rollOffIntegral(powderP.rollOff, field), 12);
    const understated = (result.inductance.atPeak * result.flux.checkCurrent) / (result.turns * powderRing.ae);
    expect(result.flux.peak).toBeGreaterThan(understated * 1.05);
  });
});
