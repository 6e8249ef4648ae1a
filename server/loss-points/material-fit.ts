// A material's fit from its loss points: the Steinmetz fit (whole range or frequency bands) with the temperature
// behaviour divided out, the behaviour itself, residuals per point and curves to draw. Pure: points in, answer out.
import { FitInputError } from '@shared/fitting/fit-error';
import { distinctSorted, type LossPoint } from '@shared/fitting/loss-points';
import { fitInBands, fitSteinmetz, fittedLoss, type SteinmetzBandFit, type SteinmetzFit } from '@shared/fitting/steinmetz-fit';
import {
  behaviourFactor,
  behaviourToQuadratic,
  fitTemperatureFactor,
  referToLowestLoss,
  type TemperatureBehaviour,
  type TemperatureFit,
} from '@shared/fitting/temperature-fit';
import { fitBiasLoss } from '@shared/fitting/bias-loss-fit';
import { fitQuality } from '@shared/fitting/fit-quality';
import type { FitAnswer, FitOptions } from '@shared/schemas/loss-points';

/** Passes of the alternation between the Steinmetz and the temperature fit, and when it has settled. */
const MAX_PASSES = 30;
/**
 * Most distinct temperatures a temperature fit takes: its constrained search costs time per temperature, and loss
 * data is measured at a few set points (our own limit).
 */
export const MAX_FIT_TEMPERATURES = 100;
const SETTLED = 1e-12;
const CURVE_SAMPLES = 16;
const MAX_CURVES = 400;

export type MaterialFit = Omit<FitAnswer, 'materialId'>;
/** What a fit takes, as plain data (it runs in a worker thread). */
export interface MaterialFitInput {
  points: LossPoint[];
  options: FitOptions;
}

/** The field a refusal names: the point (its index in the version's points) and its field, or the option. */
export function fitErrorField(error: FitInputError): string {
  return error.index !== undefined ? `points[${error.index}].${error.field ?? 'value'}` : (error.field ?? 'points');
}

/** The points a fit uses: all, or (temperature not fitted) those at `atTemperature`, which must then be one temperature. */
function selectPoints(points: readonly LossPoint[], options: FitOptions): number[] {
  const all = points.map((_, i) => i);
  if (options.temperature) return all;
  if (options.atTemperature !== undefined) {
    const at = all.filter((i) => points[i]!.temperature === options.atTemperature);
    if (!at.length) throw new FitInputError('too-few-points', `No point is at ${options.atTemperature} °C.`, 'atTemperature');
    return at;
  }
  const temperatures = distinctSorted(points.map((p) => p.temperature));
  if (temperatures.length > 1) {
    throw new FitInputError(
      'invalid-value',
      `The points are at ${temperatures.length} temperatures: fit the temperature behaviour, or give atTemperature to fit the points at one of them.`,
      'atTemperature',
    );
  }
  return all;
}

const changed = (a: number, b: number) => Math.abs(a - b) > SETTLED * Math.max(Math.abs(a), Math.abs(b), 1);

/**
 * The temperature factor fitted to what the Steinmetz fit leaves at each point, with the points of one temperature
 * taken together: the relative least squares Σ (F(T) − y)²/y² over a group of one temperature equals, up to a
 * constant, W·(F(T) − ȳ)² with W = Σ 1/y² and ȳ = Σ (1/y) / W, so one weighted value per temperature gives the same
 * fit (algebra, no source) at a cost that does not grow with the points. Quality is over every point.
 */
