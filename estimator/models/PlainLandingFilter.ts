// The landing filter written plainly with ml-matrix objects: dense F, Q, H, textbook Joseph
// form, matrix inverse for S. Same model and numbers as LandingFilter (the fast path that
// exploits the block structure of F and H); kept as the reference it is tested against and as
// the baseline of `npm run bench`. Measurements at the current time only (no delayed boxes).
import { Matrix, inverse } from 'ml-matrix';
import type { FilterSpec } from './FilterSettings.js';
import { type Box, boxProblem } from '../camera/Box.js';
import { boxMeasurement, boxMeasurementJacobian } from '../camera/boxGeometry.js';
import { BoxMeasurementModel } from './BoxMeasurementModel.js';
import { OutlineBoxModel, type DeckOutline } from './OutlineBoxModel.js';
import type { FilterCamera } from './FilterCamera.js';
import { emptyProcessCoefficients, processCoefficients, type ProcessCoefficients } from './ProcessCoefficients.js';
import { landingStateDimension, STANDARD_GRAVITY } from './landingState.js';
import { FilterSpecError, validateFilterSpec } from './validateFilterSpec.js';
import { gateThreshold } from '../filter/gate.js';
import { rotationMatrixFromQuat } from '../frames/rotationMatrixFromQuat.js';
import type { InitialSigma, UpdateResult } from './UpdateResult.js';

function block(M: Matrix, row: number, col: number, B: Matrix | number): void {
  for (let i = 0; i < 3; i++) {
    for (let j = 0; j < 3; j++) M.set(row + i, col + j, typeof B === 'number' ? (i === j ? B : 0) : B.get(i, j));
  }
}

export class PlainLandingFilter {
  readonly n: number;
  /** State (n x 1) and covariance (n x n). */
  x: Matrix;
  P: Matrix;
  time = Number.NaN;
  /** y (3 x 1) and S (3 x 3) of the last update that reached the gate (see LandingFilter.lastInnovation), else null. */
  lastInnovation: Matrix | null = null;
  lastInnovationCovariance: Matrix | null = null;
  private readonly coefficients: ProcessCoefficients;
  private readonly model: BoxMeasurementModel;
  private readonly gate: number;
  private readonly gateOutline: number;
  private readonly Rbox: Matrix;
  private readonly Rodometry: Matrix;
  private readonly attitude = new Float64Array(4);

  /** The outline box model (shared with LandingFilter: checked on its own against finite differences and the simulator's outline), or null for the flat model. */
  private readonly outline: OutlineBoxModel | null;

  constructor(readonly spec: FilterSpec, camera: FilterCamera, readonly targetSize: number, outline?: DeckOutline) {
    validateFilterSpec(spec);
    // the plain reference stays the 12/15-state formulation; the fast filter's deck-scale
    // column is checked against finite differences instead (test/models/deckScale.test.ts)
    if ((spec.pointingBiasSigmaDeg ?? 0) > 0) throw new FilterSpecError('filter.pointingBiasSigmaDeg', 'the plain reference filter has no pointing-bias states: use LandingFilter, or pointingBiasSigmaDeg 0');
    if ((spec.deckScaleSigma ?? 0) > 0) throw new FilterSpecError('filter.deckScaleSigma', 'the plain reference filter has no deck-scale state: use LandingFilter, or deckScaleSigma 0');
    this.n = landingStateDimension(spec.carrierModel === 'singer');
    this.x = Matrix.zeros(this.n, 1);
    this.P = Matrix.zeros(this.n, this.n);
    this.coefficients = emptyProcessCoefficients(spec.carrierModel === 'singer');
    this.model = new BoxMeasurementModel(camera, targetSize);
    const deck = outline ?? { deckLength: targetSize, deckWidth: targetSize, bodyHeight: 0 };
    this.outline = (spec.boxModel ?? 'outline') === 'outline' ? new OutlineBoxModel(this.model.camera, deck, spec.boxTerms ?? 'centre-size', spec.headingMinSpeed ?? 1.5) : null;
    this.gate = gateThreshold(spec.gateProbability, 3, spec.gateScale);
    this.gateOutline = gateThreshold(spec.gateProbability, this.outline ? this.outline.m : 3, spec.gateScale);
    const vp = spec.pixelNoise ** 2 * spec.rScale, vs = spec.sizeNoise ** 2 * spec.rScale, vo = spec.odometryNoise ** 2 * spec.rScale;
    this.Rbox = Matrix.diag([vp, vp, vs]);
    this.Rodometry = Matrix.diag([vo, vo, vo]);
  }

