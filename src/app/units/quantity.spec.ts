import { TestBed } from '@angular/core/testing';
import { describe, expect, it } from 'vitest';

import { QuantityPipe } from './quantity';

// Prefix sizes: milli 10⁻³, micro 10⁻⁶, kilo 10³ (BIPM SI Brochure, 9th ed., Table 7 — from memory).
describe('QuantityPipe', () => {
  const pipe = () => TestBed.runInInjectionContext(() => new QuantityPipe());

  it('shows a quantity kind with an engineering prefix', () => {
    expect(pipe().transform(4.7e-6, 'inductance')).toBe('4.7 µH');
    expect(pipe().transform(250e3, 'frequency')).toBe('250 kHz');
    expect(pipe().transform(0.123456, 'fluxDensity', 3)).toBe('123 mT');
  });

  it('keeps a display unit, with digits as the number pipe takes them', () => {
    expect(pipe().transform(0.2, 'mT', '1.0-1')).toBe('200 mT');
    expect(pipe().transform(1.5e6, 'kHz', '1.0-1')).toBe('1,500 kHz');
    expect(pipe().transform(0.0011, 'mm', '1.2-2')).toBe('1.10 mm');
    expect(pipe().transform(1.7e-5, 'cm³', 4)).toBe('17 cm³');
  });

  it('leaves the unit off for a column that names it, and shows a dash for a missing value', () => {
    expect(pipe().transform(1.52e-4, 'mm²', '1.1-1', 'bare')).toBe('152.0');
    expect(pipe().transform(100e3, 'kHz', 4, 'bare')).toBe('100');
    expect(pipe().transform(null, 'cm³', '1.2-2')).toBe('—');
    expect(pipe().transform(undefined, 'mm', '1.2-2', 'bare')).toBe('—');
  });
});
