// The material CSV format of Gapwright: one row per material, a header row, in one of two unit sets.
// Every problem names the column it comes from, so the upload preview can show it by row and column.
import * as z from 'zod';
import { steinmetzKFromSi, steinmetzKToSi } from '@shared/engine/core-loss';
import { MATERIAL_FAMILIES } from '@shared/engine/types';
import { temperatureFactorProblem } from './material-temperature';
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
  'ct0',
  'ct1',
  'ct2',
  't_ref',
  'max_temperature',
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
  'max_temperature',
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
    max_temperature: optional({ min: 50, max: 400 }),
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
  // Every check of a row runs even when some of its cells failed, so a row's problems are all reported at once.
  .superRefine(rowChecks, { when: (payload) => typeof payload.value === 'object' && payload.value !== null });
export type MaterialCsvRow = z.output<typeof materialCsvRowSchema>;

type RowInProgress = { [C in keyof MaterialCsvRow]?: unknown };

/** The checks across cells of one row; cells that failed their own check are skipped. */
function rowChecks(parsed: RowInProgress, ctx: z.RefinementCtx): void {
  const issue = (path: MaterialCsvColumn, message: string) => ctx.addIssue({ code: 'custom', path: [path], message });
  // A cell that failed its own check (even one that still carries its out-of-range number) takes no part.
  const failed = new Set(ctx.issues.map((i) => i.path?.[0]));
  const num = (column: MaterialCsvColumn): number | undefined => {
    const value = parsed[column];
    return typeof value === 'number' && !failed.has(column) ? value : undefined;
  };
  const [fMin, fMax, bMin, bMax] = [num('f_min'), num('f_max'), num('b_min'), num('b_max')];
  if (fMin !== undefined && fMax !== undefined && fMin > fMax) issue('f_min', 'must not exceed f_max');
  if (bMin !== undefined && bMax !== undefined && bMin > bMax) issue('b_min', 'must not exceed b_max');
  const partial = (columns: MaterialCsvColumn[]) => {
    const given = columns.filter((c) => parsed[c] !== undefined);
    if (given.length && given.length < columns.length) {
      for (const c of columns.filter((c) => !given.includes(c)))
        issue(c, `is required when ${given.join(', ')} ${given.length > 1 ? 'are' : 'is'} given`);
    }
  };
  partial(['ct0', 'ct1', 'ct2']);
  partial(['rolloff_a', 'rolloff_b', 'rolloff_c']);
  const factor = temperatureFactorProblem({
    ct0: num('ct0'),
    ct1: num('ct1'),
    ct2: num('ct2'),
    t_ref: num('t_ref'),
    max_temperature: num('max_temperature'),
  });
  if (factor) issue(factor.column, factor.message);

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
