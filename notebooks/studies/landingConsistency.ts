// The landing study's consistency plate. Left, NIS over time: every camera update's NIS = y' S^-1 y against the 95 %
// two-sided chi-square band of a single update, [q(0.025, m), q(0.975, m)] with m the update's
// dimension, and the gate threshold q(gateProbability, m) * gateScale above which the filter
// refused the box. For an honest filter about 95 % of the NIS values fall inside the band.
// Right, the trial's mean NIS (accepted updates) and mean NEES per dimension.
import { gateThreshold } from '../../estimator/filter/gate.js';
import type { Scenario } from '../../estimator/sim/Scenario.js';
import { chiSquareQuantile } from '../../estimator/stats/chiSquare.js';
import { ESTIMATE, MUTED, SERIES, TRUTH } from '../figures/palette.js';
import { extent, plotSvg, type Layer } from '../figures/plot.js';
import { sideBySide } from '../figures/sideBySide.js';
import { formatNumber } from '../figures/svg.js';
import type { JobState } from '../jobs/JobState.js';
import type { LandingOutput } from '../jobs/landingJob.js';
import { fromState, keyNumber, toCsv, WIDE } from './figureOutput.js';
import type { StudyFigure } from './Study.js';
import { verdictText } from './verdictText.js';
import { descentConsistency } from '../../estimator/study/statistics/descentConsistency.js';
import { consistencyWords } from '../../estimator/study/statistics/ensembleConsistency.js';

/** Two-sided level of the per-update band. */
export const NIS_BAND_LEVEL = 0.95;

export interface NisBandCount {
  /** Band [low, high] for one update of dimension dim at NIS_BAND_LEVEL. */
  low: number;
  high: number;
  /** Updates with a NIS (accepted or gated), and how many of them lie inside the band (inclusive). */
  total: number;
  inside: number;
}

/** Count the updates whose NIS lies inside the single-update chi-square band. */
export function nisBandCount(updates: LandingOutput['updates'], dim: number): NisBandCount {
  const low = chiSquareQuantile((1 - NIS_BAND_LEVEL) / 2, dim);
  const high = chiSquareQuantile((1 + NIS_BAND_LEVEL) / 2, dim);
  let total = 0, inside = 0;
  for (const u of updates) {
    if (!Number.isFinite(u.nis)) continue;
    total++;
    if (u.nis >= low && u.nis <= high) inside++;
  }
  return { low, high, total, inside };
}

const percent = (v: number | null) => (v === null ? '–' : `${formatNumber(100 * v)} %`);

/** Panel widths inside the wide plate: NIS over time, and the trial's means. */
const OVER_TIME = 610;
const MEANS = WIDE.width - OVER_TIME;

function nisOverTime(v: LandingOutput, band: NisBandCount, dim: number, gate: number): string {
  const accepted = v.updates.filter((u) => u.status === 'accepted' && Number.isFinite(u.nis));
  const gated = v.updates.filter((u) => u.status === 'gated' && Number.isFinite(u.nis));
  const values = [...accepted, ...gated].map((u) => u.nis).filter((n) => n > 0);
  const lowest = Math.min(band.low / 3, ...values.map((n) => n / 1.5));
  const top = Math.max(gate * 2, ...values.map((n) => n * 1.5));
  const time = extent(v.t, 0);
  return plotSvg({
    title: 'NIS of every camera update',
    width: OVER_TIME,
    height: WIDE.height,
    legendBelow: true,
    x: { label: 'time (s)', domain: time },
    y: { label: 'NIS (dimensionless)', domain: [Math.max(lowest, 1e-4), top], log: true, ticks: 4 },
    layers: [
      { kind: 'band', x: time, low: [band.low, band.low], high: [band.high, band.high], color: TRUTH, label: `95 % band, χ²(${dim})` },
      { kind: 'rule', axis: 'y', value: dim, color: MUTED, dash: 2, label: `expected ${dim}` },
      { kind: 'rule', axis: 'y', value: gate, color: SERIES[3], dash: 1, label: `gate ${formatNumber(gate)}` },
      { kind: 'points', x: accepted.map((u) => u.t), y: accepted.map((u) => u.nis), color: ESTIMATE, radius: 2.4, label: `accepted (${accepted.length})` },
      { kind: 'points', x: gated.map((u) => u.t), y: gated.map((u) => u.nis), color: SERIES[7], shape: 'square', radius: 2.6, label: `gated (${gated.length})` },
    ],
  });
}

