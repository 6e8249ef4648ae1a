// The numeric core shared by evaluateDesign and searchCandidates. Everything that depends only on the spec, a
// wire, a material or a core × material pair is prepared once; evaluateCandidate then composes the formula modules'
// functions without allocating. The magnetic design (turns, gap) it takes comes from magnetic-design.ts.
import {
  AC_TEMPERATURE_NODES,
  AcTemperatureGrid,
  acLossSums,
  acLossTable,
  dcCopperLoss,
  rippleWeightNodes,
  type AcLossSums,
  type AcLossTable,
} from './copper-loss';
import { copperResistanceRatio, copperResistivity, windingResistance } from './copper';
import { biasLossFactor, coreDcField } from './dc-bias-loss';
import { litzProximitySum, litzWindingFactor } from './litz';
import { HOT_SPOT_ALLOWANCE } from './constants';
import { coreLossTemperatureFactor, fluxInFitRange, frequencyInFitRange, igseTriangleLoss, steinmetzLoss } from './core-loss';
import { foilDelta, roundWireDelta } from './dowell';
import {
  gapFieldLoss,
  gapFieldSum,
  gapFieldSumInWindow,
  gapMmfShare,
  rippleTransverseLoss,
  type GapFieldLayout,
  type GapFieldSources,
} from './gap-field-loss';
import { foilGapLowFrequencyScale, foilGapResistance, type FoilGapLayout, type FoilGapSources } from './foil-gap-loss';
import { spacerEquivalentGap } from './gap';
import { harmonicWeights, type HarmonicWeights } from './harmonics';
import { DEFAULT_KEEP_OUT, resolveLimits, type ConverterSpec, type DesignLimits } from './inputs';
import { operatingPoint, type OperatingPoint } from './operating-point';
import type { MagneticDesign } from './magnetic-design';
import { saturationFlux, saturationMargin } from './saturation';
import { copperSkinDepth } from './skin-depth';
import {
  TEMPERATURE_FACTOR_FLOOR,
  THERMAL_MODEL_LIMIT,
  ThermalSolution,
  emptyWoundCoreLoss,
  prepareThermalPart,
  solveTemperature,
  type ThermalPart,
  type WoundCoreLoss,
} from './thermal';
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
  /** Copper foil beside an air gap in the search, which leaves the gap field's loss in the foil out (SpecContext.foilGapModelled). */
  lossNotModelled: 1 << 6,
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
  /**
   * Whether a foil winding's gap-field loss is computed (foil-gap-loss.ts): yes for one design (evaluateDesign, the
   * load map), not in the search, where that model costs ~0.2 ms a harmonic and temperature node against the ~10⁴ foil
   * evaluations of a search; there a foil beside a gap keeps WARNING.lossNotModelled and is ranked after the others.
   */
  foilGapModelled: boolean;
}

export function prepareSpec(spec: ConverterSpec, limits?: Partial<DesignLimits>, foilGapModelled = false): SpecContext {
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
    foilGapModelled,
  };
}

export interface WireContext {
  wire: WireOption;
  /** Copper area of one turn (m²); foil's depends on the core, see `turnCopperArea`. */
  copperArea: number;
  /** Penetration ratio Δ of the fundamental. */
  firstHarmonicDelta: number;
  /**
   * Litz: Σ I_n²/2·(Fr_n − 1) per N²/b² at the reference temperature (litzProximitySum), and the same at each node of the
   * spec's acGrid (∝ 1/ρ², i.e. the node's Δ scale to the 4th); 0 and undefined for other conductors.
   */
  litzProximity: number;
  litzProximityNodes: Float64Array | undefined;
  sums: AcLossSums;
  /** The same sums at each copper temperature of the spec's acGrid. */
  acTable: AcLossTable;
  /**
   * Σ (I_n²/2)·P′_n of one conductor position in a transverse field of 1 A/m (the strands of a litz bundle counted)
   * at each node of acGrid, for the gap-field loss; zeros for foil, which that model does not cover. Prepared on first
   * use (wireGapTable): a search evaluates a gapped winding with few of the wires it prepares.
   */
  gapTable: Float64Array | undefined;
  /** Strand tables by diameter, shared by the wires prepared together. */
  transverseByDiameter: Map<number, Float64Array>;
}

