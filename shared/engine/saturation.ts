import type { CoreMaterial } from './types';

/** Bsat(T), linear through (25 °C, bsat25) and (100 °C, bsat100), extrapolated outside. */
export function saturationFlux(material: CoreMaterial, temperature: number): number {
  return material.bsat25 + ((material.bsat100 - material.bsat25) * (temperature - 25)) / 75;
}

/** Core flux at current I: B = L·I/(N·Ae); fringe flux passes through the core too. */
export function fluxDensity(inductance: number, current: number, turns: number, area: number): number {
  return (inductance * current) / (turns * area);
}

export interface SaturationCheck {
  peakFlux: number;
  saturationFlux: number;
  /** 1 − Bpk/Bsat(T). */
  margin: number;
  ok: boolean;
}

export function saturationCheck(
  material: CoreMaterial,
  peakFlux: number,
  temperature: number,
  requiredMargin = 0.2,
): SaturationCheck {
  const bsat = saturationFlux(material, temperature);
  const margin = 1 - peakFlux / bsat;
  return { peakFlux, saturationFlux: bsat, margin, ok: margin >= requiredMargin };
}
