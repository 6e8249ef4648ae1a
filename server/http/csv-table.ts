// Reading an uploaded CSV table (materials, cores): text checks (UTF-8, no NUL bytes), delimiter and header
// checks against the columns of the format, row and record limits, then one record per data row with the
// row number a spreadsheet shows. Also the parts of an import preview that do not depend on the format:
// rows checked against each other and the stored names, the summary, and the all-or-nothing refusal.
import { parse } from 'csv-parse/sync';
import { stringify } from 'csv-stringify/sync';
import type { CellProblem, ImportPreview, PreviewRow } from '@shared/schemas/materials';
import { AppError, badRequest } from './errors.ts';

export const MAX_RECORD_CHARACTERS = 8_192;

/** The columns of one CSV format and the noun its messages use ("material", "core"). */
export interface CsvTableFormat<C extends string> {
  columns: readonly C[];
  /** Columns the header must have; the others may be left out (their cells are then empty). */
  required: readonly C[];
  noun: string;
  maxRows: number;
}

export interface CsvRecord<C extends string = string> {
  /** The line of the file the record starts on (the header is line 1), as an editor or spreadsheet shows it. */
  row: number;
  cells: Partial<Record<C, string>>;
  /** Problems found before validation (a wrong number of cells). */
  shapeProblem?: string;
}

/** A record as the parser answers with `info`: its cells and the line it ends on. */
interface ParsedRecord {
  record: string[];
  info: { lines: number };
}

const fileProblem = (message: string, fields: Record<string, string> = { file: message }) => badRequest(message, fields);

/** Text of an upload, refusing what is not a UTF-8 text file (binary, other encodings). */
export function decodeCsvText(buffer: Buffer): string {
  if (buffer.length === 0) throw fileProblem('The file is empty.');
  if (buffer.includes(0)) throw fileProblem('The file contains NUL bytes: it is a binary file, not a CSV text file.');
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(buffer);
  } catch {
    throw fileProblem('The file is not valid UTF-8 text. Save it as "CSV UTF-8" and upload it again.');
  }
}

/** Header, delimiter and size checks, then one record per data row with its row number. */
export function parseCsvTable<C extends string>(text: string, format: CsvTableFormat<C>): CsvRecord<C>[] {
  const { noun, maxRows } = format;
  // Spreadsheets and editors mix CRLF, LF and lone CR line endings; the parser expects one kind, so every
  // line ending becomes LF first (inside quoted cells too). Line numbers are unchanged by this.
  const withoutBom = text.replace(/^\uFEFF/, '').replace(/\r\n?/g, '\n');
  const firstLine = withoutBom.split('\n', 1)[0] ?? '';
  if (withoutBom.trim() === '') throw fileProblem('The file is empty.');
  if (!firstLine.includes(',')) {
    const other = [';', '\t', '|'].find((d) => firstLine.includes(d));
    throw fileProblem(
      other
        ? `The header row is separated by "${other === '\t' ? 'tab' : other}"; Gapwright ${noun} files use commas.`
        : `The header row has a single column; Gapwright ${noun} files are comma-separated with the columns of the template.`,
      { header: 'Not comma-separated' },
    );
  }

  let table: ParsedRecord[];
  try {
    // The limit counts records, not lines: a quoted cell may span lines and blank lines are skipped. One
    // record more than the limit is read so that a file over it is refused as a whole, never cut short.
    table = parse(withoutBom, {
      bom: true,
      delimiter: ',',
      relax_column_count: true,
      skip_empty_lines: true,
      max_record_size: MAX_RECORD_CHARACTERS,
      info: true,
      to: maxRows + 2,
    }) as unknown as ParsedRecord[];
  } catch (error) {
    const e = error as { code?: string; message?: string; lines?: number };
    const line = e.lines ? ` near line ${e.lines}` : '';
    const reason =
      e.code === 'CSV_MAX_RECORD_SIZE'
        ? `a record is longer than ${MAX_RECORD_CHARACTERS} characters`
        : e.code === 'CSV_QUOTE_NOT_CLOSED'
          ? 'a quoted cell is never closed'
          : 'it is not well-formed CSV';
    throw fileProblem(`The file cannot be read${line}: ${reason}.`, { file: `${reason}${line}` });
  }

  const [headerRecord, ...data] = table;
  const header = headerRecord?.record;
  if (!header) throw fileProblem('The file is empty.');
  if (data.length > maxRows) {
    throw fileProblem(
      `The file has more than ${maxRows} ${noun} rows (the limit is ${maxRows} per file); nothing was imported. Split it into smaller files.`,
    );
  }
  const columns = header.map((c) => c.trim().toLowerCase());
  const headerFields: Record<string, string> = {};
  columns.forEach((c, i) => {
    if (!(format.columns as readonly string[]).includes(c))
      headerFields[`header.${c || `column ${i + 1}`}`] = `Unknown column "${c.slice(0, 40)}"`;
    else if (columns.indexOf(c) !== i) headerFields[`header.${c}`] = `Column "${c}" appears twice`;
  });
  for (const c of format.required) if (!columns.includes(c)) headerFields[`header.${c}`] = `Missing column "${c}"`;
  if (Object.keys(headerFields).length) {
    throw new AppError(
      400,
      'invalid_input',
      `The header row does not match the template: ${Object.values(headerFields).slice(0, 4).join('; ')}.`,
      headerFields,
    );
  }
  if (!data.length) throw fileProblem(`The file has a header row but no ${noun} rows.`, { file: `No ${noun} rows` });

  return data.map(({ record: cells, info }) => {
    const record: CsvRecord<C> = { row: firstLineOf(cells, info.lines), cells: {} };
    columns.forEach((c, i) => {
      record.cells[c as C] = cells[i] ?? '';
    });
    if (cells.length !== columns.length) record.shapeProblem = `has ${cells.length} cells; the header has ${columns.length}`;
    return record;
  });
}

/** The line a record starts on: the parser reports the line it ends on, less the line breaks inside its cells. */
function firstLineOf(cells: readonly string[], lastLine: number): number {
  return lastLine - cells.reduce((breaks, cell) => breaks + (cell.match(/\n/g)?.length ?? 0), 0);
}

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
  validate: (cells: Partial<Record<C, string>>) => { values?: V; problems: CellProblem[] },
  existing: (lowerName: string) => E | undefined,
): RowAnalysis<V, E> {
  const firstRowOfName = new Map<string, number>();
  const analysis: RowAnalysis<V, E> = { rows: [], valid: [] };
  for (const record of records) {
    const { values, problems } = validate(record.cells);
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
    analysis.rows.push({ row: record.row, name: name.slice(0, 80), status, problems: allProblems });
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
