// Box centre and size <-> relative position of a target of known size, in the camera optical
// frame. The filter's box model: centre (u, v) = project(p_cam) and size
//   s = sqrt(fx fy A_target) / Z = sqrt(fx fy) L / Z,   L = sqrt(A_target) (m),
// a square target facing the camera. (The simulator's detector boxes the true 3-D outline, so
// this model is deliberately simpler than the truth.) Allocation-free with `out`/`work`.
import type { Box } from './Box.js';
import type { PinholeCamera } from './PinholeCamera.js';
import { BehindCameraError, normalizedFromPixel, project, projectJacobian } from './project.js';

/** Box-size measurement s (px) of a target of size L (m) at depth Z (m). */
export function boxSizeAtDepth(camera: PinholeCamera, targetSize: number, depth: number): number {
  return (Math.sqrt(camera.fx * camera.fy) * targetSize) / depth;
}

/** out = h(p_cam) = [u, v, s]. */
export function boxMeasurement(camera: PinholeCamera, targetSize: number, pCam: ArrayLike<number>, out: Float64Array | number[] = new Float64Array(3)): Float64Array | number[] {
  project(camera, pCam, out);
  out[2] = boxSizeAtDepth(camera, targetSize, pCam[2]!);
  return out;
}

/**
 * Jacobian ∂(u, v, s)/∂(X, Y, Z), row-major 3x3 into out[0..8]:
 * rows 1-2 from projectJacobian, row 3 = [0, 0, -sqrt(fx fy) L / Z²]. `work` holds 4 numbers.
 */
export function boxMeasurementJacobian(camera: PinholeCamera, targetSize: number, pCam: ArrayLike<number>, out: Float64Array | number[] = new Float64Array(9), work: Float64Array | number[] = new Float64Array(4)): Float64Array | number[] {
  projectJacobian(camera, pCam, out, work);
  const Z = pCam[2]!;
  out[6] = 0;
  out[7] = 0;
  out[8] = -(Math.sqrt(camera.fx * camera.fy) * targetSize) / (Z * Z);
  return out;
}

/** A square box of the target at p_cam (m, optical frame). Throws BehindCameraError when Z <= 0. */
export function boxFromRelativePosition(camera: PinholeCamera, pCam: ArrayLike<number>, targetSize: number): Box {
  const m = boxMeasurement(camera, targetSize, pCam);
  const half = m[2]! / 2;
  return { xMin: m[0]! - half, yMin: m[1]! - half, xMax: m[0]! + half, yMax: m[1]! + half };
}

/**
 * Inverse of the box model: p_cam (m, optical frame) from centre (u, v) and size s (px):
 * Z = sqrt(fx fy) L / s, (X, Y) = Z · undistort((u - cx)/fx, (v - cy)/fy).
 */
export function relativePositionFromMeasurement(camera: PinholeCamera, targetSize: number, u: number, v: number, s: number, out: Float64Array | number[] = new Float64Array(3), work?: Float64Array | number[]): Float64Array | number[] {
  if (!(s > 0)) throw new RangeError(`box size must be positive, got ${s}`);
  const Z = boxSizeAtDepth(camera, targetSize, s); // symmetric: Z = sqrt(fx fy) L / s
  normalizedFromPixel(camera, u, v, out, work);
  out[0] = out[0]! * Z;
  out[1] = out[1]! * Z;
  out[2] = Z;
  return out;
}

/** p_cam (m, optical frame) of a target of size L (m) from its box. */
export function relativePositionFromBox(camera: PinholeCamera, box: Box, targetSize: number, out: Float64Array | number[] = new Float64Array(3)): Float64Array | number[] {
  const u = (box.xMin + box.xMax) / 2, v = (box.yMin + box.yMax) / 2;
  const s = Math.sqrt((box.xMax - box.xMin) * (box.yMax - box.yMin));
  return relativePositionFromMeasurement(camera, targetSize, u, v, s, out);
}

/**
 * Jacobian ∂(X, Y, Z)/∂(u, v, s) of the back-projection at p_cam, by the inverse function
 * theorem: the inverse of boxMeasurementJacobian at the same point (row-major 3x3).
 * Used to propagate box noise into the loose 3-D fix: R_p = J R_box Jᵀ.
 */
export function relativePositionJacobian(camera: PinholeCamera, targetSize: number, pCam: ArrayLike<number>, out: Float64Array | number[] = new Float64Array(9), work: Float64Array | number[] = new Float64Array(13)): Float64Array | number[] {
  if (!(pCam[2]! > 0)) throw new BehindCameraError(pCam[2]!);
  boxMeasurementJacobian(camera, targetSize, pCam, work, out);
  // Block structure: J = [[A, c], [0, d]] with A 2x2, c 2x1, d scalar -> J⁻¹ = [[A⁻¹, -A⁻¹ c / d], [0, 1/d]].
  const a = work[0]!, b = work[1]!, c0 = work[2]!, e = work[3]!, f = work[4]!, c1 = work[5]!, d = work[8]!;
  const det = a * f - b * e;
  const i00 = f / det, i01 = -b / det, i10 = -e / det, i11 = a / det;
  out[0] = i00; out[1] = i01; out[2] = -(i00 * c0 + i01 * c1) / d;
  out[3] = i10; out[4] = i11; out[5] = -(i10 * c0 + i11 * c1) / d;
  out[6] = 0; out[7] = 0; out[8] = 1 / d;
  return out;
}
