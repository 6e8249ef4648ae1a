// The numeric core shared by evaluateDesign and searchCandidates. Everything that depends only on the spec, a
// wire, a material or a core × material pair is prepared once; evaluateCandidate then runs without allocating.
import { acLossSums, type AcLossSums } from './copper-loss';
import { COPPER_RESISTIVITY_20C, COPPER_TEMPERATURE_COEFFICIENT, HOT_SPOT_ALLOWANCE, MU0 } from './constants';
import { igseCoefficient, triangleDutyFactor } from './core-loss';
import { proximityFactor, roundWireDelta } from './dowell';
import {
  fringingOutOfRange,
  fringingFactor,
  gappedInductance,
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
import { copperSkinDepth } from './skin-depth';
import { THERMAL_MAX_PASSES, THERMAL_MODEL_LIMIT, THERMAL_TOLERANCE, coreVolumeThermalResistance } from './thermal';
import type { CoreMaterial, CoreShape, WireOption } from './types';
import { conductorCopperArea } from './winding';

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
  const firstHarmonicDelta = roundWireDelta(wire.strandDiameter, ctx.skinDepth, porosity);
  return {
    wire,
    copperArea: conductorCopperArea(wire),
    firstHarmonicDelta,
    layersPerWindingLayer: isLitz ? Math.max(1, Math.round(Math.sqrt(wire.strands))) : 1,
    sums: acLossSums(firstHarmonicDelta, ctx.harmonics),
  };
}

export interface MaterialContext {
  material: CoreMaterial;
  /** Core-loss density at the reference temperature is this × ΔB^β (W/m³). */
  igsePerSwing: number;
  steinmetzPerSwing: number;
  frequencyInFit: boolean;
}

export function prepareMaterial(material: CoreMaterial, ctx: SpecContext): MaterialContext {
  const f = ctx.spec.frequency;
  const d = ctx.op.dutyAtVinMax;
  const fAlpha = Math.pow(f, material.alpha);
  return {
    material,
    igsePerSwing: igseCoefficient(material) * fAlpha * triangleDutyFactor(d, material.alpha),
    // Steinmetz takes the peak B̂ = ΔB/2.
    steinmetzPerSwing: (material.k * fAlpha) / Math.pow(2, material.beta),
    frequencyInFit: f >= material.fitFrequencyMin && f <= material.fitFrequencyMax,
  };
}

export interface CoreContext {
  core: CoreShape;
  thermalResistanceByVolume: number;
  surfaceAreaCm2: number;
}

