import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { coreLossTemperatureFactor, steinmetzLoss } from '@shared/engine/core-loss';
import {
  behaviourFactor,
  behaviourFromQuadratic,
  behaviourToQuadratic,
  fitTemperatureBehaviour,
  fitTemperatureFactor,
  referToLowestLoss,
  type TemperatureBehaviour,
} from '@shared/fitting/temperature-fit';
import { noiseFactor, refusal, relative, seededUniform } from './support';

const behaviours = fc.record({
  lowestLossTemperature: fc.double({ min: -40, max: 200, noNaN: true }),
  lowestLossFactor: fc.double({ min: 0.05, max: 5, noNaN: true }),
  curvature: fc.double({ min: 0, max: 1e-2, noNaN: true }),
});
const temperatures = fc.double({ min: -60, max: 250, noNaN: true });

describe('temperature behaviour F0 + c·(T − T0)² against the engine quadratic ct2·T² − ct1·T + ct0 (algebraic identity)', () => {
  it('gives the same factor as the engine at every temperature', () => {
    fc.assert(
      fc.property(behaviours, temperatures, (b, t) => {
        const engine = coreLossTemperatureFactor(behaviourToQuadratic(b), t);
        expect(relative(engine, behaviourFactor(b, t))).toBeLessThan(1e-9);
      }),
    );
  });

  it('round-trips behaviour → quadratic → behaviour', () => {
    fc.assert(
      fc.property(behaviours, (b) => {
        fc.pre(b.curvature > 1e-9);
        const back = behaviourFromQuadratic(behaviourToQuadratic(b));
        expect(Math.abs(back.lowestLossTemperature - b.lowestLossTemperature)).toBeLessThan(1e-9);
        expect(relative(back.lowestLossFactor, b.lowestLossFactor)).toBeLessThan(1e-9);
        expect(back.curvature).toBe(b.curvature);
      }),
    );
  });

  it('round-trips quadratic → behaviour → quadratic for every quadratic positive everywhere', () => {
    const quadratics = fc
      .tuple(
        fc.double({ min: 1e-7, max: 1e-2, noNaN: true }),
        fc.double({ min: -1, max: 4, noNaN: true }),
        fc.double({ min: 0.01, max: 5, noNaN: true }),
      )
      .map(([ct2, ct1, margin]) => ({ ct2, ct1, ct0: (ct1 * ct1) / (4 * ct2) + margin }));
    fc.assert(
      fc.property(quadratics, (q) => {
        const back = behaviourToQuadratic(behaviourFromQuadratic(q));
        expect(back.ct2).toBe(q.ct2);
        expect(Math.abs(back.ct1 - q.ct1)).toBeLessThan(1e-12 * Math.max(1, Math.abs(q.ct1)));
        expect(relative(back.ct0, q.ct0)).toBeLessThan(1e-12);
      }),
    );
  });

  it('is positive everywhere, lowest (= F0) at T0', () => {
    fc.assert(
      fc.property(behaviours, fc.double({ min: -1e3, max: 1e3, noNaN: true }), (b, t) => {
        expect(behaviourFactor(b, t)).toBeGreaterThanOrEqual(b.lowestLossFactor);
        expect(behaviourFactor(b, t)).toBeGreaterThan(0);
        expect(behaviourFactor(b, b.lowestLossTemperature)).toBe(b.lowestLossFactor);
      }),
    );
  });

  it('refers k to T0 without changing the loss at any temperature', () => {
    fc.assert(
      fc.property(behaviours, temperatures, (b, t) => {
        const referred = referToLowestLoss(3.7, b);
        expect(referred.behaviour.lowestLossFactor).toBe(1);
        expect(relative(referred.k * behaviourFactor(referred.behaviour, t), 3.7 * behaviourFactor(b, t))).toBeLessThan(1e-12);
      }),
    );
  });

  it('refuses quadratics that are not positive everywhere, and behaviours outside F0 > 0, c ≥ 0', () => {
    expect(refusal(() => behaviourFromQuadratic({ ct2: -1e-4, ct1: 0, ct0: 1 })).message).toMatch(
      /ct2 = -0.0001 < 0.*not positive everywhere/,
    );
    // Minimum at 100 °C of 0.5 − 1e-4·100² = −0.5.
    const dip = refusal(() => behaviourFromQuadratic({ ct2: 1e-4, ct1: 0.02, ct0: 0.5 }));
    expect(dip.message).toMatch(/minimum -0.5\d* at 100 °C is not positive/);
    expect(refusal(() => behaviourFromQuadratic({ ct2: 0, ct1: 0.01, ct0: 1 })).message).toMatch(/sloped factor/);
    expect(refusal(() => behaviourFromQuadratic({ ct2: NaN, ct1: 0, ct0: 1 })).field).toBe('ct2');
    expect(refusal(() => behaviourToQuadratic({ lowestLossTemperature: 90, lowestLossFactor: 0, curvature: 1e-4 })).field).toBe(
      'lowestLossFactor',
    );
    expect(refusal(() => behaviourToQuadratic({ lowestLossTemperature: 90, lowestLossFactor: 1, curvature: -1e-4 })).field).toBe(
      'curvature',
    );
  });

  it('takes a flat factor (ct2 = ct1 = 0) with T0 at 25 °C by convention', () => {
    expect(behaviourFromQuadratic({ ct2: 0, ct1: 0, ct0: 1.2 })).toEqual({
      lowestLossTemperature: 25,
      lowestLossFactor: 1.2,
      curvature: 0,
    });
  });
});

