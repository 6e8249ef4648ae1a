import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { permeabilityFraction } from '@shared/engine/powder';
import {
  fitRollOff,
  linearisedRollOff,
  rollOffFraction,
  rollOffFromEngine,
  rollOffToEngine,
  type RollOff,
  type RollOffPoint,
} from '@shared/fitting/rolloff-fit';
import { noiseFactor, refusal, relative, seededUniform } from './support';

const rollOffs = fc.record({
  halfField: fc.double({ min: 100, max: 1e5, noNaN: true }),
  steepness: fc.double({ min: 0.5, max: 4, noNaN: true }),
});
const fields = fc.double({ min: 0, max: 1e6, noNaN: true });

/** Fields log-evenly from 100 A/m to 100 kA/m. */
const FIELDS = Array.from({ length: 19 }, (_, i) => 100 * 10 ** (i / 6));
const pointsOf = (r: RollOff, noise: () => number = () => 1): RollOffPoint[] =>
  FIELDS.map((field) => ({ field, fraction: rollOffFraction(r, field) * noise() }));

describe('roll-off μ/μi = 1/(1 + (H/H½)ⁿ) against the engine form 1/(a + b·H^c) (algebraic identity: a = 1, b = H½^−n, c = n)', () => {
  it('gives the engine the same curve at every field', () => {
    fc.assert(
      fc.property(rollOffs, fields, (r, h) => {
        expect(relative(permeabilityFraction(rollOffToEngine(r), h), rollOffFraction(r, h))).toBeLessThan(1e-12);
      }),
    );
  });

  it('is one at zero field and one half at H½', () => {
    fc.assert(
      fc.property(rollOffs, (r) => {
        expect(rollOffFraction(r, 0)).toBe(1);
        expect(rollOffFraction(r, r.halfField)).toBeCloseTo(0.5, 14);
      }),
    );
  });

  it('round-trips ours → engine → ours exactly', () => {
    fc.assert(
      fc.property(rollOffs, (r) => {
        const back = rollOffFromEngine(rollOffToEngine(r));
        expect(back.exact).toBe(true);
        expect(relative(back.rollOff.halfField, r.halfField)).toBeLessThan(1e-12);
        expect(back.rollOff.steepness).toBe(r.steepness);
      }),
    );
  });

  it('for a ≠ 1 keeps the exact shape by scaling μi by 1/a, and reports the least-squares conversion as inexact', () => {
    // Invented old constants: the curve starts at 1/1.05 of μi and halves (relative to that) at (a/b)^(1/c).
    const old = { a: 1.05, b: 1.05 * 8000 ** -1.6, c: 1.6 };
    const conversion = rollOffFromEngine(old);
    expect(conversion.exact).toBe(false);
    expect(relative(conversion.scaled.rollOff.halfField, 8000)).toBeLessThan(1e-12);
    expect(conversion.scaled.permeabilityScale).toBeCloseTo(1 / 1.05, 15);
    for (const h of [0, 100, 8000, 5e4, 1e6]) {
      const scaled = conversion.scaled.permeabilityScale * rollOffFraction(conversion.scaled.rollOff, h);
      expect(relative(scaled, permeabilityFraction(old, h))).toBeLessThan(1e-12);
    }
    // The least-squares form cannot start at 1/a: its error is about the 5 % offset, and no worse than that.
    expect(conversion.worstRelativeError).toBeGreaterThan(0.01);
    expect(conversion.worstRelativeError).toBeLessThan(0.06);
    // Judged over two decades either side of the old curve's own half field.
    expect(relative(conversion.fittedField[0], 80)).toBeLessThan(1e-12);
    expect(relative(conversion.fittedField[1], 8e5)).toBeLessThan(1e-12);
  });

  it('refuses non-positive engine constants', () => {
    expect(refusal(() => rollOffFromEngine({ a: 1, b: 0, c: 1.5 })).field).toBe('b');
    expect(refusal(() => rollOffFromEngine({ a: 1, b: 1e-6, c: NaN })).field).toBe('c');
    expect(refusal(() => rollOffToEngine({ halfField: -5, steepness: 1.5 })).field).toBe('halfField');
  });
});