/** A strand's ripple transverse-field loss at each node of the spec's AC grid (gap-field-loss.ts). */
function transverseLossNodes(diameter: number, ctx: SpecContext): Float64Array {
  const nodes = new Float64Array(ctx.acGrid.temperatures.length);
  for (let i = 0; i < nodes.length; i++) {
    nodes[i] = rippleTransverseLoss(diameter, ctx.spec.frequency, ctx.acGrid.temperatures[i]!, ctx.harmonics);
  }
  return nodes;
}

export function prepareWire(
  wire: WireOption,
  ctx: SpecContext,
  sumsByDelta?: Map<number, AcLossParts>,
  transverseByDiameter?: Map<number, Float64Array>,
): WireContext {
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
  const litzProximity = isLitz
    ? litzProximitySum(wire.strands, wire.strandDiameter, copperResistivity(ctx.acTemperature), ctx.spec.frequency, ctx.harmonics)
    : 0;
  return {
    wire,
    copperArea: conductorCopperArea(wire),
    firstHarmonicDelta,
    litzProximity,
    litzProximityNodes: isLitz ? Float64Array.from(ctx.acGrid.scales, (scale) => litzProximity * scale ** 4) : undefined,
    sums: parts.sums,
    acTable: parts.acTable,
    gapTable: undefined,
    transverseByDiameter: transverseByDiameter ?? new Map(),
  };
}

/** Strands at one conductor position of the gap-field sum: each round wire in hand is its own, litz shares one. */
export function strandsPerPosition(wire: WireOption): number {
  return wire.kind === 'litz' ? wire.strands : Math.max(1, wire.strands / wire.conductorsPerTurn);
}

/** The wire's gap-field table (WireContext.gapTable), prepared on first call. */
export function wireGapTable(wireCtx: WireContext, ctx: SpecContext): Float64Array {
  if (wireCtx.gapTable) return wireCtx.gapTable;
  const wire = wireCtx.wire;
  let table: Float64Array;
  if (wire.kind === 'foil') table = new Float64Array(ctx.acGrid.temperatures.length);
  else {
    let strand = wireCtx.transverseByDiameter.get(wire.strandDiameter);
    if (!strand) {
      strand = transverseLossNodes(wire.strandDiameter, ctx);
      wireCtx.transverseByDiameter.set(wire.strandDiameter, strand);
    }
    const perPosition = strandsPerPosition(wire);
    table = perPosition === 1 ? strand : strand.map((v) => v * perPosition);
  }
  wireCtx.gapTable = table;
  return table;
}

type AcLossParts = Pick<WireContext, 'sums' | 'acTable'>;

/**
 * Every wire of a search. The harmonic sums depend only on Δ, which wires in hand share with their single wire:
 * computed once per Δ (about a third of the catalogue's options), they are shared, never changed.
 */
export function prepareWires(wires: readonly WireOption[], ctx: SpecContext): WireContext[] {
  const sumsByDelta = new Map<number, AcLossParts>();
  const transverseByDiameter = new Map<number, Float64Array>();
  return wires.map((wire) => prepareWire(wire, ctx, sumsByDelta, transverseByDiameter));
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
  /** The lowest core-loss temperature factor (floored) between ambient and the thermal model's limit, for lossFloor. */
  lowestTemperatureFactor: number;
}

/** min over [low, high] of the (floored) temperature factor ct2·T² − ct1·T + ct0: at an end or at the vertex. */
function lowestTemperatureFactor(material: CoreMaterial, low: number, high: number): number {
  const c = material.tempCoefficients;
  if (!c) return 1;
  let lowest = Math.min(coreLossTemperatureFactor(c, low), coreLossTemperatureFactor(c, high));
  if (c.ct2 > 0) {
    const vertex = c.ct1 / (2 * c.ct2);
    if (vertex > low && vertex < high) lowest = Math.min(lowest, coreLossTemperatureFactor(c, vertex));
  }
  return Math.max(lowest, TEMPERATURE_FACTOR_FLOOR);
}

