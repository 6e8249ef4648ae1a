import { copperResistanceRatio } from './copper';
import { AC_TEMPERATURE_NODES, gridScaleAt, interpolateAtScale, type AcTemperatureGrid } from './copper-loss';
import { coreLossTemperatureFactor, type TemperatureCoefficients } from './core-loss';
import { NetworkSolution, solveNetwork, thermalNetwork, type Cooling, type ThermalNetwork } from './thermal-network';
import type { CoreFamily, CoreShape } from './types';

/** Surface-dissipation law ΔT = 450·(P/At)^0.826, P in W and At in cm² (At given here in m²). */
export function surfaceDissipationRise(power: number, surfaceArea: number): number {
  if (!(power > 0)) return 0;
  return 450 * Math.pow(power / (surfaceArea * 1e4), SURFACE_EXPONENT);
}

const SURFACE_EXPONENT = 0.826;

/** Thermal resistance of a ferrite E-type core from its effective volume: Rth = 53·Ve^−0.54, Ve in cm³ (K/W). */
export function coreVolumeThermalResistance(effectiveVolume: number): number {
  return 53 * Math.pow(effectiveVolume * 1e6, -0.54);
}

/** The rise of the two-node network and, as a cross-check, of the two empirical laws at the same loss (K). */
export class TemperatureRise {
  /** Surface law, applied to every core as a rough check. */
  bySurface = 0;
  /** Core-volume law; NaN where it does not apply (see VOLUME_LAW_FAMILIES). */
  byVolume = 0;
  /** The hotter node's rise, used for design decisions. */
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
 * and the ripple's AC factor (interpolated between the nodes of an AcTemperatureGrid) at the winding node's
 * temperature, the core its material's temperature factor (coreLossTemperatureFactor) at the core node's. Plain
 * numbers and reused arrays, so one object serves a whole search.
 */
export interface WoundCoreLoss {
  /** Winding resistance at 20 °C (Ω). */
  resistance20: number;
  /** Iout² (A²). */
  dcCurrentSquare: number;
  /** Σ Fr·I_n²/2 at the grid's node temperatures (A²); without a grid, element 0 holds it at every temperature. */
  rippleWeights: Float64Array;
  acGrid: AcTemperatureGrid | undefined;
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
    coreLossReference: 0,
    gapLossScale: 0,
    gapLossWeights: new Float64Array(AC_TEMPERATURE_NODES),
    temperatureCoefficients: undefined,
  };
}

/**
 * Families the core-volume law (fitted on ferrite E-type sets) is applied to as a cross-check: E, ETD, EFD, EQ. Not
 * to PQ, RM and pot cores (their winding is mostly enclosed) nor to toroids (no bobbin, the winding covers the core).
 */
export const VOLUME_LAW_FAMILIES: readonly CoreFamily[] = ['E', 'ETD', 'EFD', 'EQ'];

/** What the thermal solve needs of a core, prepared once per core. */
export interface ThermalPart {
  network: ThermalNetwork;
  /** Exposed surface of the wound part (m²), for the surface law's cross-check. */
  surfaceArea: number;
  /** Core-volume law's K/W where it applies (VOLUME_LAW_FAMILIES), NaN elsewhere. */
  volumeThermalResistance: number;
}

export function prepareThermalPart(core: CoreShape): ThermalPart {
  return {
    network: thermalNetwork(core),
    surfaceArea: core.surfaceArea,
    volumeThermalResistance: VOLUME_LAW_FAMILIES.includes(core.family) ? coreVolumeThermalResistance(core.ve) : Number.NaN,
  };
}

export class ThermalSolution {
  readonly rise = new TemperatureRise();
  passes = 0;
  converged = false;
  /**
   * The losses would heat the part past THERMAL_MODEL_LIMIT: the losses are those at that limit and the rises are
   * reported as the rise at which the model stopped (THERMAL_MODEL_LIMIT − ambient), not the absurd figure the
   * network would give for them.
   */
  runaway = false;
  /** Winding resistance (at the winding node), ripple weight Σ Fr·I_n²/2, core-loss factor and total loss of the last pass. */
  resistance = 0;
  rippleWeight = 0;
  /** Winding loss from the gap's fringing field in the last pass (W). */
  gapLoss = 0;
  temperatureFactor = 1;
  /** The factor as the coefficients give it, before the floor; ≤ 0 means the fit is invalid at that temperature. */
  rawTemperatureFactor = 1;
  /** Core node's temperature (°C), at which the last pass took the core loss (at most THERMAL_MODEL_LIMIT). */
  coreTemperature = 0;
  /** Winding node's temperature (°C), at which the last pass took the copper loss (at most THERMAL_MODEL_LIMIT). */
  windingTemperature = 0;
  copperLoss = 0;
  coreLoss = 0;
  totalLoss = 0;
  /** Scratch and last state of the two-node network. */
  readonly network = new NetworkSolution();
}

