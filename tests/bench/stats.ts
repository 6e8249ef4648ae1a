/** Nearest-rank percentile of an ascending list: the smallest value with at least p % of the list at or below it. */
export function percentile(sorted: readonly number[], p: number): number {
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1))] ?? NaN;
}

export const median = (values: readonly number[]) =>
  percentile(
    [...values].sort((a, b) => a - b),
    50,
  );
