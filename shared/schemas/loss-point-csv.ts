// The loss-point CSV format of Gapwright: one measured or read-off core-loss point per row, units in the column
// names (one unit set: kHz, mT, °C, kW/m³, A/m). Every problem names its column so the preview can show it by row
// and column; problems across rows (duplicates, too few points, one frequency or flux) come from `loss-point-checks`.
import * as z from 'zod';
import { trimmedNumber } from '@shared/units/format';
import type { LossPoint } from '@shared/fitting/loss-points';
import type { CellProblem } from './csv-import';
import { cellProblems, optionalNumberCell, optionalTextCell, requiredNumberCell } from './csv-cells';

/** Columns in the order the template writes them. */
export const LOSS_POINT_CSV_COLUMNS = [
  'frequency_khz',
  'peak_flux_mt',
  'temperature_c',
  'loss_kw_per_m3',
  'dc_bias_a_per_m',
  'source',
] as const;
export type LossPointCsvColumn = (typeof LOSS_POINT_CSV_COLUMNS)[number];
export const OPTIONAL_LOSS_POINT_COLUMNS: readonly LossPointCsvColumn[] = ['dc_bias_a_per_m', 'source'];
export const REQUIRED_LOSS_POINT_COLUMNS: readonly LossPointCsvColumn[] = LOSS_POINT_CSV_COLUMNS.filter(
  (c) => !OPTIONAL_LOSS_POINT_COLUMNS.includes(c),
);

/** Most points a file (and a material version) may hold. */
export const MAX_LOSS_POINTS = 10_000;

/** Scale from each number column's unit to SI (Hz, T, °C, W/m³, A/m). */
export const LOSS_POINT_SCALES = {
  frequency_khz: 1e3,
  peak_flux_mt: 1e-3,
  temperature_c: 1,
  loss_kw_per_m3: 1e3,
  dc_bias_a_per_m: 1,
} as const satisfies Partial<Record<LossPointCsvColumn, number>>;

/**
 * The quantity each column holds, for the hint on a header that names it in another unit ("frequency_hz"):
 * a prefix of the column name and the column this format takes instead.
 */
export const LOSS_POINT_QUANTITIES: readonly { prefix: string; column: LossPointCsvColumn; unit: string }[] = [
  { prefix: 'frequency', column: 'frequency_khz', unit: 'kHz' },
  { prefix: 'peak_flux', column: 'peak_flux_mt', unit: 'mT' },
  { prefix: 'flux', column: 'peak_flux_mt', unit: 'mT' },
  { prefix: 'temperature', column: 'temperature_c', unit: '°C' },
  { prefix: 'loss', column: 'loss_kw_per_m3', unit: 'kW/m³' },
  { prefix: 'dc_bias', column: 'dc_bias_a_per_m', unit: 'A/m' },
];

// Sane ranges (our own limits, common practice, no source): 10 Hz … 100 MHz, 0.01 mT … 2 T peak, −60 … 250 °C,
// a loss density up to 10⁶ kW/m³ (1 kW/cm³), a DC bias field up to 10⁶ A/m.
export const lossPointCsvRowSchema = z
  .object({
    frequency_khz: requiredNumberCell({ min: 0.01, max: 100_000 }),
    peak_flux_mt: requiredNumberCell({ min: 0.01, max: 2000 }),
    temperature_c: requiredNumberCell({ min: -60, max: 250 }),
    loss_kw_per_m3: requiredNumberCell({ exclusiveMin: 0 }),
    dc_bias_a_per_m: optionalNumberCell({ min: 0, max: 1e6 }),
    source: optionalTextCell(200),
  })
  .strict()
  .superRefine(
    (row, ctx) => {
      const loss = row.loss_kw_per_m3;
      if (typeof loss === 'number' && loss > 1e6 && !ctx.issues.some((i) => i.path?.[0] === 'loss_kw_per_m3')) {
        ctx.addIssue({ code: 'custom', path: ['loss_kw_per_m3'], message: `must be at most 1000000 kW/m³ (got ${loss})` });
      }
    },
    { when: (payload) => typeof payload.value === 'object' && payload.value !== null },
  );
export type LossPointCsvRow = z.output<typeof lossPointCsvRowSchema>;

/** A checked row as a point in SI units. */
export function lossPointFromRow(row: LossPointCsvRow): LossPoint {
  return {
    frequency: row.frequency_khz * LOSS_POINT_SCALES.frequency_khz,
    peakFlux: row.peak_flux_mt * LOSS_POINT_SCALES.peak_flux_mt,
    temperature: row.temperature_c,
    lossDensity: row.loss_kw_per_m3 * LOSS_POINT_SCALES.loss_kw_per_m3,
    ...(row.dc_bias_a_per_m !== undefined ? { dcBias: row.dc_bias_a_per_m } : {}),
    ...(row.source !== undefined ? { source: row.source } : {}),
  };
}

/**
 * A point's cells in the file's units (template, export, the editable table). With `significant`, numbers are written
 * to that many significant digits, so a value converted from SI shows without float noise (70, not 70.00000000000001).
 */
export function lossPointCells(point: LossPoint, significant?: number): Record<LossPointCsvColumn, string> {
  const text = (value: number) => (significant === undefined ? String(value) : trimmedNumber(value, significant));
  return {
    frequency_khz: text(point.frequency / LOSS_POINT_SCALES.frequency_khz),
    peak_flux_mt: text(point.peakFlux / LOSS_POINT_SCALES.peak_flux_mt),
    temperature_c: text(point.temperature),
    loss_kw_per_m3: text(point.lossDensity / LOSS_POINT_SCALES.loss_kw_per_m3),
    dc_bias_a_per_m: point.dcBias === undefined ? '' : text(point.dcBias),
    source: point.source ?? '',
  };
}

/** One row of cells (absent columns as empty): the point in SI units with the row as written, or its problems by column. */
export function validateLossPointCells(cells: Partial<Record<string, string>>): {
  values?: { point: LossPoint; row: LossPointCsvRow };
  problems: CellProblem[];
} {
  const input: Record<string, string> = {};
  for (const column of LOSS_POINT_CSV_COLUMNS) input[column] = cells[column] ?? '';
  const result = lossPointCsvRowSchema.safeParse(input);
  if (result.success) return { values: { point: lossPointFromRow(result.data), row: result.data }, problems: [] };
  return { problems: cellProblems(result.error.issues) };
}
