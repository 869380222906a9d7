// Replay a flight log through the LandingFilter: a k-way merge of the time-ordered CSV
// streams (each read row by row, never loaded whole), boxes applied when they arrived at
// the time they were captured (delayed measurements), statistics from the innovations and,
// with truth, from the errors. Browser-safe: give it any LogSource.
// Per row the merge allocates only the split line and the filter's small UpdateResult.
import type { FilterSpec } from '../../sim/Scenario.js';
import { LandingFilter, type Box, type UpdateStatus } from '../../models/LandingFilter.js';
import { averagedChiSquareInterval } from '../../stats/chiSquare.js';
import { applyFilterSettings, defaultFilterSpec, FilterSettingsError } from './filterSettings.js';
import { LogLayoutError, ProblemLog, type LogProblem, type LogProblemKind } from './LogProblem.js';
import { UnparsedJson, type LogSource } from './LogSource.js';
import { LogStreamReader } from './LogStreamReader.js';
import { BOX_SLOTS, LOG_STREAMS, REQUIRED_STREAMS, STREAM_SPECS, type LogStreamName } from './logStreams.js';
import { parseLogCamera } from './parseLogCamera.js';
import { MeasurementStatistics, whitenessSummary, type NisSummary, type WhitenessSummary } from './ReplayStatistics.js';
import { TruthComparison } from './TruthComparison.js';
import { WhitenessAccumulator } from './WhitenessAccumulator.js';
import { PendingMeasurements, PENDING_BOX, PENDING_ODOMETRY } from './PendingMeasurements.js';

/** Start-up uncertainty, the same the simulator's runTrial uses. */
export const DEFAULT_INITIAL_SIGMA = { velocity: 1, accelBias: 0.2 };

export const REPLAY_CAUTION = 'Replay and simulation results clear nothing for flight: fly under local aviation rules and licensed practice, with a safety pilot, geofence and kill switch.';

/** Same-time events apply in this order (attitude first, comparisons last): see LAYOUT.md. */
/** Times this close to the filter clock count as "now" (s); the filter uses the same tolerance. */
const TIME_EPSILON = 1e-9;

const TIE_ORDER: Record<LogStreamName, number> = { attitude: 0, imu: 1, odometry: 2, boxes: 3, truth: 4, onboard: 5 };

export interface ReplaySettings {
  /** Partial FilterSpec applied over the log's filter.json (and the defaults). Validated. */
  filter?: Partial<FilterSpec>;
  /** Name of the settings' origin for messages (default "settings"). */
  filterSource?: string;
  /** Line of each settings field (from jsonLines) for messages. */
  filterLines?: ReadonlyMap<string, number>;
  /** Initial 1-sigma of velocities (m/s) and accelerometer bias (m/s²) at the first box. Default { velocity: 1, accelBias: 0.2 } (as the simulator). */
  initialSigma?: { velocity: number; accelBias: number };
  /** Whiteness lags L (default 20) and confidence level of the NIS/NEES bounds (default 0.95). */
  lags?: number;
  level?: number;
  /** Row problems kept in full in the report (all are counted; default 100). */
  keepProblems?: number;
  /** Called after each IMU step's events with the filter's own x and P (n x n): copy, do not keep. */
  onEstimate?: (t: number, x: Float64Array, P: Float64Array, n: number) => void;
  /** Called after every box/odometry update the filter evaluated: measurement time (s), status, NIS (NaN unless accepted or gated). */
  onUpdate?: (time: number, stream: 'boxes' | 'odometry', status: UpdateStatus, nis: number) => void;
  /** Called for every truth row compared: [t, rx, ry, rz, vcx, vcy, vcz, vlx, vly, vlz] and the filter's x, P then (all reused: copy). */
  onTruth?: (truth: Float64Array, x: Float64Array, P: Float64Array, n: number) => void;
}

export interface StreamRows {
  /** Data rows in the file; used by the filter; skipped for a problem; unused = good rows the filter could not use. */
  read: number;
  used: number;
  skipped: number;
  unused: number;
  /** Why rows went unused, counted. */
  unusedReasons: Record<string, number>;
  /** Header columns this stream ignores. */
  ignoredColumns: string[];
}

