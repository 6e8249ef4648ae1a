import { describe, expect, it } from 'vitest';
import { evaluateDesign, type CoreMaterial } from '@shared/engine/index';
import { parse } from 'csv-parse/sync';
import { CatalogueService } from '../../../server/catalogue/catalogue.service.ts';
import { buildBom, COPPER_DENSITY, copperMass, LEAD_LENGTH } from '../../../server/exports/bom.ts';
import { testSheet } from '../../support/winding-sheet.ts';
import { SHEET_CAUTION } from '@shared/shop/sheet';
import { bomCsv, candidatesCsv } from '../../../server/exports/candidates-csv.ts';
import { buildSpiceSubcircuit, spiceNumber, spiceSubcircuitName, spiceValues } from '../../../server/exports/spice.ts';

// An invented ferrite for the test (illustrative coefficients, not a real material).
const FERRITE: CoreMaterial = {
  id: 'test-ferrite',
  name: 'Test ferrite (invented)',
  family: 'ferrite',
  k: 2.0,
  alpha: 1.4,
  beta: 2.6,
  fitFrequencyMin: 20e3,
  fitFrequencyMax: 500e3,
  fitFluxMin: 0.01,
  fitFluxMax: 0.3,
  bsat25: 0.48,
  bsat100: 0.38,
  permeability: 2300,
  density: 4800,
};

const catalogue = new CatalogueService();
const awg16x2 = catalogue.wire({ kind: 'awg', awg: 16, strands: 2 });
const result = evaluateDesign({
  spec: { vinMin: 24, vinMax: 36, vout: 12, ioutMax: 10, frequency: 100e3, rippleRatio: 0.3, rectifier: 'ideal' },
  core: catalogue.core('ETD39/20/13'),
  material: FERRITE,
  turns: 'auto',
  gap: 'auto',
  wire: awg16x2,
});

/** Ohm's law for a branch R ∥ jX: Z = R·jX/(R + jX); its real part is R·X²/(R² + X²) (circuit theory, from memory). */
function parallelRealPart(r: number, x: number): number {
  return (r * x * x) / (r * r + x * x);
}

describe('SPICE subcircuit', () => {
  const v = spiceValues(result);
  const text = buildSpiceSubcircuit({ designNumber: 'GW-0007', title: 'Test\nchoke', revision: 2, engineVersion: '1.0.0' }, result);
  const element = (name: string) => Number(new RegExp(`^${name} \\S+ \\S+ (\\S+)$`, 'm').exec(text)![1]);

  it('carries L and the hot DC resistance of the evaluation', () => {
    expect(element('L1') / result.inductance.atLoad).toBeCloseTo(1, 5);
    expect(element('RDC') / result.copper.resistanceHot).toBeCloseTo(1, 5);
  });

  it("has an AC branch whose real part at fs is (Fr − 1)·Rdc plus the gap field's loss over ΔI²/12, and zero at DC", () => {
    const omega = 2 * Math.PI * result.operatingPoint.frequency;
    const extra = parallelRealPart(element('RAC'), omega * element('LAC'));
    const rippleMeanSquare = result.operatingPoint.rippleAtVinMax ** 2 / 12;
    const expected = (result.copper.acFactor - 1) * result.copper.resistanceHot + result.copper.gapLoss! / rippleMeanSquare;
    expect(extra / expected).toBeCloseTo(1, 4);
    expect(parallelRealPart(element('RAC'), 0)).toBe(0);
  });

  it('has a core-loss resistance that dissipates the iGSE core loss at the RMS inductor voltage', () => {
    // Square wave across L at Vin max: Vin − Vout = 24 V for D = 1/3, −12 V for 2/3 (ideal switches, D = Vout/Vin from volt-second balance, computed).
    expect(v.inductorVoltageRms).toBeCloseTo(Math.sqrt(24 ** 2 / 3 + (12 ** 2 * 2) / 3), 6);
    expect(v.inductorVoltageRms ** 2 / element('RCORE') / result.coreLoss.loss).toBeCloseTo(1, 4);
  });

  it('names the subcircuit safely, explains each value and keeps the title on one comment line', () => {
    expect(spiceSubcircuitName('GW-0007', 2)).toBe('GW_0007_R2');
    expect(text).toMatch(/^\.SUBCKT GW_0007_R2 1 2$/m);
    expect(text).toMatch(/^\.ENDS GW_0007_R2$/m);
    expect(text).toContain('* GW_0007_R2: Test choke');
    expect(text).toMatch(/Caution: a linear, single-frequency equivalent/);
    for (const line of text.trim().split('\n')) expect(line).toMatch(/^(\*|\.SUBCKT|\.ENDS|L1 |RCORE |RDC |RAC |LAC )/);
  });
});

