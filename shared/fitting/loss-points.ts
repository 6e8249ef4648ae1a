import { FitInputError } from './fit-error';

/** One measured or read-off core-loss point, in SI units (temperature in °C). */
export interface LossPoint {
  /** Frequency (Hz). */
  frequency: number;
  /** Peak AC flux density B̂, half the peak-to-peak swing (T). */
  peakFlux: number;
  /** Core temperature (°C). */
  temperature: number;
  /** Loss density Pv (W/m³). */
  lossDensity: number;
  /** DC bias field (A/m), where the point was taken under bias. */
  dcBias?: number;
  /** Where the point came from (bench run, curve read-off, …). */
  source?: string;
}

const POSITIVE_FIELDS = ['frequency', 'peakFlux', 'lossDensity'] as const;

/**
 * Refuses the first point with a non-finite value, or a frequency, flux or loss that is not positive; the error
 * names the field and the point's index.
 */
export function checkLossPoints(points: readonly LossPoint[]): void {
  points.forEach((point, index) => {
    for (const field of POSITIVE_FIELDS) {
      const value = point[field];
      if (!Number.isFinite(value))
        throw new FitInputError('invalid-value', `point ${index}: ${field} is not a finite number`, field, index);
      if (value <= 0) throw new FitInputError('not-positive', `point ${index}: ${field} must be positive, got ${value}`, field, index);
    }
    if (!Number.isFinite(point.temperature)) {
      throw new FitInputError('invalid-value', `point ${index}: temperature is not a finite number`, 'temperature', index);
    }
    if (point.dcBias !== undefined && !(Number.isFinite(point.dcBias) && point.dcBias >= 0)) {
      throw new FitInputError('invalid-value', `point ${index}: dcBias must be a finite field ≥ 0 A/m`, 'dcBias', index);
    }
  });
}

/** The points whose temperature lies in [min, max] °C, with their indices in `points`. */
export function pointsInTemperatureBand(
  points: readonly LossPoint[],
  min: number,
  max: number,
): { points: LossPoint[]; indices: number[] } {
  const indices = points.flatMap((p, i) => (p.temperature >= min && p.temperature <= max ? [i] : []));
  return { points: indices.map((i) => points[i]!), indices };
}

/** Smallest and largest of the values (the caller ensures there is at least one). */
export function valueRange(values: readonly number[]): [number, number] {
  let min = Infinity;
  let max = -Infinity;
  for (const v of values) {
    min = Math.min(min, v);
    max = Math.max(max, v);
  }
  return [min, max];
}

/** Distinct values, ascending. */
export function distinctSorted(values: readonly number[]): number[] {
  return [...new Set(values)].sort((a, b) => a - b);
}
