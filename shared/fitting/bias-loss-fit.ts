// The DC-bias loss curve 1 + (H/H₂)^m from loss points measured under bias, against the zero-bias fit.
import { biasLossFactor } from '@shared/engine/dc-bias-loss';
import type { BiasLossCurve } from '@shared/engine/types';
import { fitQuality, type FitQuality } from './fit-quality';

/** One biased point: its DC field (A/m) and its loss over the zero-bias fit's at the same f, B̂ and T. */
export interface BiasLossPoint {
  field: number;
  ratio: number;
}

export interface BiasLossFitResult extends BiasLossCurve, FitQuality {}

/** Below this ratio − 1 a point says the bias made no difference: it carries no information on H₂ and m. */
const NO_RISE = 0.02;

/**
 * ln(ratio − 1) = m·ln H − m·ln H₂ is a straight line in ln H: least squares over the points that rose by more than
 * NO_RISE (at least two distinct fields) gives m and H₂; the quality is the curve's factor against every biased point's
 * ratio. Null when the points cannot say.
 */
export function fitBiasLoss(points: readonly BiasLossPoint[]): BiasLossFitResult | null {
  const usable = points.filter((p) => p.field > 0 && p.ratio - 1 > NO_RISE);
  const fields = new Set(usable.map((p) => p.field));
  if (fields.size < 2) return null;
  const xs = usable.map((p) => Math.log(p.field));
  const ys = usable.map((p) => Math.log(p.ratio - 1));
  const n = xs.length;
  const meanX = xs.reduce((a, b) => a + b, 0) / n;
  const meanY = ys.reduce((a, b) => a + b, 0) / n;
  let sxx = 0;
  let sxy = 0;
  xs.forEach((x, i) => {
    sxx += (x - meanX) ** 2;
    sxy += (x - meanX) * (ys[i]! - meanY);
  });
  const steepness = sxy / sxx;
  if (!(steepness > 0)) return null;
  const doublingField = Math.exp(meanX - meanY / steepness);
  const curve = { doublingField, steepness };
  const quality = fitQuality(
    points.map((p) => biasLossFactor(curve, p.field)),
    points.map((p) => p.ratio),
  );
  return { ...curve, ...quality };
}
