// Request schemas of the four calculation endpoints. SI units throughout (V, A, Hz, H, T, m, A/m², °C).
// Every number is finite (zod 4 rejects NaN and ±Infinity); messages name the field and the allowed range.
import * as z from 'zod';
import { text } from './text';
import { CORE_FAMILIES, GAP_PLACEMENTS, MATERIAL_FAMILIES } from '@shared/engine/types';
import { RANK_BY } from '@shared/engine/ranking';
import { storedIdTextSchema, uniqueListSchema } from './ids';

function rangeNumber(field: string, min: number, max: number, unit: string, description: string) {
  const range = `${field} must be between ${min} and ${max}${unit ? ` ${unit}` : ''}`;
  return z
    .number({ error: `${field} must be a finite number` })
    .min(min, { error: range })
    .max(max, { error: range })
    .meta({ description: `${description} (${min}…${max}${unit ? ` ${unit}` : ''})` });
}

function positiveNumber(field: string, max: number, unit: string, description: string) {
  return z
    .number({ error: `${field} must be a finite number` })
    .positive({ error: `${field} must be greater than 0` })
    .max(max, { error: `${field} must be at most ${max} ${unit}` })
    .meta({ description: `${description} (> 0, at most ${max} ${unit})` });
}

function nonNegativeNumber(field: string, max: number, unit: string, description: string) {
  return rangeNumber(field, 0, max, unit, description);
}

export const rectifierSchema = z
  .enum(['ideal', 'diode', 'synchronous'])
  .meta({ description: 'Freewheeling element: ideal switches, a diode, or a synchronous switch' });

const converterSpecShape = {
  vinMin: rangeNumber('vinMin', 0.5, 1000, 'V', 'Minimum input voltage'),
  vinNom: rangeNumber('vinNom', 0.5, 1000, 'V', 'Nominal input voltage').optional(),
  vinMax: rangeNumber('vinMax', 0.5, 1000, 'V', 'Maximum input voltage'),
  vout: rangeNumber('vout', 0.1, 1000, 'V', 'Output voltage'),
  ioutMax: rangeNumber('ioutMax', 0.001, 500, 'A', 'Full-load output current'),
  ioutMin: nonNegativeNumber('ioutMin', 500, 'A', 'Minimum load current, for the DCM warning').optional(),
  frequency: rangeNumber('frequency', 1e3, 10e6, 'Hz', 'Switching frequency'),
  rippleRatio: rangeNumber('rippleRatio', 0.01, 2, '', 'Peak-to-peak ripple over full-load current at Vin max').optional(),
  rippleCurrent: positiveNumber('rippleCurrent', 1000, 'A', 'Peak-to-peak ripple current at Vin max').optional(),
  inductance: rangeNumber('inductance', 1e-9, 1, 'H', 'Required minimum inductance').optional(),
  rectifier: rectifierSchema.default('ideal'),
  diodeDrop: nonNegativeNumber('diodeDrop', 5, 'V', 'Diode forward drop (diode rectifier)').optional(),
  switchDrop: nonNegativeNumber('switchDrop', 10, 'V', 'High-side switch drop (diode rectifier)').optional(),
  highSideResistance: nonNegativeNumber('highSideResistance', 10, 'Ω', 'High-side on-resistance (synchronous)').optional(),
  lowSideResistance: nonNegativeNumber('lowSideResistance', 10, 'Ω', 'Low-side on-resistance (synchronous)').optional(),
  inductorResistance: nonNegativeNumber('inductorResistance', 10, 'Ω', 'Inductor resistance used in the duty cycle').optional(),
  currentLimit: positiveNumber('currentLimit', 2000, 'A', 'Controller current limit; saturation is checked there').optional(),
};

interface SpecFields {
  vinMin: number;
  vinMax: number;
  vinNom?: number | undefined;
  vout: number;
  ioutMax: number;
  ioutMin?: number | undefined;
  rippleRatio?: number | undefined;
  rippleCurrent?: number | undefined;
  inductance?: number | undefined;
}

