// The core CSV format of Gapwright: one row per user core, a header row, lengths in mm, areas in mm², volumes
// in mm³ (the units are in the column names). A "ring" row gives its nominal dimensions (od_mm, id_mm,
// height_mm; effective parameters by IEC 60205); a "shape" row gives the effective parameters of a gapped
// set. A row becomes the same `UserCoreRequest` (SI units) that POST /api/catalogue/cores takes, checked by
// `userCoreRequestSchema` and the shared core schema; every problem names the CSV column it comes from.
import type * as z from 'zod';
import { userCoreRequestSchema, type UserCoreRequest } from './cores';
import type { CellProblem } from './materials';
import { checkedUserCoreShape } from './user-core-shape';

export { importDecisionsSchema, type CellProblem, type ImportDecision, type ImportPreview, type PreviewRow } from './materials';

type UnitSuffix = 'mm' | 'mm2' | 'mm3';
/** A dimension column's name ends in its unit (see UNIT_OF_SUFFIX). */
type UnitNamed = `${string}_${UnitSuffix}`;
/** A ring row's dimension columns: nominal dimensions, effective parameters by IEC 60205. */
const RING_COLUMNS = ['od_mm', 'id_mm', 'height_mm'] as const satisfies readonly UnitNamed[];
/** A shape row's dimension columns: the effective parameters of a gapped set. */
const SHAPE_COLUMNS = [
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
] as const satisfies readonly UnitNamed[];

/** Columns in the order the template writes them. */
export const CORE_CSV_COLUMNS = ['name', 'kind', 'family', ...RING_COLUMNS, ...SHAPE_COLUMNS, 'source'] as const;
export type CoreCsvColumn = (typeof CORE_CSV_COLUMNS)[number];

/** The header must have these; the dimension columns may be left out (a file of rings only needs no shape columns). */
export const REQUIRED_CORE_COLUMNS: readonly CoreCsvColumn[] = ['name', 'kind', 'family', 'source'];

export const CORE_KINDS = ['ring', 'shape'] as const;
export type CoreKind = (typeof CORE_KINDS)[number];

type DimensionColumn = (typeof RING_COLUMNS)[number] | (typeof SHAPE_COLUMNS)[number];
type RequestField =
  | keyof Omit<Extract<UserCoreRequest, { kind: 'ring' }>, 'kind' | 'name' | 'family' | 'source'>
  | keyof Omit<Extract<UserCoreRequest, { kind: 'shape' }>, 'kind' | 'name' | 'family' | 'source'>;

/** The dimension columns each kind uses; a row's other dimension cells must be empty. */
export const KIND_COLUMNS: Record<CoreKind, readonly DimensionColumn[]> = { ring: RING_COLUMNS, shape: SHAPE_COLUMNS };

/** The request field each dimension column fills. */
const FIELD_OF_DIMENSION: Record<DimensionColumn, RequestField> = {
  od_mm: 'outerDiameter',
  id_mm: 'innerDiameter',
  height_mm: 'height',
  ae_mm2: 'ae',
  amin_mm2: 'amin',
  le_mm: 'le',
  ve_mm3: 've',
  window_mm2: 'windowArea',
  window_height_mm: 'windowHeight',
  bobbin_width_mm: 'bobbinWidth',
  bobbin_height_mm: 'bobbinHeight',
  mlt_mm: 'mlt',
  surface_mm2: 'surfaceArea',
};

/** The unit a column's name ends in (`_mm`, `_mm2`, `_mm3`) and the divisor from it to SI (SI prefixes). */
const UNIT_OF_SUFFIX: Record<UnitSuffix, { unit: 'mm' | 'mm²' | 'mm³'; toSi: number }> = {
  mm: { unit: 'mm', toSi: 1e3 },
  mm2: { unit: 'mm²', toSi: 1e6 },
  mm3: { unit: 'mm³', toSi: 1e9 },
};

/** Each dimension column: the request field it fills, its unit and the divisor from that unit to SI. */
function dimensionOf(column: DimensionColumn) {
  const suffix = column.slice(column.lastIndexOf('_') + 1) as UnitSuffix;
  return { field: FIELD_OF_DIMENSION[column], ...UNIT_OF_SUFFIX[suffix] };
}
const DIMENSIONS = Object.fromEntries(
  (Object.keys(FIELD_OF_DIMENSION) as DimensionColumn[]).map((column) => [column, dimensionOf(column)]),
) as Record<DimensionColumn, ReturnType<typeof dimensionOf>>;

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

// Plain decimal numbers with an optional exponent; no thousands separators, no decimal comma, no hex.
const NUMBER_TEXT = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
const FORMULA_START = /^[=+\-@\t\r]/;
// eslint-disable-next-line no-control-regex -- finding control characters is the point of this pattern
const CONTROL_CHARACTERS = /[\u0000-\u0008\u000b\u000c\u000e-\u001f]/;
const shown = (text: string) => (text.length > 24 ? `${text.slice(0, 24)}…` : text);

function numberOf(column: DimensionColumn, raw: string): { value?: number; problem?: string } {
  const text = raw.trim();
  if (!NUMBER_TEXT.test(text)) {
    const hint = /^\d+,\d+$/.test(text) ? ' (use a point as the decimal separator)' : '';
    return { problem: `${column} "${shown(text)}" is not a number${hint}` };
  }
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