/**
 * Losses depend on temperature (copper ρ(T) and the ripple's AC factor at the winding node, the core-loss factor at
 * the core node) and the temperatures on the losses: start at ambient and repeat until the hotter node's rise moves
 * less than 0.1 K, at most 6 passes. The first pass takes the surface law's rise as a start; each later pass solves
 * the two-node network (thermal-network.ts) for that pass's core and copper loss from the previous temperatures. The surface law and, where it applies, the
 * core-volume law are evaluated at the last pass's total loss as a cross-check (TemperatureRise.bySurface/byVolume).
 * The result is written into `out` so the search allocates nothing.
 */
export function solveTemperature(
  cooling: Cooling,
  loss: WoundCoreLoss,
  part: ThermalPart,
  out: ThermalSolution = new ThermalSolution(),
): ThermalSolution {
  const ambient = cooling.ambient;
  const net = out.network;
  net.coreTemperature = ambient;
  net.windingTemperature = ambient;
  let rise = 0;
  let previous = Number.NaN;
  let passes = 0;
  let resistance = 0;
  let rippleWeight = 0;
  let gapLoss = 0;
  let rawFactor = 1;
  let temperatureFactor = 1;
  let coreTemperature = ambient;
  let windingTemperature = ambient;
  let copperLoss = 0;
  let coreLoss = 0;
  while (passes < THERMAL_MAX_PASSES && !(Math.abs(rise - previous) < THERMAL_TOLERANCE)) {
    previous = rise;
    // Losses are never evaluated above the model limit: past it the part is in runaway.
    coreTemperature = Math.min(net.coreTemperature, THERMAL_MODEL_LIMIT);
    windingTemperature = Math.min(net.windingTemperature, THERMAL_MODEL_LIMIT);
    resistance = loss.resistance20 * copperResistanceRatio(windingTemperature);
    const scale = loss.acGrid ? gridScaleAt(loss.acGrid, windingTemperature) : 0;
    rippleWeight = loss.acGrid ? interpolateAtScale(loss.acGrid, loss.rippleWeights, scale) : loss.rippleWeights[0]!;
    rawFactor = coreLossTemperatureFactor(loss.temperatureCoefficients, coreTemperature);
    temperatureFactor = rawFactor > TEMPERATURE_FACTOR_FLOOR ? rawFactor : TEMPERATURE_FACTOR_FLOOR;
    // The gap's fringing field drives eddy loss in the winding: copper loss, at the winding's temperature.
    gapLoss =
      loss.gapLossScale > 0
        ? loss.gapLossScale * (loss.acGrid ? interpolateAtScale(loss.acGrid, loss.gapLossWeights, scale) : loss.gapLossWeights[0]!)
        : 0;
    copperLoss = resistance * (loss.dcCurrentSquare + rippleWeight) + gapLoss;
    coreLoss = loss.coreLossReference * temperatureFactor;
    if (passes === 0) {
      // The first pass takes the surface law's rise for the losses at ambient: a cheap start near the network's
      // answer, from which the network (solved from the next pass on) converges in two or three iterations.
      rise = surfaceDissipationRise(copperLoss + coreLoss, part.surfaceArea);
      net.coreTemperature = ambient + rise;
      net.windingTemperature = ambient + rise;
    } else {
      solveNetwork(part.network, cooling, coreLoss, copperLoss, net);
      rise = (net.coreTemperature > net.windingTemperature ? net.coreTemperature : net.windingTemperature) - ambient;
    }
    passes += 1;
  }
  const power = copperLoss + coreLoss;
  const bySurface = surfaceDissipationRise(power, part.surfaceArea);
  const byVolume = power * part.volumeThermalResistance;
  out.passes = passes;
  out.converged = Math.abs(rise - previous) < THERMAL_TOLERANCE;
  out.runaway = ambient + rise > THERMAL_MODEL_LIMIT;
  const cap = out.runaway ? THERMAL_MODEL_LIMIT - ambient : Number.POSITIVE_INFINITY;
  out.rise.bySurface = bySurface < cap ? bySurface : cap;
  out.rise.byVolume = byVolume > cap ? cap : byVolume; // NaN (law not applied) stays NaN
  out.rise.design = rise < cap ? rise : cap;
  out.resistance = resistance;
  out.rippleWeight = rippleWeight;
  out.gapLoss = gapLoss;
  out.temperatureFactor = temperatureFactor;
  out.rawTemperatureFactor = rawFactor;
  out.coreTemperature = Math.min(net.coreTemperature, THERMAL_MODEL_LIMIT);
  out.windingTemperature = Math.min(net.windingTemperature, THERMAL_MODEL_LIMIT);
  out.copperLoss = copperLoss;
  out.coreLoss = coreLoss;
  out.totalLoss = power;
  return out;
}
