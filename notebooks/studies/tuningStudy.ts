// Study: filter tuning on simulated trials, as `alight tune <scenario>`: the noise terms are
// identified from recorded trials by innovation likelihood (profiles and intervals), checked
// against the scenario's own setting, then Q and R multipliers around the identified setting fly
// the same trials and the landing/consistency trade-off is shown as its non-dominated settings.
import type { SettingCheck, StatisticCheck } from '../../estimator/io/log/settingCheck.js';
import type { Scenario } from '../../estimator/sim/Scenario.js';
import { PROFILE_RISE_95 } from '../../estimator/study/identifyNoise.js';
import { termValueText } from '../../estimator/study/termValueText.js';
import { DEFAULT_FREE_TERMS, type NoiseTermName } from '../../estimator/study/noiseTerms.js';
import { consistencyWords } from '../../estimator/study/statistics/ensembleConsistency.js';
import { neesVerdict } from '../../estimator/study/statistics/neesVerdict.js';
import { MUTED, SERIES } from '../figures/palette.js';
import { plotSvg, type Layer } from '../figures/plot.js';
import { escapeXml, formatNumber, formatPercent } from '../figures/svg.js';
import type { JobRunner } from '../jobs/JobRunner.js';
import type { JobState } from '../jobs/JobState.js';
import type { TuningOutput } from '../jobs/tuningJob.js';
import { fromState, HALF, htmlTable, keyNumber, toCsv } from './figureOutput.js';
import type { Study } from './Study.js';

type TuningState = JobState<TuningOutput>;
/** Trade-off multiplier range, as `alight tune` (0.25..4). */
const RANGE: [number, number] = [0.25, 4];
const TERM_SETS: Record<string, NoiseTermName[]> = {
  default: [...DEFAULT_FREE_TERMS],
  sensors: ['pixelNoise', 'sizeNoiseFraction', 'odometryNoise'],
  fractions: ['pixelNoise', 'pixelNoiseFraction', 'sizeNoiseFraction', 'odometryNoise', 'carrierAccelNoise'],
};

function statText(s: StatisticCheck | null): string {
  return s ? `${formatNumber(s.mean)} [${formatNumber(s.low)}, ${formatNumber(s.high)}] ${s.verdict}` : '-';
}

function checkRows(c: SettingCheck): string[] {
  return [
    statText(c.boxes),
    statText(c.odometry),
    statText(c.nees),
    c.positionRmse === null ? '-' : `${formatNumber(c.positionRmse)} m`,
    `${(100 * c.gatedFraction).toFixed(1)} %`,
    `${c.whitenessPassed} of ${c.whitenessTests}`,
  ];
}

