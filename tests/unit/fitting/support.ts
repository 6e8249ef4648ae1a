import { FitInputError } from '@shared/fitting/fit-error';

/**
 * Seeded uniform generator for repeatable noise: mulberry32 (a public-domain 32-bit generator by Tommy Ettinger;
 * common practice, no source). Returns numbers in [0, 1).
 */
export function seededUniform(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** A multiplicative noise factor uniform in [1 − spread, 1 + spread]. */
export function noiseFactor(uniform: () => number, spread: number): number {
  return 1 + spread * (2 * uniform() - 1);
}

/** Relative difference |a − b|/|b|. */
export const relative = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

/** The FitInputError `run` throws (any other outcome fails the test). */
export function refusal(run: () => unknown): FitInputError {
  try {
    run();
  } catch (error) {
    if (error instanceof FitInputError) return error;
    throw error;
  }
  throw new Error('expected a FitInputError');
}
