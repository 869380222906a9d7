// Study: the lander's own localization errors (attitude bias, odometry drift, camera
// misalignment, focal-length and target-size errors): each one switched from zero to a chosen
// severity with the others at the scenario's values, and ranked by the harm it does.
import type { Scenario } from '../../estimator/sim/Scenario.js';
import type { PointSummary } from '../../estimator/study/summarize.js';
import { combineStates } from '../jobs/combineStates.js';
import type { JobRunner } from '../jobs/JobRunner.js';
import type { JobState } from '../jobs/JobState.js';
import type { SweepOutput } from '../jobs/sweepJob.js';
import { ESTIMATE, SERIES, TRUTH } from '../figures/palette.js';
import { plotSvg, type Layer } from '../figures/plot.js';
import { differenceInterval } from '../../estimator/study/statistics/differenceInterval.js';
import { consistencyWords } from '../../estimator/study/statistics/ensembleConsistency.js';
import { formatNumber, formatPercent } from '../figures/svg.js';
import { fromState, HALF, htmlTable, keyNumber, toCsv } from './figureOutput.js';
import type { Study, StudyCell } from './Study.js';

interface ErrorSource {
  key: string;
  label: string;
  /** Axis label (at most about 11 characters: five sit side by side on a half-width plot). */
  short: string;
  path: string;
  unit: string;
  /** The value at "moderate" severity; "severe" doubles it. */
  moderate: number;
}

export const ERROR_SOURCES: readonly ErrorSource[] = [
  { key: 'attitude', short: 'attitude', label: 'attitude bias', path: 'localization.attitudeBiasDeg', unit: 'deg', moderate: 1.5 },
  { key: 'odometry', short: 'odometry', label: 'odometry drift', path: 'localization.odometryDrift', unit: 'm/s/√s', moderate: 0.08 },
  { key: 'misalignment', short: 'mounting', label: 'camera misalignment', path: 'localization.misalignmentDeg', unit: 'deg', moderate: 1.5 },
  { key: 'focal', short: 'focal', label: 'focal-length error', path: 'localization.focalError', unit: 'fraction', moderate: 0.05 },
  { key: 'targetSize', short: 'target size', label: 'target-size error', path: 'localization.targetSizeError', unit: 'fraction', moderate: 0.2 },
];

const SEVERITY: Record<string, number> = { moderate: 1, severe: 2 };

/**
 * One single-point sweep per source and level. Both levels of a source run at key point 0, so
 * they fly the same random streams (common random numbers): the difference between them is the
 * error's doing, not the draws'.
 */
function sweepCell(source: ErrorSource, level: 'zero' | 'on'): StudyCell {
  return {
    name: `sweep_${source.key}_${level}`,
    inputs: ['jobs', 'scenario', 'seed', 'severity', 'trials'],
    compute: (jobs: JobRunner, scenario: Scenario, seed: number, severity: string, trials: number) =>
      jobs.run('sweep', { scenario, seed, trials, vary: [{ path: source.path, values: [level === 'zero' ? 0 : source.moderate * SEVERITY[severity]!] }] }, `${source.label}${level === 'zero' ? ' at zero' : ''}`),
  };
}

const SWEEP_NAMES = ERROR_SOURCES.flatMap((s) => [`sweep_${s.key}_zero`, `sweep_${s.key}_on`]);

interface Harm {
  source: ErrorSource;
  clean: PointSummary;
  erred: PointSummary;
}

/** Pairs (zero, on) per source, from the job values in SWEEP_NAMES order. */
function harms(values: readonly (SweepOutput | null)[]): Harm[] {
  const out: Harm[] = [];
  ERROR_SOURCES.forEach((source, i) => {
    const clean = values[2 * i]?.summaries[0];
    const erred = values[2 * i + 1]?.summaries[0];
    if (clean && erred) out.push({ source, clean, erred });
  });
  return out;
}

const harmOf = (h: Harm, rankBy: string): number =>
  rankBy === 'success' ? h.clean.successRate - h.erred.successRate : (h.erred.cep50 ?? NaN) - (h.clean.cep50 ?? NaN);

