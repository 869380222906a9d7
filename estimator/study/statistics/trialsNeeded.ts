// How many trials before "k of n landed" supports a claim "success rate >= target".
import { binomialTail } from './binomialTail.js';
import { wilson } from './wilson.js';

export interface TrialsNeededOptions {
  /** Probability of demonstrating the target when the true rate is `rate` (default 0.8). */
  power?: number;
  /** Normal quantile of the Wilson interval (default 1.96: two-sided 95 %). */
  z?: number;
  /** Search limit (default 20,000 trials). */
  maxTrials?: number;
}

export interface TrialsNeeded {
  /** Smallest n for which n of n successes puts the Wilson lower bound at or above target. */
  allSucceed: number;
  /** Smallest n for which the expected count round(rate n) puts the lower bound at or above target; null past maxTrials. */
  atExpectedCount: number | null;
  /** Smallest n with P(lower bound >= target) >= power when successes are Bin(n, rate); null past maxTrials. */
  withPower: number | null;
  /** Rule-of-three counterpart of allSucceed: 3 / (1 - target), rounded up. */
  ruleOfThree: number;
}

/** Smallest k with Wilson lower bound >= target in n trials, or n + 1 if none. */
export function minimumSuccesses(n: number, target: number, z = 1.96): number {
  let lo = 0;
  let hi = n + 1;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (wilson(mid, n, z).low >= target) hi = mid;
    else lo = mid + 1;
  }
  return lo;
}

/**
 * Trials needed to show a success rate of at least `target` with the Wilson lower bound,
 * if the system truly succeeds at `rate`. With n of n the bound is n / (n + z²), so
 * allSucceed = ceil(z² target / (1 - target)).
 * @example trialsNeeded(0.95, 0.9).allSucceed // 35
 */
export function trialsNeeded(rate: number, target: number, options: TrialsNeededOptions = {}): TrialsNeeded {
  const { power = 0.8, z = 1.96, maxTrials = 20_000 } = options;
  if (!(rate > 0 && rate <= 1)) throw new RangeError(`trialsNeeded: rate must be in (0, 1], got ${rate}`);
  if (!(target > 0 && target < 1)) throw new RangeError(`trialsNeeded: target must be in (0, 1), got ${target}`);
  if (!(power > 0 && power < 1)) throw new RangeError(`trialsNeeded: power must be in (0, 1), got ${power}`);
  let allSucceed = Math.max(1, Math.ceil((z * z * target) / (1 - target)));
  while (wilson(allSucceed, allSucceed, z).low < target) allSucceed++; // guard the ceil against rounding
  let atExpectedCount: number | null = null;
  let withPower: number | null = null;
  if (rate > target) {
    for (let n = allSucceed; n <= maxTrials && (atExpectedCount === null || withPower === null); n++) {
      const kMin = minimumSuccesses(n, target, z);
      if (atExpectedCount === null && Math.round(rate * n) >= kMin) atExpectedCount = n;
      if (withPower === null && binomialTail(n, rate, kMin) >= power) withPower = n;
    }
  }
  return { allSucceed, atExpectedCount, withPower, ruleOfThree: Math.ceil(3 / (1 - target) - 1e-9) };
}
