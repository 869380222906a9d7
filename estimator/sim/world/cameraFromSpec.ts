// Camera intrinsics from a scenario's camera spec (given directly or from lens and sensor),
// and the numbers an engineer sizes a camera by: field of view and pixels per metre.
import { type PinholeCamera, pinholeCamera } from '../../camera/PinholeCamera.js';
import type { CameraSpec, Intrinsics } from '../Scenario.js';

const DEG = Math.PI / 180;

export class CameraSpecError extends Error {
  constructor(readonly field: string, problem: string) {
    super(`${field}: ${problem}`);
    this.name = 'CameraSpecError';
  }
}

/**
 * Intrinsics of the camera spec: its `intrinsics` as given, or from the lens:
 *   fx = f width / sensorWidth,  fy = f height / sensorHeight,  cx = width / 2,  cy = height / 2
 * (principal point at the image centre in the continuous pixel coordinates of camera/Box.ts).
 * @example intrinsicsFromSpec({ lens: { focalLength: 0.0036, sensorWidth: 0.0036, sensorHeight: 0.0027 }, width: 640, height: 480, ... })
 *   // { fx: 640, fy: 640, cx: 320, cy: 240 }
 */
export function intrinsicsFromSpec(camera: CameraSpec): Intrinsics {
  if (camera.intrinsics && camera.lens) throw new CameraSpecError('camera', 'give either intrinsics or lens, not both');
  if (camera.intrinsics) return { ...camera.intrinsics };
  const lens = camera.lens;
  if (!lens) throw new CameraSpecError('camera', 'give either intrinsics or lens');
  for (const key of ['focalLength', 'sensorWidth', 'sensorHeight'] as const) {
    if (!(lens[key] > 0) || !Number.isFinite(lens[key])) throw new CameraSpecError(`camera.lens.${key}`, `must be a positive length in metres, got ${lens[key]}`);
  }
  return {
    fx: (lens.focalLength * camera.width) / lens.sensorWidth,
    fy: (lens.focalLength * camera.height) / lens.sensorHeight,
    cx: camera.width / 2,
    cy: camera.height / 2,
  };
}

/** The spec as a pinhole camera (intrinsics, image size, distortion). */
export function pinholeFromSpec(camera: CameraSpec): PinholeCamera {
  const k = intrinsicsFromSpec(camera);
  return pinholeCamera({ fx: k.fx, fy: k.fy, cx: k.cx, cy: k.cy, width: camera.width, height: camera.height, distortion: camera.distortion }, camera.mount);
}

/**
 * Full field of view (deg) of the undistorted pinhole, edge to edge through the principal point:
 *   horizontal = atan(cx / fx) + atan((width - cx) / fx), vertical likewise with cy, fy, height
 * (= 2 atan(width / (2 fx)) for a centred principal point).
 */
export function fieldOfViewDeg(intrinsics: Intrinsics, width: number, height: number): { horizontal: number; vertical: number } {
  const { fx, fy, cx, cy } = intrinsics;
  return {
    horizontal: (Math.atan(cx / fx) + Math.atan((width - cx) / fx)) / DEG,
    vertical: (Math.atan(cy / fy) + Math.atan((height - cy) / fy)) / DEG,
  };
}

/**
 * Image pixels per metre of ground for a camera looking straight down from heightM (m):
 * sqrt(fx fy) / h (= fx / h for square pixels), at the image centre.
 */
export function pixelsPerMetre(intrinsics: Intrinsics, heightM: number): number {
  if (!(heightM > 0)) throw new RangeError(`pixelsPerMetre: height must be positive, got ${heightM} m`);
  return Math.sqrt(intrinsics.fx * intrinsics.fy) / heightM;
}
