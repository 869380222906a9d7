// The filter side of a replay: one method per kind of log row, applied in merged time order.
// It mirrors the simulator's lander (runTrial), so a recorded trial replays bit for bit:
// - IMU row: propagate to its time with the newest attitude;
// - odometry / box: applied when it arrives; a time stamped ahead of the filter clock (between
//   IMU steps) counts as "now", one earlier is a delayed measurement (box: its capture time);
// - the filter (re)starts from a box when none is running, after a divergence or after a row of
//   resets.csv: at the box's arrival time, if the box is younger than the filter's history,
//   back-projected with the attitude logged at (or just before) its capture.
// Per row it allocates nothing but the filter's small UpdateResult.
import { LandingFilter, type Box } from '../../models/LandingFilter.js';
import type { FilterSpec } from '../../sim/Scenario.js';
import { AttitudeHistory, attitudeHistorySize } from '../../sim/AttitudeHistory.js';
import { ImuHistory } from '../../models/ImuHistory.js';
import type { LogCamera } from './parseLogCamera.js';
import { BOX_SLOTS } from './logStreams.js';
import { DEFAULT_INITIAL_SIGMA, type ReplaySettings } from './ReplayReport.js';
import { gateThreshold } from '../../filter/gate.js';
import { InnovationLikelihood } from './InnovationLikelihood.js';
import { MeasurementStatistics } from './MeasurementStatistics.js';
import { TruthComparison } from './TruthComparison.js';
import { WhitenessAccumulator } from './WhitenessAccumulator.js';

/** Why a row was not used, or '' when it was. */
export type RowOutcome = string;

export class LogReplayer {
  readonly filter: LandingFilter;
  readonly boxes: MeasurementStatistics;
  readonly odometry: MeasurementStatistics;
  /** Each odometry innovation component y_i / sqrt(S_ii), for accepted updates at the filter clock. */
  readonly odometryWhiteness: WhitenessAccumulator[];
  /** Each box innovation component y_i / sqrt(S_ii) (tight: u, v, s; loose: the fix's rx, ry, rz), accepted updates, delayed ones at their capture time. */
  readonly boxWhiteness: WhitenessAccumulator[];
  /** -2 ln L of the box and of the odometry innovations (accepted and gated updates). */
  readonly boxLikelihood: InnovationLikelihood;
  readonly odometryLikelihood: InnovationLikelihood;
  readonly truth = new TruthComparison();
  started = false;
  start: number | null = null;
  steps = 0;
  restarts = 0;
  readonly divergences: { time: number; event: string }[] = [];
  onboardCompared = 0;
  onboardMax = 0;
  onboardAt: number | null = null;
  private readonly spec: FilterSpec;
  private readonly settings: ReplaySettings;
  private readonly hasOdometry: boolean;
  private haveOdometry = false;
  private resetPending = false;
  private divergenceNoted = false;
  private readonly q = new Float64Array([Number.NaN, 0, 0, 0]);
  /** Attitudes of the last historyLength (+ 0.1 s), to read a starting box with the attitude of its capture. */
  private readonly attitudes: AttitudeHistory;
  /** IMU rows kept so a start at a box's capture can re-propagate to its arrival. */
  private readonly imuSamples: ImuHistory;
  private readonly qCapture = new Float64Array(4);
  private readonly f = new Float64Array(3);
  private readonly vL = new Float64Array(3);
  private readonly box: Box = { xMin: 0, yMin: 0, xMax: 0, yMax: 0 };

  constructor(spec: FilterSpec, camera: LogCamera, settings: ReplaySettings, hasOdometry: boolean) {
    this.spec = spec;
    this.settings = settings;
    this.hasOdometry = hasOdometry;
    this.filter = new LandingFilter(spec, camera.camera, camera.targetSize, camera.outline);
    this.attitudes = new AttitudeHistory(attitudeHistorySize(spec.historyLength, spec.rate));
    this.imuSamples = new ImuHistory(attitudeHistorySize(spec.historyLength, spec.rate));
    const lags = settings.lags ?? 20;
    const gate = gateThreshold(spec.gateProbability, 3, spec.gateScale);
    this.boxLikelihood = new InnovationLikelihood(gate);
    this.odometryLikelihood = new InnovationLikelihood(gate);
    this.boxes = new MeasurementStatistics('box', lags);
    this.odometry = new MeasurementStatistics('odometry', lags);
    this.odometryWhiteness = ['vx', 'vy', 'vz'].map((c) => new WhitenessAccumulator(`odometry innovation ${c} / sqrt(S)`, lags));
    const boxComponents = spec.cameraUpdate === 'loose' ? ['rx', 'ry', 'rz'] : ['u', 'v', 's'];
    this.boxWhiteness = boxComponents.map((c) => new WhitenessAccumulator(`box innovation ${c} / sqrt(S)`, lags));
  }

  /** True while a started filter runs (not diverged). After a reset it runs on until a box restarts it, as on the lander. */
  get running(): boolean {
    return this.started && this.filter.diverged === null;
  }

  private get idle(): RowOutcome {
    return this.started ? 'after-divergence' : 'before-filter-start';
  }

  attitude(v: Float64Array): RowOutcome {
    for (let i = 0; i < 4; i++) this.q[i] = v[1 + i]!;
    this.attitudes.push(v[0]!, this.q);
    return '';
  }

