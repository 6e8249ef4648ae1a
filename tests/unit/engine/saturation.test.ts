import { describe, expect, it } from 'vitest';
import { fluxDensity, saturationCheck, saturationFlux } from '@shared/engine/saturation';
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

  it('requires the margin 1 − Bpk/Bsat(T) to reach the limit (default 20 %, common practice, no source)', () => {
    // Bsat(100 °C) = 0.39 T: 0.31 T leaves 20.5 %, 0.32 T leaves 17.9 %
    expect(saturationCheck(ferriteA, 0.31, 100).ok).toBe(true);
    const tight = saturationCheck(ferriteA, 0.32, 100);
    expect(tight.ok).toBe(false);
    expect(tight.margin).toBeCloseTo(1 - 0.32 / 0.39, 12);
  });
});
