// One predict step and one measurement update of the landing EKF, on preallocated typed
// arrays (allocation-free). LandingFilter adds the clock, the history for delayed boxes and
// divergence bookkeeping on top. Measurements (all 3-dimensional, H non-zero in one 3-column
// block; see FilterCamera.ts for the camera models):
//   tight    z = [u, v, s] (px),          H = [∂h/∂r 0 0 0],   R = diag(σp² + (φc h_s)², σp² + (φc h_s)², σs² + (φ h_s)²) · rScale
//            boxModel 'outline' (OutlineBoxModel.ts): h from the deck outline, H = [∂h/∂r ∂h/∂v_c 0 0]
//            (v_c sets the deck heading), z = [u, v, s] or [u, v, w, h] (boxTerms); w and h take the
//            size variance of their own length
//            (φ = sizeNoiseFraction, φc = pixelNoiseFraction: errors that scale with the box, see Scenario.ts)
//   loose    z = back-projected r (m),     H = [I 0 0 0],       R = propagated box noise
//   odometry z = vL (m/s, world),          H = [0 0 I 0],       R = σo² I · rScale
// Deck-scale state s (deckScaleSigma > 0; last in x, landingState.ts): the deck is (1 + s) times
// the assumed one, so every box model gains a column for s:
//   tight flat     s_box = sqrt(fx fy) L (1 + s) / Z,  ∂s_box/∂s = s_box / (1 + s)
//   tight outline  corners scaled by (1 + s) (OutlineBoxModel.ts)
//   loose          the fix back-projected with L is c + (r - c) / (1 + s), c = R_wb t_b (the camera's
//                  offset in the world: p_cam scales with the target size for a given box), so
//                  H_r = I / (1 + s),  H_s = -(r - c) / (1 + s)²
// These updates use the column-block-plus-one-column form (columnBlockUpdate.ts).
// Pointing-bias states δ (pointingBiasSigmaDeg > 0; before s): both tight models turn the camera
// point, p' = (I + [δ]×) p (BoxMeasurementModel.ts, OutlineBoxModel.ts), so H gains two columns
// next to s's; the update takes the two-column-block form (innovationCovarianceColumnBlocks).
import type { FilterSpec } from './FilterSettings.js';
import { BoxMeasurementModel, type PointingBias } from './BoxMeasurementModel.js';
import type { FilterCamera } from './FilterCamera.js';
import { EVENT_ODOMETRY, EVENT_TIGHT } from './FilterHistory.js';
import { ProcessCoefficientCache, type ProcessNoise } from './ProcessCoefficients.js';
import { predictLanding } from './predictLanding.js';
import { deckScaleIndex, landingStateDimension, pointingIndex, POINTING_STATES, VL_INDEX } from './landingState.js';
import type { UpdateStatus } from './UpdateResult.js';
import { OutlineBoxModel, type DeckOutline } from './OutlineBoxModel.js';
import { UpdateWorkspace } from '../filter/UpdateWorkspace.js';
import { innovationCovarianceColumnBlock, innovationCovarianceColumnBlockAndColumn, innovationCovarianceColumnBlocks, updateJosephColumnBlock } from '../filter/columnBlockUpdate.js';
import { normalizedInnovationSquared } from '../filter/update.js';
import { innovationCovariance3, normalizedInnovationSquared3, updateJoseph3 } from '../filter/blockUpdate3.js';
import { allFinite, checkCovariance } from '../filter/checkCovariance.js';
import { gateThreshold } from '../filter/gate.js';
import { rotationMatrixFromQuat } from '../frames/rotationMatrixFromQuat.js';

const IDENTITY3 = new Float64Array([1, 0, 0, 0, 1, 0, 0, 0, 1]);

