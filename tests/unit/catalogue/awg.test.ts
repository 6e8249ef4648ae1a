import { describe, expect, it } from 'vitest';
import { awgDiameter, awgLabel, awgNumberOfAught, resistancePerMetre20, roundWireArea } from '@shared/catalogue/wire';
import { expectWithin } from './within';

// ASTM tabulates to four significant figures; allow half a unit in the fourth figure.
const FOUR_FIGURES = 6e-4;

describe('AWG bare diameters by the ASTM B258 formula', () => {
  it.each([
    // ASTM B258-02 via "American wire gauge" article: AWG 10 = 2.588 mm
    [10, 2.588],
    // ASTM B258-02 via "American wire gauge" article: AWG 18 = 1.024 mm
    [18, 1.024],
    // ASTM B258-02 via "American wire gauge" article: AWG 24 = 0.5106 mm
    [24, 0.5106],
    // ASTM B258-02 via "American wire gauge" article: AWG 30 = 0.2546 mm
    [30, 0.2546],
  ])('AWG %s is %s mm', (gauge, diameterMm) => {
    expectWithin(awgDiameter(gauge), diameterMm * 1e-3, FOUR_FIGURES);
  });

  it('handles n/0 sizes as gauge 1 − n', () => {
    // ASTM B258-02 via "American wire gauge" article: AWG 4/0 = 11.68 mm
    expect(awgNumberOfAught(4)).toBe(-3);
    expectWithin(awgDiameter(awgNumberOfAught(4)), 11.68e-3, FOUR_FIGURES);
    expect(awgLabel(-3)).toBe('4/0');
    expect(awgLabel(20)).toBe('20');
  });

  it('steps by the 39th root of 92 per gauge, and −6 gauges roughly doubles the diameter', () => {
    // ASTM B258-02 via "American wire gauge" article: ratio per gauge 92^(1/39) ≈ 1.1229
    expectWithin(awgDiameter(25) / awgDiameter(26), 1.1229, 1e-4);
    // ASTM B258-02 via "American wire gauge" article: −6 gauges ≈ 2× diameter, −3 gauges ≈ 2× area
    expectWithin(awgDiameter(14) / awgDiameter(20), 2, 0.01);
    expectWithin(roundWireArea(awgDiameter(17)) / roundWireArea(awgDiameter(20)), 2, 0.01);
  });
});

describe('copper resistance per metre at 20 °C', () => {
  it('is 20.95 mΩ/m for AWG 18 with the IEC 60028 resistivity', () => {
    // IEC 60028 ρ20 = 1.7241e-8 Ω·m; diameter from ASTM B258-02, area and R20 computed [C]: AWG 18 area 0.8230 mm², R20 = 20.95 mΩ/m
    expectWithin(roundWireArea(awgDiameter(18)), 0.823e-6, FOUR_FIGURES);
    expectWithin(resistancePerMetre20(awgDiameter(18)), 20.95e-3, FOUR_FIGURES);
  });

  it('is 84.21 mΩ/m for AWG 24 and 3.277 mΩ/m for AWG 10', () => {
    // IEC 60028 ρ20; diameter from ASTM B258-02, R20 computed [C]: AWG 24 R20 = 84.21 mΩ/m, AWG 10 R20 = 3.277 mΩ/m
    expectWithin(resistancePerMetre20(awgDiameter(24)), 84.21e-3, FOUR_FIGURES);
    expectWithin(resistancePerMetre20(awgDiameter(10)), 3.277e-3, FOUR_FIGURES);
  });
});
