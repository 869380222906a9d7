// Study: how detector quality (pixel noise, i.i.d. and bursty dropout, latency, frame rate)
// changes landing success and touchdown miss. One grid sweep per chosen impairment.
import { setPath } from '../../estimator/io/scenarioPath.js';
import type { Scenario } from '../../estimator/sim/Scenario.js';
import { OUTCOMES } from '../../estimator/sim/TrialResult.js';
import type { PointSummary } from '../../estimator/study/summarize.js';
import { trialsNeeded } from '../../estimator/study/statistics/trialsNeeded.js';
import { wilson } from '../../estimator/study/statistics/wilson.js';
import type { JobRunner } from '../jobs/JobRunner.js';
import type { JobState } from '../jobs/JobState.js';
import type { SweepOutput } from '../jobs/sweepJob.js';
import { ESTIMATE, SERIES, TRUTH } from '../figures/palette.js';
import { extent, plotSvg } from '../figures/plot.js';
import { escapeXml, formatNumber, formatPercent } from '../figures/svg.js';
import { claimReach } from './claimReach.js';
import { descentNeesFigure } from './descentFigure.js';
import { consistencyWords } from '../../estimator/study/statistics/ensembleConsistency.js';
import { CONFIDENCE_PARAMETER, Z_OF_LEVEL } from './confidence.js';
import { parseNumberList } from './Parameter.js';
import { fromState, HALF, htmlTable, keyNumber, toCsv } from './figureOutput.js';
import type { Study } from './Study.js';
import { causeFigure } from './causeFigure.js';

interface Impairment {
  label: string;
  path: string;
  unit: string;
  values: number[];
  /** Scenario changes that make the path meaningful (bursty loss needs a burst model). */
  prepare?: (s: Scenario) => Scenario;
}

export const IMPAIRMENTS: Record<string, Impairment> = {
  pixelNoise: { label: 'box centre noise', path: 'detector.pixelNoise', unit: 'px', values: [0.5, 2, 4, 8] },
  dropout: { label: 'i.i.d. dropout', path: 'detector.dropout', unit: 'probability', values: [0, 0.2, 0.4, 0.6] },
  burst: {
    label: 'bursty loss: P(enter)',
    path: 'detector.burst.enter',
    unit: 'per frame (exit 0.25)',
    values: [0, 0.02, 0.05, 0.1],
    prepare: (s) => setPath(s, 'detector.burst', { enter: 0, exit: 0.25 }),
  },
  latency: { label: 'latency', path: 'detector.latency', unit: 's', values: [0, 0.1, 0.2, 0.4] },
  rate: { label: 'frame rate', path: 'detector.rate', unit: 'Hz', values: [5, 10, 20, 30] },
};

type SweepState = JobState<SweepOutput>;

function xOf(s: PointSummary, path: string): number {
  return Number(s.point[path]);
}

