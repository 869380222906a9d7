// Empirical percentile with linear interpolation between order statistics.

/**
 * The p-quantile (0 <= p <= 1) of finite values, linear interpolation between order
 * statistics at h = (n - 1) p (Hyndman and Fan type 7, as in spreadsheets and d3.quantile).
 * Returns null for no values; non-finite values are refused, never skipped.
 * @example percentile([1, 2, 3, 4], 0.5) // 2.5
 */
export function percentile(values: ArrayLike<number>, p: number): number | null {
  if (!(p >= 0 && p <= 1)) throw new RangeError(`percentile: p must be in [0, 1], got ${p}`);
  const n = values.length;
  if (n === 0) return null;
  const sorted = Float64Array.from(values);
  for (let i = 0; i < n; i++) {
    if (!Number.isFinite(sorted[i]!)) throw new RangeError(`percentile: value ${i} is not finite (${sorted[i]})`);
  }
  sorted.sort();
  return quantileSorted(sorted, p);
}

/** The p-quantile of values already sorted ascending (type 7). */
export function quantileSorted(sorted: ArrayLike<number>, p: number): number {
  const h = (sorted.length - 1) * p;
  const i = Math.floor(h);
  const lower = sorted[i]!;
  return i + 1 < sorted.length ? lower + (h - i) * (sorted[i + 1]! - lower) : lower;
}
