// The numeric core shared by evaluateDesign and searchCandidates. Everything that depends only on the spec, a
// wire, a material or a core × material pair is prepared once; evaluateCandidate then composes the formula modules'
// functions without allocating.
import {
  AcTemperatureGrid,
  acLossSums,
  acLossTable,
  dcCopperLoss,
  rippleWeightNodes,
  type AcLossSums,
  type AcLossTable,
} from './copper-loss';
import { windingResistance } from './copper';
import { FRINGING_VALIDITY_LIMIT, HOT_SPOT_ALLOWANCE } from './constants';
import { fluxInFitRange, frequencyInFitRange, igseTriangleLoss, steinmetzLoss } from './core-loss';
import { foilDelta, roundWireDelta } from './dowell';
import {
  gappedInductance,
  gappedInductanceFactor,
  gapWithFringing,
  minimumTurnsUngapped,
  spacerEquivalentGap,
  spacerForInductance,
  spacerInductance,
  turnsForFluxLimit,
  turnsForGap,
  turnsForSpacer,
  type GapGeometry,
} from './gap';
import { harmonicWeights, type HarmonicWeights } from './harmonics';
import { resolveLimits, type ConverterSpec, type DesignLimits } from './inputs';
import { operatingPoint, type OperatingPoint } from './operating-point';
import { biasedFlux, biasedInductance, permeabilityFraction, powderInductanceFactor, powderTurns } from './powder';
import { fluxDensity, saturationFlux, saturationMargin } from './saturation';
import { copperSkinDepth } from './skin-depth';
import {
  THERMAL_MODEL_LIMIT,
  ThermalSolution,
  coreVolumeThermalResistance,
  emptyWoundCoreLoss,
  solveTemperature,
  type WoundCoreLoss,
} from './thermal';
import type { CoreMaterial, CoreShape, GapPlacement, WireOption } from './types';
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
  gapTooSmall: 1 << 12,
  temperatureFactor: 1 << 13,
} as const;

export const WARNING = {
  fringingRange: 1 << 0,
  frequencyFit: 1 << 1,
  fluxFit: 1 << 2,
  thermalNotConverged: 1 << 3,
  fluxAboveLimit: 1 << 4,
  gapSensitive: 1 << 5,
} as const;

export interface SpecContext {
  spec: ConverterSpec;
  limits: DesignLimits;
  op: OperatingPoint;
  harmonics: HarmonicWeights;
  /**
   * Reference copper temperature (ambient + max rise) of skin depth and each wire's first-harmonic Δ, used to
   * choose wires. The losses read the AC factor at the part's own temperature from sums prepared on acGrid.
   */
  acTemperature: number;
  skinDepth: number;
  /** Copper temperatures (ambient … the thermal model limit) at which every wire's harmonic sums are prepared. */
  acGrid: AcTemperatureGrid;
  /** Hottest hot spot the limits allow (ambient + max rise + hot-spot allowance): the worst-case saturation corner. */
  hottestAllowed: number;
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
    acGrid: new AcTemperatureGrid(acTemperature, resolved.ambient, Math.max(THERMAL_MODEL_LIMIT, resolved.ambient + 1)),
    hottestAllowed: acTemperature + HOT_SPOT_ALLOWANCE,
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
  /** The same sums at each copper temperature of the spec's acGrid. */
  acTable: AcLossTable;
}

export function prepareWire(wire: WireOption, ctx: SpecContext, sumsByDelta?: Map<number, AcLossParts>): WireContext {
  const isLitz = wire.kind === 'litz';
  // Close-wound layers: pitch = insulated diameter; inside litz, strands share the bundle's diameter.
  const porosity = isLitz
    ? Math.min(1, (wire.strandDiameter * Math.sqrt(wire.strands)) / wire.overallDiameter)
    : wire.strandDiameter / (wire.overallDiameter || wire.strandDiameter);
  // Foil spanning the winding width is Dowell's layer itself: Δ = h/δ (porosity ≈ 1).
  const firstHarmonicDelta =
    wire.kind === 'foil' ? foilDelta(wire.strandDiameter, ctx.skinDepth) : roundWireDelta(wire.strandDiameter, ctx.skinDepth, porosity);
  let parts = sumsByDelta?.get(firstHarmonicDelta);
  if (!parts) {
    parts = { sums: acLossSums(firstHarmonicDelta, ctx.harmonics), acTable: acLossTable(firstHarmonicDelta, ctx.harmonics, ctx.acGrid) };
    sumsByDelta?.set(firstHarmonicDelta, parts);
  }
  return {
    wire,
    copperArea: conductorCopperArea(wire),
    firstHarmonicDelta,
    layersPerWindingLayer: isLitz ? Math.max(1, Math.round(Math.sqrt(wire.strands))) : 1,
    sums: parts.sums,
    acTable: parts.acTable,
  };
}