export function prepareMaterial(material: CoreMaterial, ctx: SpecContext): MaterialContext {
  const f = ctx.spec.frequency;
  return {
    material,
    lowestTemperatureFactor: lowestTemperatureFactor(material, ctx.limits.ambient, Math.max(THERMAL_MODEL_LIMIT, ctx.limits.ambient)),
    igseAtUnitSwing: igseTriangleLoss(material, f, 1, ctx.op.dutyAtVinMax),
    steinmetzAtUnitSwing: steinmetzLoss(material, f, 0.5),
    frequencyInFit: frequencyInFitRange(material, f),
  };
}

export interface CoreContext {
  core: CoreShape;
  /** The core's thermal network and the empirical laws' figures (thermal.ts). */
  thermal: ThermalPart;
}

export function prepareCore(core: CoreShape): CoreContext {
  return { core, thermal: prepareThermalPart(core) };
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
  /** Winding loss from the gap's fringing field (W), at the part's temperature. */
  gapLoss = 0;
  /** Clearance from the centre-leg face to the first layer's copper this evaluation used (m). */
  keepOut = 0;
  /** Failures of the layout alone (fill), before the keep-out and the temperature add theirs. */
  layoutFailures = 0;
  fluxDc = 0;
  fluxSwing = 0;
  fluxPeak = 0;
  /** Peak flux in the narrowest section (Amin where the core gives it), used for the saturation margin. */
  fluxPeakLocal = 0;
  coreLossDensityIgse = 0;
  coreLossDensitySteinmetz = 0;
  /** DC field in the core material at full load (A/m) and the core-loss factor it brings (1 without DC-bias data). */
  dcField = 0;
  biasLossFactor = 1;
  temperatureFactor = 1;
  coreLoss = 0;
  totalLoss = 0;
  rise = 0;
  /** The winding node's temperature (°C). */
  hotSpot = 0;
  /** The losses outran the cooling: rise and hot spot are where the thermal model stopped (see ThermalSolution). */
  runaway = false;
  /** Core node's temperature (the core loss's) and the material's temperature factor there before any floor. */
  coreTemperature = 0;
  /** Winding node's temperature (°C), the copper loss's. */
  windingTemperature = 0;
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
  /** The failures and warnings evaluateWinding found, before applyMagnetics adds the gap's. */
  windingFailures = 0;
  windingWarnings = 0;
  /** Scratch of the loss–temperature iteration, reused so an evaluation allocates nothing. */
  readonly loss: WoundCoreLoss = emptyWoundCoreLoss();
  readonly thermal = new ThermalSolution();
}

/**
 * One candidate: the winding, losses and temperature (evaluateWinding), then what the gap decides (applyMagnetics).
 * A search that tries both gap placements at the same turns and wire lays the winding out once (layOutWinding) and
 * solves the losses per placement (evaluateWindingLosses).
 */
export function evaluateCandidate(
  ctx: SpecContext,
  coreCtx: CoreContext,
  matCtx: MaterialContext,
  mag: MagneticDesign,
  wireCtx: WireContext,
  out: CandidateFigures,
  keepOut = ctx.limits.keepOut,
): boolean {
  evaluateWinding(ctx, coreCtx, matCtx, mag, wireCtx, out, keepOut);
  return applyMagnetics(ctx, coreCtx.core, matCtx.material, mag, out);
}

/**
 * The gaps facing the winding and the share of the winding MMF across each, into `target` (round wire's and foil's
 * sources alike): a ground gap in the centre leg takes the gap's share of the path reluctance (gapMmfShare); a spacer
 * opens a gap of its thickness in the centre leg and in the outer legs, which split that share as their reluctances do.
 */
function setGapSources(
  target: { centreGap: number; centreShare: number; outerGap: number; outerShare: number },
  core: CoreShape,
  material: CoreMaterial,
  mag: MagneticDesign,
): void {
  const ratio = core.centreToOuterLegAreaRatio ?? 1;
  const spacer = mag.placement === 'spacer';
  const share = gapMmfShare(
    spacer ? spacerEquivalentGap(mag.spacer, ratio) : mag.totalGap,
    mag.fringingFactor,
    core.le,
    material.permeability,
  );
  target.centreGap = spacer ? mag.spacer : mag.totalGap;
  target.centreShare = spacer ? share / (1 + ratio) : share;
  target.outerGap = spacer ? mag.spacer : 0;
  target.outerShare = spacer ? (share * ratio) / (1 + ratio) : 0;
}

