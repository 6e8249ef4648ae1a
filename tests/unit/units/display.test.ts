import { describe, expect, it } from 'vitest';

import { axisFor, axisIn, formatIn, fromDisplay, isDisplayUnit, toDisplay } from '@shared/units/display';

// Prefix sizes: milli 10⁻³, micro 10⁻⁶, kilo 10³ (BIPM SI Brochure, 9th ed., Table 7 — from memory).
describe('display units', () => {
  it('shows SI values in a fixed unit and reads them back', () => {
    expect(toDisplay(0.0125, 'mm')).toBe(12.5);
    expect(fromDisplay(12.5, 'mm')).toBe(0.0125);
    expect(toDisplay(250e3, 'kHz')).toBe(250);
    expect(fromDisplay(100, 'kHz')).toBe(100e3);
    expect(toDisplay(0.2, 'mT')).toBe(200);
    expect(fromDisplay(200, 'mT')).toBe(0.2);
    expect(toDisplay(1.52e-4, 'mm²')).toBeCloseTo(152, 10);
    expect(toDisplay(2.64e-9, 'cm⁴')).toBeCloseTo(0.264, 12);
    expect(fromDisplay(8000, 'mm³')).toBeCloseTo(8e-6, 18);
    // The kilogram is the SI unit of mass, the gram 10⁻³ of it (BIPM SI Brochure, 9th ed. — from memory).
    expect(toDisplay(0.0261, 'g')).toBe(26.1);
    expect(toDisplay(0.0261, 'kg')).toBe(0.0261);
  });

  it('reads a typed number in mm as the exact decimal in metres', () => {
    // 7 × 1e-3 is 0.007000000000000001 in binary floating point; 7 / 1000 is 0.007.
    expect(fromDisplay(7, 'mm')).toBe(0.007);
    expect(fromDisplay(31.4, 'mm')).toBe(0.0314);
  });

  it('formats in a unit with trailing zeros dropped', () => {
    expect(formatIn(1.524e-4, 'mm²')).toBe('152.4 mm²');
    expect(formatIn(1.7e-5, 'cm³')).toBe('17 cm³');
    expect(formatIn(Number.NaN, 'cm³')).toBe('');
  });

  it('knows its units', () => {
    expect(isDisplayUnit('kHz')).toBe(true);
    expect(isDisplayUnit('frequency')).toBe(false);
    expect(isDisplayUnit('toString')).toBe(false);
  });
});

describe('chart axes', () => {
  it('keeps a fixed axis in its unit', () => {
    const axis = axisIn('kHz');
    expect(axis.unit).toBe('kHz');
    expect(axis.toAxis(20e3)).toBe(20);
  });

  it('chooses one prefix per axis from the largest value', () => {
    const micro = axisFor('s', [0, 4e-6, 10e-6, 20e-6]);
    expect(micro.unit).toBe('µs');
    expect(micro.toAxis(20e-6)).toBeCloseTo(20, 10);
    expect(micro.toAxis(4e-6)).toBeCloseTo(4, 10);
    const nano = axisFor('s', [0, 400e-9]);
    expect(nano.unit).toBe('ns');
    expect(nano.toAxis(400e-9)).toBeCloseTo(400, 10);
    expect(axisFor('Hz', [1e3, 2e6]).unit).toBe('MHz');
    expect(axisFor('A', []).unit).toBe('A');
  });
});
