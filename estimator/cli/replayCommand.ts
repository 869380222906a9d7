// `alight replay <log-folder> [--filter settings.json] [--out estimates.csv] [--json]`: run the
// landing filter over a flight log and judge it from its innovations (and truth, if logged).
import { consistencyWords } from '../study/statistics/ensembleConsistency.js';
import { readFileSync } from 'node:fs';
import { isAbsolute, join } from 'node:path';
import { JsonSyntaxError, parseJsonText } from '../io/jsonPositions.js';
import { estimatesHeader, estimatesRow } from '../io/log/estimatesCsv.js';
import { FilterSettingsError } from '../io/log/filterSettings.js';
import { logSourceFromFolder } from '../io/log/logSourceFromFolder.node.js';
import { LogLayoutError, formatProblem } from '../io/log/LogProblem.js';
import { replayLog, type ReplayReport, type ReplaySettings } from '../io/log/replayLog.js';
import type { NisSummary } from '../io/log/MeasurementStatistics.js';
import { FilterSpecError } from '../models/LandingFilter.js';
import { CliError } from './CliError.js';
import type { Command } from './Command.js';
import { formatHelp, HELP_OPTION, numberOption, parseArgs, type OptionSpec } from './parseArgs.js';
import { checkOutputs, filesIn, openOutput, outputTarget, type StreamedOutput } from './outputFiles.js';

const OPTIONS: OptionSpec[] = [
  { name: 'filter', kind: 'value', valueName: 'settings.json', help: 'filter settings over the log\'s own: a partial FilterSpec, e.g. {"qScale": 2, "pixelNoise": 3}' },
  { name: 'out', kind: 'value', valueName: 'estimates.csv', help: 'write the state and covariance diagonal after every IMU step (streamed)' },
  { name: 'json', kind: 'flag', help: 'print one JSON object (rows, nisMean, nisBounds, gateRejections, whiteness, neesMean, ...)' },
  { name: 'lags', kind: 'value', valueName: 'L', help: 'lags of the whiteness test (default 20)' },
  HELP_OPTION,
];

const USAGE = 'alight replay <log-folder> [--filter settings.json] [--out estimates.csv] [--json] [--lags L]';
const PURPOSE = 'run the landing filter over a flight log: NIS with chi-square bounds, whiteness, gate rejections, NEES and RMSE with truth';

/** Settings file -> ReplaySettings.filter with line numbers for messages. */
export function readFilterSettings(command: string, path: string, cwd: string): Pick<ReplaySettings, 'filter' | 'filterSource' | 'filterLines'> {
  let text: string;
  try {
    text = readFileSync(isAbsolute(path) ? path : join(cwd, path), 'utf8');
  } catch (error) {
    throw new CliError(`alight ${command}: cannot read --filter ${path} (${(error as { code?: string }).code ?? String(error)})`);
  }
  try {
    const { value, lines } = parseJsonText(text);
    return { filter: value as ReplaySettings['filter'], filterSource: path, filterLines: lines };
  } catch (error) {
    if (error instanceof JsonSyntaxError) throw new CliError(`${path}:${error.line}:${error.column}: ${error.message}`);
    throw error;
  }
}

/** Library errors about the input -> CliError (exit 2), message only. */
export function inputError(command: string, error: unknown): never {
  if (error instanceof LogLayoutError) throw new CliError(`alight ${command}: ${error.message}`);
  if (error instanceof FilterSettingsError) throw new CliError(error.problems.map((p) => `alight ${command}: ${p}`).join('\n'));
  if (error instanceof FilterSpecError) throw new CliError(`alight ${command}: filter settings: ${error.message}`);
  throw error;
}

const f = (v: number | null, digits = 2) => (v === null || !Number.isFinite(v) ? '-' : v.toFixed(digits));

function nisLine(label: string, s: NisSummary): string {
  if (s.count === 0) return `  ${label.padEnd(11)}no accepted updates${s.gated ? `, ${s.gated} gated` : ''}`;
  // The verdict in the words every output shares (page, report, summarize): same rule, same sentence.
  const verdict = consistencyWords(s.consistent ? 'consistent' : s.mean! < s.bounds![0] ? 'under-confident' : 'over-confident');
  return `  ${label.padEnd(11)}${f(s.mean)} (dim ${s.dim}, ${s.count} updates), 95 % bounds [${f(s.bounds![0])}, ${f(s.bounds![1])}]: ${verdict}; ${s.gated} gated`;
}