describe('bill of materials', () => {
  const rows = buildBom({ result, materialName: FERRITE.name });

  it('lists core set, bobbin, wire with lead allowance, copper mass and tape', () => {
    expect(rows.map((r) => r.item)).toEqual(['Core set', 'Bobbin', 'Clips', 'Wire', 'Copper mass', 'Tape']);
    const wire = rows.find((r) => r.item === 'Wire')!;
    // Two wires in hand, each the winding's length + two 50 mm leads: the quantity is both together.
    expect(LEAD_LENGTH).toBe(0.05);
    expect(wire.quantity).toBeCloseTo(2 * (result.winding.wireLength + 0.1), 3);
    expect(wire.note).toMatch(/total of 2 conductor\(s\) in hand; each \d\.\d{3} m .* 50 mm lead at each end/);
  });

  it('agrees with the winding sheet on length per wire, total length and copper mass', () => {
    const sheet = testSheet(result, awg16x2, undefined);
    const wire = rows.find((r) => r.item === 'Wire')!;
    expect(wire.quantity).toBeCloseTo(sheet.parts.wire.totalLength!, 3);
    expect(sheet.parts.wire.length * 2).toBeCloseTo(sheet.parts.wire.totalLength!, 12);
    expect(rows.find((r) => r.item === 'Copper mass')!.quantity).toBeCloseTo(sheet.parts.wire.mass * 1e3, 2);
  });

  it('weighs the copper of all wires in hand as area × length × density', () => {
    const mass = result.wire.copperArea * (result.winding.wireLength + 0.1) * COPPER_DENSITY;
    expect(copperMass(result)).toBeCloseTo(mass, 12);
    // Two AWG 16 wires: d = 0.127 mm × 92^((36 − 16)/39) = 1.291 mm (ASTM B258-02 via "American wire gauge" article, formula; value computed [C]).
    expect(result.wire.copperArea * 1e6).toBeCloseTo(2 * (Math.PI / 4) * 1.291 ** 2, 2);
  });

  it('escapes formula cells in the CSV', () => {
    const csv = bomCsv([{ item: '=SUM(A1)', description: '+1', quantity: 1, unit: 'pc', note: '@x' }]);
    const [, row] = parse(csv) as string[][];
    expect(row[0]).toBe("'=SUM(A1)");
    expect(row[1]).toBe("'+1");
    expect(row[4]).toBe("'@x");
  });

  it('ends with the sheet’s caution as a row a spreadsheet shows and a parser reads like the others', () => {
    const rows = parse(bomCsv([{ item: 'Core', description: 'ETD34', quantity: 1, unit: 'set', note: '' }]), { columns: true }) as Record<
      string,
      string
    >[];
    expect(rows.map((r) => r['item'])).toEqual(['Core', 'Caution']);
    expect(rows[1]['description']).toBe(SHEET_CAUTION);
    expect(rows[1]['description']).toMatch(/must be verified on a prototype/);
  });
});

describe('candidates CSV', () => {
  it('escapes a formula in the design title and writes one row per candidate with reasons for infeasible ones', () => {
    const search = {
      rankBy: 'loss' as const,
      candidates: [
        {
          rank: 1,
          pareto: true,
          paretoByMass: true,
          extrapolated: false,
          lossNotModelled: false,
          conductor: 'in-hand' as const,
          placement: 'ground' as const,
          volume: result.core.ve,
          mass: 0.05,
          wire: catalogue.wire({ kind: 'awg', awg: 16, strands: 2 }),
          result,
        },
      ],
      page: { offset: 0, limit: 20, total: 1 },
      paretoFront: [],
      paretoFrontByMass: [],
      infeasible: [
        {
          coreId: 'E13/7/4',
          materialId: 'test-ferrite',
          reasons: [{ code: 'fill', severity: 'error' as const, message: 'Winding does not fit' }],
        },
      ],
      counts: {
        cores: 2,
        materials: 1,
        wireOptions: 1,
        evaluated: 2,
        screened: 0,
        feasible: 1,
        extrapolated: 0,
        prefiltered: 0,
        incompatible: 0,
      },
      requiredAreaProduct: 1e-8,
    };
    const csv = candidatesCsv(
      { number: 'GW-0001', title: '=HYPERLINK("http://x")' },
      search,
      new Map([['test-ferrite', 'Test ferrite (invented)']]),
    );
    const rows = parse(csv, { columns: true }) as Record<string, string>[];
    expect(rows).toHaveLength(3);
    // the sheet's caution closes the file as one row of the same table
    expect(rows[2]['design']).toBe('Caution');
    expect(rows[2]['title']).toBe(SHEET_CAUTION);
    expect(rows[0]['design']).toBe('GW-0001');
    expect(rows[0]['title']).toBe(`'=HYPERLINK("http://x")`);
    expect(rows[0]['feasible']).toBe('yes');
    expect(Number(rows[0]['total_loss_W'])).toBeCloseTo(result.totalLoss, 3);
    // a ground design: the placement is named and the spacer column (spacer designs only) stays empty
    expect(rows[0]['gap_placement']).toBe('ground');
    expect(Number(rows[0]['gap_mm'])).toBeCloseTo(result.gap.total * 1e3, 4);
    expect(rows[0]['spacer_mm']).toBe('');
    expect(rows[1]['feasible']).toBe('no');
    expect(rows[1]['reasons']).toBe('Winding does not fit');
    expect(rows[1]['material']).toBe('Test ferrite (invented)');
  });
});

describe('numbers in the SPICE text', () => {
  it('keeps the zeros of round integers and drops only those of a fraction (common practice, no source)', () => {
    expect(spiceNumber(400e3)).toBe('400000');
    expect(spiceNumber(100e3)).toBe('100000');
    expect(spiceNumber(150_000)).toBe('150000');
    expect(spiceNumber(2.5e-5)).toBe('0.000025');
    expect(spiceNumber(1.234567e-9)).toBe('1.23457e-9');
    expect(spiceNumber(1000)).toBe('1000');
    expect(spiceNumber(0.012)).toBe('0.012');
  });

  it('states the design’s own switching frequency in the derivation comment (a 100 kHz design says 100000 Hz)', () => {
    const text = buildSpiceSubcircuit({ designNumber: 'GW-0001', title: 'round numbers', revision: 1, engineVersion: '2.0.0' }, result);
    expect(text).toContain('fs = 100000 Hz');
    expect(text).not.toMatch(/fs = 1 Hz/);
  });
});