export const localizationStudy: Study = {
  id: 'localization',
  title: 'Localization error',
  lede: 'The filter trusts the lander’s attitude, odometry and camera model. Which error in them costs the most landings? Each source is turned from zero to the chosen severity while the others keep the scenario’s values.',
  parameters: [
    { kind: 'choice', name: 'severity', label: 'Severity of each error', options: [{ value: 'moderate', label: 'moderate' }, { value: 'severe', label: 'severe (twice)' }], default: 'moderate' },
    { kind: 'number', name: 'trials', label: 'Trials per setting', unit: 'trials', min: 1, max: 1000, step: 1, default: 4, integer: true },
    { kind: 'choice', name: 'rankBy', label: 'Rank by', options: [{ value: 'success', label: 'lost success' }, { value: 'cep50', label: 'added CEP50' }], default: 'success' },
  ],
  cells: ERROR_SOURCES.flatMap((s) => [sweepCell(s, 'zero'), sweepCell(s, 'on')]),
  figures: [
    {
      name: 'ranking',
      title: 'Which error hurts most',
      caption: 'Harm of each error source: success lost, or CEP50 added, when it goes from zero to the chosen severity. Longest bar first. Lost success carries the Newcombe 95 % interval of the difference (a line across the bar); an error is named as hurting most only when that interval lies above zero.',
      inputs: ['rankBy', ...SWEEP_NAMES],
      compute: (rankBy: string, ...states: JobState<SweepOutput>[]) =>
        fromState(combineStates(states), 'trials', (values, partial) => {
          const list = harms(values).sort((a, b) => (harmOf(b, rankBy) || 0) - (harmOf(a, rankBy) || 0));
          // Newcombe's hybrid score interval treats the two settings as independent samples; they
          // share random draws here, which only makes the true interval narrower: the rule is cautious.
          const intervals = list.map((h) => (rankBy === 'success' ? differenceInterval(h.clean.landed, h.clean.trials, h.erred.landed, h.erred.trials) : null));
          const rects = list.map((h, i) => {
            const v = harmOf(h, rankBy);
            return { x0: Math.min(0, v), x1: Math.max(0, v), y0: list.length - i - 0.8, y1: list.length - i - 0.2, fill: v >= 0 ? SERIES[1] : SERIES[0], title: `${h.source.label}: ${formatNumber(v)}` };
          });
          // the axis covers every bar: a negative harm (the error helped, by chance with few trials) too
          const harmValues = [...list.map((h) => harmOf(h, rankBy) || 0), ...intervals.flatMap((d) => (d ? [d.low, d.high] : []))];
          const span = Math.max(0.05, ...harmValues.map(Math.abs));
          const lowest = Math.min(0, ...harmValues);
          const worst = list[0];
          const worstInterval = intervals[0] ?? null;
          const shown = worst !== undefined && (worstInterval === null || worstInterval.low > 0);
          return {
            markup: plotSvg({
              title: 'Harm per error source',
              ...HALF,
              x: { label: rankBy === 'success' ? 'success lost (fraction of trials)' : 'CEP50 added (m)', domain: [lowest - span * 0.1, Math.max(0, ...harmValues) + span * 0.1] },
              y: { label: '', domain: [0, Math.max(1, list.length)], tickLabels: list.map((h, i) => ({ value: list.length - i - 0.5, label: h.source.short })) },
              marginLeft: 92,
              note: partial ? 'partial results' : undefined,
              layers: [
                { kind: 'rects', rects: rects.filter((r) => r.fill === SERIES[1]), label: 'worse with the error', legendColor: SERIES[1] },
                { kind: 'rects', rects: rects.filter((r) => r.fill === SERIES[0]), label: rects.some((r) => r.fill === SERIES[0]) ? 'better with it (chance?)' : undefined, legendColor: SERIES[0] },
                { kind: 'rule', axis: 'x', value: 0, color: SERIES[7], dash: 0 },
                ...intervals.flatMap((d, i): Layer[] => (d ? [{ kind: 'line', x: [d.low, d.high], y: [list.length - i - 0.5, list.length - i - 0.5], color: SERIES[7], width: 1.6, ...(i === 0 ? { label: 'Newcombe 95 %' } : {}) }] : [])),
              ],
            }),
            csv: toCsv(['source', 'path', 'value', 'successClean', 'successErred', 'cep50Clean', 'cep50Erred', 'harm', 'harmLow', 'harmHigh'], list.map((h, i) => [h.source.key, h.source.path, Number(h.erred.point[h.source.path]), h.clean.successRate, h.erred.successRate, h.clean.cep50, h.erred.cep50, harmOf(h, rankBy), intervals[i]?.low ?? null, intervals[i]?.high ?? null])),
            numbers: worst
              ? [
                  keyNumber('worst', 'hurts most', null, shown ? worst.source.label : `not shown: its interval includes 0 with ${worst.clean.trials} trials per setting`),
                  keyNumber('worstHarm', rankBy === 'success' ? `success lost by ${worst.source.label}` : `CEP50 added by ${worst.source.label} (m)`, harmOf(worst, rankBy)),
                  ...(worstInterval ? [keyNumber('worstLow', 'interval low', worstInterval.low), keyNumber('worstHigh', 'interval high', worstInterval.high)] : []),
                ]
              : [],
          };
        }),
    },
    {
      name: 'successPairs',
      title: 'Success without and with each error',
      caption: 'Success rate with Wilson 95 % interval: circle = error at zero, square = at the chosen severity.',
      inputs: SWEEP_NAMES,
      compute: (...states: JobState<SweepOutput>[]) =>
        fromState(combineStates(states), 'trials', (values, partial) => {
          const list = harms(values);
          const x0 = list.map((_, i) => i - 0.12);
          const x1 = list.map((_, i) => i + 0.12);
          return {
            markup: plotSvg({
              title: 'Success without and with each error',
              ...HALF,
              x: { label: '', domain: [-0.6, ERROR_SOURCES.length - 0.4], tickLabels: ERROR_SOURCES.map((s, i) => ({ value: i, label: s.short })) },
              y: { label: 'landed', domain: [0, 1], format: (v) => `${Math.round(v * 100)} %` },
              note: partial ? 'partial results' : undefined,
              layers: [
                { kind: 'errorbars', x: x0, low: list.map((h) => h.clean.wilsonLow), high: list.map((h) => h.clean.wilsonHigh), color: TRUTH },
                { kind: 'points', x: x0, y: list.map((h) => h.clean.successRate), color: TRUTH, label: 'error at zero' },
                { kind: 'errorbars', x: x1, low: list.map((h) => h.erred.wilsonLow), high: list.map((h) => h.erred.wilsonHigh), color: ESTIMATE },
                { kind: 'points', x: x1, y: list.map((h) => h.erred.successRate), color: ESTIMATE, shape: 'square', label: 'error on' },
              ],
            }),
            csv: toCsv(['source', 'successClean', 'wilsonLowClean', 'wilsonHighClean', 'successErred', 'wilsonLowErred', 'wilsonHighErred'], list.map((h) => [h.source.key, h.clean.successRate, h.clean.wilsonLow, h.clean.wilsonHigh, h.erred.successRate, h.erred.wilsonLow, h.erred.wilsonHigh])),
            numbers: list[0] ? [keyNumber('successClean0', `success, ${list[0].source.label} at zero`, list[0].clean.successRate, formatPercent(list[0].clean.successRate))] : [],
          };
        }),
    },
    {
      name: 'table',
      title: 'Every setting',
      caption: `Outcome counts, miss and consistency per error source and level; the NEES verdict as \`alight summarize\` gives it (${consistencyWords('over-confident')}).`,
      wide: true,
      inputs: SWEEP_NAMES,
      compute: (...states: JobState<SweepOutput>[]) =>
        fromState(combineStates(states), 'trials', (values) => {
          const rows: string[][] = [];
          const csv: (string | number | null)[][] = [];
          for (const h of harms(values)) {
            for (const p of [h.clean, h.erred]) {
              const v = Number(p.point[h.source.path]);
              rows.push([h.source.label, h.source.unit === 'fraction' ? `${formatNumber(100 * v)} %` : `${v} ${h.source.unit}`, `${p.landed} / ${p.trials}`, formatPercent(p.wilsonLow), formatNumber(p.cep50), formatNumber(p.neesMean), p.neesLow === null || p.neesHigh === null ? '–' : `${formatNumber(p.neesLow)} to ${formatNumber(p.neesHigh)}`, p.neesVerdict ?? '–', formatNumber(p.positionRmse)]);
              csv.push([h.source.path, v, p.trials, p.landed, p.wilsonLow, p.wilsonHigh, p.cep50, p.neesMean, p.neesLow, p.neesHigh, p.neesVerdict, p.positionRmse]);
            }
          }
          return {
            kind: 'table',
            markup: htmlTable(['source', 'value', 'landed', 'Wilson low', 'CEP50 (m)', 'NEES mean', 'NEES 95 % interval', 'NEES verdict', 'RMSE (m)'], rows),
            csv: toCsv(['path', 'value', 'trials', 'landed', 'wilsonLow', 'wilsonHigh', 'cep50', 'neesMean', 'neesLow', 'neesHigh', 'neesVerdict', 'positionRmse'], csv),
          };
        }),
    },
  ],
  blocks: [
    { prose: 'Each error runs at zero and at the chosen severity on the same random draws, so the difference is the error’s doing. Switching the ranking between lost success and added miss only redraws the ranking; it reruns no trial. With a handful of trials, differences inside the Wilson bars below mean little.' },
    { figure: 'ranking' },
    { figure: 'successPairs' },
    { prose: 'Errors the filter does not model turn into biased estimates: the NEES column rises above its dimension when the filter is over-confident about a wrong camera or attitude.' },
    { figure: 'table' },
  ],
};
