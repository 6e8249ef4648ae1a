// Answer schemas of the four calculation endpoints, tied to the engine's result types (`satisfies`), so the
// engine, the server's answer, the OpenAPI document and the client's parse keep one shape and one set of names.
import * as z from 'zod';
import type {
  CornerRow,
  EngineIssue,
  EvaluationResult,
  LossAtFrequency,
  LoadPoint,
  LossMap,
  OperatingPoint,
  SearchResult,
  WireOption,
} from '@shared/engine/index';
import { CORE_FAMILIES, GAP_PLACEMENTS, MATERIAL_FAMILIES, WIRE_KINDS } from '@shared/engine/types';
import { CONDUCTOR_TYPES } from '@shared/engine/conductor-choice';
import { RANK_BY } from '@shared/engine/ranking';

export const engineIssueSchema = z.object({
  code: z.string(),
  severity: z.enum(['error', 'warning']),
  message: z.string(),
}) satisfies z.ZodType<EngineIssue>;

export const operatingPointSchema = z.object({
  frequency: z.number(),
  vout: z.number(),
  ioutMax: z.number(),
  ioutMin: z.number(),
  dutyAtVinMax: z.number(),
  dutyAtVinMin: z.number(),
  onVoltageAtVinMax: z.number(),
  voltSeconds: z.number(),
  inductanceMin: z.number().meta({ description: 'Required (minimum) inductance (H)' }),
  inductanceNominal: z.number().meta({ description: 'Nominal inductance to build so the low-tolerance part still meets the minimum (H)' }),
  rippleAtVinMax: z.number().meta({ description: 'Peak-to-peak ripple at Vin max with the minimum inductance (A)' }),
  rippleAtVinMin: z.number(),
  rippleRatio: z.number(),
  peakCurrent: z.number(),
  valleyCurrent: z.number(),
  rmsCurrent: z.number(),
  storedEnergy: z.number().meta({ description: '½·L·Ipk² with the minimum inductance (J)' }),
  ccmBoundaryCurrent: z.number(),
  saturationCheckCurrent: z.number(),
  warnings: z.array(engineIssueSchema),
}) satisfies z.ZodType<OperatingPoint>;

/** The operating point as the engine gives it, plus the ripple harmonics (A, peak) and the engine version. */
export const operatingPointAnswerSchema = operatingPointSchema.extend({
  engineVersion: z.string(),
  harmonics: z.array(z.object({ n: z.number().int(), amplitude: z.number() })),
});
export type OperatingPointAnswer = z.infer<typeof operatingPointAnswerSchema>;

export const coreLossAnswerSchema = z.object({
  steinmetz: z.number().meta({ description: 'Steinmetz density at peak B = ΔB/2 (W/m³)' }),
  igse: z.number().meta({ description: 'iGSE density (W/m³)' }),
});

export const wireOptionSchema = z.object({
  id: z.string(),
  kind: z.enum(WIRE_KINDS),
  strandDiameter: z.number(),
  strands: z.number(),
  overallDiameter: z.number(),
  conductorsPerTurn: z.number(),
  grade: z.union([z.literal(1), z.literal(2)]).optional(),
}) satisfies z.ZodType<WireOption>;

const numbers = <K extends string>(...keys: K[]) =>
  z.object(Object.fromEntries(keys.map((key) => [key, z.number()])) as Record<K, z.ZodNumber>);

export const cornerRowSchema = numbers('inductance', 'peakFlux', 'temperature', 'saturationFlux', 'margin').extend({
  corner: z.enum(['nominal', 'low', 'high']),
  pass: z.boolean(),
}) satisfies z.ZodType<CornerRow>;

