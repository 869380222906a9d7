// Preallocated scratch for measurement updates of an n-state filter with up to mMax
// measurements, so the update hot path allocates nothing. Intermediate results (U = P Hᵀ,
// S, S⁻¹, K, y, NIS) stay here after an update for inspection (see symbols.ts).

export class UpdateWorkspace {
  /** U = P Hᵀ, n x m. */
  readonly U: Float64Array;
  /** S = H P Hᵀ + R and its inverse, m x m. */
  readonly S: Float64Array;
  readonly Sinv: Float64Array;
  /** K = U S⁻¹, n x m. */
  readonly K: Float64Array;
  /** K S, n x m (Joseph term K S Kᵀ). */
  readonly KS: Float64Array;
  /** Innovation y = z - h(x), m. Callers write it before the update. */
  readonly y: Float64Array;
  /** Cholesky scratch, 2 m². */
  readonly chol: Float64Array;
  /** Dense scratch for the textbook Joseph form, n x n each. */
  readonly A: Float64Array;
  readonly T: Float64Array;
  /** NIS of the last innovation evaluated. */
  nis = Number.NaN;

  constructor(readonly n: number, readonly mMax: number) {
    this.U = new Float64Array(n * mMax);
    this.S = new Float64Array(mMax * mMax);
    this.Sinv = new Float64Array(mMax * mMax);
    this.K = new Float64Array(n * mMax);
    this.KS = new Float64Array(n * mMax);
    this.y = new Float64Array(mMax);
    this.chol = new Float64Array(2 * mMax * mMax);
    this.A = new Float64Array(n * n);
    this.T = new Float64Array(n * n);
  }
}