export function temperatureFit(points: readonly LossPoint[], steinmetz: SteinmetzFit): TemperatureFit {
  const factors = points.map((p) => p.lossDensity / fittedLoss(steinmetz, p.frequency, p.peakFlux));
  const groups = new Map<number, { w: number; s: number }>();
  points.forEach((p, i) => {
    const group = groups.get(p.temperature) ?? { w: 0, s: 0 };
    group.w += 1 / factors[i]! ** 2;
    group.s += 1 / factors[i]!;
    groups.set(p.temperature, group);
  });
  if (groups.size > MAX_FIT_TEMPERATURES) {
    throw new FitInputError(
      'invalid-value',
      `The points are at ${groups.size} different temperatures; a temperature fit takes at most ${MAX_FIT_TEMPERATURES}. Give each point its set-point temperature.`,
      'temperature',
    );
  }
  const temperatures = [...groups.keys()];
  const means = temperatures.map((t) => groups.get(t)!.s / groups.get(t)!.w);
  // fitTemperatureFactor weighs each value by weight/value², so W·ȳ² gives the group its weight W.
  const fit = fitTemperatureFactor(
    temperatures,
    means,
    temperatures.map((t, i) => groups.get(t)!.w * means[i]! ** 2),
  );
  return {
    ...fit,
    ...fitQuality(
      points.map((p) => behaviourFactor(fit.behaviour, p.temperature)),
      factors,
    ),
  };
}

/**
 * The temperature behaviour with k referred to its lowest-loss temperature (F0 = 1), by alternating the two linear
 * fits (our own rule, common practice, no source): the Steinmetz fit with the current factor divided out, then the
 * factor fitted to what the Steinmetz fit leaves, until k, α and β stop changing. With points on a full grid of
 * frequency × flux × temperature the factor does not bias α and β, and two passes reproduce exact data.
 */
function fitBehaviour(points: readonly LossPoint[]) {
  let steinmetz: SteinmetzFit = fitSteinmetz(points);
  for (let pass = 0; pass < MAX_PASSES; pass++) {
    const referred = referToLowestLoss(steinmetz.k, temperatureFit(points, steinmetz).behaviour);
    const next = fitSteinmetz(points, { temperatureFactor: (t) => behaviourFactor(referred.behaviour, t) });
    // The first pass moves k by the mean factor; after it, k, α and β change only while the factor does.
    const settled =
      pass > 0 && !changed(next.k, steinmetz.k) && !changed(next.alpha, steinmetz.alpha) && !changed(next.beta, steinmetz.beta);
    steinmetz = next;
    if (settled) break;
  }
  const fit = temperatureFit(points, steinmetz);
  const behaviour = referToLowestLoss(steinmetz.k, fit.behaviour).behaviour;
  return { fit, behaviour };
}

function lossCurves(
  points: readonly LossPoint[],
  fits: readonly SteinmetzBandFit[],
  factor: (t: number) => number,
): Pick<MaterialFit, 'curves' | 'curvesTruncated'> {
  const curves: MaterialFit['curves'] = [];
  let truncated = false;
  fits.forEach((band, b) => {
    const pairs = new Map<string, { frequency: number; temperature: number }>();
    for (const i of band.pointIndices) pairs.set(`${points[i]!.frequency}|${points[i]!.temperature}`, points[i]!);
    const [low, high] = band.fittedFlux;
    for (const { frequency, temperature } of pairs.values()) {
      if (curves.length >= MAX_CURVES) {
        truncated = true;
        return;
      }
      const samples = Array.from({ length: CURVE_SAMPLES }, (_, s) => {
        const peakFlux = low * Math.pow(high / low, s / (CURVE_SAMPLES - 1));
        return { peakFlux, lossDensity: fittedLoss(band, frequency, peakFlux) * factor(temperature) };
      });
      curves.push({ band: b, frequency, temperature, samples });
    }
  });
  return { curves, curvesTruncated: truncated };
}

const biased = (p: LossPoint) => p.dcBias !== undefined && p.dcBias > 0;

/**
 * Fits the points as `options` ask; a refused input throws `FitInputError` naming the field and point. Points taken
 * under DC bias stay out of the Steinmetz and temperature fits; their losses over that zero-bias model give the DC-bias
 * loss curve (fitBiasLoss).
 */
