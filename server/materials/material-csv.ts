import { parse } from 'csv-parse/sync';
import { stringify } from 'csv-stringify/sync';
import {
  MATERIAL_CSV_COLUMNS,
  REQUIRED_MATERIAL_COLUMNS,
  type MaterialCsvColumn,
} from '@shared/schemas/materials';
import { AppError, badRequest } from '../http/errors.ts';

export const MAX_UPLOAD_BYTES = 2 * 1024 * 1024;
export const MAX_MATERIAL_ROWS = 10_000;
export const MAX_RECORD_CHARACTERS = 8_192;

export interface CsvRecord {
  /** Row number as a spreadsheet shows it: the header is row 1. */
  row: number;
  cells: Partial<Record<MaterialCsvColumn, string>>;
  /** Problems found before validation (a wrong number of cells). */
  shapeProblem?: string;
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
export function parseMaterialCsv(text: string): CsvRecord[] {
  const withoutBom = text.replace(/^\uFEFF/, '');
  const firstLine = withoutBom.split(/\r?\n/, 1)[0] ?? '';
  if (withoutBom.trim() === '') throw fileProblem('The file is empty.');
  if (!firstLine.includes(',')) {
    const other = [';', '\t', '|'].find((d) => firstLine.includes(d));
    throw fileProblem(
      other
        ? `The header row is separated by "${other === '\t' ? 'tab' : other}"; Gapwright material files use commas.`
        : 'The header row has a single column; Gapwright material files are comma-separated with the columns of the template.',
      { header: 'Not comma-separated' },
    );
  }

  let table: string[][];
  try {
    table = parse(withoutBom, {
      bom: true,
      delimiter: ',',
      relax_column_count: true,
      skip_empty_lines: true,
      max_record_size: MAX_RECORD_CHARACTERS,
      to_line: MAX_MATERIAL_ROWS + 2,
    }) as string[][];
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

  const [header, ...data] = table;
  if (!header) throw fileProblem('The file is empty.');
  if (data.length > MAX_MATERIAL_ROWS) {
    throw fileProblem(`The file has more than ${MAX_MATERIAL_ROWS} material rows; split it into smaller files.`);
  }
  const columns = header.map((c) => c.trim().toLowerCase());
  const headerFields: Record<string, string> = {};
  columns.forEach((c, i) => {
    if (!(MATERIAL_CSV_COLUMNS as readonly string[]).includes(c)) headerFields[`header.${c || `column ${i + 1}`}`] = `Unknown column "${c.slice(0, 40)}"`;
    else if (columns.indexOf(c) !== i) headerFields[`header.${c}`] = `Column "${c}" appears twice`;
  });
  for (const c of REQUIRED_MATERIAL_COLUMNS) if (!columns.includes(c)) headerFields[`header.${c}`] = `Missing column "${c}"`;
  if (Object.keys(headerFields).length) {
    throw new AppError(400, 'invalid_input', `The header row does not match the template: ${Object.values(headerFields).slice(0, 4).join('; ')}.`, headerFields);
  }
  if (!data.length) throw fileProblem('The file has a header row but no material rows.', { file: 'No material rows' });

  return data.map((cells, index) => {
    const record: CsvRecord = { row: index + 2, cells: {} };
    columns.forEach((c, i) => {
      record.cells[c as MaterialCsvColumn] = cells[i] ?? '';
    });
    if (cells.length !== columns.length) record.shapeProblem = `has ${cells.length} cells; the header has ${columns.length}`;
    return record;
  });
}

/** CSV text of rows in template column order; formula-like cells are escaped for spreadsheets. */
export function stringifyMaterialCsv(rows: Record<MaterialCsvColumn, string>[]): string {
  return stringify(rows, { header: true, columns: [...MATERIAL_CSV_COLUMNS], escape_formulas: true, record_delimiter: 'unix' });
}
