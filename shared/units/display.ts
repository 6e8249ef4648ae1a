// Fixed display units: a table column in mm², a caption in kHz, a chart axis in µs. The client shows SI values
// in such a unit, and reads numbers typed in one, only through these functions: no component scales by powers of ten.
import { engineeringExponent, prefixOf, trimmedNumber } from './format';

/** Each display unit as the power of ten of its size in SI (1 mm² = 10⁻⁶ m²). */
export const DISPLAY_UNITS = {
  Hz: 0,
  kHz: 3,
  MHz: 6,
  T: 0,
  mT: -3,
  s: 0,
  ms: -3,
  µs: -6,
  m: 0,
  mm: -3,
  'mm²': -6,
  'cm²': -4,
  'mm³': -9,
  'cm³': -6,
  'cm⁴': -8,
  'W/m³': 0,
  'kW/m³': 3,
  // Mass: the SI unit is the kilogram, so the gram is 10⁻³ of it.
  kg: 0,
  g: -3,
} as const satisfies Record<string, number>;
export type DisplayUnit = keyof typeof DISPLAY_UNITS;

export function isDisplayUnit(text: string): text is DisplayUnit {
  return Object.hasOwn(DISPLAY_UNITS, text);
}

/**
 * `si` divided by 10^exponent. Whole powers of ten are exact doubles, so dividing by 10³ or multiplying by 10⁶
 * gives the correctly rounded result (multiplying by 1e-3 would not: 1e-3 is not exact in binary).
 */
function shift(si: number, exponent: number): number {
  return exponent >= 0 ? si / 10 ** exponent : si * 10 ** -exponent;
}

/** The number shown for the SI value `si` in `unit` (0.0125 m → 12.5 in mm). */
export function toDisplay(si: number, unit: DisplayUnit): number {
  return shift(si, DISPLAY_UNITS[unit]);
}

/** The SI value of a number given in `unit` (12.5 mm → 0.0125 m). */
export function fromDisplay(shown: number, unit: DisplayUnit): number {
  return shift(shown, -DISPLAY_UNITS[unit]);
}

/** "152.4 mm²": the value in `unit` to `significant` digits, trailing zeros dropped. */
export function formatIn(si: number, unit: DisplayUnit, significant = 4): string {
  return Number.isFinite(si) ? `${trimmedNumber(toDisplay(si, unit), significant)} ${unit}` : '';
}

/** A chart axis in one unit: its name and how an SI value becomes a coordinate on it. */
export interface AxisScale {
  unit: string;
  toAxis(si: number): number;
}

/** An axis in a fixed display unit (a loss sweep always in kHz). */
export function axisIn(unit: DisplayUnit): AxisScale {
  return { unit, toAxis: (si) => toDisplay(si, unit) };
}

/**
 * An axis of `symbol` ("s", "Hz") with the engineering prefix chosen once from the largest magnitude among `values`
 * (a 20 µs span is drawn in µs, a 400 ns span in ns), so the ticks read with 1 to 3 digits before the point.
 */
export function axisFor(symbol: string, values: readonly number[]): AxisScale {
  const largest = values.reduce((max, v) => (Number.isFinite(v) ? Math.max(max, Math.abs(v)) : max), 0);
  const exponent = engineeringExponent(largest);
  return { unit: `${prefixOf(exponent)}${symbol}`, toAxis: (si) => shift(si, exponent) };
}
