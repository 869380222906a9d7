// Replay a flight log through the LandingFilter: a k-way merge of the time-ordered CSV
// streams (each read row by row, never loaded whole) feeding a LogReplayer, then the report:
// NIS with chi-square bounds, whiteness, gate rejections and, with truth, NEES and RMSE.
// Browser-safe: give it any LogSource. The merge allocates nothing per row.
import { descentConsistency } from '../../study/statistics/descentConsistency.js';
import type { FilterSpec } from '../../sim/Scenario.js';
import { averagedChiSquareInterval } from '../../stats/chiSquare.js';
import { applyFilterSettings, defaultFilterSpec, FilterSettingsError } from './filterSettings.js';
import { LogLayoutError, ProblemLog } from './LogProblem.js';
import { LogReplayer, type RowOutcome } from './LogReplayer.js';
import { UnparsedJson, type LogSource } from './LogSource.js';
import { LogStreamReader } from './LogStreamReader.js';
import { LOG_STREAMS, REQUIRED_STREAMS, STREAM_SPECS, type LogStreamName } from './logStreams.js';
import { parseLogCamera, type LogCamera } from './parseLogCamera.js';
import { SAFETY_CAUTION } from '../../safetyCaution.js';
import { type ReplayReport, type ReplaySettings, type StreamRows } from './ReplayReport.js';
import { whitenessSummary } from './WhitenessAccumulator.js';

export { DEFAULT_INITIAL_SIGMA } from './ReplayReport.js';
export type { ReplayReport, ReplaySettings, StreamRows } from './ReplayReport.js';

/** Same-time rows apply in this order (attitude first, comparisons last): see README.md, "Flight-log layout". */
const TIE_ORDER: Record<LogStreamName, number> = { attitude: 0, imu: 1, odometry: 2, boxes: 3, resets: 4, truth: 5, onboard: 6 };

function readCameraJson(source: LogSource) {
  if (source.camera === undefined || source.camera === null) throw new LogLayoutError('camera.json', null, null, 'missing: a flight log needs camera.json (see the flight-log layout)');
  if (source.camera instanceof UnparsedJson) throw new LogLayoutError(`camera.json:${source.camera.line}:${source.camera.column}`, null, null, `not valid JSON: ${source.camera.error}`);
  return parseLogCamera(source.camera, source.cameraLines);
}

/** The FilterSpec a replay runs with: defaults <- the log's filter.json <- settings.filter. */
export function replayFilterSpec(source: LogSource, settings: ReplaySettings = {}): FilterSpec {
  let spec = defaultFilterSpec();
  if (source.filter instanceof UnparsedJson) throw new FilterSettingsError([`filter.json:${source.filter.line}:${source.filter.column}: not valid JSON: ${source.filter.error}`]);
  if (source.filter !== null && source.filter !== undefined) spec = applyFilterSettings(spec, source.filter, 'filter.json', source.filterLines);
  if (settings.filter) spec = applyFilterSettings(spec, settings.filter, settings.filterSource ?? 'settings', settings.filterLines);
  return spec;
}

function apply(replayer: LogReplayer, name: LogStreamName, v: Float64Array): RowOutcome {
  switch (name) {
    case 'attitude':
      return replayer.attitude(v);
    case 'imu':
      return replayer.imu(v);
    case 'odometry':
      return replayer.odometryRow(v);
    case 'boxes':
      return replayer.boxRow(v);
    case 'resets':
      return replayer.resetRow();
    case 'truth':
      return replayer.truthRow(v);
    case 'onboard':
      return replayer.onboardRow(v);
  }
}

export async function replayLog(source: LogSource, settings: ReplaySettings = {}): Promise<ReplayReport> {
  const camera = readCameraJson(source);
  const spec = replayFilterSpec(source, settings);
  const level = settings.level ?? 0.95;
  const problems = new ProblemLog(settings.keepProblems ?? 100);
  const readers: LogStreamReader[] = [];
  const unused = new Map<LogStreamReader, Record<string, number>>();
  for (const name of LOG_STREAMS) {
    const chunks = source.openChunks ? source.openChunks(name) : null;
    const lines = chunks ?? source.open(name);
    if (lines === null) {
      if (REQUIRED_STREAMS.includes(name)) {
        await Promise.all(readers.map((r) => r.close()));
        throw new LogLayoutError(source.fileName(name), null, null, 'missing: a flight log needs boxes.csv, imu.csv and attitude.csv (see the flight-log layout)');
      }
      continue;
    }
    const reader = new LogStreamReader(STREAM_SPECS[name], lines, problems, camera.timeOffsets[name] ?? 0, chunks !== null);
    readers.push(reader);
    unused.set(reader, {});
  }
  try {
    return await merge(source, spec, level, settings, camera, readers, unused, problems);
  } finally {
    // After a layout error (or any other), no file stays open; after a full read this does nothing.
    await Promise.all(readers.map((r) => r.close()));
  }
}

