// The working arrays and running sums of one trial (runTrial's bookkeeping), preallocated so
// the step loop allocates nothing; row() builds a TraceRow only when a caller wants one.
//   position/velocity RMSE and mean NEES: EstimateErrors, over steps with a valid estimate
//   nisMean = mean NIS of accepted boxes (dim 3, or 4 with a centre-width-height box)
// Means over no samples are NaN (JSON null).
import type { Box } from '../camera/Box.js';
import type { UpdateResult } from '../models/LandingFilter.js';
import { DivergenceWatch, type DivergenceEvent } from './DivergenceWatch.js';
import { quatMultiply } from '../frames/quaternion.js';
import type { NadirGimbal } from './world/NadirGimbal.js';
import { EstimateErrors } from './EstimateErrors.js';
import { DESCENT_HEIGHT_BINS, descentHeightBin } from './descentHeightBins.js';
import { PHASES, type Outcome, type Phase, type TrialResult } from './TrialResult.js';
import type { TouchdownJudgement } from './touchdown.js';
import type { CameraUpdate, RelativeTriple, TraceRow } from './trace.js';

export interface TrialEnd {
  touchdown: TouchdownJudgement | null;
  touchdownTime: number | null;
  aborts: number;
  lastAbort: string | null;
  falseBoxes: number;
  /** Largest body rotation rate of any step (rad/s). */
  peakAttitudeRate: number;
}

const vec = (a: ArrayLike<number>, o: number): [number, number, number] => [a[o]!, a[o + 1]!, a[o + 2]!];

/** Position of a phase in PHASES, without a lookup object. */
function phaseIndex(phase: Phase): number {
  switch (phase) {
    case 'acquire': return 0;
    case 'trail': return 1;
    case 'align': return 2;
    case 'descend': return 3;
    default: return 4;
  }
}

/** Accepted boxes that confirm a (re)start before the lander leaves acquire on it. */
export const CONFIRM_BOXES = 3;

export class TrialState {
  readonly wind = new Float64Array(3);
  /** Lander velocity command (m/s, world), applied in the next step. */
  readonly command = new Float64Array(3);
  readonly rTrue = new Float64Array(3);
  readonly vCTrue = new Float64Array(3);
  readonly vLTrue = new Float64Array(3);
  /** Estimated attitude q_wb, measured specific force (body), measured velocity (world). */
  readonly qEstimate = Float64Array.of(1, 0, 0, 0);
  /** nadir-gimbal: true camera-base attitude q_wb ⊗ q_g, its estimate q̂_wb ⊗ q_g and the specific force in that frame R(q_g)^T f. */
  readonly qCameraTrue = Float64Array.of(1, 0, 0, 0);
  readonly qCameraEstimate = Float64Array.of(1, 0, 0, 0);
  readonly forceCamera = new Float64Array(3);

  /** Step the gimbal on the estimated attitude and place the true camera base on the body. */
  levelCamera(dt: number, gimbal: NadirGimbal, qWorldBody: ArrayLike<number>): void {
    gimbal.step(dt, this.qEstimate);
    quatMultiply(qWorldBody, gimbal.q, this.qCameraTrue);
  }

  /** The IMU sample as the filter sees it on a gimbal: attitude q̂ ⊗ q_g, force R(q_g)^T f (rotated by conj(q_g)). */
  onGimbal(qGimbal: ArrayLike<number>): void {
    quatMultiply(this.qEstimate, qGimbal, this.qCameraEstimate);
    const w = qGimbal[0]!, x = -qGimbal[1]!, y = -qGimbal[2]!, z = -qGimbal[3]!;
    const vx = this.force[0]!, vy = this.force[1]!, vz = this.force[2]!;
    // v' = v + 2 u x (u x v + w v), u = (x, y, z): rotation by the unit quaternion (w, u)
    const cx = y * vz - z * vy + w * vx, cy = z * vx - x * vz + w * vy, cz = x * vy - y * vx + w * vz;
    this.forceCamera[0] = vx + 2 * (y * cz - z * cy);
    this.forceCamera[1] = vy + 2 * (z * cx - x * cz);
    this.forceCamera[2] = vz + 2 * (x * cy - y * cx);
  }

