// Layout of the landing-filter state x (ENU world frame, SI units):
//   x[0..2]   r  = p_carrier - p_lander (m)
//   x[3..5]   vC = carrier velocity (m/s)
//   x[6..8]   vL = lander velocity (m/s)
//   x[9..11]  ba = accelerometer bias, body FLU (m/s²)
//   x[12..14] aC = carrier acceleration (m/s²), Singer model only
//   δx, δy    pointing bias (rad), only with pointingBiasSigmaDeg > 0: the small angles about the
//             camera's x and y axes by which the camera really points off where the filter believes
//             (attitude and gyro bias, mount misalignment); random constants, after aC (or ba) and
//             before s
//   x[n - 1]  s  = deck scale factor - 1 (dimensionless), only with deckScaleSigma > 0: the true
//                  deck outline is the assumed one times (1 + s); always the LAST state (index 12,
//                  or 15 after the Singer acceleration)
// P is n x n row-major in the same order.

export const R_INDEX = 0;
export const VC_INDEX = 3;
export const VL_INDEX = 6;
export const BA_INDEX = 9;
export const AC_INDEX = 12;

/** Standard gravity (m/s²); gravity in ENU is (0, 0, -G). */
export const STANDARD_GRAVITY = 9.80665;

/** Number of pointing-bias states when the filter carries them. */
export const POINTING_STATES = 2;

/** State dimension for a carrier model, with or without the deck-scale state and the pointing-bias states. */
export function landingStateDimension(singer: boolean, deckScale = false, pointing = false): number {
  return (singer ? 15 : 12) + (pointing ? POINTING_STATES : 0) + (deckScale ? 1 : 0);
}

/** Index of the deck-scale state s (the last one), or -1 when the filter carries none. */
export function deckScaleIndex(singer: boolean, deckScale: boolean, pointing = false): number {
  return deckScale ? landingStateDimension(singer, false, pointing) : -1;
}

/** Index of δx (δy follows), or -1 when the filter carries no pointing states. */
export function pointingIndex(singer: boolean, pointing: boolean): number {
  return pointing ? landingStateDimension(singer) : -1;
}
