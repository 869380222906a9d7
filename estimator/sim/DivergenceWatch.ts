// The simulator's truth-side judge of the estimate: a filter can be far from the truth while
// everything it reports looks calm (a start from a false box, then every true box gated out:
// three relay trials of 100 had position RMSE 55-76 m and NEES up to 37,000 while the mean
// NIS stayed 0.62). The lander cannot see this (it has no truth); the simulator names it, so
// statistics can separate it from a divergence the filter declared. Allocation-free.
//   far:     e = |r̂ - r| > FAR_ERROR for FAR_TIME continuously (one episode per restart), counted
//            only while boxes are expected (runTrial pauses the watch while the predicted
//            outline leaves the image: a blind final descent only dead-reckons, and drifts)
//   calm:    the boxes accepted during the episode have mean NIS below the chi-square 0.99
//            quantile of their dimension (11.34 for 3), or none was accepted
//   named:   calm -> 'silent-divergence', else 'estimate-far-from-truth'
import { chiSquareQuantile } from '../stats/chiSquare.js';

/** Horizontal-and-vertical position error (m) that counts as lost: past any pad and funnel of the demos. */
export const FAR_ERROR = 2;
/** How long the error must stay past FAR_ERROR (s): a re-start's first steps are not a divergence. */
export const FAR_TIME = 0.5;
/** Chi-square 0.99 quantile for the box NIS's 3 degrees of freedom (about 11.34). */
const NIS_CALM_3 = chiSquareQuantile(0.99, 3);

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
   * One step with a valid estimate x (x[0..2] = r̂) against the true r (m); returns the event
   * when an episode is confirmed at this step, else null.
   */
  step(t: number, x: ArrayLike<number>, rTrue: ArrayLike<number>): DivergenceEvent | null {
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
    return calm ? 'silent-divergence' : 'estimate-far-from-truth';
  }
}