  /** Estimated attitude at a box's capture (looked up when a box starts the filter). */
  readonly qCapture = Float64Array.of(1, 0, 0, 0);
  readonly force = new Float64Array(3);
  readonly odometry = new Float64Array(3);
  /** The velocity the autopilot's loop closes on (world, m/s): odometry or the estimate, never truth. */
  readonly autopilotVelocity = new Float64Array(3);
  /** Yaw setpoint's unit vector (ENU x, y), smoothed from the carrier's estimated heading. */
  readonly heading = new Float64Array(2);
  haveOdometry = false;
  boxes = 0;
  dropped = 0;
  gateRejections = 0;
  lastBox: Box | null = null;
  /** Camera updates of this step: updatePool[0 .. updateCount - 1] (the pool only grows). */
  updateCount = 0;
  private readonly updatePool: CameraUpdate[] = [];
  /** True outline box of the frame captured this step (copied in place), when haveOutline. */
  readonly outline: Box = { xMin: NaN, yMin: NaN, xMax: NaN, yMax: NaN };
  haveOutline = false;
  /** Seconds per phase, indexed as PHASES (a string-keyed store per step allocated a number each time). */
  private readonly phaseSeconds = new Float64Array(PHASES.length);
  private readonly phaseSteps = new Float64Array(PHASES.length);
  private stepDt = 1;
  private divergence: string | null = null;
  /** The simulator saw the estimate far from truth with a calm NIS (DivergenceWatch). */
  private silentDivergence = false;
  /** Truth's judge of the estimate (it names divergences the filter cannot see). */
  readonly watch = new DivergenceWatch();
  /** Boxes accepted since the filter last (re)started, and boxes gated in a row since then. */
  acceptedSinceStart = 0;
  gatedInARow = 0;
  private nisSum = 0;
  private nisCount = 0;
  /** Estimate errors against truth at every filter step (RMSE, NEES). */
  readonly errors = new EstimateErrors();
  private readonly pDiagonal: Float64Array;
  /** NEES sums and counts of the descent per true-height bin (descentHeightBins.ts). */
  private readonly descentNeesSum = new Float64Array(DESCENT_HEIGHT_BINS);
  private readonly descentNeesCount = new Float64Array(DESCENT_HEIGHT_BINS);

  /** @param boxDim dimension of the filter's box measurement (3, or 4 for centre-width-height) */
  /** @param scaleIndex index of the filter's deck-scale state, or -1 without it */
  constructor(readonly n: number, readonly boxDim = 3, readonly scaleIndex = -1) {
    this.pDiagonal = new Float64Array(n);
  }

  /** Forget this step's box, update and outline (call at the start of each step). */
  clearStep(): void {
    this.lastBox = null;
    this.updateCount = 0;
    this.haveOutline = false;
  }

  /** Note a camera update of this step (box and result copied into a reused slot). */
  noteUpdate(box: Box, r: UpdateResult): void {
    let u = this.updatePool[this.updateCount];
    if (u === undefined) {
      // NaN, not 0: the fields hold doubles from the start (a small-integer field turned double deoptimizes once)
      u = { box: { xMin: Number.NaN, yMin: Number.NaN, xMax: Number.NaN, yMax: Number.NaN }, status: 'accepted', nis: Number.NaN, dim: 0 };
      this.updatePool.push(u);
    }
    u.box.xMin = box.xMin; u.box.yMin = box.yMin; u.box.xMax = box.xMax; u.box.yMax = box.yMax;
    u.status = r.status;
    u.nis = r.nis;
    u.dim = r.dim;
    this.updateCount++;
  }

  /** Copy the true outline of the frame captured this step, if any of it is in the image (NaN corners: behind the camera). */
  noteOutline(box: Box): void {
    this.haveOutline = box.xMax > box.xMin && box.yMax > box.yMin; // false for NaN corners too
    if (!this.haveOutline) return;
    this.outline.xMin = box.xMin; this.outline.yMin = box.yMin; this.outline.xMax = box.xMax; this.outline.yMax = box.yMax;
  }

  /** Add dt seconds to a phase's time. */
  addPhaseTime(phase: Phase, dt: number): void {
    this.phaseSeconds[phaseIndex(phase)] += dt;
    this.phaseSteps[phaseIndex(phase)]! += 1;
    this.stepDt = dt;
  }

  /**
   * A phase's time: steps / rate when every step had the same dt at a whole rate (so 6 steps
   * at 100 Hz read 0.06, not the summed 0.060000000000000005), else the plain sum.
   */
  private phaseTime(i: number): number {
    const rate = 1 / this.stepDt;
    const steps = this.phaseSteps[i]!;
    const whole = Math.round(rate);
    return Math.abs(rate - whole) < 1e-9 * whole && Math.abs(steps / whole - this.phaseSeconds[i]!) < 1e-9 * (1 + steps) / whole ? steps / whole : this.phaseSeconds[i]!;
  }

  /** Keep the first named divergence event. */
  noteDivergence(event: string | null): void {
    if (this.divergence === null && event !== null) this.divergence = event;
  }

  /**
   * The filter (re)started from a box. A re-start (confirm = true) must now be confirmed by its
   * successors; the first start is taken as it is (the lander has not been fooled yet, and the
   * gate still drops it when ten boxes in a row disagree).
   */
  startedAfresh(confirm: boolean): void {
    this.acceptedSinceStart = confirm ? 0 : CONFIRM_BOXES;
    this.gatedInARow = 0;
    this.watch.reset();
  }

