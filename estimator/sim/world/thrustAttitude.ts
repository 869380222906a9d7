// Attitude of a multirotor whose thrust produces a given acceleration: the body z axis
// points along the specific force a - g_vec, yaw is held. Allocation-free (writes out).
import { quatFromRotationMatrix } from '../../frames/rotationMatrixFromQuat.js';

export const GRAVITY = 9.80665; // m/s^2, standard gravity; gravity vector in ENU is (0, 0, -GRAVITY)

const scratch = new Float64Array(9);

/**
 * q_wb (Hamilton, [w, x, y, z], body FLU -> world ENU) with body z along
 * f = a - (0, 0, -g) and the body x axis's horizontal projection at heading yaw (rad from East,
 * CCW), i.e. yaw is the ZYX Euler yaw:
 *   z_b = f / |f|,  x_b = (y_c x z_b) / |y_c x z_b| with y_c = (-sin yaw, cos yaw, 0),  y_b = z_b x x_b.
 * When |f| vanishes (free fall) the body is held level. Returns the tilt angle (rad) of z_b from vertical.
 */
export function attitudeFromAcceleration(acceleration: ArrayLike<number>, yaw: number, out: Float64Array): number {
  return attitudeFromAccelerationAtHeading(acceleration, Math.cos(yaw), Math.sin(yaw), out);
}

/** attitudeFromAcceleration with the yaw given as its cosine and sine (a held yaw: no trigonometry per step). */
export function attitudeFromAccelerationAtHeading(acceleration: ArrayLike<number>, c: number, s: number, out: Float64Array): number {
  let zx = acceleration[0]!, zy = acceleration[1]!, zz = acceleration[2]! + GRAVITY;
  let norm = Math.sqrt(zx * zx + zy * zy + zz * zz);
  if (norm < 1e-9 || zz <= 0) {
    // free fall or thrust pointing down: a multirotor cannot do that; stay level
    zx = 0; zy = 0; zz = 1; norm = 1;
  }
  zx /= norm; zy /= norm; zz /= norm;
  // x_b = y_c x z_b / |.| with y_c = (-sin yaw, cos yaw, 0): x_b stays in the vertical plane of the yaw
  let xx = c * zz, xy = s * zz, xz = -s * zy - c * zx;
  const nx = Math.sqrt(xx * xx + xy * xy + xz * xz);
  xx /= nx; xy /= nx; xz /= nx;
  // y_b = z_b x x_b
  const yx = zy * xz - zz * xy, yy = zz * xx - zx * xz, yz = zx * xy - zy * xx;
  // R_wb = [x_b y_b z_b] (columns), row-major
  const R = scratch;
  R[0] = xx; R[1] = yx; R[2] = zx;
  R[3] = xy; R[4] = yy; R[5] = zy;
  R[6] = xz; R[7] = yz; R[8] = zz;
  quatFromRotationMatrix(R, out);
  return Math.acos(Math.min(1, zz));
}

/** q <- q * (rotation by angle about body y), in place: the deck's pitch oscillation. */
export function pitchQuaternionInPlace(q: Float64Array, angle: number): Float64Array {
  const c = Math.cos(angle / 2), s = Math.sin(angle / 2);
  const w = q[0]!, x = q[1]!, y = q[2]!, z = q[3]!;
  // (w, x, y, z) * (c, 0, s, 0)
  q[0] = w * c - y * s;
  q[1] = x * c - z * s;
  q[2] = y * c + w * s;
  q[3] = z * c + x * s;
  return q;
}
