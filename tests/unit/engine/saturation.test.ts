import { describe, expect, it } from 'vitest';
import { fluxDensity, saturationFlux, saturationMargin } from '@shared/engine/saturation';
import { THERMAL_MODEL_LIMIT } from '@shared/engine/thermal';
import { ferriteA } from './fixtures';

describe('saturation check', () => {
  it('interpolates Bsat linearly through the 25 °C and 100 °C values and extrapolates beyond', () => {
    expect(saturationFlux(ferriteA, 25)).toBeCloseTo(0.5, 12);
    expect(saturationFlux(ferriteA, 100)).toBeCloseTo(0.39, 12);
    expect(saturationFlux(ferriteA, 62.5)).toBeCloseTo(0.445, 12);
    expect(saturationFlux(ferriteA, 130)).toBeCloseTo(0.39 - 0.11 * (30 / 75), 12);
  });

  it('gives Bpk = L·Ipk/(N·Ae) = 0.2871 T for the worked buck example with 11 turns on Ae 97.1 mm² (flux linkage N·Φ = L·I, computed)', () => {
    expect(fluxDensity(8e-5 / 3, 11.5, 11, 97.1e-6)).toBeCloseTo(0.2871, 4);
  });

  it('reads Bsat at most at the 250 °C model limit and never below zero (the limit: common practice, no source)', () => {
    const at250 = 0.5 - 0.11 * ((THERMAL_MODEL_LIMIT - 25) / 75);
    expect(saturationFlux(ferriteA, THERMAL_MODEL_LIMIT)).toBeCloseTo(at250, 12);
    expect(saturationFlux(ferriteA, 400)).toBe(saturationFlux(ferriteA, THERMAL_MODEL_LIMIT));
    // A steep invented fall reaches zero before the limit: Bsat stays at 0, not negative.
    const steep = { ...ferriteA, bsat25: 0.4, bsat100: 0.1 };
    expect(saturationFlux(steep, 200)).toBe(0);
  });

  it('takes the margin as 1 − Bpk/Bsat(T) and −1 when no Bsat is left (the 20 % limit: common practice, no source)', () => {
    // Bsat(100 °C) = 0.39 T: 0.31 T leaves 20.5 %, 0.32 T leaves 17.9 %
    const bsat = saturationFlux(ferriteA, 100);
    expect(saturationMargin(0.31, bsat)).toBeGreaterThanOrEqual(0.2);
    expect(saturationMargin(0.32, bsat)).toBeLessThan(0.2);
    expect(saturationMargin(0.32, bsat)).toBeCloseTo(1 - 0.32 / 0.39, 12);
    expect(saturationMargin(0.1, 0)).toBe(-1);
  });
});