export interface ReplayReport {
  log: string;
  layoutVersion: 1;
  filter: FilterSpec;
  rows: Partial<Record<LogStreamName, StreamRows>>;
  problems: { total: number; byKind: Partial<Record<LogProblemKind, number>>; shown: LogProblem[] };
  /** Filter time span (s) and IMU steps taken; null start = the filter never started. */
  start: number | null;
  end: number | null;
  filterSteps: number;
  /** Box (camera) updates: mean NIS, count, dimension, chi-square bounds at `level`. */
  nisMean: number | null;
  nisCount: number;
  nisDim: number;
  nisBounds: [number, number] | null;
  level: number;
  boxes: NisSummary;
  odometry: NisSummary;
  /** Gate rejections of boxes and odometry together. */
  gateRejections: number;
  whiteness: WhitenessSummary;
  /** With truth.csv: mean NEES of [r, vC, vL] (dim 9) with bounds, RMS errors; null without. */
  neesMean: number | null;
  neesDim: number;
  neesCount: number;
  neesBounds: [number, number] | null;
  positionRmse: number | null;
  velocityRmse: number | null;
  /** With onboard.csv: rows compared and the largest |x_replay - x_onboard| over all of them. */
  onboard: { compared: number; maxStateDifference: number; at: number | null } | null;
  /** First divergence event (named by the filter), all of them with times, and restarts from a later box. */
  divergence: string | null;
  divergences: { time: number; event: string }[];
  restarts: number;
  caution: string;
}

function readCameraJson(source: LogSource) {
  if (source.camera === undefined || source.camera === null) throw new LogLayoutError('camera.json', null, null, 'missing: a flight log needs camera.json (see the flight-log layout)');
  if (source.camera instanceof UnparsedJson) throw new LogLayoutError('camera.json', null, null, `not valid JSON (${source.camera.error})`);
  return parseLogCamera(source.camera);
}

/** The FilterSpec a replay runs with: defaults <- the log's filter.json <- settings.filter. */
export function replayFilterSpec(source: LogSource, settings: ReplaySettings = {}): FilterSpec {
  let spec = defaultFilterSpec();
  if (source.filter instanceof UnparsedJson) throw new FilterSettingsError([`filter.json: not valid JSON (${source.filter.error})`]);
  if (source.filter !== null && source.filter !== undefined) spec = applyFilterSettings(spec, source.filter, 'filter.json');
  if (settings.filter) spec = applyFilterSettings(spec, settings.filter, settings.filterSource ?? 'settings', settings.filterLines);
  return spec;
}

