// One predict step and one measurement update of the landing EKF, on preallocated typed
// arrays (allocation-free). LandingFilter adds the clock, the history for delayed boxes and
// divergence bookkeeping on top. Measurements (all 3-dimensional, H non-zero in one 3-column
// block; see FilterCamera.ts for the camera models):
//   tight    z = [u, v, s] (px),          H = [∂h/∂r 0 0 0],   R = diag(σp² + (φc h_s)², σp² + (φc h_s)², σs² + (φ h_s)²) · rScale
//            (φ = sizeNoiseFraction, φc = pixelNoiseFraction: errors that scale with the box, see Scenario.ts)
//   loose    z = back-projected r (m),     H = [I 0 0 0],       R = propagated box noise
//   odometry z = vL (m/s, world),          H = [0 0 I 0],       R = σo² I · rScale
import type { FilterSpec } from './FilterSettings.js';
import { BoxMeasurementModel } from './BoxMeasurementModel.js';
import type { FilterCamera } from './FilterCamera.js';
import { EVENT_ODOMETRY, EVENT_TIGHT } from './FilterHistory.js';
import { ProcessCoefficientCache, type ProcessNoise } from './ProcessCoefficients.js';
import { predictLanding } from './predictLanding.js';
import { landingStateDimension, VL_INDEX } from './landingState.js';
import type { UpdateStatus } from './UpdateResult.js';
import { UpdateWorkspace } from '../filter/UpdateWorkspace.js';
import { innovationCovariance3, normalizedInnovationSquared3, updateJoseph3 } from '../filter/blockUpdate3.js';
import { allFinite, checkCovariance } from '../filter/checkCovariance.js';
import { gateThreshold } from '../filter/gate.js';
import { rotationMatrixFromQuat } from '../frames/rotationMatrixFromQuat.js';

const IDENTITY3 = new Float64Array([1, 0, 0, 0, 1, 0, 0, 0, 1]);

export class LandingCore {
  readonly n: number;
  /** x then P in one array (views below), so the filter history saves a step with one copy. */
  readonly state: Float64Array;
  readonly x: Float64Array;
  readonly P: Float64Array;
  readonly model: BoxMeasurementModel;
  readonly noise: ProcessNoise;
  /** Transition and process-noise coefficients per step length. */
  readonly coefficients: ProcessCoefficientCache;
  /** Box centre and constant size variances (px², rScale applied). */
  readonly varPixel: number;
  readonly varSize: number;
  /** φ² · rScale: size variance per px² of box size (sizeNoiseFraction). */
  readonly varSizeFraction: number;
  /** φc² · rScale: centre variance per px² of box size (pixelNoiseFraction). */
  readonly varPixelFraction: number;
  /** NIS and reason of the last apply(). */
  lastNis = Number.NaN;
  lastReason: string | null = null;
  /**
   * Views onto the workspace: innovation y (3) and its covariance S (3x3 row-major) of the last
   * apply() that got as far as S (valid when it returned 'accepted' or 'gated'); overwritten by
   * the next apply(), so LandingFilter copies them.
   */
  readonly innovation: Float64Array;
  readonly innovationCovariance: Float64Array;
  /** Scratch for the loose fix and its covariance (also used by initializeFromBox). */
  readonly fix = new Float64Array(3);
  readonly Rfix = new Float64Array(9);
  readonly check: Float64Array;
  private readonly ws: UpdateWorkspace;
  private readonly gate: number;
  private readonly Rbox: Float64Array;
  private readonly Rodometry: Float64Array;
  private readonly h = new Float64Array(3);
  private readonly Hb = new Float64Array(9);
  private readonly Rwb = new Float64Array(9);

  constructor(spec: FilterSpec, camera: FilterCamera, targetSize: number) {
    const singer = spec.carrierModel === 'singer';
    this.n = landingStateDimension(singer);
    this.state = new Float64Array(this.n + this.n * this.n);
    this.x = this.state.subarray(0, this.n);
    this.P = this.state.subarray(this.n);
    this.check = new Float64Array(this.n * this.n);
    this.model = new BoxMeasurementModel(camera, targetSize);
    this.noise = { carrierAccelNoise: spec.carrierAccelNoise, singerTau: spec.singerTau, accelNoise: spec.accelNoise, accelBiasWalk: spec.accelBiasWalk, qScale: spec.qScale };
    this.coefficients = new ProcessCoefficientCache(singer, this.noise);
    this.ws = new UpdateWorkspace(this.n, 3);
    this.innovation = this.ws.y;
    this.innovationCovariance = this.ws.S;
    this.gate = gateThreshold(spec.gateProbability, 3, spec.gateScale);
    this.varPixel = spec.pixelNoise * spec.pixelNoise * spec.rScale;
    this.varSize = spec.sizeNoise * spec.sizeNoise * spec.rScale;
    this.varSizeFraction = spec.sizeNoiseFraction * spec.sizeNoiseFraction * spec.rScale;
    this.varPixelFraction = spec.pixelNoiseFraction * spec.pixelNoiseFraction * spec.rScale;
    this.Rbox = new Float64Array([this.varPixel, 0, 0, 0, this.varPixel, 0, 0, 0, this.varSize]);
    const varOdometry = spec.odometryNoise * spec.odometryNoise * spec.rScale;
    this.Rodometry = new Float64Array([varOdometry, 0, 0, 0, varOdometry, 0, 0, 0, varOdometry]);
  }

