import { availableAreaProduct, availableGeometryConstant, requiredAreaProduct } from './area-product';
import { cornerRows, type CornerRow } from './corners';
import { EngineInputError } from './errors';
import type { ConverterSpec, DesignLimits, EngineIssue } from './inputs';
import { describeIssues } from './issues';
import {
  CandidateFigures,
  evaluateCandidate,
  prepareCore,
  prepareMaterial,
  prepareSpec,
  prepareWire,
  turnCopperArea,
  type SpecContext,
  type WireContext,
} from './kernel';
import { designMagnetics, type MagneticDesign, type TurnsInput } from './magnetic-design';
import type { OperatingPoint } from './operating-point';
import { crossCheckPart, crossCheckRises } from './thermal';
import {
  gapInputOf,
  type CoreFamily,
  type CoreMaterial,
  type CoreShape,
  type GapKind,
  type GapPlacement,
  type MaterialFamily,
  type WireKind,
  type WireOption,
} from './types';

export interface EvaluateInput {
  spec: ConverterSpec;
  limits?: Partial<DesignLimits>;
  core: CoreShape;
  material: CoreMaterial;
  turns: TurnsInput;
  /** Ground gap (placement 'ground') or spacer thickness ('spacer') in m, or 'auto'; ignored for distributed-gap cores. */
  gap: TurnsInput;
  /** Where the gap is made (default 'ground'). */
  placement?: GapPlacement;
  wire: WireOption;
  /** Clearance from the centre-leg face to the copper (m); default the limits' keepOut. */
  keepOut?: number;
}

export interface EvaluationResult {
  feasible: boolean;
  issues: EngineIssue[];
  operatingPoint: OperatingPoint;
  core: {
    id: string;
    family: CoreFamily;
    gapKind: GapKind;
    ae: number;
    le: number;
    ve: number;
    windowArea: number;
    areaProductAvailable: number;
    areaProductRequired: number;
    /** Erickson's Kg = Ae²·Wa/MLT (m⁵). */
    geometryConstant: number;
  };
  material: { id: string; name: string; family: MaterialFamily };
  wire: { id: string; kind: WireKind; strandDiameter: number; strands: number; copperArea: number; currentDensity: number };
  turns: number;
  gap: {
    placement: GapPlacement;
    /** Sum of the gap lengths in the path (m): the ground gap, or twice the spacer; 0 for distributed-gap cores. */
    total: number;
    /** Spacer thickness under all legs (m): this design's spacer, or the alternative giving the same L. */
    spacer: number;
    fringingFactor: number;
    /** Largest t/√A over the gaps; the fringing formula is trusted below 0.3. */
    relativeToCore: number;
    /** ΔL/L for 10 µm more ground gap (or spacer); 0 for distributed-gap cores. */
    sensitivity10um: number;
  };
  inductanceFactor: { withoutFringing: number; withFringing: number };
  inductance: {
    required: number;
    targetNominal: number;
    nominal: number;
    minimum: number;
    atLoad: number;
    atPeak: number;
    /** L(peak)/L(0): the permeability left at the saturation-check current. */
    permeabilityAtPeak: number;
  };
  flux: {
    dc: number;
    acPeak: number;
    swing: number;
    peak: number;
    /** Peak flux in the minimum section Amin (equals peak when Amin is not given). */
    peakAtMinimumSection: number;
    checkCurrent: number;
    saturationAtHotSpot: number;
    saturationMargin: number;
    requiredMargin: number;
  };
  winding: {
    turnsPerLayer: number;
    layers: number;
    buildHeight: number;
    buildAvailable: number;
    copperFill: number;
    meanTurnLength: number;
    wireLength: number;
    /** Clearance from the centre-leg face (and its gap) to the first layer's copper (m); absent before engine 2.1. */
    keepOut?: number;
  };
  copper: {
    resistance20: number;
    resistanceHot: number;
    /** Σ Fr·I_n²/2 over Σ I_n²/2: the ripple's Rac/Rdc. */
    acFactor: number;
    skinDepth: number;
    penetrationRatio: number;
    dcLoss: number;
    /** Ripple loss by one-dimensional Dowell (W). */
    acLoss: number;
    /** Eddy loss the gap's fringing field drives in the winding (W; gap-field-loss.ts), also in totalLoss; absent before engine 2.1. */
    gapLoss?: number;
  };
  coreLoss: {
    steinmetzDensity: number;
    igseDensity: number;
    temperatureFactor: number;
    /** iGSE at the operating temperature and, where the material has the data, under the DC bias (W). */
    loss: number;
    /**
     * The DC field in the material at full load (A/m), the loss factor it brings, and what that means in words; absent
     * in results stored by engines before 2.1.
     */
    dcBias?: DcBiasFigures;
  };
  totalLoss: number;
  thermal: {
    /** Cross-check: the surface-dissipation law's rise at the same loss (K). */
    riseBySurface: number;
    /** Cross-check: the core-volume law's rise (K), null where it does not apply (VOLUME_LAW_FAMILIES). */
    riseByVolume: number | null;
    /** The hotter node's rise (K). */
    rise: number;
    /** The hotter node's temperature (°C). */
    surfaceTemperature: number;
    /** The winding node's temperature (°C): the insulation's check. */
    hotSpot: number;
    /** Core and winding node temperatures (°C) of the two-node network; absent on results saved before it. */
    coreTemperature?: number;
    windingTemperature?: number;
    /** Saved before the two-node network only: the allowance the hot spot then added to the surface (K). */
    hotSpotAllowance?: number;
    passes: number;
    /** No steady temperature below the model limit: rise and hot spot are where the model stopped, not a prediction. */
    runaway: boolean;
  };
  corners: CornerRow[];
}