/** Window width from the centre-leg face to the outer leg (m). */
const windowWidthOf = (core: CoreShape) => core.windowArea / core.windowHeight;

/**
 * Turn length at the centre-leg face (m), from the full bobbin's MLT (mid-build at the default keep-out plus half the
 * bobbin height), at least a round leg's perimeter.
 */
const legFacePerimeter = (core: CoreShape) =>
  Math.max(2 * Math.sqrt(Math.PI * core.ae), core.mlt - 2 * Math.PI * (DEFAULT_KEEP_OUT + core.bobbinHeight / 2));

/** Window height between the yokes (m): a spacer holds the halves apart by its thickness, so it is that much higher. */
const gapWindowHeight = (core: CoreShape, mag: MagneticDesign) => core.windowHeight + (mag.placement === 'spacer' ? mag.spacer : 0);

/** Scratch of the gap-field sum, reused so an evaluation allocates nothing. */
const fieldLayout: GapFieldLayout = {
  turns: 0,
  turnsPerLayer: 0,
  layers: 0,
  conductorsPerTurn: 1,
  overallDiameter: 0,
  keepOut: 0,
  legPerimeter: 0,
};
const fieldSources: GapFieldSources = { centreGap: 0, centreShare: 0, outerGap: 0, outerShare: 0, windowWidth: 0 };

/**
 * The gap-field loss per unit of the wire's gapTable (gap-field-loss.ts): 2·N²·Σ L·share²·|h|². A ground gap faces
 * the winding's middle; a spacer opens a gap in the centre leg there and one in the outer legs across the window;
 * distributed-gap cores, rings and foil have none here. The turn length at the leg face follows from the full
 * bobbin's MLT (mid-build at the default keep-out plus half the bobbin height).
 */
function prepareGapField(
  core: CoreShape,
  material: CoreMaterial,
  mag: MagneticDesign,
  out: CandidateFigures,
  wire: WireOption,
  keepOut: number,
): boolean {
  if (mag.kind !== 'air-gap' || mag.totalGap <= 0 || core.ring || wire.kind === 'foil') return false;
  setGapSources(fieldSources, core, material, mag);
  fieldSources.windowWidth = windowWidthOf(core);
  fieldLayout.turns = mag.turns;
  fieldLayout.turnsPerLayer = out.turnsPerLayer;
  fieldLayout.layers = out.layers;
  fieldLayout.conductorsPerTurn = wire.conductorsPerTurn;
  fieldLayout.overallDiameter = wire.overallDiameter;
  fieldLayout.keepOut = keepOut;
  fieldLayout.legPerimeter = legFacePerimeter(core);
  return true;
}

/**
 * The gap-field scale of the search and the design's figures: for round wire and litz Roshen's half-plane Hx² at each
 * conductor, no cross term (gapFieldSum, O(conductors)); foil takes foilGapScale when foilModelled (the design page,
 * the load map), else none (the search: too slow there, flagged instead).
 */
export function gapLossScale(
  core: CoreShape,
  material: CoreMaterial,
  mag: MagneticDesign,
  out: CandidateFigures,
  wire: WireOption,
  keepOut: number,
  foilModelled = false,
): number {
  if (wire.kind === 'foil') return foilModelled ? foilGapScale(core, material, mag, wire, keepOut) : 0;
  if (!prepareGapField(core, material, mag, out, wire, keepOut)) return 0;
  return gapFieldLoss(mag.turns, gapFieldSum(fieldLayout, fieldSources), 1, 1);
}

/**
 * The design page's gap-field scale: the same sources by the method of images in the window with the cross term
 * (gapFieldSumInWindow, O(conductors²), too slow for the search). The term can be negative (a gap can lower the
 * window's field where the winding's own field and the gap's oppose): it is then taken as zero, Dowell's loss kept.
 */