  initialize(t: number, r: ArrayLike<number>, vC: ArrayLike<number>, vL: ArrayLike<number>, sigma: InitialSigma): void {
    this.x = Matrix.columnVector([...Array.from(r), ...Array.from(vC), ...Array.from(vL), 0, 0, 0, ...(this.n === 15 ? [0, 0, 0] : [])]);
    const diag = [sigma.position, sigma.velocity, sigma.velocity, sigma.accelBias].flatMap((s) => [s * s, s * s, s * s]);
    if (this.n === 15) {
      const variance = Math.max((this.spec.carrierAccelNoise ** 2 * this.spec.qScale) / (2 * this.spec.singerTau), 1e-12);
      const sz = this.spec.carrierVerticalAccelNoise ?? this.spec.carrierAccelNoise;
      diag.push(variance, variance, Math.max((sz ** 2 * this.spec.qScale) / (2 * this.spec.singerTau), 1e-12));
    }
    this.P = Matrix.diag(diag);
    this.time = t;
    this.coefficients.dt = Number.NaN;
  }

  /** IMU step: P ← F P Fᵀ + Q with dense F and Q. */
  propagate(t: number, f: ArrayLike<number>, q: ArrayLike<number>): void {
    const dt = t - this.time;
    if (!(dt > 0)) return;
    const norm = Math.hypot(q[0]!, q[1]!, q[2]!, q[3]!);
    for (let i = 0; i < 4; i++) this.attitude[i] = q[i]! / norm;
    const Rwb = new Matrix(3, 3);
    const R = rotationMatrixFromQuat(this.attitude);
    for (let i = 0; i < 9; i++) Rwb.set(Math.floor(i / 3), i % 3, R[i]!);
    const c = processCoefficients(dt, { carrierAccelNoise: this.spec.carrierAccelNoise, carrierVerticalAccelNoise: this.spec.carrierVerticalAccelNoise, singerTau: this.spec.singerTau, accelNoise: this.spec.accelNoise, accelBiasWalk: this.spec.accelBiasWalk, qScale: this.spec.qScale }, this.coefficients);
    const n = this.n;
    const F = Matrix.eye(n, n);
    block(F, 0, 3, dt);
    block(F, 0, 6, -dt);
    block(F, 0, 9, Rwb.clone().mul(0.5 * dt * dt));
    block(F, 6, 9, Rwb.clone().mul(-dt));
    const Q = Matrix.zeros(n, n);
    block(Q, 0, 0, c.Qrr);
    block(Q, 0, 3, c.QrVc);
    block(Q, 3, 0, c.QrVc);
    block(Q, 0, 6, c.QrVl);
    block(Q, 6, 0, c.QrVl);
    block(Q, 3, 3, c.QVcVc);
    block(Q, 6, 6, c.QVlVl);
    block(Q, 9, 9, c.QBaBa);
    if (n === 15) {
      block(F, 0, 12, c.alpha);
      block(F, 3, 12, c.beta);
      block(F, 12, 12, c.e);
      block(Q, 0, 12, c.QrAc);
      block(Q, 12, 0, c.QrAc);
      block(Q, 3, 12, c.QVcAc);
      block(Q, 12, 3, c.QVcAc);
      block(Q, 12, 12, c.QAcAc);
    }
    // the carrier's vertical axis (z) from its own noise density
    symmetric(Q, 2, 2, c.QrrZ);
    symmetric(Q, 2, 5, c.QrVcZ);
    symmetric(Q, 5, 5, c.QVcVcZ);
    if (n === 15) {
      symmetric(Q, 2, 14, c.QrAcZ);
      symmetric(Q, 5, 14, c.QVcAcZ);
      symmetric(Q, 14, 14, c.QAcAcZ);
    }
    // Nonlinear state step: a_L = R_wb (f - ba) + g.
    const bias = this.x.subMatrix(9, 11, 0, 0);
    const aL = Rwb.mmul(Matrix.columnVector(Array.from(f).slice(0, 3)).sub(bias));
    aL.set(2, 0, aL.get(2, 0) - STANDARD_GRAVITY);
    const xs = this.x.clone();
    for (let i = 0; i < 3; i++) {
      let r = xs.get(i, 0) + dt * (xs.get(3 + i, 0) - xs.get(6 + i, 0)) - 0.5 * dt * dt * aL.get(i, 0);
      let vc = xs.get(3 + i, 0);
      if (n === 15) {
        r += c.alpha * xs.get(12 + i, 0);
        vc += c.beta * xs.get(12 + i, 0);
        this.x.set(12 + i, 0, c.e * xs.get(12 + i, 0));
      }
      this.x.set(i, 0, r);
      this.x.set(3 + i, 0, vc);
      this.x.set(6 + i, 0, xs.get(6 + i, 0) + dt * aL.get(i, 0));
    }
    this.P = F.mmul(this.P).mmul(F.transpose()).add(Q);
    this.symmetrize();
    this.time = t;
  }

