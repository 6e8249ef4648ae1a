// The numeric core shared by evaluateDesign and searchCandidates. Everything that depends only on the spec, a
// wire, a material or a core × material pair is prepared once; evaluateCandidate then composes the formula modules'
// functions without allocating.
import { acCopperLoss, acLossSums, dcCopperLoss, effectiveAcFactor, rippleResistanceWeight, type AcLossSums } from './copper-loss';
import { windingResistance } from './copper';
import { HOT_SPOT_ALLOWANCE } from './constants';
import { fluxInFitRange, frequencyInFitRange, igseTriangleLoss, steinmetzLoss } from './core-loss';
import { foilDelta, roundWireDelta } from './dowell';
import {
  fringingOutOfRange,
  fringingFactor,
  gappedInductance,
  gappedInductanceFactor,
  gapWithFringing,
  minimumTurnsUngapped,
  spacerThickness,
  turnsForFluxLimit,
  turnsForGap,
  type GapGeometry,
} from './gap';
import { harmonicWeights, type HarmonicWeights } from './harmonics';
import { resolveLimits, type ConverterSpec, type DesignLimits } from './inputs';
import { operatingPoint, type OperatingPoint } from './operating-point';
import { biasedInductance, permeabilityFraction, powderInductanceFactor, powderTurns } from './powder';
import { fluxDensity, saturationFlux, saturationMargin } from './saturation';
import { copperSkinDepth } from './skin-depth';
import { ThermalSolution, coreVolumeThermalResistance, solveTemperature, type WoundCoreLoss } from './thermal';
import type { CoreMaterial, CoreShape, WireOption } from './types';
import { conductorCopperArea, fitsBuildHeight, layWinding, windowFill } from './winding';

/** Ferrite without a stated limit: Curie temperature typically ≥ 200 °C (common practice, no source). */
export const DEFAULT_FERRITE_TEMPERATURE_LIMIT = 200;

export function materialTemperatureLimit(material: CoreMaterial): number {
  return material.maxTemperature ?? (material.family === 'ferrite' ? DEFAULT_FERRITE_TEMPERATURE_LIMIT : Number.POSITIVE_INFINITY);
}

/** Failure reasons, one bit each, so the inner loop records them without building text. */
export const FAILURE = {
  inductanceShort: 1 << 0,
  negativeGap: 1 << 1,
  powderLimit: 1 << 2,
  saturation: 1 << 3,
  permeabilityDrop: 1 << 4,
  build: 1 << 5,
  fill: 1 << 6,
  temperatureRise: 1 << 7,
  insulation: 1 << 8,
  materialTemperature: 1 << 9,
  lossBudget: 1 << 10,
  thermalRunaway: 1 << 11,
} as const;

export const WARNING = {
  fringingRange: 1 << 0,
  frequencyFit: 1 << 1,
  fluxFit: 1 << 2,
  thermalNotConverged: 1 << 3,
  fluxAboveLimit: 1 << 4,
} as const;

export interface SpecContext {
  spec: ConverterSpec;
  limits: DesignLimits;
  op: OperatingPoint;
  harmonics: HarmonicWeights;
  /**
   * Copper temperature for skin depth and Dowell factors: the hottest the limits allow (ambient + max rise).
   * Held fixed so one harmonic sum per wire serves every candidate; Rdc itself follows the thermal iteration.
   */
  acTemperature: number;
  skinDepth: number;
}

export function prepareSpec(spec: ConverterSpec, limits?: Partial<DesignLimits>): SpecContext {
  const resolved = resolveLimits(limits);
  const op = operatingPoint(spec, resolved.inductanceTolerance);
  const acTemperature = resolved.ambient + resolved.maxRise;
  return {
    spec,
    limits: resolved,
    op,
    harmonics: harmonicWeights(op.rippleAtVinMax, op.dutyAtVinMax),
    acTemperature,
    skinDepth: copperSkinDepth(spec.frequency, acTemperature),
  };
}

export interface WireContext {
  wire: WireOption;
  /** Copper area of one turn (m²); foil's depends on the core, see `turnCopperArea`. */
  copperArea: number;
  /** Penetration ratio Δ of the fundamental. */
  firstHarmonicDelta: number;
  /** Dowell layers per winding layer: 1 for round wire, ≈√strands rows of strands inside a litz bundle. */
  layersPerWindingLayer: number;
  sums: AcLossSums;
}

