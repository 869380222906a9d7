// Projection and back-projection through a pinhole camera with Brown–Conrady distortion.
// Points are in the camera optical frame (x right, y down, z forward; m). Allocation-free
// when `out` (and `work`) are passed.
//   u = fx xd + cx,  v = fy yd + cy,  (xd, yd) = distort(X/Z, Y/Z)
import type { PinholeCamera } from './PinholeCamera.js';
import { distortNormalized, distortionJacobian, undistortNormalized } from './distortion.js';

/** A point that is not in front of the camera (Z <= 0) has no image. */
export class BehindCameraError extends RangeError {
  constructor(readonly z: number) {
    super(`point is not in front of the camera (Z = ${z} m)`);
    this.name = 'BehindCameraError';
  }
}

/** Pixel (u, v) of a point in the optical frame. Throws BehindCameraError when Z <= 0: check pCam[2] first. */
export function project(camera: PinholeCamera, pCam: ArrayLike<number>, out: Float64Array | number[] = new Float64Array(2)): Float64Array | number[] {
  const Z = pCam[2]!;
  if (!(Z > 0)) throw new BehindCameraError(Z);
  distortNormalized(pCam[0]! / Z, pCam[1]! / Z, camera.distortion, out);
  out[0] = camera.fx * out[0]! + camera.cx;
  out[1] = camera.fy * out[1]! + camera.cy;
  return out;
}

/**
 * Jacobian ∂(u, v)/∂(X, Y, Z), row-major 2x3 into out[0..5]:
 * diag(fx, fy) · J_distortion(x, y) · [[1/Z, 0, -X/Z²], [0, 1/Z, -Y/Z²]].
 */
export function projectJacobian(camera: PinholeCamera, pCam: ArrayLike<number>, out: Float64Array | number[] = new Float64Array(6), work: Float64Array | number[] = new Float64Array(4)): Float64Array | number[] {
  const X = pCam[0]!, Y = pCam[1]!, Z = pCam[2]!;
  if (!(Z > 0)) throw new BehindCameraError(Z);
  const iz = 1 / Z, x = X * iz, y = Y * iz;
  distortionJacobian(x, y, camera.distortion, work);
  const a = work[0]! * camera.fx, b = work[1]! * camera.fx, c = work[2]! * camera.fy, d = work[3]! * camera.fy;
  out[0] = a * iz; out[1] = b * iz; out[2] = -(a * x + b * y) * iz;
  out[3] = c * iz; out[4] = d * iz; out[5] = -(c * x + d * y) * iz;
  return out;
}

/** Undistorted normalized coordinates (X/Z, Y/Z) of a pixel (iterative undistortion). */
export function normalizedFromPixel(camera: PinholeCamera, u: number, v: number, out: Float64Array | number[] = new Float64Array(2), work?: Float64Array | number[]): Float64Array | number[] {
  return undistortNormalized((u - camera.cx) / camera.fx, (v - camera.cy) / camera.fy, camera.distortion, out, work);
}

/** The pixel an ideal (distortion-free) camera with the same K would have seen. */
export function undistortPixel(camera: PinholeCamera, u: number, v: number, out: Float64Array | number[] = new Float64Array(2)): Float64Array | number[] {
  normalizedFromPixel(camera, u, v, out);
  out[0] = camera.fx * out[0]! + camera.cx;
  out[1] = camera.fy * out[1]! + camera.cy;
  return out;
}

/** The point at depth Z (m, along the optical axis) that projects to pixel (u, v). */
export function backProject(camera: PinholeCamera, u: number, v: number, depth: number, out: Float64Array | number[] = new Float64Array(3)): Float64Array | number[] {
  normalizedFromPixel(camera, u, v, out);
  out[0] = out[0]! * depth;
  out[1] = out[1]! * depth;
  out[2] = depth;
  return out;
}
