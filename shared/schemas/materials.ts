// The material CSV format of Gapwright (one row per material, a header row) and the edit body, with
// their conversion to the SI values the engine and the database use (W/m³, Hz, T, kg/m³, °C).
// Every problem names the column it comes from, so the upload preview can show it by row and column.
import * as z from 'zod';
import { text } from './text';
import { steinmetzKFromSi, steinmetzKToSi } from '@shared/engine/core-loss';
import { MATERIAL_FAMILIES, type CoreMaterial, type MaterialFamily } from '@shared/engine/types';
import { storedIdTextSchema, uniqueListSchema } from './ids';

export const MATERIAL_UNIT_SETS = ['W/m3-Hz-T', 'mW/cm3-kHz-mT'] as const;
export type MaterialUnitSet = (typeof MATERIAL_UNIT_SETS)[number];

/** Columns in the order the template and the export write them. */
export const MATERIAL_CSV_COLUMNS = [
  'name',
  'family',
  'unit_set',
  'k',
  'alpha',
  'beta',
  'f_min',
  'f_max',
  'b_min',
  'b_max',
  'ct0',
  'ct1',
  'ct2',
  't_ref',
  'bsat_25',
  'bsat_100',
  'mu_i',
  'rolloff_a',
  'rolloff_b',
  'rolloff_c',
  'density',
  'provenance',
] as const;
export type MaterialCsvColumn = (typeof MATERIAL_CSV_COLUMNS)[number];

/** Columns that may be left out of the header (their cells are then empty). */
export const OPTIONAL_MATERIAL_COLUMNS: readonly MaterialCsvColumn[] = [
  'ct0',
  'ct1',
  'ct2',
  't_ref',
  'rolloff_a',
  'rolloff_b',
  'rolloff_c',
];
export const REQUIRED_MATERIAL_COLUMNS: readonly MaterialCsvColumn[] = MATERIAL_CSV_COLUMNS.filter(
  (c) => !OPTIONAL_MATERIAL_COLUMNS.includes(c),
);

/** Scale from a row's unit set to SI for frequency and flux columns. */
export const UNIT_SCALES: Record<MaterialUnitSet, { frequency: number; flux: number; frequencyUnit: string; fluxUnit: string }> = {
  'W/m3-Hz-T': { frequency: 1, flux: 1, frequencyUnit: 'Hz', fluxUnit: 'T' },
  'mW/cm3-kHz-mT': { frequency: 1e3, flux: 1e-3, frequencyUnit: 'kHz', fluxUnit: 'mT' },
};

/** Convert an uploaded k to SI (k_SI = k′·10^(3·(1 − α + β)) for mW/cm³, kHz, mT, computed from Pv = k·f^α·B̂^β). */
export function kToSi(kUploaded: number, unitSet: MaterialUnitSet, alpha: number, beta: number): number {
  return unitSet === 'W/m3-Hz-T' ? kUploaded : steinmetzKToSi(kUploaded, alpha, beta);
}

export function kFromSi(kSi: number, unitSet: MaterialUnitSet, alpha: number, beta: number): number {
  return unitSet === 'W/m3-Hz-T' ? kSi : steinmetzKFromSi(kSi, alpha, beta);
}

// Plain decimal numbers with an optional exponent; no thousands separators, no decimal comma, no hex.
export const NUMBER_TEXT = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
// A cell a spreadsheet would run as a formula.
const FORMULA_START = /^[=+\-@\t\r]/;

const shown = (text: string) => (text.length > 24 ? `${text.slice(0, 24)}…` : text);

function numberCell(range: { min?: number; max?: number; exclusiveMin?: number }, required: boolean) {
  // One transform per cell (trim, parse, range) keeps a 10,000-row file fast to validate.
  return text().transform((raw, ctx): number | undefined => {
    const trimmed = raw.trim();
    // An export escapes a leading minus or plus with an apostrophe (formula safety); read it back.
    const text = /^'[-+]/.test(trimmed) ? trimmed.slice(1) : trimmed;
    const fail = (message: string) => {
      ctx.addIssue({ code: 'custom', message, input: raw });
      return undefined;
    };
    if (text === '') return required ? fail('is required') : undefined;
    if (!NUMBER_TEXT.test(text)) {
      const hint = /^\d+,\d+$/.test(text) ? ' (use a point as the decimal separator)' : '';
      return fail(`"${shown(text)}" is not a number${hint}`);
    }
    const value = Number(text);
    if (!Number.isFinite(value)) return fail('must be a finite number');
    if (range.exclusiveMin !== undefined && value <= range.exclusiveMin) {
      fail(`must be greater than ${range.exclusiveMin} (got ${value})`);
    } else if ((range.min !== undefined && value < range.min) || (range.max !== undefined && value > range.max)) {
      fail(`must be between ${range.min} and ${range.max} (got ${value})`);
    }
    return value;
  });
}

