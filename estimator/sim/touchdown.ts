// Touchdown judgement at the first contact, against the landing envelope. Allocation-free.
//   d = R_wd' (p_lander - p_deck)            contact point in the deck frame (x along travel, y left)
//   miss = hypot(d_x, d_y)
//   closing = vC_z - vL_z                    vertical closing speed (m/s, > 0 approaching)
//   lateral = |vL_h - vC_h|                  horizontal relative speed (m/s)
//   tilt = acos(z_body . z_deck)             lander tilt relative to the deck (deg)
// Outcome: hard-contact when any speed or the tilt exceeds the envelope (it breaks things
// wherever it happens), else off-pad when miss > padRadius or the contact is not on the
// deck, else landed.
import type { LandingEnvelope } from './Scenario.js';
import type { Outcome } from './TrialResult.js';

export interface TouchdownJudgement {
  outcome: Outcome;
  missDistance: number;
  missX: number;
  missY: number;
  closingSpeed: number;
  lateralSpeed: number;
  tiltDeg: number;
}

/** z axis of the rotation q (Hamilton [w, x, y, z]) in world coordinates, into out. */
function zAxis(q: ArrayLike<number>, out: Float64Array): Float64Array {
  const w = q[0]!, x = q[1]!, y = q[2]!, z = q[3]!;
  out[0] = 2 * (x * z + w * y);
  out[1] = 2 * (y * z - w * x);
  out[2] = 1 - 2 * (x * x + y * y);
  return out;
}

const zBody = new Float64Array(3);
const zDeck = new Float64Array(3);

/**
 * Judge a contact. Positions/velocities world ENU (m, m/s); quaternions q_wb (lander) and
 * q_wd (deck), Hamilton scalar first. `onDeck` false for contact with the ground beside
 * the carrier.
 */
export function judgeTouchdown(
  envelope: LandingEnvelope,
  landerPosition: ArrayLike<number>, landerVelocity: ArrayLike<number>, qWorldBody: ArrayLike<number>,
  deckPosition: ArrayLike<number>, deckVelocity: ArrayLike<number>, qWorldDeck: ArrayLike<number>,
  onDeck: boolean,
): TouchdownJudgement {
  const dx = landerPosition[0]! - deckPosition[0]!, dy = landerPosition[1]! - deckPosition[1]!, dz = landerPosition[2]! - deckPosition[2]!;
  // rotate d into the deck frame: d_deck = R_wd' d = rotation by conj(q_wd)
  const w = qWorldDeck[0]!, qx = -qWorldDeck[1]!, qy = -qWorldDeck[2]!, qz = -qWorldDeck[3]!;
  const tx = 2 * (qy * dz - qz * dy), ty = 2 * (qz * dx - qx * dz), tz = 2 * (qx * dy - qy * dx);
  const missX = dx + w * tx + (qy * tz - qz * ty);
  const missY = dy + w * ty + (qz * tx - qx * tz);
  const closingSpeed = deckVelocity[2]! - landerVelocity[2]!;
  const lateralSpeed = Math.hypot(landerVelocity[0]! - deckVelocity[0]!, landerVelocity[1]! - deckVelocity[1]!);
  const zb = zAxis(qWorldBody, zBody);
  const zd = zAxis(qWorldDeck, zDeck);
  const cos = zb[0]! * zd[0]! + zb[1]! * zd[1]! + zb[2]! * zd[2]!;
  const tiltDeg = (Math.acos(Math.max(-1, Math.min(1, cos))) * 180) / Math.PI;
  const missDistance = Math.hypot(missX, missY);
  let outcome: Outcome = 'landed';
  if (closingSpeed > envelope.maxClosingSpeed || lateralSpeed > envelope.maxLateralSpeed || tiltDeg > envelope.maxTiltDeg) outcome = 'hard-contact';
  else if (!onDeck || missDistance > envelope.padRadius) outcome = 'off-pad';
  return { outcome, missDistance, missX, missY, closingSpeed, lateralSpeed, tiltDeg };
}
