// Euler angles (ZYX, intrinsic yaw-pitch-roll; degrees) to a Hamilton quaternion [w, x, y, z].
// q = qz(yaw) ⊗ qy(pitch) ⊗ qx(roll), i.e. R = Rz(yaw) Ry(pitch) Rx(roll). For a body
// attitude q_wb in ENU/FLU: yaw from East counter-clockwise, pitch positive nose down
// (right-hand about body y = left), roll positive right side down.

const DEG = Math.PI / 180;

/**
 * @example quatFromEulerDeg(0, 0, 90) // [cos 45°, 0, 0, sin 45°]: body x points North
 */
export function quatFromEulerDeg(rollDeg: number, pitchDeg: number, yawDeg: number, out: Float64Array | number[] = new Float64Array(4)): Float64Array | number[] {
  const hr = (rollDeg * DEG) / 2, hp = (pitchDeg * DEG) / 2, hy = (yawDeg * DEG) / 2;
  const cr = Math.cos(hr), sr = Math.sin(hr);
  const cp = Math.cos(hp), sp = Math.sin(hp);
  const cy = Math.cos(hy), sy = Math.sin(hy);
  out[0] = cy * cp * cr + sy * sp * sr;
  out[1] = cy * cp * sr - sy * sp * cr;
  out[2] = cy * sp * cr + sy * cp * sr;
  out[3] = sy * cp * cr - cy * sp * sr;
  return out;
}

/** Inverse of quatFromEulerDeg: [rollDeg, pitchDeg, yawDeg] (pitch in [-90, 90]). */
export function eulerDegFromQuat(q: ArrayLike<number>, out: Float64Array | number[] = new Float64Array(3)): Float64Array | number[] {
  const w = q[0]!, x = q[1]!, y = q[2]!, z = q[3]!;
  out[0] = Math.atan2(2 * (w * x + y * z), 1 - 2 * (x * x + y * y)) / DEG;
  out[1] = Math.asin(Math.max(-1, Math.min(1, 2 * (w * y - z * x)))) / DEG;
  out[2] = Math.atan2(2 * (w * z + x * y), 1 - 2 * (y * y + z * z)) / DEG;
  return out;
}
