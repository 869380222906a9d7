// Rule of three: with zero events in n trials, the 95 % upper bound on the event rate is about 3/n.

/**
 * Approximate one-sided 95 % upper bound on an event rate after n trials with no event:
 * 3/n, from -ln(0.05) = 2.996 (the exact bound is 1 - 0.05^(1/n)). n must be a positive integer.
 * @example ruleOfThree(30) // 0.1 — "30 of 30 landed" still allows a 10 % failure rate
 */
export function ruleOfThree(n: number): number {
  if (!Number.isInteger(n) || n <= 0) throw new RangeError(`ruleOfThree: need a positive integer n, got ${n}`);
  return Math.min(1, 3 / n);
}
