// Uploaded CSV tables (materials, cores) on top of the one reader in `shared/csv/csv-table.ts`: its refusals
// become 400 answers naming the field, and the parts of an import preview that do not depend on the format:
// rows checked against each other and the stored names, the summary, and the all-or-nothing refusal.
import { stringify } from 'csv-stringify/sync';
import {
  CsvTableError,
  decodeCsvText as decodeText,
  readCsvTable,
  type CsvRecord,
  type CsvTableFormat as TableFormat,
} from '@shared/csv/csv-table';
import type { CellProblem, ImportPreview, PreviewRow } from '@shared/schemas/materials';
import { AppError, badRequest } from './errors.ts';

export type { CsvRecord } from '@shared/csv/csv-table';

/** An upload format: the shared one, with a row limit that is never left out. */
export type CsvTableFormat<C extends string> = TableFormat<C> & { maxRows: number };

/** Runs a step of the reader, answering a table it cannot read with 400 and the fields it names. */
function asBadRequest<T>(read: () => T): T {
  try {
    return read();
  } catch (error) {
    if (error instanceof CsvTableError) throw badRequest(error.message, error.fields);
    throw error;
  }
}

/** Text of an upload, refusing what is not a UTF-8 text file (binary, other encodings). */
export const decodeCsvText = (buffer: Uint8Array): string => asBadRequest(() => decodeText(buffer));

/** Header, delimiter and size checks, then one record per data row with its row number. */
export const parseCsvTable = <C extends string>(text: string, format: CsvTableFormat<C>): CsvRecord<C>[] =>
  asBadRequest(() => readCsvTable(text, format));

/** CSV text of rows in the format's column order; formula-like cells are escaped for spreadsheets. */
export function stringifyCsvTable<C extends string>(rows: Record<C, string>[], columns: readonly C[]): string {
  return stringify(rows, { header: true, columns: [...columns], escape_formulas: true, record_delimiter: 'unix' });
}

export interface RowAnalysis<V, E> {
  rows: PreviewRow[];
  /** Rows without problems, with the stored item of the same name if there is one. */
  valid: { row: number; values: V; existing?: E }[];
}

/**
 * The rows of a file checked one by one (`validate`), against each other (a name may appear once, compared
 * without case) and against what is stored (`existing`, by lower-case name): new, exists or error.
 */
export function analyseRecords<C extends string, V, E>(
  records: CsvRecord<C>[],
  validate: (cells: Partial<Record<C, string>>) => { values?: V; problems: CellProblem[]; notices?: CellProblem[] },
  existing: (lowerName: string) => E | undefined,
): RowAnalysis<V, E> {
  const firstRowOfName = new Map<string, number>();
  const analysis: RowAnalysis<V, E> = { rows: [], valid: [] };
  for (const record of records) {
    const { values, problems, notices = [] } = validate(record.cells);
    const allProblems: CellProblem[] = record.shapeProblem
      ? [{ column: '(row)', message: `Row ${record.shapeProblem}` }, ...problems]
      : [...problems];
    const name = ((record.cells as Partial<Record<string, string>>)['name'] ?? '').trim();
    const key = name.toLowerCase();
    if (key) {
      const first = firstRowOfName.get(key);
      if (first !== undefined) allProblems.push({ column: 'name', message: `name "${name.slice(0, 80)}" already appears in row ${first}` });
      else firstRowOfName.set(key, record.row);
    }
    const stored = key ? existing(key) : undefined;
    const status = allProblems.length ? 'error' : stored ? 'exists' : 'new';
    analysis.rows.push({ row: record.row, name: name.slice(0, 80), status, problems: allProblems, notices });
    if (values && !allProblems.length) analysis.valid.push({ row: record.row, values, ...(stored ? { existing: stored } : {}) });
  }
  return analysis;
}

export function summarisePreview(fileName: string, rows: PreviewRow[]): ImportPreview {
  return {
    fileName,
    rows,
    summary: {
      rows: rows.length,
      new: rows.filter((r) => r.status === 'new').length,
      exists: rows.filter((r) => r.status === 'exists').length,
      errors: rows.filter((r) => r.status === 'error').length,
    },
  };
}

/** The refusal of a file with row problems: one field per row and column ("row 3.od_mm"). */
export function rowErrors(rows: PreviewRow[]): AppError {
  const fields: Record<string, string> = {};
  for (const row of rows) for (const p of row.problems) fields[`row ${row.row}.${p.column}`] ??= p.message;
  const count = rows.filter((r) => r.problems.length).length;
  const first = Object.entries(fields)
    .slice(0, 3)
    .map(([k, v]) => `${k}: ${v}`)
    .join('; ');
  return new AppError(
    400,
    'invalid_rows',
    `${count} row${count === 1 ? '' : 's'} cannot be imported; nothing was written. ${first}`,
    fields,
  );
}

/** Existing names without a decision: the commit is refused until each has "new-version" or "skip". */
export function undecidedNames<V extends { name: string }, E>(
  valid: RowAnalysis<V, E>['valid'],
  decided: (lowerName: string) => boolean,
): AppError | undefined {
  const undecided: Record<string, string> = {};
  for (const v of valid) {
    if (v.existing && !decided(v.values.name.toLowerCase())) {
      undecided[`row ${v.row}.name`] = `"${v.values.name}" already exists: choose "new-version" or "skip"`;
    }
  }
  if (!Object.keys(undecided).length) return undefined;
  return badRequest('Choose what to do with the names that already exist; nothing was written.', undecided);
}
