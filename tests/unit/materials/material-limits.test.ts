import { describe, expect, it } from 'vitest';
import { evaluateDesign } from '@shared/engine/evaluate';
import { emptyWoundCoreLoss, solveTemperature } from '@shared/engine/thermal';
import type { CoreMaterial } from '@shared/engine/types';
import { materialCellsFromValues, validateMaterialCells, type MaterialValues } from '@shared/schemas/materials';
import { toCoreMaterial } from '../../../server/materials/material-view.ts';
import type { MaterialRow } from '../../../server/materials/materials.repository.ts';
import { powderP, powderRing, roundWire, sectionOneSpec } from '../engine/fixtures';

// An invented powder in SI cells with the numbers of the engine fixture powderP (no real material).
const POWDER_CELLS = {
  name: 'Unit powder (invented)',
  family: 'powder',
  unit_set: 'W/m3-Hz-T',
  k: '60',
  alpha: '1.3',
  beta: '2.2',
  f_min: '10000',
  f_max: '500000',
  b_min: '0.005',
  b_max: '0.4',
  bsat_25: '1',
  bsat_100: '0.95',
  mu_i: '60',
  rolloff_a: '1',
  rolloff_b: String(Math.pow(8000, -1.3)),
  rolloff_c: '1.3',
  density: '7000',
  provenance: 'Invented unit-test row',
};

/** A stored version of some values, as the repository would read it back. */
function storedRow(values: MaterialValues): MaterialRow {
  return {
    ...values,
    id: 7,
    lineage: 'unit-powder',
    version: 1,
    current: true,
    retired: false,
    importId: null,
    createdBy: null,
    createdAt: new Date('2026-03-01T10:00:00Z'),
  };
}

function loaded(cells: Record<string, string>): CoreMaterial {
  const { values, problems } = validateMaterialCells(cells);
  expect(problems).toEqual([]);
  return toCoreMaterial(storedRow(values!));
}

const problemsOf = (cells: Record<string, string>) =>
  Object.fromEntries(validateMaterialCells(cells).problems.map((p) => [p.column, p.message]));

describe('max_temperature', () => {
  it('is optional, kept as stored and written back into the same cell', () => {
    const { values } = validateMaterialCells({ ...POWDER_CELLS, max_temperature: '155' });
    expect(values!.maxTemperature).toBe(155);
    expect(materialCellsFromValues(values!).max_temperature).toBe('155');
    expect(validateMaterialCells(POWDER_CELLS).values!.maxTemperature).toBeNull();
  });

  it('must lie between 50 and 400 °C', () => {
    expect(problemsOf({ ...POWDER_CELLS, max_temperature: '40' })['max_temperature']).toMatch(
      /^max_temperature must be between 50 and 400 \(got 40\)/,
    );
    expect(problemsOf({ ...POWDER_CELLS, max_temperature: '450' })['max_temperature']).toMatch(/between 50 and 400/);
  });
});

// The factor ct2·T² − ct1·T + ct0 is a parabola; its lowest value on a range is at an end or at the vertex ct1/(2·ct2)
// (calculus, no source needed). All coefficients below are invented.
describe('a temperature factor that is not positive somewhere in the range', () => {
  it('is refused naming the coefficient, the temperature and the value', () => {
    // 2e-4·T² − 0.04·T + 1.5: vertex at 100 °C, value 1.5 − 2 = −0.5; there −ct1·T = −4 pulls it down most.
    const problems = problemsOf({ ...POWDER_CELLS, ct0: '1.5', ct1: '0.04', ct2: '0.0002' });
    expect(Object.keys(problems)).toEqual(['ct1']);
    expect(problems['ct1']).toBe(
      'ct1 makes the temperature factor ct2·T² − ct1·T + ct0 -0.500 at 100 °C; it must stay above 0 from -40 to 200 °C (up to the default without max_temperature)',
    );
  });

  it('is checked up to max_temperature when the row gives one, and up to t_ref when that lies above', () => {
    // 1.7 − 0.01·T: 0.15 at 155 °C, 0 at 170 °C, −0.3 at 200 °C.
    const falling = { ...POWDER_CELLS, ct0: '1.7', ct1: '0.01', ct2: '0' };
    expect(problemsOf({ ...falling, max_temperature: '155' })).toEqual({});
    expect(problemsOf(falling)['ct1']).toMatch(/-0\.300 at 200 °C/);
    expect(problemsOf({ ...falling, max_temperature: '155', t_ref: '180' })['ct1']).toMatch(
      /-0\.100 at 180 °C; it must stay above 0 from -40 to 180 °C/,
    );
  });

  it('blames ct0 where the constant term is what goes negative', () => {
    // −0.2 + 0.001·T: −0.24 at −40 °C, where ct0 = −0.2 is the most negative term (−ct1·T = −0.04).
    expect(problemsOf({ ...POWDER_CELLS, ct0: '-0.2', ct1: '-0.001', ct2: '0' })['ct0']).toMatch(/-0\.240 at -40 °C/);
  });

  it('is reported together with every other problem of the row', () => {
    const problems = problemsOf({
      ...POWDER_CELLS,
      f_min: '600000',
      alpha: 'x',
      bsat_25: '9',
      max_temperature: '20',
      rolloff_c: '',
      ct0: '1.5',
      ct1: '0.04',
      ct2: '0.0002',
    });
    expect(Object.keys(problems).sort()).toEqual(['alpha', 'bsat_25', 'ct1', 'f_min', 'max_temperature', 'rolloff_c']);
    expect(problems['f_min']).toMatch(/must not exceed f_max/);
    expect(problems['rolloff_c']).toMatch(/required when rolloff_a, rolloff_b are given/);
  });
});