function checkSpec(spec: SpecFields, ctx: z.RefinementCtx): void {
  if (spec.vout >= spec.vinMin) {
    ctx.addIssue({ code: 'custom', path: ['vout'], message: `vout must be below vinMin (${spec.vinMin} V) for a buck converter` });
  }
  if (spec.vinMin > spec.vinMax) {
    ctx.addIssue({ code: 'custom', path: ['vinMin'], message: `vinMin must not exceed vinMax (${spec.vinMax} V)` });
  }
  if (spec.vinNom !== undefined && (spec.vinNom < spec.vinMin || spec.vinNom > spec.vinMax)) {
    ctx.addIssue({ code: 'custom', path: ['vinNom'], message: `vinNom must lie between vinMin and vinMax` });
  }
  if (spec.ioutMin !== undefined && spec.ioutMin > spec.ioutMax) {
    ctx.addIssue({ code: 'custom', path: ['ioutMin'], message: `ioutMin must not exceed ioutMax (${spec.ioutMax} A)` });
  }
  const given = (['rippleRatio', 'rippleCurrent', 'inductance'] as const).filter((key) => spec[key] !== undefined);
  if (given.length !== 1) {
    ctx.addIssue({
      code: 'custom',
      path: [given[1] ?? 'rippleRatio'],
      message: 'Give exactly one of rippleRatio, rippleCurrent or inductance',
    });
  }
}

export const converterSpecSchema = z
  .object(converterSpecShape)
  .strict()
  .superRefine(checkSpec)
  .meta({ description: 'Buck converter in continuous conduction; exactly one of rippleRatio, rippleCurrent, inductance' });
export type ConverterSpecRequest = z.infer<typeof converterSpecSchema>;

/** One design's clearance from the centre leg (and its gap) to the copper; more than the bobbin wall takes from the build. */
export const keepOutSchema = rangeNumber(
  'keepOut',
  0,
  10e-3,
  'm',
  "Clearance from the centre leg (and its gap) to this winding's copper (0…0.01 m); default the limits' keepOut",
);

export const designLimitsSchema = z
  .object({
    ambient: rangeNumber('ambient', -40, 125, '°C', 'Ambient temperature').optional(),
    airSpeed: rangeNumber('airSpeed', 0, 20, 'm/s', 'Forced air speed along the part; 0 = natural convection').optional(),
    boardThermalResistance: rangeNumber(
      'boardThermalResistance',
      0.1,
      1000,
      'K/W',
      'Thermal resistance from the core to the board',
    ).optional(),
    maxRise: rangeNumber('maxRise', 1, 150, 'K', 'Largest allowed temperature rise').optional(),
    lossBudget: positiveNumber('lossBudget', 1000, 'W', 'Largest allowed total loss').optional(),
    inductanceTolerance: rangeNumber('inductanceTolerance', 0, 0.5, '', 'Inductance tolerance; L is designed to its minimum').optional(),
    bMax: rangeNumber('bMax', 0.01, 2, 'T', 'Peak flux density limit for choosing turns').optional(),
    saturationMargin: rangeNumber('saturationMargin', 0, 0.9, '', 'Required margin below Bsat at the hot spot').optional(),
    currentDensity: rangeNumber('currentDensity', 0.5e6, 20e6, 'A/m²', 'RMS current density target').optional(),
    windowUtilisation: rangeNumber('windowUtilisation', 0.05, 0.9, '', 'Largest copper fill of the window (Ku)').optional(),
    insulationClass: rangeNumber('insulationClass', 90, 250, '°C', 'Insulation class temperature').optional(),
    maxStrands: z
      .number({ error: 'maxStrands must be a whole number' })
      .int({ error: 'maxStrands must be a whole number' })
      .min(1, { error: 'maxStrands must be between 1 and 50' })
      .max(50, { error: 'maxStrands must be between 1 and 50' })
      .meta({ description: 'Most round wires in hand before litz is used (1…50)' })
      .optional(),
    minPermeabilityAtPeak: rangeNumber('minPermeabilityAtPeak', 0, 1, '', 'Smallest L(Ipk)/L0 of a powder core').optional(),
    minGap: rangeNumber('minGap', 0, 5e-3, 'm', 'Smallest ground gap or spacer a workshop can hold').optional(),
    keepOut: rangeNumber(
      'keepOut',
      0,
      10e-3,
      'm',
      "Clearance from the centre leg (and its gap) to the winding's copper the search starts from",
    ).optional(),
    gapPlacements: uniqueListSchema(z.enum(GAP_PLACEMENTS), GAP_PLACEMENTS.length, 'gapPlacements', 1)
      .meta({ description: 'Gap placements the search may propose for air-gap cores: "ground", "spacer" (default both)' })
      .optional(),
    allowedFamilies: uniqueListSchema(z.enum(CORE_FAMILIES), CORE_FAMILIES.length, 'allowedFamilies')
      .meta({ description: 'Core families to consider' })
      .optional(),
    allowedMaterials: uniqueListSchema(text().min(1).max(80), 200, 'allowedMaterials')
      .meta({ description: 'Material ids to consider' })
      .optional(),
  })
  .strict()
  .meta({ description: 'Design limits; omitted fields take the engine defaults' });