  /** Emit the estimate of the finished step, then propagate (y = specific force, body FLU). */
  imu(v: Float64Array): RowOutcome {
    for (let i = 0; i < 3; i++) this.f[i] = v[1 + i]!;
    this.imuSamples.push(v[0]!, this.f, this.q);
    if (!this.running) return this.idle;
    this.emit();
    const result = this.filter.propagate(v[0]!, this.f, this.q);
    this.noteDivergence();
    if (result !== null && result.status !== 'accepted') return `refused: ${result.reason ?? result.status}`;
    this.steps++;
    return '';
  }

  odometryRow(v: Float64Array): RowOutcome {
    for (let i = 0; i < 3; i++) this.vL[i] = v[1 + i]!;
    this.haveOdometry = true;
    // Not running: the newest lander velocity only seeds the next start.
    if (!this.running) return this.idle;
    const filter = this.filter;
    const t = Math.min(v[0]!, filter.time);
    const now = t === filter.time;
    const result = filter.updateOdometry(t, this.vL);
    this.noteDivergence();
    this.settings.onUpdate?.(t, 'odometry', result.status, result.nis);
    if (now && result.status === 'accepted') this.addNormalizedInnovation(this.odometryWhiteness);
    this.addLikelihood(this.odometryLikelihood, result.status);
    return this.odometry.add(result) ? '' : `refused: ${this.odometry.lastReason}`;
  }

  boxRow(v: Float64Array): RowOutcome {
    const box = this.box;
    box.xMin = v[BOX_SLOTS.xMin]!;
    box.yMin = v[BOX_SLOTS.yMin]!;
    box.xMax = v[BOX_SLOTS.xMax]!;
    box.yMax = v[BOX_SLOTS.yMax]!;
    const capture = v[BOX_SLOTS.capture]!;
    if (!this.running || this.resetPending) return this.startFrom(capture, v[BOX_SLOTS.arrival]!);
    const t = Math.min(capture, this.filter.time);
    const result = this.filter.updateBox(t, box);
    this.noteDivergence();
    this.settings.onUpdate?.(t, 'boxes', result.status, result.nis);
    if (result.status === 'accepted') this.addNormalizedInnovation(this.boxWhiteness);
    this.addLikelihood(this.boxLikelihood, result.status);
    return this.boxes.add(result) ? '' : `refused: ${this.boxes.lastReason}`;
  }

  truthRow(v: Float64Array): RowOutcome {
    if (!this.running) return this.idle;
    const filter = this.filter;
    this.settings.onTruth?.(v, filter.x, filter.P, filter.n);
    this.truth.add(filter.x, filter.P, filter.n, v);
    return '';
  }

  onboardRow(v: Float64Array): RowOutcome {
    if (!this.running) return this.idle;
    // the onboard estimate holds the reference formulation's states, never the deck-scale state
    const filter = this.filter, n = filter.deckScaleIndex >= 0 ? filter.deckScaleIndex : filter.n;
    if (v.length - 1 < n) return 'state-size-differs';
    for (let i = 0; i < n; i++) {
      const d = Math.abs(filter.x[i]! - v[1 + i]!);
      if (!(d <= this.onboardMax)) {
        this.onboardMax = d;
        this.onboardAt = v[0]!;
      }
    }
    this.onboardCompared++;
    return '';
  }

  /** resets.csv: the lander dropped its estimate here; the next usable box starts afresh. */
  resetRow(): RowOutcome {
    if (!this.started) return 'before-filter-start';
    this.resetPending = true;
    return '';
  }

  emit(): void {
    if (this.started && this.settings.onEstimate) this.settings.onEstimate(this.filter.time, this.filter.x, this.filter.P, this.filter.n);
  }

  private startFrom(capture: number, arrival: number): RowOutcome {
    if (!Number.isFinite(this.q[0]!)) return 'no-attitude-yet';
    if (this.hasOdometry && !this.haveOdometry) return 'no-odometry-yet';
    if (arrival - capture > this.spec.historyLength) return 'too-old-to-start';
    const t = arrival;
    this.attitudes.at(capture, this.qCapture);
    const result = this.filter.initializeFromDelayedBox(Math.min(capture, t), this.box, this.qCapture, this.vL, this.settings.initialSigma ?? DEFAULT_INITIAL_SIGMA, this.imuSamples);
    if (result.status !== 'accepted') return `start-refused: ${result.reason}`;
    if (this.started) this.restarts++;
    else this.start = t;
    this.started = true;
    this.resetPending = false;
    this.divergenceNoted = false;
    return '';
  }

  /** y_i / sqrt(S_ii) of the filter's last update into one accumulator per component. */
  private addNormalizedInnovation(accumulators: WhitenessAccumulator[]): void {
    const y = this.filter.lastInnovation, S = this.filter.lastInnovationCovariance;
    for (let i = 0; i < 3; i++) accumulators[i]!.add(y[i]! / Math.sqrt(S[4 * i]!));
  }

  private addLikelihood(likelihood: InnovationLikelihood, status: string): void {
    if (status === 'accepted' || status === 'gated') likelihood.add(this.filter.lastInnovation, this.filter.lastInnovationCovariance, status === 'gated');
  }

  private noteDivergence(): void {
    const event = this.filter.diverged;
    if (event === null || this.divergenceNoted) return;
    this.divergenceNoted = true;
    this.divergences.push({ time: this.filter.time, event });
  }
}
