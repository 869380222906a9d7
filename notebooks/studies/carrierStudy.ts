// Study: carrier speed and path shape. One grid sweep over shape x speed; the envelope is the
// highest swept speed per shape whose success still meets the chosen target.
import { setPath } from '../../estimator/io/scenarioPath.js';
import type { PathShape, Scenario } from '../../estimator/sim/Scenario.js';
import { createCarrierState, createCarrierTrajectory } from '../../estimator/sim/world/carrierPath.js';
import type { PointSummary } from '../../estimator/study/summarize.js';
import type { JobRunner } from '../jobs/JobRunner.js';
import type { JobState } from '../jobs/JobState.js';
import type { SweepOutput } from '../jobs/sweepJob.js';
import { DASHES, MUTED, SERIES } from '../figures/palette.js';
import { extent, plotSvg, type Layer } from '../figures/plot.js';
import { formatNumber, formatPercent } from '../figures/svg.js';
import { fromState, HALF, keyNumber, toCsv } from './figureOutput.js';
import { claimReach } from './claimReach.js';
import type { FigureOutput, Study } from './Study.js';

export const SHAPES: readonly PathShape[] = ['straight', 'rectangle', 'ellipse', 'figure-eight', 'survey'];

export function speedsUpTo(maxSpeed: number): number[] {
  return [1, 2, 3, 4].map((k) => Number(((maxSpeed * k) / 4).toPrecision(6)));
}

function bySpeed(summaries: readonly PointSummary[], shape: PathShape): PointSummary[] {
  return summaries.filter((s) => s.point['carrier.path.shape'] === shape).sort((a, b) => Number(a.point['carrier.speed']) - Number(b.point['carrier.speed']));
}

/** Highest swept speed whose success rate (or Wilson lower bound) meets the target, with all slower speeds meeting it too. */
export function envelopeSpeed(points: readonly PointSummary[], target: number, useLowerBound: boolean): number | null {
  let speed: number | null = null;
  for (const p of points) {
    if ((useLowerBound ? p.wilsonLow : p.successRate) < target) break;
    speed = Number(p.point['carrier.speed']);
  }
  return speed;
}

type SweepState = JobState<SweepOutput>;