export const detectionStudy: Study = {
  id: 'detection',
  title: 'Detection quality',
  lede: 'What must the detector deliver? Each impairment is swept on its own, the rest of the scenario held fixed, and every point flown several times with its own random streams.',
  parameters: [
    {
      kind: 'choice',
      name: 'impairment',
      label: 'Impairment swept',
      options: Object.entries(IMPAIRMENTS).map(([value, i]) => ({ value, label: i.label })),
      default: 'pixelNoise',
    },
    { kind: 'number', name: 'trials', label: 'Trials per point', unit: 'trials', min: 1, max: 1000, step: 1, default: 5, integer: true },
    { kind: 'list', name: 'values', label: 'Swept values (empty: the default grid)', unit: '', maxItems: 12, default: '' },
    CONFIDENCE_PARAMETER,
    { kind: 'number', name: 'target', label: 'Claim: success at least', unit: '', min: 0.5, max: 0.99, step: 0.01, default: 0.9 },
  ],
  cells: [
    {
      name: 'sweep',
      inputs: ['jobs', 'scenario', 'seed', 'impairment', 'trials', 'values'],
      compute: (jobs: JobRunner, scenario: Scenario, seed: number, impairment: string, trials: number, values: string) => {
        const i = IMPAIRMENTS[impairment]!;
        const base = i.prepare ? i.prepare(scenario) : scenario;
        // Own values replace the impairment's default grid; the scenario validator judges each one.
        const own = parseNumberList(values, 12);
        const swept = Array.isArray(own) && own.length > 0 ? [...own].sort((a, b) => a - b) : i.values;
        return jobs.run('sweep', { scenario: base, seed, trials, vary: [{ path: i.path, values: swept }] }, `${i.label} sweep`);
      },
    },
  ],
  figures: [
    {
      name: 'success',
      title: 'Landing success',
      caption: 'Share of trials that landed on the pad, with its Wilson score interval at the chosen confidence.',
      inputs: ['sweep', 'impairment', 'confidence'],
      compute: (state: SweepState, impairment: string, confidence: string) =>
        fromState(state, 'trials', (value, partial) => {
          const imp = IMPAIRMENTS[impairment]!;
          const z = Z_OF_LEVEL[confidence]!;
          const s = value.summaries;
          const x = s.map((p) => xOf(p, imp.path));
          const bands = s.map((p) => wilson(p.landed, p.trials, z));
          const first = s[0];
          return {
            markup: plotSvg({
              title: `Landing success versus ${imp.label}`,
              ...HALF,
              x: { label: `${imp.label} (${imp.unit})`, domain: extent(x, 0.06) },
              y: { label: 'landed', domain: [0, 1], format: (v) => `${Math.round(v * 100)} %` },
              note: partial ? 'partial results' : undefined,
              layers: [
                { kind: 'band', x, low: bands.map((b) => b.low), high: bands.map((b) => b.high), color: TRUTH, label: `Wilson ${Math.round(Number(confidence) * 100)} %` },
                { kind: 'line', x, y: s.map((p) => p.successRate), color: TRUTH, label: 'success rate' },
                { kind: 'points', x, y: s.map((p) => p.successRate), color: TRUTH, titles: s.map((p) => `${p.landed} of ${p.trials} landed`) },
              ],
            }),
            csv: toCsv([imp.path, 'trials', 'landed', 'successRate', 'wilsonLow', 'wilsonHigh', 'z'], s.map((p, k) => [x[k]!, p.trials, p.landed, p.successRate, bands[k]!.low, bands[k]!.high, z])),
            numbers: first
              ? [
                  keyNumber('successRate0', `success at ${x[0]} ${imp.unit}`, first.successRate, formatPercent(first.successRate)),
                  keyNumber('wilsonLow0', 'lower bound', bands[0]!.low, formatPercent(bands[0]!.low)),
                  keyNumber('wilsonHigh0', 'upper bound', bands[0]!.high, formatPercent(bands[0]!.high)),
                ]
              : [],
          };
        }),
    },
    {
      name: 'miss',
      title: 'Touchdown miss',
      caption: 'Circular error probable of the horizontal miss at contact, 50 % and 95 %, over the trials that touched the deck.',
      inputs: ['sweep', 'impairment'],
      compute: (state: SweepState, impairment: string) =>
        fromState(state, 'trials', (value, partial) => {
          const imp = IMPAIRMENTS[impairment]!;
          const s = value.summaries;
          const x = s.map((p) => xOf(p, imp.path));
          const c50 = s.map((p) => p.cep50 ?? NaN);
          const c95 = s.map((p) => p.cep95 ?? NaN);
          return {
            markup: plotSvg({
              title: `Touchdown miss versus ${imp.label}`,
              ...HALF,
              x: { label: `${imp.label} (${imp.unit})`, domain: extent(x, 0.06) },
              y: { label: 'miss (m)', domain: [0, Math.max(value.header.scenario.envelope.padRadius, ...c95.filter(Number.isFinite)) * 1.15] },
              note: partial ? 'partial results' : undefined,
              layers: [
                { kind: 'rule', axis: 'y', value: value.header.scenario.envelope.padRadius, color: SERIES[7], label: 'pad radius' },
                { kind: 'line', x, y: c50, color: ESTIMATE, label: 'CEP50' },
                { kind: 'points', x, y: c50, color: ESTIMATE },
                { kind: 'line', x, y: c95, color: SERIES[2], dash: 1, label: 'CEP95' },
                { kind: 'points', x, y: c95, color: SERIES[2], shape: 'square' },
              ],
            }),
            csv: toCsv([imp.path, 'contacts', 'cep50', 'cep95'], s.map((p, k) => [x[k]!, p.contacts, p.cep50, p.cep95])),
            numbers: s[0] ? [keyNumber('cep50_0', `CEP50 at ${x[0]} ${imp.unit}`, s[0].cep50, `${formatNumber(s[0].cep50)} m`)] : [],
          };
        }),
    },
    descentNeesFigure((p, impairment) => `${p.point[IMPAIRMENTS[impairment]!.path]} ${IMPAIRMENTS[impairment]!.unit}`),
    {
      name: 'claims',
      title: 'Does the claim hold, and how many trials would show it?',
      wide: true,
      caption: 'A point supports "success ≥ target" when its Wilson lower bound reaches the target. Trials needed: all succeeding, and with 80 % power if the rate seen here is the true one.',
      inputs: ['sweep', 'impairment', 'confidence', 'target'],
      compute: (state: SweepState, impairment: string, confidence: string, target: number) =>
        fromState(state, 'trials', (value) => {
          const imp = IMPAIRMENTS[impairment]!;
          const z = Z_OF_LEVEL[confidence]!;
          const rows = value.summaries.map((p) => {
            const low = wilson(p.landed, p.trials, z).low;
            const needed = p.successRate > 0 ? trialsNeeded(p.successRate, target, { z }) : null;
            return { p, low, needed };
          });
          const supported = rows.filter((r) => r.low >= target).length;
          const reach = claimReach(value.header.trials, target, z);
          return {
            kind: 'table',
            markup: `<p class="${reach.reachable ? 'verdict' : 'verdict bad'}">${escapeXml(reach.words)}</p>` + htmlTable(
              [`${imp.label} (${imp.unit})`, 'landed', `Wilson low (${Math.round(Number(confidence) * 100)} %)`, `≥ ${formatPercent(target, 0)}?`, 'n of n needed', 'needed at this rate (80 % power)'],
              rows.map(({ p, low, needed }) => [
                String(p.point[imp.path]),
                `${p.landed} / ${p.trials}`,
                formatPercent(low),
                low >= target ? 'supported' : reach.reachable ? 'not shown' : 'too few trials',
                String(needed?.allSucceed ?? '–'),
                needed === null ? 'never lands' : needed.withPower === null ? 'rate below target' : String(needed.withPower),
              ]),
            ),
            csv: toCsv([imp.path, 'trials', 'landed', 'wilsonLow', 'z', 'target', 'supported', 'allSucceed', 'withPower'], rows.map(({ p, low, needed }) => [Number(p.point[imp.path]), p.trials, p.landed, low, z, target, low >= target ? 1 : 0, needed?.allSucceed ?? null, needed?.withPower ?? null])),
            numbers: [
              keyNumber('supported', 'points supporting the claim', supported, `${supported} of ${rows.length}`),
              keyNumber('claimNeeds', 'straight successes the claim needs', reach.needed, String(reach.needed)),
            ],
          };
        }),
    },
    {
      name: 'outcomes',
      title: 'Outcomes per point',
      caption: `How each trial ended, and the trials’ averaged NEES against its chi-square interval with the verdict of \`alight summarize\` (${consistencyWords('consistent')}; ${consistencyWords('over-confident')}; ${consistencyWords('under-confident')}). The sweep’s results file (JSON Lines) gives the same counts through \`alight summarize\`.`,
      wide: true,
      inputs: ['sweep', 'impairment'],
      compute: (state: SweepState, impairment: string) => fromState(state, 'trials', (value) => outcomeTable(value, IMPAIRMENTS[impairment]!.path)),
    },
    causeFigure((impairment) => IMPAIRMENTS[impairment]!.path, 'impairment'),
  ],
  blocks: [
    { prose: 'Each impairment is swept on its own, every point flown the chosen number of times. Changing the confidence level only redraws the bands and the claims; it reruns no trial.', pageOnly: true },
    { figure: 'success' },
    { figure: 'miss' },
    { figure: 'descentNees' },
    { prose: 'Few trials give wide bands: n landings out of n leave a Wilson lower bound of n / (n + z²), so a claim of 95 % at 95 % confidence takes at least 73 trials, all landed. The claims table says what the chosen trials can and cannot show.' },
    { figure: 'claims' },
    { figure: 'outcomes' },
    { figure: 'causes' },
  ],
};

export function outcomeTable(value: SweepOutput, path: string): { kind: 'table'; markup: string; csv: string; attachment: { label: string; fileName: string; text: string } } {
  const header = [path, 'trials', ...OUTCOMES, 'NEES mean', 'NEES 95 % interval', 'NEES verdict', 'position RMSE (m)'];
  const rows = value.summaries.map((p) => [
    String(p.point[path]),
    String(p.trials),
    ...OUTCOMES.map((o) => String(p.outcomes[o])),
    formatNumber(p.neesMean),
    p.neesLow === null || p.neesHigh === null ? '–' : `${formatNumber(p.neesLow)} to ${formatNumber(p.neesHigh)}`,
    p.neesVerdict ?? '–',
    formatNumber(p.positionRmse),
  ]);
  const csvRows = value.summaries.map((p) => [p.point[path] as number, p.trials, ...OUTCOMES.map((o) => p.outcomes[o]), p.neesMean, p.neesLow, p.neesHigh, p.neesVerdict, p.positionRmse]);
  return {
    kind: 'table',
    markup: htmlTable(header, rows),
    csv: toCsv(header, csvRows),
    attachment: { label: 'Results (JSON Lines)', fileName: 'sweep-results.jsonl', text: value.resultsText },
  };
}
