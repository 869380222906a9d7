// Study: replay a flight log (a demo log, or a folder dropped on the page) through the filter
// with chosen Q and R multipliers, and check it from the innovations alone: NIS against its
// chi-square bounds, whiteness, gate rejections; with truth, NEES and RMSE too.
import type { LogFile } from '../../estimator/io/log/LogSource.js';
import { ESTIMATE, SERIES, TRUTH } from '../figures/palette.js';
import { extent, plotSvg, type Layer } from '../figures/plot.js';
import { escapeXml, formatNumber } from '../figures/svg.js';
import type { JobRunner } from '../jobs/JobRunner.js';
import type { JobState } from '../jobs/JobState.js';
import type { LogChoice, ReplayOutput } from '../jobs/replayJob.js';
import { fromState, HALF, htmlTable, keyNumber, toCsv, WIDE } from './figureOutput.js';
import { sideBySide } from '../figures/sideBySide.js';
import { verdictText } from './verdictText.js';
import { consistencyWords } from '../../estimator/study/statistics/ensembleConsistency.js';
import type { FigureOutput, Study } from './Study.js';

/** Demo logs shipped in data-demo/ (folder names). */
export const DEMO_LOGS = ['logs/harbour-boat', 'logs/delivery-van-no-truth'] as const;

const MULTIPLIERS = ['0.25', '0.5', '1', '2', '4'].map((v) => ({ value: v, label: `× ${v}` }));

type ReplayState = JobState<ReplayOutput>;

