// The column-block update of columnBlockUpdate.ts unrolled for the landing filter's case:
// a 3-dimensional measurement whose H is zero outside 3 consecutive columns (Hb 3x3 at column c).
// Same equations, in place and allocation-free:
//   U = P[:, c:c+3] Hbᵀ,  S = Hb U[c:c+3, :] + R,  S⁻¹ by cofactors (S checked positive definite
//   by its leading minors, Sylvester's criterion),  K = U S⁻¹,  x ← x + K y,
//   P ← P - K Uᵀ - U Kᵀ + (K S) Kᵀ   (Joseph form expanded; upper triangle computed, mirrored).
// For n = 12 and 15 (the landing filters; 13 and 16 with the deck-scale state) updateJoseph3 runs generated straight-line code
// (josephUpdate.generated.ts), bit-identical to the loops, which stay for other n.
import type { UpdateWorkspace } from './UpdateWorkspace.js';
import { updateJoseph12, updateJoseph13, updateJoseph14, updateJoseph15, updateJoseph16, updateJoseph17, updateJoseph18 } from './josephUpdate.generated.js';

/** U, S, S⁻¹ (3x3, row-major in ws) for H = [0 … Hb … 0]. False when S is not positive definite. */
export function innovationCovariance3(P: Float64Array, Hb: Float64Array, col: number, R: Float64Array, n: number, ws: UpdateWorkspace): boolean {
  const U = ws.U, S = ws.S, Si = ws.Sinv;
  const h00 = Hb[0]!, h01 = Hb[1]!, h02 = Hb[2]!, h10 = Hb[3]!, h11 = Hb[4]!, h12 = Hb[5]!, h20 = Hb[6]!, h21 = Hb[7]!, h22 = Hb[8]!;
  for (let i = 0; i < n; i++) {
    const p0 = P[i * n + col]!, p1 = P[i * n + col + 1]!, p2 = P[i * n + col + 2]!;
    U[3 * i] = p0 * h00 + p1 * h01 + p2 * h02;
    U[3 * i + 1] = p0 * h10 + p1 * h11 + p2 * h12;
    U[3 * i + 2] = p0 * h20 + p1 * h21 + p2 * h22;
  }
  const c0 = 3 * col, c1 = c0 + 3, c2 = c0 + 6;
  const s00 = R[0]! + h00 * U[c0]! + h01 * U[c1]! + h02 * U[c2]!;
  const s01 = R[1]! + h00 * U[c0 + 1]! + h01 * U[c1 + 1]! + h02 * U[c2 + 1]!;
  const s02 = R[2]! + h00 * U[c0 + 2]! + h01 * U[c1 + 2]! + h02 * U[c2 + 2]!;
  const s11 = R[4]! + h10 * U[c0 + 1]! + h11 * U[c1 + 1]! + h12 * U[c2 + 1]!;
  const s12 = R[5]! + h10 * U[c0 + 2]! + h11 * U[c1 + 2]! + h12 * U[c2 + 2]!;
  const s22 = R[8]! + h20 * U[c0 + 2]! + h21 * U[c1 + 2]! + h22 * U[c2 + 2]!;
  S[0] = s00; S[1] = s01; S[2] = s02; S[3] = s01; S[4] = s11; S[5] = s12; S[6] = s02; S[7] = s12; S[8] = s22;
  const m00 = s11 * s22 - s12 * s12, m01 = s02 * s12 - s01 * s22, m02 = s01 * s12 - s02 * s11;
  const minor2 = s00 * s11 - s01 * s01;
  const det = s00 * m00 + s01 * m01 + s02 * m02;
  if (!(s00 > 0) || !(minor2 > 0) || !(det > 0) || !Number.isFinite(det)) return false;
  const inv = 1 / det;
  Si[0] = m00 * inv; Si[1] = m01 * inv; Si[2] = m02 * inv;
  Si[4] = (s00 * s22 - s02 * s02) * inv;
  Si[5] = (s01 * s02 - s00 * s12) * inv;
  Si[8] = minor2 * inv;
  Si[3] = Si[1]!; Si[6] = Si[2]!; Si[7] = Si[5]!;
  return true;
}

/** NIS = yᵀ S⁻¹ y for the 3-vector ws.y (stored in ws.nis). */
export function normalizedInnovationSquared3(ws: UpdateWorkspace): number {
  const y = ws.y, Si = ws.Sinv;
  const y0 = y[0]!, y1 = y[1]!, y2 = y[2]!;
  const nis = Si[0]! * y0 * y0 + Si[4]! * y1 * y1 + Si[8]! * y2 * y2 + 2 * (Si[1]! * y0 * y1 + Si[2]! * y0 * y2 + Si[5]! * y1 * y2);
  ws.nis = nis;
  return nis;
}