export const tuningStudy: Study = {
  id: 'tuning',
  title: 'Filter tuning',
  lede: 'Which noise does the filter meet in this scenario, and which Q and R land best while staying honest? The noise terms are identified from recorded trials by the likelihood of the innovations; then every Q/R setting flies the same trials with the same random streams, so the trade-off differs by the settings alone.',
  parameters: [
    { kind: 'number', name: 'logs', label: 'Recorded trials to identify from', unit: '', min: 1, max: 10, step: 1, default: 1, integer: true },
    { kind: 'choice', name: 'terms', label: 'Noise terms identified', options: [
      { value: 'default', label: 'pixel, size fraction, odometry, carrier and lander acceleration' },
      { value: 'sensors', label: 'pixel, size fraction, odometry' },
      { value: 'fractions', label: 'pixel and its centre fraction, size fraction, odometry, carrier acceleration' },
    ], default: 'sensors' },
    { kind: 'number', name: 'grid', label: 'Trade-off grid points per multiplier', unit: '', min: 2, max: 5, step: 1, default: 2, integer: true },
    { kind: 'number', name: 'trials', label: 'Trials per setting', unit: 'trials', min: 1, max: 400, step: 1, default: 2, integer: true },
    { kind: 'choice', name: 'level', label: 'NEES acceptance level', options: [{ value: '0.95', label: '95 %' }, { value: '0.99', label: '99 %' }], default: '0.95' },
  ],
  cells: [
    {
      name: 'search',
      inputs: ['jobs', 'scenario', 'seed', 'logs', 'terms', 'grid', 'trials'],
      compute: (jobs: JobRunner, scenario: Scenario, seed: number, logs: number, terms: string, grid: number, trials: number) =>
        jobs.run('tuning', { scenario, seed, logs, free: TERM_SETS[terms] ?? TERM_SETS.default!, grid, trials, q: RANGE, r: RANGE }, 'identification and trade-off'),
    },
  ],
  figures: [
    {
      name: 'identified',
      title: 'Identified noise terms',
      caption: 'Each term at the likelihood’s optimum with its approximate 95 % interval; a term the recorded trials do not bound is said so and keeps the scenario’s value.',
      inputs: ['search'],
      compute: (state: TuningState) =>
        fromState(state, 'logs and trials', (value) => {
          const terms = value.identification.terms;
          return {
            kind: 'table',
            markup: htmlTable(['term', 'identified', 'scenario', 'recommended'], terms.map((t) => [t.name, termValueText(t), formatNumber(t.start), `${t.recommended}${t.status === 'identified' ? '' : ' (kept)'}`])) +
              value.warnings.map((w) => `<p class="message">${escapeXml(w)}</p>`).join(''),
            csv: toCsv(['term', 'unit', 'start', 'estimate', 'low', 'high', 'status', 'recommended'], terms.map((t) => [t.name, t.unit, t.start, t.estimate, t.low, t.high, t.status, t.recommended])),
            numbers: terms.map((t) => keyNumber(`term_${t.name}`, `recommended ${t.name}`, t.recommended, String(t.recommended))),
          };
        }),
    },
    {
      name: 'profiles',
      title: 'Likelihood profiles',
      caption: 'Rise of −2 ln L as one term moves from its optimum (the others held), against value / optimum; the dashed line is the 3.84 rise that bounds a 95 % interval (Wilks). A curve that stays under it on a side leaves that side unbounded.',
      inputs: ['search'],
      compute: (state: TuningState) =>
        fromState(state, 'logs and trials', (value) => {
          const terms = value.identification.terms;
          const layers: Layer[] = terms.map((t, i) => ({ kind: 'line', x: t.profile.map((p) => p.value / t.estimate), y: t.profile.map((p) => Math.min(p.rise, 40)), color: SERIES[i % SERIES.length]!, label: t.name }));
          const ratios = terms.flatMap((t) => t.profile.map((p) => p.value / t.estimate)).filter((v) => v > 0);
          return {
            markup: plotSvg({
              title: 'Likelihood profiles', ...HALF, legendBelow: true,
              x: { label: 'value / optimum', domain: [Math.max(1e-3, Math.min(...ratios)), Math.min(1e3, Math.max(...ratios))], log: true },
              y: { label: 'rise of −2 ln L (capped at 40)', domain: [0, 40] },
              layers: [...layers, { kind: 'rule', axis: 'y', value: PROFILE_RISE_95, color: MUTED, dash: 4, label: '95 % (3.84)' }],
            }),
            csv: toCsv(['term', 'value', 'rise'], terms.flatMap((t) => t.profile.map((p) => [t.name, p.value, p.rise]))),
          };
        }),
    },
    {
      name: 'comparison',
      title: 'Identified against the scenario’s setting',
      caption: 'Both settings replayed on the recorded trials. NIS per sensor and NEES against truth with their 95 % acceptance intervals; truth checks the result, it never steers it.',
      wide: true,
      inputs: ['search'],
      compute: (state: TuningState) =>
        fromState(state, 'logs and trials', (value) => {
          const names = ['box NIS (dim 3)', 'odometry NIS (dim 3)', 'NEES vs truth (dim 6)', 'position RMSE', 'gated updates', 'whiteness tests passed'];
          const a = checkRows(value.checks.current), b = checkRows(value.checks.recommended);
          const box = value.checks.recommended.boxes;
          return {
            kind: 'table',
            markup: htmlTable(['check', 'scenario setting', 'identified setting'], names.map((n, i) => [n, a[i]!, b[i]!])) +
              (box ? `<p>Box updates with the identified setting: ${consistencyWords(box.verdict)}.</p>` : ''),
            csv: toCsv(['check', 'current', 'recommended'], names.map((n, i) => [n, a[i]!, b[i]!])),
          };
        }),
    },
    {
      name: 'tradeoff',
      title: 'Landing against consistency',
      caption: 'Each Q/R setting around the identified noise: landing success (Wilson 95 % bars) against |ln(ANEES/n)| (0 = consistent). Filled: non-dominated (nothing lands more often while at least as consistent); ringed: the named setting.',
      inputs: ['search', 'level'],
      compute: (state: TuningState, level: string) =>
        fromState(state, 'logs and trials', (value, partial) => {
          const t = value.tradeOff;
          if (!t) return { markup: '<p>identification done; flying the trade-off grid…</p>', kind: 'table' };
          const shown = t.settings.filter((s) => s.neesDistance !== null);
          const front = shown.filter((s) => s.nonDominated).sort((a, b) => a.neesDistance! - b.neesDistance!);
          const judged = (s: (typeof shown)[number]) => neesVerdict(s.summary.neesMean!, s.summary.trials, s.summary.neesDim!, Number(level)).verdict;
          const titles = (list: typeof shown) => list.map((s) => `qScale ${s.qScale}, rScale ${s.rScale}: ${s.summary.landed} of ${s.summary.trials} landed, ANEES ${formatNumber(s.summary.neesMean)} (${judged(s)} at ${Math.round(Number(level) * 100)} %)`);
          const named = t.chosen !== null ? t.settings[t.chosen]! : null;
          const maxD = Math.max(0.5, ...shown.map((s) => s.neesDistance!));
          return {
            markup: plotSvg({
              title: 'Landing against consistency', ...HALF, legendBelow: true, note: partial ? 'partial results' : undefined,
              x: { label: '|ln(ANEES / n)|', domain: [0, maxD * 1.05] },
              // A little headroom above 100 % so marks there are not cut by the frame.
              y: { label: 'landing success', domain: [0, 1.05], format: (v) => formatPercent(v) },
              layers: [
                { kind: 'errorbars', x: shown.map((s) => s.neesDistance!), low: shown.map((s) => s.summary.wilsonLow), high: shown.map((s) => s.summary.wilsonHigh), color: MUTED },
                { kind: 'points', x: shown.map((s) => s.neesDistance!), y: shown.map((s) => s.summary.successRate), color: SERIES[7], radius: 3, label: 'setting', titles: titles(shown) },
                { kind: 'line', x: front.map((s) => s.neesDistance!), y: front.map((s) => s.summary.successRate), color: SERIES[0], dash: 4 },
                { kind: 'points', x: front.map((s) => s.neesDistance!), y: front.map((s) => s.summary.successRate), color: SERIES[0], radius: 5, label: 'non-dominated', titles: titles(front) },
                ...(named && named.neesDistance !== null ? [{ kind: 'points' as const, x: [named.neesDistance], y: [named.summary.successRate], color: SERIES[1], shape: 'diamond' as const, radius: 8, label: 'named', titles: [`named: qScale ${named.qScale}, rScale ${named.rScale}`] }] : []),
              ],
            }),
            csv: toCsv(['qScale', 'rScale', 'trials', 'landed', 'successRate', 'wilsonLow', 'wilsonHigh', 'neesMean', 'neesDistance', 'nonDominated'], t.settings.map((s) => [s.qScale, s.rScale, s.summary.trials, s.summary.landed, s.summary.successRate, s.summary.wilsonLow, s.summary.wilsonHigh, s.summary.neesMean, s.neesDistance, String(s.nonDominated)])),
            numbers: named
              ? [
                  keyNumber('namedQ', 'named qScale', named.qScale),
                  keyNumber('namedR', 'named rScale', named.rScale),
                  keyNumber('namedSuccess', 'success there', named.summary.successRate, formatPercent(named.summary.successRate)),
                  keyNumber('frontSize', 'non-dominated settings', t.front.length),
                ]
              : [keyNumber('frontSize', 'non-dominated settings', t.front.length)],
          };
        }),
    },
    {
      name: 'settings',
      title: 'Every trade-off setting',
      caption: 'The Q and R multipliers on top of the identified noise, each over the same trials.',
      wide: true,
      inputs: ['search'],
      compute: (state: TuningState) =>
        fromState(state, 'logs and trials', (value) => {
          const t = value.tradeOff;
          if (!t) return { kind: 'table', markup: '<p>waiting for the trade-off grid…</p>' };
          return {
            kind: 'table',
            markup: htmlTable(
              ['qScale', 'rScale', 'landed', 'ANEES [95 %]', 'non-dominated'],
              t.settings.map((s, i) => [formatNumber(s.qScale), formatNumber(s.rScale), `${s.summary.landed} / ${s.summary.trials}`, s.summary.neesMean === null ? '-' : `${formatNumber(s.summary.neesMean)} [${formatNumber(s.summary.neesLow)}, ${formatNumber(s.summary.neesHigh)}]`, s.nonDominated ? (i === t.chosen ? 'yes, named' : 'yes') : '']),
            ),
            csv: toCsv(['qScale', 'rScale', 'trials', 'landed', 'neesMean', 'nonDominated'], t.settings.map((s) => [s.qScale, s.rScale, s.summary.trials, s.summary.landed, s.summary.neesMean, String(s.nonDominated)])),
          };
        }),
    },
  ],
  blocks: [
    { prose: 'The identification and the trade-off run in a background worker. Changing the acceptance level only re-judges the trade-off figure.', pageOnly: true },
    { figure: 'identified' },
    { figure: 'profiles' },
    { prose: 'The likelihood finds the noise the filter’s own model explains best. Errors the model does not carry (a target-size error, odometry drift, the oblique view of the deck) then show as an over-confident NEES against truth below: read the comparison before using the values.' },
    { figure: 'comparison' },
    { figure: 'tradeoff' },
    { prose: 'Put the identified terms and the named multipliers into the scenario’s filter section, then confirm them on flight logs with `alight tune <log-folder>` and the replay study: consistency in simulation is necessary, not sufficient.' },
    { figure: 'settings' },
  ],
};
