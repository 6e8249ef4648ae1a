// The core CSV format of Gapwright: one row per user core, a header row, lengths in mm, areas in mm², volumes
// in mm³ (the units are in the column names). A "ring" row gives its nominal dimensions (od_mm, id_mm,
// height_mm; effective parameters by IEC 60205); a "shape" row gives the effective parameters of a gapped
// set. A row becomes the same `UserCoreRequest` (SI units) that POST /api/catalogue/cores takes, checked by
// `userCoreRequestSchema` and the shared core schema; every problem names the CSV column it comes from.
import type * as z from 'zod';
import { userCoreRequestSchema, type UserCoreRequest } from './cores';
import { CONTROL_CHARACTERS, decimalCommaHint, FORMULA_START, NUMBER_TEXT, shownCell } from './csv-cells';
import type { CellProblem } from './csv-import';
import { checkedUserCoreShape } from './user-core-shape';

export { importDecisionsSchema, type CellProblem, type ImportDecision, type ImportPreview, type PreviewRow } from './csv-import';

/** Columns in the order the template writes them. */
export const CORE_CSV_COLUMNS = [
  'name',
  'kind',
  'family',
  'od_mm',
  'id_mm',
  'height_mm',
  'ae_mm2',
  'amin_mm2',
  'le_mm',
  've_mm3',
  'window_mm2',
  'window_height_mm',
  'bobbin_width_mm',
  'bobbin_height_mm',
  'mlt_mm',
  'surface_mm2',
  'source',
] as const;
export type CoreCsvColumn = (typeof CORE_CSV_COLUMNS)[number];

/** The header must have these; the dimension columns may be left out (a file of rings only needs no shape columns). */
export const REQUIRED_CORE_COLUMNS: readonly CoreCsvColumn[] = ['name', 'kind', 'family', 'source'];

export const CORE_KINDS = ['ring', 'shape'] as const;
export type CoreKind = (typeof CORE_KINDS)[number];

type DimensionColumn = Exclude<CoreCsvColumn, 'name' | 'kind' | 'family' | 'source'>;
type RequestField =
  | keyof Omit<Extract<UserCoreRequest, { kind: 'ring' }>, 'kind' | 'name' | 'family' | 'source'>
  | keyof Omit<Extract<UserCoreRequest, { kind: 'shape' }>, 'kind' | 'name' | 'family' | 'source'>;

/** Each dimension column: the request field it fills and the divisor from the column's unit to SI. */
const DIMENSIONS: Record<DimensionColumn, { field: RequestField; unit: 'mm' | 'mm²' | 'mm³'; toSi: number }> = {
  od_mm: { field: 'outerDiameter', unit: 'mm', toSi: 1e3 },
  id_mm: { field: 'innerDiameter', unit: 'mm', toSi: 1e3 },
  height_mm: { field: 'height', unit: 'mm', toSi: 1e3 },
  ae_mm2: { field: 'ae', unit: 'mm²', toSi: 1e6 },
  amin_mm2: { field: 'amin', unit: 'mm²', toSi: 1e6 },
  le_mm: { field: 'le', unit: 'mm', toSi: 1e3 },
  ve_mm3: { field: 've', unit: 'mm³', toSi: 1e9 },
  window_mm2: { field: 'windowArea', unit: 'mm²', toSi: 1e6 },
  window_height_mm: { field: 'windowHeight', unit: 'mm', toSi: 1e3 },
  bobbin_width_mm: { field: 'bobbinWidth', unit: 'mm', toSi: 1e3 },
  bobbin_height_mm: { field: 'bobbinHeight', unit: 'mm', toSi: 1e3 },
  mlt_mm: { field: 'mlt', unit: 'mm', toSi: 1e3 },
  surface_mm2: { field: 'surfaceArea', unit: 'mm²', toSi: 1e6 },
};

/** The dimension columns each kind uses; a row's other dimension cells must be empty. */
export const KIND_COLUMNS: Record<CoreKind, readonly DimensionColumn[]> = {
  ring: ['od_mm', 'id_mm', 'height_mm'],
  shape: [
    'ae_mm2',
    'amin_mm2',
    'le_mm',
    've_mm3',
    'window_mm2',
    'window_height_mm',
    'bobbin_width_mm',
    'bobbin_height_mm',
    'mlt_mm',
    'surface_mm2',
  ],
};
const OPTIONAL_DIMENSIONS: readonly DimensionColumn[] = ['amin_mm2'];

/** The CSV column of a request field (userCoreRequestSchema) or a CoreShape field (shared core schema). */
const COLUMN_OF_FIELD: Record<string, CoreCsvColumn> = {
  ...Object.fromEntries(Object.entries(DIMENSIONS).map(([column, d]) => [d.field, column as CoreCsvColumn])),
  name: 'name',
  id: 'name',
  kind: 'kind',
  gapKind: 'kind',
  family: 'family',
  source: 'source',
  ring: 'id_mm',
};

