import { Matrix, solve } from 'ml-matrix';
import { FitInputError } from './fit-error';
import { fitQuality, type FitQuality } from './fit-quality';
import { checkLossPoints, distinctSorted, valueRange, type LossPoint } from './loss-points';

/**
 * Steinmetz coefficients from loss points: Pv = k·f^α·B̂^β (C. P. Steinmetz, "On the law of hysteresis",
 * Trans. AIEE 9, 1892, for the power law in B̂; the f^α term is the usual extension, common practice, no source).
 * Taking logs makes the model linear, ln Pv = ln k + α·ln f + β·ln B̂, so the fit is ordinary weighted linear least
 * squares on ln Pv (common practice, no source): it minimises relative rather than absolute error, which suits
 * losses spanning decades.
 */
export interface SteinmetzFit extends FitQuality {
  /** W/m³ with f in Hz and B̂ in T, at a temperature factor of 1. */
  k: number;
  alpha: number;
  beta: number;
  /** Exactly the smallest and largest frequency (Hz) and peak flux (T) of the points used. */
  fittedFrequency: [number, number];
  fittedFlux: [number, number];
}

export interface SteinmetzFitOptions {
  /** One weight per point on its ln Pv residual (> 0); equal weights when omitted. */
  weights?: readonly number[];
  /**
   * Temperature factor to divide out of each point's loss before fitting (and to apply when judging the fit), so
   * points at several temperatures share one k. Without it the caller passes points of one temperature band.
   */
  temperatureFactor?: (temperature: number) => number;
}

/** Loss density the fit predicts at f (Hz), B̂ (T), at a temperature factor of 1. */
export function fittedLoss(fit: Pick<SteinmetzFit, 'k' | 'alpha' | 'beta'>, frequency: number, peakFlux: number): number {
  return fit.k * Math.pow(frequency, fit.alpha) * Math.pow(peakFlux, fit.beta);
}

function checkWeights(weights: readonly number[] | undefined, count: number): void {
  if (!weights) return;
  if (weights.length !== count) {
    throw new FitInputError('invalid-value', `weights: ${weights.length} given for ${count} points`, 'weights');
  }
  weights.forEach((w, index) => {
    if (!(Number.isFinite(w) && w > 0))
      throw new FitInputError('invalid-value', `weight ${index} must be a positive number`, 'weights', index);
  });
}

function temperatureFactors(points: readonly LossPoint[], factor: SteinmetzFitOptions['temperatureFactor']): number[] {
  return points.map((p, index) => {
    const value = factor ? factor(p.temperature) : 1;
    if (!(Number.isFinite(value) && value > 0)) {
      throw new FitInputError(
        'not-positive',
        `point ${index}: the temperature factor at ${p.temperature} °C is not positive`,
        'temperature',
        index,
      );
    }
    return value;
  });
}

/**
 * Refuses point sets that cannot fix all three coefficients: fewer than 3 points, one frequency, one flux, or
 * frequency and flux varying together (ln f and ln B̂ collinear, so α and β cannot be told apart).
 */
function checkDesign(logF: readonly number[], logB: readonly number[], points: readonly LossPoint[]): void {
  if (points.length < 3) {
    throw new FitInputError('too-few-points', `a Steinmetz fit needs at least 3 points, got ${points.length}`, 'points');
  }
  if (distinctSorted(points.map((p) => p.frequency)).length < 2) {
    throw new FitInputError('singular', 'all points are at one frequency: α cannot be fitted', 'frequency');
  }
  if (distinctSorted(points.map((p) => p.peakFlux)).length < 2) {
    throw new FitInputError('singular', 'all points are at one peak flux: β cannot be fitted', 'peakFlux');
  }
  const n = logF.length;
  const meanF = logF.reduce((s, v) => s + v, 0) / n;
  const meanB = logB.reduce((s, v) => s + v, 0) / n;
  let sff = 0;
  let sbb = 0;
  let sfb = 0;
  for (let i = 0; i < n; i++) {
    const df = logF[i]! - meanF;
    const db = logB[i]! - meanB;
    sff += df * df;
    sbb += db * db;
    sfb += df * db;
  }
  // Squared correlation of ln f and ln B̂ within rounding of 1: the normal equations are singular.
  if (sff * sbb - sfb * sfb <= 1e-12 * sff * sbb) {
    throw new FitInputError('singular', 'frequency and peak flux vary together in these points: α and β cannot be told apart', 'points');
  }
}