export function prepareWire(wire: WireOption, ctx: SpecContext): WireContext {
  const isLitz = wire.kind === 'litz';
  // Close-wound layers: pitch = insulated diameter; inside litz, strands share the bundle's diameter.
  const porosity = isLitz
    ? Math.min(1, (wire.strandDiameter * Math.sqrt(wire.strands)) / wire.overallDiameter)
    : wire.strandDiameter / (wire.overallDiameter || wire.strandDiameter);
  // Foil spanning the winding width is Dowell's layer itself: Δ = h/δ (porosity ≈ 1).
  const firstHarmonicDelta =
    wire.kind === 'foil' ? foilDelta(wire.strandDiameter, ctx.skinDepth) : roundWireDelta(wire.strandDiameter, ctx.skinDepth, porosity);
  return {
    wire,
    copperArea: conductorCopperArea(wire),
    firstHarmonicDelta,
    layersPerWindingLayer: isLitz ? Math.max(1, Math.round(Math.sqrt(wire.strands))) : 1,
    sums: acLossSums(firstHarmonicDelta, ctx.harmonics),
  };
}

/** Copper area of one turn of this wire on this core (m²). */
export function turnCopperArea(wireCtx: WireContext, core: CoreShape): number {
  return wireCtx.wire.kind === 'foil' ? conductorCopperArea(wireCtx.wire, core) : wireCtx.copperArea;
}

export interface MaterialContext {
  material: CoreMaterial;
  /** iGSE density (W/m³) of this spec's triangular flux at ΔB = 1 T and the reference temperature; scales as ΔB^β. */
  igseAtUnitSwing: number;
  /** Steinmetz density at ΔB = 1 T (B̂ = ½ T), likewise. */
  steinmetzAtUnitSwing: number;
  frequencyInFit: boolean;
}

export function prepareMaterial(material: CoreMaterial, ctx: SpecContext): MaterialContext {
  const f = ctx.spec.frequency;
  return {
    material,
    igseAtUnitSwing: igseTriangleLoss(material, f, 1, ctx.op.dutyAtVinMax),
    steinmetzAtUnitSwing: steinmetzLoss(material, f, 0.5),
    frequencyInFit: frequencyInFitRange(material, f),
  };
}

export interface CoreContext {
  core: CoreShape;
  thermalResistanceByVolume: number;
}

export function prepareCore(core: CoreShape): CoreContext {
  return { core, thermalResistanceByVolume: coreVolumeThermalResistance(core.ve) };
}

/** Turns, gap and inductance of one core × material, independent of the wire. */
export interface MagneticDesign {
  kind: 'air-gap' | 'distributed';
  turns: number;
  totalGap: number;
  spacer: number;
  fringingFactor: number;
  inductanceFactorWithoutFringing: number;
  inductanceFactor: number;
  /** Nominal inductance at zero bias, at full load and at the saturation-check peak (H). */
  inductanceZeroBias: number;
  inductanceAtLoad: number;
  inductanceAtPeak: number;
  /** L(peak)/L(0). */
  permeabilityAtPeak: number;
  failures: number;
  warnings: number;
}

export type TurnsInput = number | 'auto';

/** Most turns whose copper (Irms/J each) fits the usable window. */
export function windowTurnLimit(core: CoreShape, ctx: SpecContext): number {
  const perTurn = ctx.op.rmsCurrent / ctx.limits.currentDensity;
  return Math.max(1, Math.floor((ctx.limits.windowUtilisation * core.windowArea) / perTurn));
}

export function designMagnetics(
  core: CoreShape,
  material: CoreMaterial,
  ctx: SpecContext,
  turnsInput: TurnsInput = 'auto',
  gapInput: TurnsInput = 'auto',
): MagneticDesign {
  return core.gapKind === 'distributed'
    ? designDistributed(core, material, ctx, turnsInput)
    : designAirGap(core, material, ctx, turnsInput, gapInput);
}

