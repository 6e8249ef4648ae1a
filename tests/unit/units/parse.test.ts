import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { formatQuantity, parseQuantity, type QuantityKind } from '@shared/units/index';

function value(text: string, kind: QuantityKind): number {
  const result = parseQuantity(text, kind);
  if (!result.ok) throw new Error(`expected "${text}" to parse as ${kind}: ${result.error}`);
  return result.value;
}

function error(text: string, kind: QuantityKind): string {
  const result = parseQuantity(text, kind);
  if (result.ok) throw new Error(`expected "${text}" to be refused as ${kind}, got ${result.value}`);
  return result.error;
}

const relative = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe('parseQuantity', () => {
  // SI prefixes micro = 1e-6, kilo = 1e3, milli = 1e-3 (BIPM SI Brochure, 9th ed., Table 7 — from memory).
  it.each([
    ['4.7 uH', 'inductance', 4.7e-6],
    ['4.7µH', 'inductance', 4.7e-6],
    ['4.7 μH', 'inductance', 4.7e-6],
    ['250kHz', 'frequency', 250e3],
    ['1.5 MHz', 'frequency', 1.5e6],
    ['12 V', 'voltage', 12],
    ['350 mV', 'voltage', 0.35],
    ['12', 'voltage', 12],
    ['20 mA', 'current', 0.02],
    ['2.5 mΩ', 'resistance', 2.5e-3],
    ['10 mohm', 'resistance', 10e-3],
    ['300 mT', 'fluxDensity', 0.3],
    ['1.5 W', 'power', 1.5],
    ['0.5 mm', 'length', 0.5e-3],
  ] as const)('reads "%s" as %s %d (SI)', (text, kind, expected) => {
    expect(relative(value(text, kind), expected)).toBeLessThan(1e-12);
  });

  it('reads temperatures in °C whichever way the degree is typed', () => {
    expect(value('85 °C', 'temperature')).toBeCloseTo(85, 9);
    expect(value('85 degC', 'temperature')).toBeCloseTo(85, 9);
    expect(value('85', 'temperature')).toBe(85);
    // 0 °C = 273.15 K (BIPM SI Brochure, 9th ed., definition of the degree Celsius — from memory).
    expect(value('273.15 K', 'temperature')).toBeCloseTo(0, 9);
    // Fahrenheit: 212 °F = 100 °C (definition of the Fahrenheit scale — from memory).
    expect(value('212 degF', 'temperature')).toBeCloseTo(100, 9);
  });

  it('reads a temperature rise as a difference, not an absolute temperature', () => {
    expect(value('40 K', 'temperatureRise')).toBe(40);
    expect(value('40 degC', 'temperatureRise')).toBe(40);
    // A Fahrenheit degree is 5/9 of a kelvin (definition of the Fahrenheit scale — from memory).
    expect(value('72 degF', 'temperatureRise')).toBeCloseTo(40, 9);
  });

  it('reads ratios as plain numbers or percentages', () => {
    expect(value('0.3', 'ratio')).toBe(0.3);
    expect(value('30 %', 'ratio')).toBeCloseTo(0.3, 12);
    expect(value('30%', 'ratio')).toBeCloseTo(0.3, 12);
    expect(error('30 V', 'ratio')).toMatch(/plain number or a percentage/);
  });

  it('reads current density in A/mm² and takes a bare number as A/mm²', () => {
    // 1 A/mm² = 1e6 A/m² (mm² = 1e-6 m², SI prefix milli squared — from memory).
    expect(value('3 A/mm^2', 'currentDensity')).toBeCloseTo(3e6, 3);
    expect(value('3 A/mm²', 'currentDensity')).toBeCloseTo(3e6, 3);
    expect(value('4', 'currentDensity')).toBeCloseTo(4e6, 3);
    expect(value('4e6 A/m^2', 'currentDensity')).toBeCloseTo(4e6, 3);
  });

  it('refuses a quantity of the wrong kind and names what was expected', () => {
    expect(error('3 A', 'voltage')).toBe('Expected a voltage (V), not a current (A)');
    expect(error('12 V', 'current')).toBe('Expected a current (A), not a voltage (V)');
    expect(error('4.7 uH', 'frequency')).toMatch(/^Expected a frequency \(Hz\), not an inductance/);
  });

  it('refuses text that is not a quantity', () => {
    expect(error('', 'voltage')).toBe('Enter a value');
    expect(error('twelve volts', 'voltage')).toMatch(/not a number with a unit; expected a voltage/);
    expect(error('V', 'voltage')).toMatch(/Give a number/);
    expect(error('2.5', 'count')).toMatch(/whole number/);
  });
});