export type DesignLimitsRequest = z.infer<typeof designLimitsSchema>;

/** The operating-point request: a converter spec plus the inductance tolerance. */
export const operatingPointRequestSchema = z
  .object({
    ...converterSpecShape,
    inductanceTolerance: rangeNumber('inductanceTolerance', 0, 0.5, '', 'Inductance tolerance').optional(),
  })
  .strict()
  .superRefine(checkSpec)
  .meta({ description: 'Buck operating point: duty, inductance, ripple, peak and RMS current' });
export type OperatingPointRequest = z.infer<typeof operatingPointRequestSchema>;

export const steinmetzSchema = z
  .object({
    k: positiveNumber('k', 1e12, 'W/m³ (Hz, T)', 'Steinmetz k in SI units'),
    alpha: rangeNumber('alpha', 1, 3, '', 'Steinmetz frequency exponent α'),
    beta: rangeNumber('beta', 1.5, 4, '', 'Steinmetz flux exponent β'),
  })
  .strict();

export const coreLossRequestSchema = z
  .object({
    material: steinmetzSchema,
    frequency: rangeNumber('frequency', 1e3, 10e6, 'Hz', 'Excitation frequency'),
    deltaB: rangeNumber('deltaB', 1e-4, 2, 'T', 'Peak-to-peak flux swing ΔB'),
    duty: z
      .number({ error: 'duty must be a finite number' })
      .gt(0, { error: 'duty must be between 0 and 1 (exclusive)' })
      .lt(1, { error: 'duty must be between 0 and 1 (exclusive)' })
      .meta({ description: 'Rise fraction of the triangular flux (0…1 exclusive)' }),
    waveform: z.enum(['triangle', 'sine']).meta({ description: 'Flux waveform' }),
  })
  .strict()
  .meta({ description: 'Core-loss density by Steinmetz and iGSE → { steinmetz, igse } in W/m³' });
export type CoreLossRequest = z.infer<typeof coreLossRequestSchema>;

const rollOffSchema = z
  .object({
    a: rangeNumber('rollOff.a', 0.1, 10, '', 'Roll-off fit a'),
    b: rangeNumber('rollOff.b', 0, 1e3, '', 'Roll-off fit b (H in A/m)'),
    c: rangeNumber('rollOff.c', 0.1, 5, '', 'Roll-off fit exponent c'),
  })
  .strict();