export function prepareCore(core: CoreShape): CoreContext {
  return {
    core,
    thermalResistanceByVolume: coreVolumeThermalResistance(core.ve),
    surfaceAreaCm2: core.surfaceArea * 1e4,
  };
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
  const geometry: GapGeometry = { area: core.ae, pathLength: core.le, windowHeight: core.windowHeight, permeability: material.permeability };
  let failures = 0;
  let warnings = 0;
  let turns: number;
  if (turnsInput !== 'auto') turns = turnsInput;
  else if (gapInput !== 'auto') turns = turnsForGap(target, gapInput, geometry);
  else {
    turns = Math.max(
      turnsForFluxLimit(target, op.saturationCheckCurrent, limits.bMax, core.ae),
      minimumTurnsUngapped(target, geometry),
    );
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
  const reluctanceLength = gap + core.le / material.permeability;
  const fringing = fringingFactor(gap, core.ae, core.windowHeight);
  return {
    kind: 'air-gap',
    turns,
    totalGap: gap,
    spacer: spacerThickness(gap, core.centreToOuterLegAreaRatio ?? 1),
    fringingFactor: fringing,
    inductanceFactorWithoutFringing: (MU0 * core.ae) / reluctanceLength,
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
}

/** Winding layers and turns per layer without allocating (ring cores lose circumference layer by layer). */
function layOut(turns: number, wire: WireOption, core: CoreShape, out: CandidateFigures): void {
  const pitch = wire.conductorsPerTurn * wire.overallDiameter;
  if (core.ring) {
    let placed = 0;
    let layers = 0;
    let first = 0;
    while (placed < turns) {
      const inLayer = Math.floor((Math.PI * (core.ring.id - (2 * layers + 1) * wire.overallDiameter)) / pitch);
      if (inLayer < 1) {
        layers = Number.POSITIVE_INFINITY;
        break;
      }
      if (layers === 0) first = inLayer;
      placed += inLayer;
      layers += 1;
    }
    out.turnsPerLayer = first;
    out.layers = layers;
    out.buildHeight = layers * wire.overallDiameter;
    const build = Number.isFinite(out.buildHeight) ? out.buildHeight : core.bobbinHeight;
    out.meanTurnLength = core.ring.od - core.ring.id + 2 * core.ring.height + Math.PI * build;
  } else {
    const perLayer = Math.floor(core.bobbinWidth / pitch);
    out.turnsPerLayer = perLayer;
    out.layers = perLayer >= 1 ? Math.ceil(turns / perLayer) : Number.POSITIVE_INFINITY;
    out.buildHeight = out.layers * wire.overallDiameter;
    out.meanTurnLength = core.mlt;
  }
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

  layOut(n, wire, core, out);
  out.copperFill = (n * wireCtx.copperArea) / core.windowArea;
  if (!(out.buildHeight <= core.bobbinHeight)) failures |= FAILURE.build;
  if (out.copperFill > limits.windowUtilisation) failures |= FAILURE.fill;

  const mlt = out.meanTurnLength;
  out.resistance20 = (COPPER_RESISTIVITY_20C * n * mlt) / wireCtx.copperArea;
  const dowellLayers = (Number.isFinite(out.layers) ? out.layers : 1) * wireCtx.layersPerWindingLayer;
  const rippleWeighted = wireCtx.sums.skin + proximityFactor(dowellLayers) * wireCtx.sums.proximity;
  out.acFactor = rippleWeighted / wireCtx.sums.meanSquare;

  const areaTurns = n * core.ae;
  out.fluxSwing = op.voltSeconds / areaTurns;
  out.fluxDc = (mag.inductanceAtLoad * op.ioutMax) / areaTurns;
  out.fluxPeak = (mag.inductanceAtPeak * op.saturationCheckCurrent) / areaTurns;
  out.fluxPeakLocal = core.amin !== undefined && core.amin < core.ae ? (out.fluxPeak * core.ae) / core.amin : out.fluxPeak;
  const swingPowBeta = Math.pow(out.fluxSwing, material.beta);
  out.coreLossDensityIgse = matCtx.igsePerSwing * swingPowBeta;
  out.coreLossDensitySteinmetz = matCtx.steinmetzPerSwing * swingPowBeta;
  const coreLossReference = out.coreLossDensityIgse * core.ve;

  const dcSquare = op.ioutMax * op.ioutMax;
  const tc = material.tempCoefficients;
  let rise = 0;
  let previous = Number.NaN;
  let passes = 0;
  let totalLoss = 0;
  let riseBySurface = 0;
  let riseByVolume = 0;
  let resistance = 0;
  let tempFactor = 1;
  // The iteration of thermal.ts solveTemperature, inlined so no closure is made per candidate.
  while (passes < THERMAL_MAX_PASSES && !(Math.abs(rise - previous) < THERMAL_TOLERANCE)) {
    previous = rise;
    // Losses are never evaluated above the model limit: past it the part is in runaway (flagged below).
    const temperature = Math.min(limits.ambient + rise, THERMAL_MODEL_LIMIT);
    resistance = out.resistance20 * (1 + COPPER_TEMPERATURE_COEFFICIENT * (temperature - 20));
    tempFactor = tc ? tc.ct2 * temperature * temperature - tc.ct1 * temperature + tc.ct0 : 1;
    totalLoss = resistance * (dcSquare + rippleWeighted) + coreLossReference * tempFactor;
    riseBySurface = totalLoss > 0 ? 450 * Math.pow(totalLoss / coreCtx.surfaceAreaCm2, 0.826) : 0;
    riseByVolume = totalLoss * coreCtx.thermalResistanceByVolume;
    rise = riseBySurface > riseByVolume ? riseBySurface : riseByVolume;
    passes += 1;
  }
  if (!(Math.abs(rise - previous) < THERMAL_TOLERANCE)) warnings |= WARNING.thermalNotConverged;
  out.thermalPasses = passes;
  out.resistanceHot = resistance;
  out.temperatureFactor = tempFactor;
  out.copperLossDc = resistance * dcSquare;
  out.copperLossAc = resistance * rippleWeighted;
  out.coreLoss = coreLossReference * tempFactor;
  out.totalLoss = totalLoss;
  out.riseBySurface = riseBySurface;
  out.riseByVolume = riseByVolume;
  out.rise = rise;
  out.hotSpot = limits.ambient + rise + HOT_SPOT_ALLOWANCE;
  if (limits.ambient + rise > THERMAL_MODEL_LIMIT) failures |= FAILURE.thermalRunaway;

  // Bsat falls linearly through its 25 °C and 100 °C values; never read it beyond the model limit, nor below zero.
  const saturationTemperature = Math.min(out.hotSpot, THERMAL_MODEL_LIMIT);
  out.saturationFluxHot = Math.max(0, material.bsat25 + ((material.bsat100 - material.bsat25) * (saturationTemperature - 25)) / 75);
  out.saturationMargin = out.saturationFluxHot > 0 ? 1 - out.fluxPeakLocal / out.saturationFluxHot : -1;
  if (out.saturationMargin < limits.saturationMargin) failures |= FAILURE.saturation;
  if (mag.kind === 'air-gap' && out.fluxPeak > limits.bMax * (1 + 1e-9)) warnings |= WARNING.fluxAboveLimit;
  if (rise > limits.maxRise) failures |= FAILURE.temperatureRise;
  if (out.hotSpot > limits.insulationClass) failures |= FAILURE.insulation;
  if (out.hotSpot > materialTemperatureLimit(material)) failures |= FAILURE.materialTemperature;
  if (limits.lossBudget !== undefined && totalLoss > limits.lossBudget) failures |= FAILURE.lossBudget;
  if (!matCtx.frequencyInFit) warnings |= WARNING.frequencyFit;
  const peakAcFlux = out.fluxSwing / 2;
  if (peakAcFlux < material.fitFluxMin || peakAcFlux > material.fitFluxMax) warnings |= WARNING.fluxFit;

  out.failures = failures;
  out.warnings = warnings;
  return failures === 0;
}
