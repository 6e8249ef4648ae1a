// Reading the shipped CSV tables through the one CSV reader (`shared/csv/csv-table.ts`): records with their
// data row and line numbers, and errors that name the file, row, line and column to fix.

import { CsvTableError, readCsvTable } from '@shared/csv/csv-table';
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
  /** Cells by column, without surrounding spaces. */
  cells: Record<string, string>;
  /** 1-based data row (the header is not counted). */
  row: number;
  /** 1-based line in the file the record starts on. */
  line: number;
}

/** The records of a shipped table whose header holds exactly `expectedColumns`. */
export function readCsvRecords(text: string, fileName: string, expectedColumns: readonly string[]): TableRecord[] {
  let records;
  try {
    records = readCsvTable(text, { columns: expectedColumns, required: expectedColumns, noun: 'catalogue' });
  } catch (error) {
    if (!(error instanceof CsvTableError)) throw error;
    const { line, column, problem } = error.place;
    throw new TableError(fileName, undefined, line, column, problem);
  }
  return records.map(({ cells, row: line, shapeProblem }, index) => {
    if (shapeProblem) throw new TableError(fileName, index + 1, line, undefined, `the row ${shapeProblem}`);
    const trimmed = Object.fromEntries(Object.entries(cells).map(([column, cell]) => [column, (cell ?? '').trim()]));
    return { cells: trimmed, row: index + 1, line };
  });
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
