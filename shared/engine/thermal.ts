import { copperResistanceRatio } from './copper';
import { AC_TEMPERATURE_NODES, gridScaleAt, interpolateAtScale, type AcTemperatureGrid } from './copper-loss';
import { coreLossTemperatureFactor, type TemperatureCoefficients } from './core-loss';

/** Surface-dissipation law ΔT = 450·(P/At)^0.826, P in W and At in cm² (At given here in m²). */
export function surfaceDissipationRise(power: number, surfaceArea: number): number {
  if (!(power > 0)) return 0;
  return 450 * Math.pow(power / (surfaceArea * 1e4), SURFACE_EXPONENT);
}

const SURFACE_EXPONENT = 0.826;

/**
 * The loss above which the volume law's rise P·Rth exceeds the surface law's 450·(P/A)^0.826 (W): the two cross once,
 * at P = (450/(A^0.826·Rth))^(1/0.174); set a hair above it so a rounding error cannot reverse the comparison. Above
 * it the temperature iteration needs no power of the surface law.
 */
export function volumeLawAbove(surfaceArea: number, volumeThermalResistance: number): number {
  const crossing = Math.pow(450 / (Math.pow(surfaceArea * 1e4, SURFACE_EXPONENT) * volumeThermalResistance), 1 / (1 - SURFACE_EXPONENT));
  return crossing > 0 ? crossing * (1 + 1e-6) : Number.POSITIVE_INFINITY;
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

/** Lowest core-loss temperature factor used: a fit that turns ≤ 0 must never yield a negative loss (see FAILURE). */
export const TEMPERATURE_FACTOR_FLOOR = 0.01;

/**
 * The losses of a winding on a core as functions of temperature: copper follows ρ(T)/ρ20 (copperResistanceRatio)
 * at the hot spot, the ripple's AC factor the part's temperature (interpolated between the nodes of an
 * AcTemperatureGrid), the core its material's temperature factor (coreLossTemperatureFactor). Plain numbers and
 * reused arrays, so one object serves a whole search.
 */
export interface WoundCoreLoss {
  /** Winding resistance at 20 °C (Ω). */
  resistance20: number;
  /** Iout² (A²). */
  dcCurrentSquare: number;
  /** Σ Fr·I_n²/2 at the grid's node temperatures (A²); without a grid, element 0 holds it at every temperature. */
  rippleWeights: Float64Array;
  acGrid: AcTemperatureGrid | undefined;
  /** How much hotter the copper is than the part's surface estimate (K): Rdc is taken at the hot spot. */
  copperAboveSurface: number;
  /** Core loss with the temperature factor 1 (W). */
  coreLossReference: number;
  /**
   * Eddy loss the gap's fringing field drives in the winding (gap-field-loss.ts): gapLossScale (1/m·…) times the
   * wire's ripple transverse-field loss at the grid's nodes, interpolated at the part's temperature like the ripple
   * weight; scale 0 for none.
   */
  gapLossScale: number;
  gapLossWeights: Float64Array;
  temperatureCoefficients: TemperatureCoefficients | undefined;
}

/** A WoundCoreLoss with nothing in it, to be filled per evaluation. */
export function emptyWoundCoreLoss(): WoundCoreLoss {
  return {
    resistance20: 0,
    dcCurrentSquare: 0,
    rippleWeights: new Float64Array(AC_TEMPERATURE_NODES),
    acGrid: undefined,
    copperAboveSurface: 0,
    coreLossReference: 0,
    gapLossScale: 0,
    gapLossWeights: new Float64Array(AC_TEMPERATURE_NODES),
    temperatureCoefficients: undefined,
  };
}

export class ThermalSolution {
  readonly rise = new TemperatureRise();
  passes = 0;
  converged = false;
  /**
   * The losses would heat the part past THERMAL_MODEL_LIMIT: the losses are those at that limit and the rises are
   * reported as the rise at which the model stopped (THERMAL_MODEL_LIMIT − ambient), not the absurd figure the
   * surface law would give for them.
   */
  runaway = false;
  /** Winding resistance (at the hot spot), ripple weight Σ Fr·I_n²/2, core-loss factor and total loss of the last pass. */
  resistance = 0;
  rippleWeight = 0;
  /** Winding loss from the gap's fringing field in the last pass (W). */
  gapLoss = 0;
  temperatureFactor = 1;
  /** The factor as the coefficients give it, before the floor; ≤ 0 means the fit is invalid at that temperature. */
  rawTemperatureFactor = 1;
  /** Temperature (°C) at which the last pass took the core loss. */
  coreTemperature = 0;
  totalLoss = 0;
}

/**
 * Losses depend on temperature (copper ρ(T), the ripple's AC factor, the core-loss factor) and temperature on
 * losses: start at ambient and repeat until the rise moves less than 0.1 K, at most 6 passes. Each pass takes the
 * larger rise of the surface law and of the volume thermal resistance (K/W, coreVolumeThermalResistance, prepared
 * once per core). The losses and rise reported are those of the last pass; the result is written into `out` so the
 * search allocates nothing.
 */
export function solveTemperature(
  ambient: number,
  loss: WoundCoreLoss,
  surfaceArea: number,
  volumeThermalResistance: number,
  out: ThermalSolution = new ThermalSolution(),
  volumeAbove = volumeLawAbove(surfaceArea, volumeThermalResistance),
): ThermalSolution {
  let rise = 0;
  let previous = Number.NaN;
  let passes = 0;
  let bySurface = 0;
  let byVolume = 0;
  let resistance = 0;
  let rippleWeight = 0;
  let gapLoss = 0;
  let rawFactor = 1;
  let temperatureFactor = 1;
  let surface = ambient;
  let power = 0;
  while (passes < THERMAL_MAX_PASSES && !(Math.abs(rise - previous) < THERMAL_TOLERANCE)) {
    previous = rise;
    // Losses are never evaluated above the model limit: past it the part is in runaway.
    surface = Math.min(ambient + rise, THERMAL_MODEL_LIMIT);
    const copper = Math.min(ambient + rise + loss.copperAboveSurface, THERMAL_MODEL_LIMIT);
    resistance = loss.resistance20 * copperResistanceRatio(copper);
    const scale = loss.acGrid ? gridScaleAt(loss.acGrid, surface) : 0;
    rippleWeight = loss.acGrid ? interpolateAtScale(loss.acGrid, loss.rippleWeights, scale) : loss.rippleWeights[0]!;
    rawFactor = coreLossTemperatureFactor(loss.temperatureCoefficients, surface);
    temperatureFactor = rawFactor > TEMPERATURE_FACTOR_FLOOR ? rawFactor : TEMPERATURE_FACTOR_FLOOR;
    gapLoss =
      loss.gapLossScale > 0
        ? loss.gapLossScale * (loss.acGrid ? interpolateAtScale(loss.acGrid, loss.gapLossWeights, scale) : loss.gapLossWeights[0]!)
        : 0;
    power = resistance * (loss.dcCurrentSquare + rippleWeight) + gapLoss + loss.coreLossReference * temperatureFactor;
    byVolume = power * volumeThermalResistance;
    if (power > volumeAbove) {
      bySurface = Number.NaN;
      rise = byVolume;
    } else {
      bySurface = surfaceDissipationRise(power, surfaceArea);
      rise = bySurface > byVolume ? bySurface : byVolume;
    }
    passes += 1;
  }
  // The surface law's rise is reported even where the volume law decided.
  if (Number.isNaN(bySurface)) bySurface = surfaceDissipationRise(power, surfaceArea);
  out.passes = passes;
  out.converged = Math.abs(rise - previous) < THERMAL_TOLERANCE;
  out.runaway = ambient + rise > THERMAL_MODEL_LIMIT;
  const cap = out.runaway ? THERMAL_MODEL_LIMIT - ambient : Number.POSITIVE_INFINITY;
  out.rise.bySurface = bySurface < cap ? bySurface : cap;
  out.rise.byVolume = byVolume < cap ? byVolume : cap;
  out.rise.design = rise < cap ? rise : cap;
  out.resistance = resistance;
  out.rippleWeight = rippleWeight;
  out.gapLoss = gapLoss;
  out.temperatureFactor = temperatureFactor;
  out.rawTemperatureFactor = rawFactor;
  out.coreTemperature = surface;
  out.totalLoss = power;
  return out;
}