/** Weighted least squares on ln Pv over the given points; see {@link SteinmetzFit}. */
export function fitSteinmetz(points: readonly LossPoint[], options: SteinmetzFitOptions = {}): SteinmetzFit {
  checkLossPoints(points);
  checkWeights(options.weights, points.length);
  const factors = temperatureFactors(points, options.temperatureFactor);
  const logF = points.map((p) => Math.log(p.frequency));
  const logB = points.map((p) => Math.log(p.peakFlux));
  checkDesign(logF, logB, points);

  // Centred logs keep the columns well conditioned (ln f alone is 10–14 for every point).
  const n = points.length;
  const meanF = logF.reduce((s, v) => s + v, 0) / n;
  const meanB = logB.reduce((s, v) => s + v, 0) / n;
  const rows: number[][] = [];
  const rhs: number[][] = [];
  points.forEach((p, i) => {
    const w = Math.sqrt(options.weights?.[i] ?? 1);
    rows.push([w, w * (logF[i]! - meanF), w * (logB[i]! - meanB)]);
    rhs.push([w * Math.log(p.lossDensity / factors[i]!)]);
  });
  // Not square: ml-matrix solves by QR decomposition, the least-squares solution.
  const solution = solve(new Matrix(rows), new Matrix(rhs));
  const alpha = solution.get(1, 0);
  const beta = solution.get(2, 0);
  const k = Math.exp(solution.get(0, 0) - alpha * meanF - beta * meanB);

  return {
    k,
    alpha,
    beta,
    fittedFrequency: valueRange(points.map((p) => p.frequency)),
    fittedFlux: valueRange(points.map((p) => p.peakFlux)),
    ...fitQuality(
      points.map((p, i) => fittedLoss({ k, alpha, beta }, p.frequency, p.peakFlux) * factors[i]!),
      points.map((p) => p.lossDensity),
    ),
  };
}

/** One frequency band's fit, with the indices (in the points passed to {@link fitInBands}) of its points. */
export interface SteinmetzBandFit extends SteinmetzFit {
  pointIndices: number[];
  /** Whether the band's worst relative error is within the target. */
  meetsTarget: boolean;
}

/** Whether a band can be fitted on its own (enough distinct frequencies and fluxes, not collinear). */
function tryFit(points: readonly LossPoint[], options: SteinmetzFitOptions): SteinmetzFit | undefined {
  try {
    return fitSteinmetz(points, options);
  } catch (error) {
    if (error instanceof FitInputError && (error.reason === 'singular' || error.reason === 'too-few-points')) return undefined;
    throw error;
  }
}

/** The options for a band: its points' weights. */
function bandOptions(options: SteinmetzFitOptions, indices: readonly number[]): SteinmetzFitOptions {
  const { weights } = options;
  return weights ? { ...options, weights: indices.map((i) => weights[i]!) } : options;
}

function bandFit(
  all: readonly LossPoint[],
  indices: readonly number[],
  maxWorstError: number,
  options: SteinmetzFitOptions,
  fit?: SteinmetzFit,
): SteinmetzBandFit[] {
  const points = indices.map((i) => all[i]!);
  const own = fit ?? fitSteinmetz(points, bandOptions(options, indices));
  const result = (): SteinmetzBandFit[] => [
    { ...own, worstPoint: indices[own.worstPoint]!, pointIndices: [...indices], meetsTarget: own.worstRelativeError <= maxWorstError },
  ];
  if (own.worstRelativeError <= maxWorstError) return result();
  const frequencies = distinctSorted(points.map((p) => p.frequency));
  if (frequencies.length < 3) return result();
  // The median frequency goes to both halves, so neighbouring bands' ranges meet and each has ≥ 2 frequencies.
  const median = frequencies[Math.floor((frequencies.length - 1) / 2)]!;
  const lower = indices.filter((i) => all[i]!.frequency <= median);
  const upper = indices.filter((i) => all[i]!.frequency >= median);
  const lowerFit = tryFit(
    lower.map((i) => all[i]!),
    bandOptions(options, lower),
  );
  const upperFit = tryFit(
    upper.map((i) => all[i]!),
    bandOptions(options, upper),
  );
  if (!lowerFit || !upperFit) return result();
  return [...bandFit(all, lower, maxWorstError, options, lowerFit), ...bandFit(all, upper, maxWorstError, options, upperFit)];
}

/**
 * Steinmetz fits in frequency bands (our own rule, common practice, no source): fit all points; while a band's worst
 * relative error exceeds `maxWorstError`, split it at its median frequency — the points at that frequency go to both
 * halves, so the bands' frequency ranges meet without a gap — and fit each half. A band is kept whole when it has
 * fewer than 3 distinct frequencies or when either half cannot be fitted on its own (one flux, collinear); its
 * `meetsTarget` then says whether it is good enough. Bands come back in ascending frequency.
 */
export function fitInBands(points: readonly LossPoint[], maxWorstError: number, options: SteinmetzFitOptions = {}): SteinmetzBandFit[] {
  if (!(Number.isFinite(maxWorstError) && maxWorstError > 0)) {
    throw new FitInputError('invalid-value', `maxWorstError must be a positive fraction, got ${maxWorstError}`, 'maxWorstError');
  }
  return bandFit(
    points,
    points.map((_, i) => i),
    maxWorstError,
    options,
  );
}
