import { Matrix, solve } from 'ml-matrix';
import type { TemperatureCoefficients } from '@shared/engine/core-loss';
import { FitInputError } from './fit-error';
import { fitQuality, type FitQuality } from './fit-quality';
import { checkLossPoints, distinctSorted, valueRange, type LossPoint } from './loss-points';
import { fittedLoss } from './steinmetz-fit';

/**
 * The core-loss temperature behaviour in the terms a designer thinks in (our own parametrisation): the factor on the
 * Steinmetz loss is F0 + c·(T − T0)², T in °C — lowest at T0, F0 there, rising with curvature c. With F0 > 0 and
 * c ≥ 0 it is positive at every temperature by construction. The engine's form ct2·T² − ct1·T + ct0 is the same
 * parabola expanded (ct2 = c, ct1 = 2·c·T0, ct0 = F0 + c·T0²).
 */
export interface TemperatureBehaviour {
  /** T0 (°C): temperature of lowest loss. */
  lowestLossTemperature: number;
  /** F0 (> 0): the loss factor at T0; 1 when k is referred to T0. */
  lowestLossFactor: number;
  /** c (1/K², ≥ 0): how fast the factor rises away from T0. */
  curvature: number;
}

/** The engine's quadratic: factor = ct2·T² − ct1·T + ct0 (see `shared/engine/core-loss.ts`). */
export type TemperatureQuadratic = TemperatureCoefficients;

/** Temperature used as T0 for a flat factor (c = 0), where the lowest-loss temperature is not defined. */
export const FLAT_FACTOR_TEMPERATURE = 25;

function checkBehaviour(b: TemperatureBehaviour): void {
  if (!Number.isFinite(b.lowestLossTemperature)) {
    throw new FitInputError('invalid-value', 'lowest-loss temperature must be a finite number (°C)', 'lowestLossTemperature');
  }
  if (!(Number.isFinite(b.lowestLossFactor) && b.lowestLossFactor > 0)) {
    throw new FitInputError('not-positive', 'the loss factor at the lowest-loss temperature must be positive', 'lowestLossFactor');
  }
  if (!(Number.isFinite(b.curvature) && b.curvature >= 0)) {
    throw new FitInputError('not-positive', 'the curvature must be a finite number ≥ 0 (1/K²)', 'curvature');
  }
}

/** The factor F0 + c·(T − T0)² at T (°C). */
export function behaviourFactor(b: TemperatureBehaviour, temperature: number): number {
  const d = temperature - b.lowestLossTemperature;
  return b.lowestLossFactor + b.curvature * d * d;
}

/** The engine's quadratic for a behaviour: ct2 = c, ct1 = 2·c·T0, ct0 = F0 + c·T0². */
export function behaviourToQuadratic(b: TemperatureBehaviour): TemperatureQuadratic {
  checkBehaviour(b);
  const { lowestLossTemperature: t0, lowestLossFactor: f0, curvature: c } = b;
  return { ct2: c, ct1: 2 * c * t0, ct0: f0 + c * t0 * t0 };
}

/**
 * A behaviour from the engine's quadratic: T0 = ct1/(2·ct2), F0 = ct0 − ct1²/(4·ct2). Refused when the parabola
 * opens downwards (ct2 < 0) or is a slope (ct2 = 0, ct1 ≠ 0) or has its minimum at or below zero: such a factor is
 * not positive at every temperature. A flat factor (ct2 = ct1 = 0, ct0 > 0) is taken with T0 = `flatTemperature`.
 */