export function gapLossScaleInWindow(
  core: CoreShape,
  material: CoreMaterial,
  mag: MagneticDesign,
  out: CandidateFigures,
  wire: WireOption,
  keepOut: number,
): number {
  if (!prepareGapField(core, material, mag, out, wire, keepOut)) return 0;
  return Math.max(0, gapFieldLoss(mag.turns, gapFieldSumInWindow(fieldLayout, fieldSources, { height: gapWindowHeight(core, mag) }), 1, 1));
}

/** Scratch of the foil gap-field model (foil-gap-loss.ts). */
const foilLayout: FoilGapLayout = {
  layers: 0,
  thickness: 0,
  pitch: 0,
  keepOut: 0,
  windowWidth: 0,
  windowHeight: 0,
  legPerimeter: 0,
};
const foilSources: FoilGapSources = { centreGap: 0, centreShare: 0, outerGap: 0, outerShare: 0 };

/** Sets foilLayout and foilSources for a foil winding of this design (one turn per layer); false when no gap faces it. */
function setFoilGap(core: CoreShape, material: CoreMaterial, mag: MagneticDesign, wire: WireOption, keepOut: number): boolean {
  if (mag.kind !== 'air-gap' || mag.totalGap <= 0 || core.ring) return false;
  setGapSources(foilSources, core, material, mag);
  foilLayout.layers = mag.turns;
  foilLayout.thickness = wire.strandDiameter;
  foilLayout.pitch = wire.overallDiameter;
  foilLayout.keepOut = keepOut;
  foilLayout.windowWidth = windowWidthOf(core);
  foilLayout.windowHeight = gapWindowHeight(core, mag);
  foilLayout.legPerimeter = legFacePerimeter(core);
  return true;
}

/**
 * A foil winding's gap-field scale: the thin-foil low-frequency form over ω²σ (foilGapLowFrequencyScale), which orders
 * keep-outs and placements like the loss; foilGapWeights carries the loss itself per unit of it.
 */
function foilGapScale(core: CoreShape, material: CoreMaterial, mag: MagneticDesign, wire: WireOption, keepOut: number): number {
  return setFoilGap(core, material, mag, wire, keepOut) ? foilGapLowFrequencyScale(foilLayout, foilSources, mag.turns) : 0;
}

/** The foil's gap-field resistance (Ω, foilGapResistance) of this design at one frequency and resistivity; 0 without a gap. */
export function foilGapResistanceOf(
  core: CoreShape,
  material: CoreMaterial,
  mag: MagneticDesign,
  wire: WireOption,
  keepOut: number,
  frequency: number,
  resistivity: number,
): number {
  return setFoilGap(core, material, mag, wire, keepOut) ? foilGapResistance(foilLayout, foilSources, mag.turns, frequency, resistivity) : 0;
}

/** Below this share of the sum so far, a ripple harmonic's bound ends the foil's harmonic sum. */
const FOIL_HARMONIC_TOLERANCE = 1e-4;

/**
 * The foil's gap-field loss at each node of the AC grid per unit of its scale: Σ_n (I_n²/2)·R_gap(n·f, ρ(T))/scale.
 * R_gap depends on the winding and the gap, so the table is the candidate's own (a new array, not the wire's).
 */
function foilGapWeights(
  ctx: SpecContext,
  core: CoreShape,
  material: CoreMaterial,
  mag: MagneticDesign,
  wire: WireOption,
  keepOut: number,
  scale: number,
): Float64Array {
  const table = new Float64Array(AC_TEMPERATURE_NODES);
  if (!setFoilGap(core, material, mag, wire, keepOut)) return table;
  const weights = ctx.harmonics;
  for (let i = 0; i < AC_TEMPERATURE_NODES; i++) {
    const resistivity = copperResistivity(ctx.acGrid.temperatures[i]!);
    let sum = 0;
    for (let n = 1; n <= weights.meanSquare.length; n++) {
      const w = weights.meanSquare[n - 1]!;
      if (w === 0) continue;
      const r = foilGapResistance(foilLayout, foilSources, mag.turns, n * ctx.spec.frequency, resistivity);
      sum += w * r;
      // The envelope falls as n⁻⁴ and R_gap grows at most as n² (its low-frequency form).
      if (weights.envelope[n - 1]! * r < FOIL_HARMONIC_TOLERANCE * sum) break;
    }
    table[i] = sum / scale;
  }
  return table;
}

