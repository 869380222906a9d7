// The time-dependent views of the landing study: top view, side view and the camera image.
// They depend on the inspected time; the trial itself is not rerun when it moves.
import type { Box } from '../../estimator/camera/Box.js';
import type { Scenario } from '../../estimator/sim/Scenario.js';
import { CARRIER, ESTIMATE, SERIES, TRUTH } from '../figures/palette.js';
import { extent, plotSvg, type Layer } from '../figures/plot.js';
import { formatNumber } from '../figures/svg.js';
import type { JobState } from '../jobs/JobState.js';
import type { LandingOutput } from '../jobs/landingJob.js';
import { fromState, HALF, keyNumber, toCsv } from './figureOutput.js';
import type { StudyFigure } from './Study.js';

type TrialState = JobState<LandingOutput>;

/** The latest box: Okabe–Ito orange, readable on the dark image. */
const DETECTOR_BOX = SERIES[4];
/** The true outline: Okabe–Ito sky blue, dashed, also readable on the dark image. */
const TRUE_OUTLINE = SERIES[5];

const boxPath = (b: Box) => ({ x: [b.xMin, b.xMax, b.xMax, b.xMin], y: [b.yMin, b.yMin, b.yMax, b.yMax] });

/** Index of the last kept row at or before time t. */
function rowAt(value: LandingOutput, t: number): number {
  let k = 0;
  while (k + 1 < value.t.length && value.t[k + 1]! <= t) k++;
  return k;
}

/** Said on each view when the inspected time lies past the trial's end (the slider reaches 120 s for every trial). */
function pastEnd(value: LandingOutput, t: number): string | undefined {
  const end = value.t[value.t.length - 1];
  return end !== undefined && t > end ? `trial ended at ${formatNumber(end)} s: its last moment shown` : undefined;
}

function deckOutline(east: number, north: number, heading: number, length: number, width: number): { x: number[]; y: number[] } {
  const c = Math.cos(heading), s = Math.sin(heading);
  const corners = [[length / 2, width / 2], [-length / 2, width / 2], [-length / 2, -width / 2], [length / 2, -width / 2]];
  return { x: corners.map(([a, b]) => east + a! * c - b! * s), y: corners.map(([a, b]) => north + a! * s + b! * c) };
}

const landerEast = (v: LandingOutput, r: readonly number[][], k: number) => v.carrierEast[k]! - r[0]![k]!;
const landerNorth = (v: LandingOutput, r: readonly number[][], k: number) => v.carrierNorth[k]! - r[1]![k]!;