  /** The start agrees with its successors: CONFIRM_BOXES boxes accepted since (the gate is the agreement test). */
  get confirmed(): boolean {
    return this.acceptedSinceStart >= CONFIRM_BOXES;
  }

  /** Judge the valid estimate x against this step's truth; names an episode far from truth as a divergence event (returned at the step it is named, else null). */
  watchEstimate(t: number, x: ArrayLike<number>, P: ArrayLike<number>): DivergenceEvent | null {
    const event = this.watch.step(t, x, P, this.n, this.rTrue);
    if (event === null) return null;
    this.noteDivergence(event);
    if (event === 'silent-divergence') this.silentDivergence = true;
    return event;
  }

  addNis(nis: number): void {
    this.acceptedSinceStart++;
    this.gatedInARow = 0;
    this.watch.noteNis(nis);
    if (!Number.isFinite(nis)) return;
    this.nisSum += nis;
    this.nisCount++;
  }

  /** Count a descent step's NEES in the bin of the lander's true height above the deck (m). */
  addDescentNees(height: number, nees: number): void {
    if (!Number.isFinite(nees)) return;
    const bin = descentHeightBin(height);
    this.descentNeesSum[bin] += nees;
    this.descentNeesCount[bin] += 1;
  }

  /** Diagonal of P (n x n) into a reused array. */
  diagonal(P: ArrayLike<number>): Float64Array {
    for (let i = 0; i < this.n; i++) this.pDiagonal[i] = P[i * this.n + i]!;
    return this.pDiagonal;
  }

  /** A fresh trace row for time t. */
  row(t: number, phase: Phase, x: ArrayLike<number> | null, P: ArrayLike<number> | null): TraceRow {
    const triple = (a: ArrayLike<number>): RelativeTriple => ({ r: vec(a, 0), vC: vec(a, 3), vL: vec(a, 6) });
    const sd = P ? Array.from({ length: 9 }, (_, i) => Math.sqrt(P[i * this.n + i]!)) : null;
    const truth = new Float64Array(9);
    truth.set(this.rTrue, 0);
    truth.set(this.vCTrue, 3);
    truth.set(this.vLTrue, 6);
    const updates = this.updatePool.slice(0, this.updateCount).map((u) => ({ ...u, box: { ...u.box } }));
    const last = updates[updates.length - 1];
    return {
      t,
      phase,
      truth: triple(truth),
      estimate: x ? triple(x) : null,
      sigma: sd ? triple(sd) : null,
      box: this.lastBox ? { ...this.lastBox } : null,
      command: vec(this.command, 0),
      updates,
      update: last ? last.status : null,
      nis: last ? last.nis : null,
      nisDim: last ? last.dim : null,
      outline: this.haveOutline ? { ...this.outline } : null,
      ...(this.scaleIndex >= 0 ? { deckScale: x && P ? { value: x[this.scaleIndex]!, sigma: Math.sqrt(P[this.scaleIndex * this.n + this.scaleIndex]!) } : null } : {}),
    };
  }

  /** The trial's result; outcome without contact: diverged if the filter diverged, aborted after an abort, else timed-out. */
  result(end: TrialEnd): TrialResult {
    const t = end.touchdown;
    let outcome: Outcome;
    if (t) outcome = t.outcome;
    else if (this.divergence !== null && end.lastAbort === 'diverged') outcome = 'diverged';
    else if (this.silentDivergence) outcome = 'silent-divergence';
    else if (end.aborts > 0) outcome = 'aborted';
    else outcome = 'timed-out';
    const mean = (sum: number, count: number) => (count > 0 ? sum / count : Number.NaN);
    return {
      outcome,
      missDistance: t ? t.missDistance : null,
      missX: t ? t.missX : null,
      missY: t ? t.missY : null,
      closingSpeed: t ? t.closingSpeed : null,
      lateralSpeed: t ? t.lateralSpeed : null,
      tiltDeg: t ? t.tiltDeg : null,
      touchdownTime: end.touchdownTime,
      positionRmse: this.errors.positionRmse,
      velocityRmse: this.errors.velocityRmse,
      neesMean: this.errors.neesMean,
      neesDim: 6,
      neesByHeight: Array.from(this.descentNeesSum, (sum, i) => (this.descentNeesCount[i]! > 0 ? sum / this.descentNeesCount[i]! : null)),
      nisMean: mean(this.nisSum, this.nisCount),
      nisDim: this.boxDim,
      nisCount: this.nisCount,
      phaseTimes: { acquire: this.phaseTime(0), trail: this.phaseTime(1), align: this.phaseTime(2), descend: this.phaseTime(3), touchdown: this.phaseTime(4) },
      boxes: this.boxes,
      dropped: this.dropped,
      falseBoxes: end.falseBoxes,
      gateRejections: this.gateRejections,
      aborts: end.aborts,
      divergence: this.divergence,
      peakAttitudeRateDeg: (end.peakAttitudeRate * 180) / Math.PI,
    };
  }
}
