import { levenbergMarquardt } from 'ml-levenberg-marquardt';
import { Matrix, solve } from 'ml-matrix';
import type { RollOffFit } from '@shared/engine/types';
import { FitInputError } from './fit-error';
import { fitQuality, type FitQuality } from './fit-quality';
import { distinctSorted, valueRange } from './loss-points';

/**
 * Powder DC-bias roll-off in our own terms: μ/μi = 1/(1 + (H/H½)ⁿ), H in A/m — H½ the field at which the
 * permeability has fallen to half, n how steeply it falls around there.
 */
export interface RollOff {
  /** H½ (A/m, > 0). */
  halfField: number;
  /** n (> 0). */
  steepness: number;
}

/** One measured permeability fraction μ/μi at a DC field H (A/m). */
export interface RollOffPoint {
  field: number;
  fraction: number;
}

/** The quality is of the fitted against the measured fraction. */
export interface RollOffFitResult extends FitQuality {
  rollOff: RollOff;
  /** Exactly the smallest and largest field (A/m) of the points. */
  fittedField: [number, number];
  iterations: number;
}

function checkRollOff(r: RollOff): void {
  if (!(Number.isFinite(r.halfField) && r.halfField > 0))
    throw new FitInputError('not-positive', 'H½ must be a positive field (A/m)', 'halfField');
  if (!(Number.isFinite(r.steepness) && r.steepness > 0))
    throw new FitInputError('not-positive', 'the steepness n must be positive', 'steepness');
}

/** μ/μi at field H (A/m). */
export function rollOffFraction(r: RollOff, field: number): number {
  return 1 / (1 + Math.pow(Math.abs(field) / r.halfField, r.steepness));
}

/** The engine's three constants μ% = 1/(a + b·H^c) for a roll-off: a = 1, b = H½^−n, c = n (exact). */
export function rollOffToEngine(r: RollOff): RollOffFit {
  checkRollOff(r);
  return { a: 1, b: Math.pow(r.halfField, -r.steepness), c: r.steepness };
}

/** Relative tolerance within which `a` counts as 1, so the engine's form converts exactly. */
const UNIT_A_TOLERANCE = 1e-12;
/** Field span (decades either side of the curve's own half field) sampled by the least-squares conversion. */
const CONVERSION_DECADES = 2;
const CONVERSION_SAMPLES = 81;

export interface EngineRollOffConversion {
  rollOff: RollOff;
  /** True when a = 1: the curves are identical. Otherwise `rollOff` is a least-squares fit over `fittedField`. */
  exact: boolean;
  /** The conversion's own fit quality (0 when exact) and the field range it was judged over (A/m). */
  rmsRelativeError: number;
  worstRelativeError: number;
  fittedField: [number, number];
  /**
   * The exact alternative for a ≠ 1: 1/(a + b·H^c) = (1/a)·1/(1 + (H/H½)^c) with H½ = (a/b)^(1/c), so the curve's
   * shape converts exactly when μi is multiplied by `permeabilityScale` = 1/a.
   */
  scaled: { rollOff: RollOff; permeabilityScale: number };
}

/**
 * A roll-off from the engine's three constants. μ% = 1/(a + b·H^c) is our form exactly when a = 1 (H½ = b^(−1/c),
 * n = c). For a ≠ 1 the curve starts at 1/a instead of 1 and our form cannot match it: the conversion is then the
 * least-squares fit of our form to the old curve sampled log-evenly over two decades either side of its own half
 * field (a, b, c) (our own rule), reported with its error, beside the exact shape-preserving alternative that
 * rescales μi.
 */
export function rollOffFromEngine(fit: RollOffFit): EngineRollOffConversion {
  for (const field of ['a', 'b', 'c'] as const) {
    if (!(Number.isFinite(fit[field]) && fit[field] > 0)) {
      throw new FitInputError('not-positive', `roll-off constant ${field} must be a positive number, got ${fit[field]}`, field);
    }
  }
  const scaledRollOff = { halfField: Math.pow(fit.a / fit.b, 1 / fit.c), steepness: fit.c };
  const scaled = { rollOff: scaledRollOff, permeabilityScale: 1 / fit.a };
  const span = 10 ** CONVERSION_DECADES;
  const fittedField: [number, number] = [scaledRollOff.halfField / span, scaledRollOff.halfField * span];
  if (Math.abs(fit.a - 1) <= UNIT_A_TOLERANCE) {
    return {
      rollOff: { halfField: Math.pow(fit.b, -1 / fit.c), steepness: fit.c },
      exact: true,
      rmsRelativeError: 0,
      worstRelativeError: 0,
      fittedField,
      scaled,
    };
  }
  const points = Array.from({ length: CONVERSION_SAMPLES }, (_, i) => {
    const field = fittedField[0] * Math.pow(span * span, i / (CONVERSION_SAMPLES - 1));
    return { field, fraction: 1 / (fit.a + fit.b * Math.pow(field, fit.c)) };
  });
  const result = fitRollOff(points);
  return {
    rollOff: result.rollOff,
    exact: false,
    rmsRelativeError: result.rmsRelativeError,
    worstRelativeError: result.worstRelativeError,
    fittedField,
    scaled,
  };
}