async function merge(source: LogSource, spec: FilterSpec, level: number, settings: ReplaySettings, camera: LogCamera, readers: LogStreamReader[], unused: Map<LogStreamReader, Record<string, number>>, problems: ProblemLog): Promise<ReplayReport> {
  for (const reader of readers) {
    await reader.start();
    await reader.advance();
  }
  readers.sort((a, b) => TIE_ORDER[a.spec.name] - TIE_ORDER[b.spec.name]);
  const replayer = new LogReplayer(spec, camera, settings, readers.some((r) => r.spec.name === 'odometry'));
  let merged = 0;

  for (;;) {
    // k-way merge, k <= 7: a linear scan beats a heap. Readers are sorted by TIE_ORDER, so on
    // equal times the strict < keeps the earlier stream.
    let next: LogStreamReader | null = null;
    let nextKey = Infinity;
    for (let i = 0; i < readers.length; i++) {
      const reader = readers[i]!;
      if (reader.key < nextKey) {
        next = reader;
        nextKey = reader.key;
      }
    }
    if (next === null) break;
    if ((++merged & 0xffff) === 0) settings.onProgress?.(merged, nextKey);
    const outcome = apply(replayer, next.spec.name, next.values);
    if (outcome === '') next.used++;
    else {
      const reasons = unused.get(next)!;
      reasons[outcome] = (reasons[outcome] ?? 0) + 1;
    }
    // Next row: synchronous while the chunk lasts, one await per chunk.
    let state = next.step();
    while (state < 0) {
      await next.fill();
      state = next.step();
    }
  }
  replayer.emit();
  return report(source, spec, level, readers, unused, problems, replayer);
}

function likelihood(r: LogReplayer): ReplayReport['likelihood'] {
  const boxes = r.boxLikelihood.summary(), odometry = r.odometryLikelihood.summary();
  return { minus2LogL: boxes.minus2LogL + odometry.minus2LogL, boxes, odometry };
}

function report(source: LogSource, spec: FilterSpec, level: number, readers: LogStreamReader[], unused: Map<LogStreamReader, Record<string, number>>, problems: ProblemLog, r: LogReplayer): ReplayReport {
  const rows: Partial<Record<LogStreamName, StreamRows>> = {};
  for (const reader of readers) {
    const reasons = unused.get(reader)!;
    const count = Object.values(reasons).reduce((a, b) => a + b, 0);
    rows[reader.spec.name] = { read: reader.read, used: reader.used, skipped: reader.skipped, unused: count, unusedReasons: reasons, ignoredColumns: reader.ignoredColumns };
  }
  const boxes = r.boxes.summary(level);
  const odometry = r.odometry.summary(level);
  const hasTruth = rows.truth !== undefined;
  const t = r.truth.summary();
  const lags = r.boxes.nisWhiteness.lags;
  return {
    log: source.name,
    layoutVersion: 1,
    filter: spec,
    rows,
    problems: { total: problems.total, byKind: problems.byKind, shown: problems.shown },
    start: r.start,
    end: r.started ? r.filter.time : null,
    filterSteps: r.steps,
    nisMean: boxes.mean,
    nisCount: boxes.count,
    nisDim: boxes.dim,
    nisBounds: boxes.bounds,
    level,
    boxes,
    odometry,
    gateRejections: boxes.gated + odometry.gated,
    // NIS sequences first, then each normalized innovation component (odometry, then boxes)
    whiteness: whitenessSummary([r.boxes.nisWhiteness, r.odometry.nisWhiteness, ...r.odometryWhiteness, ...r.boxWhiteness], lags),
    likelihood: likelihood(r),
    neesMean: hasTruth && t.neesCount > 0 ? t.neesMean : null,
    neesDim: t.neesDim,
    neesCount: t.neesCount,
    neesBounds: hasTruth && t.neesCount > 0 ? averagedChiSquareInterval(t.neesCount, t.neesDim, level) : null,
    neesByHeight: hasTruth && t.neesCount > 0 ? t.neesByHeight : null,
    descentNees: hasTruth && t.neesCount > 0 ? descentConsistency([t.neesByHeight], t.neesDim) : null,
    positionRmse: hasTruth && t.count > 0 ? t.positionRmse : null,
    velocityRmse: hasTruth && t.count > 0 ? t.velocityRmse : null,
    onboard: rows.onboard !== undefined ? { compared: r.onboardCompared, maxStateDifference: r.onboardMax, at: r.onboardAt } : null,
    divergence: r.divergences.length > 0 ? r.divergences[0]!.event : null,
    divergences: r.divergences,
    restarts: r.restarts,
    ...(r.filter.deckScaleIndex >= 0 ? { deckScaleEstimate: r.started ? r.filter.deckScale() : null } : {}),
    caution: SAFETY_CAUTION,
  };
}
