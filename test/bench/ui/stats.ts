// Order statistics for the UI benchmark. Percentiles use the nearest-rank method (the smallest
// value with at least p % of the samples at or below it), so a reported p90 is a real sample.

/** The median: the middle value, or the mean of the two middle values for an even count. */
export function median(values: readonly number[]): number {
  if (values.length === 0) throw new Error('median of no values');
  const sorted = [...values].sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  return sorted.length % 2 === 1 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
}

/** The nearest-rank percentile `p` (0 < p ≤ 100). */
export function percentile(values: readonly number[], p: number): number {
  if (values.length === 0) throw new Error('percentile of no values');
  const sorted = [...values].sort((a, b) => a - b);
  const rank = Math.max(1, Math.ceil((p / 100) * sorted.length));
  return sorted[rank - 1];
}
