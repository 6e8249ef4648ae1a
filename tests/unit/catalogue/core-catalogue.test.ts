import { describe, expect, it } from 'vitest';
import type { CoreShape } from '@shared/engine/types';
import { coreShapeSchema, isRingFamily } from '@shared/catalogue/core-schema';
import { loadCoreCatalogue } from '@core-data/catalogue';
import { expectWithin } from './within';

const MM = 1e-3;
const MM2 = 1e-6;
const MM3 = 1e-9;
const CM4 = 1e-8;

const catalogue = loadCoreCatalogue();
const core = (id: string): CoreShape => {
  const found = catalogue.find((candidate) => candidate.id === id);
  if (!found) throw new Error(`${id} is not in the catalogue`);
  return found;
};

describe('shipped core catalogue', () => {
  it('holds at least 60 cores in at least 6 families with unique ids', () => {
    const ids = catalogue.map((shape) => shape.id);

    expect(catalogue.length).toBeGreaterThanOrEqual(60);
    expect(new Set(catalogue.map((shape) => shape.family)).size).toBeGreaterThanOrEqual(6);
    expect(new Set(ids).size).toBe(ids.length);
  });

  it('passes the shared core schema on every row', () => {
    for (const shape of catalogue) {
      const result = coreShapeSchema.safeParse(shape);
      expect(result.success, `${shape.id}: ${result.error?.message}`).toBe(true);
    }
  });

  it('has Ve within 5 % of Ae·le on every row', () => {
    for (const shape of catalogue) expectWithin(shape.ve, shape.ae * shape.le, 0.05);
  });

  it('marks ring cores as distributed-gap and every set of halves as air-gapped', () => {
    for (const shape of catalogue) {
      expect(shape.gapKind, shape.id).toBe(isRingFamily(shape.family) ? 'distributed' : 'air-gap');
    }
  });

  it('says where every row comes from, and says so when winding space was estimated', () => {
    for (const shape of catalogue) {
      expect(shape.source, shape.id).toMatch(/IEC 61185|IEC 63093|IEC 60205|from memory/);
      expect(shape.source, shape.id).toMatch(/estimated from nominal outline dimensions/);
    }
  });

  it('returns the same records on a second call without reading the tables again', () => {
    const again = loadCoreCatalogue();

    expect(again).toHaveLength(catalogue.length);
    expect(again[0]).toBe(catalogue[0]);
  });
});

describe('ETD rows carry the recalled nominal values', () => {
  it.each([
    // IEC 61185 nominal, from memory: Ae mm², Amin mm², le mm, Ve mm³, window per side mm²
    ['ETD29/16/10', 76.0, 71.0, 72.0, 5470, 134],
    ['ETD34/17/11', 97.1, 91.6, 78.6, 7640, 175],
    ['ETD39/20/13', 125, 123, 92.2, 11500, 234],
    ['ETD44/22/15', 173, 172, 103, 17800, 279],
    ['ETD49/25/16', 211, 209, 114, 24000, 343],
  ])('%s: Ae %s, Amin %s, le %s, Ve %s, window ≈ %s', (id, ae, amin, le, ve, window) => {
    const shape = core(id);

    expectWithin(shape.ae, ae * MM2, 1e-9);
    expectWithin(shape.amin!, amin * MM2, 1e-9);
    expectWithin(shape.le, le * MM, 1e-9);
    expectWithin(shape.ve, ve * MM3, 1e-9);
    expectWithin(shape.windowArea, window * MM2, 0.01);
    expect(shape.family).toBe('ETD');
  });

  it('estimates the ETD34 bobbin at about 21 mm × 6 mm', () => {
    // From memory / common practice, no source (estimate): ETD34 bobbin ≈ 21 mm wide × 6 mm build
    const shape = core('ETD34/17/11');

    expect(Math.abs(shape.bobbinWidth - 21 * MM)).toBeLessThan(0.5 * MM);
    expect(Math.abs(shape.bobbinHeight - 6 * MM)).toBeLessThan(0.5 * MM);
  });
});

describe('E rows carry the recalled nominal values', () => {
  it.each([
    // IEC 63093-8 nominal, from memory: Ae mm², le mm, Ve mm³, window per side mm²
    ['E25/13/7', 52.5, 57.5, 3020, 87],
    ['E32/16/9', 83, 74, 6140, 148],
    ['E42/21/15', 178, 97, 17300, 256],
    ['E55/28/21', 353, 124, 43700, 376],
  ])('%s: Ae %s, le %s, Ve %s, window ≈ %s', (id, ae, le, ve, window) => {
    const shape = core(id);

    expectWithin(shape.ae, ae * MM2, 1e-9);
    expectWithin(shape.le, le * MM, 1e-9);
    expectWithin(shape.ve, ve * MM3, 1e-9);
    expectWithin(shape.windowArea, window * MM2, 0.01);
  });
});

describe('ring rows follow IEC 60205', () => {
  it.each([
    // IEC 60205 sharp-edged ring formulas (from memory), values computed [C]: le mm, Ae mm², Ve mm³, window mm²
    ['R20/10/7', 43.55, 33.63, 1465, 78.5],
    ['R25/15/10', 60.18, 48.93, 2944, 176.7],
    ['T26.9/14.7/11.2', 61.53, 66.28, 4078, 169.7],
    ['R40/24/16', 96.29, 125.25, 12060, 452.4],
  ])('%s: le %s, Ae %s, Ve %s, window %s', (id, le, ae, ve, window) => {
    const shape = core(id);

    expectWithin(shape.le, le * MM, 5e-4);
    expectWithin(shape.ae, ae * MM2, 5e-4);
    expectWithin(shape.ve, ve * MM3, 5e-4);
    // The check value rounds the window π·ID²/4 to one decimal (78.5 mm² for 78.54 mm²).
    expectWithin(shape.windowArea, window * MM2, 1e-3);
  });

  it('includes the common powder-toroid sizes as distributed-gap cores', () => {
    for (const id of ['T17.3/9.65/6.35', 'T23.6/14.4/8.89', 'T33.0/19.9/10.7', 'T46.7/24.1/18.0']) {
      expect(core(id)).toMatchObject({ family: 'POWDER_TOROID', gapKind: 'distributed' });
    }
  });
});

describe('area product Ap = Wa·Ae', () => {
  it.each([
    // Ap = Wa·Ae computed [C] from the recalled nominal data above (IEC 61185 / IEC 63093-8, from memory): ETD34 ≈ 1.7 cm⁴, E25/13/7 ≈ 0.46 cm⁴, E32/16/9 ≈ 1.2 cm⁴, ETD29 ≈ 1.0 cm⁴
    ['ETD34/17/11', 1.7],
    ['E25/13/7', 0.46],
    ['E32/16/9', 1.2],
    ['ETD29/16/10', 1.0],
  ])('of %s is about %s cm⁴', (id, areaProductCm4) => {
    const shape = core(id);

    expectWithin(shape.windowArea * shape.ae, areaProductCm4 * CM4, 0.03);
  });
});