function designDistributed(core: CoreShape, material: CoreMaterial, ctx: SpecContext, turnsInput: TurnsInput): MagneticDesign {
  const { op, limits } = ctx;
  const target = op.inductanceNominal;
  const al = powderInductanceFactor(material.permeability, core.ae, core.le);
  let failures = 0;
  let turns: number;
  if (turnsInput === 'auto') {
    const result = powderTurns(target, op.saturationCheckCurrent, al, core.le, material.rollOff, windowTurnLimit(core, ctx));
    turns = result.turns;
    if (!result.feasible) failures |= FAILURE.powderLimit;
  } else {
    turns = turnsInput;
  }
  const inductanceZeroBias = al * turns * turns;
  const inductanceAtPeak = biasedInductance(turns, op.saturationCheckCurrent, al, core.le, material.rollOff);
  const inductanceAtLoad = biasedInductance(turns, op.ioutMax, al, core.le, material.rollOff);
  if (inductanceAtPeak * (1 - limits.inductanceTolerance) < op.inductanceMin * (1 - 1e-9) && !(failures & FAILURE.powderLimit)) {
    failures |= FAILURE.inductanceShort;
  }
  const permeabilityAtPeak = permeabilityFraction(material.rollOff, (turns * op.saturationCheckCurrent) / core.le);
  if (permeabilityAtPeak < limits.minPermeabilityAtPeak) failures |= FAILURE.permeabilityDrop;
  return {
    kind: 'distributed',
    turns,
    totalGap: 0,
    spacer: 0,
    fringingFactor: 1,
    inductanceFactorWithoutFringing: al,
    inductanceFactor: al,
    inductanceZeroBias,
    inductanceAtLoad,
    inductanceAtPeak,
    permeabilityAtPeak,
    failures,
    warnings: 0,
  };
}

function designAirGap(
  core: CoreShape,
  material: CoreMaterial,
  ctx: SpecContext,
  turnsInput: TurnsInput,
  gapInput: TurnsInput,
): MagneticDesign {
  const { op, limits } = ctx;
  const target = op.inductanceNominal;
  const geometry: GapGeometry = {
    area: core.ae,
    pathLength: core.le,
    windowHeight: core.windowHeight,
    permeability: material.permeability,
  };
  let failures = 0;
  let warnings = 0;
  let turns: number;
  if (turnsInput !== 'auto') turns = turnsInput;
  else if (gapInput !== 'auto') turns = turnsForGap(target, gapInput, geometry);
  else {
    turns = Math.max(turnsForFluxLimit(target, op.saturationCheckCurrent, limits.bMax, core.ae), minimumTurnsUngapped(target, geometry));
  }
  let gap: number;
  if (gapInput !== 'auto') gap = gapInput;
  else {
    gap = gapWithFringing(turns, target, geometry);
    if (gap < 0) {
      failures |= FAILURE.negativeGap;
      gap = 0;
    }
  }
  const inductance = gappedInductance(turns, gap, core.ae, core.le, material.permeability, core.windowHeight);
  if (inductance * (1 - limits.inductanceTolerance) < op.inductanceMin * (1 - 1e-6)) failures |= FAILURE.inductanceShort;
  if (fringingOutOfRange(gap, core.ae)) warnings |= WARNING.fringingRange;
  const fringing = fringingFactor(gap, core.ae, core.windowHeight);
  return {
    kind: 'air-gap',
    turns,
    totalGap: gap,
    spacer: spacerThickness(gap, core.centreToOuterLegAreaRatio ?? 1),
    fringingFactor: fringing,
    inductanceFactorWithoutFringing: gappedInductanceFactor(gap, core.ae, core.le, material.permeability, core.windowHeight, false),
    inductanceFactor: inductance / (turns * turns),
    inductanceZeroBias: inductance,
    inductanceAtLoad: inductance,
    inductanceAtPeak: inductance,
    permeabilityAtPeak: 1,
    failures,
    warnings,
  };
}

/** Every number of one evaluated candidate; reused between evaluations. */
export class CandidateFigures {
  turnsPerLayer = 0;
  layers = 0;
  buildHeight = 0;
  copperFill = 0;
  meanTurnLength = 0;
  resistance20 = 0;
  resistanceHot = 0;
  acFactor = 0;
  copperLossDc = 0;
  copperLossAc = 0;
  fluxDc = 0;
  fluxSwing = 0;
  fluxPeak = 0;
  /** Peak flux in the narrowest section (Amin where the core gives it), used for the saturation margin. */
  fluxPeakLocal = 0;
  coreLossDensityIgse = 0;
  coreLossDensitySteinmetz = 0;
  temperatureFactor = 1;
  coreLoss = 0;
  totalLoss = 0;
  riseBySurface = 0;
  riseByVolume = 0;
  rise = 0;
  hotSpot = 0;
  saturationFluxHot = 0;
  saturationMargin = 0;
  thermalPasses = 0;
  failures = 0;
  warnings = 0;
  /** Scratch of the loss–temperature iteration, reused so an evaluation allocates nothing. */
  readonly loss: WoundCoreLoss = { resistance20: 0, weightedCurrentSquare: 0, coreLossReference: 0, temperatureCoefficients: undefined };
  readonly thermal = new ThermalSolution();
}

