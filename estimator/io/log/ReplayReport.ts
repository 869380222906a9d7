// What a replay takes (settings) and gives back (the report): field names are promises to
// users' scripts (`alight replay --json`): keep them.
import type { UpdateStatus } from '../../models/LandingFilter.js';
import type { FilterSpec } from '../../sim/Scenario.js';
import type { LogProblem, LogProblemKind } from './LogProblem.js';
import type { LogStreamName } from './logStreams.js';
import type { LikelihoodSummary } from './InnovationLikelihood.js';
import type { NisSummary } from './MeasurementStatistics.js';
import type { WhitenessSummary } from './WhitenessAccumulator.js';

/** Start-up uncertainty, the same the simulator's runTrial uses. */
export const DEFAULT_INITIAL_SIGMA = { velocity: 1, accelBias: 0.2 };

export interface ReplaySettings {
  /** Partial FilterSpec applied over the log's filter.json (and the defaults). Validated. */
  filter?: Partial<FilterSpec>;
  /** Name of the settings' origin for messages (default "settings"). */
  filterSource?: string;
  /** Line of each settings field (from jsonLines) for messages. */
  filterLines?: ReadonlyMap<string, number>;
  /** Initial 1-sigma of velocities (m/s) and accelerometer bias (m/s²) at a start. Default DEFAULT_INITIAL_SIGMA. */
  initialSigma?: { velocity: number; accelBias: number };
  /** Whiteness lags L (default 20) and confidence level of the NIS/NEES bounds (default 0.95). */
  lags?: number;
  level?: number;
  /** Row problems kept in full in the report (all are counted; default 100). */
  keepProblems?: number;
  /** Called before each IMU step and at the end with the filter's own x and P (n x n): copy, do not keep. */
  onEstimate?: (t: number, x: Float64Array, P: Float64Array, n: number) => void;
  /** Called after every box/odometry update the filter evaluated: measurement time (s), status, NIS (NaN unless accepted or gated). */
  onUpdate?: (time: number, stream: 'boxes' | 'odometry', status: UpdateStatus, nis: number) => void;
  /** Called every 65,536 rows with the rows merged so far and the current log time (s): progress for long logs. */
  onProgress?: (rows: number, time: number) => void;
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

import type { EnsembleConsistency } from '../../study/statistics/ensembleConsistency.js';

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
  /**
   * Innovation likelihood, -2 ln L = sum (ln|2 pi S_k| + y_kᵀ S_k⁻¹ y_k) over box and odometry
   * updates (NIS beyond the gate log-weighted): the objective of noise identification
   * (Mehra 1970; Bar-Shalom, Li, Kirubarajan 2001). Lower is more likely.
   */
  likelihood: { minus2LogL: number; boxes: LikelihoodSummary; odometry: LikelihoodSummary };
  /** With truth.csv: mean NEES of relative position + velocity (dim 6) with bounds, RMS errors; null without. */
  neesMean: number | null;
  neesDim: number;
  neesCount: number;
  neesBounds: [number, number] | null;
  /**
   * With truth.csv: mean NEES per true-height bin (DESCENT_HEIGHT_EDGES, every row counted) and
   * the verdict of the same ensemble rule as summarize (one run per bin); null without truth.
   */
  neesByHeight: (number | null)[] | null;
  descentNees: EnsembleConsistency | null;
  positionRmse: number | null;
  velocityRmse: number | null;
  /** With onboard.csv: rows compared and the largest |x_replay - x_onboard| over all of them. */
  onboard: { compared: number; maxStateDifference: number; at: number | null } | null;
  /** First divergence event (named by the filter), all of them with times, and restarts after the first start. */
  divergence: string | null;
  divergences: { time: number; event: string }[];
  restarts: number;
  /**
   * The filter's deck-scale estimate at the end of the replay: s (true deck = assumed x (1 + s))
   * and its 1 sigma. Present only when the settings carry the state (filter.deckScaleSigma > 0);
   * null when the filter never started.
   */
  deckScaleEstimate?: { value: number; sigma: number } | null;
  caution: string;
}
