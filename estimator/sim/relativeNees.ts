// NEES of the relative position + relative velocity block (dim 6) of the landing filter.
// Allocation-free (module scratch). With the filter state x = [r, vC, vL, ...] and P (n x n):
//   e = [r̂ - r, (v̂C - v̂L) - (vC - vL)],  C = T P Tᵀ with T = [[I, 0, 0], [0, I, -I]]
//   C_rr = P_rr,  C_rv = P_rc - P_rl,  C_vv = P_cc - P_cl - P_lc + P_ll
//   NEES = eᵀ C⁻¹ e   (Cholesky C = L Lᵀ, then |L⁻¹ e|²)
// Returns NaN when C is not positive definite.

const C = new Float64Array(36);
const e = new Float64Array(6);

/**
 * @param x filter state, P its covariance (n x n row-major)
 * @param rTrue, vCTrue, vLTrue truth at the filter's time (m, m/s, world ENU)
 */
export function relativeNees(
  x: ArrayLike<number>, P: ArrayLike<number>, n: number,
  rTrue: ArrayLike<number>, vCTrue: ArrayLike<number>, vLTrue: ArrayLike<number>,
): number {
  for (let i = 0; i < 3; i++) {
    e[i] = x[i]! - rTrue[i]!;
    e[3 + i] = x[3 + i]! - x[6 + i]! - (vCTrue[i]! - vLTrue[i]!);
  }
  for (let i = 0; i < 3; i++) {
    for (let j = 0; j < 3; j++) {
      C[6 * i + j] = P[i * n + j]!;
      const rv = P[i * n + 3 + j]! - P[i * n + 6 + j]!;
      C[6 * i + 3 + j] = rv;
      C[6 * (3 + j) + i] = rv;
      C[6 * (3 + i) + 3 + j] = P[(3 + i) * n + 3 + j]! - P[(3 + i) * n + 6 + j]! - P[(6 + i) * n + 3 + j]! + P[(6 + i) * n + 6 + j]!;
    }
  }
  // in-place Cholesky (lower triangle), forward substitution on e
  for (let j = 0; j < 6; j++) {
    let d = C[6 * j + j]!;
    for (let k = 0; k < j; k++) d -= C[6 * j + k]! * C[6 * j + k]!;
    if (!(d > 0)) return Number.NaN;
    const l = Math.sqrt(d);
    C[6 * j + j] = l;
    for (let i = j + 1; i < 6; i++) {
      let s = C[6 * i + j]!;
      for (let k = 0; k < j; k++) s -= C[6 * i + k]! * C[6 * j + k]!;
      C[6 * i + j] = s / l;
    }
  }
  let nees = 0;
  for (let i = 0; i < 6; i++) {
    let s = e[i]!;
    for (let k = 0; k < i; k++) s -= C[6 * i + k]! * e[k]!;
    e[i] = s / C[6 * i + i]!;
    nees += e[i]! * e[i]!;
  }
  return nees;
}