/** Keep-out beyond the bobbin wall (DEFAULT_KEEP_OUT), taken from the build height; none on a ring (m). */
export function extraKeepOutOf(core: CoreShape, keepOut: number): number {
  return core.ring ? 0 : Math.max(0, keepOut - DEFAULT_KEEP_OUT);
}

/** Whether the layout in `out` still fits its bobbin with this keep-out. */
export function buildFitsWithKeepOut(core: CoreShape, out: CandidateFigures, keepOut: number): boolean {
  return fitsBuildHeight(out.buildHeight + extraKeepOutOf(core, keepOut), core);
}

/**
 * Build, copper (with the gap's fringing-field loss at this keep-out), core loss and temperature of a winding on a
 * core with the magnetic design's turns and gap; applyMagnetics adds what the gap decides for saturation.
 */
export function evaluateWinding(
  ctx: SpecContext,
  coreCtx: CoreContext,
  matCtx: MaterialContext,
  mag: MagneticDesign,
  wireCtx: WireContext,
  out: CandidateFigures,
  keepOut = ctx.limits.keepOut,
): void {
  layOutWinding(ctx, coreCtx, matCtx, mag.turns, mag.fluxAtLoad, wireCtx, out);
  evaluateWindingLosses(ctx, coreCtx, matCtx, mag, wireCtx, out, keepOut);
}

/**
 * What depends on the turns and the wire only: build, fill, resistance, flux swing and core-loss density, the loss
 * inputs of the temperature iteration. evaluateWindingLosses then adds what the gap and the keep-out change; the
 * search calls it once per placement and keep-out on one layout.
 */
export function layOutWinding(
  ctx: SpecContext,
  coreCtx: CoreContext,
  matCtx: MaterialContext,
  turns: number,
  dcFlux: number,
  wireCtx: WireContext,
  out: CandidateFigures,
): void {
  const { op, limits } = ctx;
  const core = coreCtx.core;
  const material = matCtx.material;
  const wire = wireCtx.wire;
  const n = turns;

  layWinding(n, wire, core, out);
  const copperArea = turnCopperArea(wireCtx, core);
  out.copperFill = windowFill(n, copperArea, core.windowArea);
  out.layoutFailures = out.copperFill > limits.windowUtilisation ? FAILURE.fill : 0;

  out.resistance20 = windingResistance(n, out.meanTurnLength, copperArea, 20);
  const dowellLayers = Number.isFinite(out.layers) ? out.layers : 1;

  out.fluxSwing = op.voltSeconds / (n * core.ae);
  // Both densities scale as ΔB^β from their value at ΔB = 1 T, prepared once per material.
  const swingPowBeta = Math.pow(out.fluxSwing, material.beta);
  out.coreLossDensityIgse = matCtx.igseAtUnitSwing * swingPowBeta;
  out.coreLossDensitySteinmetz = matCtx.steinmetzAtUnitSwing * swingPowBeta;

  const loss = out.loss;
  loss.resistance20 = out.resistance20;
  loss.dcCurrentSquare = op.ioutMax * op.ioutMax;
  if (wireCtx.litzProximityNodes) {
    const perNode = litzWindingFactor(n, core.bobbinWidth);
    for (let i = 0; i < AC_TEMPERATURE_NODES; i++) {
      loss.rippleWeights[i] = wireCtx.acTable.skin[i]! + wireCtx.litzProximityNodes[i]! * perNode;
    }
  } else rippleWeightNodes(wireCtx.acTable, dowellLayers, loss.rippleWeights);
  loss.acGrid = ctx.acGrid;
  // The DC flux at full load sets the DC field in the material, which raises the core loss where the material has
  // DC-bias data (dc-bias-loss.ts); both placements of one turns count meet the same inductance, so they share it.
  out.dcField = coreDcField(core.gapKind, dcFlux, material.permeability, n, op.ioutMax, core.le);
  out.biasLossFactor = biasLossFactor(material.biasLoss, out.dcField);
  loss.coreLossReference = out.coreLossDensityIgse * core.ve * out.biasLossFactor;
  loss.temperatureCoefficients = material.tempCoefficients;
  // No temperature solved for this layout yet.
  loss.gapLossScale = Number.NaN;
}

