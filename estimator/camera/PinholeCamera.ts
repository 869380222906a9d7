// A pinhole camera with Brown–Conrady distortion (Brown 1966; the k1 k2 k3 / p1 p2 form in
// common use). Intrinsics K = [[fx, 0, cx], [0, fy, cy], [0, 0, 1]] (Hartley & Zisserman ch. 6),
// with (cx, cy) in the continuous pixel coordinates of Box.ts (image centre = (width/2, height/2)).
import type { Distortion } from '../sim/Scenario.js';

export interface PinholeCamera {
  /** Focal lengths (px). */
  fx: number;
  fy: number;
  /** Principal point (px, continuous coordinates, origin top-left corner). */
  cx: number;
  cy: number;
  /** Image size (px). */
  width: number;
  height: number;
  /** Radial k1 k2 k3 and tangential p1 p2 coefficients (all zero = ideal pinhole). */
  distortion: Distortion;
}

export const NO_DISTORTION: Readonly<Distortion> = Object.freeze({ k1: 0, k2: 0, k3: 0, p1: 0, p2: 0 });

/** Typed error for a camera that cannot be used (carries the offending field). */
export class CameraError extends Error {
  constructor(readonly field: string, message: string) {
    super(`camera.${field}: ${message}`);
    this.name = 'CameraError';
  }
}

/** Throws CameraError unless the intrinsics are finite with positive focal lengths and size. */
export function validateCamera(camera: PinholeCamera): void {
  for (const key of ['fx', 'fy', 'width', 'height'] as const) {
    if (!(camera[key] > 0) || !Number.isFinite(camera[key])) throw new CameraError(key, `must be a positive number, got ${camera[key]}`);
  }
  for (const key of ['cx', 'cy'] as const) {
    if (!Number.isFinite(camera[key])) throw new CameraError(key, `must be finite, got ${camera[key]}`);
  }
  for (const key of ['k1', 'k2', 'k3', 'p1', 'p2'] as const) {
    if (!Number.isFinite(camera.distortion[key])) throw new CameraError(`distortion.${key}`, `must be finite, got ${camera.distortion[key]}`);
  }
}
