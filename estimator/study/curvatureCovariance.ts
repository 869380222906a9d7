// The covariance of maximum-likelihood estimates from the curvature of D = -2 ln L at the
// optimum (observed information; for D = -2 ln L the covariance is 2 H⁻¹), by central
// differences in the search coordinates. Used by identifyNoise for its intervals.

/** Step of the finite-difference Hessian in ln θ: 10 %, inside the quadratic region of a well-identified term. */
const HESSIAN_STEP = 0.1;

/**
 * C = 2 H⁻¹, H the Hessian of D at zHat by central differences (step h in ln θ):
 *   H_ii = (D(+h) - 2 D0 + D(-h)) / h²,  H_ij = (D(++) - D(+-) - D(-+) + D(--)) / (4 h²).
 * Terms with H_ii <= 0 (flat or concave) are left out of the inversion and get no variance;
 * null when what is left is not positive definite.
 */
export async function curvatureCovariance(D: (z: readonly number[]) => Promise<number>, zHat: readonly number[], dHat: number, n: number): Promise<Float64Array | null> {
  const h = HESSIAN_STEP;
  const at = async (i: number, si: number, j: number, sj: number) => {
    const z = [...zHat];
    z[i]! += si * h;
    z[j]! += sj * h;
    return D(z);
  };
  const H = new Float64Array(n * n);
  for (let i = 0; i < n; i++) H[i * n + i] = ((await at(i, 1, i, 0)) - 2 * dHat + (await at(i, -1, i, 0))) / (h * h);
  const kept = Array.from({ length: n }, (_, i) => i).filter((i) => H[i * n + i]! > 1e-9 && Number.isFinite(H[i * n + i]!));
  for (const i of kept) {
    for (const j of kept) {
      if (j <= i) continue;
      const v = ((await at(i, 1, j, 1)) - (await at(i, 1, j, -1)) - (await at(i, -1, j, 1)) + (await at(i, -1, j, -1))) / (4 * h * h);
      H[i * n + j] = v;
      H[j * n + i] = v;
    }
  }
  const m = kept.length;
  const C = new Float64Array(n * n);
  if (m === 0) return C;
  const A = kept.flatMap((i) => kept.map((j) => H[i * n + j]!));
  const inv = invertSymmetric(A, m);
  if (inv === null) {
    // Correlations made H indefinite: fall back to each term's own curvature (others held).
    for (const i of kept) C[i * n + i] = 2 / H[i * n + i]!;
    return C;
  }
  kept.forEach((i, a) => kept.forEach((j, b) => (C[i * n + j] = 2 * inv[a * m + b]!)));
  return C;
}

/** Inverse of a small symmetric positive-definite matrix by Gauss–Jordan; null when a pivot is not positive. */
function invertSymmetric(A: number[], m: number): number[] | null {
  const a = A.slice(), inv = Array.from({ length: m * m }, (_, k) => (k % (m + 1) === 0 ? 1 : 0));
  for (let c = 0; c < m; c++) {
    const pivot = a[c * m + c]!;
    if (!(pivot > 0)) return null;
    for (let k = 0; k < m; k++) {
      a[c * m + k]! /= pivot;
      inv[c * m + k]! /= pivot;
    }
    for (let r = 0; r < m; r++) {
      if (r === c) continue;
      const f = a[r * m + c]!;
      for (let k = 0; k < m; k++) {
        a[r * m + k]! -= f * a[c * m + k]!;
        inv[r * m + k]! -= f * inv[c * m + k]!;
      }
    }
  }
  return inv;
}