describe('temperature fit by linear least squares of a quadratic in T (ml-matrix; common practice, no source)', () => {
  // Invented: a ferrite-like curve lowest at 85 °C, 0.9 there, curvature 1.1e-4 /K²; Steinmetz values invented too.
  const truth: TemperatureBehaviour = { lowestLossTemperature: 85, lowestLossFactor: 0.9, curvature: 1.1e-4 };
  const steinmetz = { k: 2.5, alpha: 1.4, beta: 2.7 };
  const temps = [20, 40, 60, 80, 100, 120];
  const points = (factor: (t: number) => number) =>
    temps.map((temperature) => ({
      frequency: 100e3,
      peakFlux: 0.1,
      temperature,
      lossDensity: steinmetzLoss(steinmetz, 100e3, 0.1) * factor(temperature),
    }));

  it('recovers invented T0, F0, c to 1e-9 from noiseless points, over exactly their temperatures', () => {
    const fit = fitTemperatureBehaviour(
      points((t) => behaviourFactor(truth, t)),
      steinmetz,
    );
    expect(Math.abs(fit.behaviour.lowestLossTemperature - 85)).toBeLessThan(1e-9);
    expect(relative(fit.behaviour.lowestLossFactor, 0.9)).toBeLessThan(1e-9);
    expect(relative(fit.behaviour.curvature, 1.1e-4)).toBeLessThan(1e-9);
    expect(fit.constrained).toBe(false);
    expect(fit.fittedTemperature).toEqual([20, 120]);
    expect(fit.worstRelativeError).toBeLessThan(1e-9);
    // The quadratic handed to the engine reproduces each measured loss.
    for (const p of points((t) => behaviourFactor(truth, t))) {
      const predicted = steinmetzLoss(steinmetz, p.frequency, p.peakFlux) * coreLossTemperatureFactor(fit.quadratic, p.temperature);
      expect(relative(predicted, p.lossDensity)).toBeLessThan(1e-9);
    }
  });

  it('recovers T0 within 3 K, F0 within 3 %, c within 20 % under ±2 % uniform noise (5 seeds)', () => {
    for (const seed of [1, 2, 3, 14, 2026]) {
      const uniform = seededUniform(seed);
      const fit = fitTemperatureBehaviour(
        points((t) => behaviourFactor(truth, t) * noiseFactor(uniform, 0.02)),
        steinmetz,
      );
      expect(Math.abs(fit.behaviour.lowestLossTemperature - 85)).toBeLessThan(3);
      expect(relative(fit.behaviour.lowestLossFactor, 0.9)).toBeLessThan(0.03);
      expect(relative(fit.behaviour.curvature, 1.1e-4)).toBeLessThan(0.2);
      expect(fit.worstRelativeError).toBeLessThan(0.04);
    }
  });

  it('keeps c ≥ 0 and T0 inside the data when the points bend the wrong way, positive everywhere', () => {
    // Invented factors falling ever faster with temperature: the free quadratic opens downwards.
    const fit = fitTemperatureFactor([20, 50, 80, 110], [1.2, 1.15, 1.0, 0.7]);
    expect(fit.constrained).toBe(true);
    expect(fit.behaviour.curvature).toBeGreaterThanOrEqual(0);
    expect(fit.behaviour.lowestLossFactor).toBeGreaterThan(0);
    expect(fit.behaviour.lowestLossTemperature).toBeGreaterThanOrEqual(20);
    expect(fit.behaviour.lowestLossTemperature).toBeLessThanOrEqual(110);
    // The falling data put the minimum at the hot end.
    expect(fit.behaviour.lowestLossTemperature).toBeGreaterThan(100);
    for (const t of [-40, 0, 100, 300]) expect(coreLossTemperatureFactor(fit.quadratic, t)).toBeGreaterThan(0);
  });

  it('refuses fewer than 3 temperatures, a non-positive factor and mismatched lengths', () => {
    expect(refusal(() => fitTemperatureFactor([25, 25, 100], [1, 1.1, 0.9])).message).toMatch(/3 or more temperatures/);
    expect(refusal(() => fitTemperatureFactor([25, 60, 100], [1, -0.1, 0.9])).message).toMatch(/point 1: the loss factor must be positive/);
    expect(refusal(() => fitTemperatureFactor([25, 60, 100], [1, 0.9])).field).toBe('points');
    expect(refusal(() => fitTemperatureFactor([25, NaN, 100], [1, 1, 1])).field).toBe('temperature');
  });
});
