// Upper tail of the binomial distribution, P(X >= k) for X ~ Bin(n, p).
import { logGamma } from './logGamma.js';

/**
 * P(X >= k), X ~ Bin(n, p). Sums the probability mass from the requested end towards the
 * mode with the recurrence pmf(j+1) = pmf(j) (n-j)/(j+1) p/(1-p), stopping once terms no
 * longer change the sum, so large n stays cheap.
 * @example binomialTail(10, 0.5, 10) // 1/1024
 */
export function binomialTail(n: number, p: number, k: number): number {
  if (!Number.isInteger(n) || n < 0 || !Number.isInteger(k)) throw new RangeError(`binomialTail: need integers n >= 0 and k, got n = ${n}, k = ${k}`);
  if (!(p >= 0 && p <= 1)) throw new RangeError(`binomialTail: p must be in [0, 1], got ${p}`);
  if (k <= 0) return 1;
  if (k > n) return 0;
  if (p === 0) return 0;
  if (p === 1) return 1;
  const mode = Math.floor((n + 1) * p);
  const logPmf = (j: number): number =>
    logGamma(n + 1) - logGamma(j + 1) - logGamma(n - j + 1) + j * Math.log(p) + (n - j) * Math.log1p(-p);
  const odds = p / (1 - p);
  if (k > mode) {
    // Sum upward from k: terms only shrink.
    let term = Math.exp(logPmf(k));
    let sum = 0;
    for (let j = k; j <= n; j++) {
      sum += term;
      if (term < sum * 1e-17) break;
      term *= ((n - j) / (j + 1)) * odds;
    }
    return Math.min(1, sum);
  }
  // 1 - P(X <= k-1), summing downward from k-1.
  let term = Math.exp(logPmf(k - 1));
  let sum = 0;
  for (let j = k - 1; j >= 0; j--) {
    sum += term;
    if (term < sum * 1e-17) break;
    term *= (j / (n - j + 1)) / odds;
  }
  return Math.max(0, 1 - sum);
}