/** A legend-sized name of an innovation series ("odometry innovation vx / sqrt(S)" -> "odometry vx"). */
function shortSeries(series: string): string {
  const head = series.replace(' innovation', '').split(/ \/| \(| sequence/)[0]!.trim();
  return head.length > 16 ? head.slice(0, 15) + '…' : head;
}

function logChoice(log: string, files: ReadonlyMap<string, LogFile> | null): LogChoice {
  return files && files.size > 0 ? { kind: 'files', files, name: 'dropped folder' } : { kind: 'demo', name: log };
}

export const replayStudy: Study = {
  id: 'replay',
  title: 'Flight-log replay',
  lede: 'Run the landing filter over what a lander recorded — boxes, IMU, attitude, odometry, and truth where a reference exists — and judge it from its innovations alone.',
  parameters: [
    { kind: 'choice', name: 'log', label: 'Demo log', options: DEMO_LOGS.map((l) => ({ value: l, label: l.split('/').pop()! })), default: DEMO_LOGS[0] },
    { kind: 'choice', name: 'qScale', label: 'Process noise Q', options: MULTIPLIERS, default: '1' },
    { kind: 'choice', name: 'rScale', label: 'Measurement noise R', options: MULTIPLIERS, default: '1' },
  ],
  cells: [
    {
      name: 'replay',
      inputs: ['jobs', 'log', 'logFiles', 'qScale', 'rScale'],
      compute: (jobs: JobRunner, log: string, files: ReadonlyMap<string, LogFile> | null, qScale: string, rScale: string) =>
        jobs.run('replay', { log: logChoice(log, files), filter: { qScale: Number(qScale), rScale: Number(rScale) }, every: 0.1 }, 'replay'),
    },
  ],
  figures: [
    {
      name: 'source',
      title: 'The log',
      wide: true,
      caption: 'Which files are replayed. A dropped folder replaces the demo log until the page is reloaded (it is not part of the link).',
      inputs: ['log', 'logFiles'],
      compute: (log: string, files: ReadonlyMap<string, LogFile> | null): FigureOutput => {
        const choice = logChoice(log, files);
        const rows = choice.kind === 'files' ? [...choice.files].map(([name, f]) => [name, typeof f === 'string' ? `${f.length} characters` : `${f.size} bytes`]) : [[`data-demo/${choice.name}/`, 'demo log on the server']];
        return { kind: 'table', markup: htmlTable(['file', 'size'], rows), csv: null, numbers: [], final: true, status: choice.kind === 'files' ? 'dropped folder' : 'demo log' };
      },
    },
    {
      name: 'estimate',
      title: 'Relative position estimate',
      caption: 'Carrier minus lander, east/north/up (m), with the filter’s ±3σ band, every 0.1 s of the replay.',
      wide: true,
      inputs: ['replay'],
      compute: (state: ReplayState) =>
        fromState(state, 'log', (value) => {
          const layers: Layer[] = [];
          const names = ['east', 'north', 'up'];
          for (let i = 0; i < 3; i++) {
            const r = value.r[i]!;
            const s = value.sigma[i]!;
            layers.push({ kind: 'band', x: value.t, low: r.map((v, k) => v - 3 * s[k]!), high: r.map((v, k) => v + 3 * s[k]!), color: SERIES[i]!, opacity: 0.15 });
            layers.push({ kind: 'line', x: value.t, y: r, color: SERIES[i]!, dash: i, label: `${names[i]} ±3σ` });
          }
          return {
            markup: plotSvg({ title: 'Relative position estimate', ...WIDE, x: { label: 'time (s)', domain: extent(value.t, 0) }, y: { label: 'r (m)', domain: extent(value.r.flat(), 0.08) }, layers }),
            csv: toCsv(['t', 'rx', 'ry', 'rz', 'sx', 'sy', 'sz'], value.t.map((t, k) => [t, value.r[0]![k]!, value.r[1]![k]!, value.r[2]![k]!, value.sigma[0]![k]!, value.sigma[1]![k]!, value.sigma[2]![k]!])),
          };
        }),
    },
    {
      name: 'consistency',
      title: 'Consistency from innovations',
      caption: 'Mean NIS of box and odometry updates divided by its dimension, with the chi-square acceptance interval (bars) and the verdict in words; with truth, NEES likewise.',
      inputs: ['replay'],
      compute: (state: ReplayState) =>
        fromState(state, 'log', (value) => {
          const rep = value.report;
          const items = [
            { key: 'box', label: 'box NIS', mean: rep.boxes.mean, count: rep.boxes.count, dim: rep.boxes.dim, bounds: rep.boxes.bounds },
            { key: 'odometry', label: 'odometry NIS', mean: rep.odometry.mean, count: rep.odometry.count, dim: rep.odometry.dim, bounds: rep.odometry.bounds },
            { key: 'nees', label: 'NEES', mean: rep.neesMean, count: rep.neesCount, dim: rep.neesDim, bounds: rep.neesBounds },
          ].filter((i) => i.mean !== null);
          const verdicts = items.map((i) => verdictText(i.mean, i.count, i.dim, rep.level));
          const x = items.map((_, i) => i);
          const ratio = items.map((i) => i.mean! / i.dim);
          return {
            markup: plotSvg({
              title: 'Consistency from innovations',
              ...HALF,
              legendBelow: true,
              x: { label: '', domain: [-0.6, Math.max(0.6, items.length - 0.4)], tickLabels: items.map((it, i) => ({ value: i, label: it.label })) },
              y: { label: 'mean / dimension', domain: [0, Math.max(2, ...ratio.filter(Number.isFinite)) * 1.1] },
              layers: [
                { kind: 'rule', axis: 'y', value: 1, color: SERIES[7], label: 'consistent = 1' },
                { kind: 'errorbars', x, low: items.map((i) => (i.bounds ? i.bounds[0] / i.dim : NaN)), high: items.map((i) => (i.bounds ? i.bounds[1] / i.dim : NaN)), color: TRUTH },
                { kind: 'points', x, y: ratio, color: ESTIMATE, shape: 'diamond', radius: 5, label: 'replay', titles: items.map((i) => `${i.label}: mean ${formatNumber(i.mean)} for dimension ${i.dim}`) },
              ],
            }),
            csv: toCsv(['statistic', 'mean', 'dim', 'low', 'high'], items.map((i) => [i.label, i.mean, i.dim, i.bounds?.[0] ?? null, i.bounds?.[1] ?? null])),
            numbers: [
              ...items.flatMap((it, k) => {
                const v = verdicts[k];
                return v ? [keyNumber(`${it.key}Verdict`, `${it.label} ÷ ${it.dim} (${it.count} ${it.key === 'nees' ? 'samples' : 'updates'})`, v.ratio, v.text)] : [];
              }),
              ...(rep.descentNees ? [keyNumber('descentVerdict', `NEES per height of the descent: ${Math.round(100 * rep.descentNees.insideShare)} % of bins inside`, rep.descentNees.insideShare, consistencyWords(rep.descentNees.verdict))] : []),
              keyNumber('nisMean', 'box NIS mean', rep.nisMean),
              keyNumber('gateRejections', 'gate rejections', rep.gateRejections, String(rep.gateRejections)),
              keyNumber('white', 'innovations white', rep.whiteness.white === null ? null : rep.whiteness.white ? 1 : 0, rep.whiteness.white === null ? 'too short' : rep.whiteness.white ? 'yes' : 'no'),
              ...(rep.positionRmse !== null ? [keyNumber('positionRmse', 'position RMSE (m)', rep.positionRmse)] : []),
            ],
          };
        }),
    },
    {
      name: 'whiteness',
      title: 'Innovation whiteness',
      caption: 'Sample autocorrelation of each normalized innovation sequence against its lag, camera boxes on the left and odometry on the right; a white sequence stays inside ±1.96/√N (band: the widest of the panel) and passes the Ljung–Box test (✗: it fails).',
      wide: true,
      inputs: ['replay'],
      compute: (state: ReplayState) =>
        fromState(state, 'log', (value) => {
          const tests = value.report.whiteness.tests;
          // One panel per sensor, at most a handful of series each: eight lines in one panel could not be told apart.
          const groups = [
            { name: 'camera boxes', tests: tests.filter((t) => !t.series.startsWith('odometry')) },
            { name: 'odometry', tests: tests.filter((t) => t.series.startsWith('odometry')) },
          ].filter((g) => g.tests.length > 0);
          const width = Math.floor(WIDE.width / Math.max(1, groups.length));
          const panel = (g: { name: string; tests: typeof tests }): string => {
            const bound = Math.max(0, ...g.tests.map((t) => t.bound));
            const lagsAxis = Math.max(1, ...g.tests.map((t) => t.lags));
            const layers: Layer[] = [
              { kind: 'band', x: [0.5, lagsAxis + 0.5], low: [-bound, -bound], high: [bound, bound], color: SERIES[5]!, opacity: 0.25, label: '±1.96/√N' },
              ...g.tests.map((t, i): Layer => ({ kind: 'line', x: t.autocorrelation.map((_, k) => k + 1), y: t.autocorrelation, color: SERIES[i % 5]!, dash: i % 4, width: 1.4, label: `${shortSeries(t.series)}${t.white ? '' : ' ✗'}` })),
            ];
            return plotSvg({
              title: `Innovation whiteness: ${g.name}`,
              width,
              height: WIDE.height,
              legendBelow: true,
              x: { label: `lag (${g.name} updates)`, domain: [0.5, lagsAxis + 0.5] },
              y: { label: 'autocorrelation', domain: extent([...g.tests.flatMap((t) => t.autocorrelation), bound, -bound], 0.1) },
              layers,
            });
          };
          const smallest = tests.length > 0 ? Math.min(...tests.map((t) => t.pValue)) : null;
          return {
            ...(groups.length > 0
              ? { markup: sideBySide('Innovation whiteness', groups.map((g) => ({ svg: panel(g), width, height: WIDE.height }))) }
              : { kind: 'table' as const, markup: '<p>No innovation sequence long enough to test.</p>' }),
            csv: toCsv(['series', 'count', 'lags', 'bound', 'outside', 'ljungBox', 'threshold', 'pValue', 'white'], tests.map((t) => [t.series, t.count, t.lags, t.bound, t.outside, t.ljungBox, t.threshold, t.pValue, t.white ? 1 : 0])),
            numbers: [keyNumber('smallestP', 'smallest Ljung–Box p', smallest, smallest !== null && smallest < 0.001 ? '< 0.001' : formatNumber(smallest))],
          };
        }),
    },
    {
      name: 'rows',
      title: 'Rows read and used',
      caption: 'Every row is counted: used by the filter, skipped for a problem (file, line, column below), or unused.',
      inputs: ['replay'],
      compute: (state: ReplayState) =>
        fromState(state, 'log', (value) => {
          const rep = value.report;
          const rows = Object.entries(rep.rows).map(([name, r]) => [name, String(r!.read), String(r!.used), String(r!.skipped), String(r!.unused)]);
          const shown = rep.problems.shown;
          // The page table stops at 200 rows; the CSV beside it holds every kept one.
          const problemRows = shown.slice(0, 200).map((p) => [p.file, String(p.line), p.column ?? '(whole row)', p.kind, p.message]);
          const listed =
            rep.problems.total === 0
              ? '<p>No problem rows.</p>'
              : `<p>${rep.problems.total} problem ${rep.problems.total === 1 ? 'row was' : 'rows were'} skipped (by kind: ${Object.entries(rep.problems.byKind).map(([k, n]) => `${k} ${n}`).join(', ')})${problemRows.length < rep.problems.total ? `; the first ${problemRows.length} are listed here, ${shown.length === rep.problems.total ? 'all of them' : `the first ${shown.length}`} in the CSV` : ''}.</p>` +
                htmlTable(['file', 'line', 'field', 'kind', 'problem'], problemRows, 'Problem rows, skipped by the replay');
          const problemsCsv = toCsv(['file', 'line', 'field', 'kind', 'problem'], shown.map((p) => [p.file, p.line, p.column, p.kind, p.message]));
          return {
            kind: 'table' as const,
            markup: htmlTable(['stream', 'read', 'used', 'skipped', 'unused'], rows, 'Rows of each stream') + listed,
            csv: toCsv(['stream', 'read', 'used', 'skipped', 'unused'], Object.entries(rep.rows).map(([name, r]) => [name, r!.read, r!.used, r!.skipped, r!.unused])),
            ...(rep.problems.total > 0 ? { attachment: { label: 'Problems (CSV)', fileName: 'replay-problems.csv', text: problemsCsv } } : {}),
            numbers: [keyNumber('filterSteps', 'filter steps', rep.filterSteps, String(rep.filterSteps))],
          };
        }),
    },
  ],
  blocks: [
    { prose: 'Drop a log folder (camera.json plus boxes, imu, attitude, odometry and optional truth CSV files, as in the README’s flight-log layout) on the area below, or pick one with the button. The replay runs in a background worker.', pageOnly: true },
    { dropzone: 'Drop a flight-log folder here' },
    { figure: 'source' },
    { figure: 'consistency' },
    { figure: 'whiteness' },
    { figure: 'estimate' },
    { figure: 'rows' },
    { prose: 'Changing Q or R replays the log again; the file list does not change. A NIS mean above its interval says the filter is over-confident about its measurements or its motion model; correlated innovations say its model misses a dynamic the data has.' },
  ],
};
