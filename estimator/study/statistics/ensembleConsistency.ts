// Robust consistency verdict over an ensemble of trials, bin by bin (height or phase bins).
import { averagedChiSquareInterval, chiSquareQuantile } from '../../stats/chiSquare.js';
import type { Consistency } from './neesVerdict.js';

/** One bin's samples: one value per trial, that trial's mean NEES (or NIS) inside the bin. */
export interface BinSamples {
  label: string;
  values: readonly number[];
}

export interface BinConsistency {
  label: string;
  /** Trials with a value in this bin, outliers included. */
  runs: number;
  /** Plain mean and median of all values (outliers included), for display beside the verdict. */
  mean: number;
  median: number;
  /** Mean over the trials that are not outliers: what the verdict tests. */
  robustMean: number;
  /** Acceptance interval for robustMean: [chi2_{M n}(a/2) / M, chi2_{M n}(1 - a/2) / M], M = runs - outliers. */
  low: number;
  high: number;
  /** Trials whose value lies above the single-run outlier threshold. */
  outliers: number;
  verdict: Consistency;
}

export interface EnsembleConsistency {
  dim: number;
  level: number;
  bins: BinConsistency[];
  /** Share of bins whose verdict is consistent (0..1). */
  insideShare: number;
  /** Outliers summed over bins (a trial may count in several bins). */
  outlierTrials: number;
  verdict: Consistency;
}

/** Share of bins that must be consistent for the ensemble to be called consistent. */
export const CONSISTENT_BIN_SHARE = 0.9;
/** Family-wise chance, per bin, of calling a sound trial an outlier (split over its runs). */
const OUTLIER_FAMILY_RISK = 0.01;
/** Outliers tolerated per bin before they alone make it over-confident: 5 % of runs, at least 1. */
const TOLERATED_OUTLIER_SHARE = 0.05;

/**
 * The ensemble NEES test of Bar-Shalom, Li, Kirubarajan 2001 (section 5.4), made robust:
 * in each bin, M trials' values average to a statistic with M * mean ~ chi-square(M n), so
 * the 95 % acceptance interval of the average is [chi2_{Mn}(0.025) / M, chi2_{Mn}(0.975) / M].
 *
 * Two departures from the textbook test, both so one bad trial cannot decide the study:
 * - Outliers: a value above the chi-square(n) quantile at 1 - 0.01 / runs (a Bonferroni split of
 *   a 1 % family risk) is counted as an outlier and left out of the averaged test. Each value is
 *   a time average of correlated samples, whose spread is narrower than one chi-square(n) draw,
 *   so this threshold rarely flags a sound trial. More outliers than 5 % of the runs (at least
 *   one is always tolerated) make the bin over-confident on their own.
 * - Correlated samples: values are per-trial means inside a bin, so independence holds across
 *   trials (separate random streams) though not within one; the interval uses trials as runs.
 *
 * The ensemble is consistent when at least 90 % of its bins are; otherwise the verdict is the
 * direction most failing bins take (ties: over-confident, the unsafe side).
 * NIS works the same way with n = the measurement dimension.
 * @example ensembleConsistency([{ label: '0-1 m', values: [6.1, 5.8, 6.4] }], 6).verdict // 'consistent'
 */
export function ensembleConsistency(bins: readonly BinSamples[], dim: number, level = 0.95): EnsembleConsistency {
  if (!Number.isInteger(dim) || dim <= 0) throw new RangeError(`ensembleConsistency: dimension must be a positive integer, got ${dim}`);
  if (!(level > 0 && level < 1)) throw new RangeError(`ensembleConsistency: level must be in (0, 1), got ${level}`);
  const judged: BinConsistency[] = [];
  for (const bin of bins) {
    if (bin.values.length === 0) continue;
    judged.push(judgeBin(bin, dim, level));
  }
  if (judged.length === 0) throw new RangeError('ensembleConsistency: no bin holds any value');
  let inside = 0, over = 0, under = 0, outlierTrials = 0;
  for (const b of judged) {
    outlierTrials += b.outliers;
    if (b.verdict === 'consistent') inside++;
    else if (b.verdict === 'over-confident') over++;
    else under++;
  }
  const insideShare = inside / judged.length;
  const verdict: Consistency = insideShare >= CONSISTENT_BIN_SHARE ? 'consistent' : over >= under ? 'over-confident' : 'under-confident';
  return { dim, level, bins: judged, insideShare, outlierTrials, verdict };
}

function judgeBin(bin: BinSamples, dim: number, level: number): BinConsistency {
  const runs = bin.values.length;
  const threshold = chiSquareQuantile(1 - OUTLIER_FAMILY_RISK / runs, dim);
  let sum = 0, keptSum = 0, kept = 0;
  for (const v of bin.values) {
    if (Number.isNaN(v) || v < 0) throw new RangeError(`ensembleConsistency: bin "${bin.label}" holds ${v}; values must be non-negative (Infinity marks a diverged trial)`);
    sum += v;
    if (v <= threshold) {
      keptSum += v;
      kept++;
    }
  }
  const outliers = runs - kept;
  const tolerated = Math.max(1, Math.floor(TOLERATED_OUTLIER_SHARE * runs));
  const robustMean = kept > 0 ? keptSum / kept : Number.POSITIVE_INFINITY;
  const [low, high] = averagedChiSquareInterval(Math.max(kept, 1), dim, level);
  const verdict: Consistency =
    outliers > tolerated || robustMean > high ? 'over-confident' : robustMean < low ? 'under-confident' : 'consistent';
  return { label: bin.label, runs, mean: sum / runs, median: median(bin.values), robustMean, low, high, outliers, verdict };
}

function median(values: readonly number[]): number {
  const sorted = Float64Array.from(values).sort();
  const mid = sorted.length >> 1;
  return sorted.length % 2 === 1 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
}

/** The one sentence every output (CLI text, page, report) uses for a verdict. */
export function consistencyWords(verdict: Consistency): string {
  switch (verdict) {
    case 'consistent':
      return 'consistent: the errors are as large as the filter believes';
    case 'over-confident':
      return 'over-confident: the errors are larger than the filter believes';
    case 'under-confident':
      return 'under-confident: the errors are smaller than the filter believes';
  }
}