function checkPoints(points: readonly RollOffPoint[]): void {
  points.forEach((p, index) => {
    if (!(Number.isFinite(p.field) && p.field >= 0))
      throw new FitInputError('invalid-value', `point ${index}: field must be a finite number ≥ 0 A/m`, 'field', index);
    if (!(Number.isFinite(p.fraction) && p.fraction > 0 && p.fraction <= 1.5)) {
      throw new FitInputError('invalid-value', `point ${index}: μ/μi must be a fraction in (0, 1.5], got ${p.fraction}`, 'fraction', index);
    }
  });
  const informative = points.filter((p) => p.field > 0 && p.fraction < 1);
  if (points.length < 3 || distinctSorted(informative.map((p) => p.field)).length < 2) {
    throw new FitInputError(
      'too-few-points',
      'a roll-off fit needs at least 3 points, 2 of them at different fields with μ/μi below 1',
      'points',
    );
  }
}

/**
 * The roll-off from the linear form ln(1/y − 1) = n·ln H − n·ln H½ over the points with 0 < y < 1 (ordinary least
 * squares, ml-matrix): exact for noiseless points, the start of {@link fitRollOff} for noisy ones.
 */
export function linearisedRollOff(points: readonly RollOffPoint[]): RollOff {
  checkPoints(points);
  const usable = points.filter((p) => p.field > 0 && p.fraction < 1);
  const slopeAndIntercept = solve(
    new Matrix(usable.map((p) => [Math.log(p.field), 1])),
    new Matrix(usable.map((p) => [Math.log(1 / p.fraction - 1)])),
  ).getColumn(0);
  const n = slopeAndIntercept[0]!;
  if (!(n > 0)) throw new FitInputError('singular', 'μ/μi does not fall with the field in these points', 'fraction');
  return { halfField: Math.exp(-slopeAndIntercept[1]! / n), steepness: n };
}

/** Bounds on n for the search (common practice, no source: powder roll-off exponents lie near 1–3). */
const STEEPNESS_BOUNDS: [number, number] = [0.05, 20];

/**
 * Fits H½ and n to (H, μ/μi) points by the Levenberg–Marquardt method (K. Levenberg, Quart. Appl. Math. 2, 1944;
 * D. W. Marquardt, J. SIAM 11, 1963; `ml-levenberg-marquardt`) in the parameters (ln H½, n) with an analytical
 * Jacobian, from the start values of the linearised form. It fits ln(μ/μi) = −ln(1 + (H/H½)ⁿ) with equal weights, so
 * the residuals are relative; the library's own `weights` are not used because its step and its error sum apply them
 * inversely to each other.
 */
export function fitRollOff(points: readonly RollOffPoint[]): RollOffFitResult {
  const start = linearisedRollOff(points);
  const model =
    ([logHalf, n]: number[]) =>
    (h: number) =>
      h > 0 ? -Math.log1p(Math.exp(n! * (Math.log(h) - logHalf!))) : 0;
  const jacobian =
    ([logHalf, n]: number[]) =>
    (h: number) => {
      if (!(h > 0)) return [0, 0];
      const x = Math.log(h) - logHalf!;
      const u = Math.exp(n! * x);
      return [(n! * u) / (1 + u), (-u * x) / (1 + u)];
    };
  const result = levenbergMarquardt({ x: points.map((p) => p.field), y: points.map((p) => Math.log(p.fraction)) }, model, {
    initialValues: [Math.log(start.halfField), Math.min(Math.max(start.steepness, STEEPNESS_BOUNDS[0]), STEEPNESS_BOUNDS[1])],
    jacobianFunction: jacobian,
    minValues: [-Infinity, STEEPNESS_BOUNDS[0]],
    maxValues: [Infinity, STEEPNESS_BOUNDS[1]],
    damping: 1e-3,
    errorTolerance: 1e-24,
    maxIterations: 200,
  });
  const [logHalf, steepness] = result.parameterValues;
  const rollOff = { halfField: Math.exp(logHalf!), steepness: steepness! };
  return {
    rollOff,
    fittedField: valueRange(points.map((p) => p.field)),
    ...fitQuality(
      points.map((p) => rollOffFraction(rollOff, p.field)),
      points.map((p) => p.fraction),
    ),
    iterations: result.iterations,
  };
}
