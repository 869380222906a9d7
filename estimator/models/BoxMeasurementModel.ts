// The box measurement models built on the camera the filter believes in (FilterCamera.ts).
// Tight: z = [u, v, s], h(x) = boxMeasurement(p_cam), p_cam = R_cb (R_wbᵀ r - t_b), so
//   H_r = ∂h/∂p_cam · R_cb R_wbᵀ  (only the r block of H is non-zero; with the deck-scale state
//   L becomes L (1 + s) and H gains ∂s_box/∂s, see LandingCore; with pointing states δ the camera
//   point is turned, p' = (I + [δ]×) p, so H_r = ∂h/∂p' (I + [δ]×) R_cb R_wbᵀ and H_δ = ∂h/∂p' ∂p'/∂δ).
// Loose: back-project the box to p_cam, r_z = R_wb (R_cbᵀ p_cam + t_b), with covariance
//   R_r = C J R_box Jᵀ Cᵀ, J = ∂p_cam/∂(u, v, s), C = R_wb R_cbᵀ (camera -> world); then H = [I 0 …].
// Preallocated; the methods allocate nothing.
import type { FilterCamera } from './FilterCamera.js';
import { type PinholeCamera, pinholeCamera, validateCamera, CameraError } from '../camera/PinholeCamera.js';
import { boxMeasurement, boxMeasurementJacobian, relativePositionFromMeasurement, relativePositionJacobian } from '../camera/boxGeometry.js';
import { UndistortionError } from '../camera/distortion.js';
import { cameraFromBody } from '../frames/cameraFromBody.js';
import { rotationMatrixFromQuat } from '../frames/rotationMatrixFromQuat.js';

/** Pointing-bias states for the tight model: δ (rad) in, ∂h/∂δ (3 x 2, row-major) out. */
export interface PointingBias {
  dx: number;
  dy: number;
  readonly H: Float64Array;
}

/** Why a box could not be turned into a measurement. */
export type CameraModelProblem = 'target-behind-camera' | 'undistortion-failed' | null;

const MIN_DEPTH = 1e-3; // m: closer than this the pinhole model is meaningless

export class BoxMeasurementModel {
  readonly camera: PinholeCamera;
  /** R_cb (body -> camera) and camera offset t_b (m, FLU). */
  readonly Rcb: Float64Array;
  readonly offset: Float64Array;
  /** R_wb of the attitude last set, and M = R_cb R_wbᵀ (world -> camera). */
  readonly Rwb = new Float64Array(9);
  readonly Rcw = new Float64Array(9);
  /** o = R_cb t_b: the camera offset seen from the camera (m), so p_cam = M r - o. */
  readonly offsetCam = new Float64Array(3);
  /** p_cam of the last evaluation (m). */
  readonly pCam = new Float64Array(3);
  private readonly J = new Float64Array(9);
  private readonly work = new Float64Array(13);
  private readonly tmp = new Float64Array(9);
  private readonly turned = new Float64Array(9);

  constructor(camera: FilterCamera, readonly targetSize: number) {
    validateCamera(camera);
    if (!(targetSize > 0) || !Number.isFinite(targetSize)) throw new CameraError('targetSize', `must be a positive number of metres, got ${targetSize}`);
    this.camera = pinholeCamera(camera); // the one camera shape (PinholeCamera.ts)
    this.Rcb = cameraFromBody(camera.mount);
    this.offset = Float64Array.from(camera.mount.offset);
    const R = this.Rcb, t = this.offset;
    for (let i = 0; i < 3; i++) this.offsetCam[i] = R[3 * i]! * t[0]! + R[3 * i + 1]! * t[1]! + R[3 * i + 2]! * t[2]!;
  }

  /** Set the attitude q_wb [w, x, y, z] (unit) used by the next evaluations. */
  setAttitude(q: ArrayLike<number>): void {
    rotationMatrixFromQuat(q, this.Rwb);
    const A = this.Rcb, B = this.Rwb, M = this.Rcw;
    // M = R_cb R_wbᵀ
    for (let i = 0; i < 3; i++) {
      for (let j = 0; j < 3; j++) M[3 * i + j] = A[3 * i]! * B[3 * j]! + A[3 * i + 1]! * B[3 * j + 1]! + A[3 * i + 2]! * B[3 * j + 2]!;
    }
  }

