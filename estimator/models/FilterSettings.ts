// The landing filter's settings: models, noise assumed, gates, tuning multipliers, history.
// They belong to the filter, not to the simulator: a scenario composes them as its `filter`
// field, and a flight-log replay builds them without any scenario.
import type { BoxTerms } from './OutlineBoxModel.js';

export type { BoxTerms };

export type CameraUpdateMode = 'tight' | 'loose';
/** How the tight update predicts the detector's box: the deck outline seen through the believed camera, or the deck centre's image with a square of sqrt(fx fy) L / Z. */
export type BoxModel = 'outline' | 'flat';
export type CarrierModel = 'constant-velocity' | 'singer';

export interface FilterSpec {
  /** Filter (and IMU integration) rate (Hz). */
  rate: number;
  cameraUpdate: CameraUpdateMode;
  /**
   * Tight box model (default 'outline'): 'outline' predicts the box of the deck's corners (and
   * of the body below) through the believed camera at the estimated attitude, with the deck's
   * heading; 'flat' projects the deck centre with size sqrt(fx fy) L / Z (biased along travel
   * when the lander tilts; kept to compare).
   */
  boxModel?: BoxModel;
  /** Outline model: measure centre and size sqrt(w h) (3-D, default) or centre, width and height (4-D). */
  boxTerms?: BoxTerms;
  /** Outline model: carrier speed (m/s) below which the deck heading is the lander's yaw instead of the direction of the carrier velocity estimate (default 1.5). */
  headingMinSpeed?: number;
  carrierModel: CarrierModel;
  /** Carrier acceleration noise (m/s^2 / sqrt(Hz)) and Singer time constant (s). */
  carrierAccelNoise: number;
  /**
   * The carrier's vertical (Up) acceleration noise (m/s^2 / sqrt(Hz); default carrierAccelNoise):
   * a ground carrier barely moves vertically and a boat heaves, while both may turn and change
   * speed. Left as free as the horizontal axes, the carrier's vertical velocity absorbs the box's
   * growth and the range and deck scale are poorly pinned by the lander's metric motion.
   */
  carrierVerticalAccelNoise?: number;
  singerTau: number;
  /** Accelerometer noise density assumed (m/s^2 / sqrt(Hz)) and bias random walk (m/s^3 / sqrt(Hz)). */
  accelNoise: number;
  accelBiasWalk: number;
  /** Measurement noise assumed: box centre (px), box size (px), odometry (m/s). */
  pixelNoise: number;
  sizeNoise: number;
  /**
   * Box-size noise assumed in proportion to the size (1 sigma, fraction; 0 = none): the size
   * variance is sizeNoise² + (sizeNoiseFraction · s)², s the predicted (tight) or measured
   * (loose) size in px. Covers what scales with the box: detector size noise, the box of a
   * yawed, obliquely seen outline versus sqrt(deck area), target-size and focal errors.
   */
  sizeNoiseFraction: number;
  /**
   * Box-centre noise assumed in proportion to the box size (1 sigma, fraction; 0 = none): the
   * centre variance per axis is pixelNoise² + (pixelNoiseFraction · s)². Covers the offset of
   * the outline's box centre from the deck centre's image (the body below the deck seen
   * obliquely), which is a fixed share of the box, so grows in px as the lander descends.
   */
  pixelNoiseFraction: number;
  odometryNoise: number;
  /** Gate: probability mass inside the chi-square gate (e.g. 0.997). */
  gateProbability: number;
  /** Tuning multipliers (log-scaled by the tuner): Q, R and gate threshold. */
  qScale: number;
  rScale: number;
  gateScale: number;
  /**
   * Deck-scale state (default 0 = none): fractional 1 sigma of the deck size the filter assumes
   * (0.05 = the true deck may be 5 % larger or smaller). When > 0 the filter carries one more
   * state s, last in x (landingState.ts): the true outline (length, width, body height) and the
   * flat model's L are the assumed ones times (1 + s); s is a random constant with prior 0 ± this
   * sigma, observable from the lander's metric motion (IMU, odometry) against the box growing.
   */
  deckScaleSigma?: number;
  /**
   * Pointing-bias states (default 0 = none): 1 sigma (deg) of the angle by which the camera really
   * points off where the filter believes, per camera axis (x and y): attitude bias, gyro bias times
   * the attitude estimator's correction time and mount misalignment together, constant over a
   * trial. When > 0 the filter carries two more states δ (rad), random constants with prior
   * 0 ± this sigma, before s (landingState.ts); both tight box models turn the predicted camera
   * point by δ. The loose update has no such column (refused).
   */
  pointingBiasSigmaDeg?: number;
  /** History kept for delayed boxes (s). */
  historyLength: number;
}