export class LandingCore {
  readonly n: number;
  /** Index of the deck-scale state s in x (the last), or -1 without it (deckScaleSigma 0). */
  readonly scaleIndex: number;
  /** Index of δx (δy follows) in x, or -1 without pointing states (pointingBiasSigmaDeg 0). */
  readonly pointingIndex: number;
  /** Trailing constant states the box sees (δ, then s): their first index and count (0 = none). */
  private readonly extraIndex: number;
  private readonly extraCount: number;
  private readonly pointing: PointingBias | null;
  /** Flat tight update with pointing states: H over [r, δ (, s)] (3 x (3 + extraCount)). */
  private readonly Hextra: Float64Array;
  /** x then P in one array (views below), so the filter history saves a step with one copy. */
  readonly state: Float64Array;
  readonly x: Float64Array;
  readonly P: Float64Array;
  readonly model: BoxMeasurementModel;
  /** The outline box model (boxModel 'outline'), else null (the flat model in `model`). */
  readonly outline: OutlineBoxModel | null;
  /** Dimension of the tight box measurement: 3, or 4 with boxTerms 'centre-width-height'. */
  readonly boxDim: number;
  /** Dimension of the last apply() that reached S (3 or boxDim). */
  lastDim = 3;
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
  /** Outline update: its own workspace (m = boxDim), h, H over [r, v_c] (m x 6) and R. */
  private readonly wsOutline: UpdateWorkspace;
  private readonly hOutline: Float64Array;
  private readonly Houtline: Float64Array;
  private readonly Routline: Float64Array;
  private readonly gateOutline: number;
  private readonly refineState: Float64Array;
  /** Deck-scale state: H over [r, s] (3 x 4) for the flat tight and the loose update. */
  private readonly Hscale = new Float64Array(12);
  private readonly refineMatrix = new Float64Array(9);

