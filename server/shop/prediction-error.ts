import type { RatioSummary } from '@shared/schemas/shop';

function meanAndSpread(values: number[]): { mean: number; spread: number } {
  const mean = values.reduce((s, v) => s + v, 0) / values.length;
  const spread = values.length > 1 ? Math.sqrt(values.reduce((s, v) => s + (v - mean) ** 2, 0) / (values.length - 1)) : 0;
  return { mean, spread };
}

/** Mean and sample standard deviation of measured/predicted ratios, grouped by a key. */
export function summariseRatios(samples: { key: string; inductanceRatio: number; resistanceRatio: number }[]): RatioSummary[] {
  const groups = new Map<string, { l: number[]; r: number[] }>();
  for (const s of samples) {
    const g = groups.get(s.key) ?? { l: [], r: [] };
    g.l.push(s.inductanceRatio);
    g.r.push(s.resistanceRatio);
    groups.set(s.key, g);
  }
  return [...groups.entries()]
    .map(([key, g]) => ({ key, units: g.l.length, inductanceRatio: meanAndSpread(g.l), resistanceRatio: meanAndSpread(g.r) }))
    .sort((a, b) => a.key.localeCompare(b.key));
}
