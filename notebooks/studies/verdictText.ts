// One consistency verdict as the page and the report say it: the averaged NIS or NEES as a ratio
// to its dimension, its acceptance interval as the same ratio, and the shared verdict words
// (estimator/study/statistics: the rule of neesVerdict, the words of consistencyWords), so the
// page says what the CLI says for the same numbers.
import { consistencyWords } from '../../estimator/study/statistics/ensembleConsistency.js';
import { neesVerdict, type Consistency } from '../../estimator/study/statistics/neesVerdict.js';
import { formatNumber } from '../figures/svg.js';

export interface VerdictText {
  ratio: number;
  low: number;
  high: number;
  verdict: Consistency;
  /** e.g. "0.34 of its dimension, interval 0.93 to 1.07: under-confident: the errors are smaller than the filter believes". */
  text: string;
}

/** Null when there is nothing to judge (no samples, or a non-finite mean). */
export function verdictText(mean: number | null, runs: number, dim: number, level = 0.95): VerdictText | null {
  if (mean === null || !Number.isFinite(mean) || mean < 0 || runs <= 0 || dim <= 0) return null;
  const v = neesVerdict(mean, runs, dim, level);
  const ratio = mean / dim;
  const low = v.low / dim;
  const high = v.high / dim;
  return { ratio, low, high, verdict: v.verdict, text: `${formatNumber(ratio)} of its dimension ${dim}, interval ${formatNumber(low)} to ${formatNumber(high)}: ${consistencyWords(v.verdict)}` };
}