export function fitMaterial(points: readonly LossPoint[], options: FitOptions): MaterialFit {
  const chosen = selectPoints(points, options);
  const selected = chosen.filter((i) => !biased(points[i]!));
  if (chosen.length && !selected.length)
    throw new FitInputError('too-few-points', 'Every point is under DC bias: the zero-bias fit needs points without bias.', 'points');
  const used = selected.map((i) => points[i]!);
  const original = (i: number) => selected[i]!;
  let behaviour: TemperatureBehaviour | undefined;
  let temperature: MaterialFit['temperature'] = null;
  if (options.temperature) {
    const found = fitBehaviour(used);
    behaviour = found.behaviour;
    const { fit } = found;
    temperature = {
      ...behaviour,
      quadratic: behaviourToQuadratic(behaviour),
      fittedTemperature: fit.fittedTemperature,
      rmsRelativeError: fit.rmsRelativeError,
      worstRelativeError: fit.worstRelativeError,
      worstPoint: original(fit.worstPoint),
      pointCount: fit.pointCount,
      constrained: fit.constrained,
    };
  }
  const factor = (t: number) => (behaviour ? behaviourFactor(behaviour, t) : 1);
  const fitOptions = behaviour ? { temperatureFactor: factor } : {};
  const bands: SteinmetzBandFit[] =
    options.mode === 'bands'
      ? fitInBands(used, options.maxWorstError, fitOptions)
      : [wholeRange(fitSteinmetz(used, fitOptions), used.length, options.maxWorstError)];
  const fits = bands.map((band) => ({ ...band, worstPoint: original(band.worstPoint), pointIndices: band.pointIndices.map(original) }));

  const bandOf = new Map<number, number>();
  fits.forEach((band, b) => band.pointIndices.forEach((i) => bandOf.has(i) || bandOf.set(i, b)));
  const residuals = selected.map((index) => {
    const p = points[index]!;
    const band = bandOf.get(index)!;
    const fitted = fittedLoss(fits[band]!, p.frequency, p.peakFlux) * factor(p.temperature);
    return { index, band, measured: p.lossDensity, fitted, relativeError: fitted / p.lossDensity - 1 };
  });
  // The behaviour was fitted against one Steinmetz fit; with bands, its quality is judged against each point's band.
  if (temperature && behaviour && fits.length > 1) {
    const found = behaviour;
    const quality = fitQuality(
      residuals.map((r) => behaviourFactor(found, points[r.index]!.temperature)),
      residuals.map((r) => (r.measured * factor(points[r.index]!.temperature)) / r.fitted),
    );
    temperature = { ...temperature, ...quality, worstPoint: residuals[quality.worstPoint]!.index };
  }
  const biasLoss = biasLossOf(
    points,
    chosen.filter((i) => biased(points[i]!)),
    fits,
    factor,
  );
  return { options, pointCount: used.length, fits, temperature, residuals, biasLoss, ...lossCurves(points, fits, factor) };
}

/** The DC-bias loss curve from the biased points, each against the band covering its frequency (else the first). */
function biasLossOf(
  points: readonly LossPoint[],
  indices: number[],
  fits: readonly SteinmetzBandFit[],
  factor: (temperature: number) => number,
): MaterialFit['biasLoss'] {
  if (!indices.length) return null;
  const bandFor = (frequency: number) =>
    fits.find((b) => frequency >= b.fittedFrequency[0] && frequency <= b.fittedFrequency[1]) ?? fits[0]!;
  const ratios = indices.map((i) => {
    const p = points[i]!;
    return { field: p.dcBias!, ratio: p.lossDensity / (fittedLoss(bandFor(p.frequency), p.frequency, p.peakFlux) * factor(p.temperature)) };
  });
  const fit = fitBiasLoss(ratios);
  return fit ? { ...fit, worstPoint: indices[fit.worstPoint]! } : null;
}

function wholeRange(fit: SteinmetzFit, count: number, maxWorstError: number): SteinmetzBandFit {
  return { ...fit, pointIndices: Array.from({ length: count }, (_, i) => i), meetsTarget: fit.worstRelativeError <= maxWorstError };
}