export function behaviourFromQuadratic(q: TemperatureQuadratic, flatTemperature = FLAT_FACTOR_TEMPERATURE): TemperatureBehaviour {
  for (const field of ['ct0', 'ct1', 'ct2'] as const) {
    if (!Number.isFinite(q[field])) throw new FitInputError('invalid-value', `${field} must be a finite number`, field);
  }
  if (q.ct2 < 0) {
    throw new FitInputError(
      'not-positive',
      `ct2 = ${q.ct2} < 0: the factor falls without bound away from its peak, so it is not positive everywhere`,
      'ct2',
    );
  }
  if (q.ct2 === 0) {
    if (q.ct1 !== 0)
      throw new FitInputError('not-positive', 'ct2 = 0 with ct1 ≠ 0: a sloped factor turns negative at some temperature', 'ct1');
    if (!(q.ct0 > 0)) throw new FitInputError('not-positive', `ct0 = ${q.ct0}: a flat factor must be positive`, 'ct0');
    return { lowestLossTemperature: flatTemperature, lowestLossFactor: q.ct0, curvature: 0 };
  }
  const t0 = q.ct1 / (2 * q.ct2);
  const f0 = q.ct0 - q.ct2 * t0 * t0;
  if (!(f0 > 0)) {
    throw new FitInputError(
      'not-positive',
      `the factor's minimum ${f0} at ${t0} °C is not positive, so the factor is not positive everywhere`,
      'ct0',
    );
  }
  return { lowestLossTemperature: t0, lowestLossFactor: f0, curvature: q.ct2 };
}

/** k referred to T0 (so F0 = 1) with the same loss at every temperature: k′ = k·F0, c′ = c/F0. */
export function referToLowestLoss(k: number, b: TemperatureBehaviour): { k: number; behaviour: TemperatureBehaviour } {
  checkBehaviour(b);
  return {
    k: k * b.lowestLossFactor,
    behaviour: { lowestLossTemperature: b.lowestLossTemperature, lowestLossFactor: 1, curvature: b.curvature / b.lowestLossFactor },
  };
}

/** The quality is of the fitted against the measured factor. */
export interface TemperatureFit extends FitQuality {
  behaviour: TemperatureBehaviour;
  quadratic: TemperatureQuadratic;
  /** Exactly the lowest and highest temperature (°C) of the points used. */
  fittedTemperature: [number, number];
  /**
   * True when the free quadratic opened downwards or dipped to zero and the fit was taken with c ≥ 0 and T0 inside the
   * measured temperatures instead.
   */
  constrained: boolean;
}

/** Steps of the T0 search over the measured temperatures when the free quadratic is not a valid behaviour. */
const T0_STEPS = 2000;

/** Weighted least squares for the coefficients of `columns` (one row of basis values per point). */
function leastSquares(columns: number[][], values: readonly number[], weights: readonly number[]): number[] {
  const rows = columns.map((row, i) => row.map((v) => v * Math.sqrt(weights[i]!)));
  const rhs = values.map((v, i) => [v * Math.sqrt(weights[i]!)]);
  return solve(new Matrix(rows), new Matrix(rhs)).getColumn(0);
}

function sumOfSquares(
  b: TemperatureBehaviour,
  temperatures: readonly number[],
  factors: readonly number[],
  weights: readonly number[],
): number {
  return temperatures.reduce((s, t, i) => s + weights[i]! * (behaviourFactor(b, t) - factors[i]!) ** 2, 0);
}

/** Best F0, c ≥ 0 for a fixed T0: linear in (F0, c); a negative c gives way to the flat factor at the weighted mean. */
function fitAtMinimum(
  t0: number,
  temperatures: readonly number[],
  factors: readonly number[],
  weights: readonly number[],
): TemperatureBehaviour {
  const [f0, c] = leastSquares(
    temperatures.map((t) => [1, (t - t0) ** 2]),
    factors,
    weights,
  );
  if (c! >= 0) return { lowestLossTemperature: t0, lowestLossFactor: f0!, curvature: c! };
  const total = weights.reduce((s, w) => s + w, 0);
  const mean = factors.reduce((s, y, i) => s + weights[i]! * y, 0) / total;
  return { lowestLossTemperature: t0, lowestLossFactor: mean, curvature: 0 };
}