export const evaluationResultSchema = z.object({
  feasible: z.boolean(),
  issues: z.array(engineIssueSchema),
  operatingPoint: operatingPointSchema,
  core: numbers('ae', 'le', 've', 'windowArea', 'areaProductAvailable', 'areaProductRequired', 'geometryConstant').extend({
    id: z.string(),
    family: z.enum(CORE_FAMILIES),
    gapKind: z.enum(['air-gap', 'distributed']),
  }),
  material: z.object({ id: z.string(), name: z.string(), family: z.enum(MATERIAL_FAMILIES) }),
  wire: numbers('strandDiameter', 'strands', 'copperArea', 'currentDensity').extend({
    id: z.string(),
    kind: z.enum(WIRE_KINDS),
  }),
  turns: z.number(),
  gap: numbers('total', 'spacer', 'fringingFactor', 'relativeToCore', 'sensitivity10um').extend({
    placement: z.enum(GAP_PLACEMENTS),
  }),
  inductanceFactor: numbers('withoutFringing', 'withFringing'),
  inductance: numbers('required', 'targetNominal', 'nominal', 'minimum', 'atLoad', 'atPeak', 'permeabilityAtPeak'),
  flux: numbers(
    'dc',
    'acPeak',
    'swing',
    'peak',
    'peakAtMinimumSection',
    'checkCurrent',
    'saturationAtHotSpot',
    'saturationMargin',
    'requiredMargin',
  ),
  winding: numbers('turnsPerLayer', 'layers', 'buildHeight', 'buildAvailable', 'copperFill', 'meanTurnLength', 'wireLength').extend({
    keepOut: z.number().optional().meta({ description: 'Copper keep-out from the gap (m); absent in results stored before engine 2.1' }),
  }),
  copper: numbers('resistance20', 'resistanceHot', 'acFactor', 'skinDepth', 'penetrationRatio', 'dcLoss', 'acLoss').extend({
    gapLoss: z
      .number()
      .optional()
      .meta({ description: "Winding loss from the gap's fringing field (W); absent in results stored before engine 2.1" }),
  }),
  coreLoss: numbers('steinmetzDensity', 'igseDensity', 'temperatureFactor', 'loss').extend({
    dcBias: numbers('field', 'factor')
      .extend({
        included: z.boolean().meta({ description: 'The material has DC-bias loss data and the loss includes it' }),
        statement: z.string().meta({ description: 'What the DC bias does to the core loss, in plain words' }),
      })
      .optional()
      .meta({
        description:
          'DC field in the material at full load (A/m) and the core-loss factor it brings; absent in results stored before engine 2.1',
      }),
  }),
  totalLoss: z.number(),
  thermal: numbers('riseBySurface', 'rise', 'surfaceTemperature', 'hotSpot', 'passes').extend({
    riseByVolume: z.number().nullable().meta({
      description: 'Core-volume law rise (K) as a cross-check; null where the law does not apply (not an E, ETD, EFD or EQ core)',
    }),
    coreTemperature: z
      .number()
      .optional()
      .meta({ description: 'Core node of the two-node thermal network (°C); absent on results saved before it' }),
    windingTemperature: z.number().optional().meta({ description: 'Winding node (°C); absent on results saved before the network' }),
    hotSpotAllowance: z
      .number()
      .optional()
      .meta({ description: 'Results saved before the two-node network: the hot spot above the surface (K)' }),
    runaway: z
      .boolean()
      .meta({ description: 'No steady temperature below the model limit; rise and hot spot are where the model stopped' }),
  }),
  corners: z
    .array(cornerRowSchema)
    .meta({ description: 'Nominal, low- and high-tolerance corners of the saturation and inductance checks' }),
}) satisfies z.ZodType<EvaluationResult>;

export const lossAtFrequencySchema = numbers('frequency', 'copperDc', 'copperAc', 'copperGap', 'core', 'total', 'rise').extend({
  feasible: z.boolean().meta({ description: 'The part keeps its saturation and temperature limits at this frequency' }),
}) satisfies z.ZodType<LossAtFrequency>;