/** A temperature behaviour in our own terms: factor F0 + c·(T − T0)², positive everywhere by construction. */
const temperatureBehaviourSchema = z
  .object({
    lowestLossTemperature: rangeNumber('temperatureBehaviour.lowestLossTemperature', -100, 400, '°C', 'T0, temperature of lowest loss'),
    lowestLossFactor: z
      .number({ error: 'temperatureBehaviour.lowestLossFactor must be a finite number' })
      .gt(0, { error: 'temperatureBehaviour.lowestLossFactor must be greater than 0' })
      .max(100, { error: 'temperatureBehaviour.lowestLossFactor must be at most 100' })
      .meta({ description: 'F0, the loss factor at T0 (> 0)' }),
    curvature: rangeNumber('temperatureBehaviour.curvature', 0, 1, '1/K²', 'c, how fast the factor rises away from T0'),
  })
  .strict();

/** A powder roll-off in our own terms: μ/μi = 1/(1 + (H/H½)ⁿ). */
const rollOffCurveSchema = z
  .object({
    halfField: z
      .number({ error: 'rollOffCurve.halfField must be a finite number' })
      .gt(0, { error: 'rollOffCurve.halfField must be greater than 0' })
      .max(1e7, { error: 'rollOffCurve.halfField must be at most 1e7' })
      .meta({ description: 'H½, A/m: the field at which μ has fallen to μi/2' }),
    steepness: z
      .number({ error: 'rollOffCurve.steepness must be a finite number' })
      .gt(0, { error: 'rollOffCurve.steepness must be greater than 0' })
      .max(5, { error: 'rollOffCurve.steepness must be at most 5' })
      .meta({ description: 'n, how steeply μ falls around H½' }),
  })
  .strict();

/** Core loss under DC bias: factor 1 + (H/H₂)^m on the zero-bias loss. */
const biasLossSchema = z
  .object({
    doublingField: z
      .number({ error: 'biasLoss.doublingField must be a finite number' })
      .gt(0, { error: 'biasLoss.doublingField must be greater than 0' })
      .max(1e6, { error: 'biasLoss.doublingField must be at most 1e6' })
      .meta({ description: 'H₂, A/m: the DC field in the material at which the core loss has doubled' }),
    steepness: z
      .number({ error: 'biasLoss.steepness must be a finite number' })
      .gt(0, { error: 'biasLoss.steepness must be greater than 0' })
      .max(6, { error: 'biasLoss.steepness must be at most 6' })
      .meta({ description: 'm, how steeply the loss rises around H₂' }),
  })
  .strict();

/**
 * An inline (user-supplied) material, SI units, same meaning as CoreMaterial; the temperature behaviour and the roll-off
 * may be given in the engine's constants (tempCoefficients, rollOff) or in our own terms (temperatureBehaviour,
 * rollOffCurve), not both.
 */
