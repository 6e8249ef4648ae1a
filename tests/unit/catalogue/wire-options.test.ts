import { describe, expect, it } from 'vitest';
import { awgDiameter, enamelledDiameter, formatNominalMillimetres, litzBundleDiameter, standardWireOptions } from '@shared/catalogue/wire';
import { loadStandardWireOptions, loadWireTables, parseMetricWireRows } from '@core-data/wire-catalogue';
import { expectWithin } from './within';

const mm = (value: number) => value * 1e-3;

describe('IEC 60317 round-wire table', () => {
  const { metric } = loadWireTables();
  const sizeOf = (nominalMm: number) => metric.find((size) => Math.abs(size.nominalDiameter - mm(nominalMm)) < 1e-9);

  it.each([
    // IEC 60317-0-1 Table 1 maximum overall diameter, from memory: 0.100 mm → grade 1 ≤ 0.117 mm, grade 2 ≤ 0.125 mm
    [0.1, 0.117, 0.125],
    // IEC 60317-0-1 Table 1 maximum overall diameter, from memory: 0.250 mm → 0.281 / 0.297 mm
    [0.25, 0.281, 0.297],
    // IEC 60317-0-1 Table 1 maximum overall diameter, from memory: 0.500 mm → 0.544 / 0.566 mm
    [0.5, 0.544, 0.566],
    // IEC 60317-0-1 Table 1 maximum overall diameter, from memory: 1.000 mm → 1.062 / 1.093 mm
    [1.0, 1.062, 1.093],
  ])('lists %s mm with grade 1 %s mm and grade 2 %s mm maximum', (nominal, grade1, grade2) => {
    const size = sizeOf(nominal);

    expect(size, `${nominal} mm row`).toBeDefined();
    expectWithin(size!.grade1MaxDiameter, mm(grade1), 1e-9);
    expectWithin(size!.grade2MaxDiameter, mm(grade2), 1e-9);
  });

  it('has grade 2 > grade 1 > nominal on every row, and covers 0.10 … 2.50 mm', () => {
    for (const size of metric) {
      expect(size.grade1MaxDiameter, `${size.nominalDiameter}`).toBeGreaterThan(size.nominalDiameter);
      expect(size.grade2MaxDiameter, `${size.nominalDiameter}`).toBeGreaterThan(size.grade1MaxDiameter);
      expect(size.source.length).toBeGreaterThan(0);
    }
    expect(sizeOf(0.1)).toBeDefined();
    expect(sizeOf(2.5)).toBeDefined();
  });

  it('has a grade 2 build larger than the grade 1 build by a factor of about 1.3–2.2', () => {
    // Common practice, no source: grade 2 roughly doubles the grade 1 increase over the bare diameter; the
    // recalled table rows above give about 1.5, so the band is wide.
    for (const size of metric) {
      const ratio = (size.grade2MaxDiameter - size.nominalDiameter) / (size.grade1MaxDiameter - size.nominalDiameter);
      expect(ratio, `${size.nominalDiameter}`).toBeGreaterThan(1.3);
      expect(ratio, `${size.nominalDiameter}`).toBeLessThan(2.2);
    }
  });

  it('rejects a row whose grade 2 diameter is not above grade 1, naming the file, row and column', () => {
    const text = 'nominal_mm,grade1_max_mm,grade2_max_mm,source\n0.100,0.117,0.125,ok\n0.200,0.226,0.220,typo\n';

    expect(() => parseMetricWireRows(text, 'bad-wire.csv')).toThrow(/bad-wire\.csv, row 2 \(line 3\), column "grade2_max_mm"/);
  });
});

describe('enamelled diameter of any bare diameter', () => {
  const { metric } = loadWireTables();

  it('returns the table value for a listed size', () => {
    // IEC 60317-0-1 Table 1 maximum overall diameter, from memory: 0.500 mm grade 2 ≤ 0.566 mm
    expectWithin(enamelledDiameter(mm(0.5), 2, metric), mm(0.566), 1e-9);
  });

  it('puts AWG 18 (1.024 mm) between the 1.00 mm and 1.12 mm grade 2 diameters', () => {
    const overall = enamelledDiameter(awgDiameter(18), 2, metric);

    expect(overall).toBeGreaterThan(mm(1.093));
    expect(overall).toBeLessThan(mm(1.217));
    expect(overall - awgDiameter(18)).toBeGreaterThan(mm(0.093));
  });
});

