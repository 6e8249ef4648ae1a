// A loss-point file read and checked as a whole: the shared table reader (size, encoding, header, row limit), each
// row by its schema, then the checks across rows — a point (f, B̂, T) twice, fewer than 3 points, all at one
// frequency or one flux — so a preview shows every problem at once and a commit refuses the file with all of them.
import { distinctSorted, valueRange, type LossPoint } from '@shared/fitting/loss-points';
import type { CellProblem } from '@shared/schemas/csv-import';
import {
  LOSS_POINT_CSV_COLUMNS,
  LOSS_POINT_QUANTITIES,
  MAX_LOSS_POINTS,
  REQUIRED_LOSS_POINT_COLUMNS,
  validateLossPointCells,
  type LossPointCsvColumn,
} from '@shared/schemas/loss-point-csv';
import type { LossPointPreview } from '@shared/schemas/loss-points';
import { decodeCsvText, parseCsvTable, stringifyCsvTable, type CsvTableFormat } from '../http/csv-table.ts';
import type { UploadedFile } from '../http/csv-upload.ts';
import { AppError, badRequest } from '../http/errors.ts';

export const LOSS_POINT_TABLE: CsvTableFormat<LossPointCsvColumn> = {
  columns: LOSS_POINT_CSV_COLUMNS,
  required: REQUIRED_LOSS_POINT_COLUMNS,
  noun: 'loss point',
  maxRows: MAX_LOSS_POINTS,
};

/** Fewest points a file may hold: three fix k, α and β (our own rule, the least a Steinmetz fit takes). */
export const MIN_LOSS_POINTS = 3;

/**
 * A header naming a quantity of ours in another unit ("frequency_hz", "loss_mw_per_cm3") is refused with the column
 * this format takes: a file in other units would otherwise import numbers a thousand times off.
 */
function checkHeaderUnits(text: string): void {
  const firstLine = text.replace(/^\uFEFF/, '').split(/\r\n?|\n/, 1)[0] ?? '';
  // A header that is not comma-separated is refused by the table reader, naming the delimiter.
  if (!firstLine.includes(',')) return;
  const fields: Record<string, string> = {};
  for (const raw of firstLine.split(',')) {
    const column = raw.trim().replace(/^"|"$/g, '').trim().toLowerCase();
    if ((LOSS_POINT_CSV_COLUMNS as readonly string[]).includes(column)) continue;
    const quantity = LOSS_POINT_QUANTITIES.find((q) => column.startsWith(q.prefix));
    if (quantity) fields[`header.${column.slice(0, 40)}`] = `Wrong unit: this format takes ${quantity.column} (${quantity.unit})`;
  }
  const entries = Object.entries(fields);
  if (entries.length) {
    throw badRequest(
      `The header names a quantity in a unit this format does not take: ${entries.map(([k, v]) => `${k.slice(7)} (${v.slice(13)})`).join('; ')}.`,
      fields,
    );
  }
}

/** Every row's problems, the problems across rows, and the points of the valid rows (SI units, file order). */
export interface LossPointFile {
  preview: LossPointPreview;
  points: LossPoint[];
}

const pointKey = (p: { frequency_khz: number; peak_flux_mt: number; temperature_c: number }) =>
  `${p.frequency_khz}|${p.peak_flux_mt}|${p.temperature_c}`;

/** Reads and checks a whole file; a table that cannot be read at all is a 400 naming the field. */
export function readLossPointFile(file: UploadedFile): LossPointFile {
  const text = decodeCsvText(file.buffer);
  checkHeaderUnits(text);
  const records = parseCsvTable(text, LOSS_POINT_TABLE);
  const firstRowOfPoint = new Map<string, number>();
  const rows: LossPointPreview['rows'] = [];
  const points: LossPoint[] = [];
  for (const record of records) {
    const { values, problems } = validateLossPointCells(record.cells);
    const all: CellProblem[] = record.shapeProblem
      ? [{ column: '(row)', message: `Row ${record.shapeProblem}` }, ...problems]
      : [...problems];
    if (values) {
      const key = pointKey(values.row);
      const first = firstRowOfPoint.get(key);
      if (first !== undefined) {
        all.push({ column: '(row)', message: `the point (f, B̂, T) = (${key.replaceAll('|', ', ')}) already appears in row ${first}` });
      } else firstRowOfPoint.set(key, record.row);
    }
    rows.push({ row: record.row, status: all.length ? 'error' : 'ok', problems: all });
    if (values && !all.length) points.push(values.point);
  }
  return {
    preview: {
      fileName: file.originalname.slice(0, 200),
      rows,
      fileProblems: fileProblems(points, rows.length),
      summary: summary(rows, points),
    },
    points,
  };
}

