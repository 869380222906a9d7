// Quaternions, Hamilton convention, scalar first: q = [w, x, y, z], i j k = -1.
// q_wb rotates a body vector into the world frame: v_w = q_wb ⊗ [0, v_b] ⊗ conj(q_wb).
// Hot-path functions write into `out` and allocate nothing.

/** A quaternion [w, x, y, z] (Hamilton, scalar first). */
export type Quaternion = Float64Array | number[];

/** p ⊗ q (Hamilton product): the rotation q followed by p. `out` may alias p or q. */
export function quatMultiply(p: ArrayLike<number>, q: ArrayLike<number>, out: Float64Array | number[] = new Float64Array(4)): Float64Array | number[] {
  const pw = p[0]!, px = p[1]!, py = p[2]!, pz = p[3]!;
  const qw = q[0]!, qx = q[1]!, qy = q[2]!, qz = q[3]!;
  out[0] = pw * qw - px * qx - py * qy - pz * qz;
  out[1] = pw * qx + px * qw + py * qz - pz * qy;
  out[2] = pw * qy - px * qz + py * qw + pz * qx;
  out[3] = pw * qz + px * qy - py * qx + pz * qw;
  return out;
}

/** conj(q) = [w, -x, -y, -z]: the inverse rotation of a unit quaternion. */
export function quatConjugate(q: ArrayLike<number>, out: Float64Array | number[] = new Float64Array(4)): Float64Array | number[] {
  out[0] = q[0]!;
  out[1] = -q[1]!;
  out[2] = -q[2]!;
  out[3] = -q[3]!;
  return out;
}

/** q / |q|. Throws on a zero or non-finite quaternion (no silent NaN). */
export function quatNormalize(q: ArrayLike<number>, out: Float64Array | number[] = new Float64Array(4)): Float64Array | number[] {
  const norm = Math.hypot(q[0]!, q[1]!, q[2]!, q[3]!);
  if (!(norm > 0) || !Number.isFinite(norm)) throw new RangeError(`quaternion cannot be normalized: [${Array.from(q as ArrayLike<number>).join(', ')}]`);
  out[0] = q[0]! / norm;
  out[1] = q[1]! / norm;
  out[2] = q[2]! / norm;
  out[3] = q[3]! / norm;
  return out;
}

/**
 * Rotate v by the unit quaternion q: q ⊗ [0, v] ⊗ conj(q), written as
 * v' = v + 2 w (u × v) + 2 u × (u × v) with u = (x, y, z). `out` may alias v.
 */
export function quatRotate(q: ArrayLike<number>, v: ArrayLike<number>, out: Float64Array | number[] = new Float64Array(3)): Float64Array | number[] {
  const w = q[0]!, x = q[1]!, y = q[2]!, z = q[3]!;
  const vx = v[0]!, vy = v[1]!, vz = v[2]!;
  // t = 2 u × v
  const tx = 2 * (y * vz - z * vy);
  const ty = 2 * (z * vx - x * vz);
  const tz = 2 * (x * vy - y * vx);
  out[0] = vx + w * tx + (y * tz - z * ty);
  out[1] = vy + w * ty + (z * tx - x * tz);
  out[2] = vz + w * tz + (x * ty - y * tx);
  return out;
}

/** Unit quaternion of a rotation by `angle` (rad) about the unit `axis`. */
export function quatFromAxisAngle(axis: ArrayLike<number>, angle: number, out: Float64Array | number[] = new Float64Array(4)): Float64Array | number[] {
  const norm = Math.hypot(axis[0]!, axis[1]!, axis[2]!);
  if (!(norm > 0)) throw new RangeError('rotation axis must be non-zero');
  const s = Math.sin(angle / 2) / norm;
  out[0] = Math.cos(angle / 2);
  out[1] = axis[0]! * s;
  out[2] = axis[1]! * s;
  out[3] = axis[2]! * s;
  return out;
}
