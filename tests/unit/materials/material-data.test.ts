import { describe, expect, it } from 'vitest';
import type { CoreMaterial } from '@shared/engine/types';
import { lowestLossTemperature, storedFitQuality } from '../../../server/materials/material-data.ts';
import { ferriteA } from '../engine/fixtures';

// ferriteA (invented) without its temperature factor and with round coefficients: Pv = 2·f^1.5·B̂^2.5 W/m³.
const { tempCoefficients: _factor, ...plain } = ferriteA;
const MATERIAL: CoreMaterial = { ...plain, k: 2, alpha: 1.5, beta: 2.5 };

describe('lowestLossTemperature', () => {
  it('is the stored temperature of lowest loss when the factor curves up from it', () => {
    expect(lowestLossTemperature({ lowestLossTemperature: 90, lossCurvature: 1e-4 })).toBe(90);
  });

  it('is null without a temperature behaviour and for a flat factor, which has no lowest point', () => {
    expect(lowestLossTemperature({ lowestLossTemperature: null, lossCurvature: null })).toBeNull();
    expect(lowestLossTemperature({ lowestLossTemperature: 25, lossCurvature: 0 })).toBeNull();
  });
});

describe('storedFitQuality', () => {
  it('is null without points and zero for points on the material’s own loss with its temperature factor', () => {
    expect(storedFitQuality(MATERIAL, [])).toBeNull();
    const material = { ...MATERIAL, tempCoefficients: { ct2: 1e-4, ct1: 0.018, ct0: 1.81 } };
    // At 100 kHz, 0.1 T, 50 °C: 2·(1e5)^1.5·0.1^2.5·(0.25 − 0.9 + 1.81) = 2·3.1623e7·3.1623e-3·1.16 (arithmetic).
    const loss = 2 * 1e5 ** 1.5 * 0.1 ** 2.5 * 1.16;
    const quality = storedFitQuality(material, [{ frequency: 1e5, peakFlux: 0.1, temperature: 50, lossDensity: loss }]);
    expect(quality!.worstRelativeError).toBeLessThan(1e-12);
    expect(quality!.pointCount).toBe(1);
  });

  it('measures a point twice the model as −50 % (model/measured − 1)', () => {
    const loss = 2 * 1e5 ** 1.5 * 0.1 ** 2.5;
    const quality = storedFitQuality(MATERIAL, [
      { frequency: 1e5, peakFlux: 0.1, temperature: 25, lossDensity: loss },
      { frequency: 1e5, peakFlux: 0.1, temperature: 25, lossDensity: 2 * loss },
    ]);
    expect(quality!.worstRelativeError).toBeCloseTo(0.5, 12);
    expect(quality!.rmsRelativeError).toBeCloseTo(Math.sqrt(0.25 / 2), 12);
  });
});