export async function replayLog(source: LogSource, settings: ReplaySettings = {}): Promise<ReplayReport> {
  const { camera, targetSize, timeOffsets } = readCameraJson(source);
  const spec = replayFilterSpec(source, settings);
  const lags = settings.lags ?? 20;
  const level = settings.level ?? 0.95;
  const sigma = settings.initialSigma ?? DEFAULT_INITIAL_SIGMA;
  const problems = new ProblemLog(settings.keepProblems ?? 100);
  const readers: LogStreamReader[] = [];
  const unused = new Map<LogStreamName, Record<string, number>>();
  for (const name of LOG_STREAMS) {
    const chunks = source.openChunks ? source.openChunks(name) : null;
    const lines = chunks ?? source.open(name);
    if (lines === null) {
      if (REQUIRED_STREAMS.includes(name)) throw new LogLayoutError(source.fileName(name), null, null, 'missing: a flight log needs boxes.csv, imu.csv and attitude.csv (see the flight-log layout)');
      continue;
    }
    const reader = new LogStreamReader(STREAM_SPECS[name], lines, problems, timeOffsets[name] ?? 0, chunks !== null);
    await reader.start();
    await reader.advance();
    readers.push(reader);
    unused.set(name, {});
  }
  readers.sort((a, b) => TIE_ORDER[a.spec.name] - TIE_ORDER[b.spec.name]);
  const filter = new LandingFilter(spec, camera, targetSize);
  const n = filter.n;
  const boxStats = new MeasurementStatistics('box', lags);
  const odometryStats = new MeasurementStatistics('odometry', lags);
  const odometryWhiteness = ['vx', 'vy', 'vz'].map((c) => new WhitenessAccumulator(`odometry innovation ${c} / sqrt(S)`, lags));
  const varOdometry = spec.odometryNoise * spec.odometryNoise * spec.rScale;
  const truth = new TruthComparison();
  const pending = new PendingMeasurements(1024);
  const box: Box = { xMin: 0, yMin: 0, xMax: 0, yMax: 0 };
  const q = new Float64Array([Number.NaN, 0, 0, 0]);
  const f = new Float64Array(3);
  const vL = new Float64Array(3);
  const y = new Float64Array(3);
  const corners = new Float64Array(4);
  let started = false;
  let haveOdometry = false;
  let restarts = 0;
  const divergences: { time: number; event: string }[] = [];
  const hasOdometryStream = readers.some((r) => r.spec.name === 'odometry');
  let start: number | null = null;
  let steps = 0;
  let onboardCompared = 0;
  let onboardMax = 0;
  let onboardAt: number | null = null;

  const skipUnused = (reader: LogStreamReader, reason: string) => {
    const reasons = unused.get(reader.spec.name)!;
    reasons[reason] = (reasons[reason] ?? 0) + 1;
  };
  const reasonOf = (reader: LogStreamReader) => unused.get(reader.spec.name)!;
  const emit = () => {
    if (started && settings.onEstimate) settings.onEstimate(filter.time, filter.x, filter.P, n);
  };

  /** Apply one measurement whose time the filter clock has reached. Returns true when used. */
  const applyBox = (capture: number, v: ArrayLike<number>): boolean => {
    box.xMin = v[0]!;
    box.yMin = v[1]!;
    box.xMax = v[2]!;
    box.yMax = v[3]!;
    const result = filter.updateBox(capture, box);
    settings.onUpdate?.(capture, 'boxes', result.status, result.nis);
    return boxStats.add(result);
  };
  const applyOdometry = (t: number, v: ArrayLike<number>): boolean => {
    const now = Math.abs(t - filter.time) <= TIME_EPSILON;
    if (now) for (let i = 0; i < 3; i++) y[i] = (v[i]! - filter.x[6 + i]!) / Math.sqrt(filter.P[(6 + i) * n + 6 + i]! + varOdometry);
    const result = filter.updateOdometry(t, v);
    settings.onUpdate?.(t, 'odometry', result.status, result.nis);
    if (now && result.status === 'accepted') for (let i = 0; i < 3; i++) odometryWhiteness[i]!.add(y[i]!);
    return odometryStats.add(result);
  };
  /**
   * (Re)start the filter from a box, as the simulator does: at the box's arrival time, with
   * the newest attitude and odometry velocity, then vC = vL (the lander trails the carrier).
   * Returns '' when started, else why the box could not start it.
   */
  const startFromBox = (v: Float64Array): string => {
    if (!Number.isFinite(q[0]!)) return 'no-attitude-yet';
    if (hasOdometryStream && !haveOdometry) return 'no-odometry-yet';
    box.xMin = v[BOX_SLOTS.xMin]!;
    box.yMin = v[BOX_SLOTS.yMin]!;
    box.xMax = v[BOX_SLOTS.xMax]!;
    box.yMax = v[BOX_SLOTS.yMax]!;
    const t = v[BOX_SLOTS.arrival]!;
    const result = filter.initializeFromBox(t, box, q, vL, sigma);
    if (result.status !== 'accepted') return `start-refused: ${result.reason}`;
    for (let i = 0; i < 3; i++) filter.x[3 + i] = filter.x[6 + i]!;
    dropPending('dropped-at-restart');
    if (started) restarts++;
    else start = t;
    started = true;
    return '';
  };
  /** Held measurements that will never be applied: no longer used, with a reason. */
  const dropPending = (why: string) => {
    for (const [stream, count] of pending.drain()) {
      const reader = readers.find((x) => x.spec.name === stream)!;
      reader.used -= count;
      const r = reasonOf(reader);
      r[why] = (r[why] ?? 0) + count;
    }
  };
  const flushPending = () => {
    while (pending.size > 0 && pending.peekTime() <= filter.time + TIME_EPSILON) {
      const kind = pending.peekKind();
      const used = kind === PENDING_BOX ? applyBox(pending.peekTime(), pending.peekData()) : applyOdometry(pending.peekTime(), pending.peekData());
      pending.markOutcome(used, kind === PENDING_BOX ? boxStats.lastReason : odometryStats.lastReason);
      pending.pop();
    }
  };

  for (;;) {
    // k-way merge, k <= 6: a linear scan beats a heap. Readers are sorted by TIE_ORDER, so on
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
    const v = next.values;
    const name = next.spec.name;
    let used = false;
    let reason = started ? 'after-divergence' : 'before-filter-start';
    if (name === 'attitude') {
      for (let i = 0; i < 4; i++) q[i] = v[1 + i]!;
      used = true;
    } else if (name === 'odometry' && (!started || filter.diverged)) {
      // Not an update, but the newest lander velocity seeds the next (re)start.
      for (let i = 0; i < 3; i++) vL[i] = v[1 + i]!;
      haveOdometry = true;
    } else if (name === 'boxes' && (!started || filter.diverged)) {
      reason = startFromBox(v);
      used = reason === '';
    } else if (started && !filter.diverged) {
      switch (name) {
        case 'imu': {
          emit();
          for (let i = 0; i < 3; i++) f[i] = v[1 + i]!;
          const result = filter.propagate(v[0]!, f, q);
          used = result === null || result.status === 'accepted';
          if (used) steps++;
          if (!used) reason = `refused: ${result?.reason ?? result?.status}`;
          flushPending();
          break;
        }
        case 'odometry':
          for (let i = 0; i < 3; i++) vL[i] = v[1 + i]!;
          haveOdometry = true;
          if (v[0]! > filter.time + TIME_EPSILON) {
            used = pending.push(PENDING_ODOMETRY, v[0]!, vL, name);
            reason = 'pending-queue-full';
          } else {
            used = applyOdometry(v[0]!, vL);
            if (!used) reason = `refused: ${odometryStats.lastReason}`;
          }
          break;
        case 'boxes': {
          const capture = v[BOX_SLOTS.capture]!;
          for (let i = 0; i < 4; i++) corners[i] = v[BOX_SLOTS.xMin + i]!;
          if (capture > filter.time + TIME_EPSILON) {
            used = pending.push(PENDING_BOX, capture, corners, name);
            reason = 'pending-queue-full';
          } else {
            used = applyBox(capture, corners);
            if (!used) reason = `refused: ${boxStats.lastReason}`;
          }
          break;
        }
        case 'truth':
          settings.onTruth?.(v, filter.x, filter.P, n);
          truth.add(filter.x, filter.P, n, v);
          used = true;
          break;
        case 'onboard':
          used = v.length - 1 >= n;
          reason = 'state-size-differs';
          if (used) {
            for (let i = 0; i < n; i++) {
              const d = Math.abs(filter.x[i]! - v[1 + i]!);
              if (!(d <= onboardMax)) {
                onboardMax = d;
                onboardAt = v[0]!;
              }
            }
            onboardCompared++;
          }
          break;
      }
    }
    if (filter.diverged && divergences.length === restarts) divergences.push({ time: filter.time, event: filter.diverged });
    if (used) next.used++;
    else skipUnused(next, reason);
    // Next row: synchronous while the chunk lasts, one await per chunk.
    let state = next.step();
    while (state < 0) {
      await next.fill();
      state = next.step();
    }
  }
  emit();
  // Measurements still waiting for an IMU step that never came, and pending outcomes.
  dropPending('after-last-imu-step');
  for (const [stream, reasons] of pending.refusedCounts()) {
    const reader = readers.find((x) => x.spec.name === stream)!;
    const r = reasonOf(reader);
    for (const [why, count] of Object.entries(reasons)) {
      reader.used -= count;
      r[`refused: ${why}`] = (r[`refused: ${why}`] ?? 0) + count;
    }
  }

  const rows: Partial<Record<LogStreamName, StreamRows>> = {};
  for (const reader of readers) {
    const reasons = reasonOf(reader);
    const unusedCount = Object.values(reasons).reduce((a, b) => a + b, 0);
    rows[reader.spec.name] = { read: reader.read, used: reader.used, skipped: reader.skipped, unused: unusedCount, unusedReasons: reasons, ignoredColumns: reader.ignoredColumns };
  }
  const boxes = boxStats.summary(level);
  const odometry = odometryStats.summary(level);
  const hasTruth = readers.some((r) => r.spec.name === 'truth');
  const t = truth.summary();
  return {
    log: source.name,
    layoutVersion: 1,
    filter: spec,
    rows,
    problems: { total: problems.total, byKind: problems.byKind, shown: problems.shown },
    start,
    end: started ? filter.time : null,
    filterSteps: steps,
    nisMean: boxes.mean,
    nisCount: boxes.count,
    nisDim: boxes.dim,
    nisBounds: boxes.bounds,
    level,
    boxes,
    odometry,
    gateRejections: boxes.gated + odometry.gated,
    whiteness: whitenessSummary([boxStats.nisWhiteness, odometryStats.nisWhiteness, ...odometryWhiteness], lags),
    neesMean: hasTruth && t.neesCount > 0 ? t.neesMean : null,
    neesDim: t.neesDim,
    neesCount: t.neesCount,
    neesBounds: hasTruth && t.neesCount > 0 ? averagedChiSquareInterval(t.neesCount, t.neesDim, level) : null,
    positionRmse: hasTruth && t.count > 0 ? t.positionRmse : null,
    velocityRmse: hasTruth && t.count > 0 ? t.velocityRmse : null,
    onboard: readers.some((r) => r.spec.name === 'onboard') ? { compared: onboardCompared, maxStateDifference: onboardMax, at: onboardAt } : null,
    divergence: divergences.length > 0 ? divergences[0]!.event : null,
    divergences,
    restarts,
    caution: REPLAY_CAUTION,
  };
}
