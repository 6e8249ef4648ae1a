import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { harmonicWeights, rippleHarmonic, rippleHarmonics } from '@shared/engine/harmonics';

describe('ripple harmonics', () => {
  it('sum to the triangle mean square ΔI²/12 (Parseval on the Fourier series of the triangle, derived algebraically)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.05, max: 0.95, noNaN: true }), fc.double({ min: 0.1, max: 20, noNaN: true }), (duty, ripple) => {
        const { meanSquare } = harmonicWeights(ripple, duty, 200);
        const total = meanSquare.reduce((a, b) => a + b, 0);
        expect(Math.abs(total - (ripple * ripple) / 12) / ((ripple * ripple) / 12)).toBeLessThan(1e-5);
      }),
    );
  });

  it('vanish where n·D is an integer (zeros of sin(nπD) in I_n = ΔI·|sin(nπD)|/(n²π²D(1 − D)), derived algebraically)', () => {
    const half = rippleHarmonics(1, 0.5, 6);
    expect(half[1]).toBeLessThan(1e-15);
    expect(half[3]).toBeLessThan(1e-15);
    expect(rippleHarmonic(1, 1 / 3, 3)).toBeLessThan(1e-15);
    expect(rippleHarmonic(1, 1 / 3, 6)).toBeLessThan(1e-15);
  });

  it('gives I_1 = 4·ΔI/π² for a symmetric triangle (I_n = ΔI·|sin(nπD)|/(n²π²D(1 − D)) at D = 0.5, derived algebraically)', () => {
    expect(rippleHarmonic(1, 0.5, 1)).toBeCloseTo(4 / Math.PI ** 2, 12);
  });

  it('has an envelope bounding every harmonic', () => {
    const { meanSquare, envelope } = harmonicWeights(2, 0.27, 50);
    meanSquare.forEach((value, i) => expect(value).toBeLessThanOrEqual(envelope[i]!));
  });
});
