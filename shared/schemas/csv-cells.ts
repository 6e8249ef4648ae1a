// Cell readers shared by Gapwright's CSV formats (materials, cores): plain decimal numbers, texts a
// spreadsheet would not run as formulas, a choice of words. Each failure reads as "<column> <message>".
import type * as z from 'zod';
import type { CellProblem } from './csv-import';
import { text } from './text';

// Plain decimal numbers with an optional exponent; no thousands separators, no decimal comma, no hex.
export const NUMBER_TEXT = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
// A cell a spreadsheet would run as a formula.
export const FORMULA_START = /^[=+\-@\t\r]/;
// eslint-disable-next-line no-control-regex -- finding control characters is the point of this pattern
export const CONTROL_CHARACTERS = /[\u0000-\u0008\u000b\u000c\u000e-\u001f]/;

/** A cell as a message quotes it: at most 24 characters. */
export const shownCell = (text: string) => (text.length > 24 ? `${text.slice(0, 24)}…` : text);

/** The hint for a number written with a decimal comma ("1,5"). */
export const decimalCommaHint = (text: string) => (/^\d+,\d+$/.test(text) ? ' (use a point as the decimal separator)' : '');

export interface CellRange {
  min?: number;
  max?: number;
  exclusiveMin?: number;
}

function numberCell(range: CellRange, required: boolean) {
  // One transform per cell (trim, parse, range) keeps a 10,000-row file fast to validate.
  return text().transform((raw, ctx): number | undefined => {
    const trimmed = raw.trim();
    // An export escapes a leading minus or plus with an apostrophe (formula safety); read it back.
    const text = /^'[-+]/.test(trimmed) ? trimmed.slice(1) : trimmed;
    const fail = (message: string) => {
      ctx.addIssue({ code: 'custom', message, input: raw });
      return undefined;
    };
    if (text === '') return required ? fail('is required') : undefined;
    if (!NUMBER_TEXT.test(text)) return fail(`"${shownCell(text)}" is not a number${decimalCommaHint(text)}`);
    const value = Number(text);
    if (!Number.isFinite(value)) return fail('must be a finite number');
    if (range.exclusiveMin !== undefined && value <= range.exclusiveMin) {
      fail(`must be greater than ${range.exclusiveMin} (got ${value})`);
    } else if ((range.min !== undefined && value < range.min) || (range.max !== undefined && value > range.max)) {
      fail(`must be between ${range.min} and ${range.max} (got ${value})`);
    }
    return value;
  });
}

/** A number cell that must be given, within `range`. */
export const requiredNumberCell = (range: CellRange) => numberCell(range, true) as z.ZodType<number, string>;
/** A number cell that may be empty (undefined), within `range` when given. */
export const optionalNumberCell = (range: CellRange) => numberCell(range, false) as z.ZodType<number | undefined, string>;

/** Why a given text cell cannot be stored, or undefined. */
function textProblem(text: string, max: number): string | undefined {
  if (text.length > max) return `must be at most ${max} characters`;
  if (FORMULA_START.test(text)) return 'must not start with =, +, -, @ (a spreadsheet would run it as a formula)';
  if (CONTROL_CHARACTERS.test(text)) return 'must not contain control characters';
  return undefined;
}

/** A text cell that must be given: at most `max` characters, no formula start, no control characters. */
export function textCell(max: number) {
  return text().transform((raw, ctx) => {
    const text = raw.trim();
    const problem = text === '' ? 'is required' : textProblem(text, max);
    if (problem) ctx.addIssue({ code: 'custom', message: problem, input: raw });
    return text;
  });
}

/** A text cell that may be empty (undefined): otherwise as {@link textCell}. */
export function optionalTextCell(max: number) {
  return text().transform((raw, ctx): string | undefined => {
    const text = raw.trim();
    if (text === '') return undefined;
    const problem = textProblem(text, max);
    if (problem) ctx.addIssue({ code: 'custom', message: problem, input: raw });
    return text;
  });
}

/** A cell holding one of `choices`. */
export function choiceCell<const T extends readonly string[]>(choices: T, message: string) {
  return text().transform((raw, ctx): T[number] => {
    const text = raw.trim();
    if (!choices.includes(text)) ctx.addIssue({ code: 'custom', message, input: raw });
    return text as T[number];
  });
}

/** A row schema's issues as problems by column, the first per column, each reading "<column> <message>". */
export function cellProblems(issues: readonly { path: readonly PropertyKey[]; message: string }[]): CellProblem[] {
  const problems: CellProblem[] = [];
  const seen = new Set<string>();
  for (const issue of issues) {
    const column = issue.path.length ? String(issue.path[0]) : '(row)';
    if (seen.has(column)) continue;
    seen.add(column);
    problems.push({ column, message: `${column} ${issue.message}` });
  }
  return problems;
}