export function evaluateCandidate(
  ctx: SpecContext,
  coreCtx: CoreContext,
  matCtx: MaterialContext,
  mag: MagneticDesign,
  wireCtx: WireContext,
  out: CandidateFigures,
): boolean {
  const { op, limits } = ctx;
  const core = coreCtx.core;
  const material = matCtx.material;
  const wire = wireCtx.wire;
  const n = mag.turns;
  let failures = mag.failures;
  let warnings = mag.warnings;

  layWinding(n, wire, core, out);
  const copperArea = turnCopperArea(wireCtx, core);
  out.copperFill = windowFill(n, copperArea, core.windowArea);
  if (!fitsBuildHeight(out.buildHeight, core)) failures |= FAILURE.build;
  if (out.copperFill > limits.windowUtilisation) failures |= FAILURE.fill;

  out.resistance20 = windingResistance(n, out.meanTurnLength, copperArea, 20);
  const dowellLayers = (Number.isFinite(out.layers) ? out.layers : 1) * wireCtx.layersPerWindingLayer;
  const rippleWeighted = rippleResistanceWeight(wireCtx.sums, dowellLayers);
  out.acFactor = effectiveAcFactor(wireCtx.sums, dowellLayers);

  out.fluxSwing = op.voltSeconds / (n * core.ae);
  out.fluxDc = fluxDensity(mag.inductanceAtLoad, op.ioutMax, n, core.ae);
  out.fluxPeak = fluxDensity(mag.inductanceAtPeak, op.saturationCheckCurrent, n, core.ae);
  out.fluxPeakLocal = core.amin !== undefined && core.amin < core.ae ? (out.fluxPeak * core.ae) / core.amin : out.fluxPeak;
  // Both densities scale as ΔB^β from their value at ΔB = 1 T, prepared once per material.
  const swingPowBeta = Math.pow(out.fluxSwing, material.beta);
  out.coreLossDensityIgse = matCtx.igseAtUnitSwing * swingPowBeta;
  out.coreLossDensitySteinmetz = matCtx.steinmetzAtUnitSwing * swingPowBeta;

  const loss = out.loss;
  loss.resistance20 = out.resistance20;
  loss.weightedCurrentSquare = op.ioutMax * op.ioutMax + rippleWeighted;
  loss.coreLossReference = out.coreLossDensityIgse * core.ve;
  loss.temperatureCoefficients = material.tempCoefficients;
  const thermal = solveTemperature(limits.ambient, loss, core.surfaceArea, coreCtx.thermalResistanceByVolume, out.thermal);
  if (!thermal.converged) warnings |= WARNING.thermalNotConverged;
  if (thermal.runaway) failures |= FAILURE.thermalRunaway;
  const rise = thermal.rise.design;
  out.thermalPasses = thermal.passes;
  out.resistanceHot = thermal.resistance;
  out.temperatureFactor = thermal.temperatureFactor;
  out.copperLossDc = dcCopperLoss(thermal.resistance, op.ioutMax);
  out.copperLossAc = acCopperLoss(thermal.resistance, wireCtx.sums, dowellLayers);
  out.coreLoss = loss.coreLossReference * thermal.temperatureFactor;
  out.totalLoss = thermal.totalLoss;
  out.riseBySurface = thermal.rise.bySurface;
  out.riseByVolume = thermal.rise.byVolume;
  out.rise = rise;
  out.hotSpot = limits.ambient + rise + HOT_SPOT_ALLOWANCE;

  out.saturationFluxHot = saturationFlux(material, out.hotSpot);
  out.saturationMargin = saturationMargin(out.fluxPeakLocal, out.saturationFluxHot);
  if (out.saturationMargin < limits.saturationMargin) failures |= FAILURE.saturation;
  if (mag.kind === 'air-gap' && out.fluxPeak > limits.bMax * (1 + 1e-9)) warnings |= WARNING.fluxAboveLimit;
  if (rise > limits.maxRise) failures |= FAILURE.temperatureRise;
  if (out.hotSpot > limits.insulationClass) failures |= FAILURE.insulation;
  if (out.hotSpot > materialTemperatureLimit(material)) failures |= FAILURE.materialTemperature;
  if (limits.lossBudget !== undefined && out.totalLoss > limits.lossBudget) failures |= FAILURE.lossBudget;
  if (!matCtx.frequencyInFit) warnings |= WARNING.frequencyFit;
  if (!fluxInFitRange(material, out.fluxSwing / 2)) warnings |= WARNING.fluxFit;

  out.failures = failures;
  out.warnings = warnings;
  return failures === 0;
}
