// The landing filter: 12-state EKF (15 with Singer carrier acceleration) on relative position,
// carrier and lander velocity and accelerometer bias (see landingState.ts), driven by the IMU
// and updated by detector boxes (tight or loose) and odometry. Delayed boxes are applied at
// their capture time and the history re-propagated to now. Hot path allocation-free except the
// small UpdateResult object returned per measurement.
// Divergence: NaN/Infinity is caught at every step; the full positive-definiteness test
// (Cholesky of P) runs every PD_CHECK_INTERVAL updates (on time or delayed), after a replay
// that met a non-finite value, and whenever S = H P Hᵀ + R fails to be positive definite — a
// non-PD P is reported within a few updates, a NaN never leaves the filter (x and P are
// restored to the last good step).
import type { FilterSpec } from './FilterSettings.js';
import { type Box, boxProblem } from '../camera/Box.js';
import type { FilterCamera } from './FilterCamera.js';
import { FilterHistory, EVENT_DATA, EVENT_LOOSE, EVENT_ODOMETRY, EVENT_TIGHT, EVENTS_PER_STEP } from './FilterHistory.js';
import type { DeckOutline } from './OutlineBoxModel.js';
import type { ImuHistory } from './ImuHistory.js';
import { LandingCore } from './LandingCore.js';
import { rejected, type InitialSigma, type UpdateResult, type UpdateStatus } from './UpdateResult.js';
import { validateFilterSpec } from './validateFilterSpec.js';
import { checkCovariance } from '../filter/checkCovariance.js';
import { cholesky } from '../filter/cholesky.js';

export type { FilterCamera } from './FilterCamera.js';
export type { Box } from '../camera/Box.js';
export type { UpdateStatus, UpdateResult, InitialSigma } from './UpdateResult.js';
export { FilterSpecError } from './validateFilterSpec.js';

const TIME_EPSILON = 1e-9; // s: capture times this close to the filter clock count as "now"
const PD_CHECK_INTERVAL = 8; // updates between full Cholesky tests of P
/** The attitude of a step before any IMU sample (a Float64Array like every other, so the history's hot code sees one kind of array). */
const UNKNOWN_ATTITUDE = new Float64Array(4).fill(Number.NaN);

export class LandingFilter {
  /** State dimension: 12, or 15 with the Singer carrier model. */
  readonly n: number;
  /** State estimate x (see landingState.ts) and covariance P (n x n row-major). */
  readonly x: Float64Array;
  readonly P: Float64Array;
  /**
   * The last box or odometry update's innovation y = z - h(x) (its first lastUpdateDim
   * numbers) and its covariance S = H P Hᵀ + R (lastUpdateDim² numbers, row-major), at the
   * measurement's own time (a delayed box: its capture time, before the re-propagation to now).
   * Valid when that update returned 'accepted' or 'gated' (lastUpdateDim = 3, or 4 for a tight
   * box with boxTerms 'centre-width-height'); NaN with lastUpdateDim = 0 after any other outcome.
   * Units: tight box (u, v, s) or (u, v, w, h) px and px²; loose box the back-projected r (ENU,
   * m) and m²; odometry vL (ENU, m/s) and (m/s)². Read-only, overwritten by the next update.
   */
  readonly lastInnovation = new Float64Array(4).fill(Number.NaN);
  readonly lastInnovationCovariance = new Float64Array(16).fill(Number.NaN);
  private innovationDim = 0;
  private clock = Number.NaN;
  private divergence: string | null = null;
  private initialized = false;
  private updatesSinceCheck = 0;
  /** A predict or update of the current delayed-box replay met a non-finite value or non-PD S. */
  private replayBroken = false;
  private readonly core: LandingCore;
  /** x and P as one array (x and P are views of it). */
  private readonly state: Float64Array;
  private readonly history: FilterHistory;
  private readonly loose: boolean;
  private readonly attitude = new Float64Array(4);
  private readonly force = new Float64Array(3);
  private readonly replayForce = new Float64Array(3);
  /** Scratch for the IMU samples a delayed start re-propagates. */
  private readonly startForce = new Float64Array(3);
  private readonly startAttitude = new Float64Array(4);
  private readonly replayAttitude = new Float64Array(4);

