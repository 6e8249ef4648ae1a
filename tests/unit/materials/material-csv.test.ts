import { describe, expect, it } from 'vitest';
import { steinmetzLoss } from '@shared/engine/core-loss';
import { MATERIAL_CSV_COLUMNS, kFromSi, kToSi, materialCellsFromValues, validateMaterialCells } from '@shared/schemas/materials';
import { decodeCsvText, parseMaterialCsv, stringifyMaterialCsv } from '../../../server/materials/material-csv.ts';

const FERRITE_CELLS = {
  name: 'Unit ferrite',
  family: 'ferrite',
  unit_set: 'mW/cm3-kHz-mT',
  k: '0.0032',
  alpha: '1.4',
  beta: '2.6',
  f_min: '50',
  f_max: '300',
  b_min: '20',
  b_max: '250',
  bsat_25: '500',
  bsat_100: '400',
  mu_i: '2300',
  density: '4800',
  provenance: 'Invented unit-test row',
};

describe('k conversion between unit sets (unit change in Pv = k·f^α·B̂^β)', () => {
  it('k_SI = k′·10^(3·(1 − α + β)): α = 1.4, β = 2.6 gives the factor 10^6.6 (computed by hand)', () => {
    // Derived algebraically from the unit change in Pv = k·f^α·B̂^β; 10^6.6 = 3 981 071.7, so 0.0032 → 12 739.4 W/m³ (Hz, T), by hand
    expect(kToSi(0.0032, 'mW/cm3-kHz-mT', 1.4, 2.6)).toBeCloseTo(12739.43, 1);
    expect(kToSi(0.0032, 'W/m3-Hz-T', 1.4, 2.6)).toBe(0.0032);
    expect(kFromSi(12739.43, 'mW/cm3-kHz-mT', 1.4, 2.6)).toBeCloseTo(0.0032, 8);
  });

  it('gives the same loss in both unit sets: 1 mW/cm³ = 1 kW/m³ (unit identity)', () => {
    const alpha = 1.3;
    const beta = 2.5;
    const kPrime = 2e-4;
    // Pv in mW/cm³ at 100 kHz and 100 mT, then in W/m³ at 1e5 Hz and 0.1 T
    const milliwattPerCm3 = kPrime * 100 ** alpha * 100 ** beta;
    const wattPerM3 = steinmetzLoss({ k: kToSi(kPrime, 'mW/cm3-kHz-mT', alpha, beta), alpha, beta }, 1e5, 0.1);
    expect(wattPerM3 / (milliwattPerCm3 * 1e3)).toBeCloseTo(1, 12);
  });
});

describe('row validation', () => {
  it('converts frequency and flux columns of a kHz/mT row to Hz and T', () => {
    const { values, problems } = validateMaterialCells(FERRITE_CELLS);
    expect(problems).toEqual([]);
    expect(values).toMatchObject({ fitFrequencyMin: 50e3, fitFrequencyMax: 300e3, unitSet: 'mW/cm3-kHz-mT', kUploaded: 0.0032 });
    expect(values!.fitFluxMax).toBeCloseTo(0.25, 12);
    expect(values!.bsat25).toBeCloseTo(0.5, 12);
    expect(values!.lowestLossTemperature).toBeNull();
    expect(values!.rollOffHalfField).toBeNull();
  });

  it('names the column of each problem', () => {
    const { values, problems } = validateMaterialCells({ ...FERRITE_CELLS, alpha: 'x', beta: '0.9', k: '-1', family: 'plastic' });
    expect(values).toBeUndefined();
    const byColumn = Object.fromEntries(problems.map((p) => [p.column, p.message]));
    expect(byColumn['alpha']).toMatch(/"x" is not a number/);
    expect(byColumn['beta']).toMatch(/between 1.5 and 4/);
    expect(byColumn['k']).toMatch(/greater than 0/);
    expect(byColumn['family']).toMatch(/must be one of/);
  });

  it('refuses formula-like text and reads back apostrophe-escaped negative numbers', () => {
    expect(validateMaterialCells({ ...FERRITE_CELLS, provenance: '+cmd' }).problems[0]?.column).toBe('provenance');
    const behaviour = { lowest_loss_temperature: "'-10", lowest_loss_factor: '1', loss_curvature: '0.0001' };
    expect(validateMaterialCells({ ...FERRITE_CELLS, ...behaviour }).values?.lowestLossTemperature).toBe(-10);
  });

  it('turns stored values back into the same cells', () => {
    const { values } = validateMaterialCells(FERRITE_CELLS);
    const cells = materialCellsFromValues(values!);
    const again = validateMaterialCells(cells).values!;
    for (const key of ['k', 'fitFrequencyMin', 'fitFluxMin', 'fitFluxMax', 'bsat100'] as const) {
      expect(Math.abs(again[key] - values![key]) / values![key]).toBeLessThan(1e-12);
    }
  });
});

describe('file reading', () => {
  it('numbers rows as a spreadsheet does (header = row 1), with BOM and CRLF', () => {
    const header = MATERIAL_CSV_COLUMNS.join(',');
    const records = parseMaterialCsv(
      `\uFEFF${header}\r\n${MATERIAL_CSV_COLUMNS.map(() => '1').join(',')}\r\n\r\n${MATERIAL_CSV_COLUMNS.map(() => '2').join(',')}\r\n`,
    );
    // The blank line is spreadsheet row 3, so the second record is row 4.
    expect(records.map((r) => r.row)).toEqual([2, 4]);
    expect(records[1]!.cells.alpha).toBe('2');
  });

  it('refuses NUL bytes and invalid UTF-8', () => {
    expect(() => decodeCsvText(Buffer.from([0x61, 0x00, 0x62]))).toThrow(/binary/);
    expect(() => decodeCsvText(Buffer.from([0x61, 0xe9, 0x62]))).toThrow(/UTF-8/);
    expect(decodeCsvText(Buffer.from('é', 'utf8'))).toBe('é');
  });

  it('escapes formula-like cells when writing', () => {
    const { values } = validateMaterialCells(FERRITE_CELLS);
    const csv = stringifyMaterialCsv([{ ...materialCellsFromValues(values!), provenance: '=1+1' }]);
    expect(csv).toContain(",'=1+1");
  });
});
