import { describe, expect, it } from 'vitest';
import { ringEffectiveParameters } from '@shared/catalogue/iec60205';
import { ringCoreShape } from '@shared/catalogue/ring-core';
import { expectWithin } from './within';

const mm = (value: number) => value * 1e-3;
const ring = (od: number, id: number, h: number) =>
  ringEffectiveParameters({ outerDiameter: mm(od), innerDiameter: mm(id), height: mm(h) });

// Check values: computed [C] by hand from the IEC 60205 sharp-edged ring formulas (C1 = 2π/(h·ln(r2/r1)),
// C2 = 2π·(1/r1 − 1/r2)/(h²·ln³(r2/r1)), le = C1²/C2, Ae = C1/C2, Ve = C1³/C2²; formulas from memory).
// Tolerance 0.05 %: the check values are rounded to four significant figures.
const TOLERANCE = 5e-4;

describe('IEC 60205 effective parameters of a rectangular-section ring', () => {
  it.each([
    // [C]: 20/10/7 → le 43.55 mm, Ae 33.63 mm², Ve 1465 mm³
    [20, 10, 7, 43.55, 33.63, 1465],
    // [C]: 25/15/10 → le 60.18 mm, Ae 48.93 mm², Ve 2944 mm³
    [25, 15, 10, 60.18, 48.93, 2944],
    // [C]: 26.9/14.7/11.2 (typical powder size) → le 61.53 mm, Ae 66.28 mm², Ve 4078 mm³
    [26.9, 14.7, 11.2, 61.53, 66.28, 4078],
    // [C]: 40/24/16 → le 96.29 mm, Ae 125.25 mm², Ve 12060 mm³
    [40, 24, 16, 96.29, 125.25, 12060],
  ])('%s/%s/%s mm gives le %s mm, Ae %s mm², Ve %s mm³', (od, id, h, le, ae, ve) => {
    const result = ring(od, id, h);

    expectWithin(result.le, mm(le), TOLERANCE);
    expectWithin(result.ae, ae * 1e-6, TOLERANCE);
    expectWithin(result.ve, ve * 1e-9, TOLERANCE);
  });

  it('agrees with the commonly published R20/10/7 and R25/15/10 values', () => {
    const r20 = ring(20, 10, 7);
    const r25 = ring(25, 15, 10);

    // Commonly published ferrite ring values, from memory (no single source): R20/10/7 ≈ 43.6 mm / 33.6 mm²
    expectWithin(r20.le, mm(43.6), 0.005);
    expectWithin(r20.ae, 33.6e-6, 0.005);
    // from memory (no single source): R25/15/10 ≈ 60.2 mm / 48.9 mm²
    expectWithin(r25.le, mm(60.2), 0.005);
    expectWithin(r25.ae, 48.9e-6, 0.005);
  });

  it('keeps the core constants consistent: C1 = le/Ae and Ve = Ae·le', () => {
    const result = ring(40, 24, 16);

    expectWithin(result.c1, result.le / result.ae, 1e-12);
    expectWithin(result.ve, result.ae * result.le, 1e-12);
  });

  it('tends to the thin-ring limit le = π·(OD+ID)/2, Ae = h·(OD−ID)/2', () => {
    // A thin ring is a straight bar bent round: the mean circumference and the plain section (geometry, no source needed).
    const result = ring(100.2, 99.8, 5);

    expectWithin(result.le, mm(Math.PI * 100), 1e-5);
    expectWithin(result.ae, mm(5) * mm(0.2), 1e-5);
  });

  it('rejects an inner diameter that is not smaller than the outer diameter', () => {
    expect(() => ring(10, 10, 5)).toThrow(RangeError);
    expect(() => ring(10, 12, 5)).toThrow(/0 < ID < OD/);
  });
});

describe('ring core shape', () => {
  const core = ringCoreShape({
    id: 'R25/15/10',
    family: 'RING',
    dimensions: { outerDiameter: mm(25), innerDiameter: mm(15), height: mm(10) },
    source: 'test',
  });

  it('follows the CoreShape conventions for rings: window π·ID²/4, width π·ID, build ID/2, height h', () => {
    // Window 176.7 mm² for ID 15 mm: computed [C] from π·ID²/4
    expectWithin(core.windowArea, 176.7e-6, 5e-4);
    expectWithin(core.bobbinWidth, Math.PI * mm(15), 1e-12);
    expectWithin(core.bobbinHeight, mm(7.5), 1e-12);
    expectWithin(core.windowHeight, mm(10), 1e-12);
    expect(core.gapKind).toBe('distributed');
  });

  it('gives a mean turn a little longer than the bare section perimeter (OD − ID) + 2h', () => {
    const barePerimeter = mm(25 - 15) + 2 * mm(10);

    expect(core.mlt).toBeGreaterThan(barePerimeter);
    expect(core.mlt).toBeLessThan(1.3 * barePerimeter);
  });
});
