// Consistency verdict for an averaged NEES (or NIS) against its chi-square acceptance interval.
import { averagedChiSquareInterval } from '../../stats/chiSquare.js';

export type Consistency = 'consistent' | 'over-confident' | 'under-confident';

export interface NeesVerdict {
  /** The averaged statistic, its acceptance interval and the number of runs behind it. */
  mean: number;
  low: number;
  high: number;
  runs: number;
  verdict: Consistency;
}

/**
 * With N independent runs of an n-dimensional error, N times the average NEES is
 * chi-square with N n degrees of freedom, so at level 1 - alpha the average is accepted in
 *   [chi2_{Nn}(alpha/2) / N, chi2_{Nn}(1 - alpha/2) / N]   (Bar-Shalom, Li, Kirubarajan 2001, 5.4).
 * Above the interval the filter's covariance is too small (over-confident); below, too large
 * (under-confident). Each trial's NEES is itself a time average, which only narrows its
 * spread, so using N = trials keeps the test on the lenient side. NIS: n = measurement dimension.
 * @example neesVerdict(2.1, 50, 2) // { low: ≈1.48, high: ≈2.59, verdict: 'consistent', ... }
 */
export function neesVerdict(mean: number, runs: number, dim: number, level = 0.95): NeesVerdict {
  if (!Number.isFinite(mean) || mean < 0) throw new RangeError(`neesVerdict: mean must be a finite non-negative number, got ${mean}`);
  if (!Number.isInteger(runs) || runs <= 0) throw new RangeError(`neesVerdict: runs must be a positive integer, got ${runs}`);
  if (!Number.isInteger(dim) || dim <= 0) throw new RangeError(`neesVerdict: dimension must be a positive integer, got ${dim}`);
  const [low, high] = averagedChiSquareInterval(runs, dim, level);
  const verdict: Consistency = mean > high ? 'over-confident' : mean < low ? 'under-confident' : 'consistent';
  return { mean, low, high, runs, verdict };
}
