// Rotation matrices are 3x3, row-major Float64Array(9). R_ab maps frame-b vectors into frame a.
// rotationMatrixFromQuat(q_wb) = R_wb, so v_w = R_wb v_b. Allocation-free with `out`.

/** R(q) for a unit Hamilton quaternion [w, x, y, z] (row-major 3x3). */
export function rotationMatrixFromQuat(q: ArrayLike<number>, out: Float64Array = new Float64Array(9)): Float64Array {
  const w = q[0]!, x = q[1]!, y = q[2]!, z = q[3]!;
  const xx = x * x, yy = y * y, zz = z * z;
  const xy = x * y, xz = x * z, yz = y * z, wx = w * x, wy = w * y, wz = w * z;
  out[0] = 1 - 2 * (yy + zz); out[1] = 2 * (xy - wz); out[2] = 2 * (xz + wy);
  out[3] = 2 * (xy + wz); out[4] = 1 - 2 * (xx + zz); out[5] = 2 * (yz - wx);
  out[6] = 2 * (xz - wy); out[7] = 2 * (yz + wx); out[8] = 1 - 2 * (xx + yy);
  return out;
}

/** Unit quaternion of a proper rotation matrix (Shepperd's branch choice for stability). */
export function quatFromRotationMatrix(R: ArrayLike<number>, out: Float64Array | number[] = new Float64Array(4)): Float64Array | number[] {
  const m00 = R[0]!, m01 = R[1]!, m02 = R[2]!, m10 = R[3]!, m11 = R[4]!, m12 = R[5]!, m20 = R[6]!, m21 = R[7]!, m22 = R[8]!;
  const trace = m00 + m11 + m22;
  if (trace > 0) {
    const s = 2 * Math.sqrt(trace + 1);
    out[0] = s / 4; out[1] = (m21 - m12) / s; out[2] = (m02 - m20) / s; out[3] = (m10 - m01) / s;
  } else if (m00 > m11 && m00 > m22) {
    const s = 2 * Math.sqrt(1 + m00 - m11 - m22);
    out[0] = (m21 - m12) / s; out[1] = s / 4; out[2] = (m01 + m10) / s; out[3] = (m02 + m20) / s;
  } else if (m11 > m22) {
    const s = 2 * Math.sqrt(1 + m11 - m00 - m22);
    out[0] = (m02 - m20) / s; out[1] = (m01 + m10) / s; out[2] = s / 4; out[3] = (m12 + m21) / s;
  } else {
    const s = 2 * Math.sqrt(1 + m22 - m00 - m11);
    out[0] = (m10 - m01) / s; out[1] = (m02 + m20) / s; out[2] = (m12 + m21) / s; out[3] = s / 4;
  }
  if (out[0]! < 0) for (let i = 0; i < 4; i++) out[i] = -out[i]!;
  return out;
}

/** out = A B for row-major 3x3 matrices. `out` must not alias A or B. */
export function mat3Multiply(A: ArrayLike<number>, B: ArrayLike<number>, out: Float64Array = new Float64Array(9)): Float64Array {
  for (let i = 0; i < 3; i++) {
    const a0 = A[3 * i]!, a1 = A[3 * i + 1]!, a2 = A[3 * i + 2]!;
    out[3 * i] = a0 * B[0]! + a1 * B[3]! + a2 * B[6]!;
    out[3 * i + 1] = a0 * B[1]! + a1 * B[4]! + a2 * B[7]!;
    out[3 * i + 2] = a0 * B[2]! + a1 * B[5]! + a2 * B[8]!;
  }
  return out;
}

/** out = Aᵀ (3x3). `out` must not alias A. */
export function mat3Transpose(A: ArrayLike<number>, out: Float64Array = new Float64Array(9)): Float64Array {
  out[0] = A[0]!; out[1] = A[3]!; out[2] = A[6]!;
  out[3] = A[1]!; out[4] = A[4]!; out[5] = A[7]!;
  out[6] = A[2]!; out[7] = A[5]!; out[8] = A[8]!;
  return out;
}

/** out = A v (3x3 times 3-vector). `out` may not alias v. */
export function mat3MultiplyVector(A: ArrayLike<number>, v: ArrayLike<number>, out: Float64Array | number[] = new Float64Array(3)): Float64Array | number[] {
  const v0 = v[0]!, v1 = v[1]!, v2 = v[2]!;
  out[0] = A[0]! * v0 + A[1]! * v1 + A[2]! * v2;
  out[1] = A[3]! * v0 + A[4]! * v1 + A[5]! * v2;
  out[2] = A[6]! * v0 + A[7]! * v1 + A[8]! * v2;
  return out;
}

/** out = Aᵀ v (3x3 transposed times 3-vector). */
export function mat3TransposeMultiplyVector(A: ArrayLike<number>, v: ArrayLike<number>, out: Float64Array | number[] = new Float64Array(3)): Float64Array | number[] {
  const v0 = v[0]!, v1 = v[1]!, v2 = v[2]!;
  out[0] = A[0]! * v0 + A[3]! * v1 + A[6]! * v2;
  out[1] = A[1]! * v0 + A[4]! * v1 + A[7]! * v2;
  out[2] = A[2]! * v0 + A[5]! * v1 + A[8]! * v2;
  return out;
}
