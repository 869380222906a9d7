// Small linear models shared by the filter-core tests (not a test file).

/** Discrete white-noise acceleration model: Q = σv² [[T⁴/4, T³/2], [T³/2, T²]] (Bar-Shalom et al. 2001). */
export function constantVelocity(T: number, sigmaV: number): { F: Float64Array; Q: Float64Array } {
  const q = sigmaV * sigmaV;
  return {
    F: new Float64Array([1, T, 0, 1]),
    Q: new Float64Array([(q * T ** 4) / 4, (q * T ** 3) / 2, (q * T ** 3) / 2, q * T * T]),
  };
}