export function formatReplay(r: ReplayReport): string {
  const lines = [`alight replay: ${r.log}`];
  for (const [name, rows] of Object.entries(r.rows)) {
    const reasons = Object.entries(rows.unusedReasons).map(([k, n]) => `${k} ${n}`).join(', ');
    lines.push(`  ${name.padEnd(11)}${rows.read} rows: ${rows.used} used, ${rows.skipped} skipped, ${rows.unused} unused${reasons ? ` (${reasons})` : ''}${rows.ignoredColumns.length ? `; ignored columns ${rows.ignoredColumns.join(',')}` : ''}`);
  }
  if (r.problems.total > 0) {
    lines.push(`  problems   ${r.problems.total} rows skipped (${Object.entries(r.problems.byKind).map(([k, n]) => `${k} ${n}`).join(', ')}):`);
    for (const p of r.problems.shown.slice(0, 20)) lines.push(`    ${formatProblem(p)}`);
    if (r.problems.total > 20) lines.push(`    ... ${r.problems.total - 20} more (all in --json)`);
  }
  const diverged = r.divergences.length > 0 ? `; diverged: ${r.divergences.map((d) => `${d.event} at ${f(d.time)} s`).join(', ')}` : '';
  const restarts = r.restarts > 0 ? `; ${r.restarts} restart${r.restarts === 1 ? '' : 's'}` : '';
  lines.push(r.start === null ? '  filter     never started (no usable box)' : `  filter     ${f(r.start)} s to ${f(r.end)} s, ${r.filterSteps} IMU steps${diverged}${restarts}`);
  const scale = r.deckScaleEstimate;
  if (scale) lines.push(`  deck scale ${scale.value >= 0 ? '+' : ''}${f(100 * scale.value, 1)} % ± ${f(100 * scale.sigma, 1)} % (1 sigma) at the end: the deck the filter estimates against the one it assumes`);
  lines.push(nisLine('NIS boxes', r.boxes));
  lines.push(nisLine('NIS odom', r.odometry));
  lines.push(`  gate       ${r.gateRejections} rejections`);
  const w = r.whiteness;
  lines.push(`  whiteness  ${w.white === null ? 'too few updates to test' : w.white ? 'white' : 'NOT white'} (Ljung-Box, ${w.lags} lags, 5 %)`);
  for (const t of w.tests) lines.push(`    ${t.series}: Q ${f(t.ljungBox, 1)} vs ${f(t.threshold, 1)}, p ${f(t.pValue, 3)}, ${t.outside}/${t.lags} lags outside ±${f(t.bound, 3)}`);
  if (r.neesMean !== null) lines.push(`  truth      NEES ${f(r.neesMean)} (dim ${r.neesDim}, ${r.neesCount} rows), 95 % bounds [${f(r.neesBounds![0])}, ${f(r.neesBounds![1])}] (independent samples assumed); position RMSE ${f(r.positionRmse, 3)} m, velocity RMSE ${f(r.velocityRmse, 3)} m/s`);
  if (r.descentNees) lines.push(`  truth      NEES by true height: ${consistencyWords(r.descentNees.verdict)} (inside its 95 % interval in ${r.descentNees.bins.filter((b) => b.verdict === 'consistent').length} of ${r.descentNees.bins.length} height bins)`);
  if (r.onboard) lines.push(`  onboard    ${r.onboard.compared} rows compared, largest |replay - onboard| ${r.onboard.maxStateDifference.toExponential(2)}${r.onboard.at !== null ? ` at ${f(r.onboard.at)} s` : ''}`);
  lines.push(r.caution);
  return lines.join('\n') + '\n';
}

export const replayCommand: Command = {
  name: 'replay',
  purpose: 'run the landing filter over a flight log and check its consistency',
  async run(argv, io) {
    const parsed = parseArgs('replay', argv, OPTIONS);
    if (parsed.flags.has('help')) {
      io.stdout(formatHelp(USAGE, `${PURPOSE}.\nThe log layout (camera.json, boxes.csv, imu.csv, attitude.csv, odometry.csv, truth.csv) is described\nin the README, section "Flight-log layout". Bad rows are skipped and reported with file, line and column.`, OPTIONS));
      return 0;
    }
    if (parsed.positional.length !== 1) throw new CliError(`alight replay: give one log folder (${USAGE})`);
    const folder = parsed.positional[0]!;
    const lags = numberOption('replay', parsed, 'lags', 20, (v) => Number.isInteger(v) && v >= 1 && v <= 1000, 'an integer from 1 to 1000');
    const settings: ReplaySettings = { lags };
    const filterPath = parsed.values.get('filter');
    if (filterPath !== undefined) Object.assign(settings, readFilterSettings('replay', filterPath, io.cwd));
    const outTarget = outputTarget('--out', parsed.values.get('out'), io.cwd);
    const folderPath = isAbsolute(folder) ? folder : join(io.cwd, folder);
    let stream: StreamedOutput | null = null;
    let buffer = '';
    let header = false;
    if (outTarget) {
      checkOutputs('replay', [outTarget], [...filesIn(folderPath), ...(filterPath !== undefined ? [isAbsolute(filterPath) ? filterPath : join(io.cwd, filterPath)] : [])]);
      const out = openOutput('replay', outTarget);
      stream = out;
      settings.onEstimate = (t, x, P, n) => {
        if (!header) {
          buffer += estimatesHeader(n) + '\n';
          header = true;
        }
        buffer += estimatesRow(t, x, P, n) + '\n';
        if (buffer.length > 1 << 16) {
          out.write(buffer);
          buffer = '';
        }
      };
    }
    if (io.interactive) {
      let shown = 0;
      settings.onProgress = (rows, time) => {
        const now = Date.now();
        if (now - shown < 500) return;
        shown = now;
        io.stderr(`\r  replaying: ${(rows / 1e6).toFixed(1)} M rows, log time ${time.toFixed(1)} s   `);
      };
    }
    let report: ReplayReport;
    let complete = false;
    try {
      report = await replayLog(logSourceFromFolder(folderPath, folder), settings);
      complete = true;
    } catch (error) {
      inputError('replay', error);
    } finally {
      // The estimates file appears under its name only when the replay finished.
      if (stream !== null) {
        if (complete && buffer.length > 0) stream.write(buffer);
        stream.finish(complete);
      }
    }
    if (io.interactive) io.stderr('\r\x1b[K');
    io.stdout(parsed.flags.has('json') ? JSON.stringify(report) + '\n' : formatReplay(report));
    return 0;
  },
};
