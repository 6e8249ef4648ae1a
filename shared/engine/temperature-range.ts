// Where a material's core-loss temperature factor ct2·T² − ct1·T + ct0 is lowest over the temperatures it is used
// at. A parabola fitted near its minimum can dip below zero away from the fit, and a negative factor would turn
// core loss into a gain; stored materials cannot give one (named behaviour F0 + c·(T − T0)², F0 > 0, c ≥ 0), inline
// calc materials in the engine's constants can, and the engine guards against it.
import type { TemperatureCoefficients } from './core-loss';
import { coreLossTemperatureFactor } from './core-loss';

/** Temperatures a material's coefficients must hold over when the material states no limit (°C). */
export const TEMPERATURE_FACTOR_RANGE = { min: -40, max: 200 } as const;

export interface LowestFactor {
  value: number;
  /** Where it occurs (°C). */
  at: number;
}

/** The lowest factor on [tMin, tMax]: at an end, or at the vertex ct1/(2·ct2) of an upward parabola inside. */
export function lowestTemperatureFactor(coefficients: TemperatureCoefficients, tMin: number, tMax: number): LowestFactor {
  const candidates = [tMin, tMax];
  if (coefficients.ct2 > 0) {
    const vertex = coefficients.ct1 / (2 * coefficients.ct2);
    if (vertex > tMin && vertex < tMax) candidates.push(vertex);
  }
  let lowest: LowestFactor = { value: Number.POSITIVE_INFINITY, at: tMin };
  for (const t of candidates) {
    const value = coreLossTemperatureFactor(coefficients, t);
    if (value < lowest.value) lowest = { value, at: t };
  }
  return lowest;
}
