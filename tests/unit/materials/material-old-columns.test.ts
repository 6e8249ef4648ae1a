import { describe, expect, it } from 'vitest';
import { rollOffFraction } from '@shared/fitting/rolloff-fit';
import { behaviourFactor } from '@shared/fitting/temperature-fit';
import { materialCellsFromValues, validateMaterialCells } from '@shared/schemas/materials';
import { parseMaterialCsv } from '../../../server/materials/material-csv.ts';
import { TEMPLATE_ROWS } from '../../../server/materials/material-template.ts';

// The template's invented ferrite without its temperature behaviour, for rows in the previous format version (ct0, ct1,
// ct2; rolloff_a, rolloff_b, rolloff_c) to add their old columns to. No real material.
const FERRITE_CELLS: Record<string, string> = {
  ...TEMPLATE_ROWS[0]!,
  name: 'Old-format ferrite (invented)',
  lowest_loss_temperature: '',
  lowest_loss_factor: '',
  loss_curvature: '',
  t_ref: '',
  provenance: 'Invented unit-test row',
};
/** The columns of the current format that name no temperature behaviour or roll-off. */
const PLAIN_COLUMNS = Object.keys(FERRITE_CELLS).filter((c) => !/^(lowest_loss|loss_curvature|rolloff_)/.test(c));
const POWDER_CELLS = { ...FERRITE_CELLS, name: 'Old-format powder (invented)', family: 'powder', mu_i: '60' };

const byColumn = (problems: { column: string; message: string }[]) => Object.fromEntries(problems.map((p) => [p.column, p.message]));

describe('old temperature columns ct0, ct1, ct2', () => {
  it('convert exactly to T0 = ct1/(2·ct2), F0 = ct0 − ct1²/(4·ct2), c = ct2, with a notice (algebra, no source)', () => {
    // 1e-4·T² − 0.018·T + 1.43: T0 = 0.018/2e-4 = 90 °C, F0 = 1.43 − 0.81 = 0.62 (by hand).
    const { values, problems, notices } = validateMaterialCells({
      ...FERRITE_CELLS,
      ct0: '1.43',
      ct1: '0.018',
      ct2: '0.0001',
      t_ref: '90',
    });
    expect(problems).toEqual([]);
    expect(values!.lowestLossTemperature).toBeCloseTo(90, 9);
    expect(values!.lowestLossFactor).toBeCloseTo(0.62, 12);
    expect(values!.lossCurvature).toBe(1e-4);
    expect(values!.referenceTemperature).toBe(90);
    expect(notices).toEqual([
      {
        column: 'ct0',
        message:
          'old columns ct0, ct1, ct2 converted to lowest-loss temperature 90 °C, factor 0.62, curvature 1.0e-4 /K²; ' +
          'this old format is read until the next format version',
      },
    ]);
    // Same factor at any temperature: 1e-4·150² − 0.018·150 + 1.43 = 0.98 (by hand).
    const b = { lowestLossTemperature: values!.lowestLossTemperature!, lowestLossFactor: values!.lowestLossFactor!, curvature: 1e-4 };
    expect(behaviourFactor(b, 150)).toBeCloseTo(0.98, 12);
  });

  it('take a flat factor (ct1 = ct2 = 0) with T0 = 25 °C and c = 0', () => {
    const { values } = validateMaterialCells({ ...FERRITE_CELLS, ct0: '1.2', ct1: '0', ct2: '0' });
    expect([values!.lowestLossTemperature, values!.lowestLossFactor, values!.lossCurvature]).toEqual([25, 1.2, 0]);
  });

  it('are refused naming the old column when the parabola opens downwards, with what to give instead', () => {
    const problems = byColumn(validateMaterialCells({ ...FERRITE_CELLS, ct0: '1', ct1: '0', ct2: '-0.0001' }).problems);
    expect(problems['ct2']).toBe(
      'ct2 = -0.0001 makes the old quadratic open downwards: its factor falls below zero away from its peak, so it cannot be ' +
        'positive at every temperature; give lowest_loss_temperature (°C), lowest_loss_factor (> 0) and loss_curvature ' +
        '(1/K², ≥ 0) instead, which are positive at every temperature',
    );
  });

  it('are refused for a slope (ct2 = 0, ct1 ≠ 0) and for a minimum at or below zero', () => {
    expect(byColumn(validateMaterialCells({ ...FERRITE_CELLS, ct0: '1.7', ct1: '0.01', ct2: '0' }).problems)['ct1']).toMatch(
      /^ct1 = 0\.01 with ct2 = 0 makes the old factor a slope/,
    );
    // 2e-4·T² − 0.04·T + 1.5: minimum 1.5 − 2 = −0.5 at 100 °C (by hand).
    expect(byColumn(validateMaterialCells({ ...FERRITE_CELLS, ct0: '1.5', ct1: '0.04', ct2: '0.0002' }).problems)['ct0']).toMatch(
      /lowest value at or below zero/,
    );
  });
});