  /** One predict step of dt (s) with specific force f (body, m/s²) and unit q_wb; false when x or P became non-finite. */
  step(dt: number, force: ArrayLike<number>, attitude: ArrayLike<number>): boolean {
    return this.stepRotated(dt, force, rotationMatrixFromQuat(attitude, this.Rwb));
  }

  /** step() with the attitude given as its rotation matrix R_wb (row-major 3x3). */
  stepRotated(dt: number, force: ArrayLike<number>, Rwb: Float64Array): boolean {
    return predictLanding(this.x, this.P, this.n, force, Rwb, this.coefficients.get(dt));
  }

  /** The divergence event for a non-finite x or P. */
  nonFiniteEvent(): string {
    return allFinite(this.x, this.n) ? 'covariance-not-finite' : 'state-not-finite';
  }

  /**
   * One measurement update (kind from FilterHistory) with attitude q (unused for odometry).
   * Returns 'diverged' with lastReason = the event when P turns out broken; x and P are then
   * left for the caller to restore.
   */
  apply(kind: number, q: Float64Array, d0: number, d1: number, d2: number, useGate: boolean): UpdateStatus {
    const ws = this.ws, x = this.x, y = ws.y;
    this.lastNis = Number.NaN;
    this.lastReason = null;
    let col = 0;
    let R: Float64Array = this.Rbox;
    let Hb: Float64Array = this.Hb;
    if (kind === EVENT_ODOMETRY) {
      col = VL_INDEX;
      R = this.Rodometry;
      Hb = IDENTITY3;
      y[0] = d0 - x[6]!;
      y[1] = d1 - x[7]!;
      y[2] = d2 - x[8]!;
    } else {
      if (!Number.isFinite(q[0]!)) return this.fail('attitude-unknown');
      this.model.setAttitude(q);
      if (kind === EVENT_TIGHT) {
        const problem = this.model.tight(x, this.h, this.Hb);
        if (problem) return this.fail(problem);
        y[0] = d0 - this.h[0]!;
        y[1] = d1 - this.h[1]!;
        y[2] = d2 - this.h[2]!;
        this.Rbox[0] = this.Rbox[4] = this.centreVariance(this.h[2]!);
        this.Rbox[8] = this.sizeVariance(this.h[2]!);
      } else {
        const varCentre = this.centreVariance(d2);
        const problem = this.model.loose(d0, d1, d2, varCentre, varCentre, this.sizeVariance(d2), this.fix, this.Rfix);
        if (problem) return this.fail(problem);
        R = this.Rfix;
        Hb = IDENTITY3;
        y[0] = this.fix[0]! - x[0]!;
        y[1] = this.fix[1]! - x[1]!;
        y[2] = this.fix[2]! - x[2]!;
      }
    }
    if (!innovationCovariance3(this.P, Hb, col, R, this.n, ws)) {
      // R is positive definite (spec) or semi-definite (loose fix), so S fails only when P does.
      const event = checkCovariance(this.x, this.P, this.n, this.check);
      if (event) {
        this.lastReason = event;
        return 'diverged';
      }
      return this.fail('innovation-covariance-not-positive-definite');
    }
    this.lastNis = normalizedInnovationSquared3(ws);
    if (useGate && this.lastNis > this.gate) {
      this.lastReason = 'outside-gate';
      return 'gated';
    }
    if (!updateJoseph3(this.x, this.P, this.n, ws)) {
      this.lastReason = this.nonFiniteEvent();
      return 'diverged';
    }
    return 'accepted';
  }

  /** Size variance (px²) of a box of size s (px): σs² + (φ s)², rScale applied. */
  sizeVariance(s: number): number {
    return this.varSize + this.varSizeFraction * s * s;
  }

  /** Centre variance per axis (px²) of a box of size s (px): σp² + (φc s)², rScale applied. */
  centreVariance(s: number): number {
    return this.varPixel + this.varPixelFraction * s * s;
  }

  private fail(reason: string): UpdateStatus {
    this.lastReason = reason;
    return 'rejected';
  }
}
