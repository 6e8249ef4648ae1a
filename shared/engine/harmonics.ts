/** Most harmonics any sum in the engine takes; the series falls at least as n^−3.5. */
export const MAX_HARMONIC = 200;

/**
 * Peak amplitude of harmonic n of a triangular ripple with peak-to-peak ΔI and rise fraction D:
 * I_n = ΔI·|sin(nπD)| / (n²π²D(1 − D)).
 */
export function rippleHarmonic(rippleCurrent: number, duty: number, n: number): number {
  return (rippleCurrent * Math.abs(Math.sin(n * Math.PI * duty))) / (n * n * Math.PI * Math.PI * duty * (1 - duty));
}

/** Amplitudes I_1…I_count (index 0 holds n = 1). */
export function rippleHarmonics(rippleCurrent: number, duty: number, count = MAX_HARMONIC): Float64Array {
  const amplitudes = new Float64Array(count);
  for (let n = 1; n <= count; n++) amplitudes[n - 1] = rippleHarmonic(rippleCurrent, duty, n);
  return amplitudes;
}

/**
 * Mean-square contributions I_n²/2 plus the envelope ΔI²/(2·n⁴π⁴D²(1−D)²) that bounds them, which lets a sum
 * stop early without being fooled by harmonics that vanish (n·D an integer).
 */
export interface HarmonicWeights {
  meanSquare: Float64Array;
  envelope: Float64Array;
}

export function harmonicWeights(rippleCurrent: number, duty: number, count = MAX_HARMONIC): HarmonicWeights {
  const meanSquare = new Float64Array(count);
  const envelope = new Float64Array(count);
  const scale = rippleCurrent / (Math.PI * Math.PI * duty * (1 - duty));
  for (let n = 1; n <= count; n++) {
    const bound = scale / (n * n);
    const amplitude = bound * Math.abs(Math.sin(n * Math.PI * duty));
    meanSquare[n - 1] = (amplitude * amplitude) / 2;
    envelope[n - 1] = (bound * bound) / 2;
  }
  return { meanSquare, envelope };
}
