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
/**
 * Highest temperature (°C) at which losses are evaluated. Above it magnet-wire enamel (class 220 at most) and
 * ferrite (Curie points of roughly 200–300 °C) have failed and the loss fits mean nothing, so a part whose losses
 * would drive it past this point is in thermal runaway (common practice, no source). Without this cap the
 * loss–temperature iteration diverges and reports absurd figures (negative Bsat, kΩ of copper).
 */
export const THERMAL_MODEL_LIMIT = 250;

export interface ThermalSolution {
  rise: TemperatureRise;
  passes: number;
  converged: boolean;
  /** The losses would heat the part past THERMAL_MODEL_LIMIT; figures are those at that limit. */
  runaway: boolean;
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
  const capped = (t: number) => Math.min(t, THERMAL_MODEL_LIMIT);
  let rise = temperatureRise(lossAt(capped(ambient)), surfaceArea, effectiveVolume);
  let previous = 0;
  let passes = 1;
  while (Math.abs(rise.design - previous) >= THERMAL_TOLERANCE && passes < THERMAL_MAX_PASSES) {
    previous = rise.design;
    rise = temperatureRise(lossAt(capped(ambient + rise.design)), surfaceArea, effectiveVolume);
    passes += 1;
  }
  return {
    rise,
    passes,
    converged: Math.abs(rise.design - previous) < THERMAL_TOLERANCE,
    runaway: ambient + rise.design > THERMAL_MODEL_LIMIT,
  };
}
