// Waveforms of one switching period for a chart: few points, the extremes kept.

/**
 * At most `limit` [t, i] points of a sampled waveform: evenly spaced samples by index, plus its highest and lowest
 * point (an even pick could step over the peak the table reports).
 */
export function decimateWaveform(time: number[], current: number[], limit: number): [number, number][] {
  const n = time.length;
  if (n <= limit) return time.map((t, k) => [t, current[k]!]);
  let high = 0;
  let low = 0;
  current.forEach((i, k) => {
    if (i > current[high]!) high = k;
    if (i < current[low]!) low = k;
  });
  const picked = new Set([0, n - 1, high, low]);
  const even = limit - picked.size;
  for (let k = 0; k < even && picked.size < limit; k++) picked.add(Math.round((k * (n - 1)) / (even - 1)));
  return [...picked].sort((a, b) => a - b).map((k) => [time[k]!, current[k]!]);
}

/** The engine's waveform: a straight rise from the valley to the peak over D·T, a straight fall back by T. */
export function predictedTriangle(valley: number, peak: number, duty: number, period: number): [number, number][] {
  return [
    [0, valley],
    [duty * period, peak],
    [period, valley],
  ];
}
