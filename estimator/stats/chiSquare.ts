// Chi-square distribution helpers (wrapping @stdlib), used for gates and consistency bounds.
import quantile from '@stdlib/stats-base-dists-chisquare-quantile';
import cdf from '@stdlib/stats-base-dists-chisquare-cdf';

/** x with P(X <= x) = p for X ~ chi-square(dof). Throws on p outside [0, 1] or dof <= 0. */
export function chiSquareQuantile(p: number, dof: number): number {
  if (!(p >= 0 && p <= 1)) throw new RangeError(`chi-square probability must be in [0, 1], got ${p}`);
  if (!(dof > 0)) throw new RangeError(`chi-square degrees of freedom must be positive, got ${dof}`);
  return quantile(p, dof);
}

/** P(X <= x) for X ~ chi-square(dof). */
export function chiSquareCdf(x: number, dof: number): number {
  if (!(dof > 0)) throw new RangeError(`chi-square degrees of freedom must be positive, got ${dof}`);
  if (Number.isNaN(x)) throw new RangeError('chi-square cdf of NaN');
  return cdf(x, dof);
}

/**
 * Two-sided acceptance interval for the average of N independent chi-square(dof) values
 * (e.g. NEES over N Monte Carlo runs; Bar-Shalom, Li, Kirubarajan 2001, section 5.4):
 * N · mean ~ chi-square(N dof), so mean ∈ [q((1-level)/2, N dof) / N, q((1+level)/2, N dof) / N].
 * @example averagedChiSquareInterval(50, 2) // ≈ [1.48, 2.59]
 */
export function averagedChiSquareInterval(runs: number, dof: number, level = 0.95): [number, number] {
  if (!(runs >= 1) || !Number.isInteger(runs)) throw new RangeError(`number of runs must be a positive integer, got ${runs}`);
  if (!(level > 0 && level < 1)) throw new RangeError(`confidence level must be in (0, 1), got ${level}`);
  const total = runs * dof;
  return [chiSquareQuantile((1 - level) / 2, total) / runs, chiSquareQuantile((1 + level) / 2, total) / runs];
}
