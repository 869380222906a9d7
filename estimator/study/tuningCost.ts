// The cost `alight tune` minimises for a setting of the filter multipliers on simulated trials.
import type { PointSummary } from './summarize.js';

/**
 * cost = (1 - success rate) + w · |ln(ANEES / n)|
 * ANEES: average over trials of each trial's mean NEES, n its dimension. A consistent filter
 * has ANEES ≈ n (Bar-Shalom, Li, Kirubarajan 2001, 5.4): the log makes "twice too large"
 * and "half too small" equally bad. w = 0.25 trades a factor 2 of NEES for about 17 % of
 * landing success. No NEES at all (every trial diverged) costs as much as ANEES off by e^4.
 */
export function tuningCost(summary: PointSummary, neesWeight = 0.25): number {
  const failure = 1 - summary.successRate;
  if (summary.neesMean === null || summary.neesDim === null || !(summary.neesMean > 0)) return failure + neesWeight * 4;
  return failure + neesWeight * Math.abs(Math.log(summary.neesMean / summary.neesDim));
}
