// NEES of the relative position + relative velocity block (dim 6) of the landing filter.
// Allocation-free. With the filter state x = [r, vC, vL, ...] and P (n x n):
//   e = [r̂ - r, (v̂C - v̂L) - (vC - vL)],  C = T P Tᵀ with T = [[I, 0, 0], [0, I, -I]]
//   C_rr = P_rr,  C_rv = P_rc - P_rl,  C_vv = P_cc - P_cl - P_lc + P_ll
//   NEES = eᵀ C⁻¹ e   (Cholesky C = L Lᵀ, then |L⁻¹ e|²)
// Returns NaN when C is not positive definite.
// Written out in full (the lower triangle of C and of L in locals c_ij, row i, column j): it runs
// at every filter step, and the loop form with a scratch array cost four times as much. The
// operations and their order are those of the textbook loops (column by column, then forward
// substitution), so the result is the same to the last bit.

/**
 * @param x filter state, P its covariance (n x n row-major)
 * @param rTrue, vCTrue, vLTrue truth at the filter's time (m, m/s, world ENU)
 */
export function relativeNees(
  x: ArrayLike<number>, P: ArrayLike<number>, n: number,
  rTrue: ArrayLike<number>, vCTrue: ArrayLike<number>, vLTrue: ArrayLike<number>,
): number {
  const e0 = x[0]! - rTrue[0]!, e1 = x[1]! - rTrue[1]!, e2 = x[2]! - rTrue[2]!;
  const e3 = x[3]! - x[6]! - (vCTrue[0]! - vLTrue[0]!);
  const e4 = x[4]! - x[7]! - (vCTrue[1]! - vLTrue[1]!);
  const e5 = x[5]! - x[8]! - (vCTrue[2]! - vLTrue[2]!);
  const c00 = P[0]!;
  let c10 = P[n + 0]!;
  const c11 = P[n + 1]!;
  let c20 = P[2 * n + 0]!;
  let c21 = P[2 * n + 1]!;
  const c22 = P[2 * n + 2]!;
  let c30 = P[3]! - P[6]!;
  let c31 = P[n + 3]! - P[n + 6]!;
  let c32 = P[2 * n + 3]! - P[2 * n + 6]!;
  let c40 = P[4]! - P[7]!;
  let c41 = P[n + 4]! - P[n + 7]!;
  let c42 = P[2 * n + 4]! - P[2 * n + 7]!;
  let c50 = P[5]! - P[8]!;
  let c51 = P[n + 5]! - P[n + 8]!;
  let c52 = P[2 * n + 5]! - P[2 * n + 8]!;
  const c33 = P[3 * n + 3]! - P[3 * n + 6]! - P[6 * n + 3]! + P[6 * n + 6]!;
  let c43 = P[4 * n + 3]! - P[4 * n + 6]! - P[7 * n + 3]! + P[7 * n + 6]!;
  const c44 = P[4 * n + 4]! - P[4 * n + 7]! - P[7 * n + 4]! + P[7 * n + 7]!;
  let c53 = P[5 * n + 3]! - P[5 * n + 6]! - P[8 * n + 3]! + P[8 * n + 6]!;
  let c54 = P[5 * n + 4]! - P[5 * n + 7]! - P[8 * n + 4]! + P[8 * n + 7]!;
  const c55 = P[5 * n + 5]! - P[5 * n + 8]! - P[8 * n + 5]! + P[8 * n + 8]!;
  const d0 = c00;
  if (!(d0 > 0)) return Number.NaN;
  const l0 = Math.sqrt(d0);
  c10 = c10 / l0;
  c20 = c20 / l0;
  c30 = c30 / l0;
  c40 = c40 / l0;
  c50 = c50 / l0;
  const d1 = c11 - c10 * c10;
  if (!(d1 > 0)) return Number.NaN;
  const l1 = Math.sqrt(d1);
  c21 = (c21 - c20 * c10) / l1;
  c31 = (c31 - c30 * c10) / l1;
  c41 = (c41 - c40 * c10) / l1;
  c51 = (c51 - c50 * c10) / l1;
  const d2 = c22 - c20 * c20 - c21 * c21;
  if (!(d2 > 0)) return Number.NaN;
  const l2 = Math.sqrt(d2);
  c32 = (c32 - c30 * c20 - c31 * c21) / l2;
  c42 = (c42 - c40 * c20 - c41 * c21) / l2;
  c52 = (c52 - c50 * c20 - c51 * c21) / l2;
  const d3 = c33 - c30 * c30 - c31 * c31 - c32 * c32;
  if (!(d3 > 0)) return Number.NaN;
  const l3 = Math.sqrt(d3);
  c43 = (c43 - c40 * c30 - c41 * c31 - c42 * c32) / l3;
  c53 = (c53 - c50 * c30 - c51 * c31 - c52 * c32) / l3;
  const d4 = c44 - c40 * c40 - c41 * c41 - c42 * c42 - c43 * c43;
  if (!(d4 > 0)) return Number.NaN;
  const l4 = Math.sqrt(d4);
  c54 = (c54 - c50 * c40 - c51 * c41 - c52 * c42 - c53 * c43) / l4;
  const d5 = c55 - c50 * c50 - c51 * c51 - c52 * c52 - c53 * c53 - c54 * c54;
  if (!(d5 > 0)) return Number.NaN;
  const l5 = Math.sqrt(d5);
  const z0 = e0 / l0;
  const z1 = (e1 - c10 * z0) / l1;
  const z2 = (e2 - c20 * z0 - c21 * z1) / l2;
  const z3 = (e3 - c30 * z0 - c31 * z1 - c32 * z2) / l3;
  const z4 = (e4 - c40 * z0 - c41 * z1 - c42 * z2 - c43 * z3) / l4;
  const z5 = (e5 - c50 * z0 - c51 * z1 - c52 * z2 - c53 * z3 - c54 * z4) / l5;
  return ((((z0 * z0 + z1 * z1) + z2 * z2) + z3 * z3) + z4 * z4) + z5 * z5;
}