const required = (range: { min?: number; max?: number; exclusiveMin?: number }) => numberCell(range, true) as z.ZodType<number, string>;
const optional = (range: { min?: number; max?: number; exclusiveMin?: number }) =>
  numberCell(range, false) as z.ZodType<number | undefined, string>;

function textCell(max: number) {
  return text().transform((raw, ctx) => {
    const text = raw.trim();
    const fail = (message: string) => ctx.addIssue({ code: 'custom', message, input: raw });
    if (text === '') fail('is required');
    else if (text.length > max) fail(`must be at most ${max} characters`);
    else if (FORMULA_START.test(text)) fail('must not start with =, +, -, @ (a spreadsheet would run it as a formula)');
    // eslint-disable-next-line no-control-regex -- finding control characters is the point of this pattern
    else if (/[\u0000-\u0008\u000b\u000c\u000e-\u001f]/.test(text)) fail('must not contain control characters');
    return text;
  });
}

function choiceCell<const T extends readonly string[]>(choices: T, message: string) {
  return text().transform((raw, ctx): T[number] => {
    const text = raw.trim();
    if (!choices.includes(text)) ctx.addIssue({ code: 'custom', message, input: raw });
    return text as T[number];
  });
}

/** One CSV row (every cell as text, empty for absent optional columns). */
export const materialCsvRowSchema = z
  .object({
    name: textCell(80),
    family: choiceCell(MATERIAL_FAMILIES, `must be one of ${MATERIAL_FAMILIES.join(', ')}`),
    unit_set: choiceCell(MATERIAL_UNIT_SETS, `must be ${MATERIAL_UNIT_SETS.join(' or ')}`),
    k: required({ exclusiveMin: 0 }),
    alpha: required({ min: 1, max: 3 }),
    beta: required({ min: 1.5, max: 4 }),
    f_min: required({ exclusiveMin: 0 }),
    f_max: required({ exclusiveMin: 0 }),
    b_min: required({ min: 0 }),
    b_max: required({ exclusiveMin: 0 }),
    ct0: optional({ min: -100, max: 100 }),
    ct1: optional({ min: -10, max: 10 }),
    ct2: optional({ min: -1, max: 1 }),
    t_ref: optional({ min: -40, max: 250 }),
    bsat_25: required({ exclusiveMin: 0 }),
    bsat_100: required({ exclusiveMin: 0 }),
    mu_i: required({ min: 1, max: 200000 }),
    rolloff_a: optional({ min: 0.1, max: 10 }),
    rolloff_b: optional({ min: 0, max: 1000 }),
    rolloff_c: optional({ min: 0.1, max: 5 }),
    density: required({ min: 500, max: 20000 }),
    provenance: textCell(500),
  })
  .strict()
  .superRefine((row, ctx) => {
    const issue = (path: MaterialCsvColumn, message: string) => ctx.addIssue({ code: 'custom', path: [path], message });
    const scale = UNIT_SCALES[row.unit_set];
    if (row.f_min !== undefined && row.f_max !== undefined && row.f_min > row.f_max) issue('f_min', 'must not exceed f_max');
    if (row.b_min !== undefined && row.b_max !== undefined && row.b_min > row.b_max) issue('b_min', 'must not exceed b_max');
    if (row.f_max !== undefined && row.f_max * scale.frequency > 100e6)
      issue('f_max', `must be at most 100 MHz (${100e6 / scale.frequency} ${scale.frequencyUnit})`);
    if (row.b_max !== undefined && row.b_max * scale.flux > 2) issue('b_max', `must be at most 2 T (${2 / scale.flux} ${scale.fluxUnit})`);
    for (const column of ['bsat_25', 'bsat_100'] as const) {
      const value = row[column];
      if (value !== undefined && (value * scale.flux < 0.05 || value * scale.flux > 3)) {
        issue(column, `must be between 0.05 and 3 T (${0.05 / scale.flux}…${3 / scale.flux} ${scale.fluxUnit})`);
      }
    }
    const partial = (columns: MaterialCsvColumn[]) => {
      const given = columns.filter((c) => row[c as keyof typeof row] !== undefined);
      if (given.length && given.length < columns.length) {
        for (const c of columns.filter((c) => !given.includes(c)))
          issue(c, `is required when ${given.join(', ')} ${given.length > 1 ? 'are' : 'is'} given`);
      }
    };
    partial(['ct0', 'ct1', 'ct2']);
    partial(['rolloff_a', 'rolloff_b', 'rolloff_c']);
    if (row.k !== undefined && row.alpha !== undefined && row.beta !== undefined) {
      const kSi = kToSi(row.k, row.unit_set, row.alpha, row.beta);
      if (!Number.isFinite(kSi) || kSi <= 0 || kSi > 1e12)
        issue('k', `gives ${kSi.toPrecision(3)} in SI units; must be between 0 and 1e12`);
    }
  });
