// Fourier series of a periodic piecewise-linear waveform (an inductor current in CCM, at the boundary or in DCM).

/** Average, RMS and harmonic mean squares I_n²/2 (index 0 holds n = 1) of a piecewise-linear periodic waveform. */
export interface WaveformSpectrum {
  average: number;
  rms: number;
  meanSquare: Float64Array;
}

/**
 * A piecewise-linear x(t) has x'' = Σ_k Δs_k·δ(t − t_k), where Δs_k is the change of slope at corner t_k, so its
 * complex Fourier coefficients are c_n = −Σ_k Δs_k·e^(−jω_n·t_k) / (ω_n²·T) for n ≥ 1 (integrate twice; exact, no
 * sampling). The peak amplitude of harmonic n is 2|c_n|. `times` ascend from 0 to the period; `values` has the same
 * length with the last equal to the first.
 */
export function piecewiseLinearSpectrum(times: ArrayLike<number>, values: ArrayLike<number>, count: number): WaveformSpectrum {
  const corners = times.length - 1;
  if (corners < 2 || values.length !== times.length)
    throw new RangeError('a periodic waveform needs at least three points, times and values alike');
  const period = times[corners]! - times[0]!;
  const slopes = new Float64Array(corners);
  let area = 0;
  let squareArea = 0;
  for (let k = 0; k < corners; k++) {
    const dt = times[k + 1]! - times[k]!;
    const a = values[k]!;
    const b = values[k + 1]!;
    slopes[k] = dt > 0 ? (b - a) / dt : 0;
    area += ((a + b) / 2) * dt;
    squareArea += ((a * a + a * b + b * b) / 3) * dt;
  }
  const meanSquare = new Float64Array(count);
  for (let n = 1; n <= count; n++) {
    const omega = (2 * Math.PI * n) / period;
    let re = 0;
    let im = 0;
    for (let k = 0; k < corners; k++) {
      // The corner at times[k] joins segment k − 1 (the last one for k = 0, the waveform being periodic) to segment k.
      const change = slopes[k]! - slopes[k === 0 ? corners - 1 : k - 1]!;
      if (change === 0) continue;
      const phase = omega * (times[k]! - times[0]!);
      re += change * Math.cos(phase);
      im -= change * Math.sin(phase);
    }
    const magnitude = Math.hypot(re, im) / (omega * omega * period);
    meanSquare[n - 1] = 2 * magnitude * magnitude;
  }
  return { average: area / period, rms: Math.sqrt(squareArea / period), meanSquare };
}
