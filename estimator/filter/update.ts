// EKF / KF measurement update for a dense H, in place and allocation-free:
//   S = H P Hᵀ + R,  K = P Hᵀ S⁻¹,  x ← x + K y,
//   P ← (I - K H) P (I - K H)ᵀ + K R Kᵀ   (Joseph form: Bucy & Joseph 1968; stays symmetric
//   positive semi-definite for any gain, unlike (I - K H) P).
// Call innovationCovariance, set ws.y, optionally gate on normalizedInnovationSquared, then updateJoseph.
import { cholesky, invertSymmetricPositiveDefinite } from './cholesky.js';
import type { UpdateWorkspace } from './UpdateWorkspace.js';

/** R (or any matrix named `name`) is not symmetric positive definite. */
export class NotPositiveDefiniteError extends RangeError {
  constructor(readonly matrix: string) {
    super(`${matrix} is not symmetric positive definite`);
    this.name = 'NotPositiveDefiniteError';
  }
}

/** Throws NotPositiveDefiniteError unless A (m x m) is symmetric and positive definite. */
export function assertPositiveDefinite(A: ArrayLike<number>, m: number, name: string, work: Float64Array): void {
  for (let i = 0; i < m; i++) {
    for (let j = i + 1; j < m; j++) {
      const a = A[i * m + j]!, b = A[j * m + i]!;
      if (!(Math.abs(a - b) <= 1e-12 * (Math.abs(a) + Math.abs(b)) || a === b)) throw new NotPositiveDefiniteError(name);
    }
  }
  if (!cholesky(A, m, work)) throw new NotPositiveDefiniteError(name);
}

/** U = P Hᵀ, S = H U + R, S⁻¹ into ws. Returns false when S is not positive definite. */
export function innovationCovariance(P: ArrayLike<number>, H: ArrayLike<number>, R: ArrayLike<number>, n: number, m: number, ws: UpdateWorkspace): boolean {
  const { U, S } = ws;
  for (let i = 0; i < n; i++) {
    for (let a = 0; a < m; a++) {
      let sum = 0;
      for (let k = 0; k < n; k++) sum += P[i * n + k]! * H[a * n + k]!;
      U[i * m + a] = sum;
    }
  }
  for (let a = 0; a < m; a++) {
    for (let b = a; b < m; b++) {
      let sum = R[a * m + b]!;
      for (let k = 0; k < n; k++) sum += H[a * n + k]! * U[k * m + b]!;
      S[a * m + b] = sum;
      S[b * m + a] = sum;
    }
  }
  return invertSymmetricPositiveDefinite(S, m, ws.Sinv, ws.chol);
}

/** NIS = yᵀ S⁻¹ y from ws.y and ws.Sinv; also stored in ws.nis. */
export function normalizedInnovationSquared(ws: UpdateWorkspace, m: number): number {
  const { y, Sinv } = ws;
  let nis = 0;
  for (let a = 0; a < m; a++) {
    let row = 0;
    for (let b = 0; b < m; b++) row += Sinv[a * m + b]! * y[b]!;
    nis += y[a]! * row;
  }
  ws.nis = nis;
  return nis;
}

/** K = U S⁻¹ into ws.K (n x m). */
export function gain(ws: UpdateWorkspace, n: number, m: number): void {
  const { U, Sinv, K } = ws;
  for (let i = 0; i < n; i++) {
    for (let b = 0; b < m; b++) {
      let sum = 0;
      for (let a = 0; a < m; a++) sum += U[i * m + a]! * Sinv[a * m + b]!;
      K[i * m + b] = sum;
    }
  }
}

/**
 * x ← x + K y; P ← (I - K H) P (I - K H)ᵀ + K R Kᵀ with the textbook Joseph form
 * (upper triangle computed, then mirrored). Requires innovationCovariance and ws.y first.
 */
export function updateJoseph(x: Float64Array, P: Float64Array, H: ArrayLike<number>, R: ArrayLike<number>, n: number, m: number, ws: UpdateWorkspace): void {
  gain(ws, n, m);
  const { K, y, A, T } = ws;
  for (let i = 0; i < n; i++) {
    let dx = 0;
    for (let a = 0; a < m; a++) dx += K[i * m + a]! * y[a]!;
    x[i] = x[i]! + dx;
  }
  // A = I - K H
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      let sum = i === j ? 1 : 0;
      for (let a = 0; a < m; a++) sum -= K[i * m + a]! * H[a * n + j]!;
      A[i * n + j] = sum;
    }
  }
  // T = A P
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      let sum = 0;
      for (let k = 0; k < n; k++) sum += A[i * n + k]! * P[k * n + j]!;
      T[i * n + j] = sum;
    }
  }
  // P = T Aᵀ + K R Kᵀ (upper triangle, mirrored)
  for (let i = 0; i < n; i++) {
    for (let j = i; j < n; j++) {
      let sum = 0;
      for (let k = 0; k < n; k++) sum += T[i * n + k]! * A[j * n + k]!;
      for (let a = 0; a < m; a++) {
        let kr = 0;
        for (let b = 0; b < m; b++) kr += K[i * m + b]! * R[b * m + a]!;
        sum += kr * K[j * m + a]!;
      }
      P[i * n + j] = sum;
      P[j * n + i] = sum;
    }
  }
}
