// Shows SI values in engineering notation with SI prefixes: 4.7e-6 H → "4.7 µH".
import { QUANTITIES, type QuantityKind } from './quantities';

const PREFIXES: Record<number, string> = {
  [-15]: 'f',
  [-12]: 'p',
  [-9]: 'n',
  [-6]: 'µ',
  [-3]: 'm',
  0: '',
  3: 'k',
  6: 'M',
  9: 'G',
  12: 'T',
};

/** The power of ten (a multiple of three, femto to tera) whose prefix shows `value` with 1 to 3 digits before the point. */
export function engineeringExponent(value: number): number {
  if (!Number.isFinite(value) || value === 0) return 0;
  const exponent = Math.floor(Math.log10(Math.abs(value)) / 3) * 3;
  return Math.min(12, Math.max(-15, exponent));
}

/** The SI prefix of a power of ten that is a multiple of three ("k" for 3, "µ" for -6). */
export function prefixOf(exponent: number): string {
  return PREFIXES[exponent] ?? '';
}

/** Number with `significant` digits, trailing zeros removed, never in exponent notation for ordinary sizes. */
export function trimmedNumber(value: number, significant = 4): string {
  if (value === 0) return '0';
  const text = Number(value.toPrecision(significant)).toString();
  return text;
}

/** "4.7 µH", "250 kHz", "85 °C", "4 A/mm²", "0.3". */
export function formatQuantity(value: number, kind: QuantityKind, significant = 4): string {
  const info = QUANTITIES[kind];
  if (!Number.isFinite(value)) return '';
  const shown = value * info.displayScale;
  if (!info.prefixed || shown === 0) {
    return info.symbol ? `${trimmedNumber(shown, significant)} ${info.symbol}` : trimmedNumber(shown, significant);
  }
  return formatEngineering(shown, info.symbol, significant);
}

/** Engineering notation for any symbol: the exponent is a multiple of three and carried by a prefix. */
export function formatEngineering(value: number, symbol: string, significant = 4): string {
  if (!Number.isFinite(value)) return '';
  if (value === 0) return symbol ? `0 ${symbol}` : '0';
  const rounded = Number(value.toPrecision(significant));
  const exponent = engineeringExponent(rounded);
  const mantissa = trimmedNumber(rounded / 10 ** exponent, significant);
  return `${mantissa} ${prefixOf(exponent)}${symbol}`.trim();
}
