// Replay against a reference (truth.csv): NEES of the relative position + relative velocity
// block (dim 6) and RMS errors of r and of vC - vL, through the simulator's own EstimateErrors,
// so both report the same numbers. add() allocates nothing (scratch preallocated).
import { EstimateErrors } from '../../sim/EstimateErrors.js';
import { DESCENT_HEIGHT_BINS, descentHeightBin } from '../../sim/descentHeightBins.js';

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
  /** Mean NEES per true-height bin (height = -r_z of truth, bins of DESCENT_HEIGHT_EDGES); null where no row fell. A log has no phases, so every row counts. */
  neesByHeight: (number | null)[];
}

export class TruthComparison {
  private readonly r = new Float64Array(3);
  private readonly vC = new Float64Array(3);
  private readonly vL = new Float64Array(3);
  private readonly errors = new EstimateErrors();
  private readonly heightSum = new Float64Array(DESCENT_HEIGHT_BINS);
  private readonly heightCount = new Float64Array(DESCENT_HEIGHT_BINS);

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
    const nees = this.errors.add(x, P, n, this.r, this.vC, this.vL);
    if (Number.isFinite(nees)) {
      const bin = descentHeightBin(-this.r[2]!);
      this.heightSum[bin] += nees;
      this.heightCount[bin] += 1;
    }
    return nees;
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
      neesByHeight: Array.from(this.heightSum, (sum, i) => (this.heightCount[i]! > 0 ? sum / this.heightCount[i]! : null)),
    };
  }
}