function fileProblems(points: readonly LossPoint[], rowCount: number): CellProblem[] {
  const problems: CellProblem[] = [];
  const counted = points.length === rowCount ? `${points.length}` : `${points.length} valid of ${rowCount}`;
  if (points.length < MIN_LOSS_POINTS) {
    problems.push({
      column: 'file',
      message: `The file has ${counted} point${rowCount === 1 ? '' : 's'}; a fit needs at least ${MIN_LOSS_POINTS}.`,
    });
    return problems;
  }
  if (distinctSorted(points.map((p) => p.frequency)).length < 2) {
    problems.push({ column: 'file', message: 'All points are at one frequency: α cannot be fitted. Add points at other frequencies.' });
  }
  if (distinctSorted(points.map((p) => p.peakFlux)).length < 2) {
    problems.push({ column: 'file', message: 'All points are at one peak flux: β cannot be fitted. Add points at other flux levels.' });
  }
  return problems;
}

function summary(rows: LossPointPreview['rows'], points: readonly LossPoint[]): LossPointPreview['summary'] {
  const range = (values: number[]) => (values.length ? valueRange(values) : null);
  const frequencies = points.map((p) => p.frequency);
  const fluxes = points.map((p) => p.peakFlux);
  const temperatures = points.map((p) => p.temperature);
  return {
    rows: rows.length,
    valid: points.length,
    errors: rows.filter((r) => r.status === 'error').length,
    frequencies: distinctSorted(frequencies).length,
    fluxes: distinctSorted(fluxes).length,
    temperatures: distinctSorted(temperatures).length,
    frequencyRange: range(frequencies),
    fluxRange: range(fluxes),
    temperatureRange: range(temperatures),
  };
}

/** The refusal of a file with problems: one field per row and column ("row 3.loss_kw_per_m3"), and "file". */
export function lossPointFileErrors(preview: LossPointPreview): AppError | undefined {
  const fields: Record<string, string> = {};
  for (const row of preview.rows) for (const p of row.problems) fields[`row ${row.row}.${p.column}`] ??= p.message;
  if (preview.fileProblems.length) fields['file'] = preview.fileProblems.map((p) => p.message).join(' ');
  const entries = Object.entries(fields);
  if (!entries.length) return undefined;
  const { errors } = preview.summary;
  const first = entries
    .slice(0, 3)
    .map(([k, v]) => `${k}: ${v}`)
    .join('; ');
  const what = errors ? `${errors} row${errors === 1 ? '' : 's'} cannot be imported` : 'The points cannot be imported';
  return new AppError(400, 'invalid_rows', `${what}; nothing was written. ${first}`, fields);
}

/**
 * The template: invented points of an illustrative ferrite, no maker's data — Pv = 3.2·f^1.4·B̂^2.6 W/m³ (the material
 * template's invented coefficients) at 60, 90 and 120 °C with a factor 1 + 1e-4·(T − 90)².
 */
export function lossPointTemplate(): string {
  const rows: Record<LossPointCsvColumn, string>[] = [];
  for (const temperature of [60, 90, 120]) {
    for (const kHz of [50, 100, 200]) {
      for (const mT of [50, 100, 200]) {
        const factor = 1 + 1e-4 * (temperature - 90) ** 2;
        const loss = 3.2 * (kHz * 1e3) ** 1.4 * (mT * 1e-3) ** 2.6 * factor;
        rows.push({
          frequency_khz: String(kHz),
          peak_flux_mt: String(mT),
          temperature_c: String(temperature),
          loss_kw_per_m3: (loss / 1e3).toPrecision(4),
          dc_bias_a_per_m: '',
          source: 'Invented example, illustrative only',
        });
      }
    }
  }
  return stringifyCsvTable(rows, LOSS_POINT_CSV_COLUMNS);
}
