// Replay against a reference (truth.csv): NEES of the relative position + relative velocity
// block (dim 6) and RMS errors of r and of vC - vL, through the simulator's own EstimateErrors,
// so both report the same numbers. add() allocates nothing (scratch preallocated).
import { EstimateErrors } from '../../sim/EstimateErrors.js';

export interface TruthSummary {
  /** Rows compared. */
  count: number;
  /** Mean NEES over `neesCount` rows (rows with a positive-definite block), and its dimension. */
  neesMean: number;
  neesCount: number;
  neesDim: number;
  /** RMS of |r_hat - r| (m) and |(vC - vL)_hat - (vC - vL)| (m/s). */
  positionRmse: number;
  velocityRmse: number;
  /** Rows whose block covariance was not positive definite (NEES not computed, counted). */
  notPositiveDefinite: number;
}

export class TruthComparison {
  private readonly r = new Float64Array(3);
  private readonly vC = new Float64Array(3);
  private readonly vL = new Float64Array(3);
  private readonly errors = new EstimateErrors();

  /**
   * Compare state x with covariance P (n x n, row-major) against a truth row
   * [t, rx, ry, rz, vcx, vcy, vcz, vlx, vly, vlz]; returns this row's NEES (NaN if not PD).
   */
  add(x: ArrayLike<number>, P: ArrayLike<number>, n: number, truth: ArrayLike<number>): number {
    for (let i = 0; i < 3; i++) {
      this.r[i] = truth[1 + i]!;
      this.vC[i] = truth[4 + i]!;
      this.vL[i] = truth[7 + i]!;
    }
    return this.errors.add(x, P, n, this.r, this.vC, this.vL);
  }

  summary(): TruthSummary {
    const e = this.errors;
    return {
      count: e.count,
      neesMean: e.neesMean,
      neesCount: e.neesCount,
      neesDim: 6,
      positionRmse: e.positionRmse,
      velocityRmse: e.velocityRmse,
      notPositiveDefinite: e.notPositiveDefinite,
    };
  }
}
