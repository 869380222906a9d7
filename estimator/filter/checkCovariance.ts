// Divergence detection: a covariance that is not finite or not positive definite is a named
// event, never a NaN passed downstream. Allocation-free (`work` holds n² numbers).
import { cholesky } from './cholesky.js';

/** The named divergence events of the filter core. */
export type DivergenceEvent = 'state-not-finite' | 'covariance-not-finite' | 'covariance-not-positive-definite';

/** True when every entry of a is finite (one pass; NaN and ±Infinity poison the sum). */
export function allFinite(a: ArrayLike<number>, length = a.length): boolean {
  let sum = 0;
  for (let i = 0; i < length; i++) sum += a[i]! * 0;
  return sum === 0;
}

/**
 * null when x is finite and P is finite and positive definite (Cholesky succeeds);
 * otherwise the name of the first problem found.
 */
export function checkCovariance(x: ArrayLike<number>, P: ArrayLike<number>, n: number, work: Float64Array): DivergenceEvent | null {
  if (!allFinite(x, n)) return 'state-not-finite';
  if (!allFinite(P, n * n)) return 'covariance-not-finite';
  if (!cholesky(P, n, work)) return 'covariance-not-positive-definite';
  return null;
}