  /**
   * @param spec filter settings (validated here: FilterSpecError names the bad field)
   * @param camera the camera as the filter believes it (intrinsics, distortion, mount)
   * @param targetSize L = sqrt(target area) assumed by the flat box model and the loose fix (m)
   * @param outline the deck outline assumed by the outline box model (m); default a flat
   *   square deck of side targetSize (a flight log that gives only the target size)
   */
  constructor(readonly spec: FilterSpec, camera: FilterCamera, targetSize: number, outline?: DeckOutline) {
    validateFilterSpec(spec);
    this.core = new LandingCore(spec, camera, targetSize, outline);
    this.n = this.core.n;
    this.x = this.core.x;
    this.P = this.core.P;
    this.state = this.core.state;
    this.history = new FilterHistory(this.n, Math.ceil(spec.historyLength * spec.rate * 1.5) + 4);
    this.loose = spec.cameraUpdate === 'loose';
  }

  /** Filter clock (s) = IMU clock; NaN before initialization. */
  get time(): number {
    return this.clock;
  }

  /** Dimension of the tight box measurement: 3 (centre, size) or 4 (centre, width, height). */
  get boxDim(): number {
    return this.core.boxDim;
  }

  /** Dimension of lastInnovation: 3 (or 4) after an accepted or gated update, else 0. */
  get lastUpdateDim(): number {
    return this.innovationDim;
  }

  /** Index of the deck-scale state s in x (the last), or -1 when the filter carries none (deckScaleSigma 0). */
  get deckScaleIndex(): number {
    return this.core.scaleIndex;
  }

  /**
   * The deck-scale estimate: s (true deck = assumed deck x (1 + s)) and its 1 sigma sqrt(P_ss);
   * NaN for both without the state or before initialization.
   */
  deckScale(): { value: number; sigma: number } {
    const i = this.core.scaleIndex;
    if (i < 0 || !this.initialized) return { value: Number.NaN, sigma: Number.NaN };
    return { value: this.x[i]!, sigma: Math.sqrt(this.P[i * this.n + i]!) };
  }

  /** Index of the pointing state δx in x (δy follows), or -1 when the filter carries none (pointingBiasSigmaDeg 0). */
  get pointingIndex(): number {
    return this.core.pointingIndex;
  }

  /** The pointing-bias estimate (deg) about the camera's x and y axes and their 1 sigma; NaN without the states or before initialization. */
  pointingBias(): { x: number; y: number; sigmaX: number; sigmaY: number } {
    const i = this.core.pointingIndex, n = this.n, deg = 180 / Math.PI;
    if (i < 0 || !this.initialized) return { x: Number.NaN, y: Number.NaN, sigmaX: Number.NaN, sigmaY: Number.NaN };
    return { x: this.x[i]! * deg, y: this.x[i + 1]! * deg, sigmaX: Math.sqrt(this.P[i * n + i]!) * deg, sigmaY: Math.sqrt(this.P[(i + 1) * n + i + 1]!) * deg };
  }

  /** The named divergence event, or null. After it every call returns 'diverged' until re-initialized. */
  get diverged(): string | null {
    return this.divergence;
  }

  /** Start from a known state with diagonal uncertainty (carrier acceleration starts at 0 ± its stationary sigma). */
  initialize(t: number, r: ArrayLike<number>, vC: ArrayLike<number>, vL: ArrayLike<number>, sigma: InitialSigma): void {
    const values = [t, ...Array.from(r), ...Array.from(vC), ...Array.from(vL)];
    if (values.length !== 10 || !values.every(Number.isFinite)) throw new RangeError(`initialize: time and the three 3-vectors must be finite, got ${values.join(', ')}`);
    for (const key of ['position', 'velocity', 'accelBias'] as const) {
      if (!(sigma[key] > 0) || !Number.isFinite(sigma[key])) throw new RangeError(`initialize: sigma.${key} must be a positive number, got ${sigma[key]}`);
    }
    this.reset();
    for (let i = 0; i < 3; i++) {
      this.x[i] = r[i]!;
      this.x[3 + i] = vC[i]!;
      this.x[6 + i] = vL[i]!;
    }
    this.setDiagonal(0, sigma.position * sigma.position);
    this.setDiagonal(3, sigma.velocity * sigma.velocity);
    this.setDiagonal(6, sigma.velocity * sigma.velocity);
    this.setDiagonal(9, sigma.accelBias * sigma.accelBias);
    this.start(t, UNKNOWN_ATTITUDE);
  }