describe('the material limit as loaded for the engine', () => {
  // The engine's hot spot = surface + 5 K (common practice, no source); ambient 124 °C puts this part's hot spot
  // near 180 °C. Insulation and rise limits are opened so the material limit is the only one in play.
  const design = (material: CoreMaterial) =>
    evaluateDesign({
      spec: sectionOneSpec,
      limits: { ambient: 124, maxRise: 100, insulationClass: 220 },
      core: powderRing,
      material,
      turns: 'auto',
      gap: 'auto',
      wire: roundWire(0.8e-3, 3),
    });

  it('fails a 180 °C hot spot on a powder whose stored max_temperature is 155 °C, naming the limit', () => {
    const material = loaded({ ...POWDER_CELLS, max_temperature: '155' });
    expect(material.maxTemperature).toBe(155);
    const result = design(material);
    expect(result.thermal.hotSpot).toBeGreaterThan(178);
    expect(result.thermal.hotSpot).toBeLessThan(182);
    expect(result.feasible).toBe(false);
    expect(result.issues.find((i) => i.code === 'material-temperature')?.message).toBe(
      'Hot spot 180 °C exceeds the Unit powder (invented) limit of 155 °C.',
    );
  });

  it('passes the same part when the stored limit is 200 °C', () => {
    const result = design(loaded({ ...POWDER_CELLS, max_temperature: '200' }));
    expect(result.thermal.hotSpot).toBeGreaterThan(178);
    expect(result.issues.map((i) => i.code)).not.toContain('material-temperature');
    // the loaded material is the engine fixture's powder apart from its name, id and limit
    const { id: _i, name: _n, maxTemperature: _m, ...rest } = loaded(POWDER_CELLS);
    const { id: _pi, name: _pn, maxTemperature: _pm, ...fixture } = powderP;
    expect(rest).toEqual(fixture);
  });
});

describe('t_ref: k is the loss at t_ref', () => {
  // 1e-4·T² − 0.03·T + 2.8 is 0.8 at 100 °C (1 − 3 + 2.8) and positive from −40 to 200 °C (lowest 0.55 at 150 °C).
  const coefficients = { ct0: '2.8', ct1: '0.03', ct2: '0.0001' };

  /** Core loss (W) the engine's temperature solver takes at exactly 100 °C: no rise with an unbounded surface. */
  function lossAt100(material: CoreMaterial): number {
    const loss = emptyWoundCoreLoss();
    loss.coreLossReference = 2; // W at factor 1, i.e. from k alone
    loss.temperatureCoefficients = material.tempCoefficients;
    const solution = solveTemperature(100, loss, Number.POSITIVE_INFINITY, 0);
    expect(solution.coreTemperature).toBe(100);
    return solution.totalLoss;
  }

  it('gives the same loss at 100 °C as k alone when t_ref is 100 °C', () => {
    expect(lossAt100(loaded({ ...POWDER_CELLS, ...coefficients, t_ref: '100' }))).toBeCloseTo(2, 12);
    expect(lossAt100(loaded(POWDER_CELLS))).toBe(2);
  });

  it('keeps the coefficients as they are without t_ref (k·factor(T))', () => {
    expect(lossAt100(loaded({ ...POWDER_CELLS, ...coefficients }))).toBeCloseTo(1.6, 12);
  });

  it('scales the whole curve: the ratio between two temperatures is unchanged', () => {
    const referred = loaded({ ...POWDER_CELLS, ...coefficients, t_ref: '100' }).tempCoefficients!;
    const factor = (c: { ct0: number; ct1: number; ct2: number }, t: number) => c.ct2 * t * t - c.ct1 * t + c.ct0;
    // as given: 25 °C → 0.0625 − 0.75 + 2.8 = 2.1125; 100 °C → 0.8
    expect(factor(referred, 25) / factor(referred, 100)).toBeCloseTo(2.1125 / 0.8, 12);
  });
});
