/** Summaries of timing samples for bench figures. */

/** The nearest-rank p-th percentile (0 < p ≤ 100) of `values`; NaN when there are none. */
export function percentile(values: readonly number[], p: number): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)] ?? NaN;
}
