// A pinhole camera with Brown–Conrady distortion (Brown 1966; the k1 k2 k3 / p1 p2 form in
// common use). Intrinsics K = [[fx, 0, cx], [0, fy, cy], [0, 0, 1]] (Hartley & Zisserman ch. 6),
// with (cx, cy) in the continuous pixel coordinates of Box.ts (image centre = (width/2, height/2)).
import type { CameraMount } from './CameraMount.js';
import type { Distortion } from './distortion.js';

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

/** A pinhole camera with its mount (offset FLU m, roll/pitch/yaw deg from the nominal nadir mount). */
export interface MountedPinhole extends PinholeCamera {
  mount: CameraMount;
}

// One object shape for every camera, distortion and mount the simulator and filter hold: a
// fresh literal with a fixed key order, so `project`, the box code and `distortNormalized`
// see a single hidden class (JSON scenarios, spreads and hand-built objects give several,
// and the JIT then recompiles those functions per shape). Values are copied, never changed.

/** Copy of the distortion coefficients in the one fixed shape. */
export function distortionCoefficients(d: Distortion): Distortion {
  return { k1: d.k1, k2: d.k2, k3: d.k3, p1: d.p1, p2: d.p2 };
}

/** Copy of a camera mount in the one fixed shape (offset copied into a fresh array). */
export function cameraMount(m: CameraMount): CameraMount {
  return { offset: [m.offset[0], m.offset[1], m.offset[2]], rollDeg: m.rollDeg, pitchDeg: m.pitchDeg, yawDeg: m.yawDeg };
}

const NOMINAL_MOUNT: Readonly<CameraMount> = { offset: [0, 0, 0], rollDeg: 0, pitchDeg: 0, yawDeg: 0 };

/**
 * Copy of a camera in the one fixed shape: intrinsics, size, distortion and mount (the given
 * `mount`, else the camera's own, else the nominal nadir mount at the body origin).
 * @example pinholeCamera({ fx: 500, fy: 500, cx: 320, cy: 240, width: 640, height: 480, distortion: NO_DISTORTION })
 */
export function pinholeCamera(c: PinholeCamera & { mount?: CameraMount }, mount: CameraMount = c.mount ?? NOMINAL_MOUNT): MountedPinhole {
  return { fx: c.fx, fy: c.fy, cx: c.cx, cy: c.cy, width: c.width, height: c.height, distortion: distortionCoefficients(c.distortion), mount: cameraMount(mount) };
}

// Build one camera with fractional numbers at load, so every field of the shape starts as a
// double: a later integer-valued camera (cx = 320) then fits it, where the other order would
// widen the fields from small integers to doubles mid-run and discard the compiled code.
pinholeCamera({ fx: 0.5, fy: 0.5, cx: 0.5, cy: 0.5, width: 0.5, height: 0.5, distortion: { k1: 0.5, k2: 0.5, k3: 0.5, p1: 0.5, p2: 0.5 } }, { offset: [0.5, 0.5, 0.5], rollDeg: 0.5, pitchDeg: 0.5, yawDeg: 0.5 });

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
