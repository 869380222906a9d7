// What one closed-loop trial reports. Field names are promises to users' scripts
// (`alight simulate --json`, sweep JSON Lines): keep them.
import type { FailureCause, FailureEvent } from './attribution/FailureEvent.js';
import type { Phase } from './Phase.js';

/**
 * How a trial ended. Contact: landed, off-pad (on the deck, outside the pad), hard-contact (on
 * the deck, beyond the envelope's speeds or tilt), off-carrier (not on the carrier at all: the
 * ground, or past the deck's edge). No contact: aborted, timed-out, diverged (the filter said
 * so), silent-divergence (the estimate was far from truth while its NIS looked calm: only the
 * simulator's truth can tell; see runTrial).
 */
export type Outcome = 'landed' | 'off-pad' | 'hard-contact' | 'off-carrier' | 'aborted' | 'timed-out' | 'diverged' | 'silent-divergence';
export const OUTCOMES: readonly Outcome[] = ['landed', 'off-pad', 'hard-contact', 'off-carrier', 'aborted', 'timed-out', 'diverged', 'silent-divergence'];

export { PHASES, type Phase } from './Phase.js';

export interface TrialResult {
  outcome: Outcome;
  /** Horizontal distance of the contact point from the pad centre (m); null without contact. */
  missDistance: number | null;
  /** Contact point relative to the pad centre in the carrier's deck frame, x along travel, y left (m). */
  missX: number | null;
  missY: number | null;
  /** Vertical closing speed and horizontal relative speed at contact (m/s), tilt at contact (deg). */
  closingSpeed: number | null;
  lateralSpeed: number | null;
  tiltDeg: number | null;
  /** Simulated time of contact (s); null without contact. */
  touchdownTime: number | null;
  /** RMS error of the relative position / velocity estimate over the trial (m, m/s). */
  positionRmse: number;
  velocityRmse: number;
  /** Mean NEES of the relative-position+velocity block over filter steps, and its dimension. */
  neesMean: number;
  neesDim: number;
  /**
   * Mean NEES (dim neesDim) over the filter steps of the descent (phases descend and touchdown),
   * per true-height bin of DESCENT_HEIGHT_EDGES (descentHeightBins.ts); null where the descent
   * spent no step. Summaries judge these across trials (ensemble NEES per height bin).
   */
  neesByHeight?: (number | null)[];
  /** Mean NIS over accepted camera updates, and its dimension. */
  nisMean: number;
  nisDim: number;
  nisCount: number;
  /** Seconds spent in each phase. */
  phaseTimes: Record<Phase, number>;
  /** Counts: boxes delivered, dropped, false boxes, gate rejections, aborts. */
  boxes: number;
  dropped: number;
  falseBoxes: number;
  gateRejections: number;
  aborts: number;
  /** Named filter event if the estimate diverged (e.g. 'covariance-not-positive-definite'). */
  divergence: string | null;
  /**
   * Why a trial that did not land failed, by the rule in sim/attribution/attributeFailure.ts;
   * null when it landed. Absent in results written before attribution existed.
   */
  cause?: FailureCause | null;
  /** The cause and the events after it (time s, phase, true height above the deck m, value); [] when it landed. */
  causeChain?: FailureEvent[];
  /**
   * The filter's deck-scale estimate at the end of the trial (touchdown, or the last step):
   * s (true deck = assumed deck x (1 + s)) and its 1 sigma. Present only when the filter carries
   * the state (filter.deckScaleSigma > 0); null when the filter never started.
   */
  deckScaleEstimate?: { value: number; sigma: number } | null;
  /** Largest body rotation rate of any step (deg/s): at most lander.maxAttitudeRateDeg. */
  peakAttitudeRateDeg: number;
}
