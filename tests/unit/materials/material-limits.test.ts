import { describe, expect, it } from 'vitest';
import { evaluateDesign } from '@shared/engine/evaluate';
import { emptyWoundCoreLoss, prepareThermalPart, solveTemperature } from '@shared/engine/thermal';
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
  rolloff_half_field: '8000',
  rolloff_steepness: '1.3',
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

// F0 + c·(T − T0)² with F0 > 0 and c ≥ 0 is positive at every temperature (algebra, no source): the named cells are
// plain range checks. All values below are invented.
describe('the named temperature behaviour', () => {
  it('refuses a factor F0 ≤ 0 and a negative curvature as plain cell range checks', () => {
    const behaviour = { lowest_loss_temperature: '90', lowest_loss_factor: '0', loss_curvature: '-1e-4' };
    const problems = problemsOf({ ...POWDER_CELLS, ...behaviour });
    expect(problems['lowest_loss_factor']).toBe('lowest_loss_factor must be greater than 0 (got 0)');
    expect(problems['loss_curvature']).toBe('loss_curvature must be between 0 and 1 (got -0.0001)');
  });

  it('takes all three or none', () => {
    const problems = problemsOf({ ...POWDER_CELLS, lowest_loss_temperature: '90' });
    expect(Object.keys(problems).sort()).toEqual(['loss_curvature', 'lowest_loss_factor']);
    expect(problems['loss_curvature']).toMatch(/required when lowest_loss_temperature is given \(all three or none\)/);
  });

  it('reports every problem of the row at once, f_min above f_max among them', () => {
    const problems = problemsOf({
      ...POWDER_CELLS,
      f_min: '600000',
      alpha: 'x',
      bsat_25: '9',
      max_temperature: '20',
      rolloff_steepness: '',
      lowest_loss_factor: '-1',
      lowest_loss_temperature: '90',
      loss_curvature: '1e-4',
    });
    expect(Object.keys(problems).sort()).toEqual([
      'alpha',
      'bsat_25',
      'f_min',
      'lowest_loss_factor',
      'max_temperature',
      'rolloff_steepness',
    ]);
    expect(problems['f_min']).toBe('f_min must be below f_max (600000 ≥ 500000)');
    expect(problems['rolloff_steepness']).toMatch(/required when rolloff_half_field is given \(both or none\)/);
  });

  it('refuses an empty fitted range (f_min = f_max, b_min = b_max) and allows b_min = 0', () => {
    const problems = problemsOf({ ...POWDER_CELLS, f_min: '500000', b_min: '0.4' });
    expect(problems['f_min']).toMatch(/must be below f_max/);
    expect(problems['b_min']).toBe('b_min must be below b_max (0.4 ≥ 0.4)');
    expect(problemsOf({ ...POWDER_CELLS, b_min: '0' })).toEqual({});
  });
});

describe('the material limit as loaded for the engine', () => {
  // The material limit is checked at the core node of the thermal network; an (unrealistic) ambient of 150 °C puts
  // this ring's core near 180 °C (30 K rise at 2.1 W). Insulation and rise limits are opened so the material limit is
  // the only one in play.
  const design = (material: CoreMaterial) =>
    evaluateDesign({
      spec: sectionOneSpec,
      limits: { ambient: 150, maxRise: 100, insulationClass: 220 },
      core: powderRing,
      material,
      turns: 'auto',
      gap: 'auto',
      wire: roundWire(0.8e-3, 3),
    });

  it('fails a 180 °C core on a powder whose stored max_temperature is 155 °C, naming the limit', () => {
    const material = loaded({ ...POWDER_CELLS, max_temperature: '155' });
    expect(material.maxTemperature).toBe(155);
    const result = design(material);
    expect(result.thermal.coreTemperature).toBeGreaterThan(178);
    expect(result.thermal.coreTemperature).toBeLessThan(182);
    expect(result.feasible).toBe(false);
    expect(result.issues.find((i) => i.code === 'material-temperature')?.message).toBe(
      'Core 180 °C exceeds the Unit powder (invented) limit of 155 °C.',
    );
  });

  it('passes the same part when the stored limit is 200 °C', () => {
    const result = design(loaded({ ...POWDER_CELLS, max_temperature: '200' }));
    expect(result.thermal.coreTemperature).toBeGreaterThan(178);
    expect(result.issues.map((i) => i.code)).not.toContain('material-temperature');
    // the loaded material is the engine fixture's powder apart from its name, id and limit
    const { id: _i, name: _n, maxTemperature: _m, ...rest } = loaded(POWDER_CELLS);
    const { id: _pi, name: _pn, maxTemperature: _pm, ...fixture } = powderP;
    expect(rest).toEqual(fixture);
  });
});

describe('t_ref: k is the loss at t_ref', () => {
  // T0 = 150 °C, F0 = 0.55, c = 1e-4 is the quadratic 1e-4·T² − 0.03·T + 2.8 (algebra, no source): 0.8 at 100 °C.
  const behaviour = { lowest_loss_temperature: '150', lowest_loss_factor: '0.55', loss_curvature: '0.0001' };

  /** Core loss (W) the engine's temperature solver takes at 100 °C: no rise with a core tied to a 100 °C board. */
  function lossAt100(material: CoreMaterial): number {
    const loss = emptyWoundCoreLoss();
    loss.coreLossReference = 2; // W at factor 1, i.e. from k alone
    loss.temperatureCoefficients = material.tempCoefficients;
    const solution = solveTemperature({ ambient: 100, boardThermalResistance: 1e-12 }, loss, prepareThermalPart(powderRing));
    expect(solution.coreTemperature).toBeCloseTo(100, 9);
    return solution.totalLoss;
  }

  it('gives the same loss at 100 °C as k alone when t_ref is 100 °C', () => {
    expect(lossAt100(loaded({ ...POWDER_CELLS, ...behaviour, t_ref: '100' }))).toBeCloseTo(2, 12);
    expect(lossAt100(loaded(POWDER_CELLS))).toBe(2);
  });

  it('hands the engine the expanded quadratic without t_ref (k·factor(T))', () => {
    const material = loaded({ ...POWDER_CELLS, ...behaviour });
    expect(material.tempCoefficients!.ct2).toBeCloseTo(1e-4, 15);
    expect(material.tempCoefficients!.ct1).toBeCloseTo(0.03, 12);
    expect(material.tempCoefficients!.ct0).toBeCloseTo(2.8, 12);
    expect(lossAt100(material)).toBeCloseTo(1.6, 12);
  });

  it('scales the whole curve: the ratio between two temperatures is unchanged', () => {
    const referred = loaded({ ...POWDER_CELLS, ...behaviour, t_ref: '100' }).tempCoefficients!;
    const factor = (c: { ct0: number; ct1: number; ct2: number }, t: number) => c.ct2 * t * t - c.ct1 * t + c.ct0;
    // as given: 25 °C → 0.55 + 1e-4·125² = 2.1125; 100 °C → 0.55 + 0.25 = 0.8
    expect(factor(referred, 25) / factor(referred, 100)).toBeCloseTo(2.1125 / 0.8, 12);
  });
});
