// Study: one landing, step by step: where carrier, lander and estimate were, how wrong the
// estimate was against its own ±3σ, whether its NIS stayed inside the chi-square band, the
// supervisor's phases, and what the camera reported. The time slider only moves the markers.
import { setPath } from '../../estimator/io/scenarioPath.js';
import type { Scenario } from '../../estimator/sim/Scenario.js';
import { PHASES } from '../../estimator/sim/TrialResult.js';
import { ESTIMATE, SERIES, TRUTH } from '../figures/palette.js';
import { extent, plotSvg } from '../figures/plot.js';
import { sideBySide } from '../figures/sideBySide.js';
import { formatNumber } from '../figures/svg.js';
import type { JobRunner } from '../jobs/JobRunner.js';
import type { JobState } from '../jobs/JobState.js';
import type { LandingOutput } from '../jobs/landingJob.js';
import { fromState, HALF, keyNumber, toCsv, WIDE } from './figureOutput.js';
import type { Study } from './Study.js';
import { landingViews } from './landingViews.js';
import { consistencyFigure } from './landingConsistency.js';

type TrialState = JobState<LandingOutput>;

export const landingStudy: Study = {
  id: 'landing',
  title: 'One landing, step by step',
  lede: 'A single trial of the scenario: the carrier drives, the lander trails, aligns and descends on its filter’s estimate. Scrub through time to see what the camera reported.',
  parameters: [
    { kind: 'number', name: 'trial', label: 'Trial number', unit: '', min: 0, max: 999, step: 1, default: 0, integer: true },
    { kind: 'number', name: 'speed', label: 'Carrier speed', unit: 'm/s', min: 0, max: 15, step: 0.5, default: 3 },
    { kind: 'number', name: 'pixelNoise', label: 'Box centre noise', unit: 'px', min: 0, max: 10, step: 0.5, default: 1.5 },
    { kind: 'number', name: 'time', label: 'Inspect time', unit: 's', min: 0, max: 120, step: 0.5, default: 8 },
    // the sweep point a replayed trial came from (links from the failure-cause tables set it); 0 for a lone trial
    { kind: 'number', name: 'point', label: 'Sweep point', unit: '', min: 0, max: 999, step: 1, default: 0, integer: true },
  ],
  cells: [
    {
      name: 'flown',
      inputs: ['scenario', 'speed', 'pixelNoise'],
      compute: (scenario: Scenario, speed: number, pixelNoise: number) => setPath(setPath(scenario, 'carrier.speed', speed), 'detector.pixelNoise', pixelNoise),
    },
    {
      name: 'run',
      inputs: ['jobs', 'flown', 'seed', 'trial', 'point'],
      compute: (jobs: JobRunner, flown: Scenario, seed: number, trial: number, point: number) =>
        jobs.run('landing', { scenario: flown, seed, trial, point, every: 0.05 }, point === 0 ? `trial ${trial}` : `trial ${trial} of point ${point}`),
    },
  ],
  figures: [
    ...landingViews,
    {
      name: 'error',
      title: 'Estimate error and its ±3σ',
      caption: 'Estimated minus true relative position, per axis (m), inside the filter’s own ±3σ band: an honest filter keeps the line inside the band almost always.',
      wide: true,
      inputs: ['run'],
      compute: (state: TrialState) =>
        fromState(state, 'trial', (v) => {
          const names = ['east', 'north', 'up'];
          const panels = [0, 1, 2].map((i) => {
            const err = v.estimate[i]!.map((e, k) => e - v.truth[i]![k]!);
            const s3 = v.sigma[i]!.map((s) => 3 * s);
            const span = Math.max(0.2, ...err.map(Math.abs).filter(Number.isFinite)) * 1.2;
            const width = WIDE.width / 3;
            return {
              width,
              height: WIDE.height,
              svg: plotSvg({
                title: `${names[i]} error`,
                width,
                height: WIDE.height,
                legendBelow: true,
                x: { label: 'time (s)', domain: extent(v.t, 0) },
                y: { label: `${names[i]} error (m)`, domain: [-span, span] },
                layers: [
                  { kind: 'band', x: v.t, low: s3.map((s) => -s), high: s3, color: TRUTH, label: '±3σ' },
                  { kind: 'line', x: v.t, y: err, color: ESTIMATE, width: 1.4, label: 'error' },
                ],
              }),
            };
          });
          return {
            markup: sideBySide('Estimate error and its ±3σ', panels),
            csv: toCsv(['t', 'errEast', 'errNorth', 'errUp', 'sigmaEast', 'sigmaNorth', 'sigmaUp'], v.t.map((t, k) => [t, v.estimate[0]![k]! - v.truth[0]![k]!, v.estimate[1]![k]! - v.truth[1]![k]!, v.estimate[2]![k]! - v.truth[2]![k]!, v.sigma[0]![k]!, v.sigma[1]![k]!, v.sigma[2]![k]!])),
            numbers: [keyNumber('positionRmse', 'position RMSE (m)', v.result.positionRmse), keyNumber('velocityRmse', 'velocity RMSE (m/s)', v.result.velocityRmse)],
          };
        }),
    },
    consistencyFigure,
    {
      name: 'phases',
      title: 'Phase timeline',
      caption: 'What the landing supervisor was doing: acquire, trail, align, descend, touchdown (aborts fall back to acquire).',
      inputs: ['run'],
      compute: (state: TrialState) =>
        fromState(state, 'trial', (v) => {
          const rects: { x0: number; x1: number; y0: number; y1: number; fill: string; title: string }[] = [];
          let start = 0;
          for (let k = 1; k <= v.t.length; k++) {
            if (k === v.t.length || v.phase[k] !== v.phase[start]) {
              const row = PHASES.indexOf(v.phase[start]!);
              const end = k === v.t.length ? v.t[k - 1]! : v.t[k]!;
              rects.push({ x0: v.t[start]!, x1: end, y0: PHASES.length - row - 0.8, y1: PHASES.length - row - 0.2, fill: SERIES[row]!, title: `${v.phase[start]}: ${formatNumber(v.t[start]!)}–${formatNumber(end)} s` });
              start = k;
            }
          }
          const r = v.result;
          return {
            markup: plotSvg({
              title: 'Phase timeline',
              ...HALF,
              x: { label: 'time (s)', domain: extent(v.t, 0) },
              y: { label: '', domain: [0, PHASES.length], tickLabels: PHASES.map((p, i) => ({ value: PHASES.length - i - 0.5, label: p })) },
              marginLeft: 78,
              layers: [{ kind: 'rects', rects }],
            }),
            csv: toCsv(['phase', 'seconds'], PHASES.map((p) => [p, r.phaseTimes[p]])),
            numbers: [
              keyNumber('outcome', 'outcome', null, r.outcome),
              keyNumber('missDistance', 'miss (m)', r.missDistance),
              keyNumber('touchdownTime', 'touchdown (s)', r.touchdownTime),
            ],
          };
        }),
    },
  ],
  blocks: [
    { prose: 'The trial runs in a background worker (about a twentieth of a second of computing for a minute of flight). Changing the trial number, speed or noise flies it again; the time slider only moves markers and the camera view.', pageOnly: true },
    { figure: 'topView' },
    { figure: 'sideView' },
    { prose: 'The detector’s box is the image of the carrier’s true 3-D outline, noisy, late and sometimes missing; the filter assumes a flat square target, so its size model is mismatched on purpose.' },
    { figure: 'camera' },
    { figure: 'phases' },
    { figure: 'error' },
    { figure: 'consistency' },
  ],
};
