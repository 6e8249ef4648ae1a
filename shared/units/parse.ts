// Reads what a person types into a number field ("4.7 µH", "250kHz", "85 °C", "30 %", "3 A/mm^2") as SI.
// Only the unit machinery of mathjs is loaded, to keep the browser bundle small.
import { create, unitDependencies, type Unit } from 'mathjs';
import { QUANTITIES, type QuantityKind } from './quantities';

const math = create({ unitDependencies });
const toUnit = (text: string): Unit => math.unit(text) as Unit;

export type ParseResult = { ok: true; value: number } | { ok: false; error: string };

/** Spellings people type that mathjs does not know, mapped to ones it does. */
function normalise(text: string): string {
  return text
    .trim()
    .replace(/[\u00b5\u03bc]/g, 'u')
    .replace(/\u2126|\u03a9/g, 'ohm')
    .replace(/ohms?\b/gi, 'ohm')
    .replace(/°\s*C\b/g, 'degC')
    .replace(/°\s*F\b/g, 'degF')
    .replace(/²/g, '^2')
    .replace(/³/g, '^3')
    .replace(/\u2212/g, '-')
    .replace(/(\d),(\d{1,2})(?!\d)/g, '$1.$2');
}

const PLAIN_NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i;

function parsePlain(text: string): number | undefined {
  return PLAIN_NUMBER.test(text) ? Number(text) : undefined;
}

const PREFIXES: Record<string, number> = { p: 1e-12, n: 1e-9, u: 1e-6, m: 1e-3, k: 1e3, M: 1e6, G: 1e9 };
/** "400k", "4u7", "2k2", "1M5": a number with an SI prefix and no unit, the prefix standing for the decimal point. */
const PREFIX_SHORTHAND = /^([+-]?\d+(?:\.\d+)?)\s*([pnumkMG])(\d*)$/;

/**
 * Whether `text` is read by a rule a person may not expect — a decimal comma ("1,5") or a prefix shorthand ("400k",
 * "4u7") — so a field can say what it read instead of taking it silently.
 */
export function readLoosely(text: string): boolean {
  return /,/.test(text) || PREFIX_SHORTHAND.test(text.trim());
}

/** The value of a prefix shorthand in a field whose unit it leaves out, or undefined (also where a prefix letter is the unit). */
function parseShorthand(text: string, kind: QuantityKind): number | undefined {
  const info = QUANTITIES[kind];
  const match = PREFIX_SHORTHAND.exec(text);
  if (!match || !info.prefixed || match[2] === info.symbol) return undefined;
  const [, whole, prefix, fraction] = match;
  if (fraction && whole!.includes('.')) return undefined;
  return Number(fraction ? `${whole}.${fraction}` : whole) * PREFIXES[prefix!]!;
}

/**
 * Parse `text` as the quantity `kind`; a bare number is taken in the field's own unit (SI, or A/mm² for current
 * density), a number with only a prefix ("400k", "4u7") in the field's unit with that prefix.
 */
export function parseQuantity(text: string, kind: QuantityKind): ParseResult {
  const info = QUANTITIES[kind];
  const cleaned = normalise(text);
  if (!cleaned) return { ok: false, error: 'Enter a value' };

  const plain = parsePlain(cleaned);
  if (plain !== undefined) return finish(plain / info.displayScale, kind);
  const shorthand = parseShorthand(cleaned, kind);
  if (shorthand !== undefined) return finish(shorthand, kind);

  if (kind === 'ratio') {
    const percent = /^(.*\S)\s*%$/.exec(cleaned);
    const number = percent ? parsePlain(percent[1].trim()) : undefined;
    if (number !== undefined) return finish(number / 100, kind);
    return { ok: false, error: `Expected ${info.expected}, e.g. 0.3 or 30 %` };
  }
  if (kind === 'count') return { ok: false, error: `Expected ${info.expected}` };

  let unit: Unit;
  try {
    unit = toUnit(cleaned);
  } catch {
    return { ok: false, error: `"${text.trim()}" is not a number with a unit; expected ${info.expected}` };
  }
  const reference = toUnit(info.reference);
  if (!unit.equalBase(reference)) {
    return { ok: false, error: `Expected ${info.expected}, not ${describeDimension(unit)}` };
  }
  if (unit.value === null) return { ok: false, error: `Give a number as well as the unit; expected ${info.expected}` };
  if (kind === 'temperature') return finish(unit.toNumber('degC'), kind);
  if (kind === 'temperatureRise') {
    // A rise is a difference: kelvin and degrees Celsius have the same size, degrees Fahrenheit are 5/9 of one.
    const typed = unit.units[0]?.unit.name;
    const factor = typed === 'degF' || typed === 'fahrenheit' ? 5 / 9 : 1;
    return finish(unit.toNumber(typed ?? 'K') * factor, kind);
  }
  return finish(unit.toSI().toNumber(), kind);
}

function finish(value: number, kind: QuantityKind): ParseResult {
  if (!Number.isFinite(value)) return { ok: false, error: 'The value is not a finite number' };
  if (kind === 'count' && !Number.isInteger(value)) return { ok: false, error: 'Expected a whole number' };
  return { ok: true, value };
}

const DIMENSION_NAMES: [string, string][] = [
  ['V', 'a voltage'],
  ['A', 'a current'],
  ['Hz', 'a frequency'],
  ['H', 'an inductance'],
  ['ohm', 'a resistance'],
  ['K', 'a temperature'],
  ['W', 'a power'],
  ['T', 'a flux density'],
  ['A/m^2', 'a current density'],
  ['m', 'a length'],
  ['m/s', 'a speed'],
  ['K/W', 'a thermal resistance'],
  ['s', 'a time'],
  ['F', 'a capacitance'],
  ['J', 'an energy'],
  ['m^2', 'an area'],
  ['kg', 'a mass'],
];

function describeDimension(unit: Unit): string {
  for (const [symbol, name] of DIMENSION_NAMES) {
    if (unit.equalBase(toUnit(symbol))) return `${name} (${symbol.replace('ohm', 'Ω')})`;
  }
  return `"${unit.formatUnits()}"`;
}