export const inlineMaterialSchema = z
  .object({
    id: text().trim().min(1).max(80).optional(),
    name: text().trim().min(1).max(80),
    family: z.enum(MATERIAL_FAMILIES),
    k: positiveNumber('k', 1e12, 'W/m³ (Hz, T)', 'Steinmetz k in SI units'),
    alpha: rangeNumber('alpha', 1, 3, '', 'Steinmetz α'),
    beta: rangeNumber('beta', 1.5, 4, '', 'Steinmetz β'),
    fitFrequencyMin: rangeNumber('fitFrequencyMin', 1, 10e6, 'Hz', 'Lowest fitted frequency'),
    fitFrequencyMax: rangeNumber('fitFrequencyMax', 1, 100e6, 'Hz', 'Highest fitted frequency'),
    fitFluxMin: rangeNumber('fitFluxMin', 0, 2, 'T', 'Lowest fitted peak AC flux'),
    fitFluxMax: rangeNumber('fitFluxMax', 1e-4, 2, 'T', 'Highest fitted peak AC flux'),
    tempCoefficients: z
      .object({
        ct0: rangeNumber('ct0', -100, 100, '', 'Temperature factor constant'),
        ct1: rangeNumber('ct1', -10, 10, '1/K', 'Temperature factor linear coefficient'),
        ct2: rangeNumber('ct2', -1, 1, '1/K²', 'Temperature factor quadratic coefficient'),
      })
      .strict()
      .optional(),
    bsat25: rangeNumber('bsat25', 0.05, 3, 'T', 'Saturation flux density at 25 °C'),
    bsat100: rangeNumber('bsat100', 0.05, 3, 'T', 'Saturation flux density at 100 °C'),
    permeability: rangeNumber('permeability', 1, 200000, '', 'Initial relative permeability'),
    rollOff: rollOffSchema.optional(),
    temperatureBehaviour: temperatureBehaviourSchema.optional(),
    rollOffCurve: rollOffCurveSchema.optional(),
    biasLoss: biasLossSchema.optional(),
    density: rangeNumber('density', 500, 20000, 'kg/m³', 'Density').optional(),
    maxTemperature: rangeNumber('maxTemperature', 50, 400, '°C', 'Highest tolerated hot-spot temperature').optional(),
  })
  .strict()
  .superRefine((m, ctx) => {
    if (m.fitFrequencyMin > m.fitFrequencyMax) {
      ctx.addIssue({ code: 'custom', path: ['fitFrequencyMin'], message: 'fitFrequencyMin must not exceed fitFrequencyMax' });
    }
    if (m.fitFluxMin > m.fitFluxMax) {
      ctx.addIssue({ code: 'custom', path: ['fitFluxMin'], message: 'fitFluxMin must not exceed fitFluxMax' });
    }
    if (m.tempCoefficients && m.temperatureBehaviour) {
      ctx.addIssue({ code: 'custom', path: ['temperatureBehaviour'], message: 'give temperatureBehaviour or tempCoefficients, not both' });
    }
    if (m.rollOff && m.rollOffCurve) {
      ctx.addIssue({ code: 'custom', path: ['rollOffCurve'], message: 'give rollOffCurve or rollOff, not both' });
    }
  });
export type InlineMaterial = z.infer<typeof inlineMaterialSchema>;

export const rankBySchema = z
  .enum(RANK_BY)
  .meta({ description: 'What "best" means: smallest part meeting every limit, lowest loss, lowest rise, or loss × volume' });

const idSchema = text().trim().min(1).max(80);

export const searchRequestSchema = z
  .object({
    spec: converterSpecSchema,
    limits: designLimitsSchema.optional(),
    materialIds: uniqueListSchema(storedIdTextSchema(), 200, 'materialIds').meta({ description: 'Catalogue material ids' }).optional(),
    materials: z.array(inlineMaterialSchema).max(20).meta({ description: 'Inline materials' }).optional(),
    coreIds: uniqueListSchema(idSchema, 2000, 'coreIds').meta({ description: 'Restrict to these cores' }).optional(),
    families: uniqueListSchema(z.enum(CORE_FAMILIES), CORE_FAMILIES.length, 'families')
      .meta({ description: 'Restrict to these core families' })
      .optional(),
    rankBy: rankBySchema.default('smallest'),
    offset: z
      .number({ error: 'offset must be a whole number' })
      .int({ error: 'offset must be a whole number' })
      .min(0, { error: 'offset must be between 0 and 100000' })
      .max(100000, { error: 'offset must be between 0 and 100000' })
      .default(0)
      .meta({ description: 'First rank of the page to return (0-based)' }),
    limit: z
      .number({ error: 'limit must be a whole number' })
      .int({ error: 'limit must be a whole number' })
      .min(1, { error: 'limit must be between 1 and 200' })
      .max(200, { error: 'limit must be between 1 and 200' })
      .default(20)
      .meta({ description: 'Feasible candidates to return (1…200)' }),
  })
  .strict()
  .superRefine((request, ctx) => {
    if (!request.materialIds?.length && !request.materials?.length) {
      ctx.addIssue({ code: 'custom', path: ['materialIds'], message: 'Give materialIds, inline materials, or both' });
    }
  })
  .meta({ description: 'Design search over cores × materials × wire options' });
