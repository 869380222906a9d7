// The simulator's truth-side judge of the estimate: a filter can be far from the truth while
// everything it reports looks calm (a start from a false box, then every true box gated out:
// three relay trials of 100 had position RMSE 55-76 m and NEES up to 37,000 while the mean
// NIS stayed 0.62). The lander cannot see this (it has no truth); the simulator names it, so
// statistics can separate it from a divergence the filter declared. Allocation-free.
//   far:     e = |r̂ - r| > FAR_ERROR for FAR_TIME continuously (one episode per restart), counted
//            only while boxes are expected (runTrial pauses the watch while the predicted
//            outline leaves the image: a blind final descent only dead-reckons, and drifts)
//   sure:    the filter is over-confident about it: position NEES e^T P_rr^-1 e above the
//            chi-square 0.999 quantile of 3 degrees of freedom (about 16.3); a filter whose
//            covariance grew honestly (a long outage) is far but not silent
//   calm:    the boxes accepted during the episode have mean NIS below the chi-square 0.99
//            quantile of their dimension (11.34 for 3), or none was accepted
//   named:   sure and calm -> 'silent-divergence', else 'estimate-far-from-truth'
import { chiSquareQuantile } from '../stats/chiSquare.js';

/** Horizontal-and-vertical position error (m) that counts as lost: past any pad and funnel of the demos. */
export const FAR_ERROR = 2;
/** How long the error must stay past FAR_ERROR (s): a re-start's first steps are not a divergence. */
export const FAR_TIME = 0.5;
/** Chi-square 0.99 quantile for the box NIS's 3 degrees of freedom (about 11.34). */
const NIS_CALM_3 = chiSquareQuantile(0.99, 3);
/** Chi-square 0.999 quantile for the position error's 3 degrees of freedom (about 16.27). */
const NEES_SURE_3 = chiSquareQuantile(0.999, 3);

export type DivergenceEvent = 'silent-divergence' | 'estimate-far-from-truth';

export class DivergenceWatch {
  private farSince = Number.NaN;
  private named = false;
  private nisSum = 0;
  private nisCount = 0;

  /** Start afresh (the filter restarted): a new episode may be named again. */
  reset(): void {
    this.farSince = Number.NaN;
    this.named = false;
    this.nisSum = 0;
    this.nisCount = 0;
  }

  /** No judgement this step (no estimate, or blind by design): a running episode ends unnamed. */
  pause(): void {
    this.farSince = Number.NaN;
    this.nisSum = 0;
    this.nisCount = 0;
  }

  /** An accepted box's NIS (dimension 3) at this step. */
  noteNis(nis: number): void {
    if (!Number.isFinite(nis) || Number.isNaN(this.farSince)) return;
    this.nisSum += nis;
    this.nisCount++;
  }

  /**
   * One step with a valid estimate x (x[0..2] = r̂) and its covariance P (n x n, row-major)
   * against the true r (m); returns the event when an episode is confirmed at this step, else null.
   */
  step(t: number, x: ArrayLike<number>, P: ArrayLike<number>, n: number, rTrue: ArrayLike<number>): DivergenceEvent | null {
    const ex = x[0]! - rTrue[0]!, ey = x[1]! - rTrue[1]!, ez = x[2]! - rTrue[2]!;
    const e = Math.sqrt(ex * ex + ey * ey + ez * ez);
    if (!(e > FAR_ERROR)) {
      this.farSince = Number.NaN;
      this.nisSum = 0;
      this.nisCount = 0;
      return null;
    }
    if (Number.isNaN(this.farSince)) this.farSince = t;
    if (this.named || t - this.farSince < FAR_TIME) return null;
    this.named = true;
    const calm = this.nisCount === 0 || this.nisSum / this.nisCount < NIS_CALM_3;
    const sure = positionNees(ex, ey, ez, P, n) > NEES_SURE_3;
    return calm && sure ? 'silent-divergence' : 'estimate-far-from-truth';
  }
}

/** e^T A^-1 e for the symmetric 3 x 3 block A = P[0..2][0..2] (adjugate inverse); Infinity if A is singular. */
function positionNees(ex: number, ey: number, ez: number, P: ArrayLike<number>, n: number): number {
  const a = P[0]!, b = P[1]!, c = P[2]!, d = P[n + 1]!, e = P[n + 2]!, f = P[2 * n + 2]!;
  // adjugate of [[a b c] [b d e] [c e f]]
  const A00 = d * f - e * e, A01 = c * e - b * f, A02 = b * e - c * d;
  const A11 = a * f - c * c, A12 = b * c - a * e, A22 = a * d - b * b;
  const det = a * A00 + b * A01 + c * A02;
  if (!(det > 0)) return Infinity;
  const q = ex * (A00 * ex + A01 * ey + A02 * ez) + ey * (A01 * ex + A11 * ey + A12 * ez) + ez * (A02 * ex + A12 * ey + A22 * ez);
  return q / det;
}
