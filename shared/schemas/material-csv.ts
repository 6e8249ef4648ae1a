// The material CSV format of Gapwright: one row per material, a header row, in one of two unit sets.
// Every problem names the column it comes from, so the upload preview can show it by row and column.
import * as z from 'zod';
import { steinmetzKFromSi, steinmetzKToSi } from '@shared/engine/core-loss';
import { MATERIAL_FAMILIES } from '@shared/engine/types';
import { convertOldRollOff, convertOldTemperature, mixedForms, OLD_MATERIAL_COLUMNS, type OldMaterialColumn } from './material-old-columns';
import { choiceCell, optionalNumberCell as optional, requiredNumberCell as required, textCell } from './csv-cells';

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
  'lowest_loss_temperature',
  'lowest_loss_factor',
  'loss_curvature',
  't_ref',
  'max_temperature',
  'bsat_25',
  'bsat_100',
  'mu_i',
  'rolloff_half_field',
  'rolloff_steepness',
  'bias_loss_doubling_field',
  'bias_loss_steepness',
  'density',
  'provenance',
] as const;
export type MaterialCsvColumn = (typeof MATERIAL_CSV_COLUMNS)[number];

/** Every column an upload may have: the current ones and those of the previous format version (converted on import). */
export const MATERIAL_READ_COLUMNS = [...MATERIAL_CSV_COLUMNS, ...OLD_MATERIAL_COLUMNS] as const;
export type MaterialReadColumn = MaterialCsvColumn | OldMaterialColumn;

/** Columns that may be left out of the header (their cells are then empty). */
export const OPTIONAL_MATERIAL_COLUMNS: readonly MaterialReadColumn[] = [
  'lowest_loss_temperature',
  'lowest_loss_factor',
  'loss_curvature',
  't_ref',
  'max_temperature',
  'rolloff_half_field',
  'rolloff_steepness',
  'bias_loss_doubling_field',
  'bias_loss_steepness',
  ...OLD_MATERIAL_COLUMNS,
];
export const REQUIRED_MATERIAL_COLUMNS: readonly MaterialReadColumn[] = MATERIAL_CSV_COLUMNS.filter(
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

/**
 * Ranges of the named temperature, roll-off and DC-bias loss cells (a converted old row is held to them too). F0 > 0,
 * c ≥ 0, H½ > 0 and n > 0 make the factor and the permeability positive by construction, H₂ > 0 and m > 0 the DC-bias
 * loss factor 1 + (H/H₂)^m at least 1; the bounds beyond are plausibility limits (common practice, no source).
 */
export const NAMED_RANGES = {
  lowest_loss_temperature: { min: -100, max: 400 },
  lowest_loss_factor: { exclusiveMin: 0, max: 100 },
  loss_curvature: { min: 0, max: 1 },
  rolloff_half_field: { exclusiveMin: 0, max: 1e7 },
  rolloff_steepness: { exclusiveMin: 0, max: 5 },
  bias_loss_doubling_field: { exclusiveMin: 0, max: 1e6 },
  bias_loss_steepness: { exclusiveMin: 0, max: 6 },
} as const;

const MU_I_RANGE = { min: 1, max: 200000 } as const;

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
    lowest_loss_temperature: optional(NAMED_RANGES.lowest_loss_temperature),
    lowest_loss_factor: optional(NAMED_RANGES.lowest_loss_factor),
    loss_curvature: optional(NAMED_RANGES.loss_curvature),
    t_ref: optional({ min: -40, max: 250 }),
    max_temperature: optional({ min: 50, max: 400 }),
    bsat_25: required({ exclusiveMin: 0 }),
    bsat_100: required({ exclusiveMin: 0 }),
    mu_i: required(MU_I_RANGE),
    rolloff_half_field: optional(NAMED_RANGES.rolloff_half_field),
    rolloff_steepness: optional(NAMED_RANGES.rolloff_steepness),
    bias_loss_doubling_field: optional(NAMED_RANGES.bias_loss_doubling_field),
    bias_loss_steepness: optional(NAMED_RANGES.bias_loss_steepness),
    density: required({ min: 500, max: 20000 }),
    provenance: textCell(500),
    // The previous format version's columns, converted on import (material-old-columns.ts).
    ct0: optional({ min: -100, max: 100 }),
    ct1: optional({ min: -10, max: 10 }),
    ct2: optional({ min: -1, max: 1 }),
    rolloff_a: optional({ min: 0.1, max: 10 }),
    rolloff_b: optional({ min: 0, max: 1000 }),
    rolloff_c: optional({ min: 0.1, max: 5 }),
  })
  .strict()
  // Every check of a row runs even when some of its cells failed, so a row's problems are all reported at once.
  .superRefine(rowChecks, { when: (payload) => typeof payload.value === 'object' && payload.value !== null });
export type MaterialCsvRow = z.output<typeof materialCsvRowSchema>;

type RowInProgress = { [C in keyof MaterialCsvRow]?: unknown };

