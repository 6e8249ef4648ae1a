import { describe, expect, it } from 'vitest';
import { biasLossFactor, coreDcField } from '@shared/engine/dc-bias-loss';
import { MU0 } from '@shared/engine/constants';
import { fitBiasLoss } from '@shared/fitting/bias-loss-fit';

describe('DC-bias loss factor', () => {
  it('is 1 at zero field and without data, 2 at H₂, and rises as (H/H₂)^m beyond', () => {
    const curve = { doublingField: 60, steepness: 1.5 };
    expect(biasLossFactor(curve, 0)).toBe(1);
    expect(biasLossFactor(undefined, 100)).toBe(1);
    expect(biasLossFactor(curve, 60)).toBeCloseTo(2, 12);
    expect(biasLossFactor(curve, 240)).toBeCloseTo(1 + 4 ** 1.5, 12);
  });

  it('takes the field in the material: N·I/le for a distributed gap, B/(μ0·μi) for a gapped ferrite (Ampère; B = μ0·μr·H)', () => {
    expect(coreDcField('distributed', 0.3, 60, 30, 10, 0.1)).toBeCloseTo(3000, 9);
    // 0.2 T in a ferrite of μi 2000 is 79.6 A/m
    expect(coreDcField('air-gap', 0.2, 2000, 30, 10, 0.1)).toBeCloseTo(0.2 / (MU0 * 2000), 9);
    expect(coreDcField('air-gap', 0.2, 2000, 30, 10, 0.1)).toBeCloseTo(79.58, 1);
  });
});

describe('fitBiasLoss', () => {
  it('recovers H₂ and m from ratios on the curve, and judges itself against every biased point', () => {
    const truth = { doublingField: 80, steepness: 1.7 };
    const points = [20, 40, 80, 160].map((field) => ({ field, ratio: biasLossFactor(truth, field) }));
    const fit = fitBiasLoss(points)!;
    expect(fit.doublingField).toBeCloseTo(80, 6);
    expect(fit.steepness).toBeCloseTo(1.7, 9);
    expect(fit.worstRelativeError).toBeLessThan(1e-9);
    expect(fit.pointCount).toBe(4);
  });

  it('says nothing when the points cannot: one field, or no rise', () => {
    expect(fitBiasLoss([{ field: 50, ratio: 1.8 }])).toBeNull();
    expect(
      fitBiasLoss([
        { field: 50, ratio: 1.0 },
        { field: 100, ratio: 1.01 },
      ]),
    ).toBeNull();
  });
});