  /**
   * @param outline the deck outline believed in (m); default a flat square deck of side targetSize
   */
  constructor(spec: FilterSpec, camera: FilterCamera, targetSize: number, outline?: DeckOutline) {
    const singer = spec.carrierModel === 'singer';
    const deckScale = (spec.deckScaleSigma ?? 0) > 0;
    const pointing = (spec.pointingBiasSigmaDeg ?? 0) > 0;
    this.n = landingStateDimension(singer, deckScale, pointing);
    this.scaleIndex = deckScaleIndex(singer, deckScale, pointing);
    this.pointingIndex = pointingIndex(singer, pointing);
    this.extraIndex = pointing ? this.pointingIndex : this.scaleIndex;
    this.extraCount = (pointing ? POINTING_STATES : 0) + (deckScale ? 1 : 0);
    this.pointing = pointing ? { dx: 0, dy: 0, H: new Float64Array(6) } : null;
    this.Hextra = new Float64Array(3 * (3 + this.extraCount));
    this.refineState = new Float64Array(this.n);
    this.state = new Float64Array(this.n + this.n * this.n);
    this.x = this.state.subarray(0, this.n);
    this.P = this.state.subarray(this.n);
    this.check = new Float64Array(this.n * this.n);
    this.model = new BoxMeasurementModel(camera, targetSize);
    this.noise = { carrierAccelNoise: spec.carrierAccelNoise, carrierVerticalAccelNoise: spec.carrierVerticalAccelNoise, singerTau: spec.singerTau, accelNoise: spec.accelNoise, accelBiasWalk: spec.accelBiasWalk, qScale: spec.qScale };
    this.coefficients = new ProcessCoefficientCache(singer, this.noise);
    this.ws = new UpdateWorkspace(this.n, 3);
    this.lastWorkspace = this.ws;
    this.gate = gateThreshold(spec.gateProbability, 3, spec.gateScale);
    this.varPixel = spec.pixelNoise * spec.pixelNoise * spec.rScale;
    this.varSize = spec.sizeNoise * spec.sizeNoise * spec.rScale;
    this.varSizeFraction = spec.sizeNoiseFraction * spec.sizeNoiseFraction * spec.rScale;
    this.varPixelFraction = spec.pixelNoiseFraction * spec.pixelNoiseFraction * spec.rScale;
    this.Rbox = new Float64Array([this.varPixel, 0, 0, 0, this.varPixel, 0, 0, 0, this.varSize]);
    const deck = outline ?? { deckLength: targetSize, deckWidth: targetSize, bodyHeight: 0 };
    this.outline = (spec.boxModel ?? 'outline') === 'outline' ? new OutlineBoxModel(this.model.camera, deck, spec.boxTerms ?? 'centre-size', spec.headingMinSpeed ?? 1.5, this.scaleIndex, this.pointingIndex) : null;
    this.boxDim = this.outline ? this.outline.m : 3;
    this.wsOutline = new UpdateWorkspace(this.n, this.boxDim);
    this.hOutline = new Float64Array(this.boxDim);
    this.Houtline = new Float64Array((this.outline ? this.outline.columns : 6) * this.boxDim);
    this.Routline = new Float64Array(this.boxDim * this.boxDim);
    this.gateOutline = gateThreshold(spec.gateProbability, this.boxDim, spec.gateScale);
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
  apply(kind: number, q: Float64Array, d0: number, d1: number, d2: number, d3: number, useGate: boolean): UpdateStatus {
    const ws = this.ws, x = this.x, y = ws.y;
    this.lastNis = Number.NaN;
    this.lastReason = null;
    this.lastDim = 3;
    this.lastWorkspace = ws;
    if (kind === EVENT_TIGHT && this.outline) {
      if (!Number.isFinite(q[0]!)) return this.fail('attitude-unknown');
      this.model.setAttitude(q);
      return this.applyOutline(d0, d1, d2, d3, useGate);
    }
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
        if (this.scaleIndex >= 0 && !(1 + x[this.scaleIndex]! > 0)) return this.fail('deck-scale-not-positive');
        if (this.pointing) return this.applyFlatWithPointing(d0, d1, d2, useGate);
        const problem = this.scaleIndex >= 0 ? this.model.tight(x, this.h, this.Hb, 1 + x[this.scaleIndex]!) : this.model.tight(x, this.h, this.Hb);
        if (problem) return this.fail(problem);
        y[0] = d0 - this.h[0]!;
        y[1] = d1 - this.h[1]!;
        y[2] = d2 - this.h[2]!;
        this.Rbox[0] = this.Rbox[4] = this.centreVariance(this.h[2]!);
        this.Rbox[8] = this.sizeVariance(this.h[2]!);
        if (this.scaleIndex >= 0) return this.applyWithScale(this.Rbox, useGate);
      } else {
        const varCentre = this.centreVariance(d2);
        const problem = this.model.loose(d0, d1, d2, varCentre, varCentre, this.sizeVariance(d2), this.fix, this.Rfix);
        if (problem) return this.fail(problem);
        R = this.Rfix;
        Hb = IDENTITY3;
        if (this.scaleIndex >= 0) return this.applyLooseWithScale(useGate);
        y[0] = this.fix[0]! - x[0]!;
        y[1] = this.fix[1]! - x[1]!;
        y[2] = this.fix[2]! - x[2]!;
      }
    }
    if (!innovationCovariance3(this.P, Hb, col, R, this.n, ws)) {
      // R is positive definite (spec) or semi-definite (loose fix), so S fails only when P does.
      return this.refuseS();
    }
    this.lastNis = normalizedInnovationSquared3(ws);
    if (useGate && this.lastNis > this.gate) {
      this.lastReason = 'outside-gate';
      return 'gated';
    }
    return this.joseph3(ws);
  }

  /** y and S of the last apply() that reached S: views of lastDim and lastDim² numbers. */
  get lastInnovation(): Float64Array {
    return this.lastWorkspace.y;
  }

  get lastInnovationCovariance(): Float64Array {
    return this.lastWorkspace.S;
  }

  private lastWorkspace: UpdateWorkspace;

  /** The tight update with the outline model; z = (d0, d1, d2) or (d0, d1, d2, d3). */
  private applyOutline(d0: number, d1: number, d2: number, d3: number, useGate: boolean): UpdateStatus {
    const outline = this.outline!, ws = this.wsOutline, m = this.boxDim, h = this.hOutline, R = this.Routline;
    this.lastWorkspace = ws;
    this.lastDim = m;
    if (!outline.evaluate(this.x, this.model.Rcw, this.model.offsetCam, this.model.Rwb, h, this.Houtline)) return this.fail('target-behind-camera');
    const y = ws.y;
    y[0] = d0 - h[0]!;
    y[1] = d1 - h[1]!;
    y[2] = d2 - h[2]!;
    // R = diag(centre, centre, size of s) or diag(centre, centre, size of w, size of h); the
    // centre term scales with the box size s = sqrt(w h)
    const size = m === 4 ? Math.sqrt(h[2]! * h[3]!) : h[2]!;
    R.fill(0);
    R[0] = R[m + 1] = this.centreVariance(size);
    R[2 * m + 2] = this.sizeVariance(h[2]!);
    if (m === 4) {
      y[3] = d3 - h[3]!;
      R[15] = this.sizeVariance(h[3]!);
    }
    const scaled = this.scaleIndex >= 0;
    const ok = this.pointing
      ? innovationCovarianceColumnBlocks(this.P, this.Houtline, 0, 6, this.extraIndex, this.extraCount, R, this.n, m, ws)
      : scaled ? innovationCovarianceColumnBlockAndColumn(this.P, this.Houtline, 0, 6, this.scaleIndex, R, this.n, m, ws) : innovationCovarianceColumnBlock(this.P, this.Houtline, 0, 6, R, this.n, m, ws);
    if (!ok) {
      return this.refuseS();
    }
    this.lastNis = normalizedInnovationSquared(ws, m);
    if (useGate && this.lastNis > this.gateOutline) {
      this.lastReason = 'outside-gate';
      return 'gated';
    }
    // with the deck-scale state a 3-D box takes the generated Joseph kernel (same U, S layout);
    // without it the loops stay, so a filter without the state is unchanged to the bit
    if ((scaled || this.pointing) && m === 3) {
      return this.joseph3(ws);
    }
    updateJosephColumnBlock(this.x, this.P, this.n, m, ws);
    if (!allFinite(this.state, this.state.length)) {
      this.lastReason = this.nonFiniteEvent();
      return 'diverged';
    }
    return 'accepted';
  }

  /**
   * Flat tight update with the pointing states (and the deck-scale state when carried):
   * h = box of p' = (I + [δ]×) p with L (1 + s); H over [r, δ, s] = [H_r, H_δ, ∂h/∂s].
   */
  private applyFlatWithPointing(d0: number, d1: number, d2: number, useGate: boolean): UpdateStatus {
    const x = this.x, pointing = this.pointing!, si = this.scaleIndex, h = this.h, Hb = this.Hb, H = this.Hextra, y = this.ws.y;
    pointing.dx = x[this.pointingIndex]!;
    pointing.dy = x[this.pointingIndex + 1]!;
    const k1 = si >= 0 ? 1 + x[si]! : 1;
    const problem = this.model.tight(x, h, Hb, k1, pointing);
    if (problem) return this.fail(problem);
    y[0] = d0 - h[0]!;
    y[1] = d1 - h[1]!;
    y[2] = d2 - h[2]!;
    const R = this.Rbox;
    R[0] = R[4] = this.centreVariance(h[2]!);
    R[8] = this.sizeVariance(h[2]!);
    const w = 3 + this.extraCount, Hd = pointing.H;
    for (let a = 0; a < 3; a++) {
      for (let j = 0; j < 3; j++) H[w * a + j] = Hb[3 * a + j]!;
      H[w * a + 3] = Hd[2 * a]!;
      H[w * a + 4] = Hd[2 * a + 1]!;
      if (si >= 0) H[w * a + 5] = a === 2 ? h[2]! / k1 : 0;
    }
    const ws = this.ws;
    if (!innovationCovarianceColumnBlocks(this.P, H, 0, 3, this.extraIndex, this.extraCount, R, this.n, 3, ws)) {
      return this.refuseS();
    }
    this.lastNis = normalizedInnovationSquared(ws, 3);
    if (useGate && this.lastNis > this.gate) {
      this.lastReason = 'outside-gate';
      return 'gated';
    }
    return this.joseph3(ws);
  }

  /** S could not be formed: R is positive (semi-)definite, so P failed (a named divergence) or S is not positive definite. */
  private refuseS(): UpdateStatus {
    const event = checkCovariance(this.x, this.P, this.n, this.check);
    if (event) {
      this.lastReason = event;
      return 'diverged';
    }
    return this.fail('innovation-covariance-not-positive-definite');
  }

  /** Joseph update of a 3-D measurement from workspace ws (the generated kernel). */
  private joseph3(ws: UpdateWorkspace): UpdateStatus {
    if (!updateJoseph3(this.x, this.P, this.n, ws)) {
      this.lastReason = this.nonFiniteEvent();
      return 'diverged';
    }
    return 'accepted';
  }

  /**
   * Flat tight update with the deck-scale state: h and the r block of H are in this.h and
   * this.Hb (with L (1 + s)); H over [r, s] = [H_r, ∂h/∂s], ∂h/∂s = (0, 0, s_box / (1 + s)).
   */
  private applyWithScale(R: Float64Array, useGate: boolean): UpdateStatus {
    const H = this.Hscale, Hb = this.Hb, h = this.h;
    for (let a = 0; a < 3; a++) for (let j = 0; j < 3; j++) H[4 * a + j] = Hb[3 * a + j]!;
    H[3] = 0;
    H[7] = 0;
    H[11] = h[2]! / (1 + this.x[this.scaleIndex]!);
    return this.updateWithScale(R, useGate);
  }

  /**
   * Loose update with the deck-scale state: z = fix (back-projected with the assumed L),
   * h(x) = c + (r - c) / (1 + s), c = R_wb t_b; H_r = I / (1 + s), H_s = -(r - c) / (1 + s)².
   */
  private applyLooseWithScale(useGate: boolean): UpdateStatus {
    const x = this.x, k1 = 1 + x[this.scaleIndex]!, H = this.Hscale, y = this.ws.y, B = this.model.Rwb, t = this.model.offset;
    if (!(k1 > 0)) return this.fail('deck-scale-not-positive');
    H.fill(0);
    for (let i = 0; i < 3; i++) {
      const c = B[3 * i]! * t[0]! + B[3 * i + 1]! * t[1]! + B[3 * i + 2]! * t[2]!;
      const rel = x[i]! - c;
      y[i] = this.fix[i]! - (c + rel / k1);
      H[4 * i + i] = 1 / k1;
      H[4 * i + 3] = -rel / (k1 * k1);
    }
    return this.updateWithScale(this.Rfix, useGate);
  }

  /** The 3-D update with H over [r, s] in this.Hscale, y already in ws.y. */
  private updateWithScale(R: Float64Array, useGate: boolean): UpdateStatus {
    const ws = this.ws;
    if (!innovationCovarianceColumnBlockAndColumn(this.P, this.Hscale, 0, 3, this.scaleIndex, R, this.n, 3, ws)) {
      return this.refuseS();
    }
    this.lastNis = normalizedInnovationSquared(ws, 3);
    if (useGate && this.lastNis > this.gate) {
      this.lastReason = 'outside-gate';
      return 'gated';
    }
    // U (n x 3) and S as updateJoseph3 reads them: its generated kernel for 13 and 16 states
    return this.joseph3(ws);
  }

  /**
   * Refine the loose fix in `fix` (r, m) so the outline model reproduces the box centre (u, v)
   * and size s = sqrt(w h): Gauss-Newton on r with the deck heading of carrier velocity vC,
   *   r ← r + H_r⁻¹ (z - h(r)),  z = [u, v, s]
   * (the flat back-projection misplaces a close, obliquely seen deck with a body below it by
   * decimetres, and the first update would then gate every box). Attitude as last set on
   * `model`. Stops after 8 steps or a step under 1 mm; returns false (fix untouched) when
   * the outline cannot be evaluated, H_r is singular, or the fit moves r by more than half its
   * length (the box is then not the deck's: a false box or a cut one).
   */
  refineFixWithOutline(u: number, v: number, w: number, h: number, vC: ArrayLike<number>): boolean {
    const outline = this.outline;
    if (!outline) return true;
    // state: r, v_c, and (deck-scale state) s at its prior 0
    const state = this.refineState, hv = this.hOutline, H = this.Houtline, m = outline.m, c = outline.columns;
    for (let i = 0; i < 3; i++) {
      state[i] = this.fix[i]!;
      state[3 + i] = vC[i]!;
    }
    const s = Math.sqrt(w * h);
    for (let iteration = 0; iteration < 8; iteration++) {
      if (!outline.evaluate(state, this.model.Rcw, this.model.offsetCam, this.model.Rwb, hv, H)) return false;
      // rows (u, v, s); with width and height measured, s and its row follow from them
      let hs = hv[2]!;
      const A = this.refineMatrix;
      for (let j = 0; j < 3; j++) {
        A[j] = H[j]!;
        A[3 + j] = H[c + j]!;
        A[6 + j] = m === 4 ? (hv[3]! * H[2 * c + j]! + hv[2]! * H[3 * c + j]!) / (2 * Math.sqrt(hv[2]! * hv[3]!)) : H[2 * c + j]!;
      }
      if (m === 4) hs = Math.sqrt(hv[2]! * hv[3]!);
      const e0 = u - hv[0]!, e1 = v - hv[1]!, e2 = s - hs;
      // solve A d = e by Cramer's rule (3x3)
      const det = A[0]! * (A[4]! * A[8]! - A[5]! * A[7]!) - A[1]! * (A[3]! * A[8]! - A[5]! * A[6]!) + A[2]! * (A[3]! * A[7]! - A[4]! * A[6]!);
      if (!(Math.abs(det) > 0) || !Number.isFinite(det)) return false;
      const d0 = (e0 * (A[4]! * A[8]! - A[5]! * A[7]!) - A[1]! * (e1 * A[8]! - A[5]! * e2) + A[2]! * (e1 * A[7]! - A[4]! * e2)) / det;
      const d1 = (A[0]! * (e1 * A[8]! - A[5]! * e2) - e0 * (A[3]! * A[8]! - A[5]! * A[6]!) + A[2]! * (A[3]! * e2 - e1 * A[6]!)) / det;
      const d2 = (A[0]! * (A[4]! * e2 - e1 * A[7]!) - A[1]! * (A[3]! * e2 - e1 * A[6]!) + e0 * (A[3]! * A[7]! - A[4]! * A[6]!)) / det;
      state[0] = state[0]! + d0;
      state[1] = state[1]! + d1;
      state[2] = state[2]! + d2;
      if (!Number.isFinite(state[0]! + state[1]! + state[2]!)) return false;
      if (d0 * d0 + d1 * d1 + d2 * d2 < 1e-6) break;
    }
    const f = this.fix;
    const moved2 = (state[0]! - f[0]!) ** 2 + (state[1]! - f[1]!) ** 2 + (state[2]! - f[2]!) ** 2;
    if (!(moved2 <= 0.25 * (f[0]! * f[0]! + f[1]! * f[1]! + f[2]! * f[2]!))) return false;
    for (let i = 0; i < 3; i++) f[i] = state[i]!;
    return true;
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