export const carrierStudy: Study = {
  id: 'carrier',
  title: 'Carrier speed and path',
  lede: 'How fast may the carrier drive, and does the shape of its path matter? Every path shape is flown at four speeds up to the chosen maximum.',
  parameters: [
    { kind: 'number', name: 'maxSpeed', label: 'Highest carrier speed', unit: 'm/s', min: 2, max: 16, step: 1, default: 8 },
    { kind: 'number', name: 'trials', label: 'Trials per point', unit: 'trials', min: 1, max: 1000, step: 1, default: 2, integer: true },
    { kind: 'number', name: 'target', label: 'Success target', unit: '', min: 0.5, max: 1, step: 0.05, default: 0.8 },
    { kind: 'choice', name: 'envelopeRule', label: 'Envelope uses', options: [{ value: 'rate', label: 'the success rate' }, { value: 'lower', label: 'its Wilson lower bound' }], default: 'rate' },
  ],
  cells: [
    {
      name: 'sweep',
      inputs: ['jobs', 'scenario', 'seed', 'maxSpeed', 'trials'],
      compute: (jobs: JobRunner, scenario: Scenario, seed: number, maxSpeed: number, trials: number) =>
        jobs.run('sweep', { scenario, seed, trials, vary: [{ path: 'carrier.path.shape', values: [...SHAPES] }, { path: 'carrier.speed', values: speedsUpTo(maxSpeed) }] }, 'shape x speed sweep'),
    },
  ],
  figures: [
    {
      name: 'paths',
      title: 'The path shapes',
      caption: 'Where the deck centre goes in the first 60 s at 3 m/s for each shape of the scenario’s path settings (top view, metres).',
      inputs: ['scenario'],
      compute: (scenario: Scenario): FigureOutput => {
        const layers: Layer[] = [];
        const xs: number[] = [];
        const ys: number[] = [];
        const csv: (string | number)[][] = [];
        SHAPES.forEach((shape, i) => {
          const spec = setPath(setPath(scenario, 'carrier.path.shape', shape), 'carrier.speed', 3).carrier;
          const trajectory = createCarrierTrajectory(spec);
          const state = createCarrierState();
          const x: number[] = [];
          const y: number[] = [];
          for (let t = 0; t <= 60; t += 0.5) {
            trajectory.stateAt(t, state);
            x.push(state.position[0]!);
            y.push(state.position[1]!);
            csv.push([shape, t, state.position[0]!, state.position[1]!]);
          }
          xs.push(...x);
          ys.push(...y);
          layers.push({ kind: 'line', x, y, color: SERIES[i]!, dash: i % DASHES.length, label: shape });
        });
        return {
          kind: 'svg',
          markup: plotSvg({ title: 'Carrier path shapes', ...HALF, equalAspect: true, x: { label: 'east (m)', domain: extent(xs) }, y: { label: 'north (m)', domain: extent(ys) }, layers }),
          csv: toCsv(['shape', 't', 'east', 'north'], csv),
          numbers: [],
          final: true,
          status: `${SHAPES.length} shapes`,
        };
      },
    },
    {
      name: 'success',
      title: 'Success versus carrier speed',
      caption: 'Share of trials landed, per path shape, against the carrier’s cruise speed, with Wilson 95 % bars. Shapes are drawn a little apart along the speed axis so equal results stay visible.',
      inputs: ['sweep'],
      compute: (state: SweepState) =>
        fromState(state, 'trials', (value, partial) => {
          const layers: Layer[] = [];
          const top = Math.max(...value.header.points.map((p) => Number(p['carrier.speed'])));
          SHAPES.forEach((shape, i) => {
            const points = bySpeed(value.summaries, shape);
            // Dodge: each shape sits 1.5 % of the widest speed to one side of the true speed.
            const x = points.map((p) => Number(p.point['carrier.speed']) + (i - (SHAPES.length - 1) / 2) * 0.015 * top);
            const y = points.map((p) => p.successRate);
            layers.push({ kind: 'errorbars', x, low: points.map((p) => p.wilsonLow), high: points.map((p) => p.wilsonHigh), color: SERIES[i]! });
            layers.push({ kind: 'line', x, y, color: SERIES[i]!, dash: i % DASHES.length, label: shape });
            layers.push({ kind: 'points', x, y, color: SERIES[i]!, titles: points.map((p) => `${shape} at ${p.point['carrier.speed']} m/s: ${p.landed} of ${p.trials} (Wilson ${formatPercent(p.wilsonLow, 0)} to ${formatPercent(p.wilsonHigh, 0)})`) });
          });
          const speeds = value.header.points.map((p) => Number(p['carrier.speed']));
          const straight = bySpeed(value.summaries, 'straight')[0];
          return {
            markup: plotSvg({ title: 'Success versus carrier speed', ...HALF, x: { label: 'carrier speed (m/s)', domain: extent([...speeds.map((v) => v - 0.03 * top), ...speeds.map((v) => v + 0.03 * top)], 0.05) }, y: { label: 'landed', domain: [0, 1.02], format: (v) => `${Math.round(v * 100)} %` }, layers, note: partial ? 'partial results' : undefined }),
            csv: toCsv(['shape', 'speed', 'trials', 'landed', 'successRate', 'wilsonLow', 'wilsonHigh'], value.summaries.map((p) => [String(p.point['carrier.path.shape']), Number(p.point['carrier.speed']), p.trials, p.landed, p.successRate, p.wilsonLow, p.wilsonHigh])),
            numbers: straight ? [keyNumber('straightSlowest', `straight at ${straight.point['carrier.speed']} m/s`, straight.successRate, formatPercent(straight.successRate))] : [],
          };
        }),
    },
    {
      name: 'envelope',
      title: 'Speed envelope per path shape',
      caption: 'Highest swept speed at which the shape still meets the success target (and every slower speed does too).',
      inputs: ['sweep', 'target', 'envelopeRule'],
      compute: (state: SweepState, target: number, rule: string) =>
        fromState(state, 'trials', (value, partial) => {
          const envelope = SHAPES.map((shape) => envelopeSpeed(bySpeed(value.summaries, shape), target, rule === 'lower'));
          // With the lower-bound rule, too few trials can show nothing: say so rather than "none".
          const reach = claimReach(value.header.trials, target, 1.96);
          const emptyText = rule === 'lower' && !reach.reachable ? `cannot tell: ${value.header.trials} trials per speed cannot show ${formatPercent(target, 0)}` : 'none: not even the slowest speed';
          const atEnvelope = SHAPES.map((shape, i) => bySpeed(value.summaries, shape).find((p) => Number(p.point['carrier.speed']) === envelope[i]) ?? null);
          const maxSwept = Math.max(...value.header.points.map((p) => Number(p['carrier.speed'])));
          return {
            markup: plotSvg({
              title: 'Speed envelope per path shape',
              ...HALF,
              x: { label: `highest speed with ${rule === 'lower' ? 'Wilson lower bound' : 'success'} ≥ ${Math.round(target * 100)} % (m/s)`, domain: [0, maxSwept * 1.05] },
              y: { label: '', domain: [0, SHAPES.length], tickLabels: SHAPES.map((s, i) => ({ value: SHAPES.length - i - 0.5, label: s })) },
              marginLeft: 92,
              // The success-rate rule has no confidence behind it: say so when the trials could not show the target.
              note: partial ? 'partial results' : rule === 'rate' && !reach.reachable ? `rates only: ${value.header.trials} trials per speed cannot show ${formatPercent(target, 0)}` : undefined,
              layers: [
                { kind: 'rects', rects: envelope.map((v, i) => ({ x0: 0, x1: v ?? 0, y0: SHAPES.length - i - 0.8, y1: SHAPES.length - i - 0.2, fill: SERIES[i]!, title: `${SHAPES[i]}: ${v === null ? 'none' : `${v} m/s, ${atEnvelope[i]!.landed} of ${atEnvelope[i]!.trials} landed there (Wilson ${formatPercent(atEnvelope[i]!.wilsonLow, 0)} to ${formatPercent(atEnvelope[i]!.wilsonHigh, 0)})`}` })) },
                // an empty row says so, rather than looking like missing data
                ...envelope.flatMap((v, i): Layer[] => (v === null && !partial ? [{ kind: 'text', x: maxSwept * 0.02, y: SHAPES.length - i - 0.5 - 0.12, text: emptyText, color: MUTED }] : [])),
              ],
            }),
            csv: toCsv(['shape', 'envelopeSpeed', 'target', 'rule'], SHAPES.map((s, i) => [s, envelope[i] ?? null, target, rule])),
            numbers: [
              keyNumber('claimNeeds', `trials per speed to show ${formatPercent(target, 0)}`, Number.isFinite(reach.needed) ? reach.needed : null, !Number.isFinite(reach.needed) ? 'no number of trials' : reach.reachable ? `${reach.needed} (have ${value.header.trials})` : `${reach.needed}: have only ${value.header.trials}`),
              ...SHAPES.map((s, i) => keyNumber(`envelope_${s}`, envelope[i] === null ? s : `${s} (Wilson low ${formatPercent(atEnvelope[i]!.wilsonLow, 0)})`, envelope[i] ?? null, envelope[i] === null ? 'none' : `${formatNumber(envelope[i]!)} m/s`)),
            ],
          };
        }),
    },
  ],
  blocks: [
    { prose: 'The path shape changes what the filter must follow: straight roads are easy, corners and the figure-eight make the carrier accelerate sideways, which a constant-velocity carrier model does not expect.' },
    { figure: 'paths' },
    { figure: 'success' },
    { prose: 'The envelope reads the same trials: moving the target or switching to the lower confidence bound redraws only this figure.', pageOnly: true },
    { figure: 'envelope' },
  ],
};
