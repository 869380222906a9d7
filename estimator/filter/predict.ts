// EKF / KF predict for a dense transition matrix, in place and allocation-free.
// For block-structured models (see models/) use their own predict: same equations, fewer flops.

/** x ← F x (linear model). `work` holds n numbers. */
export function predictState(x: Float64Array, F: ArrayLike<number>, n: number, work: Float64Array): void {
  for (let i = 0; i < n; i++) {
    let sum = 0;
    for (let k = 0; k < n; k++) sum += F[i * n + k]! * x[k]!;
    work[i] = sum;
  }
  for (let i = 0; i < n; i++) x[i] = work[i]!;
}

/**
 * P ← F P Fᵀ + Q. The upper triangle is computed and mirrored, so P stays exactly symmetric.
 * `work` holds n² numbers.
 */
export function predictCovariance(P: Float64Array, F: ArrayLike<number>, Q: ArrayLike<number>, n: number, work: Float64Array): void {
  // T = F P
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      let sum = 0;
      for (let k = 0; k < n; k++) sum += F[i * n + k]! * P[k * n + j]!;
      work[i * n + j] = sum;
    }
  }
  // P = T Fᵀ + Q (upper triangle, mirrored)
  for (let i = 0; i < n; i++) {
    for (let j = i; j < n; j++) {
      let sum = Q[i * n + j]!;
      for (let k = 0; k < n; k++) sum += work[i * n + k]! * F[j * n + k]!;
      P[i * n + j] = sum;
      P[j * n + i] = sum;
    }
  }
}
