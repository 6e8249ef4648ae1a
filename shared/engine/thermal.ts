/** Surface-dissipation law ΔT = 450·(P/At)^0.826, P in W and At in cm² (At given here in m²). */
export function surfaceDissipationRise(power: number, surfaceArea: number): number {
  if (power <= 0) return 0;
  return 450 * Math.pow(power / (surfaceArea * 1e4), 0.826);
}

/** Thermal resistance of a ferrite E-type core from its effective volume: Rth = 53·Ve^−0.54, Ve in cm³ (K/W). */
export function coreVolumeThermalResistance(effectiveVolume: number): number {
  return 53 * Math.pow(effectiveVolume * 1e6, -0.54);
}

export interface TemperatureRise {
  bySurface: number;
  byVolume: number;
  /** The larger of the two, used for design decisions. */
  design: number;
}

export function temperatureRise(power: number, surfaceArea: number, effectiveVolume: number): TemperatureRise {
  const bySurface = surfaceDissipationRise(power, surfaceArea);
  const byVolume = Math.max(0, power) * coreVolumeThermalResistance(effectiveVolume);
  return { bySurface, byVolume, design: Math.max(bySurface, byVolume) };
}

export const THERMAL_TOLERANCE = 0.1;
export const THERMAL_MAX_PASSES = 6;

export interface ThermalSolution {
  rise: TemperatureRise;
  passes: number;
  converged: boolean;
}

/**
 * Losses depend on temperature (copper ρ(T), core-loss factor) and temperature on losses: start at ambient and
 * repeat until the rise moves less than 0.1 K, at most 6 passes.
 */
export function solveTemperature(
  ambient: number,
  lossAt: (temperature: number) => number,
  surfaceArea: number,
  effectiveVolume: number,
): ThermalSolution {
  let rise = temperatureRise(lossAt(ambient), surfaceArea, effectiveVolume);
  let previous = 0;
  let passes = 1;
  while (Math.abs(rise.design - previous) >= THERMAL_TOLERANCE && passes < THERMAL_MAX_PASSES) {
    previous = rise.design;
    rise = temperatureRise(lossAt(ambient + rise.design), surfaceArea, effectiveVolume);
    passes += 1;
  }
  return { rise, passes, converged: Math.abs(rise.design - previous) < THERMAL_TOLERANCE };
}
