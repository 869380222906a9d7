// Replay against a reference (truth.csv): NEES of the relative position + relative velocity
// block (dim 6, the same definition the simulator reports: sim/relativeNees.ts) and RMS
// errors of r and of vC - vL. add() allocates nothing (scratch preallocated).
import { relativeNees } from '../../sim/relativeNees.js';

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
  private count = 0;
  private neesCount = 0;
  private neesSum = 0;
  private positionSquares = 0;
  private velocitySquares = 0;
  private notPositiveDefinite = 0;

  /**
   * Compare state x with covariance P (n x n, row-major) against a truth row
   * [t, rx, ry, rz, vcx, vcy, vcz, vlx, vly, vlz]; returns this row's NEES (NaN if not PD).
   */
  add(x: ArrayLike<number>, P: ArrayLike<number>, n: number, truth: ArrayLike<number>): number {
    for (let i = 0; i < 3; i++) {
      this.r[i] = truth[1 + i]!;
      this.vC[i] = truth[4 + i]!;
      this.vL[i] = truth[7 + i]!;
      const dr = x[i]! - this.r[i]!;
      const dv = x[3 + i]! - x[6 + i]! - (this.vC[i]! - this.vL[i]!);
      this.positionSquares += dr * dr;
      this.velocitySquares += dv * dv;
    }
    this.count++;
    const nees = relativeNees(x, P, n, this.r, this.vC, this.vL);
    if (Number.isNaN(nees)) this.notPositiveDefinite++;
    else {
      this.neesSum += nees;
      this.neesCount++;
    }
    return nees;
  }

  summary(): TruthSummary {
    return {
      count: this.count,
      neesMean: this.neesCount > 0 ? this.neesSum / this.neesCount : Number.NaN,
      neesCount: this.neesCount,
      neesDim: 6,
      positionRmse: this.count > 0 ? Math.sqrt(this.positionSquares / this.count) : Number.NaN,
      velocityRmse: this.count > 0 ? Math.sqrt(this.velocitySquares / this.count) : Number.NaN,
      notPositiveDefinite: this.notPositiveDefinite,
    };
  }
}