/** The checks across cells of one row; cells that failed their own check are skipped. */
function rowChecks(parsed: RowInProgress, ctx: z.RefinementCtx): void {
  const issue = (path: MaterialReadColumn, message: string) => ctx.addIssue({ code: 'custom', path: [path], message });
  // A cell that failed its own check (even one that still carries its out-of-range number) takes no part.
  const failed = new Set(ctx.issues.map((i) => i.path?.[0]));
  const num = (column: MaterialReadColumn): number | undefined => {
    const value = parsed[column];
    return typeof value === 'number' && !failed.has(column) ? value : undefined;
  };
  const [fMin, fMax, bMin, bMax] = [num('f_min'), num('f_max'), num('b_min'), num('b_max')];
  // A fitted range must hold more than one value; b_min may be 0.
  if (fMin !== undefined && fMax !== undefined && fMin >= fMax) issue('f_min', `must be below f_max (${fMin} ≥ ${fMax})`);
  if (bMin !== undefined && bMax !== undefined && bMin >= bMax) issue('b_min', `must be below b_max (${bMin} ≥ ${bMax})`);
  const partial = (columns: MaterialReadColumn[], rule: string) => {
    const given = columns.filter((c) => parsed[c] !== undefined);
    if (given.length && given.length < columns.length) {
      for (const c of columns.filter((c) => !given.includes(c)))
        issue(c, `is required when ${given.join(', ')} ${given.length > 1 ? 'are' : 'is'} given (${rule})`);
    }
  };
  partial(['lowest_loss_temperature', 'lowest_loss_factor', 'loss_curvature'], 'all three or none');
  partial(['rolloff_half_field', 'rolloff_steepness'], 'both or none');
  partial(['bias_loss_doubling_field', 'bias_loss_steepness'], 'both or none');
  partial(['ct0', 'ct1', 'ct2'], 'all three or none');
  partial(['rolloff_a', 'rolloff_b', 'rolloff_c'], 'all three or none');
  for (const mixed of mixedForms(Object.keys(parsed).filter((c) => parsed[c as MaterialReadColumn] !== undefined))) {
    issue(mixed.column as MaterialReadColumn, mixed.message);
  }
  for (const problem of oldColumnProblems(num)) issue(problem.column, problem.message);

  // The rest depends on the unit set.
  const unitSet = MATERIAL_UNIT_SETS.find((set) => set === parsed.unit_set);
  if (!unitSet) return;
  const scale = UNIT_SCALES[unitSet];
  if (fMax !== undefined && fMax * scale.frequency > 100e6)
    issue('f_max', `must be at most 100 MHz (${100e6 / scale.frequency} ${scale.frequencyUnit})`);
  if (bMax !== undefined && bMax * scale.flux > 2) issue('b_max', `must be at most 2 T (${2 / scale.flux} ${scale.fluxUnit})`);
  for (const column of ['bsat_25', 'bsat_100'] as const) {
    const value = num(column);
    if (value !== undefined && (value * scale.flux < 0.05 || value * scale.flux > 3)) {
      issue(column, `must be between 0.05 and 3 T (${0.05 / scale.flux}…${3 / scale.flux} ${scale.fluxUnit})`);
    }
  }
  const [k, alpha, beta] = [num('k'), num('alpha'), num('beta')];
  if (k !== undefined && alpha !== undefined && beta !== undefined) {
    const kSi = kToSi(k, unitSet, alpha, beta);
    if (!Number.isFinite(kSi) || kSi <= 0 || kSi > 1e12) issue('k', `gives ${kSi.toPrecision(3)} in SI units; must be between 0 and 1e12`);
  }
}

type NumberOf = (column: MaterialReadColumn) => number | undefined;

/** Old columns whose values cannot be converted, or convert to named values outside their ranges. */
function oldColumnProblems(num: NumberOf): { column: OldMaterialColumn; message: string }[] {
  const problems: { column: OldMaterialColumn; message: string }[] = [];
  const { temperature, rollOff } = oldConversions(num);
  if (temperature && 'problem' in temperature) problems.push(temperature.problem);
  if (temperature && 'value' in temperature) {
    const b = temperature.value;
    outOfRange(problems, 'ct0', 'lowest_loss_temperature', b.lowestLossTemperature);
    outOfRange(problems, 'ct0', 'lowest_loss_factor', b.lowestLossFactor);
    outOfRange(problems, 'ct2', 'loss_curvature', b.curvature);
  }
  if (rollOff && 'problem' in rollOff) problems.push(rollOff.problem);
  if (rollOff && 'value' in rollOff) {
    outOfRange(problems, 'rolloff_b', 'rolloff_half_field', rollOff.value.rollOff.halfField);
    outOfRange(problems, 'rolloff_c', 'rolloff_steepness', rollOff.value.rollOff.steepness);
    const muI = num('mu_i');
    const scaled = muI === undefined ? undefined : muI * rollOff.value.permeabilityScale;
    if (scaled !== undefined && (scaled < MU_I_RANGE.min || scaled > MU_I_RANGE.max)) {
      problems.push({
        column: 'rolloff_a',
        message: `makes mu_i × 1/a = ${scaled.toPrecision(4)}, outside ${MU_I_RANGE.min}…${MU_I_RANGE.max}`,
      });
    }
  }
  return problems;
}

function outOfRange(
  problems: { column: OldMaterialColumn; message: string }[],
  column: OldMaterialColumn,
  named: keyof typeof NAMED_RANGES,
  value: number,
): void {
  const range: { min?: number; max: number; exclusiveMin?: number } = NAMED_RANGES[named];
  const low = range.exclusiveMin !== undefined ? value <= range.exclusiveMin : value < (range.min ?? -Infinity);
  if (low || value > range.max) {
    problems.push({
      column,
      message: `converts to ${named} ${value.toPrecision(4)}, outside ${range.min ?? range.exclusiveMin}…${range.max}`,
    });
  }
}

/** The conversions of a row's old columns (undefined where the row does not give all three of them). */
export function oldConversions(num: NumberOf) {
  const [ct0, ct1, ct2] = [num('ct0'), num('ct1'), num('ct2')];
  const [a, b, c] = [num('rolloff_a'), num('rolloff_b'), num('rolloff_c')];
  return {
    temperature: ct0 !== undefined && ct1 !== undefined && ct2 !== undefined ? convertOldTemperature({ ct0, ct1, ct2 }) : undefined,
    rollOff: a !== undefined && b !== undefined && c !== undefined ? convertOldRollOff({ a, b, c }) : undefined,
  };
}
