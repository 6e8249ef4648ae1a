import { expect } from 'vitest';

/** Asserts |actual/expected − 1| ≤ relativeTolerance, reporting both values on failure. */
export function expectWithin(actual: number, expected: number, relativeTolerance: number): void {
  const deviation = Math.abs(actual / expected - 1);
  expect(deviation, `${actual} vs ${expected} (±${relativeTolerance * 100} %)`).toBeLessThanOrEqual(relativeTolerance);
}