function numberOf(column: DimensionColumn, raw: string): { value?: number; problem?: string } {
  const text = raw.trim();
  if (!NUMBER_TEXT.test(text)) return { problem: `${column} "${shownCell(text)}" is not a number${decimalCommaHint(text)}` };
  const value = Number(text);
  if (!Number.isFinite(value)) return { problem: `${column} must be a finite number` };
  if (value <= 0) return { problem: `${column} must be greater than 0 (got ${value})` };
  return { value };
}

const CAMEL_FIELDS = new RegExp(
  `\\b(${Object.keys(COLUMN_OF_FIELD)
    .filter((f) => /[A-Z]/.test(f))
    .join('|')})\\b`,
  'g',
);

/**
 * A message of the request or core schema in CSV terms: field names become column names and limits in
 * m, m², m³ become mm, mm², mm³ ("outerDiameter must be at most 0.5 m" → "od_mm must be at most 500 mm").
 */
function inCsvTerms(field: string, column: CoreCsvColumn, message: string): string {
  let text = message.startsWith(`${field} `) ? `${column}${message.slice(field.length)}` : message;
  text = text.replace(CAMEL_FIELDS, (name) => COLUMN_OF_FIELD[name]!);
  const dimension = DIMENSIONS[column as DimensionColumn];
  if (dimension) {
    text = text.replace(
      /(\d+(?:\.\d+)?(?:e[+-]?\d+)?) (m³|m²|m)(?![a-zA-Z])/,
      (_all, value: string) => `${Number((Number(value) * dimension.toSi).toPrecision(12))} ${dimension.unit}`,
    );
  }
  return text.startsWith(`${column} `) ? text : `${column}: ${text}`;
}

function problemsOf(error: z.ZodError): CellProblem[] {
  const problems: CellProblem[] = [];
  const seen = new Set<string>();
  for (const issue of error.issues) {
    const field = String(issue.path[0] ?? '');
    const column = COLUMN_OF_FIELD[field];
    if (!column) {
      if (!seen.has('(row)')) problems.push({ column: '(row)', message: issue.message });
      seen.add('(row)');
      continue;
    }
    if (seen.has(column)) continue;
    seen.add(column);
    problems.push({ column, message: inCsvTerms(field, column, issue.message) });
  }
  return problems;
}

const columnIndex = (column: string) => (CORE_CSV_COLUMNS as readonly string[]).indexOf(column);
const inColumnOrder = (problems: CellProblem[]) => problems.sort((a, b) => columnIndex(a.column) - columnIndex(b.column));

function textProblem(column: 'name' | 'source', text: string): CellProblem | undefined {
  if (FORMULA_START.test(text))
    return { column, message: `${column} must not start with =, +, - or @ (a spreadsheet would run it as a formula)` };
  if (CONTROL_CHARACTERS.test(text)) return { column, message: `${column} must not contain control characters` };
  return undefined;
}

/**
 * One CSV row (column → cell text; absent columns count as empty) as the request POST /cores takes, in SI
 * units, or the problems by column. The request's shape is also checked against the shared core schema.
 */
export function validateCoreCells(cells: Partial<Record<string, string>>): { values?: UserCoreRequest; problems: CellProblem[] } {
  const cell = (column: CoreCsvColumn) => (cells[column] ?? '').trim();
  const problems: CellProblem[] = [];
  const kind = cell('kind');
  const known = (CORE_KINDS as readonly string[]).includes(kind) ? (kind as CoreKind) : undefined;
  if (!known) problems.push({ column: 'kind', message: `kind must be ${CORE_KINDS.map((k) => `"${k}"`).join(' or ')}` });
  for (const column of ['name', 'source'] as const) {
    const problem = textProblem(column, cell(column));
    if (problem) problems.push(problem);
  }

  const request: Record<string, unknown> = { kind, name: cell('name'), family: cell('family'), source: cell('source') };
  for (const [column, dimension] of Object.entries(DIMENSIONS) as [DimensionColumn, (typeof DIMENSIONS)[DimensionColumn]][]) {
    const text = cell(column);
    const used = known ? KIND_COLUMNS[known].includes(column) : false;
    if (text === '') {
      if (used && !OPTIONAL_DIMENSIONS.includes(column)) problems.push({ column, message: `${column} is required for a ${known} core` });
      continue;
    }
    if (known && !used) {
      problems.push({ column, message: `${column} must be empty for a ${known} core (it uses ${KIND_COLUMNS[known].join(', ')})` });
      continue;
    }
    const { value, problem } = numberOf(column, text);
    if (problem) problems.push({ column, message: problem });
    else request[dimension.field] = value! / dimension.toSi;
  }
  if (!known) return { problems: inColumnOrder(problems) };

  const parsed = userCoreRequestSchema.safeParse(request);
  const taken = new Set(problems.map((p) => p.column));
  if (!parsed.success) {
    problems.push(...problemsOf(parsed.error).filter((p) => !taken.has(p.column)));
    return { problems: inColumnOrder(problems) };
  }
  if (problems.length) return { problems: inColumnOrder(problems) };
  const { error } = checkedUserCoreShape(parsed.data);
  if (error) return { problems: problemsOf(error) };
  return { values: parsed.data, problems: [] };
}
