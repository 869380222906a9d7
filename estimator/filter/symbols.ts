// The estimation symbols, documented once for the whole filter core. All matrices are
// row-major Float64Array; the filter functions work in place and allocate nothing.
//
//   x  state estimate, n            (units per state element; e.g. m, m/s, m/s²)
//   P  state covariance, n x n      (x units squared), symmetric positive definite
//   F  state transition, n x n      (x_k = F x_{k-1} for a linear model; Jacobian otherwise)
//   Q  process noise covariance, n x n, added in the predict step
//   z  measurement, m
//   H  measurement matrix / Jacobian ∂h/∂x, m x n
//   R  measurement noise covariance, m x m, symmetric positive definite
//   y  innovation z - h(x), m
//   S  innovation covariance H P Hᵀ + R, m x m
//   K  gain P Hᵀ S⁻¹, n x m
//   NIS  normalized innovation squared yᵀ S⁻¹ y (chi-square, m degrees of freedom, when consistent)

/** Largest measurement dimension the workspaces support. */
export const MAX_MEASUREMENT_DIMENSION = 6;
