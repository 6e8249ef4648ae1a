import { THERMAL_MODEL_LIMIT } from './thermal';
import type { CoreMaterial } from './types';

/**
 * Bsat(T), linear through (25 °C, bsat25) and (100 °C, bsat100) and extrapolated beyond, but read at most at the
 * thermal model limit (losses are not evaluated past it either) and never below zero: a negative Bsat is not a
 * material property.
 */
export function saturationFlux(material: CoreMaterial, temperature: number): number {
  const t = Math.min(temperature, THERMAL_MODEL_LIMIT);
  return Math.max(0, material.bsat25 + ((material.bsat100 - material.bsat25) * (t - 25)) / 75);
}

/** Core flux at current I: B = L·I/(N·Ae); fringe flux passes through the core too. */
export function fluxDensity(inductance: number, current: number, turns: number, area: number): number {
  return (inductance * current) / (turns * area);
}

/** Saturation margin 1 − Bpk/Bsat(T); −1 (none at all) when nothing is left of Bsat. */
export function saturationMargin(peakFlux: number, saturationFlux: number): number {
  return saturationFlux > 0 ? 1 - peakFlux / saturationFlux : -1;
}
