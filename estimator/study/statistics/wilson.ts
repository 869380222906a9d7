// Wilson score interval for a binomial proportion, no continuity correction (Wilson 1927).

export interface Interval {
  low: number;
  high: number;
}

/**
 * Wilson score interval for k successes in n trials.
 *
 *   p = k/n,  centre = (p + z²/2n) / (1 + z²/n),
 *   half = z / (1 + z²/n) · sqrt(p(1-p)/n + z²/4n²),  [centre - half, centre + half]
 *
 * Valid inputs: integers 0 <= k <= n. n = 0 gives the uninformative [0, 1].
 * The limits are exactly 0 when k = 0 and exactly 1 when k = n.
 * @example wilson(0, 20) // { low: 0, high: 0.1611 }
 */
export function wilson(k: number, n: number, z = 1.96): Interval {
  if (!Number.isInteger(k) || !Number.isInteger(n) || k < 0 || n < 0 || k > n) {
    throw new RangeError(`wilson: need integers 0 <= k <= n, got k = ${k}, n = ${n}`);
  }
  if (n === 0) return { low: 0, high: 1 };
  const p = k / n;
  const z2 = z * z;
  const denominator = 1 + z2 / n;
  const centre = (p + z2 / (2 * n)) / denominator;
  const half = (z / denominator) * Math.sqrt((p * (1 - p)) / n + z2 / (4 * n * n));
  return { low: k === 0 ? 0 : Math.max(0, centre - half), high: k === n ? 1 : Math.min(1, centre + half) };
}
