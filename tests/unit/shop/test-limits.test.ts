import { describe, expect, it } from 'vitest';
import { bobbinPinCount, LEAD_LENGTH } from '@shared/shop/build-practice';
import { biasTest, inductanceTest, resistanceLimit } from '@shared/shop/test-limits';

// Copper resistivity 1.7241e-8 Ω·m at 20 °C: IEC 60028 (the International Annealed Copper Standard).
const RHO20 = 1.7241e-8;
const area1mm = (Math.PI / 4) * 1e-6; // one 1.0 mm wire, m²

describe('the DC resistance limit at the pins', () => {
  it('adds both leads of seven 1.0 mm wires in hand: 2 × 50 mm × ρ20 / (7 × π/4 mm²) ≈ 0.31 mΩ', () => {
    const limit = resistanceLimit(0.44e-3, 7 * area1mm);
    expect(LEAD_LENGTH).toBe(0.05);
    // Hand figure: 2 × 0.05 m × 1.7241e-8 Ω·m / 5.498e-6 m² = 0.3136 mΩ.
    expect(limit.leads).toBeCloseTo((2 * 0.05 * RHO20) / (7 * area1mm), 12);
    expect(limit.leads * 1e3).toBeCloseTo(0.3136, 3);
  });

  it('adds two joints (0.1 mΩ each, common practice, no source) and 10 % on the sum, and asks for four-wire below 10 mΩ', () => {
    const limit = resistanceLimit(0.44e-3, 7 * area1mm);
    expect(limit.terminations).toBeCloseTo(0.2e-3, 12);
    // (0.44 + 0.3136 + 0.2) mΩ × 1.1 = 1.049 mΩ: a good unit measured at its pins (0.75 mΩ) passes; the old 0.484 mΩ failed it.
    expect(limit.max * 1e3).toBeCloseTo((0.44 + 0.3136 + 0.2) * 1.1, 3);
    expect(0.44e-3 + limit.leads).toBeLessThan(limit.max);
    expect(limit.fourWire).toBe(true);
  });

  it('leaves a two-wire reading where the limit is 10 mΩ or more', () => {
    expect(resistanceLimit(20e-3, 0.3e-6).fourWire).toBe(false);
  });
});

describe('the inductance test', () => {
  const part = { switchingFrequency: 500e3, turns: 4, ae: 40e-6, ripplePeakFlux: 0.05 };

  it('names the reactance a 2 µH part has at 10 kHz (2π · 10 kHz · 2 µH = 0.126 Ω) too small and goes to 100 kHz', () => {
    expect(2 * Math.PI * 10e3 * 2e-6).toBeCloseTo(0.1257, 4);
    const t = inductanceTest({ ...part, inductance: 2e-6 });
    expect(t.frequency).toBe(100e3);
    // 2π · 100 kHz · 2 µH = 1.257 Ω; the meter must resolve 1 % of it.
    expect(t.reactance).toBeCloseTo(1.2566, 4);
    expect(t.resolution).toBeCloseTo(0.012566, 6);
  });

  it('stays at the lowest frequency that gives 1 Ω: 22 µH at 10 kHz (1.38 Ω), not 1 kHz (0.138 Ω)', () => {
    expect(inductanceTest({ ...part, inductance: 22e-6 }).frequency).toBe(10e3);
    expect(inductanceTest({ ...part, inductance: 200e-6 }).frequency).toBe(1e3);
  });

  it('keeps the test at most half the switching frequency: a 150 kHz converter is tested at 10 kHz even where X < 1 Ω', () => {
    const t = inductanceTest({ ...part, switchingFrequency: 150e3, inductance: 2e-6 });
    expect(t.frequency).toBe(10e3);
    expect(t.reactance).toBeLessThan(1);
  });

  it('picks the largest level whose flux V·√2/(2πf·N·Ae) stays under 10 % of the ripple peak flux', () => {
    const t = inductanceTest({ ...part, inductance: 2e-6 });
    // At 100 kHz, N = 4, Ae = 40 mm²: 1 V gives √2/(2π·1e5·4·40e-6) = 14.07 mT; the limit is 5 mT → 0.2 V (2.81 mT).
    expect(t.level).toBe(0.2);
    expect(t.flux).toBeCloseTo((0.2 * Math.SQRT2) / (2 * Math.PI * 100e3 * 4 * 40e-6), 9);
    expect(t.flux).toBeLessThanOrEqual(0.1 * part.ripplePeakFlux);
  });
});

describe('the inductance-under-DC-bias test', () => {
  it('is asked for where less than 40 % margin is left below Bsat, at the check current, ≥ (1 − tol) × predicted', () => {
    const t = biasTest({ nominal: 10e-6, atCheckCurrent: 10e-6, checkCurrent: 11, saturationMargin: 0.3, tolerance: 0.1 });
    expect(t?.current).toBe(11);
    expect(t?.predicted).toBe(10e-6);
    expect(t?.min).toBeCloseTo(9e-6, 12);
    expect(t?.fractionOfNominal).toBeCloseTo(0.9, 9);
  });

  it('follows a powder roll-off: L at 20 A is 70 % of nominal → at least 63 % of nominal', () => {
    const t = biasTest({ nominal: 10e-6, atCheckCurrent: 7e-6, checkCurrent: 20, saturationMargin: 0.8, tolerance: 0.1 });
    expect(t?.min).toBeCloseTo(6.3e-6, 12);
    expect(t?.fractionOfNominal).toBeCloseTo(0.63, 9);
  });

  it('is left out with a wide margin and no roll-off', () => {
    expect(biasTest({ nominal: 10e-6, atCheckCurrent: 10e-6, checkCurrent: 11, saturationMargin: 0.45, tolerance: 0.1 })).toBeNull();
  });
});

describe('bobbin pin counts (an estimate by family and size, common practice, no source)', () => {
  it('reads the size from the designation and gives rings no pins', () => {
    expect(bobbinPinCount('PQ', 'PQ20/16')).toBe(10);
    expect(bobbinPinCount('RM', 'RM4')).toBe(6);
    expect(bobbinPinCount('ETD', 'ETD49/25/16')).toBe(20);
    expect(bobbinPinCount('RING', 'R10/6/4')).toBe(0);
  });
});