/**
 * A loss no placement or keep-out of the layout layOutWinding left in `out` can go below (W), with no temperature
 * solved: copper at ambient (ρ only rises from there) with half the smallest ripple weight of the AC grid's nodes (the
 * interpolated weight is a smooth curve through them), no gap-field loss, and the core at the lowest temperature
 * factor the material reaches between ambient and the thermal model's limit (MaterialContext.lowestTemperatureFactor).
 * The search leaves a build unsolved when even this floor cannot change its result.
 */
export function lossFloor(ctx: SpecContext, matCtx: MaterialContext, out: CandidateFigures): number {
  const loss = out.loss;
  let ripple = loss.rippleWeights[0]!;
  for (let i = 1; i < AC_TEMPERATURE_NODES; i++) if (loss.rippleWeights[i]! < ripple) ripple = loss.rippleWeights[i]!;
  const copper = loss.resistance20 * copperResistanceRatio(ctx.limits.ambient) * (loss.dcCurrentSquare + (ripple > 0 ? ripple / 2 : 0));
  return (copper + loss.coreLossReference * matCtx.lowestTemperatureFactor) * (1 - 1e-12);
}

/**
 * On the layout layOutWinding left in `out` (same core, material, turns and wire): the keep-out's build check, the
 * gap-field loss of this magnetic design at this keep-out, the temperature iteration and the failures it decides.
 * When neither the gap-field scale nor the keep-out changed since the last call on the same layout, the figures
 * already hold the answer and are kept. `scale` is gapLossScale of the same design and keep-out when the caller has it.
 */
export function evaluateWindingLosses(
  ctx: SpecContext,
  coreCtx: CoreContext,
  matCtx: MaterialContext,
  mag: MagneticDesign,
  wireCtx: WireContext,
  out: CandidateFigures,
  keepOut = ctx.limits.keepOut,
  scale = gapLossScale(coreCtx.core, matCtx.material, mag, out, wireCtx.wire, keepOut, ctx.foilGapModelled),
): void {
  const { op, limits } = ctx;
  const core = coreCtx.core;
  const material = matCtx.material;
  const loss = out.loss;
  if (scale === loss.gapLossScale && keepOut === out.keepOut) return;
  let failures = out.layoutFailures;
  let warnings = 0;
  // The bobbin height is the build at the default keep-out (the bobbin wall); more keep-out takes from it.
  out.keepOut = keepOut;
  if (!buildFitsWithKeepOut(core, out, keepOut)) failures |= FAILURE.build;
  loss.gapLossScale = scale;
  if (scale > 0) {
    loss.gapLossWeights =
      wireCtx.wire.kind === 'foil' ? foilGapWeights(ctx, core, material, mag, wireCtx.wire, keepOut, scale) : wireGapTable(wireCtx, ctx);
  }
  const thermal = solveTemperature(limits, loss, coreCtx.thermal, out.thermal, false);
  if (!thermal.converged) warnings |= WARNING.thermalNotConverged;
  if (thermal.runaway) failures |= FAILURE.thermalRunaway;
  // A temperature fit that is ≤ 0 where the core works is invalid there; the loss used the floored factor.
  if (thermal.rawTemperatureFactor <= 0) failures |= FAILURE.temperatureFactor;
  const rise = thermal.rise.design;
  out.runaway = thermal.runaway;
  out.coreTemperature = thermal.coreTemperature;
  out.windingTemperature = thermal.windingTemperature;
  out.rawTemperatureFactor = thermal.rawTemperatureFactor;
  out.thermalPasses = thermal.passes;
  out.resistanceHot = thermal.resistance;
  out.temperatureFactor = thermal.temperatureFactor;
  out.acFactor = thermal.rippleWeight / wireCtx.acTable.meanSquare;
  out.copperLossDc = dcCopperLoss(thermal.resistance, op.ioutMax);
  out.copperLossAc = thermal.resistance * thermal.rippleWeight;
  out.gapLoss = thermal.gapLoss;
  out.coreLoss = thermal.coreLoss;
  out.totalLoss = thermal.totalLoss;
  out.rise = rise;
  // Past the model's limit the runaway part is reported at the limit (the rise is capped likewise).
  out.hotSpot = thermal.runaway ? limits.ambient + rise : thermal.windingTemperature;

  if (rise > limits.maxRise) failures |= FAILURE.temperatureRise;
  if (out.hotSpot > limits.insulationClass) failures |= FAILURE.insulation;
  if ((thermal.runaway ? out.hotSpot : out.coreTemperature) > materialTemperatureLimit(material)) failures |= FAILURE.materialTemperature;
  if (limits.lossBudget !== undefined && out.totalLoss > limits.lossBudget) failures |= FAILURE.lossBudget;
  if (!matCtx.frequencyInFit) warnings |= WARNING.frequencyFit;
  if (!fluxInFitRange(material, out.fluxSwing / 2)) warnings |= WARNING.fluxFit;
  out.windingFailures = failures;
  const foilBesideGap = wireCtx.wire.kind === 'foil' && mag.kind === 'air-gap' && mag.totalGap > 0 && !coreCtx.core.ring;
  if (foilBesideGap && !ctx.foilGapModelled) warnings |= WARNING.lossNotModelled;
  out.windingWarnings = warnings;
}

