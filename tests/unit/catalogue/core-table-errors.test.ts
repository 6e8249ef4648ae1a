import { describe, expect, it } from 'vitest';
import type { CoreShape } from '@shared/engine/types';
import { coreShapeSchema } from '@shared/catalogue/core-schema';
import { TableError, assertUniqueCoreIds, parseCoreRows } from '@core-data/catalogue';

const SHAPED_HEADER =
  'designation,ae_mm2,amin_mm2,le_mm,ve_mm3,window_area_mm2,window_height_mm,window_width_mm,centre_leg,centre_leg_width_mm,' +
  'centre_leg_depth_mm,outline_width_mm,outline_height_mm,outline_depth_mm,bobbin_width_mm,bobbin_height_mm,mlt_mm,' +
  'surface_area_mm2,ac_ao,source';
const ESTIMATED = 'test row; bobbin/MLT/surface estimated from nominal outline dimensions';
const goodEtdRow = `ETD34/17/11,97.1,91.6,78.6,7640,175,23.6,7.4,round,10.8,,34.2,34.6,11.1,,,,,,${ESTIMATED}`;
const RING_HEADER = 'designation,outer_diameter_mm,inner_diameter_mm,height_mm,source';
const RING_SOURCE = 'computed by IEC 60205 from nominal dimensions';

const table = (header: string, ...rows: string[]) => [header, ...rows].join('\n') + '\n';

describe('parseCoreRows', () => {
  it('reads a good shaped-core row into SI units', () => {
    const [shape] = parseCoreRows(table(SHAPED_HEADER, goodEtdRow), 'etd.csv');

    expect(shape).toMatchObject({ id: 'ETD34/17/11', family: 'ETD', gapKind: 'air-gap' });
    expect(shape!.ae).toBeCloseTo(97.1e-6, 12);
    expect(shape!.ve).toBeCloseTo(7640e-9, 15);
  });

  it('names file, row and column when Ve disagrees with Ae·le', () => {
    const broken = goodEtdRow.replace(',7640,', ',9000,');
    const text = table(SHAPED_HEADER, goodEtdRow.replace('ETD34/17/11', 'ETD-A'), broken);

    expect(() => parseCoreRows(text, 'core-data/cores/etd.csv')).toThrow(
      /core-data\/cores\/etd\.csv, row 2 \(line 3\), column "ve_mm3": Ve differs from Ae·le/,
    );
  });

  it('names the column of a cell that is not a number', () => {
    const broken = goodEtdRow.replace(',78.6,', ',7x8,');

    expect(() => parseCoreRows(table(SHAPED_HEADER, broken), 'etd.csv')).toThrow(/etd\.csv, row 1 \(line 2\), column "le_mm"/);
  });

  it('names the column of a missing required cell', () => {
    const broken = goodEtdRow.replace(',97.1,', ',,');

    expect(() => parseCoreRows(table(SHAPED_HEADER, broken), 'etd.csv')).toThrow(/column "ae_mm2": is required/);
  });

  it('refuses to leave winding space to the estimate without saying so in the source', () => {
    const broken = goodEtdRow.replace(ESTIMATED, 'from memory');

    expect(() => parseCoreRows(table(SHAPED_HEADER, broken), 'etd.csv')).toThrow(/column "source"/);
  });

  it('refuses a bobbin larger than the window', () => {
    const broken = goodEtdRow.replace('11.1,,,,,,', '11.1,30,7,60,5000,,');

    expect(() => parseCoreRows(table(SHAPED_HEADER, broken), 'etd.csv')).toThrow(/column "bobbin_width_mm"/);
  });

  it('names a ring row whose inner diameter is not smaller than its outer diameter', () => {
    const text = table(RING_HEADER, `R20/10/7,20,10,7,${RING_SOURCE}`, `R10/12/5,10,12,5,${RING_SOURCE}`);

    expect(() => parseCoreRows(text, 'ring.csv')).toThrow(/ring\.csv, row 2 \(line 3\), column "inner_diameter_mm"/);
  });

  it('names a column missing from the header', () => {
    const text = table('designation,outer_diameter_mm,height_mm,source', `R20/10/7,20,7,${RING_SOURCE}`);

    expect(() => parseCoreRows(text, 'ring.csv')).toThrow(/ring\.csv, line 1, column "inner_diameter_mm": column missing/);
  });

  it('names the row of a record with too few cells and the line of a quote never closed', () => {
    const ragged = table(RING_HEADER, `R20/10/7,20,10,7,${RING_SOURCE}`, `R10/5/4,10,5,${RING_SOURCE}`);
    const unclosed = table(RING_HEADER, `R20/10/7,20,10,7,"${RING_SOURCE}`);

    expect(() => parseCoreRows(ragged, 'ring.csv')).toThrow(/ring\.csv, row 2 \(line 3\): the row has 4 cells; the header has 5/);
    expect(() => parseCoreRows(unclosed, 'ring.csv')).toThrow(/ring\.csv, line 2: a quoted cell is never closed/);
  });

  it('gives a record that spans lines the line it starts on', () => {
    const text = table(RING_HEADER, `R20/10/7,20,10,7,"${RING_SOURCE}\nsecond line"`, `R10/12/5,10,12,5,"${RING_SOURCE}\nsecond line"`);

    expect(() => parseCoreRows(text, 'ring.csv')).toThrow(/ring\.csv, row 2 \(line 4\), column "inner_diameter_mm"/);
  });

  it('refuses a table whose file name does not say which family it holds', () => {
    expect(() => parseCoreRows(table(RING_HEADER), 'toroids.csv')).toThrow(TableError);
  });
});

describe('assertUniqueCoreIds', () => {
  it('names the second table that reuses a designation', () => {
    const [ring] = parseCoreRows(table(RING_HEADER, `R20/10/7,20,10,7,${RING_SOURCE}`), 'ring.csv');
    const tables = [
      { fileName: 'ring.csv', cores: [ring!] },
      { fileName: 'powder-toroid.csv', cores: [{ ...ring!, family: 'POWDER_TOROID' } as CoreShape] },
    ];

    expect(() => assertUniqueCoreIds(tables)).toThrow(
      /powder-toroid\.csv, row 1, column "designation": "R20\/10\/7" is already used in ring\.csv/,
    );
  });
});

describe('coreShapeSchema', () => {
  const [ring] = parseCoreRows(table(RING_HEADER, `R20/10/7,20,10,7,${RING_SOURCE}`), 'ring.csv');

  it('accepts a ring core built from its dimensions', () => {
    expect(coreShapeSchema.safeParse(ring).success).toBe(true);
  });

  it('rejects a ring core that claims an air gap, or a window that does not follow from its inner diameter', () => {
    const gapped = coreShapeSchema.safeParse({ ...ring, gapKind: 'air-gap' });
    const wrongWindow = coreShapeSchema.safeParse({ ...ring, windowArea: ring!.windowArea * 2 });

    expect(gapped.error?.issues.map((issue) => issue.path[0])).toEqual(['gapKind']);
    expect(wrongWindow.error?.issues.map((issue) => issue.path[0])).toEqual(['windowArea']);
  });

  it('rejects an empty source and a negative area', () => {
    const result = coreShapeSchema.safeParse({ ...ring, source: '  ', ae: -1 });

    const fields = result.error?.issues.map((issue) => issue.path[0]);

    expect(fields).toContain('ae');
    expect(fields).toContain('source');
  });
});