export type MaterialCsvRow = z.output<typeof materialCsvRowSchema>;

/** A material version as stored (SI units), without identity and bookkeeping. */
export interface MaterialValues {
  name: string;
  family: MaterialFamily;
  unitSet: MaterialUnitSet;
  kUploaded: number;
  k: number;
  alpha: number;
  beta: number;
  fitFrequencyMin: number;
  fitFrequencyMax: number;
  fitFluxMin: number;
  fitFluxMax: number;
  ct0: number | null;
  ct1: number | null;
  ct2: number | null;
  referenceTemperature: number | null;
  bsat25: number;
  bsat100: number;
  permeability: number;
  rollOffA: number | null;
  rollOffB: number | null;
  rollOffC: number | null;
  density: number;
  provenance: string;
}

export const cellProblemSchema = z.object({ column: z.string(), message: z.string() });
export type CellProblem = z.infer<typeof cellProblemSchema>;

export function materialValuesFromRow(row: MaterialCsvRow): MaterialValues {
  const scale = UNIT_SCALES[row.unit_set];
  return {
    name: row.name,
    family: row.family,
    unitSet: row.unit_set,
    kUploaded: row.k,
    k: kToSi(row.k, row.unit_set, row.alpha, row.beta),
    alpha: row.alpha,
    beta: row.beta,
    fitFrequencyMin: row.f_min * scale.frequency,
    fitFrequencyMax: row.f_max * scale.frequency,
    fitFluxMin: row.b_min * scale.flux,
    fitFluxMax: row.b_max * scale.flux,
    ct0: row.ct0 ?? null,
    ct1: row.ct1 ?? null,
    ct2: row.ct2 ?? null,
    referenceTemperature: row.t_ref ?? null,
    bsat25: row.bsat_25 * scale.flux,
    bsat100: row.bsat_100 * scale.flux,
    permeability: row.mu_i,
    rollOffA: row.rolloff_a ?? null,
    rollOffB: row.rolloff_b ?? null,
    rollOffC: row.rolloff_c ?? null,
    density: row.density,
    provenance: row.provenance,
  };
}

/** Validate one row of cells (column → text); absent columns count as empty cells. */
export function validateMaterialCells(cells: Partial<Record<string, string>>): { values?: MaterialValues; problems: CellProblem[] } {
  const input: Record<string, string> = {};
  for (const column of MATERIAL_CSV_COLUMNS) input[column] = cells[column] ?? '';
  const result = materialCsvRowSchema.safeParse(input);
  if (!result.success) {
    const problems: CellProblem[] = [];
    const seen = new Set<string>();
    for (const issue of result.error.issues) {
      const column = issue.path.length ? String(issue.path[0]) : '(row)';
      if (seen.has(column)) continue;
      seen.add(column);
      problems.push({ column, message: `${column} ${issue.message}` });
    }
    return { problems };
  }
  return { values: materialValuesFromRow(result.data), problems: [] };
}

/** Cells of a stored version in its own unit set (for export and the edit form); the inverse of the import. */
export function materialCellsFromValues(values: MaterialValues): Record<MaterialCsvColumn, string> {
  const scale = UNIT_SCALES[values.unitSet];
  const text = (value: number | null) => (value === null ? '' : String(value));
  return {
    name: values.name,
    family: values.family,
    unit_set: values.unitSet,
    k: text(values.kUploaded),
    alpha: text(values.alpha),
    beta: text(values.beta),
    f_min: text(values.fitFrequencyMin / scale.frequency),
    f_max: text(values.fitFrequencyMax / scale.frequency),
    b_min: text(values.fitFluxMin / scale.flux),
    b_max: text(values.fitFluxMax / scale.flux),
    ct0: text(values.ct0),
    ct1: text(values.ct1),
    ct2: text(values.ct2),
    t_ref: text(values.referenceTemperature),
    bsat_25: text(values.bsat25 / scale.flux),
    bsat_100: text(values.bsat100 / scale.flux),
    mu_i: text(values.permeability),
    rolloff_a: text(values.rollOffA),
    rolloff_b: text(values.rollOffB),
    rolloff_c: text(values.rollOffC),
    density: text(values.density),
    provenance: values.provenance,
  };
}

/** Editing a material: the same cells as a CSV row (numbers may be sent as numbers), giving a new version. */
export const materialEditSchema = z
  .object(
    Object.fromEntries(MATERIAL_CSV_COLUMNS.map((c) => [c, z.union([text().max(500), z.number()]).optional()])) as Record<
      MaterialCsvColumn,
      z.ZodOptional<z.ZodUnion<[z.ZodString, z.ZodNumber]>>
    >,
  )
  .strict()
  .refine((edit) => Object.values(edit).some((v) => v !== undefined), { error: 'Give at least one column to change', path: ['(body)'] });
