// What a measurement (or an IMU step) did to the landing filter.

export type UpdateStatus = 'accepted' | 'gated' | 'rejected' | 'diverged';

/**
 * Outcome of one measurement. nis = yᵀ S⁻¹ y is NaN unless status is 'accepted' or 'gated';
 * reason names why a measurement was gated ('outside-gate'), rejected (e.g. 'box-empty') or
 * the divergence event (e.g. 'covariance-not-positive-definite'); null when accepted.
 */
export interface UpdateResult {
  status: UpdateStatus;
  nis: number;
  dim: number;
  reason: string | null;
}

/** Initial 1-sigma uncertainties (m, m/s, m/s²). */
export interface InitialSigma {
  position: number;
  velocity: number;
  accelBias: number;
}

export function rejected(reason: string, dim = 0): UpdateResult {
  return { status: 'rejected', nis: Number.NaN, dim, reason };
}