type AcLossParts = Pick<WireContext, 'sums' | 'acTable'>;

/**
 * Every wire of a search. The harmonic sums depend only on Δ, which wires in hand share with their single wire:
 * computed once per Δ (about a third of the catalogue's options), they are shared, never changed.
 */
export function prepareWires(wires: readonly WireOption[], ctx: SpecContext): WireContext[] {
  const sumsByDelta = new Map<number, AcLossParts>();
  return wires.map((wire) => prepareWire(wire, ctx, sumsByDelta));
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
  /** Where the gap is made; 'ground' for distributed-gap cores, which have none. */
  placement: GapPlacement;
  turns: number;
  /** Sum of the gap lengths the flux crosses: the ground gap, or twice the spacer (centre and outer legs). */
  totalGap: number;
  /** Spacer thickness: the design's own spacer, or for a ground gap the spacer that gives the same inductance. */
  spacer: number;
  /** Largest t/√A over the gaps (the fringing formula is trusted below 0.3). */
  relativeGap: number;
  /** Effective fringing factor: L with fringing over L without. */
  fringingFactor: number;
  inductanceFactorWithoutFringing: number;
  inductanceFactor: number;
  /** Nominal inductance at zero bias, at full load and at the saturation-check peak (H). */
  inductanceZeroBias: number;
  inductanceAtLoad: number;
  inductanceAtPeak: number;
  /** L(peak)/L(0). */
  permeabilityAtPeak: number;
  /** Nominal core flux density at full load and at the saturation-check current (T). */
  fluxAtLoad: number;
  fluxAtPeak: number;
  /** ΔL/L for 10 µm more gap (ground) or spacer; 0 for distributed-gap cores. Negative: L falls. */
  gapSensitivity: number;
  failures: number;
  warnings: number;
}

export type TurnsInput = number | 'auto';

/** Gap step of the sensitivity figure: what a grinder or a spacer foil may be off by (common practice, no source). */
export const GAP_SENSITIVITY_STEP = 10e-6;
/** |ΔL/L| for one sensitivity step above which the part is flagged as hard to build to tolerance (common practice, no source). */
export const GAP_SENSITIVITY_LIMIT = 0.1;

/** Most turns whose copper (Irms/J each) fits the usable window. */
export function windowTurnLimit(core: CoreShape, ctx: SpecContext): number {
  const perTurn = ctx.op.rmsCurrent / ctx.limits.currentDensity;
  return Math.max(1, Math.floor((ctx.limits.windowUtilisation * core.windowArea) / perTurn));
}

/**
 * Turns and gap of one core × material. For air-gap cores `gapInput` is the ground gap (placement 'ground') or the
 * spacer thickness (placement 'spacer'); distributed-gap cores ignore both.
 */
export function designMagnetics(
  core: CoreShape,
  material: CoreMaterial,
  ctx: SpecContext,
  turnsInput: TurnsInput = 'auto',
  gapInput: TurnsInput = 'auto',
  placement: GapPlacement = 'ground',
): MagneticDesign {
  return core.gapKind === 'distributed'
    ? designDistributed(core, material, ctx, turnsInput)
    : designAirGap(core, material, ctx, turnsInput, gapInput, placement);
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
    placement: 'ground',
    turns,
    totalGap: 0,
    spacer: 0,
    relativeGap: 0,
    fringingFactor: 1,
    inductanceFactorWithoutFringing: al,
    inductanceFactor: al,
    inductanceZeroBias,
    inductanceAtLoad,
    inductanceAtPeak,
    permeabilityAtPeak,
    // The roll-off curve is the incremental permeability: the flux is its integral, not μ%(H)·H.
    fluxAtLoad: biasedFlux(turns, op.ioutMax, material.permeability, core.le, material.rollOff),
    fluxAtPeak: biasedFlux(turns, op.saturationCheckCurrent, material.permeability, core.le, material.rollOff),
    gapSensitivity: 0,
    failures,
    warnings: 0,
  };
}