  /**
   * Tight model: h into hOut [u, v, s], r block of H (3x3) into Hb. `scale` = 1 + s multiplies the
   * target size (deck-scale state): s_box = sqrt(fx fy) L (1 + s) / Z, so ∂s_box/∂s = s_box / (1 + s).
   */
  tight(r: ArrayLike<number>, hOut: Float64Array, Hb: Float64Array, scale = 1, pointing: PointingBias | null = null): CameraModelProblem {
    let M = this.Rcw;
    const p = this.pCam, R = this.Rcb, t = this.offset;
    for (let i = 0; i < 3; i++) {
      p[i] = M[3 * i]! * r[0]! + M[3 * i + 1]! * r[1]! + M[3 * i + 2]! * r[2]! - (R[3 * i]! * t[0]! + R[3 * i + 1]! * t[1]! + R[3 * i + 2]! * t[2]!);
    }
    if (pointing) {
      // p' = (I + [δ]×) p, δ = (δx, δy, 0); ∂p'/∂δx = (0, -p_z, p_y), ∂p'/∂δy = (p_z, 0, -p_x)
      const dx = pointing.dx, dy = pointing.dy, p0 = p[0]!, p1 = p[1]!, p2 = p[2]!;
      const D = this.tmp; // ∂p'/∂δ, 3 x 2 row-major
      D[0] = 0; D[1] = p2; D[2] = -p2; D[3] = 0; D[4] = p1; D[5] = -p0;
      p[0] = p0 + dy * p2;
      p[1] = p1 - dx * p2;
      p[2] = p2 - dy * p0 + dx * p1;
      // (I + [δ]×) M for the r block
      const A = this.turned, B = this.Rcw;
      for (let j = 0; j < 3; j++) {
        A[j] = B[j]! + dy * B[6 + j]!;
        A[3 + j] = B[3 + j]! - dx * B[6 + j]!;
        A[6 + j] = B[6 + j]! - dy * B[j]! + dx * B[3 + j]!;
      }
      M = A;
    }
    if (!(p[2]! > MIN_DEPTH)) return 'target-behind-camera';
    const L = this.targetSize * scale;
    boxMeasurement(this.camera, L, p, hOut);
    const J = this.J;
    boxMeasurementJacobian(this.camera, L, p, J, this.work);
    for (let i = 0; i < 3; i++) {
      for (let j = 0; j < 3; j++) Hb[3 * i + j] = J[3 * i]! * M[j]! + J[3 * i + 1]! * M[3 + j]! + J[3 * i + 2]! * M[6 + j]!;
    }
    if (pointing) {
      const D = this.tmp, Hd = pointing.H;
      for (let i = 0; i < 3; i++) {
        for (let e = 0; e < 2; e++) Hd[2 * i + e] = J[3 * i]! * D[e]! + J[3 * i + 1]! * D[2 + e]! + J[3 * i + 2]! * D[4 + e]!;
      }
    }
    return null;
  }

  /**
   * Loose model: 3-D fix rOut (world, m) and its covariance Rr (3x3) from (u, v, s) with
   * independent noise variances (varU, varV, varS) in px².
   */
  loose(u: number, v: number, s: number, varU: number, varV: number, varS: number, rOut: Float64Array, Rr: Float64Array): CameraModelProblem {
    const p = this.pCam;
    try {
      relativePositionFromMeasurement(this.camera, this.targetSize, u, v, s, p, this.work);
    } catch (error) {
      if (error instanceof UndistortionError) return 'undistortion-failed';
      throw error;
    }
    if (!(p[2]! > MIN_DEPTH)) return 'target-behind-camera';
    const J = this.J, T = this.tmp, M = this.Rcw;
    relativePositionJacobian(this.camera, this.targetSize, p, J, this.work);
    // T = Mᵀ J  (world from (u, v, s)); R_r = T diag(var) Tᵀ
    for (let i = 0; i < 3; i++) {
      for (let j = 0; j < 3; j++) T[3 * i + j] = M[i]! * J[j]! + M[3 + i]! * J[3 + j]! + M[6 + i]! * J[6 + j]!;
    }
    for (let i = 0; i < 3; i++) {
      for (let j = i; j < 3; j++) {
        const value = T[3 * i]! * T[3 * j]! * varU + T[3 * i + 1]! * T[3 * j + 1]! * varV + T[3 * i + 2]! * T[3 * j + 2]! * varS;
        Rr[3 * i + j] = value;
        Rr[3 * j + i] = value;
      }
    }
    // r = R_wb (R_cbᵀ p + t) = Mᵀ p + R_wb t
    const B = this.Rwb, t = this.offset;
    for (let i = 0; i < 3; i++) {
      rOut[i] = M[i]! * p[0]! + M[3 + i]! * p[1]! + M[6 + i]! * p[2]! + B[3 * i]! * t[0]! + B[3 * i + 1]! * t[1]! + B[3 * i + 2]! * t[2]!;
    }
    return null;
  }
}
