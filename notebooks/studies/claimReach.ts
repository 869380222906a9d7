// Can the chosen trials support the claim at all? With n trials the best a point can do is n of n,
// whose Wilson lower bound is n / (n + z²); below the target, no outcome of those trials shows the
// claim, and the page says so instead of printing "not shown" as if the system had failed.
import { trialsNeeded } from '../../estimator/study/statistics/trialsNeeded.js';
import { wilson } from '../../estimator/study/statistics/wilson.js';
import { formatPercent } from '../figures/svg.js';

export interface ClaimReach {
  /** Wilson lower bound of n successes in n trials. */
  bestLow: number;
  /** True when n of n would reach the target. */
  reachable: boolean;
  /** Straight successes needed for the lower bound to reach the target (the project's Wilson rule). */
  needed: number;
  /** One sentence for the page and the report. */
  words: string;
}

export function claimReach(trials: number, target: number, z: number): ClaimReach {
  const bestLow = wilson(trials, trials, z).low;
  const needed = target < 1 ? trialsNeeded(1, target, { z }).allSucceed : Number.POSITIVE_INFINITY;
  const reachable = bestLow >= target;
  const claim = `success ≥ ${formatPercent(target, 0)}`;
  const words =
    target >= 1
      ? `No number of trials shows ${claim}: a Wilson lower bound never reaches 100 %.`
      : reachable
        ? `${trials} trials per point can support ${claim}: ${trials} of ${trials} would give a lower bound of ${formatPercent(bestLow)} (at least ${needed} straight successes are needed).`
        : `${trials} trials per point cannot support ${claim}: even ${trials} of ${trials} landed gives a Wilson lower bound of only ${formatPercent(bestLow)}. Showing it takes at least ${needed} trials, all landed.`;
  return { bestLow, reachable, needed, words };
}
