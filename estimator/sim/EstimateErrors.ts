// How far the filter's estimate is from truth, accumulated over comparisons: one definition for
// the simulator (every filter step) and for replay against truth.csv, so record -> replay reports
// the same numbers. Allocation-free.
//   positionRmse = sqrt(mean |r̂ - r|²)                          (m)
//   velocityRmse = sqrt(mean |(v̂C - v̂L) - (vC - vL)|²)         (m/s)
//   neesMean     = mean relative pos+vel NEES (dim 6, relativeNees) over comparisons whose block is
//                  positive definite; the others are counted, never averaged.
// Means over no samples are NaN.
import { relativeNees } from './relativeNees.js';

export class EstimateErrors {
  /** Comparisons made, and those with a finite NEES. */
  count = 0;
  neesCount = 0;
  private neesSum = 0;
  private positionSquares = 0;
  private velocitySquares = 0;

  /**
   * Compare state x (covariance P, n x n row-major) with truth r, vC, vL (world ENU, m and m/s)
   * at the same time; returns this comparison's NEES (NaN when the block is not positive definite).
   */
  add(x: ArrayLike<number>, P: ArrayLike<number>, n: number, r: ArrayLike<number>, vC: ArrayLike<number>, vL: ArrayLike<number>): number {
    let p = 0, v = 0;
    for (let k = 0; k < 3; k++) {
      const dp = x[k]! - r[k]!;
      const dv = x[3 + k]! - x[6 + k]! - (vC[k]! - vL[k]!);
      p += dp * dp;
      v += dv * dv;
    }
    this.positionSquares += p;
    this.velocitySquares += v;
    this.count++;
    const nees = relativeNees(x, P, n, r, vC, vL);
    if (Number.isFinite(nees)) {
      this.neesSum += nees;
      this.neesCount++;
    }
    return nees;
  }

  /** Comparisons whose pos+vel block was not positive definite (NEES not computed). */
  get notPositiveDefinite(): number {
    return this.count - this.neesCount;
  }

  get positionRmse(): number {
    return this.count > 0 ? Math.sqrt(this.positionSquares / this.count) : Number.NaN;
  }

  get velocityRmse(): number {
    return this.count > 0 ? Math.sqrt(this.velocitySquares / this.count) : Number.NaN;
  }

  get neesMean(): number {
    return this.neesCount > 0 ? this.neesSum / this.neesCount : Number.NaN;
  }
}