export interface DcBiasFigures {
  field: number;
  factor: number;
  included: boolean;
  statement: string;
}

function dcBiasFigures(material: CoreMaterial, f: CandidateFigures): DcBiasFigures {
  const field = f.dcField;
  const flux = `${(f.fluxDc * 1e3).toFixed(0)} mT`;
  if (!material.biasLoss) {
    return {
      field,
      factor: 1,
      included: false,
      statement: `DC bias is not included: ${material.name} has no DC-bias loss data, so the core loss is the zero-bias value; under the ${flux} DC flux (${field.toFixed(0)} A/m in the material) the real loss is higher.`,
    };
  }
  return {
    field,
    factor: f.biasLossFactor,
    included: true,
    statement: `DC bias included: ${field.toFixed(0)} A/m in the material at full load (${flux} DC) raises the core loss ×${f.biasLossFactor.toFixed(2)} (${material.name}: doubles at ${material.biasLoss.doublingField.toFixed(0)} A/m).`,
  };
}

export function assembleResult(
  ctx: SpecContext,
  core: CoreShape,
  material: CoreMaterial,
  mag: MagneticDesign,
  wireCtx: WireContext,
  f: CandidateFigures,
): EvaluationResult {
  const { op, limits } = ctx;
  const wire = wireCtx.wire;
  const crossCheck = crossCheckRises(f.totalLoss, crossCheckPart(core), limits.ambient, f.runaway);
  return {
    feasible: f.failures === 0,
    issues: describeIssues({ ctx, core, material, mag, figures: f, wire }),
    operatingPoint: op,
    core: {
      id: core.id,
      family: core.family,
      gapKind: core.gapKind,
      ae: core.ae,
      le: core.le,
      ve: core.ve,
      windowArea: core.windowArea,
      areaProductAvailable: availableAreaProduct(core),
      areaProductRequired: requiredAreaProduct(
        op.inductanceNominal,
        op.saturationCheckCurrent,
        op.rmsCurrent,
        limits.bMax,
        limits.currentDensity,
        limits.windowUtilisation,
      ),
      geometryConstant: availableGeometryConstant(core),
    },
    material: { id: material.id, name: material.name, family: material.family },
    wire: {
      id: wire.id,
      kind: wire.kind,
      strandDiameter: wire.strandDiameter,
      strands: wire.strands,
      copperArea: turnCopperArea(wireCtx, core),
      currentDensity: op.rmsCurrent / turnCopperArea(wireCtx, core),
    },
    turns: mag.turns,
    gap: {
      placement: mag.placement,
      total: mag.totalGap,
      spacer: mag.spacer,
      fringingFactor: mag.fringingFactor,
      relativeToCore: mag.relativeGap,
      sensitivity10um: mag.gapSensitivity,
    },
    inductanceFactor: { withoutFringing: mag.inductanceFactorWithoutFringing, withFringing: mag.inductanceFactor },
    inductance: {
      required: op.inductanceMin,
      targetNominal: op.inductanceNominal,
      nominal: mag.inductanceZeroBias,
      minimum: mag.inductanceAtPeak * (1 - limits.inductanceTolerance),
      atLoad: mag.inductanceAtLoad,
      atPeak: mag.inductanceAtPeak,
      permeabilityAtPeak: mag.permeabilityAtPeak,
    },
    flux: {
      dc: f.fluxDc,
      acPeak: f.fluxSwing / 2,
      swing: f.fluxSwing,
      peak: f.fluxPeak,
      peakAtMinimumSection: f.fluxPeakLocal,
      checkCurrent: op.saturationCheckCurrent,
      saturationAtHotSpot: f.saturationFluxHot,
      saturationMargin: f.saturationMargin,
      requiredMargin: limits.saturationMargin,
    },
    winding: {
      turnsPerLayer: f.turnsPerLayer,
      layers: f.layers,
      buildHeight: f.buildHeight,
      buildAvailable: core.bobbinHeight,
      copperFill: f.copperFill,
      meanTurnLength: f.meanTurnLength,
      wireLength: mag.turns * f.meanTurnLength,
      keepOut: f.keepOut,
    },
    copper: {
      resistance20: f.resistance20,
      resistanceHot: f.resistanceHot,
      acFactor: f.acFactor,
      skinDepth: ctx.skinDepth,
      penetrationRatio: wireCtx.firstHarmonicDelta,
      dcLoss: f.copperLossDc,
      acLoss: f.copperLossAc,
      gapLoss: f.gapLoss,
    },
    coreLoss: {
      steinmetzDensity: f.coreLossDensitySteinmetz * f.temperatureFactor,
      igseDensity: f.coreLossDensityIgse * f.temperatureFactor,
      temperatureFactor: f.temperatureFactor,
      loss: f.coreLoss,
      dcBias: dcBiasFigures(material, f),
    },
    totalLoss: f.totalLoss,
    thermal: {
      riseBySurface: crossCheck.bySurface,
      riseByVolume: Number.isNaN(crossCheck.byVolume) ? null : crossCheck.byVolume,
      rise: f.rise,
      surfaceTemperature: limits.ambient + f.rise,
      hotSpot: f.hotSpot,
      coreTemperature: f.coreTemperature,
      windingTemperature: f.windingTemperature,
      passes: f.thermalPasses,
      runaway: f.runaway,
    },
    corners: cornerRows(ctx, material, mag, f),
  };
}