export type MaterialEdit = z.infer<typeof materialEditSchema>;

export const importDecisionSchema = z.enum(['new-version', 'skip']);
export type ImportDecision = z.infer<typeof importDecisionSchema>;
/** Per existing name (as written in the file): make a new version, or leave the stored one alone. */
export const importDecisionsSchema = z.record(text().max(80), importDecisionSchema);

export const previewRowSchema = z.object({
  row: z.number().int(),
  name: z.string(),
  status: z.enum(['new', 'exists', 'error']),
  problems: z.array(cellProblemSchema),
});
export type PreviewRow = z.infer<typeof previewRowSchema>;
export type PreviewStatus = PreviewRow['status'];
/** What a CSV import would do with each row; nothing is written. */
export const importPreviewSchema = z.object({
  fileName: z.string(),
  rows: z.array(previewRowSchema),
  summary: z.object({ rows: z.number().int(), new: z.number().int(), exists: z.number().int(), errors: z.number().int() }),
});
export type ImportPreview = z.infer<typeof importPreviewSchema>;

export const materialExportQuerySchema = z
  .object({
    ids: text()
      .max(20000, { error: 'ids must be a comma-separated list of material ids' })
      .transform((list) => list.split(','))
      .pipe(uniqueListSchema(storedIdTextSchema(), 1000, 'ids'))
      .meta({ description: 'Comma-separated material ids (at most 1000 distinct)' })
      .optional(),
  })
  .strict();

/** The engine's CoreMaterial as an answer carries it. */
export const coreMaterialSchema = z.object({
  id: z.string(),
  name: z.string(),
  family: z.enum(MATERIAL_FAMILIES),
  k: z.number(),
  alpha: z.number(),
  beta: z.number(),
  fitFrequencyMin: z.number(),
  fitFrequencyMax: z.number(),
  fitFluxMin: z.number(),
  fitFluxMax: z.number(),
  tempCoefficients: z.object({ ct0: z.number(), ct1: z.number(), ct2: z.number() }).optional(),
  bsat25: z.number(),
  bsat100: z.number(),
  permeability: z.number(),
  rollOff: z.object({ a: z.number(), b: z.number(), c: z.number() }).optional(),
  density: z.number(),
  maxTemperature: z.number().optional(),
}) satisfies z.ZodType<CoreMaterial>;

/** A stored material version as GET /api/materials lists it: the engine's fields plus version, provenance and state. */
export const materialSummarySchema = coreMaterialSchema.extend({
  lineage: z.string(),
  version: z.number().int(),
  retired: z.boolean(),
  unitSet: z.enum(MATERIAL_UNIT_SETS),
  kUploaded: z.number(),
  referenceTemperature: z.number().nullable(),
  provenance: z.string(),
  createdAt: z.string(),
});
export type MaterialSummary = z.infer<typeof materialSummarySchema>;
export const materialListResponseSchema = z.object({ materials: z.array(materialSummarySchema) });
export const materialListQuerySchema = z.object({
  retired: z.enum(['include']).optional().meta({ description: '"include" lists retired materials too' }),
});

/** A material as the library lists it (GET /api/materials/library, history, edits): with author and its CSV cells. */
export const libraryMaterialSchema = materialSummarySchema.extend({
  current: z.boolean(),
  createdBy: z.string().nullable(),
  cells: z.record(z.enum(MATERIAL_CSV_COLUMNS), z.string()),
});
export type LibraryMaterial = z.infer<typeof libraryMaterialSchema>;
export const libraryResponseSchema = z.object({ materials: z.array(libraryMaterialSchema) });
export const materialHistoryResponseSchema = z.object({ versions: z.array(libraryMaterialSchema) });

/** One uploaded material CSV file and what it did. */
export const materialImportEntrySchema = z.object({
  id: z.number().int(),
  fileName: z.string(),
  uploadedBy: z.string().nullable(),
  uploadedAt: z.string(),
  rowCount: z.number().int(),
  createdCount: z.number().int(),
  versionedCount: z.number().int(),
  skippedCount: z.number().int(),
});
export type MaterialImportEntry = z.infer<typeof materialImportEntrySchema>;
export const materialImportsResponseSchema = z.object({ imports: z.array(materialImportEntrySchema) });

/** What a committed material CSV import did. */
export const materialCommitResultSchema = z.object({
  importId: z.number().int(),
  created: z.number().int(),
  versioned: z.number().int(),
  skipped: z.number().int(),
  materialIds: z.array(z.number().int()),
});
export type MaterialCommitResult = z.infer<typeof materialCommitResultSchema>;