describe('roll-off fit by Levenberg–Marquardt (K. Levenberg, Quart. Appl. Math. 2, 1944; D. W. Marquardt, J. SIAM 11, 1963)', () => {
  // Invented powder: μ halves at 6 kA/m, steepness 1.7.
  const truth: RollOff = { halfField: 6000, steepness: 1.7 };

  it('recovers invented H½ and n to 1e-9 from noiseless points, over exactly their fields', () => {
    const fit = fitRollOff(pointsOf(truth));
    expect(relative(fit.rollOff.halfField, 6000)).toBeLessThan(1e-9);
    expect(relative(fit.rollOff.steepness, 1.7)).toBeLessThan(1e-9);
    expect(fit.fittedField).toEqual([100, FIELDS[18]]);
    expect(fit.worstRelativeError).toBeLessThan(1e-9);
  });

  it('recovers H½ within 5 % and n within 0.05 under ±3 % uniform noise (5 seeds)', () => {
    for (const seed of [1, 2, 3, 14, 2026]) {
      const uniform = seededUniform(seed);
      const fit = fitRollOff(pointsOf(truth, () => noiseFactor(uniform, 0.03)));
      expect(relative(fit.rollOff.halfField, 6000)).toBeLessThan(0.05);
      expect(Math.abs(fit.rollOff.steepness - 1.7)).toBeLessThan(0.05);
      expect(fit.worstRelativeError).toBeLessThan(0.06);
    }
  });

  it('improves on the linearised start when points near μ/μi = 1 carry noise', () => {
    // ln(1/y − 1) magnifies noise where y is close to 1; the Levenberg–Marquardt steps on the relative residuals
    // must end no worse than the start (the library keeps the best parameters it met).
    const uniform = seededUniform(7);
    const points = pointsOf(truth, () => noiseFactor(uniform, 0.01)).map((p) => ({ ...p, fraction: Math.min(p.fraction, 0.999) }));
    const fit = fitRollOff(points);
    const start = linearisedRollOff(points);
    const sumOfSquares = (r: RollOff) => points.reduce((s, p) => s + Math.log(rollOffFraction(r, p.field) / p.fraction) ** 2, 0);
    expect(fit.iterations).toBeGreaterThan(0);
    expect(sumOfSquares(fit.rollOff)).toBeLessThan(0.9 * sumOfSquares(start));
    expect(relative(fit.rollOff.halfField, 6000)).toBeLessThan(0.05);
  });

  it('refuses too few informative points and bad values, naming the field and point', () => {
    expect(
      refusal(() =>
        fitRollOff([
          { field: 1000, fraction: 0.9 },
          { field: 2000, fraction: 0.8 },
        ]),
      ).message,
    ).toMatch(/at least 3 points/);
    expect(
      refusal(() =>
        fitRollOff([
          { field: 0, fraction: 1 },
          { field: 0, fraction: 1 },
          { field: 5000, fraction: 0.6 },
        ]),
      ).message,
    ).toMatch(/2 of them at different fields/);
    const nan = refusal(() => fitRollOff(pointsOf(truth).map((p, i) => (i === 4 ? { ...p, field: NaN } : p))));
    expect([nan.field, nan.index]).toEqual(['field', 4]);
    expect(refusal(() => fitRollOff(pointsOf(truth).map((p, i) => (i === 2 ? { ...p, fraction: 0 } : p)))).message).toMatch(
      /point 2: μ\/μi must be a fraction/,
    );
    expect(
      refusal(() =>
        fitRollOff([
          { field: 1000, fraction: 0.5 },
          { field: 2000, fraction: 0.6 },
          { field: 4000, fraction: 0.7 },
        ]),
      ).message,
    ).toMatch(/does not fall with the field/);
  });
});
