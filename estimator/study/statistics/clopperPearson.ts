// Exact binomial confidence bounds (Clopper and Pearson 1934, Biometrika 26), one-sided.
import { binomialTail } from './binomialTail.js';

/** Bisection steps: 2^-60 of the unit interval is below double precision near any bound. */
const STEPS = 60;

/**
 * One-sided lower confidence bound on a proportion p from k successes in n trials, at
 * `confidence` (e.g. 0.95): the p_L with P(X >= k | p_L) = 1 - confidence, X ~ Bin(n, p_L);
 * 0 when k = 0. With k = n it is (1 - confidence)^(1/n) exactly.
 * @example clopperPearsonLower(59, 59, 0.95) // 0.9505 (59 of 59 shows p >= 0.95)
 */
export function clopperPearsonLower(k: number, n: number, confidence: number): number {
  if (!Number.isInteger(k) || !Number.isInteger(n) || k < 0 || n < 1 || k > n) throw new RangeError(`clopperPearson: need integers 0 <= k <= n, n >= 1, got k = ${k}, n = ${n}`);
  if (!(confidence > 0 && confidence < 1)) throw new RangeError(`clopperPearson: confidence must be in (0, 1), got ${confidence}`);
  const alpha = 1 - confidence;
  if (k === 0) return 0;
  if (k === n) return Math.pow(alpha, 1 / n);
  // P(X >= k | p) rises with p: find where it crosses alpha
  let lo = 0, hi = 1;
  for (let i = 0; i < STEPS; i++) {
    const mid = (lo + hi) / 2;
    if (binomialTail(n, mid, k) < alpha) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

/** One-sided upper bound: 1 - the lower bound of the failures' proportion. */
export function clopperPearsonUpper(k: number, n: number, confidence: number): number {
  return 1 - clopperPearsonLower(n - k, n, confidence);
}
