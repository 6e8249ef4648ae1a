// The material CSV format of Gapwright: one row per material, a header row, in one of two unit sets.
// Every problem names the column it comes from, so the upload preview can show it by row and column.
import * as z from 'zod';
import { steinmetzKFromSi, steinmetzKToSi } from '@shared/engine/core-loss';
import { MATERIAL_FAMILIES } from '@shared/engine/types';
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
