import { COPPER_TEMPERATURE_COEFFICIENT } from './constants';
import { copperResistanceRatio } from './copper';
import { AC_TEMPERATURE_NODES, dotBasis, gridScaleAt, lagrangeBasis, type AcTemperatureGrid } from './copper-loss';
import { coreLossTemperatureFactor, type TemperatureCoefficients } from './core-loss';
import { NetworkSolution, networkStep, thermalNetwork, type Cooling, type ThermalNetwork } from './thermal-network';
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
export const THERMAL_MAX_PASSES = 12;
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
  return { network: thermalNetwork(core), ...crossCheckPart(core) };
}

/** What the two empirical laws need of a core. */
export function crossCheckPart(core: CoreShape): Pick<ThermalPart, 'surfaceArea' | 'volumeThermalResistance'> {
  return {
    surfaceArea: core.surfaceArea,
    volumeThermalResistance: VOLUME_LAW_FAMILIES.includes(core.family) ? coreVolumeThermalResistance(core.ve) : Number.NaN,
  };
}

/**
 * The two empirical laws' rises at a total loss (W), the cross-check shown beside the network's: the surface law on
 * every core, the core-volume law where it applies (NaN elsewhere); a part in runaway has both capped where the model
 * stops. Kept out of the loss–temperature iteration: only a shown result needs them.
 */
export function crossCheckRises(
  power: number,
  part: Pick<ThermalPart, 'surfaceArea' | 'volumeThermalResistance'>,
  ambient: number,
  runaway: boolean,
  out: TemperatureRise = new TemperatureRise(),
): TemperatureRise {
  const cap = runaway ? THERMAL_MODEL_LIMIT - ambient : Number.POSITIVE_INFINITY;
  const bySurface = surfaceDissipationRise(power, part.surfaceArea);
  const byVolume = power * part.volumeThermalResistance;
  out.bySurface = bySurface < cap ? bySurface : cap;
  out.byVolume = byVolume > cap ? cap : byVolume; // NaN (law not applied) stays NaN
  return out;
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
 * the core node) and the temperatures on the losses. The first pass takes the losses at ambient and the surface law's
 * rise as a start; each later pass solves the two-node network (thermal-network.ts) and the losses together by one
 * Newton step on the node balances (networkStep), until neither node moves by THERMAL_TOLERANCE, at most
 * THERMAL_MAX_PASSES passes. Unless `crossCheck` is false (the search's loop, which shows none), the two empirical
 * laws are evaluated at the last pass's total loss (crossCheckRises). The result is written into `out` so the search
 * allocates nothing.
 */
/** Lagrange basis of the AC grid at the winding's temperature, shared by the ripple and gap-field tables. */
const basis = new Float64Array(AC_TEMPERATURE_NODES);

export function solveTemperature(
  cooling: Cooling,
  loss: WoundCoreLoss,
  part: ThermalPart,
  out: ThermalSolution = new ThermalSolution(),
  crossCheck = true,
): ThermalSolution {
  const ambient = cooling.ambient;
  const net = out.network;
  const coefficients = loss.temperatureCoefficients;
  let passes = 0;
  let moved = Number.POSITIVE_INFINITY;
  let resistance = 0;
  let rippleWeight = 0;
  let gapLoss = 0;
  let rawFactor = 1;
  let temperatureFactor = 1;
  let coreTemperature = ambient;
  let windingTemperature = ambient;
  let copperLoss = 0;
  let coreLoss = 0;
  net.coreTemperature = ambient;
  net.windingTemperature = ambient;
  net.iterations = 0;
  while (passes < THERMAL_MAX_PASSES && !(moved < THERMAL_TOLERANCE)) {
    // Losses are never evaluated above the model limit: past it the part is in runaway.
    const coreCapped = net.coreTemperature >= THERMAL_MODEL_LIMIT;
    const windingCapped = net.windingTemperature >= THERMAL_MODEL_LIMIT;
    coreTemperature = coreCapped ? THERMAL_MODEL_LIMIT : net.coreTemperature;
    windingTemperature = windingCapped ? THERMAL_MODEL_LIMIT : net.windingTemperature;
    resistance = loss.resistance20 * copperResistanceRatio(windingTemperature);
    const grid = loss.acGrid;
    if (grid) lagrangeBasis(grid, gridScaleAt(grid, windingTemperature), basis);
    rippleWeight = grid ? dotBasis(basis, loss.rippleWeights) : loss.rippleWeights[0]!;
    rawFactor = coreLossTemperatureFactor(coefficients, coreTemperature);
    const floored = !(rawFactor > TEMPERATURE_FACTOR_FLOOR);
    temperatureFactor = floored ? TEMPERATURE_FACTOR_FLOOR : rawFactor;
    // The gap's fringing field drives eddy loss in the winding: copper loss, at the winding's temperature.
    gapLoss = loss.gapLossScale > 0 ? loss.gapLossScale * (grid ? dotBasis(basis, loss.gapLossWeights) : loss.gapLossWeights[0]!) : 0;
    const currentSquare = loss.dcCurrentSquare + rippleWeight;
    copperLoss = resistance * currentSquare + gapLoss;
    coreLoss = loss.coreLossReference * temperatureFactor;
    if (passes === 0) {
      // A cheap start near the network's answer: the surface law's rise for the losses at ambient.
      const rise = surfaceDissipationRise(copperLoss + coreLoss, part.surfaceArea);
      net.coreTemperature = ambient + rise;
      net.windingTemperature = ambient + rise;
    } else {
      // How fast each node's loss grows with its temperature (the ripple's and the gap field's slower change with ρ
      // is left out of the step, not out of the losses): copper's α20, the core factor's slope.
      const copperSlope = windingCapped ? 0 : loss.resistance20 * COPPER_TEMPERATURE_COEFFICIENT * currentSquare;
      const coreSlope =
        coreCapped || floored || !coefficients ? 0 : loss.coreLossReference * (2 * coefficients.ct2 * coreTemperature - coefficients.ct1);
      moved = networkStep(part.network, cooling, coreLoss, copperLoss, coreSlope, copperSlope, net);
    }
    passes += 1;
  }
  const rise = (net.coreTemperature > net.windingTemperature ? net.coreTemperature : net.windingTemperature) - ambient;
  const power = copperLoss + coreLoss;
  out.passes = passes;
  out.converged = moved < THERMAL_TOLERANCE;
  out.runaway = ambient + rise > THERMAL_MODEL_LIMIT;
  if (crossCheck) crossCheckRises(power, part, ambient, out.runaway, out.rise);
  else {
    out.rise.bySurface = Number.NaN;
    out.rise.byVolume = Number.NaN;
  }
  out.rise.design = out.runaway ? THERMAL_MODEL_LIMIT - ambient : rise;
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