describe('formatQuantity', () => {
  it.each([
    [4.7e-6, 'inductance', '4.7 µH'],
    [250e3, 'frequency', '250 kHz'],
    [12, 'voltage', '12 V'],
    [0.35, 'voltage', '350 mV'],
    [2.5e-3, 'resistance', '2.5 mΩ'],
    [85, 'temperature', '85 °C'],
    [4e6, 'currentDensity', '4 A/mm²'],
    [0.3, 'ratio', '0.3'],
    [1.5e6, 'frequency', '1.5 MHz'],
    [0, 'current', '0 A'],
    [-0.012, 'current', '-12 mA'],
  ] as const)('shows %d as %s "%s"', (si, kind, text) => {
    expect(formatQuantity(si, kind)).toBe(text);
  });

  it('rounds to four significant digits by default and carries rounding into the next prefix', () => {
    expect(formatQuantity(26.6667e-6, 'inductance')).toBe('26.67 µH');
    expect(formatQuantity(999.99e3, 'frequency')).toBe('1 MHz');
  });
});

describe('round trips', () => {
  const kinds: QuantityKind[] = [
    'voltage',
    'current',
    'frequency',
    'inductance',
    'resistance',
    'power',
    'fluxDensity',
    'length',
    'currentDensity',
    'temperature',
    'temperatureRise',
    'ratio',
  ];

  it('parse(format(x)) returns x within the shown precision', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...kinds),
        fc.double({ min: 1e-12, max: 1e11, noNaN: true }),
        fc.boolean(),
        (kind, magnitude, negative) => {
          const x = negative ? -magnitude : magnitude;
          const text = formatQuantity(x, kind, 12);
          const back = parseQuantity(text, kind);
          expect(back.ok, text).toBe(true);
          if (back.ok) expect(relative(back.value, x)).toBeLessThan(1e-9);
        },
      ),
      { numRuns: 400 },
    );
  });

  it('format(parse(text)) is stable: formatting a parsed value and parsing again changes nothing', () => {
    fc.assert(
      fc.property(fc.constantFrom(...kinds), fc.double({ min: 1e-9, max: 1e9, noNaN: true }), (kind, x) => {
        const once = formatQuantity(x, kind);
        const parsed = parseQuantity(once, kind);
        expect(parsed.ok).toBe(true);
        if (parsed.ok) expect(formatQuantity(parsed.value, kind)).toBe(once);
      }),
      { numRuns: 300 },
    );
  });
});

describe('prefix shorthand', () => {
  // The letter of an SI prefix standing for the decimal point ("4u7" = 4.7 µ) is the resistor-code style of IEC 60062
  // (from memory); the field's own unit is implied.
  it.each([
    ['400k', 'frequency', 400e3],
    ['400 k', 'frequency', 400e3],
    ['4u7', 'inductance', 4.7e-6],
    ['2k2', 'resistance', 2200],
    ['1M5', 'frequency', 1.5e6],
    ['470n', 'inductance', 470e-9],
    ['15m', 'resistance', 15e-3],
  ] as const)('reads "%s" in a %s field', (text, kind, expected) => {
    expect(relative(value(text, kind), expected)).toBeLessThan(1e-12);
  });

  it('leaves "5m" in a length field to mean metres, and refuses a shorthand in fields without prefixes', () => {
    expect(value('5m', 'length')).toBe(5);
    expect(error('400k', 'temperature')).toMatch(/not a number with a unit|Expected/);
    expect(error('4u7.1', 'inductance')).toMatch(/not a number with a unit|Expected/);
  });
});