  /** Box at the current time, tight or loose per spec.cameraUpdate. */
  updateBox(captureTime: number, box: Box): UpdateResult {
    const problem = boxProblem(box, this.model.camera.width, this.model.camera.height);
    if (problem) return { status: 'rejected', nis: Number.NaN, dim: 3, reason: problem };
    if (Math.abs(captureTime - this.time) > 1e-9) return { status: 'rejected', nis: Number.NaN, dim: 3, reason: 'plain-filter-has-no-history' };
    const u = (box.xMin + box.xMax) / 2, v = (box.yMin + box.yMax) / 2, s = Math.sqrt((box.xMax - box.xMin) * (box.yMax - box.yMin));
    const n = this.n;
    const Rwb = new Matrix([...Array(3)].map((_, i) => Array.from(rotationMatrixFromQuat(this.attitude).slice(3 * i, 3 * i + 3))));
    const Rcb = new Matrix([...Array(3)].map((_, i) => Array.from(this.model.Rcb.slice(3 * i, 3 * i + 3))));
    const H = Matrix.zeros(3, n);
    if (this.spec.cameraUpdate === 'tight' && this.outline) return this.updateOutline(box);
    if (this.spec.cameraUpdate === 'tight') {
      // p_cam = R_cb (R_wbᵀ r - t_b);  h = boxMeasurement(p_cam);  H_r = J R_cb R_wbᵀ
      const r = this.x.subMatrix(0, 2, 0, 0);
      const pCam = Rcb.mmul(Rwb.transpose().mmul(r).sub(Matrix.columnVector(Array.from(this.model.offset))));
      const p = pCam.to1DArray();
      if (!(p[2]! > 1e-3)) return { status: 'rejected', nis: Number.NaN, dim: 3, reason: 'target-behind-camera' };
      const h = Array.from(boxMeasurement(this.model.camera, this.targetSize, p));
      const J = Array.from(boxMeasurementJacobian(this.model.camera, this.targetSize, p));
      const Hr = new Matrix([J.slice(0, 3), J.slice(3, 6), J.slice(6, 9)]).mmul(Rcb).mmul(Rwb.transpose());
      H.setSubMatrix(Hr, 0, 0);
      // size variance σs² + (φ h_s)²: the fractional part scales with the predicted size
      const R = this.Rbox.clone();
      R.set(2, 2, this.Rbox.get(2, 2) + this.spec.sizeNoiseFraction ** 2 * this.spec.rScale * h[2]! ** 2);
      for (const i of [0, 1]) R.set(i, i, this.Rbox.get(i, i) + this.spec.pixelNoiseFraction ** 2 * this.spec.rScale * h[2]! ** 2);
      return this.update(Matrix.columnVector([u - h[0]!, v - h[1]!, s - h[2]!]), H, R);
    }
    this.model.setAttitude(this.attitude);
    const fix = new Float64Array(3), Rfix = new Float64Array(9);
    const vp = this.Rbox.get(0, 0) + this.spec.pixelNoiseFraction ** 2 * this.spec.rScale * s * s, vs = this.Rbox.get(2, 2) + this.spec.sizeNoiseFraction ** 2 * this.spec.rScale * s * s;
    const modelProblem = this.model.loose(u, v, s, vp, vp, vs, fix, Rfix);
    if (modelProblem) return { status: 'rejected', nis: Number.NaN, dim: 3, reason: modelProblem };
    H.setSubMatrix(Matrix.eye(3, 3), 0, 0);
    const y = Matrix.columnVector(Array.from(fix)).sub(this.x.subMatrix(0, 2, 0, 0));
    return this.update(y, H, new Matrix([Array.from(Rfix.slice(0, 3)), Array.from(Rfix.slice(3, 6)), Array.from(Rfix.slice(6, 9))]));
  }