  /**
   * Start from the first box: r by back-projection (loose model) with its propagated
   * covariance, vC = vL ± sigma.velocity (a lander that sees the carrier is usually moving with it),
   * vL as given ± sigma.velocity, bias 0 ± sigma.accelBias. Edit x only through the filter's
   * methods: the history for delayed boxes keeps its own copy.
   * nis is NaN (there is no prior to compare with).
   */
  initializeFromBox(t: number, box: Box, qWorldBody: ArrayLike<number>, vL: ArrayLike<number>, sigma: { velocity: number; accelBias: number }): UpdateResult {
    this.clearInnovation();
    const problem = boxProblem(box, this.core.model.camera.width, this.core.model.camera.height);
    if (problem) return rejected(problem, 3);
    if (!Number.isFinite(t) || !this.normalizeAttitude(qWorldBody)) return rejected('attitude-not-finite', 3);
    if (![vL[0]!, vL[1]!, vL[2]!].every(Number.isFinite)) return rejected('velocity-not-finite', 3);
    const core = this.core;
    core.model.setAttitude(this.attitude);
    const u = (box.xMin + box.xMax) / 2, v = (box.yMin + box.yMax) / 2, s = Math.sqrt((box.xMax - box.xMin) * (box.yMax - box.yMin));
    const modelProblem = core.model.loose(u, v, s, core.centreVariance(s), core.centreVariance(s), core.sizeVariance(s), core.fix, core.Rfix);
    if (modelProblem) return rejected(modelProblem, 3);
    if (!cholesky(this.core.Rfix, 3, this.core.check)) return rejected('fix-covariance-not-positive-definite', 3);
    // start where the outline model (when used) explains the box, so the first updates agree with it
    // (not for a box cut by the image border: its centre and size are not the outline's)
    const cam = core.model.camera;
    const inside = box.xMin > 1 && box.yMin > 1 && box.xMax < cam.width - 1 && box.yMax < cam.height - 1;
    if (!this.loose && inside) core.refineFixWithOutline(u, v, box.xMax - box.xMin, box.yMax - box.yMin, vL);
    this.initialize(t, core.fix, vL, vL, { position: 1, velocity: sigma.velocity, accelBias: sigma.accelBias });
    const n = this.n;
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) this.P[i * n + j] = core.Rfix[3 * i + j]!;
    const si = core.scaleIndex;
    if (si >= 0) {
      // The fix assumed the deck's size: r = c + (1 + s)(fix - c), c = R_wb t_b, so with s = 0 ± σ
      // r takes (fix - c)(fix - c)ᵀ σ² more and covaries with s by (fix - c) σ².
      const varS = this.P[si * n + si]!, B = core.model.Rwb, t = core.model.offset;
      const d0 = core.fix[0]! - (B[0]! * t[0]! + B[1]! * t[1]! + B[2]! * t[2]!);
      const d1 = core.fix[1]! - (B[3]! * t[0]! + B[4]! * t[1]! + B[5]! * t[2]!);
      const d2 = core.fix[2]! - (B[6]! * t[0]! + B[7]! * t[1]! + B[8]! * t[2]!);
      const d = [d0, d1, d2];
      for (let i = 0; i < 3; i++) {
        for (let j = 0; j < 3; j++) this.P[i * n + j] = this.P[i * n + j]! + d[i]! * d[j]! * varS;
        this.P[i * n + si] = this.P[si * n + i] = d[i]! * varS;
      }
    }
    const pi = core.pointingIndex;
    if (pi >= 0) {
      // The fix assumed the camera points as believed: with the turn δ the camera point of the deck
      // is p = p' - δ × p' (first order), so r = fix - Mᵀ (δ × p'), M = R_cb R_wbᵀ, p' = M fix - o:
      // r takes A Σ_δ Aᵀ more and covaries with δ by A Σ_δ, A = -Mᵀ ∂(δ × p')/∂δ.
      const varD = this.P[pi * n + pi]!, M = core.model.Rcw, o = core.model.offsetCam, f = core.fix;
      const p0 = M[0]! * f[0]! + M[1]! * f[1]! + M[2]! * f[2]! - o[0]!;
      const p1 = M[3]! * f[0]! + M[4]! * f[1]! + M[5]! * f[2]! - o[1]!;
      const p2 = M[6]! * f[0]! + M[7]! * f[1]! + M[8]! * f[2]! - o[2]!;
      // ∂(δ × p)/∂δx = (0, -p_z, p_y), ∂(δ × p)/∂δy = (p_z, 0, -p_x); A column e = -Mᵀ that
      const A = [0, 0, 0, 0, 0, 0];
      for (let i = 0; i < 3; i++) {
        A[2 * i] = -(M[3 + i]! * -p2 + M[6 + i]! * p1);
        A[2 * i + 1] = -(M[i]! * p2 + M[6 + i]! * -p0);
      }
      for (let i = 0; i < 3; i++) {
        for (let j = 0; j < 3; j++) this.P[i * n + j] = this.P[i * n + j]! + (A[2 * i]! * A[2 * j]! + A[2 * i + 1]! * A[2 * j + 1]!) * varD;
        for (let e = 0; e < 2; e++) this.P[i * n + pi + e] = this.P[(pi + e) * n + i] = A[2 * i + e]! * varD;
      }
    }
    this.history.clear();
    this.history.push(t, this.force, this.attitude, this.state);
    return { status: 'accepted', nis: Number.NaN, dim: 3, reason: null };
  }

  /**
   * Start from a box captured at `capture` (s, filter clock; at most the newest IMU time) and bring
   * the estimate to now through the IMU samples kept since. The history then reaches back to the
   * capture, so the boxes captured during the latency window are applied where they belong; a
   * start at arrival refused them all as older than its history.
   */
  initializeFromDelayedBox(capture: number, box: Box, qWorldBody: ArrayLike<number>, vL: ArrayLike<number>, sigma: { velocity: number; accelBias: number }, imu: ImuHistory): UpdateResult {
    const result = this.initializeFromBox(capture, box, qWorldBody, vL, sigma);
    if (result.status !== 'accepted') return result;
    for (let j = 0; j < imu.size; j++) {
      const tj = imu.time(j);
      if (tj <= capture) continue;
      imu.sample(j, this.startForce, this.startAttitude);
      const step = this.propagate(tj, this.startForce, this.startAttitude);
      if (step !== null && step.status === 'diverged') return step;
    }
    return result;
  }

  /** IMU step to time t: specific force in body FLU (m/s²), estimated attitude q_wb [w, x, y, z]. */
  propagate(t: number, specificForceBody: ArrayLike<number>, qWorldBody: ArrayLike<number>): UpdateResult | null {
    if (this.divergence) return this.divergedResult();
    if (!this.initialized) return rejected('not-initialized');
    if (!Number.isFinite(t)) return rejected('time-not-finite');
    const f0 = specificForceBody[0]!, f1 = specificForceBody[1]!, f2 = specificForceBody[2]!;
    if (!Number.isFinite(f0) || !Number.isFinite(f1) || !Number.isFinite(f2)) return rejected('imu-not-finite');
    if (!this.normalizeAttitude(qWorldBody)) return rejected('attitude-not-finite');
    const dt = t - this.clock;
    if (dt < 0) return rejected('time-not-increasing');
    if (dt === 0) return null;
    this.force[0] = f0;
    this.force[1] = f1;
    this.force[2] = f2;
    if (!this.core.step(dt, this.force, this.attitude)) return this.diverge(this.core.nonFiniteEvent(), this.history.slot(0));
    this.clock = t;
    this.history.push(t, this.force, this.attitude, this.state);
    return null;
  }

  /** Box captured at captureTime (may be in the past: applied then and re-propagated to now). */
  updateBox(captureTime: number, box: Box): UpdateResult {
    this.clearInnovation();
    const problem = boxProblem(box, this.core.model.camera.width, this.core.model.camera.height);
    if (problem) return rejected(problem, 3);
    const u = (box.xMin + box.xMax) / 2, v = (box.yMin + box.yMax) / 2;
    if (!this.loose && this.core.boxDim === 4) return this.measure(EVENT_TIGHT, captureTime, u, v, box.xMax - box.xMin, box.yMax - box.yMin);
    const s = Math.sqrt((box.xMax - box.xMin) * (box.yMax - box.yMin));
    return this.measure(this.loose ? EVENT_LOOSE : EVENT_TIGHT, captureTime, u, v, s, 0);
  }

  /** Lander velocity in world ENU (m/s) at time t (odometry / VIO / GNSS). */
  updateOdometry(t: number, velocityWorld: ArrayLike<number>): UpdateResult {
    this.clearInnovation();
    const v0 = velocityWorld[0]!, v1 = velocityWorld[1]!, v2 = velocityWorld[2]!;
    if (!Number.isFinite(v0) || !Number.isFinite(v1) || !Number.isFinite(v2)) return rejected('odometry-not-finite', 3);
    return this.measure(EVENT_ODOMETRY, t, v0, v1, v2, 0);
  }

  private measure(kind: number, t: number, d0: number, d1: number, d2: number, d3: number): UpdateResult {
    if (this.divergence) return this.divergedResult();
    if (!this.initialized) return rejected('not-initialized', 3);
    if (!Number.isFinite(t)) return rejected('time-not-finite', 3);
    if (t > this.clock + TIME_EPSILON) return rejected('measurement-after-filter-time', 3);
    const history = this.history;
    const head = history.slot(0);
    if (t >= this.clock - TIME_EPSILON) {
      if (history.isFull(head)) return rejected('too-many-updates-per-step', 3);
      const status = this.apply(kind, head, head, this.clock, d0, d1, d2, d3, true);
      this.keepInnovation(status);
      if (status === 'diverged') return this.diverge(this.core.lastReason ?? 'covariance-not-positive-definite', head);
      if (status !== 'accepted') return this.result(status);
      if (++this.updatesSinceCheck >= PD_CHECK_INTERVAL) {
        this.updatesSinceCheck = 0;
        const event = checkCovariance(this.x, this.P, this.n, this.core.check);
        if (event) return this.diverge(event, head);
      }
      history.addEvent(head, kind, this.clock, d0, d1, d2, d3);
      history.save(head, this.state);
      return this.result(status);
    }
    return this.measureDelayed(kind, t, d0, d1, d2, d3);
  }

  /**
   * Apply a measurement captured at t < now: from the step before t, through t, then
   * re-propagate every younger step (re-applying its measurements) and save it for later
   * delayed boxes. The newest step is overwritten only after the full check of P, so a
   * divergence restores the last good step.
   */
  private measureDelayed(kind: number, t: number, d0: number, d1: number, d2: number, d3: number): UpdateResult {
    const history = this.history;
    const age = history.ageAtOrBefore(t);
    if (age < 1) return rejected('older-than-history', 3);
    const from = history.slot(age), to = history.slot(age - 1), head = history.slot(0);
    if (history.isFull(to)) return rejected('too-many-updates-per-step', 3);
    this.replayBroken = false;
    history.restore(from, this.state);
    let tau = history.time[from]!;
    const base = to * EVENTS_PER_STEP;
    const count = history.eventCount[to]!;
    let k = 0;
    for (; k < count && history.eventTime[base + k]! <= t; k++) tau = this.replayEvent(from, to, base + k, tau);
    this.stepWithSlotInput(t - tau, to);
    const status = this.apply(kind, from, to, t, d0, d1, d2, d3, true);
    this.keepInnovation(status); // before the replay of younger measurements overwrites the core's
    const nis = this.core.lastNis, reason = this.core.lastReason;
    if (status === 'diverged') return this.diverge(reason ?? 'covariance-not-positive-definite', head);
    if (status !== 'accepted') {
      history.restore(head, this.state);
      return this.result(status);
    }
    history.addEvent(to, kind, t, d0, d1, d2, d3);
    tau = t;
    for (k = k + 1; k < count + 1; k++) tau = this.replayEvent(from, to, base + k, tau);
    this.stepWithSlotInput(history.time[to]! - tau, to);
    for (let a = age - 1; a > 0; a--) {
      // x, P are at the end of step `a`: keep them, then re-propagate step a - 1
      const done = history.slot(a), slot = history.slot(a - 1);
      history.save(done, this.state);
      tau = history.time[done]!;
      const slotBase = slot * EVENTS_PER_STEP;
      for (let e = 0; e < history.eventCount[slot]!; e++) tau = this.replayEvent(done, slot, slotBase + e, tau);
      this.stepWithSlotInput(history.time[slot]! - tau, slot);
    }
    // Every predict and update of the replay reports NaN and ±Infinity (replayBroken); then, or
    // at the periodic cadence, the full test runs before the newest step is overwritten.
    if (this.replayBroken || ++this.updatesSinceCheck >= PD_CHECK_INTERVAL) {
      this.updatesSinceCheck = 0;
      const event = checkCovariance(this.x, this.P, this.n, this.core.check);
      if (event) return this.diverge(event, head);
    }
    history.save(head, this.state);
    this.core.lastNis = nis;
    this.core.lastReason = reason;
    return this.result('accepted');
  }

  /** Propagate to a stored measurement's time and re-apply it (no gate: it was accepted before); `previous` is the step before `slot`. */
  private replayEvent(previous: number, slot: number, index: number, tau: number): number {
    const h = this.history;
    const te = h.eventTime[index]!;
    this.stepWithSlotInput(te - tau, slot);
    const d = EVENT_DATA * index;
    const status = this.apply(h.eventKind[index]!, previous, slot, te, h.eventData[d]!, h.eventData[d + 1]!, h.eventData[d + 2]!, h.eventData[d + 3]!, false);
    if (status === 'diverged') this.replayBroken = true;
    return te;
  }

  /** Predict by dt with the input stored in `slot` (its force and R_wb). */
  private stepWithSlotInput(dt: number, slot: number): void {
    if (dt <= 0) return;
    const h = this.history, f = this.replayForce;
    f[0] = h.force[3 * slot]!;
    f[1] = h.force[3 * slot + 1]!;
    f[2] = h.force[3 * slot + 2]!;
    if (!this.core.stepRotated(dt, f, h.rotationOf(slot))) this.replayBroken = true;
  }

  /**
   * One measurement update at time t inside step `slot` (previous step `previous`), with the
   * attitude AT t: the box was seen through the camera's attitude at its capture, so
   *   q(t) = normalize((1 - a) q_prev + a q_slot),  a = (t - t_prev) / (t_slot - t_prev)  (nlerp)
   * (a delayed box captured on a step time takes that step's attitude exactly). Using the
   * newer step's attitude instead put the tilt change of one IMU step (several degrees while
   * the lander manoeuvres) into the box innovation: ±8 px tails at fx = 320 on the default scenario.
   */
  private apply(kind: number, previous: number, slot: number, t: number, d0: number, d1: number, d2: number, d3: number, useGate: boolean): UpdateStatus {
    const q = this.replayAttitude, A = this.history.attitude;
    const t0 = this.history.time[previous]!, t1 = this.history.time[slot]!;
    const a = previous === slot || !(t1 > t0) || !Number.isFinite(A[4 * previous]!) ? 1 : Math.min(1, Math.max(0, (t - t0) / (t1 - t0)));
    // q and -q are one rotation: blend along the shorter arc
    let dot = 0;
    for (let i = 0; i < 4; i++) dot += A[4 * previous + i]! * A[4 * slot + i]!;
    const b = a === 1 ? 0 : dot < 0 ? -(1 - a) : 1 - a;
    let norm = 0;
    for (let i = 0; i < 4; i++) {
      q[i] = b * (b === 0 ? 0 : A[4 * previous + i]!) + a * A[4 * slot + i]!;
      norm += q[i]! * q[i]!;
    }
    norm = Math.sqrt(norm);
    if (norm > 0) for (let i = 0; i < 4; i++) q[i] = q[i]! / norm;
    return this.core.apply(kind, q, d0, d1, d2, d3, useGate);
  }

  private result(status: UpdateStatus): UpdateResult {
    return { status, nis: status === 'accepted' || status === 'gated' ? this.core.lastNis : Number.NaN, dim: this.core.lastDim, reason: this.core.lastReason };
  }

  private diverge(event: string, goodSlot: number): UpdateResult {
    this.divergence = event;
    this.clearInnovation();
    this.history.restore(goodSlot, this.state);
    return this.divergedResult();
  }

  private divergedResult(): UpdateResult {
    return { status: 'diverged', nis: Number.NaN, dim: 0, reason: this.divergence };
  }

  /** Copy the core's y and S after an update that got as far as S (accepted or gated). */
  private keepInnovation(status: UpdateStatus): void {
    if (status !== 'accepted' && status !== 'gated') return;
    const m = this.core.lastDim;
    this.lastInnovation.fill(Number.NaN);
    this.lastInnovationCovariance.fill(Number.NaN);
    const y = this.core.lastInnovation, S = this.core.lastInnovationCovariance;
    for (let i = 0; i < m; i++) this.lastInnovation[i] = y[i]!;
    for (let i = 0; i < m * m; i++) this.lastInnovationCovariance[i] = S[i]!;
    this.innovationDim = m;
  }

  private clearInnovation(): void {
    if (this.innovationDim === 0 && Number.isNaN(this.lastInnovation[0]!)) return;
    this.lastInnovation.fill(Number.NaN);
    this.lastInnovationCovariance.fill(Number.NaN);
    this.innovationDim = 0;
  }

  private normalizeAttitude(q: ArrayLike<number>): boolean {
    const norm = Math.sqrt(q[0]! * q[0]! + q[1]! * q[1]! + q[2]! * q[2]! + q[3]! * q[3]!);
    if (!(norm > 0) || !Number.isFinite(norm)) return false;
    for (let i = 0; i < 4; i++) this.attitude[i] = q[i]! / norm;
    return true;
  }

  private reset(): void {
    this.x.fill(0);
    this.P.fill(0);
    this.divergence = null;
    this.updatesSinceCheck = 0;
    const { coefficients, noise } = this.core;
    coefficients.clear();
    if (this.spec.carrierModel === 'singer') {
      const tau = noise.singerTau, sigma = noise.carrierAccelNoise, sz = noise.carrierVerticalAccelNoise ?? sigma;
      this.setDiagonal(12, Math.max((sigma * sigma * noise.qScale) / (2 * tau), 1e-12));
      // the vertical axis: its stationary variance from its own density
      this.P[14 * this.n + 14] = Math.max((sz * sz * noise.qScale) / (2 * tau), 1e-12);
    }
    // deck-scale state: prior 0 ± deckScaleSigma (x is already 0)
    const si = this.core.scaleIndex;
    if (si >= 0) this.P[si * this.n + si] = this.spec.deckScaleSigma! * this.spec.deckScaleSigma!;
    // pointing states: prior 0 ± pointingBiasSigmaDeg per axis (rad)
    const pi = this.core.pointingIndex;
    if (pi >= 0) {
      const sigma = (this.spec.pointingBiasSigmaDeg! * Math.PI) / 180;
      for (let e = 0; e < 2; e++) this.P[(pi + e) * this.n + pi + e] = sigma * sigma;
    }
  }

  private start(t: number, attitude: Float64Array): void {
    this.clock = t;
    this.initialized = true;
    this.force.fill(0);
    this.history.clear();
    this.history.push(t, this.force, attitude, this.state);
  }

  private setDiagonal(offset: number, variance: number): void {
    for (let i = 0; i < 3; i++) this.P[(offset + i) * this.n + offset + i] = variance;
  }
}