describe('old roll-off columns rolloff_a, rolloff_b, rolloff_c', () => {
  it('convert exactly for a = 1: H½ = b^(−1/c), n = c (algebra, no source)', () => {
    const { values, notices } = validateMaterialCells({
      ...POWDER_CELLS,
      rolloff_a: '1',
      rolloff_b: String(5000 ** -1.8),
      rolloff_c: '1.8',
    });
    expect(values!.rollOffHalfField).toBeCloseTo(5000, 6);
    expect(values!.rollOffSteepness).toBe(1.8);
    expect(values!.permeability).toBe(60);
    expect(notices[0]!.message).toBe(
      'old columns rolloff_a, rolloff_b, rolloff_c converted to field at half permeability 5000 A/m, steepness 1.8; ' +
        'this old format is read until the next format version',
    );
  });

  it('keep the curve exactly for a ≠ 1 by multiplying μi by 1/a, and say so', () => {
    const old = { a: 1.25, b: 2e-7, c: 1.6 };
    const { values, notices } = validateMaterialCells({
      ...POWDER_CELLS,
      rolloff_a: String(old.a),
      rolloff_b: String(old.b),
      rolloff_c: String(old.c),
    });
    expect(values!.permeability).toBeCloseTo(48, 12); // 60 / 1.25
    expect(notices[0]!.message).toMatch(/rolloff_a = 1\.25 is not 1, so mu_i is multiplied by 1\/a = 0\.8 to keep the curve exactly/);
    // μ(H) = μi·/(a + b·H^c) before, μi′·1/(1 + (H/H½)ⁿ) after, at several fields.
    const rollOff = { halfField: values!.rollOffHalfField!, steepness: values!.rollOffSteepness! };
    for (const field of [100, 3000, 20000, 1e5]) {
      const before = 60 / (old.a + old.b * field ** old.c);
      expect(values!.permeability * rollOffFraction(rollOff, field)).toBeCloseTo(before, 9);
    }
  });

  it('are refused for b = 0 (no roll-off) naming rolloff_b', () => {
    const problems = byColumn(validateMaterialCells({ ...POWDER_CELLS, rolloff_a: '1', rolloff_b: '0', rolloff_c: '1' }).problems);
    expect(problems['rolloff_b']).toMatch(/does not roll off; leave the roll-off columns empty/);
  });
});

describe('old and new columns of one quantity together', () => {
  it('are refused in a row, naming the old columns', () => {
    const problems = byColumn(
      validateMaterialCells({
        ...POWDER_CELLS,
        ct0: '1',
        ct1: '0',
        ct2: '0',
        lowest_loss_temperature: '90',
        lowest_loss_factor: '1',
        loss_curvature: '0',
      }).problems,
    );
    expect(Object.keys(problems).sort()).toEqual(['ct0', 'ct1', 'ct2']);
    expect(problems['ct0']).toMatch(/old column of the temperature behaviour and cannot be used with lowest_loss_temperature/);
  });

  it('are refused in a header, naming the columns', () => {
    const header = [...PLAIN_COLUMNS, 'rolloff_a', 'rolloff_b', 'rolloff_c', 'rolloff_half_field'].join(',');
    expect(() => parseMaterialCsv(`${header}\n${header}`)).toThrow(
      /Column "rolloff_a" is an old column of the roll-off and cannot be used with rolloff_half_field/,
    );
  });

  it('an old-format header alone is read', () => {
    const columns = [...PLAIN_COLUMNS, 'ct0', 'ct1', 'ct2'];
    const records = parseMaterialCsv(`${columns.join(',')}\n${columns.map((c) => (c === 'ct0' ? '1' : '0')).join(',')}`);
    expect(records[0]!.cells.ct0).toBe('1');
  });
});

describe('warnings', () => {
  it('note bsat_100 above bsat_25 and leave the row importable (common practice, no source)', () => {
    const { values, problems, notices } = validateMaterialCells({ ...FERRITE_CELLS, bsat_25: '0.4', bsat_100: '0.5' });
    expect(problems).toEqual([]);
    expect(values).toBeDefined();
    expect(notices).toEqual([
      {
        column: 'bsat_100',
        message: 'exceeds bsat_25: ferrite saturation normally falls with temperature; check the columns are not swapped',
      },
    ]);
    expect(validateMaterialCells(FERRITE_CELLS).notices).toEqual([]);
  });

  it('come with the problems of a row that cannot be imported', () => {
    const { problems, notices } = validateMaterialCells({ ...FERRITE_CELLS, bsat_25: '0.4', bsat_100: '0.5', f_min: '400000' });
    expect(problems.map((p) => p.column)).toEqual(['f_min']);
    expect(notices.map((n) => n.column)).toEqual(['bsat_100']);
  });
});

describe('round trip', () => {
  it('a converted old row exports in the new columns and reads back to the same values', () => {
    const { values } = validateMaterialCells({
      ...POWDER_CELLS,
      ct0: '1.43',
      ct1: '0.018',
      ct2: '0.0001',
      rolloff_a: '1.1',
      rolloff_b: '3e-7',
      rolloff_c: '1.7',
    });
    const cells = materialCellsFromValues(values!);
    expect(cells).not.toHaveProperty('ct0');
    const again = validateMaterialCells(cells);
    expect(again.notices).toEqual([]);
    expect(again.values).toEqual(values);
  });
});

describe('a converted roll-off that moves mu_i out of its range', () => {
  it('is refused naming rolloff_a', () => {
    // μi 150000 × 1/0.5 = 300000 is above the 200000 limit of mu_i (arithmetic).
    const row = { ...POWDER_CELLS, mu_i: '150000', rolloff_a: '0.5', rolloff_b: '1e-7', rolloff_c: '1.5' };
    expect(byColumn(validateMaterialCells(row).problems)['rolloff_a']).toBe('rolloff_a makes mu_i × 1/a = 3.000e+5, outside 1…200000');
  });
});
