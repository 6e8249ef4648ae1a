import { describe, expect, it } from 'vitest';
import { lowestTemperatureFactor } from '@shared/engine/temperature-range';

// The parabola ct2·T² − ct1·T + ct0 has its minimum ct0 − ct1²/(4·ct2) at T = ct1/(2·ct2) (calculus, no source needed).
describe('lowestTemperatureFactor', () => {
  it('finds the vertex of a parabola normalised to 1 at 90 °C', () => {
    const c = { ct2: 1e-4, ct1: 2 * 1e-4 * 90, ct0: 1 + 1e-4 * 90 ** 2 };
    expect(lowestTemperatureFactor(c, -40, 200)).toEqual({ value: expect.closeTo(1, 12), at: expect.closeTo(90, 9) });
  });

  it('finds a factor that turns negative inside the range', () => {
    // 2e-4·T² − 0.04·T + 1.5: vertex at 100 °C, value 1.5 − 2 = −0.5.
    const c = { ct2: 2e-4, ct1: 0.04, ct0: 1.5 };
    const lowest = lowestTemperatureFactor(c, 25, 150);
    expect(lowest.at).toBeCloseTo(100, 9);
    expect(lowest.value).toBeCloseTo(-0.5, 12);
  });

  it('takes an end of the range when the vertex lies outside it, or the parabola opens downward', () => {
    expect(lowestTemperatureFactor({ ct2: 1e-4, ct1: 0.05, ct0: 7 }, 0, 100).at).toBe(100); // vertex at 250 °C
    expect(lowestTemperatureFactor({ ct2: -1e-5, ct1: 0, ct0: 1 }, 0, 150).at).toBe(150);
  });
});