export type SearchRequest = z.infer<typeof searchRequestSchema>;

export const wireRequestSchema = z
  .object({
    kind: z.enum(['awg', 'metric', 'litz', 'foil']).meta({ description: 'Conductor kind' }),
    strandDiameter: rangeNumber('strandDiameter', 0.01e-3, 6e-3, 'm', 'Bare diameter of one strand (foil: its thickness)').optional(),
    awg: z
      .number({ error: 'awg must be a whole number' })
      .int({ error: 'awg must be a whole number' })
      .min(-3, { error: 'awg must be between -3 (4/0) and 46' })
      .max(46, { error: 'awg must be between -3 (4/0) and 46' })
      .meta({ description: 'AWG gauge; 0/0 … 4/0 as 0 … −3' })
      .optional(),
    strands: z
      .number({ error: 'strands must be a whole number' })
      .int({ error: 'strands must be a whole number' })
      .min(1, { error: 'strands must be between 1 and 5000' })
      .max(5000, { error: 'strands must be between 1 and 5000' })
      .meta({ description: 'Wires in hand, or strands of a litz bundle (1…5000)' }),
  })
  .strict()
  .superRefine((wire, ctx) => {
    const given = (wire.strandDiameter !== undefined ? 1 : 0) + (wire.awg !== undefined ? 1 : 0);
    if (given !== 1) {
      ctx.addIssue({ code: 'custom', path: ['strandDiameter'], message: 'Give exactly one of strandDiameter or awg' });
    }
    if (wire.awg !== undefined && wire.kind !== 'awg') {
      ctx.addIssue({ code: 'custom', path: ['awg'], message: 'awg is only valid with kind "awg"' });
    }
    if (wire.kind === 'foil' && wire.strands !== 1) {
      ctx.addIssue({ code: 'custom', path: ['strands'], message: 'A foil winding has one conductor per turn: strands must be 1' });
    }
  });
export type WireRequest = z.infer<typeof wireRequestSchema>;

const autoOr = <T extends z.ZodType>(schema: T) => z.union([schema, z.literal('auto')]);

export const evaluateRequestSchema = z
  .object({
    spec: converterSpecSchema,
    limits: designLimitsSchema.optional(),
    coreId: idSchema.meta({ description: 'Catalogue core id' }),
    materialId: storedIdTextSchema().meta({ description: 'Catalogue material id' }).optional(),
    material: inlineMaterialSchema.optional(),
    turns: autoOr(
      z
        .number({ error: 'turns must be a whole number' })
        .int({ error: 'turns must be a whole number' })
        .min(1, { error: 'turns must be between 1 and 2000' })
        .max(2000, { error: 'turns must be between 1 and 2000' }),
    )
      .default('auto')
      .meta({ description: 'Turns (1…2000) or "auto"' }),
    gap: autoOr(nonNegativeNumber('gap', 0.02, 'm', 'Ground gap, or spacer thickness with placement "spacer"'))
      .default('auto')
      .meta({ description: 'Ground gap, or spacer thickness with placement "spacer" (0…0.02 m), or "auto"' }),
    placement: z
      .enum(GAP_PLACEMENTS)
      .meta({ description: 'Gap ground into the centre leg (default) or a spacer under all legs' })
      .optional(),
    keepOut: keepOutSchema.optional(),
    wire: wireRequestSchema,
  })
  .strict()
  .superRefine((request, ctx) => {
    if ((request.materialId === undefined) === (request.material === undefined)) {
      ctx.addIssue({ code: 'custom', path: ['materialId'], message: 'Give exactly one of materialId or an inline material' });
    }
  })
  .meta({ description: 'Evaluate one explicit design' });
export type EvaluateRequest = z.infer<typeof evaluateRequestSchema>;
