import type { GapPlacement, SearchCandidate } from '@shared/engine/index';
import type { SearchAnswer } from '@shared/schemas/calc-answers';

// One feasible result as the engine gives it (rounded to 4 digits): a 16-turn pot core in an invented demo ferrite
// for the 36–60 V → 12 V, 10 A, 100 kHz example; every candidate of the fake answers below is a copy of it.
export const ENGINE_RESULT: SearchCandidate['result'] = {
  feasible: true,
  issues: [],
  operatingPoint: {
    frequency: 100000,
    vout: 12,
    ioutMax: 10,
    ioutMin: 0,
    dutyAtVinMax: 0.2123,
    dutyAtVinMin: 0.3526,
    onVoltageAtVinMax: 47.5,
    voltSeconds: 0.0001008,
    inductanceMin: 0.00003361,
    inductanceNominal: 0.00003734,
    rippleAtVinMax: 3,
    rippleAtVinMin: 2.466,
    rippleRatio: 0.3,
    peakCurrent: 11.5,
    valleyCurrent: 8.5,
    rmsCurrent: 10.04,
    storedEnergy: 0.002222,
    ccmBoundaryCurrent: 1.5,
    saturationCheckCurrent: 11.5,
    warnings: [],
  },
  core: {
    id: 'P26/16',
    family: 'POT',
    gapKind: 'air-gap',
    ae: 0.0000939,
    le: 0.0375,
    ve: 0.00000353,
    windowArea: 0.0000534,
    areaProductAvailable: 5.014e-9,
    areaProductRequired: 8.981e-9,
    geometryConstant: 9.167e-12,
  },
  material: { id: '2', name: 'Demo ferrite Teal (illustrative)', family: 'ferrite' },
  wire: { id: 'foil 0.15 mm', kind: 'foil', strandDiameter: 0.00015, strands: 1, copperArea: 0.000001252, currentDensity: 8014000 },
  turns: 16,
  gap: {
    placement: 'ground',
    total: 0.001049,
    spacer: 0.0005243,
    fringingFactor: 1.329,
    relativeToCore: 0.1082,
    sensitivity10um: -0.0079,
  },
  inductanceFactor: { withoutFringing: 1.097e-7, withFringing: 1.459e-7 },
  inductance: {
    required: 0.00003361,
    targetNominal: 0.00003734,
    nominal: 0.00003734,
    minimum: 0.00003361,
    atLoad: 0.00003734,
    atPeak: 0.00003734,
    permeabilityAtPeak: 1,
  },
  flux: {
    dc: 0.2486,
    acPeak: 0.03356,
    swing: 0.06711,
    peak: 0.2858,
    peakAtMinimumSection: 0.2858,
    checkCurrent: 11.5,
    saturationAtHotSpot: 0.3995,
    saturationMargin: 0.2845,
    requiredMargin: 0.2,
  },
  winding: {
    turnsPerLayer: 1,
    layers: 16,
    buildHeight: 0.0032,
    buildAvailable: 0.00365,
    copperFill: 0.3753,
    meanTurnLength: 0.05137,
    wireLength: 0.8218,
    keepOut: 0.0005,
  },
  copper: {
    resistance20: 0.01131,
    resistanceHot: 0.01399,
    acFactor: 8.786,
    skinDepth: 0.000236,
    penetrationRatio: 0.6356,
    dcLoss: 1.399,
    acLoss: 0.09222,
    gapLoss: 0,
  },
  coreLoss: { steinmetzDensity: 3706, igseDensity: 3983, temperatureFactor: 1, loss: 0.01406 },
  totalLoss: 1.506,
  thermal: {
    // Thermal figures put in the two-node shape by hand (not recomputed): a pot core gets no core-volume law.
    riseBySurface: 37.53,
    riseByVolume: null,
    rise: 40.39,
    surfaceTemperature: 80.39,
    hotSpot: 80.39,
    coreTemperature: 79.2,
    windingTemperature: 80.39,
    passes: 4,
    runaway: false,
  },
  corners: [],
};

export interface CandidateOptions {
  rank: number;
  coreId?: string;
  materialId?: string;
  materialName?: string;
  totalLoss?: number;
  volume?: number;
  mass?: number;
  extrapolated?: boolean;
  pareto?: boolean;
  paretoByMass?: boolean;
  warnings?: { code: string; message: string }[];
  /** 'spacer': the same part on a spacer of the ground design's spacer alternative (total = twice the spacer). */
  placement?: GapPlacement;
}

/** A feasible candidate: the template with another core, loss, size and warnings. */
export function searchCandidate(o: CandidateOptions): SearchCandidate {
  const volume = o.volume ?? 1e-6 * o.rank;
  const totalLoss = o.totalLoss ?? 2 - 0.01 * o.rank;
  const placement = o.placement ?? 'ground';
  const gap = placement === 'spacer' ? { ...ENGINE_RESULT.gap, placement, total: 2 * ENGINE_RESULT.gap.spacer } : ENGINE_RESULT.gap;
  return {
    rank: o.rank,
    pareto: o.pareto ?? false,
    paretoByMass: o.paretoByMass ?? false,
    extrapolated: o.extrapolated ?? false,
    lossNotModelled: false,
    conductor: 'foil',
    placement,
    volume,
    mass: o.mass ?? 5 * volume * 1e3,
    wire: { id: 'foil 0.15 mm', kind: 'foil', strandDiameter: 0.00015, strands: 1, overallDiameter: 0.0002, conductorsPerTurn: 1 },
    result: {
      ...ENGINE_RESULT,
      issues: (o.warnings ?? []).map((w) => ({ ...w, severity: 'warning' as const })),
      core: { ...ENGINE_RESULT.core, id: o.coreId ?? `Core ${o.rank}`, ve: volume },
      material: { ...ENGINE_RESULT.material, id: o.materialId ?? '2', name: o.materialName ?? 'Sample ferrite' },
      gap,
      totalLoss,
    },
  };
}

/** A search answer: `candidates` is the page, the counts and page as given (defaults: 20 of 388 from offset 0). */
export function searchAnswer(overrides: Partial<SearchAnswer> & { candidates: SearchCandidate[] }): SearchAnswer {
  return {
    engineVersion: '2.0.0',
    rankBy: 'smallest',
    page: { offset: 0, limit: 20, total: 388 },
    paretoFront: [],
    paretoFrontByMass: [],
    infeasible: [],
    counts: {
      cores: 79,
      materials: 5,
      wireOptions: 511,
      evaluated: 5210,
      screened: 1200,
      feasible: 388,
      extrapolated: 0,
      prefiltered: 0,
      incompatible: 0,
    },
    requiredAreaProduct: 8.98e-9,
    ...overrides,
  };
}