  /** Tight update with the outline model: h and H over [r, v_c] from OutlineBoxModel, the rest dense. */
  private updateOutline(box: Box): UpdateResult {
    const outline = this.outline!, m = outline.m;
    this.model.setAttitude(this.attitude);
    const h = new Float64Array(m), Hb = new Float64Array(6 * m);
    if (!outline.evaluate(this.x.to1DArray(), this.model.Rcw, this.model.offsetCam, this.model.Rwb, h, Hb)) return { status: 'rejected', nis: Number.NaN, dim: m, reason: 'target-behind-camera' };
    const w = box.xMax - box.xMin, hgt = box.yMax - box.yMin;
    const z = m === 4 ? [(box.xMin + box.xMax) / 2, (box.yMin + box.yMax) / 2, w, hgt] : [(box.xMin + box.xMax) / 2, (box.yMin + box.yMax) / 2, Math.sqrt(w * hgt)];
    const H = Matrix.zeros(m, this.n);
    for (let i = 0; i < m; i++) for (let j = 0; j < 6; j++) H.set(i, j, Hb[6 * i + j]!);
    const size = m === 4 ? Math.sqrt(h[2]! * h[3]!) : h[2]!;
    const { pixelNoise, sizeNoise, pixelNoiseFraction, sizeNoiseFraction, rScale } = this.spec;
    const centre = (pixelNoise ** 2 + pixelNoiseFraction ** 2 * size ** 2) * rScale;
    const sizeVar = (v: number): number => (sizeNoise ** 2 + sizeNoiseFraction ** 2 * v ** 2) * rScale;
    const R = Matrix.diag(m === 4 ? [centre, centre, sizeVar(h[2]!), sizeVar(h[3]!)] : [centre, centre, sizeVar(h[2]!)]);
    return this.update(Matrix.columnVector(z.map((zi, i) => zi - h[i]!)), H, R, this.gateOutline);
  }

  updateOdometry(t: number, velocityWorld: ArrayLike<number>): UpdateResult {
    if (Math.abs(t - this.time) > 1e-9) return { status: 'rejected', nis: Number.NaN, dim: 3, reason: 'plain-filter-has-no-history' };
    const H = Matrix.zeros(3, this.n);
    H.setSubMatrix(Matrix.eye(3, 3), 0, 6);
    const y = Matrix.columnVector(Array.from(velocityWorld).slice(0, 3)).sub(this.x.subMatrix(6, 8, 0, 0));
    return this.update(y, H, this.Rodometry);
  }

  /** S = H P Hᵀ + R, K = P Hᵀ S⁻¹, gate on NIS, x += K y, P = (I - K H) P (I - K H)ᵀ + K R Kᵀ. */
  private update(y: Matrix, H: Matrix, R: Matrix, gate = this.gate): UpdateResult {
    const dim = y.rows;
    const S = H.mmul(this.P).mmul(H.transpose()).add(R);
    this.lastInnovation = y;
    this.lastInnovationCovariance = S;
    const Sinv = inverse(S);
    const nis = y.transpose().mmul(Sinv).mmul(y).get(0, 0);
    if (nis > gate) return { status: 'gated', nis, dim, reason: 'outside-gate' };
    const K = this.P.mmul(H.transpose()).mmul(Sinv);
    this.x = this.x.add(K.mmul(y));
    const A = Matrix.eye(this.n, this.n).sub(K.mmul(H));
    this.P = A.mmul(this.P).mmul(A.transpose()).add(K.mmul(R).mmul(K.transpose()));
    this.symmetrize();
    return { status: 'accepted', nis, dim, reason: null };
  }

  private symmetrize(): void {
    this.P = this.P.add(this.P.transpose()).mul(0.5);
  }
}

/** Q[i][j] = Q[j][i] = value. */
function symmetric(Q: Matrix, i: number, j: number, value: number): void {
  Q.set(i, j, value);
  Q.set(j, i, value);
}
