import { describe, expect, it } from 'vitest';
import { CORE_CSV_COLUMNS, KIND_COLUMNS, REQUIRED_CORE_COLUMNS, validateCoreCells } from '@shared/schemas/core-csv';
import { userCoreShape } from '@shared/schemas/user-core-shape';
import { CORE_TEMPLATE_ROWS } from '../../../server/catalogue/core-template.ts';
import { expectWithin } from './within';

// The template's two invented rows (no maker's part) with names and sources of their own; the ring leaves the
// shape columns out instead of empty, as a file of rings only may.
const filledCells = (row: Record<string, string>) => Object.fromEntries(Object.entries(row).filter(([, cell]) => cell !== ''));
const RING = { ...filledCells(CORE_TEMPLATE_ROWS[0]!), name: 'Unit ring', source: 'invented unit-test ring' };
const SET = { ...CORE_TEMPLATE_ROWS[1]!, name: 'Unit E set', source: 'invented unit-test set' };

const problemsByColumn = (cells: Record<string, string>) =>
  Object.fromEntries(validateCoreCells(cells).problems.map((p) => [p.column, p.message]));

describe('the core CSV columns', () => {
  it('gives every dimension column to exactly one kind', () => {
    const dimensions = CORE_CSV_COLUMNS.filter((c) => !REQUIRED_CORE_COLUMNS.includes(c));
    expect([...KIND_COLUMNS.ring, ...KIND_COLUMNS.shape].sort()).toEqual([...dimensions].sort());
  });
});

describe('a ring row', () => {
  it('becomes the request POST /cores takes, in metres (1 mm = 1e-3 m, SI prefix)', () => {
    const { values, problems } = validateCoreCells(RING);

    expect(problems).toEqual([]);
    expect(values).toEqual({
      kind: 'ring',
      name: 'Unit ring',
      family: 'RING',
      outerDiameter: 0.02,
      innerDiameter: 0.01,
      height: 0.007,
      source: 'invented unit-test ring',
    });
  });

  it('gives the IEC 60205 effective parameters of 20/10/7 mm', () => {
    const { od_mm, id_mm, height_mm } = CORE_TEMPLATE_ROWS[0]!;
    expect([od_mm, id_mm, height_mm]).toEqual(['20', '10', '7']);
    const shape = userCoreShape(validateCoreCells(RING).values!);

    // Computed [C] from the IEC 60205 sharp-edged ring formulas (from memory): 20/10/7 → le 43.55 mm, Ae 33.63 mm², Ve 1465 mm³ (four significant figures)
    expectWithin(shape.le, 43.55e-3, 5e-4);
    expectWithin(shape.ae, 33.63e-6, 5e-4);
    expectWithin(shape.ve, 1465e-9, 5e-4);
    expect(shape.source).toMatch(/^computed by IEC 60205 from nominal dimensions; invented unit-test ring$/);
  });

  it('may leave its source empty and the shape columns out', () => {
    expect(validateCoreCells({ ...RING, source: '' }).problems).toEqual([]);
  });

  it('names the column of each problem, in column order', () => {
    const { values, problems } = validateCoreCells({ ...RING, od_mm: 'wide', height_mm: '-7', id_mm: '', le_mm: '43' });

    expect(values).toBeUndefined();
    expect(problems).toEqual([
      { column: 'od_mm', message: 'od_mm "wide" is not a number' },
      { column: 'id_mm', message: 'id_mm is required for a ring core' },
      { column: 'height_mm', message: 'height_mm must be greater than 0 (got -7)' },
      { column: 'le_mm', message: 'le_mm must be empty for a ring core (it uses od_mm, id_mm, height_mm)' },
    ]);
  });

  it('reports the request schema in column names and mm', () => {
    expect(problemsByColumn({ ...RING, od_mm: '8' })).toEqual({ id_mm: 'id_mm must be smaller than od_mm' });
    expect(problemsByColumn({ ...RING, od_mm: '600' })).toEqual({ od_mm: 'od_mm must be at most 500 mm' });
    expect(problemsByColumn({ ...RING, family: 'ETD' })).toEqual({ family: 'family must be RING or POWDER_TOROID' });
  });

  it('hints at a decimal comma and refuses infinite numbers', () => {
    expect(problemsByColumn({ ...RING, od_mm: '20,5' })['od_mm']).toMatch(/use a point as the decimal separator/);
    expect(problemsByColumn({ ...RING, od_mm: '1e999' })['od_mm']).toBe('od_mm must be a finite number');
  });
});

describe('a shape row', () => {
  it('converts mm², mm and mm³ to SI (SI prefixes) and keeps Amin optional', () => {
    const { values, problems } = validateCoreCells(SET);

    expect(problems).toEqual([]);
    expect(values).toMatchObject({ kind: 'shape', family: 'E', source: 'invented unit-test set' });
    const v = values as Extract<typeof values, { kind: 'shape' }>;
    expectWithin(v.ae, 80e-6, 1e-12);
    expectWithin(v.amin!, 75e-6, 1e-12);
    expectWithin(v.le, 70e-3, 1e-12);
    expectWithin(v.ve, 5600e-9, 1e-12);
    expectWithin(v.windowArea, 120e-6, 1e-12);
    expectWithin(v.surfaceArea, 2800e-6, 1e-12);
    expect(validateCoreCells({ ...SET, amin_mm2: '' }).values).not.toHaveProperty('amin');
  });

  it('needs a source and every effective parameter but Amin', () => {
    expect(problemsByColumn({ ...SET, source: '', mlt_mm: '' })).toEqual({
      mlt_mm: 'mlt_mm is required for a shape core',
      source: 'source must say where the numbers come from',
    });
  });

  it('runs the shared core consistency checks under the column names', () => {
    // Ve = Ae·le = 80 mm² × 70 mm = 5600 mm³; 9000 mm³ is 60.7 % off (the shared schema allows 5 %)
    expect(problemsByColumn({ ...SET, ve_mm3: '9000' })).toEqual({
      ve_mm3: 've_mm3: Ve differs from Ae·le by 60.7 % (at most 5 % allowed)',
    });
    expect(problemsByColumn({ ...SET, amin_mm2: '90' })).toEqual({ amin_mm2: 'amin_mm2: Amin must not exceed Ae' });
    expect(problemsByColumn({ ...SET, bobbin_width_mm: '25' })['bobbin_width_mm']).toMatch(/cannot exceed the window height/);
  });
});

describe('every row', () => {
  it('has a kind of "ring" or "shape"', () => {
    expect(problemsByColumn({ ...RING, kind: 'toroid' })).toEqual({ kind: 'kind must be "ring" or "shape"' });
  });

  it('refuses formula-like and control-character text', () => {
    expect(problemsByColumn({ ...RING, name: '@SUM(A1)' })['name']).toMatch(/formula/);
    expect(problemsByColumn({ ...SET, source: '=1+1' })['source']).toMatch(/formula/);
    expect(problemsByColumn({ ...RING, name: 'bell\u0007ring' })['name']).toMatch(/control characters/);
  });
});
