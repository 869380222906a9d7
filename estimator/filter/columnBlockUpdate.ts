// Fast measurement update when H is zero outside one block of k consecutive columns
// (H = [0 … Hb … 0], Hb m x k starting at column c) — the shape of every landing-filter
// measurement. In place and allocation-free. Same equations as update.ts:
//   U = P Hᵀ = P[:, c:c+k] Hbᵀ,  S = Hb U[c:c+k, :] + R,  K = U S⁻¹,  x ← x + K y,
//   Joseph form expanded for this H:  (I - K H) P (I - K H)ᵀ + K R Kᵀ = P - K Uᵀ - U Kᵀ + (K S) Kᵀ,
// exact for any gain K; upper triangle computed and mirrored so P stays symmetric
// (a rearranged Joseph update that is not mirrored drifts asymmetric and diverges).
import { invertSymmetricPositiveDefinite } from './cholesky.js';
import { gain } from './update.js';
import type { UpdateWorkspace } from './UpdateWorkspace.js';

/** U, S and S⁻¹ into ws for H = [0 … Hb … 0]. Returns false when S is not positive definite. */
export function innovationCovarianceColumnBlock(P: ArrayLike<number>, Hb: ArrayLike<number>, col: number, k: number, R: ArrayLike<number>, n: number, m: number, ws: UpdateWorkspace): boolean {
  const { U, S } = ws;
  for (let i = 0; i < n; i++) {
    const row = i * n + col;
    for (let a = 0; a < m; a++) {
      let sum = 0;
      for (let j = 0; j < k; j++) sum += P[row + j]! * Hb[a * k + j]!;
      U[i * m + a] = sum;
    }
  }
  for (let a = 0; a < m; a++) {
    for (let b = a; b < m; b++) {
      let sum = R[a * m + b]!;
      for (let j = 0; j < k; j++) sum += Hb[a * k + j]! * U[(col + j) * m + b]!;
      S[a * m + b] = sum;
      S[b * m + a] = sum;
    }
  }
  return invertSymmetricPositiveDefinite(S, m, ws.Sinv, ws.chol);
}

/**
 * innovationCovarianceColumnBlock for H non-zero in a block of k consecutive columns from `col`
 * plus one more column `extra` outside it (a measurement that also sees the deck-scale state,
 * last in x): Hb is m x (k + 1) row-major, its last column for `extra`.
 *   U = P[:, cols] Hbᵀ,  S = Hb U[cols, :] + R,  cols = (col … col + k - 1, extra)
 * updateJosephColumnBlock then applies it unchanged (it needs only U, S and y).
 */
export function innovationCovarianceColumnBlockAndColumn(P: ArrayLike<number>, Hb: ArrayLike<number>, col: number, k: number, extra: number, R: ArrayLike<number>, n: number, m: number, ws: UpdateWorkspace): boolean {
  const { U, S } = ws;
  const width = k + 1;
  for (let i = 0; i < n; i++) {
    const row = i * n + col, pe = P[i * n + extra]!;
    for (let a = 0; a < m; a++) {
      let sum = 0;
      for (let j = 0; j < k; j++) sum += P[row + j]! * Hb[a * width + j]!;
      U[i * m + a] = sum + pe * Hb[a * width + k]!;
    }
  }
  for (let a = 0; a < m; a++) {
    for (let b = a; b < m; b++) {
      let sum = R[a * m + b]!;
      for (let j = 0; j < k; j++) sum += Hb[a * width + j]! * U[(col + j) * m + b]!;
      sum += Hb[a * width + k]! * U[extra * m + b]!;
      S[a * m + b] = sum;
      S[b * m + a] = sum;
    }
  }
  return invertSymmetricPositiveDefinite(S, m, ws.Sinv, ws.chol);
}

/**
 * innovationCovarianceColumnBlock for H non-zero in two blocks of consecutive columns: k from
 * `col` and k2 from `col2` (a measurement that also sees trailing constant states, such as the
 * pointing biases and the deck scale): Hb is m x (k + k2) row-major, the second block last.
 *   U = P[:, cols] Hbᵀ,  S = Hb U[cols, :] + R
 */
export function innovationCovarianceColumnBlocks(P: ArrayLike<number>, Hb: ArrayLike<number>, col: number, k: number, col2: number, k2: number, R: ArrayLike<number>, n: number, m: number, ws: UpdateWorkspace): boolean {
  const { U, S } = ws;
  const width = k + k2;
  for (let i = 0; i < n; i++) {
    const row = i * n + col, row2 = i * n + col2;
    for (let a = 0; a < m; a++) {
      let sum = 0;
      for (let j = 0; j < k; j++) sum += P[row + j]! * Hb[a * width + j]!;
      for (let j = 0; j < k2; j++) sum += P[row2 + j]! * Hb[a * width + k + j]!;
      U[i * m + a] = sum;
    }
  }
  for (let a = 0; a < m; a++) {
    for (let b = a; b < m; b++) {
      let sum = R[a * m + b]!;
      for (let j = 0; j < k; j++) sum += Hb[a * width + j]! * U[(col + j) * m + b]!;
      for (let j = 0; j < k2; j++) sum += Hb[a * width + k + j]! * U[(col2 + j) * m + b]!;
      S[a * m + b] = sum;
      S[b * m + a] = sum;
    }
  }
  return invertSymmetricPositiveDefinite(S, m, ws.Sinv, ws.chol);
}

/** x ← x + K y and P ← P - K Uᵀ - U Kᵀ + (K S) Kᵀ; needs innovationCovarianceColumnBlock and ws.y. */
export function updateJosephColumnBlock(x: Float64Array, P: Float64Array, n: number, m: number, ws: UpdateWorkspace): void {
  gain(ws, n, m);
  const { K, U, S, KS, y } = ws;
  for (let i = 0; i < n; i++) {
    let dx = 0;
    for (let a = 0; a < m; a++) {
      dx += K[i * m + a]! * y[a]!;
      let ks = 0;
      for (let b = 0; b < m; b++) ks += K[i * m + b]! * S[b * m + a]!;
      KS[i * m + a] = ks;
    }
    x[i] = x[i]! + dx;
  }
  for (let i = 0; i < n; i++) {
    const ri = i * m;
    for (let j = i; j < n; j++) {
      const rj = j * m;
      let sum = P[i * n + j]!;
      for (let a = 0; a < m; a++) sum += (KS[ri + a]! - U[ri + a]!) * K[rj + a]! - K[ri + a]! * U[rj + a]!;
      P[i * n + j] = sum;
      P[j * n + i] = sum;
    }
  }
}
