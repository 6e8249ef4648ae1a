import { copperResistanceRatio } from './copper';
import { coreLossTemperatureFactor, type TemperatureCoefficients } from './core-loss';

/** Surface-dissipation law ΔT = 450·(P/At)^0.826, P in W and At in cm² (At given here in m²). */
export function surfaceDissipationRise(power: number, surfaceArea: number): number {
  if (!(power > 0)) return 0;
  return 450 * Math.pow(power / (surfaceArea * 1e4), 0.826);
}

/** Thermal resistance of a ferrite E-type core from its effective volume: Rth = 53·Ve^−0.54, Ve in cm³ (K/W). */
export function coreVolumeThermalResistance(effectiveVolume: number): number {
  return 53 * Math.pow(effectiveVolume * 1e6, -0.54);
}

/** The rise by both laws at one loss (K). */
export class TemperatureRise {
  bySurface = 0;
  byVolume = 0;
  /** The larger of the two, used for design decisions. */
  design = 0;
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

/**
 * The losses of a winding on a core as functions of temperature: copper follows ρ(T)/ρ20 (copperResistanceRatio),
 * the core its material's temperature factor (coreLossTemperatureFactor). Plain numbers, so one object serves a
 * whole search.
 */
export interface WoundCoreLoss {
  /** Winding resistance at 20 °C (Ω). */
  resistance20: number;
  /** Iout² + Σ Fr·I_n²/2: the squared current the DC resistance sees, ripple weighted by its AC factors (A²). */
  weightedCurrentSquare: number;
  /** Core loss with the temperature factor 1 (W). */
  coreLossReference: number;
  temperatureCoefficients: TemperatureCoefficients | undefined;
}

export class ThermalSolution {
  readonly rise = new TemperatureRise();
  passes = 0;
  converged = false;
  /** The losses would heat the part past THERMAL_MODEL_LIMIT; figures are those at that limit. */
  runaway = false;
  /** Winding resistance, core-loss temperature factor and total loss at the temperature of the last pass. */
  resistance = 0;
  temperatureFactor = 1;
  totalLoss = 0;
}

/**
 * Losses depend on temperature (copper ρ(T), core-loss factor) and temperature on losses: start at ambient and
 * repeat until the rise moves less than 0.1 K, at most 6 passes. Each pass takes the larger rise of the surface law
 * and of the volume thermal resistance (K/W, coreVolumeThermalResistance, prepared once per core). The losses and
 * rise reported are those of the last pass; the result is written into `out` so the search allocates nothing.
 */
export function solveTemperature(
  ambient: number,
  loss: WoundCoreLoss,
  surfaceArea: number,
  volumeThermalResistance: number,
  out: ThermalSolution = new ThermalSolution(),
): ThermalSolution {
  let rise = 0;
  let previous = Number.NaN;
  let passes = 0;
  let bySurface = 0;
  let byVolume = 0;
  let resistance = 0;
  let temperatureFactor = 1;
  let power = 0;
  while (passes < THERMAL_MAX_PASSES && !(Math.abs(rise - previous) < THERMAL_TOLERANCE)) {
    previous = rise;
    // Losses are never evaluated above the model limit: past it the part is in runaway.
    const temperature = Math.min(ambient + rise, THERMAL_MODEL_LIMIT);
    resistance = loss.resistance20 * copperResistanceRatio(temperature);
    temperatureFactor = coreLossTemperatureFactor(loss.temperatureCoefficients, temperature);
    power = resistance * loss.weightedCurrentSquare + loss.coreLossReference * temperatureFactor;
    bySurface = surfaceDissipationRise(power, surfaceArea);
    byVolume = power * volumeThermalResistance;
    rise = bySurface > byVolume ? bySurface : byVolume;
    passes += 1;
  }
  out.rise.bySurface = bySurface;
  out.rise.byVolume = byVolume;
  out.rise.design = rise;
  out.passes = passes;
  out.converged = Math.abs(rise - previous) < THERMAL_TOLERANCE;
  out.runaway = ambient + rise > THERMAL_MODEL_LIMIT;
  out.resistance = resistance;
  out.temperatureFactor = temperatureFactor;
  out.totalLoss = power;
  return out;
}