/**
 * Fits T0, F0, c to measured temperature factors (loss relative to the Steinmetz value at each point) by weighted
 * linear least squares of a quadratic in T (ml-matrix; common practice, no source). Residuals are relative — each
 * point weighs 1/factor² times its own weight — to match the relative errors reported. If the free quadratic is not a
 * valid behaviour (curvature ≤ 0 or minimum ≤ 0), the fit is repeated with c ≥ 0 and T0 searched over the measured
 * temperatures in {@link T0_STEPS} steps (our own rule), and marked `constrained`.
 */
export function fitTemperatureFactor(
  temperatures: readonly number[],
  factors: readonly number[],
  weights?: readonly number[],
): TemperatureFit {
  const n = temperatures.length;
  if (factors.length !== n || (weights && weights.length !== n)) {
    throw new FitInputError('invalid-value', 'temperatures, factors and weights must have one entry per point', 'points');
  }
  for (let i = 0; i < n; i++) {
    if (!Number.isFinite(temperatures[i]))
      throw new FitInputError('invalid-value', `point ${i}: temperature is not a finite number`, 'temperature', i);
    if (!(Number.isFinite(factors[i]) && factors[i]! > 0))
      throw new FitInputError('not-positive', `point ${i}: the loss factor must be positive`, 'lossDensity', i);
    if (weights && !(Number.isFinite(weights[i]) && weights[i]! > 0))
      throw new FitInputError('invalid-value', `weight ${i} must be a positive number`, 'weights', i);
  }
  if (distinctSorted(temperatures).length < 3) {
    throw new FitInputError('too-few-points', 'a temperature fit needs points at 3 or more temperatures', 'temperature');
  }
  const w = factors.map((y, i) => (weights?.[i] ?? 1) / (y * y));
  // Centred on the mean temperature for conditioning: factor = a + b·u + c·u², u = T − mean.
  const mean = temperatures.reduce((s, t) => s + t, 0) / n;
  const [a, b, c] = leastSquares(
    temperatures.map((t) => [1, t - mean, (t - mean) ** 2]),
    factors,
    w,
  );
  let behaviour: TemperatureBehaviour | undefined;
  if (c! > 0 && a! - (b! * b!) / (4 * c!) > 0) {
    behaviour = { lowestLossTemperature: mean - b! / (2 * c!), lowestLossFactor: a! - (b! * b!) / (4 * c!), curvature: c! };
  }
  const constrained = !behaviour;
  if (!behaviour) {
    const [low, high] = valueRange(temperatures);
    let best = Infinity;
    for (let s = 0; s <= T0_STEPS; s++) {
      const candidate = fitAtMinimum(low + ((high - low) * s) / T0_STEPS, temperatures, factors, w);
      const error = sumOfSquares(candidate, temperatures, factors, w);
      if (candidate.lowestLossFactor > 0 && error < best) {
        best = error;
        behaviour = candidate;
      }
    }
  }
  if (!behaviour) {
    throw new FitInputError('not-positive', 'no temperature factor positive everywhere fits these points', 'lossDensity');
  }
  const found = behaviour;
  return {
    behaviour: found,
    quadratic: behaviourToQuadratic(found),
    fittedTemperature: valueRange(temperatures),
    ...fitQuality(
      temperatures.map((t) => behaviourFactor(found, t)),
      factors,
    ),
    constrained,
  };
}

/**
 * Fits the temperature behaviour from loss points at several temperatures (typically one f and B̂), each point's
 * factor being its loss over the Steinmetz value k·f^α·B̂^β at its own f and B̂.
 */
export function fitTemperatureBehaviour(
  points: readonly LossPoint[],
  steinmetz: { k: number; alpha: number; beta: number },
  weights?: readonly number[],
): TemperatureFit {
  checkLossPoints(points);
  return fitTemperatureFactor(
    points.map((p) => p.temperature),
    points.map((p) => p.lossDensity / fittedLoss(steinmetz, p.frequency, p.peakFlux)),
    weights,
  );
}
