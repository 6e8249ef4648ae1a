// The one reader of CSV tables: uploaded material and core files (server/http/csv-table.ts) and the shipped
// catalogue tables (core-data/shipped-table.ts). Text checks (UTF-8, no NUL bytes), delimiter and header checks
// against the columns of a format, record limits, then one record per data row with the line it starts on.
// A table that cannot be read throws CsvTableError, which each caller words its own way (an HTTP 400 naming
// the field, or a start-up error naming the shipped file).
import { parse } from 'csv-parse/sync';

export const MAX_RECORD_CHARACTERS = 8_192;

/** The columns of one CSV format and the noun its messages use ("material", "core"). */
export interface CsvTableFormat<C extends string> {
  columns: readonly C[];
  /** Columns the header must have; the others may be left out (their cells are then empty). */
  required: readonly C[];
  noun: string;
  /** Columns that must not appear together (old and new forms of one quantity), each problem naming a column. */
  conflicts?: (columns: readonly string[]) => { column: string; message: string }[];
  /** Most data rows a file may hold (a file over it is refused as a whole); no limit when left out. */
  maxRows?: number;
}

export interface CsvRecord<C extends string = string> {
  /** The line of the file the record starts on (the header is line 1), as an editor or spreadsheet shows it. */
  row: number;
  cells: Partial<Record<C, string>>;
  /** Problems found before validation (a wrong number of cells). */
  shapeProblem?: string;
}

/** Where a table is broken, for a message that names a line and column rather than an upload field. */
export interface CsvTablePlace {
  line?: number;
  column?: string;
  /** The problem in a few words, without the place ("column missing from the header"). */
  problem: string;
}

/** A table that cannot be read: a sentence for the user, the fields an answer names, and the place. */
export class CsvTableError extends Error {
  constructor(
    message: string,
    readonly fields: Record<string, string>,
    readonly place: CsvTablePlace = { problem: message },
  ) {
    super(message);
    this.name = 'CsvTableError';
  }
}

/** A record as the parser answers with `info`: its cells and the line it ends on. */
interface ParsedRecord {
  record: string[];
  info: { lines: number };
}

const fileProblem = (message: string, fields: Record<string, string> = { file: message }, place?: CsvTablePlace) =>
  new CsvTableError(message, fields, place);

/** Text of an upload, refusing what is not a UTF-8 text file (binary, other encodings). */
export function decodeCsvText(bytes: Uint8Array): string {
  if (bytes.length === 0) throw fileProblem('The file is empty.');
  if (bytes.includes(0)) throw fileProblem('The file contains NUL bytes: it is a binary file, not a CSV text file.');
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    throw fileProblem('The file is not valid UTF-8 text. Save it as "CSV UTF-8" and upload it again.');
  }
}

/** Header, delimiter and size checks, then one record per data row with its row number. */
export function readCsvTable<C extends string>(text: string, format: CsvTableFormat<C>): CsvRecord<C>[] {
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
      { line: 1, problem: 'the header row is not comma-separated' },
    );
  }

  const [headerRecord, ...data] = parseRecords(withoutBom, maxRows);
  const header = headerRecord?.record;
  if (!header) throw fileProblem('The file is empty.');
  if (maxRows !== undefined && data.length > maxRows) {
    throw fileProblem(
      `The file has more than ${maxRows} ${noun} rows (the limit is ${maxRows} per file); nothing was imported. Split it into smaller files.`,
    );
  }
  const columns = header.map((c) => c.trim().toLowerCase());
  checkHeader(columns, format);
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

function parseRecords(text: string, maxRows: number | undefined): ParsedRecord[] {
  try {
    // The limit counts records, not lines: a quoted cell may span lines and blank lines are skipped. One
    // record more than the limit is read so that a file over it is refused as a whole, never cut short.
    return parse(text, {
      bom: true,
      delimiter: ',',
      relax_column_count: true,
      skip_empty_lines: true,
      max_record_size: MAX_RECORD_CHARACTERS,
      info: true,
      ...(maxRows === undefined ? {} : { to: maxRows + 2 }),
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
    throw fileProblem(`The file cannot be read${line}: ${reason}.`, { file: `${reason}${line}` }, { line: e.lines, problem: reason });
  }
}

const HEADER_PROBLEMS = {
  missing: 'column missing from the header',
  unknown: 'unknown column in the header',
  twice: 'column appears twice in the header',
  conflict: 'columns that cannot be used together in the header',
} as const;

interface HeaderProblem {
  kind: keyof typeof HEADER_PROBLEMS;
  column: string;
  field: string;
  message: string;
}

/** Unknown, repeated and missing columns, each as a field `header.<column>`; the place is the first missing one. */
function checkHeader<C extends string>(columns: readonly string[], format: CsvTableFormat<C>): void {
  const problems: HeaderProblem[] = [];
  columns.forEach((c, i) => {
    if (!(format.columns as readonly string[]).includes(c)) {
      problems.push({
        kind: 'unknown',
        column: c,
        field: `header.${c || `column ${i + 1}`}`,
        message: `Unknown column "${c.slice(0, 40)}"`,
      });
    } else if (columns.indexOf(c) !== i) {
      problems.push({ kind: 'twice', column: c, field: `header.${c}`, message: `Column "${c}" appears twice` });
    }
  });
  for (const c of format.required) {
    if (!columns.includes(c)) problems.push({ kind: 'missing', column: c, field: `header.${c}`, message: `Missing column "${c}"` });
  }
  for (const { column, message } of format.conflicts?.(columns) ?? []) {
    problems.push({ kind: 'conflict', column, field: `header.${column}`, message: `Column "${column}" ${message}` });
  }
  if (!problems.length) return;
  const fields: Record<string, string> = {};
  for (const p of problems) fields[p.field] = p.message;
  const first = problems.find((p) => p.kind === 'missing') ?? problems[0]!;
  throw new CsvTableError(`The header row does not match the template: ${Object.values(fields).slice(0, 4).join('; ')}.`, fields, {
    line: 1,
    column: first.column,
    problem: HEADER_PROBLEMS[first.kind],
  });
}

/** The line a record starts on: the parser reports the line it ends on, less the line breaks inside its cells. */
function firstLineOf(cells: readonly string[], lastLine: number): number {
  return lastLine - cells.reduce((breaks, cell) => breaks + (cell.match(/\n/g)?.length ?? 0), 0);
}