function checkExplicitInputs(input: EvaluateInput): void {
  if (input.turns !== 'auto' && !(Number.isInteger(input.turns) && input.turns >= 1)) {
    throw new EngineInputError('turns', `Turns must be a whole number of at least 1, got ${input.turns}.`);
  }
  if (input.gap !== 'auto' && !(input.gap >= 0 && Number.isFinite(input.gap))) {
    throw new EngineInputError('gap', `Gap must be zero or positive (m), got ${input.gap}.`);
  }
  if (input.keepOut !== undefined && !(input.keepOut >= 0 && Number.isFinite(input.keepOut))) {
    throw new EngineInputError('keepOut', `Keep-out must be zero or positive (m), got ${input.keepOut}.`);
  }
  if (input.wire.kind === 'foil' && input.core.ring) {
    throw new EngineInputError('wire', `Foil is not wound on ring cores; choose round wire or litz for ${input.core.id}.`);
  }
  if (input.core.gapKind === 'air-gap' && input.material.family === 'powder') {
    throw new EngineInputError(
      'materialId',
      `${input.material.name} is a distributed-gap material; ${input.core.id} needs a gapped material.`,
    );
  }
}

/** One fully explicit design → every figure, feasibility and plain-word issues. */
export function evaluateDesign(input: EvaluateInput): EvaluationResult {
  checkExplicitInputs(input);
  // One design: a foil winding's gap-field loss is computed (kernel.ts, SpecContext.foilGapModelled).
  const ctx = prepareSpec(input.spec, input.limits, true);
  const mag = designMagnetics(input.core, input.material, ctx, input.turns, input.gap, input.placement);
  const wireCtx = prepareWire(input.wire, ctx);
  const figures = new CandidateFigures();
  evaluateCandidate(
    ctx,
    prepareCore(input.core),
    prepareMaterial(input.material, ctx),
    mag,
    wireCtx,
    figures,
    input.keepOut ?? ctx.limits.keepOut,
  );
  return assembleResult(ctx, input.core, input.material, mag, wireCtx, figures);
}

export interface LossAtFrequency {
  frequency: number;
  /** The part keeps its saturation margin, permeability and temperature limits at this frequency. */
  feasible: boolean;
  copperDc: number;
  copperAc: number;
  /** Winding loss from the gap's fringing field (W). */
  copperGap: number;
  core: number;
  total: number;
  rise: number;
}

/** The failures that say the built part cannot run at a frequency (not those of the spec or the winding). */
const SWEEP_LIMITS: ReadonlySet<string> = new Set([
  'saturation',
  'permeability-drop',
  'thermal-runaway',
  'temperature-rise',
  'insulation',
  'material-temperature',
  'temperature-factor',
]);

/**
 * The same built part (turns, gap, wire and the inductance it achieved) run at other switching frequencies, for a
 * loss-versus-frequency chart. Frequencies where the converter would leave CCM are skipped. `base` is
 * evaluateDesign(input), passed in where the caller already has it.
 */
export function lossVersusFrequency(
  input: EvaluateInput,
  frequencies: readonly number[],
  base: EvaluationResult = evaluateDesign(input),
): LossAtFrequency[] {
  const { rippleRatio: _r, rippleCurrent: _c, inductance: _l, ...rest } = input.spec;
  const points: LossAtFrequency[] = [];
  for (const frequency of frequencies) {
    try {
      const result = evaluateDesign({
        ...input,
        spec: { ...rest, frequency, inductance: base.inductance.minimum },
        turns: base.turns,
        placement: base.gap.placement,
        gap: input.core.gapKind === 'distributed' ? 'auto' : gapInputOf(base.gap),
        keepOut: base.winding.keepOut,
      });
      points.push({
        frequency,
        feasible: !result.issues.some((issue) => SWEEP_LIMITS.has(issue.code)),
        copperDc: result.copper.dcLoss,
        copperAc: result.copper.acLoss,
        copperGap: result.copper.gapLoss ?? 0,
        core: result.coreLoss.loss,
        total: result.totalLoss,
        rise: result.thermal.rise,
      });
    } catch (error) {
      if (!(error instanceof EngineInputError)) throw error;
    }
  }
  return points;
}
