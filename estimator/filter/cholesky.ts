// Cholesky factorization and SPD inverse for small matrices, in place and allocation-free
// (up to 32 x 32; larger matrices allocate one scratch vector).

const RECIPROCALS = new Float64Array(32); // 1 / L_jj of the running factorization

/**
 * Lower-triangular L with A = L Lᵀ into `L` (row-major m x m; the strict upper part is zeroed).
 * Returns false when A is not (numerically) positive definite or not finite.
 */
export function cholesky(A: ArrayLike<number>, m: number, L: Float64Array): boolean {
  const recip = RECIPROCALS.length >= m ? RECIPROCALS : new Float64Array(m);
  for (let i = 0; i < m; i++) {
    const ri = i * m;
    for (let j = 0; j < i; j++) {
      const rj = j * m;
      let sum = A[ri + j]!;
      for (let k = 0; k < j; k++) sum -= L[ri + k]! * L[rj + k]!;
      L[ri + j] = sum * recip[j]!;
    }
    let diag = A[ri + i]!;
    for (let k = 0; k < i; k++) diag -= L[ri + k]! * L[ri + k]!;
    if (!(diag > 0) || !Number.isFinite(diag)) return false;
    const root = Math.sqrt(diag);
    L[ri + i] = root;
    recip[i] = 1 / root;
    for (let j = i + 1; j < m; j++) L[ri + j] = 0;
  }
  return true;
}

/**
 * A⁻¹ of a symmetric positive definite A (m x m) into `out`, via A = L Lᵀ, A⁻¹ = L⁻ᵀ L⁻¹.
 * `work` holds 2 m² numbers. Returns false (out untouched) when A is not positive definite.
 */
export function invertSymmetricPositiveDefinite(A: ArrayLike<number>, m: number, out: Float64Array, work: Float64Array): boolean {
  const L = work; // first m² entries
  if (!cholesky(A, m, L)) return false;
  const Linv = work.subarray(m * m, 2 * m * m);
  // Forward substitution for L⁻¹ (lower triangular).
  for (let i = 0; i < m; i++) {
    Linv[i * m + i] = 1 / L[i * m + i]!;
    for (let j = 0; j < i; j++) {
      let sum = 0;
      for (let k = j; k < i; k++) sum -= L[i * m + k]! * Linv[k * m + j]!;
      Linv[i * m + j] = sum / L[i * m + i]!;
    }
    for (let j = i + 1; j < m; j++) Linv[i * m + j] = 0;
  }
  // A⁻¹ = L⁻ᵀ L⁻¹, symmetric: compute the upper triangle and mirror.
  for (let i = 0; i < m; i++) {
    for (let j = i; j < m; j++) {
      let sum = 0;
      for (let k = j; k < m; k++) sum += Linv[k * m + i]! * Linv[k * m + j]!;
      out[i * m + j] = sum;
      out[j * m + i] = sum;
    }
  }
  return true;
}
