// Interval for the difference of two independent proportions from their Wilson intervals.
import { wilson, type Interval } from './wilson.js';

/**
 * p1 - p2 with the hybrid score interval (Newcombe 1998, "Interval estimation for the
 * difference between independent proportions", Statistics in Medicine 17:873-890, method 10):
 *   L = d - sqrt((p1 - l1)² + (u2 - p2)²),  U = d + sqrt((u1 - p1)² + (p2 - l2)²)
 * with [l_i, u_i] the Wilson interval of p_i. Needs n1, n2 > 0.
 * @example differenceInterval(56, 70, 48, 80) // { low: ≈0.052, high: ≈0.334 }
 */
export function differenceInterval(k1: number, n1: number, k2: number, n2: number, z = 1.96): Interval & { difference: number } {
  if (n1 <= 0 || n2 <= 0) throw new RangeError(`differenceInterval: both samples need trials, got n1 = ${n1}, n2 = ${n2}`);
  const p1 = k1 / n1, p2 = k2 / n2;
  const w1 = wilson(k1, n1, z), w2 = wilson(k2, n2, z);
  const d = p1 - p2;
  return {
    difference: d,
    low: d - Math.sqrt((p1 - w1.low) ** 2 + (w2.high - p2) ** 2),
    high: d + Math.sqrt((w1.high - p1) ** 2 + (p2 - w2.low) ** 2),
  };
}