/** x ← x + K y, P ← P - K Uᵀ - U Kᵀ + (K S) Kᵀ. Returns false when x or P became non-finite. */
export function updateJoseph3(x: Float64Array, P: Float64Array, n: number, ws: UpdateWorkspace): boolean {
  if (n === 12) return updateJoseph12(x, P, ws);
  if (n === 15) return updateJoseph15(x, P, ws);
  if (n === 13) return updateJoseph13(x, P, ws);
  if (n === 16) return updateJoseph16(x, P, ws);
  if (n === 14) return updateJoseph14(x, P, ws);
  if (n === 17) return updateJoseph17(x, P, ws);
  if (n === 18) return updateJoseph18(x, P, ws);
  return updateJoseph3Loops(x, P, n, ws);
}

/** updateJoseph3 by loops, for any n. */
export function updateJoseph3Loops(x: Float64Array, P: Float64Array, n: number, ws: UpdateWorkspace): boolean {
  const U = ws.U, K = ws.K, KS = ws.KS, S = ws.S, Si = ws.Sinv, y = ws.y;
  const i00 = Si[0]!, i01 = Si[1]!, i02 = Si[2]!, i11 = Si[4]!, i12 = Si[5]!, i22 = Si[8]!;
  const s00 = S[0]!, s01 = S[1]!, s02 = S[2]!, s11 = S[4]!, s12 = S[5]!, s22 = S[8]!;
  const y0 = y[0]!, y1 = y[1]!, y2 = y[2]!;
  let finite = 0;
  for (let i = 0; i < n; i++) {
    const u0 = U[3 * i]!, u1 = U[3 * i + 1]!, u2 = U[3 * i + 2]!;
    const k0 = u0 * i00 + u1 * i01 + u2 * i02;
    const k1 = u0 * i01 + u1 * i11 + u2 * i12;
    const k2 = u0 * i02 + u1 * i12 + u2 * i22;
    K[3 * i] = k0; K[3 * i + 1] = k1; K[3 * i + 2] = k2;
    KS[3 * i] = k0 * s00 + k1 * s01 + k2 * s02;
    KS[3 * i + 1] = k0 * s01 + k1 * s11 + k2 * s12;
    KS[3 * i + 2] = k0 * s02 + k1 * s12 + k2 * s22;
    const xi = x[i]! + k0 * y0 + k1 * y1 + k2 * y2;
    x[i] = xi;
    finite += xi * 0;
  }
  // W = K S - U, so P_ij += W_i · K_j - K_i · U_j, upper triangle, mirrored. Rows go in pairs
  // so each K_j, U_j is loaded once for two rows (the entries and their order are unchanged).
  let i = 0;
  for (; i + 1 < n; i += 2) {
    const w0 = KS[3 * i]! - U[3 * i]!, w1 = KS[3 * i + 1]! - U[3 * i + 1]!, w2 = KS[3 * i + 2]! - U[3 * i + 2]!;
    const k0 = K[3 * i]!, k1 = K[3 * i + 1]!, k2 = K[3 * i + 2]!;
    const v0 = KS[3 * i + 3]! - U[3 * i + 3]!, v1 = KS[3 * i + 4]! - U[3 * i + 4]!, v2 = KS[3 * i + 5]! - U[3 * i + 5]!;
    const m0 = K[3 * i + 3]!, m1 = K[3 * i + 4]!, m2 = K[3 * i + 5]!;
    const row = i * n, next = row + n;
    const diagonal = P[row + i]! + (w0 * k0 + w1 * k1 + w2 * k2) - (k0 * U[3 * i]! + k1 * U[3 * i + 1]! + k2 * U[3 * i + 2]!);
    P[row + i] = diagonal;
    let pairFinite = diagonal * 0;
    for (let j = i + 1; j < n; j++) {
      const a0 = K[3 * j]!, a1 = K[3 * j + 1]!, a2 = K[3 * j + 2]!, b0 = U[3 * j]!, b1 = U[3 * j + 1]!, b2 = U[3 * j + 2]!;
      const upper = P[row + j]! + (w0 * a0 + w1 * a1 + w2 * a2) - (k0 * b0 + k1 * b1 + k2 * b2);
      P[row + j] = upper;
      P[j * n + i] = upper;
      const lower = P[next + j]! + (v0 * a0 + v1 * a1 + v2 * a2) - (m0 * b0 + m1 * b1 + m2 * b2);
      P[next + j] = lower;
      if (j > i + 1) P[j * n + i + 1] = lower;
      pairFinite += upper * 0 + lower * 0;
    }
    finite += pairFinite;
  }
  if (i < n) {
    // last row of an odd n: its diagonal only
    const value = P[i * n + i]! + ((KS[3 * i]! - U[3 * i]!) * K[3 * i]! + (KS[3 * i + 1]! - U[3 * i + 1]!) * K[3 * i + 1]! + (KS[3 * i + 2]! - U[3 * i + 2]!) * K[3 * i + 2]!)
      - (K[3 * i]! * U[3 * i]! + K[3 * i + 1]! * U[3 * i + 1]! + K[3 * i + 2]! * U[3 * i + 2]!);
    P[i * n + i] = value;
    finite += value * 0;
  }
  return finite === 0;
}