/** The figures evaluateWindingLosses writes, copied from one CandidateFigures to another (the layout's stay). */
export function copyWindingLosses(from: CandidateFigures, to: CandidateFigures): void {
  to.keepOut = from.keepOut;
  to.loss.gapLossScale = from.loss.gapLossScale;
  to.loss.gapLossWeights = from.loss.gapLossWeights;
  to.windingFailures = from.windingFailures;
  to.windingWarnings = from.windingWarnings;
  to.runaway = from.runaway;
  to.coreTemperature = from.coreTemperature;
  to.windingTemperature = from.windingTemperature;
  to.rawTemperatureFactor = from.rawTemperatureFactor;
  to.thermalPasses = from.thermalPasses;
  to.resistanceHot = from.resistanceHot;
  to.temperatureFactor = from.temperatureFactor;
  to.acFactor = from.acFactor;
  to.copperLossDc = from.copperLossDc;
  to.copperLossAc = from.copperLossAc;
  to.gapLoss = from.gapLoss;
  to.coreLoss = from.coreLoss;
  to.totalLoss = from.totalLoss;
  to.rise = from.rise;
  to.hotSpot = from.hotSpot;
}

/**
 * The gap's share, on figures evaluateWinding left for the same turns and wire: DC flux, saturation at both
 * corners and the magnetic design's own failures. Calling it again with another placement's design replaces them.
 */
export function applyMagnetics(
  ctx: SpecContext,
  core: CoreShape,
  material: CoreMaterial,
  mag: MagneticDesign,
  out: CandidateFigures,
): boolean {
  const { limits } = ctx;
  let failures = out.windingFailures | mag.failures;
  let warnings = out.windingWarnings | mag.warnings;
  out.fluxDc = mag.fluxAtLoad;
  out.fluxPeak = mag.fluxAtPeak;
  out.fluxPeakLocal = core.amin !== undefined && core.amin < core.ae ? (out.fluxPeak * core.ae) / core.amin : out.fluxPeak;
  // Bsat at the hotter of the two nodes (a core's own hot spot lies between them).
  out.saturationFluxHot = saturationFlux(material, limits.ambient + out.rise);
  out.saturationMargin = saturationMargin(out.fluxPeakLocal, out.saturationFluxHot);
  // Worst case: the upper-tolerance inductance (flux ∝ L, or ∝ μi for a powder core) at the hottest allowed temperature.
  out.fluxPeakHigh = out.fluxPeakLocal * (1 + limits.inductanceTolerance);
  out.saturationFluxHottest = saturationFlux(material, ctx.hottestAllowed);
  out.saturationMarginHigh = saturationMargin(out.fluxPeakHigh, out.saturationFluxHottest);
  if (out.saturationMargin < limits.saturationMargin || out.saturationMarginHigh < limits.saturationMargin) {
    failures |= FAILURE.saturation;
  }
  if (mag.kind === 'air-gap' && out.fluxPeak > limits.bMax * (1 + 1e-9)) warnings |= WARNING.fluxAboveLimit;
  out.failures = failures;
  out.warnings = warnings;
  return failures === 0;
}