/** L of an air-gap core: one fringing ground gap across Ae, or a spacer's two fringing gaps in series. */
function airGapInductance(turns: number, gap: number, placement: GapPlacement, g: GapGeometry, ratio: number): number {
  return placement === 'spacer'
    ? spacerInductance(turns, gap, g, ratio)
    : gappedInductance(turns, gap, g.area, g.pathLength, g.permeability, g.windowHeight);
}

function designAirGap(
  core: CoreShape,
  material: CoreMaterial,
  ctx: SpecContext,
  turnsInput: TurnsInput,
  gapInput: TurnsInput,
  placement: GapPlacement,
): MagneticDesign {
  const { op, limits } = ctx;
  const target = op.inductanceNominal;
  const geometry: GapGeometry = {
    area: core.ae,
    pathLength: core.le,
    windowHeight: core.windowHeight,
    permeability: material.permeability,
  };
  const ratio = core.centreToOuterLegAreaRatio ?? 1;
  const spacer = placement === 'spacer';
  let failures = 0;
  let warnings = 0;
  let turns: number;
  if (turnsInput !== 'auto') turns = turnsInput;
  else if (gapInput !== 'auto')
    turns = spacer ? turnsForSpacer(target, gapInput, geometry, ratio) : turnsForGap(target, gapInput, geometry);
  else {
    // The flux limit at nominal L, and saturation margin kept by the upper-tolerance part at the hottest allowed
    // temperature in the narrowest section (the worst-case corner evaluateCandidate checks).
    const allowedFlux = saturationFlux(material, ctx.hottestAllowed) * (1 - limits.saturationMargin);
    const worstCase =
      allowedFlux > 0
        ? turnsForFluxLimit(
            target * (1 + limits.inductanceTolerance),
            op.saturationCheckCurrent,
            allowedFlux,
            Math.min(core.amin ?? core.ae, core.ae),
          )
        : 1;
    turns = Math.max(
      turnsForFluxLimit(target, op.saturationCheckCurrent, limits.bMax, core.ae),
      worstCase,
      minimumTurnsUngapped(target, geometry),
    );
  }
  // The ground gap, or the spacer thickness.
  let gap: number;
  if (gapInput !== 'auto') gap = gapInput;
  else {
    gap = spacer ? spacerForInductance(turns, target, geometry, ratio) : gapWithFringing(turns, target, geometry);
    if (gap < 0) {
      failures |= FAILURE.negativeGap;
      gap = 0;
    }
  }
  const inductance = airGapInductance(turns, gap, placement, geometry, ratio);
  if (inductance * (1 - limits.inductanceTolerance) < op.inductanceMin * (1 - 1e-6)) failures |= FAILURE.inductanceShort;
  // An exactly zero gap is an ungapped set (nothing to grind); any other gap must be one a workshop can hold.
  if (gap > 0 && gap < limits.minGap) failures |= FAILURE.gapTooSmall;
  const relativeGap = spacer ? gap / Math.sqrt(Math.min(core.ae, core.ae / ratio)) : gap / Math.sqrt(core.ae);
  if (relativeGap > FRINGING_VALIDITY_LIMIT) warnings |= WARNING.fringingRange;
  const gapSensitivity = airGapInductance(turns, gap + GAP_SENSITIVITY_STEP, placement, geometry, ratio) / inductance - 1;
  if (Math.abs(gapSensitivity) > GAP_SENSITIVITY_LIMIT) warnings |= WARNING.gapSensitive;
  const withoutFringing = gappedInductanceFactor(
    spacer ? spacerEquivalentGap(gap, ratio) : gap,
    core.ae,
    core.le,
    material.permeability,
    core.windowHeight,
    false,
  );
  const inductanceFactor = inductance / (turns * turns);
  return {
    kind: 'air-gap',
    placement,
    turns,
    totalGap: spacer ? 2 * gap : gap,
    spacer: spacer ? gap : Math.max(0, spacerForInductance(turns, inductance, geometry, ratio)),
    relativeGap,
    fringingFactor: inductanceFactor / withoutFringing,
    inductanceFactorWithoutFringing: withoutFringing,
    inductanceFactor,
    inductanceZeroBias: inductance,
    inductanceAtLoad: inductance,
    inductanceAtPeak: inductance,
    permeabilityAtPeak: 1,
    fluxAtLoad: fluxDensity(inductance, op.ioutMax, turns, core.ae),
    fluxAtPeak: fluxDensity(inductance, op.saturationCheckCurrent, turns, core.ae),
    gapSensitivity,
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
  /** The losses outran the cooling: rise and hot spot are where the thermal model stopped (see ThermalSolution). */
  runaway = false;
  /** Core temperature of the loss figures and the material's temperature factor there before any floor. */
  coreTemperature = 0;
  rawTemperatureFactor = 1;
  /** Nominal: Bsat at the predicted hot spot and the margin of fluxPeakLocal to it. */
  saturationFluxHot = 0;
  saturationMargin = 0;
  /** Worst case: the upper-tolerance part's local peak flux, Bsat at the hottest allowed temperature, margin. */
  fluxPeakHigh = 0;
  saturationFluxHottest = 0;
  saturationMarginHigh = 0;
  thermalPasses = 0;
  failures = 0;
  warnings = 0;
  /** Scratch of the loss–temperature iteration, reused so an evaluation allocates nothing. */
  readonly loss: WoundCoreLoss = emptyWoundCoreLoss();
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

  out.fluxSwing = op.voltSeconds / (n * core.ae);
  out.fluxDc = mag.fluxAtLoad;
  out.fluxPeak = mag.fluxAtPeak;
  out.fluxPeakLocal = core.amin !== undefined && core.amin < core.ae ? (out.fluxPeak * core.ae) / core.amin : out.fluxPeak;
  // Both densities scale as ΔB^β from their value at ΔB = 1 T, prepared once per material.
  const swingPowBeta = Math.pow(out.fluxSwing, material.beta);
  out.coreLossDensityIgse = matCtx.igseAtUnitSwing * swingPowBeta;
  out.coreLossDensitySteinmetz = matCtx.steinmetzAtUnitSwing * swingPowBeta;

  const loss = out.loss;
  loss.resistance20 = out.resistance20;
  loss.dcCurrentSquare = op.ioutMax * op.ioutMax;
  rippleWeightNodes(wireCtx.acTable, dowellLayers, loss.rippleWeights);
  loss.acGrid = ctx.acGrid;
  loss.copperAboveSurface = HOT_SPOT_ALLOWANCE;
  loss.coreLossReference = out.coreLossDensityIgse * core.ve;
  loss.temperatureCoefficients = material.tempCoefficients;
  const thermal = solveTemperature(limits.ambient, loss, core.surfaceArea, coreCtx.thermalResistanceByVolume, out.thermal);
  if (!thermal.converged) warnings |= WARNING.thermalNotConverged;
  if (thermal.runaway) failures |= FAILURE.thermalRunaway;
  // A temperature fit that is ≤ 0 where the core works is invalid there; the loss used the floored factor.
  if (thermal.rawTemperatureFactor <= 0) failures |= FAILURE.temperatureFactor;
  const rise = thermal.rise.design;
  out.runaway = thermal.runaway;
  out.coreTemperature = thermal.coreTemperature;
  out.rawTemperatureFactor = thermal.rawTemperatureFactor;
  out.thermalPasses = thermal.passes;
  out.resistanceHot = thermal.resistance;
  out.temperatureFactor = thermal.temperatureFactor;
  out.acFactor = thermal.rippleWeight / wireCtx.acTable.meanSquare;
  out.copperLossDc = dcCopperLoss(thermal.resistance, op.ioutMax);
  out.copperLossAc = thermal.resistance * thermal.rippleWeight;
  out.coreLoss = loss.coreLossReference * thermal.temperatureFactor;
  out.totalLoss = thermal.totalLoss;
  out.riseBySurface = thermal.rise.bySurface;
  out.riseByVolume = thermal.rise.byVolume;
  out.rise = rise;
  out.hotSpot = limits.ambient + rise + HOT_SPOT_ALLOWANCE;

  out.saturationFluxHot = saturationFlux(material, out.hotSpot);
  out.saturationMargin = saturationMargin(out.fluxPeakLocal, out.saturationFluxHot);
  // Worst case: the upper-tolerance inductance (flux ∝ L, or ∝ μi for a powder core) at the hottest allowed temperature.
  out.fluxPeakHigh = out.fluxPeakLocal * (1 + limits.inductanceTolerance);
  out.saturationFluxHottest = saturationFlux(material, ctx.hottestAllowed);
  out.saturationMarginHigh = saturationMargin(out.fluxPeakHigh, out.saturationFluxHottest);
  if (out.saturationMargin < limits.saturationMargin || out.saturationMarginHigh < limits.saturationMargin) {
    failures |= FAILURE.saturation;
  }
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
