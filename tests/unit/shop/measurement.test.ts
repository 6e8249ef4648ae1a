import { describe, expect, it } from 'vitest';
import { judgeUnit, testFrequencyMatches } from '@shared/shop/measurement';
import type { SheetTestLimits } from '@shared/shop/sheet';

const limits: SheetTestLimits = {
  inductance: { nominal: 22e-6, min: 20e-6, max: 24e-6, testFrequency: 10e3, testLevel: 0.1 },
  resistanceMax20: 12.8e-3,
  biasInductance: { current: 11, predicted: 22e-6, min: 19.8e-6, fractionOfNominal: 0.9 },
  hipot: { required: false, instruction: 'Not required' },
};
const good = { inductance: 22e-6, testFrequency: 10e3, resistance: 10e-3, resistanceTemperature: 20, hipot: 'not_tested' as const };

describe('a unit against the sheet with an L-under-DC-bias test', () => {
  it('passes with L at the stated current at or above the limit', () => {
    const judged = judgeUnit(limits, { ...good, biasCurrent: 11, biasInductance: 21e-6 });
    expect(judged.passed).toBe(true);
    expect(judged.findings.map((f) => f.check)).toEqual(['inductance', 'test-frequency', 'resistance', 'bias-inductance']);
  });

  it('fails when L under bias is below the limit, read at too low a current, or not recorded', () => {
    expect(judgeUnit(limits, { ...good, biasCurrent: 11, biasInductance: 15e-6 }).passed).toBe(false);
    const low = judgeUnit(limits, { ...good, biasCurrent: 5, biasInductance: 21e-6 });
    expect(low.passed).toBe(false);
    expect(low.findings.at(-1)?.message).toMatch(/too low a current/);
    expect(judgeUnit(limits, good).findings.at(-1)?.message).toMatch(/required \(at 11 A\) but not recorded/);
  });

  it('takes a reading within 5 % of the sheet’s test frequency as the sheet’s', () => {
    expect(testFrequencyMatches(10.4e3, 10e3)).toBe(true);
    expect(testFrequencyMatches(100e3, 10e3)).toBe(false);
  });
});
