import { parse } from 'csv-parse/browser/esm/sync';
import { stringify } from 'csv-stringify/browser/esm/sync';
import type { LossPoint } from '@shared/fitting/loss-points';
import { LOSS_POINT_CSV_COLUMNS, lossPointCells, type LossPointCsvColumn } from '@shared/schemas/loss-point-csv';

/** One typed or pasted point as its cells, in the loss-point CSV's own columns and units (kHz, mT, °C, kW/m³, A/m). */
export type LossPointCells = Record<LossPointCsvColumn, string>;

export const emptyLossPointCells = (): LossPointCells => Object.fromEntries(LOSS_POINT_CSV_COLUMNS.map((c) => [c, ''])) as LossPointCells;

/** A stored point (SI) as the cells a user edits, rounded to the digits a file would carry. */
export const cellsOfPoint = (point: LossPoint): LossPointCells => lossPointCells(point, 10);

/**
 * Rows pasted from a spreadsheet or a text file: tab-, semicolon- or comma-separated, in the CSV's column order. A
 * first line that names our columns is taken as a header and decides the order; blank lines are skipped. Cells are
 * kept as text — the server checks them, by row and column, exactly as it checks a file.
 */
export function cellsFromPastedText(text: string): LossPointCells[] {
  const records: string[][] = parse(text.replace(/^\uFEFF/, ''), {
    delimiter: pastedDelimiter(text),
    relax_column_count: true,
    skip_empty_lines: true,
    trim: true,
  });
  if (!records.length) return [];
  const first = records[0]!.map((cell) => cell.toLowerCase());
  const header = first.some((cell) => (LOSS_POINT_CSV_COLUMNS as readonly string[]).includes(cell));
  const order = (header ? first : LOSS_POINT_CSV_COLUMNS) as readonly string[];
  return (header ? records.slice(1) : records).map((record) => {
    const cells = emptyLossPointCells();
    order.forEach((column, i) => {
      if ((LOSS_POINT_CSV_COLUMNS as readonly string[]).includes(column)) cells[column as LossPointCsvColumn] = record[i] ?? '';
    });
    return cells;
  });
}

/** Spreadsheets copy with tabs; a tab in the first line wins, then a semicolon, then a comma. */
function pastedDelimiter(text: string): string {
  const firstLine = text.split(/\r\n?|\n/, 1)[0] ?? '';
  if (firstLine.includes('\t')) return '\t';
  if (firstLine.includes(';')) return ';';
  return ',';
}

/** The rows as a loss-point CSV file, so typed points go through the same preview and commit as an uploaded file. */
/** The name of the file made of typed points (the preview calls it "the typed points"). */
export const TYPED_POINTS_FILE = 'typed-points.csv';

export function lossPointFileOf(rows: readonly LossPointCells[], name = TYPED_POINTS_FILE): File {
  const text = stringify(
    rows.map((row) => ({ ...row })),
    { header: true, columns: [...LOSS_POINT_CSV_COLUMNS], record_delimiter: 'unix' },
  );
  return new File([text], name, { type: 'text/csv' });
}
