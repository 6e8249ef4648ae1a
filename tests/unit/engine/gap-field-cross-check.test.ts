import { describe, expect, it } from 'vitest';
import { evaluateDesign } from '@shared/engine/evaluate';
import { gapLossByWindowImages } from '@shared/engine/gap-field-cross-check';
import { powderP, powderRing, roundWire, workedDesign } from './fixtures';

// The image method's own agreement with the field solution is checked in tests/unit/solvers/gap-field-loss.test.ts;
// here, that the design page's cross-check is that method applied to the evaluated design.
describe('gapLossByWindowImages', () => {
  const at = (keepOut: number) => {
    const input = { ...workedDesign, keepOut };
    const result = evaluateDesign(input);
    return { result, images: gapLossByWindowImages(input, result)! };
  };

  it('falls as the copper keeps farther from the gap, as the field does (0.5, 1, 2 mm)', () => {
    const [near, mid, far] = [0.5e-3, 1e-3, 2e-3].map(at);
    expect(near!.images).toBeGreaterThan(mid!.images);
    expect(mid!.images).toBeGreaterThan(far!.images);
    expect(far!.images).toBeGreaterThan(0);
  });

  it('is absent where the design has no gap-field loss (a distributed-gap ring)', () => {
    const input = { ...workedDesign, core: powderRing, material: powderP, wire: roundWire(0.8e-3, 2) };
    const result = evaluateDesign(input);
    expect(result.copper.gapLoss ?? 0).toBe(0);
    expect(gapLossByWindowImages(input, result)).toBeUndefined();
  });
});
