// The ensemble NEES of the descent per true-height bin, for any sweep study: each point's robust
// mean NEES per bin divided by its dimension, against the bin's acceptance interval, with the
// verdict in the words every output shares. It reads the summaries' `descentNees` (the robust
// ensemble verdict of estimator/study/statistics/ensembleConsistency), and says so plainly when
// the results carry no per-height NEES.
import type { EnsembleConsistency } from '../../estimator/study/statistics/ensembleConsistency.js';
import { consistencyWords } from '../../estimator/study/statistics/ensembleConsistency.js';
import type { PointSummary } from '../../estimator/study/summarize.js';
import { MUTED, SERIES } from '../figures/palette.js';
import { plotSvg, type Layer } from '../figures/plot.js';
import { formatNumber } from '../figures/svg.js';
import type { JobState } from '../jobs/JobState.js';
import type { SweepOutput } from '../jobs/sweepJob.js';
import { fromState, HALF, keyNumber, toCsv } from './figureOutput.js';
import type { StudyFigure } from './Study.js';

/** The per-height verdict of a point, when its results carry one (results written before neesByHeight do not). */
function descentOf(p: PointSummary): EnsembleConsistency | null {
  return p.descentNees ?? null;
}

export function descentNeesFigure(pointLabel: (p: PointSummary, impairment: string) => string): StudyFigure {
  return {
    name: 'descentNees',
    title: 'Consistency during the descent',
    caption: 'Robust mean NEES per true-height bin divided by its dimension, per sweep point, against the bins’ acceptance interval (band: the first point’s); the verdict per point in words. Outlier trials are counted and set aside (ensembleConsistency).',
    inputs: ['sweep', 'impairment'],
    compute: (state: JobState<SweepOutput>, impairment: string) =>
      fromState(state, 'trials', (value, partial) => {
        const points = value.summaries.map((p) => ({ p, d: descentOf(p) })).filter((x): x is { p: PointSummary; d: EnsembleConsistency } => x.d !== null);
        if (points.length === 0) return { kind: 'table', markup: '<p>These results carry no NEES per height of the descent.</p>', csv: null };
        const labels = points[0]!.d.bins.map((b) => b.label);
        const dim = points[0]!.d.dim;
        const at = (d: EnsembleConsistency, label: string) => d.bins.find((b) => b.label === label) ?? null;
        const x = labels.map((_, i) => i);
        const first = points[0]!.d;
        const layers: Layer[] = [
          { kind: 'band', x, low: labels.map((l) => (at(first, l)?.low ?? NaN) / dim), high: labels.map((l) => (at(first, l)?.high ?? NaN) / dim), color: SERIES[0], label: 'acceptance interval' },
          { kind: 'rule', axis: 'y', value: 1, color: MUTED, dash: 2, label: 'consistent = 1' },
          ...points.flatMap(({ p, d }, i): Layer[] => {
            const y = labels.map((l) => (at(d, l)?.robustMean ?? NaN) / dim);
            const color = SERIES[(i + 1) % SERIES.length]!;
            return [
              { kind: 'line', x, y, color, dash: i % 4, label: pointLabel(p, impairment) },
              { kind: 'points', x, y, color, titles: labels.map((l) => { const b = at(d, l); return b ? `${pointLabel(p, impairment)}, ${l}: ${formatNumber(b.robustMean / dim)} (interval ${formatNumber(b.low / dim)} to ${formatNumber(b.high / dim)}), ${b.verdict}` : `${l}: no value`; }) },
            ];
          }),
        ];
        const highest = Math.max(2, ...points.flatMap(({ d }) => d.bins.map((b) => b.robustMean / dim)).filter(Number.isFinite));
        return {
          markup: plotSvg({
            title: 'Consistency during the descent',
            ...HALF,
            x: { label: 'true height above the deck', domain: [-0.5, labels.length - 0.5], tickLabels: labels.map((label, i) => ({ value: i, label })) },
            y: { label: 'NEES ÷ dimension', domain: [0, Math.min(highest, 20) * 1.1] },
            note: partial ? 'partial results' : undefined,
            layers,
          }),
          csv: toCsv(['point', 'bin', 'runs', 'mean', 'median', 'robustMean', 'low', 'high', 'outliers', 'verdict'], points.flatMap(({ p, d }) => d.bins.map((b) => [pointLabel(p, impairment), b.label, b.runs, b.mean, b.median, b.robustMean, b.low, b.high, b.outliers, b.verdict]))),
          numbers: points.map(({ p, d }, i) => keyNumber(`descentVerdict${i}`, `${pointLabel(p, impairment)}: ${formatNumber(100 * d.insideShare)} % of bins inside`, d.insideShare, consistencyWords(d.verdict))),
        };
      }),
  };
}
