// Study: filter tuning on simulated trials. The Q and R multipliers are searched on a log grid
// (then refined) with the cost of `alight tune`; the surfaces show consistency and landing.
import { neesVerdict } from '../../estimator/study/statistics/neesVerdict.js';
import type { Scenario } from '../../estimator/sim/Scenario.js';
import { heatCells, rampKey } from '../figures/heatCells.js';
import { SERIES, sequential } from '../figures/palette.js';
import { plotSvg } from '../figures/plot.js';
import { formatNumber, formatPercent } from '../figures/svg.js';
import type { JobRunner } from '../jobs/JobRunner.js';
import type { JobState } from '../jobs/JobState.js';
import type { TuningOutput, TuningSample } from '../jobs/tuningJob.js';
import { fromState, HALF, htmlTable, keyNumber, toCsv } from './figureOutput.js';
import type { Layer } from '../figures/plot.js';
import type { Study } from './Study.js';

type TuningState = JobState<TuningOutput>;
/** Searched multiplier range, as `alight tune` (0.1..10). */
const RANGE: [number, number] = [0.1, 10];

function bestMarker(best: TuningSample | null): Layer[] {
  if (!best) return [];
  return [{ kind: 'points', x: [best.q], y: [best.r], color: SERIES[4], shape: 'diamond', radius: 7, label: 'recommended', titles: [`recommended: qScale ${best.q}, rScale ${best.r}`] }];
}

/** Log axes spanning the heat map's cells, ticked at the grid's own levels. */
function axes(cells: { xDomain: [number, number]; yDomain: [number, number] }, grid: readonly TuningSample[]) {
  const ticks = (values: number[]) => [...new Set(values)].sort((a, b) => a - b).map((v) => ({ value: v, label: formatNumber(v) }));
  return {
    x: { label: 'qScale (Q multiplier)', domain: cells.xDomain, log: true, tickLabels: ticks(grid.map((s) => s.q)) },
    y: { label: 'rScale (R multiplier)', domain: cells.yDomain, log: true, tickLabels: ticks(grid.map((s) => s.r)) },
  };
}

function refineMarks(samples: readonly TuningSample[]): Layer[] {
  const refine = samples.filter((s) => s.stage === 'refine');
  if (refine.length === 0) return [];
  return [{ kind: 'points', x: refine.map((s) => s.q), y: refine.map((s) => s.r), color: SERIES[7], radius: 2.5, label: 'refinement', titles: refine.map((s) => `refine: qScale ${s.q}, rScale ${s.r}, cost ${formatNumber(s.score)}`) }];
}

