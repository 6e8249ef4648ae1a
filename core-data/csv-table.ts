// Reading the shipped CSV tables: header check, records with their line numbers, and
// errors that name the file, row, line and column to fix.

import { parse } from 'csv-parse/sync';
import type { z } from 'zod';

export class TableError extends Error {
  constructor(
    readonly fileName: string,
    readonly row: number | undefined,
    readonly line: number | undefined,
    readonly column: string | undefined,
    problem: string,
  ) {
    const rowText =
      row === undefined ? (line === undefined ? undefined : `line ${line}`) : line === undefined ? `row ${row}` : `row ${row} (line ${line})`;
    const where = [fileName, rowText, column && `column "${column}"`].filter(Boolean).join(', ');
    super(`${where}: ${problem}`);
    this.name = 'TableError';
  }
}

export interface TableRecord {
  cells: Record<string, string>;
  /** 1-based data row (the header is not counted). */
  row: number;
  /** 1-based line in the file. */
  line: number;
}

export function readCsvRecords(text: string, fileName: string, expectedColumns: readonly string[]): TableRecord[] {
  let parsed: { record: Record<string, string>; info: { lines: number } }[];
  try {
    parsed = parse(text, { columns: true, info: true, skip_empty_lines: true, trim: true });
  } catch (error) {
    const line = (error as { lines?: number }).lines;
    throw new TableError(fileName, undefined, line, undefined, `not a readable CSV table (${(error as Error).message})`);
  }
  const header = (text.split(/\r?\n/, 1)[0] ?? '').split(',').map((name) => name.trim());
  const missing = expectedColumns.find((name) => !header.includes(name));
  if (missing) throw new TableError(fileName, undefined, 1, missing, 'column missing from the header');
  const unknown = header.find((name) => !expectedColumns.includes(name));
  if (unknown !== undefined) throw new TableError(fileName, undefined, 1, unknown, 'unknown column in the header');
  return parsed.map(({ record, info }, index) => ({ cells: record, row: index + 1, line: info.lines }));
}

/** Error for a row that failed validation; `columnOf` maps an issue path to the column it concerns. */
export function rowError(
  fileName: string,
  record: TableRecord,
  issues: readonly z.core.$ZodIssue[],
  columnOf: (field: string) => string = (field) => field,
): TableError {
  const columnFor = (issue: z.core.$ZodIssue) => columnOf(String(issue.path[0] ?? ''));
  const [first, ...rest] = issues;
  const problem = [first?.message ?? 'invalid row', ...rest.map((issue) => `${columnFor(issue)}: ${issue.message}`)].join('; also ');
  return new TableError(fileName, record.row, record.line, first && columnFor(first), problem);
}
