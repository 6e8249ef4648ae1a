import * as z from 'zod';

/** Independent checks of a saved revision, run as background jobs: the circuit simulation and the field solution. */
export const CHECK_KINDS = ['circuit', 'field'] as const;
export type CheckKind = (typeof CHECK_KINDS)[number];
export const CHECK_STATUSES = ['queued', 'running', 'done', 'failed', 'cancelled'] as const;
export type CheckStatus = (typeof CHECK_STATUSES)[number];
/** A check in one of these is still owed a result; at most one per revision and kind. */
export const OPEN_CHECK_STATUSES = ['queued', 'running'] as const satisfies readonly CheckStatus[];

export const runCheckRequestSchema = z.object({ kind: z.enum(CHECK_KINDS, { error: 'kind must be "circuit" or "field"' }) }).strict();
export type RunCheckRequest = z.infer<typeof runCheckRequestSchema>;

/** Ripple, peak, average and valley of the inductor current (A). */
const currentFiguresSchema = z.object({ ripple: z.number(), peak: z.number(), average: z.number(), valley: z.number() });
/** One waveform over one period: [time from the switch-on edge (s), current (A)] pairs. */
const waveformSchema = z.array(z.tuple([z.number(), z.number()])).max(200);

export const circuitCornerSchema = z.object({
  id: z.enum(['vin-max', 'vin-min', 'current-limit']),
  label: z.string(),
  vin: z.number(),
  load: z.number(),
  duty: z.number(),
  /** Inductance behind the prediction (H): the constant L, or the incremental L at the load current. */
  predictedInductance: z.number(),
  simulated: currentFiguresSchema,
  predicted: currentFiguresSchema,
  /** (simulated − predicted)/predicted in %. */
  differencePercent: z.object({ ripple: z.number(), peak: z.number(), average: z.number() }),
  /** Change of the simulated period average from the period before (A): near zero once settled. */
  drift: z.number(),
  waveform: z.object({ simulated: waveformSchema, predicted: waveformSchema }),
});
export type CircuitCorner = z.infer<typeof circuitCornerSchema>;

/**
 * The design's exported SPICE subcircuit (the same text as its export, named DUT) in the bench at Vin max and full load:
 * its current against the engine's at the subcircuit's inductance, and the power its resistors dissipate against the
 * engine's total loss — proof that the export is a working model of the part at its operating point.
 */
export const exportedModelSchema = z.object({
  vin: z.number(),
  load: z.number(),
  /** The subcircuit's L1 (H): the inductance at the load current. */
  inductance: z.number(),
  simulated: z.object({ ripple: z.number(), peak: z.number(), average: z.number(), dissipation: z.number() }),
  predicted: z.object({ ripple: z.number(), peak: z.number(), average: z.number(), loss: z.number() }),
  /** (simulated − predicted)/predicted in %. */
  differencePercent: z.object({ ripple: z.number(), peak: z.number(), dissipation: z.number() }),
  drift: z.number(),
});
export type ExportedModelRun = z.infer<typeof exportedModelSchema>;

export const circuitCheckResultSchema = z.object({
  kind: z.literal('circuit'),
  /** 'constant': the nominal L of an air-gapped design; 'roll-off': L follows the powder's DC-bias curve. */
  inductorModel: z.enum(['constant', 'roll-off']),
  /** Zero-current inductance of the design (H). */
  nominalInductance: z.number(),
  /** Loop resistance the bench used for the winding (Ω) and where it came from. */
  windingResistance: z.number(),
  notes: z.array(z.string()),
  corners: z.array(circuitCornerSchema),
  /** Absent in checks stored before the exported model was run. */
  exportedModel: exportedModelSchema.optional(),
});
export type CircuitCheckResult = z.infer<typeof circuitCheckResultSchema>;

/** A figure of the engine beside the field solution's: (field − engine)/engine as a fraction. */
const figurePairSchema = z.object({ engine: z.number(), field: z.number(), difference: z.number() });

export const fieldCheckResultSchema = z.object({
  kind: z.literal('field'),
  /** Nominal inductance (H): engine with McLyman's fringing factor, field from the stored energy. */
  inductance: figurePairSchema,
  /** Peak flux density (T) at the check current: engine section mean, field centre-leg mean. */
  peakFlux: figurePairSchema,
  /** Largest |B| over the core's elements (T), at the gap's corners. */
  peakFluxLocal: z.number(),
  /** AC resistance (Ω) per harmonic: engine R_dc·Dowell, field Joule loss over I_rms², and the field's per layer. */
  acResistance: z.array(figurePairSchema.extend({ harmonic: z.number().int(), frequency: z.number(), fieldLayers: z.array(z.number()) })),
  /** DC resistance of the modelled conductors (Ω). */
  dcResistance: z.number(),
  nodes: z.number().int(),
  /** Solver time (s). */
  seconds: z.number(),
  notes: z.array(z.string()),
  /** The flux-line picture, SVG text drawn by Gapwright from the mesh and the solution. */
  picture: z.string().max(4_000_000),
});
export type FieldCheckResult = z.infer<typeof fieldCheckResultSchema>;

export const checkResultSchema = z.discriminatedUnion('kind', [circuitCheckResultSchema, fieldCheckResultSchema]);
export type CheckResult = z.infer<typeof checkResultSchema>;

export const revisionCheckSchema = z.object({
  id: z.number().int(),
  revisionId: z.number().int(),
  kind: z.enum(CHECK_KINDS),
  status: z.enum(CHECK_STATUSES),
  progress: z.number().min(0).max(1),
  result: checkResultSchema.nullable(),
  failure: z.string().nullable(),
  requestedBy: z.string().nullable().meta({ description: 'Display name; null when the user was removed' }),
  createdAt: z.string(),
  startedAt: z.string().nullable(),
  finishedAt: z.string().nullable(),
});
export type RevisionCheck = z.infer<typeof revisionCheckSchema>;

export const revisionChecksSchema = z.object({
  /** The latest check of each kind, newest first. */
  checks: z.array(revisionCheckSchema),
  /** False once the revision is released: its checks are frozen with it. */
  canRun: z.boolean(),
  /** Why checks cannot be run now, in plain words (null when they can). */
  frozenReason: z.string().nullable(),
});
export type RevisionChecks = z.infer<typeof revisionChecksSchema>;