export const loadPointSchema = numbers(
  'vin',
  'loadFraction',
  'iout',
  'peakCurrent',
  'copperDc',
  'copperAc',
  'copperGap',
  'core',
  'total',
  'share',
  'rise',
).extend({
  corner: z.enum(['min', 'nominal', 'max']),
  mode: z.enum(['ccm', 'boundary', 'dcm']).meta({ description: 'Continuous, boundary or discontinuous conduction at this point' }),
  runaway: z.boolean(),
}) satisfies z.ZodType<LoadPoint>;

export const lossMapSchema = z.object({
  inductance: z.number().meta({ description: 'Inductance the map runs with at full load (H)' }),
  inputs: numbers('min', 'nominal', 'max'),
  points: z.array(loadPointSchema),
}) satisfies z.ZodType<LossMap>;

/** POST /calc/evaluate: the wire as evaluated, every figure, and the sweeps when asked for. */
export const evaluateAnswerSchema = z.object({
  engineVersion: z.string(),
  wire: wireOptionSchema,
  result: evaluationResultSchema,
  lossVersusFrequency: z.array(lossAtFrequencySchema).optional(),
  lossMap: lossMapSchema.optional(),
  gapLossByWindowImages: z.number().optional().meta({
    description:
      "Cross-check of the winding loss from the gap's field by the method of images in the core window (W), with a sweep and where that loss is at least 2 % of the total; the design's figures use the half-plane estimate, as the search does",
  }),
});
export type EvaluateAnswer = z.infer<typeof evaluateAnswerSchema>;

export const EVALUATE_SWEEPS = ['frequency', 'load', 'all'] as const;
export type EvaluateSweep = (typeof EVALUATE_SWEEPS)[number];

export const evaluateQuerySchema = z.object({
  sweep: z.enum(EVALUATE_SWEEPS).optional().meta({
    description:
      '"frequency" adds a loss-versus-frequency sweep, "load" a loss map from 10 % to 100 % load at three input voltages, "all" both',
  }),
});

const searchCandidateSchema = z.object({
  rank: z.number(),
  pareto: z.boolean().meta({ description: 'On the loss-versus-core-volume Pareto front' }),
  paretoByMass: z.boolean().meta({ description: 'On the loss-versus-mass Pareto front' }),
  extrapolated: z.boolean().meta({ description: 'Core loss rests on material data used outside its fitted range' }),
  lossNotModelled: z.boolean().meta({
    description: 'The loss leaves out a term the engine does not model (foil beside a gap); ranked after fully modelled candidates',
  }),
  conductor: z.enum(CONDUCTOR_TYPES),
  placement: z.enum(GAP_PLACEMENTS).meta({ description: 'Where the gap is made: ground centre gap or spacer under all legs' }),
  volume: z.number().meta({ description: 'Core volume Ve (m³)' }),
  mass: z.number().meta({ description: 'Core plus copper (kg)' }),
  wire: wireOptionSchema,
  result: evaluationResultSchema,
});

export const searchResultSchema = z.object({
  rankBy: z.enum(RANK_BY),
  candidates: z.array(searchCandidateSchema),
  page: numbers('offset', 'limit', 'total'),
  paretoFront: z.array(searchCandidateSchema),
  paretoFrontByMass: z.array(searchCandidateSchema),
  infeasible: z.array(
    z.object({
      coreId: z.string(),
      materialId: z.string().optional(),
      wireId: z.string().optional(),
      turns: z.number().optional(),
      placement: z.enum(GAP_PLACEMENTS).optional(),
      totalLoss: z.number().optional(),
      reasons: z.array(engineIssueSchema),
    }),
  ),
  counts: numbers('cores', 'materials', 'wireOptions', 'evaluated', 'screened', 'feasible', 'extrapolated', 'prefiltered', 'incompatible'),
  requiredAreaProduct: z.number(),
}) satisfies z.ZodType<SearchResult>;

export const searchAnswerSchema = searchResultSchema.extend({ engineVersion: z.string() });
export type SearchAnswer = z.infer<typeof searchAnswerSchema>;