describe('standard wire options', () => {
  const options = loadStandardWireOptions();

  it('offers AWG 10–40 and the metric sizes 1 to 8 in hand, plus litz, with unique readable ids', () => {
    const ids = options.map((option) => option.id);

    expect(new Set(ids).size).toBe(ids.length);
    expect(ids).toContain('AWG 10 ×1 G2');
    expect(ids).toContain('AWG 20 ×2 G2');
    expect(ids).toContain('AWG 40 ×8 G2');
    expect(ids).not.toContain('AWG 41 ×1 G2');
    expect(ids).toContain('0.50 mm ×3 G2');
    expect(ids).toContain('2.50 mm ×8 G2');
    expect(ids).toContain('litz 105 × 0.10 mm');
    expect(options.filter((option) => option.kind === 'awg')).toHaveLength(31 * 8);
  });

  it('describes round wire in hand as side-by-side conductors and litz as one bundle', () => {
    const pair = options.find((option) => option.id === 'AWG 20 ×2 G2')!;
    const litz = options.find((option) => option.id === 'litz 105 × 0.10 mm')!;

    expect(pair).toMatchObject({ kind: 'awg', strands: 2, conductorsPerTurn: 2, grade: 2 });
    // ASTM B258-02 via "American wire gauge" article: AWG 20 = 0.8118 mm (formula value)
    expectWithin(pair.strandDiameter, mm(0.8118), 6e-4);
    expect(litz).toMatchObject({ kind: 'litz', strands: 105, conductorsPerTurn: 1 });
    expectWithin(litz.strandDiameter, mm(0.1), 1e-9);
  });

  it('sizes a litz bundle as 1.2·√n·(strand grade 1 diameter) plus serving', () => {
    // Common practice, no source: bundle OD ≈ 1.15–1.2·√n·d_o,strand plus serving;
    // strand 0.10 mm grade 1 ≤ 0.117 mm from memory (IEC 60317-0-1 Table 1); serving 0.03 mm a side.
    const litz = options.find((option) => option.id === 'litz 105 × 0.10 mm')!;

    expectWithin(litz.overallDiameter, 1.2 * Math.sqrt(105) * mm(0.117) + 2 * mm(0.03), 1e-9);
  });

  it('makes every overall diameter larger than the copper it holds', () => {
    for (const option of options) {
      const copperWidth = option.kind === 'litz' ? Math.sqrt(option.strands) * option.strandDiameter : option.strandDiameter;
      expect(option.overallDiameter, option.id).toBeGreaterThan(copperWidth);
    }
  });

  it('uses the grade 1 diameters when asked', () => {
    const grade1 = standardWireOptions(loadWireTables(), { grade: 1, maxInHand: 2, includeLitz: false });
    const half = grade1.find((option) => option.id === '0.50 mm ×1 G1')!;

    // IEC 60317-0-1 Table 1 maximum overall diameter, from memory: 0.500 mm grade 1 ≤ 0.544 mm
    expectWithin(half.overallDiameter, mm(0.544), 1e-9);
    expect(grade1.every((option) => option.strands <= 2 && option.kind !== 'litz')).toBe(true);
  });

  it('names metric sizes the way they are called out', () => {
    expect(formatNominalMillimetres(mm(0.5))).toBe('0.50');
    expect(formatNominalMillimetres(mm(0.112))).toBe('0.112');
    expect(formatNominalMillimetres(mm(1))).toBe('1.00');
  });

  it('grows the litz bundle with the square root of the strand count', () => {
    const { metric } = loadWireTables();
    const base = { strandDiameter: mm(0.1), servingThickness: 0, source: 'test' };

    expectWithin(
      litzBundleDiameter({ ...base, strandCount: 400 }, metric) / litzBundleDiameter({ ...base, strandCount: 100 }, metric),
      2,
      1e-12,
    );
  });
});