/** Mean NIS (accepted updates) and mean NEES, each divided by its dimension; the NIS mean's acceptance interval for that many updates. */
function means(v: LandingOutput): string {
  const r = v.result;
  const b = v.nisBounds;
  const values = [r.nisMean / r.nisDim, r.neesMean / r.neesDim];
  return plotSvg({
    title: 'Trial means against their bands',
    width: MEANS,
    height: WIDE.height,
    legendBelow: true,
    marginLeft: 50,
    x: { label: 'mean ÷ dimension', domain: [-0.6, 1.6], tickLabels: [{ value: 0, label: `NIS ÷ ${r.nisDim}` }, { value: 1, label: `NEES ÷ ${r.neesDim}` }] },
    y: { label: '', domain: [0, Math.max(2, ...values.filter(Number.isFinite)) * 1.15] },
    layers: [
      { kind: 'rule', axis: 'y', value: 1, color: MUTED, dash: 2, label: 'expected 1' },
      ...(b ? [{ kind: 'rects', rects: [{ x0: -0.3, x1: 0.3, y0: b[0] / r.nisDim, y1: b[1] / r.nisDim, fill: 'rgba(0,114,178,0.3)', title: `95 % band ${formatNumber(b[0])}–${formatNumber(b[1])}` }], label: `95 % band, ${r.nisCount} updates`, legendColor: 'rgba(0,114,178,0.4)' } as Layer] : []),
      { kind: 'points', x: [0, 1], y: values, color: ESTIMATE, shape: 'diamond', radius: 6, titles: values.map((m) => formatNumber(m)), label: 'this trial' },
    ],
  });
}

export const consistencyFigure: StudyFigure = {
  name: 'consistency',
  title: 'NIS and NEES against their chi-square bands',
  caption: 'Left: NIS of each box update (log scale) against the band holding 95 % of single χ² values for its dimension; boxes above the gate line were refused (gated). Right: the trial’s mean NIS over accepted updates with its 95 % interval for that many updates, and mean NEES, each per dimension.',
  wide: true,
  inputs: ['run', 'flown'],
  compute: (state: JobState<LandingOutput>, flown: Scenario) =>
    fromState(state, 'trial', (v) => {
      const dim = v.updates.find((u) => u.dim > 0)?.dim ?? v.result.nisDim;
      const band = nisBandCount(v.updates, dim);
      const gate = gateThreshold(flown.filter.gateProbability, dim, flown.filter.gateScale);
      const share = band.total > 0 ? band.inside / band.total : null;
      const r = v.result;
      return {
        markup: sideBySide('NIS and NEES against their chi-square bands', [
          { svg: nisOverTime(v, band, dim, gate), width: OVER_TIME, height: WIDE.height },
          { svg: means(v), width: MEANS, height: WIDE.height },
        ]),
        csv: toCsv(['t', 'status', 'nis', 'dim', 'bandLow', 'bandHigh', 'gate'], v.updates.map((u) => [u.t, u.status, Number.isFinite(u.nis) ? u.nis : null, u.dim, band.low, band.high, gate])),
        numbers: [
          keyNumber('nisInBand', 'NIS inside the 95 % band', share, percent(share)),
          keyNumber('nisUpdates', 'updates with a NIS', band.total, String(band.total)),
          keyNumber('gateRejections', 'gated', r.gateRejections, String(r.gateRejections)),
          keyNumber('nisMean', 'mean NIS', r.nisMean),
          ...(() => {
            const v = verdictText(r.nisMean, r.nisCount, r.nisDim);
            return v ? [keyNumber('nisVerdict', `mean NIS ÷ ${r.nisDim} over ${r.nisCount} updates`, v.ratio, v.text)] : [];
          })(),
          ...(() => {
            // The descent's NEES per true-height bin, judged by the rule every output shares (one trial: one run per bin).
            const d = descentConsistency([r.neesByHeight], r.neesDim);
            if (!d) return [];
            const bins = d.bins.map((b) => `${b.label} ${formatNumber(b.robustMean / d.dim)} (${formatNumber(b.low / d.dim)} to ${formatNumber(b.high / d.dim)})`).join('; ');
            return [keyNumber('descentVerdict', `NEES ÷ ${d.dim} per height of the descent: ${bins}`, d.insideShare, consistencyWords(d.verdict))];
          })(),
          keyNumber('neesMean', 'mean NEES', r.neesMean),
        ],
      };
    }),
};
