// The shipped core catalogue: one CSV table per family under core-data/cores/, values
// in the units the trade quotes (mm, mm², mm³), read once, validated row by row and
// converted to SI CoreShape records.

import { readFileSync } from 'node:fs';
import { basename } from 'node:path';
import { fileURLToPath } from 'node:url';
import { parse } from 'csv-parse/sync';
import type { z } from 'zod';
import type { CoreFamily, CoreShape } from '@shared/engine/types';
import {
  RING_CORE_COLUMNS,
  SHAPED_CORE_COLUMNS,
  coreShapeSchema,
  ringCoreRowSchema,
  shapedCoreRowSchema,
} from '@shared/catalogue/core-schema';
import {
  RING_CORE_FIELD_COLUMNS,
  SHAPED_CORE_FIELD_COLUMNS,
  ringCoreFromRow,
  shapedCoreFromRow,
} from '@shared/catalogue/core-rows';

/** Table file name → core family it holds. */
export const CORE_TABLE_FILES: Readonly<Record<string, CoreFamily>> = {
  'e.csv': 'E',
  'etd.csv': 'ETD',
  'efd.csv': 'EFD',
  'pq.csv': 'PQ',
  'rm.csv': 'RM',
  'pot.csv': 'POT',
  'ring.csv': 'RING',
  'powder-toroid.csv': 'POWDER_TOROID',
};

export class CoreTableError extends Error {
  constructor(
    readonly fileName: string,
    readonly row: number | undefined,
    readonly line: number | undefined,
    readonly column: string | undefined,
    problem: string,
  ) {
    const rowText =
      row === undefined ? (line === undefined ? undefined : `line ${line}`) : line === undefined ? `row ${row}` : `row ${row} (line ${line})`;
    const where = [fileName, rowText, column && `column "${column}"`]
      .filter(Boolean)
      .join(', ');
    super(`${where}: ${problem}`);
    this.name = 'CoreTableError';
  }
}

interface ParsedRecord {
  record: Record<string, string>;
  info: { lines: number };
}

function describeIssues(issues: z.core.$ZodIssue[], columnOf: (field: string) => string) {
  const first = issues[0]!;
  const column = columnOf(String(first.path[0] ?? ''));
  const rest = issues.slice(1).map((issue) => `${columnOf(String(issue.path[0] ?? ''))}: ${issue.message}`);
  return { column, problem: [first.message, ...rest].join('; also ') };
}

/** Parses and validates one core table. `fileName` selects the family (see CORE_TABLE_FILES). */
export function parseCoreRows(text: string, fileName: string): CoreShape[] {
  const family = CORE_TABLE_FILES[basename(fileName)];
  if (!family) {
    throw new CoreTableError(fileName, undefined, undefined, undefined, `unknown core table; expected one of ${Object.keys(CORE_TABLE_FILES).join(', ')}`);
  }
  const isRing = family === 'RING' || family === 'POWDER_TOROID';
  const expectedColumns: readonly string[] = isRing ? RING_CORE_COLUMNS : SHAPED_CORE_COLUMNS;

  let records: ParsedRecord[];
  try {
    records = parse(text, { columns: true, info: true, skip_empty_lines: true, trim: true }) as ParsedRecord[];
  } catch (error) {
    const line = (error as { lines?: number }).lines;
    throw new CoreTableError(fileName, undefined, line, undefined, `not a readable CSV table (${(error as Error).message})`);
  }
  const header = text.split(/\r?\n/, 1)[0]!.split(',').map((name) => name.trim());
  const missing = expectedColumns.filter((name) => !header.includes(name));
  const unknown = header.filter((name) => !expectedColumns.includes(name));
  if (missing.length > 0 || unknown.length > 0) {
    throw new CoreTableError(fileName, undefined, 1, missing[0] ?? unknown[0], missing.length > 0 ? 'column missing from the header' : 'unknown column in the header');
  }

  return records.map(({ record, info }, index) => {
    const row = index + 1;
    const fail = (issues: z.core.$ZodIssue[], columnOf: (field: string) => string): never => {
      const { column, problem } = describeIssues(issues, columnOf);
      throw new CoreTableError(fileName, row, info.lines, column, problem);
    };
    const fieldColumns: Partial<Record<string, string>> = isRing ? RING_CORE_FIELD_COLUMNS : SHAPED_CORE_FIELD_COLUMNS;
    const derivedColumn = (field: string) => fieldColumns[field] ?? `${field} (derived)`;

    let shape: CoreShape;
    if (isRing) {
      const parsed = ringCoreRowSchema.safeParse(record);
      if (!parsed.success) return fail(parsed.error.issues, (column) => column);
      shape = ringCoreFromRow(parsed.data, family);
    } else {
      const parsed = shapedCoreRowSchema.safeParse(record);
      if (!parsed.success) return fail(parsed.error.issues, (column) => column);
      shape = shapedCoreFromRow(parsed.data, family);
    }
    const validated = coreShapeSchema.safeParse(shape);
    if (!validated.success) return fail(validated.error.issues, derivedColumn);
    return shape;
  });
}

const CORE_TABLE_DIRECTORY = fileURLToPath(new URL('./cores/', import.meta.url));

/** Checks that designations are unique across all tables; names the second occurrence. */
export function assertUniqueCoreIds(tables: { fileName: string; cores: CoreShape[] }[]): void {
  const seen = new Map<string, string>();
  for (const { fileName, cores } of tables) {
    cores.forEach((core, index) => {
      const earlier = seen.get(core.id);
      if (earlier) {
        throw new CoreTableError(fileName, index + 1, undefined, 'designation', `"${core.id}" is already used in ${earlier}`);
      }
      seen.set(core.id, fileName);
    });
  }
}

let cachedCatalogue: readonly CoreShape[] | undefined;

/** All shipped cores, validated and in SI units. Reads the tables on first call only. */
export function loadCoreCatalogue(): CoreShape[] {
  if (!cachedCatalogue) {
    const tables = Object.keys(CORE_TABLE_FILES).map((name) => {
      const fileName = `core-data/cores/${name}`;
      return { fileName, cores: parseCoreRows(readFileSync(CORE_TABLE_DIRECTORY + name, 'utf8'), fileName) };
    });
    assertUniqueCoreIds(tables);
    cachedCatalogue = Object.freeze(tables.flatMap((table) => table.cores).map((core) => Object.freeze(core)));
  }
  return [...cachedCatalogue];
}