export const landingViews: StudyFigure[] = [
    {
      name: 'topView',
      title: 'Top view',
      caption: 'Carrier track, lander (truth) and where the filter put the lander, east/north in metres; the deck outline and markers at the inspected time.',
      inputs: ['run', 'time', 'flown'],
      compute: (state: TrialState, time: number, flown: Scenario) =>
        fromState(state, 'trial', (v) => {
          const k = rowAt(v, time);
          const idx = v.t.map((_, i) => i);
          const deck = deckOutline(v.carrierEast[k]!, v.carrierNorth[k]!, v.carrierHeading[k]!, flown.carrier.deckLength, flown.carrier.deckWidth);
          const lx = idx.map((i) => landerEast(v, v.truth, i));
          const ly = idx.map((i) => landerNorth(v, v.truth, i));
          const ex = idx.map((i) => landerEast(v, v.estimate, i));
          const ey = idx.map((i) => landerNorth(v, v.estimate, i));
          return {
            markup: plotSvg({
              title: 'Top view',
              ...HALF,
              note: pastEnd(v, time),
              equalAspect: true,
              legendBelow: true,
              x: { label: 'east (m)', domain: extent([...v.carrierEast, ...lx]) },
              y: { label: 'north (m)', domain: extent([...v.carrierNorth, ...ly]) },
              layers: [
                { kind: 'line', x: v.carrierEast, y: v.carrierNorth, color: CARRIER, width: 3, label: 'carrier' },
                { kind: 'line', x: lx, y: ly, color: TRUTH, label: 'lander' },
                { kind: 'line', x: ex, y: ey, color: ESTIMATE, dash: 1, label: 'estimated lander' },
                { kind: 'outline', ...deck, color: CARRIER, fill: 'rgba(0,158,115,0.25)' },
                { kind: 'points', x: [lx[k]!], y: [ly[k]!], color: TRUTH, radius: 4.5 },
                { kind: 'points', x: [ex[k]!], y: [ey[k]!], color: ESTIMATE, shape: 'diamond', radius: 4.5 },
              ],
            }),
            csv: toCsv(['t', 'carrierEast', 'carrierNorth', 'landerEast', 'landerNorth', 'estimatedEast', 'estimatedNorth'], idx.map((i) => [v.t[i]!, v.carrierEast[i]!, v.carrierNorth[i]!, lx[i]!, ly[i]!, ex[i]!, ey[i]!])),
          };
        }),
    },
    {
      name: 'sideView',
      title: 'Side view',
      caption: 'Lander relative to the deck centre: along the carrier’s heading (m) against height above the deck (m); truth and estimate.',
      inputs: ['run', 'time', 'flown'],
      compute: (state: TrialState, time: number, flown: Scenario) =>
        fromState(state, 'trial', (v) => {
          const k = rowAt(v, time);
          const along = (r: readonly number[][], i: number) => -(r[0]![i]! * Math.cos(v.carrierHeading[i]!) + r[1]![i]! * Math.sin(v.carrierHeading[i]!));
          const idx = v.t.map((_, i) => i);
          const ta = idx.map((i) => along(v.truth, i));
          const th = v.truth[2]!.map((z) => -z);
          const ea = idx.map((i) => along(v.estimate, i));
          const eh = v.estimate[2]!.map((z) => -z);
          const half = flown.carrier.deckLength / 2;
          return {
            markup: plotSvg({
              title: 'Side view',
              ...HALF,
              note: pastEnd(v, time),
              legendBelow: true,
              x: { label: 'along the carrier heading (m)', domain: extent([...ta, -half, half]) },
              y: { label: 'height above deck (m)', domain: extent([...th, 0], 0.08) },
              layers: [
                { kind: 'rects', rects: [{ x0: -half, x1: half, y0: -flown.carrier.bodyHeight, y1: 0, fill: 'rgba(0,158,115,0.35)', title: 'deck' }], label: 'deck', legendColor: CARRIER },
                { kind: 'line', x: ta, y: th, color: TRUTH, label: 'lander' },
                { kind: 'line', x: ea, y: eh, color: ESTIMATE, dash: 1, label: 'estimate' },
                { kind: 'points', x: [ta[k]!], y: [th[k]!], color: TRUTH, radius: 4.5 },
              ],
            }),
            csv: toCsv(['t', 'alongTruth', 'heightTruth', 'alongEstimate', 'heightEstimate'], idx.map((i) => [v.t[i]!, ta[i]!, th[i]!, ea[i]!, eh[i]!])),
          };
        }),
    },
    {
      name: 'camera',
      title: 'What the camera reported',
      caption: 'The image (pixels, origin top left): the carrier’s true outline in the last captured frame (dashed), and the boxes the detector delivered in the second before the inspected time, faded by age, the latest solid. Latency shows as the box trailing the outline.',
      inputs: ['run', 'time', 'flown'],
      compute: (state: TrialState, time: number, flown: Scenario) =>
        fromState(state, 'trial', (v) => {
          const recent = v.boxes.filter((b) => b.t <= time && b.t > time - 1);
          const w = flown.camera.width, h = flown.camera.height;
          const latest = recent[recent.length - 1];
          let truth: LandingOutput['outlines'][number] | undefined;
          for (const o of v.outlines) {
            if (o.t > time) break;
            if (o.t > time - 1) truth = o;
          }
          const layers: Layer[] = [
            { kind: 'rects', rects: [{ x0: 0, x1: w, y0: 0, y1: h, fill: '#2b3138', title: `image ${w} × ${h} px` }] },
            ...recent.slice(0, -1).map((b): Layer => ({ kind: 'outline', ...boxPath(b.box), color: 'rgba(230,225,215,0.35)' })),
          ];
          // the true outline is drawn last, dashed, so the box shows through its gaps where they coincide
          if (latest) layers.push({ kind: 'outline', ...boxPath(latest.box), color: DETECTOR_BOX, label: `box arrived ${formatNumber(latest.t)} s` });
          if (truth) layers.push({ kind: 'outline', ...boxPath(truth.box), color: TRUE_OUTLINE, dash: 1, label: `true outline, ${formatNumber(truth.t)} s` });
          if (!latest) layers.push({ kind: 'text', x: w / 2, y: h / 2, text: 'no box in this second', color: '#fffdf8', anchor: 'middle' });
          const centre = (b: Box) => [(b.xMin + b.xMax) / 2, (b.yMin + b.yMax) / 2] as const;
          const offset = latest && truth ? Math.hypot(centre(latest.box)[0] - centre(truth.box)[0], centre(latest.box)[1] - centre(truth.box)[1]) : null;
          return {
            markup: plotSvg({ title: 'Camera image', ...HALF, note: pastEnd(v, time), equalAspect: true, yDown: true, legendBelow: true, x: { label: 'u (px)', domain: [0, w] }, y: { label: 'v (px)', domain: [0, h] }, layers }),
            csv: toCsv(['t', 'source', 'xMin', 'yMin', 'xMax', 'yMax'], [
              ...v.boxes.map((b) => [b.t, 'detector', b.box.xMin, b.box.yMin, b.box.xMax, b.box.yMax]),
              ...v.outlines.map((o) => [o.t, 'true outline', o.box.xMin, o.box.yMin, o.box.xMax, o.box.yMax]),
            ].sort((a, b) => (a[0] as number) - (b[0] as number))),
            numbers: [
              keyNumber('boxesInSecond', 'boxes in that second', recent.length, String(recent.length)),
              keyNumber('boxOffset', 'latest box centre to true outline centre (px)', offset),
            ],
          };
        }),
    },
];