export const tuningStudy: Study = {
  id: 'tuning',
  title: 'Filter tuning',
  lede: 'Which process and measurement noise multipliers make the filter honest about its own error, and which land best? Every setting flies the same trials with the same random streams, so the surfaces differ by the settings alone.',
  parameters: [
    { kind: 'number', name: 'grid', label: 'Grid points per multiplier', unit: '', min: 2, max: 7, step: 1, default: 3, integer: true },
    { kind: 'number', name: 'trials', label: 'Trials per setting', unit: '', min: 1, max: 30, step: 1, default: 2, integer: true },
    { kind: 'number', name: 'refine', label: 'Refinement evaluations', unit: '', min: 0, max: 30, step: 1, default: 2, integer: true },
    { kind: 'choice', name: 'neesWeight', label: 'Weight of consistency in the cost', options: ['0.1', '0.25', '0.5', '1'].map((v) => ({ value: v, label: v })), default: '0.25' },
    { kind: 'choice', name: 'level', label: 'NEES acceptance level', options: [{ value: '0.95', label: '95 %' }, { value: '0.99', label: '99 %' }], default: '0.95' },
  ],
  cells: [
    {
      name: 'search',
      inputs: ['jobs', 'scenario', 'seed', 'grid', 'trials', 'refine', 'neesWeight'],
      compute: (jobs: JobRunner, scenario: Scenario, seed: number, grid: number, trials: number, refine: number, neesWeight: string) =>
        jobs.run('tuning', { scenario, seed, grid, trials, refine, neesWeight: Number(neesWeight), q: RANGE, r: RANGE }, 'Q/R search'),
    },
  ],
  figures: [
    {
      name: 'consistency',
      title: 'Consistency surface',
      caption: 'Average NEES over its dimension (ANEES/n) per grid setting; 1 = honest covariance, darker = further from 1 either way. Cells with a green square pass the chi-square test at the chosen level.',
      inputs: ['search', 'level'],
      compute: (state: TuningState, level: string) =>
        fromState(state, 'trials', (value, partial) => {
          const grid = value.samples.filter((s) => s.stage === 'grid');
          const verdicts = grid.map((s) => (s.summary.neesMean !== null && s.summary.neesDim !== null ? neesVerdict(s.summary.neesMean, s.summary.trials, s.summary.neesDim, Number(level)) : null));
          const cells = heatCells(
            grid.map((s, i) => {
              const ratio = s.summary.neesMean !== null && s.summary.neesDim ? s.summary.neesMean / s.summary.neesDim : NaN;
              return { x: s.q, y: s.r, fill: sequential(Math.abs(Math.log(ratio)) / 3), title: `qScale ${s.q}, rScale ${s.r}: ANEES/n ${formatNumber(ratio)} (${verdicts[i]?.verdict ?? 'no NEES'})` };
            }),
          );
          const passed = grid.filter((_, i) => verdicts[i]?.verdict === 'consistent');
          return {
            markup: plotSvg({
              title: 'Consistency surface',
              ...HALF,
              ...axes(cells, grid),
              legendBelow: true,
              note: partial ? 'partial results' : undefined,
              layers: [
                cells.layer,
                { kind: 'points', x: passed.map((s) => s.q), y: passed.map((s) => s.r), color: SERIES[2], shape: 'square', radius: 5, label: `consistent at ${Math.round(Number(level) * 100)} %` },
                ...refineMarks(value.samples),
                ...bestMarker(value.best),
                // colour = |ln(ANEES/n)| / 3: 0 at 1, 0.5 at a factor e^1.5 ≈ 4.5, 1 (darkest) from e^3 ≈ 20
                ...rampKey(sequential, [[0, 'ANEES/n = 1'], [0.5, '4.5× off'], [1, '20× off or more']]),
              ],
            }),
            csv: toCsv(['qScale', 'rScale', 'neesMean', 'neesDim', 'low', 'high', 'verdict'], grid.map((s, i) => [s.q, s.r, s.summary.neesMean, s.summary.neesDim, verdicts[i]?.low ?? null, verdicts[i]?.high ?? null, verdicts[i]?.verdict ?? null])),
            numbers: [keyNumber('consistentCells', `settings consistent at ${Math.round(Number(level) * 100)} %`, passed.length, `${passed.length} of ${grid.length}`)],
          };
        }),
    },
    {
      name: 'landing',
      title: 'Landing surface',
      caption: 'Share of trials landed per grid setting (darker = more landings lost, as darker = less consistent on the other map); the diamond is the recommended point (lowest cost).',
      inputs: ['search'],
      compute: (state: TuningState) =>
        fromState(state, 'trials', (value, partial) => {
          const grid = value.samples.filter((s) => s.stage === 'grid');
          // Dark = bad on both maps (here: landings lost), so the two read the same way side by side.
          const cells = heatCells(grid.map((s) => ({ x: s.q, y: s.r, fill: sequential(1 - s.summary.successRate), title: `qScale ${s.q}, rScale ${s.r}: ${s.summary.landed} of ${s.summary.trials} landed` })));
          const best = value.best;
          return {
            markup: plotSvg({ title: 'Landing surface', ...HALF, legendBelow: true, ...axes(cells, grid), note: partial ? 'partial results' : undefined, layers: [cells.layer, ...refineMarks(value.samples), ...bestMarker(best), ...rampKey(sequential, [[0, 'all landed'], [0.5, 'half'], [1, 'none landed']])] }),
            csv: toCsv(['qScale', 'rScale', 'trials', 'landed', 'successRate', 'wilsonLow', 'wilsonHigh'], grid.map((s) => [s.q, s.r, s.summary.trials, s.summary.landed, s.summary.successRate, s.summary.wilsonLow, s.summary.wilsonHigh])),
            numbers: best
              ? [
                  keyNumber('bestQ', 'recommended qScale', best.q),
                  keyNumber('bestR', 'recommended rScale', best.r),
                  keyNumber('bestCost', 'cost', best.score),
                  keyNumber('bestSuccess', 'success there', best.summary.successRate, formatPercent(best.summary.successRate)),
                ]
              : [],
          };
        }),
    },
    {
      name: 'settings',
      title: 'Every evaluated setting',
      caption: 'Grid first, then the Nelder–Mead refinement, in evaluation order. Cost = (1 − success) + w·|ln(ANEES/n)|.',
      wide: true,
      inputs: ['search'],
      compute: (state: TuningState) =>
        fromState(state, 'trials', (value) => ({
          kind: 'table',
          markup: htmlTable(
            ['stage', 'qScale', 'rScale', 'landed', 'ANEES', 'cost'],
            value.samples.map((s) => [s.stage, formatNumber(s.q), formatNumber(s.r), `${s.summary.landed} / ${s.summary.trials}`, formatNumber(s.summary.neesMean), formatNumber(s.score)]),
          ),
          csv: toCsv(['stage', 'qScale', 'rScale', 'gateScale', 'trials', 'landed', 'neesMean', 'cost'], value.samples.map((s) => [s.stage, s.q, s.r, s.gate, s.summary.trials, s.summary.landed, s.summary.neesMean, s.score])),
        })),
    },
  ],
  blocks: [
    { prose: 'The search runs in a background worker. Changing the acceptance level only re-judges the consistency surface; changing the weight reruns the search, because the refinement follows the cost.', pageOnly: true },
    { figure: 'consistency' },
    { figure: 'landing' },
    { prose: 'Put the recommended multipliers into the scenario’s filter section (qScale, rScale), then confirm them on flight logs with the replay study: consistency in simulation is necessary, not sufficient.' },
    { figure: 'settings' },
  ],
};
