// Contact between the lander and the carrier's deck plane, and the quantities a landing
// envelope is judged on. Allocation-free (writes into a DeckContact from createDeckContact).
import type { CarrierState } from './carrierPath.js';

/** The lander's true motion as contact needs it (a LanderState fits; kept structural so
 * contact does not import the dynamics that use it). */
export interface ContactBody {
  /** World ENU position (m) and velocity (m/s). */
  position: Float64Array;
  velocity: Float64Array;
  /** Attitude q_wb (Hamilton [w, x, y, z], body FLU -> world ENU). */
  qWorldBody: Float64Array;
}

export interface DeckContact {
  /** Height of the lander's feet above the deck plane, along the deck normal (m); <= 0 means contact. */
  height: number;
  inContact: boolean;
  /** Foot of the perpendicular from the lander onto the deck plane, world ENU (m). */
  point: Float64Array;
  /** Lander offset from the deck centre in deck axes: along travel and to the left (m). */
  along: number;
  across: number;
  /** Whether that point lies within the deck rectangle. */
  onDeck: boolean;
  /** Relative speed towards the deck along its normal (m/s, positive = closing). */
  closingSpeed: number;
  /** Relative speed within the deck plane (m/s). */
  lateralSpeed: number;
  /** Angle between the lander's body z axis and the deck normal (rad). */
  tilt: number;
  /** Lander height above the ground plane z = 0 (m), for misses beside a ground carrier. */
  groundHeight: number;
}

export function createDeckContact(): DeckContact {
  return {
    height: Infinity, inContact: false, point: new Float64Array(3), along: 0, across: 0,
    onDeck: false, closingSpeed: 0, lateralSpeed: 0, tilt: 0, groundHeight: Infinity,
  };
}

/**
 * Contact geometry. Deck axes from q_wd: e_x (along), e_y (left), n = e_z (normal).
 *   d = p_L - p_D, height = d.n - footHeight, point = p_L - (d.n) n,
 *   v_rel = v_L - v_D (deck rotation rate neglected), closing = -v_rel.n,
 *   lateral = |v_rel - (v_rel.n) n|, tilt = acos(z_b . n).
 * footHeight: distance from the lander's body origin down to its feet (m), default 0.
 */
export function deckContact(
  lander: ContactBody, carrier: CarrierState, deckLength: number, deckWidth: number,
  out: DeckContact, footHeight = 0,
): DeckContact {
  const q = carrier.qWorldDeck;
  const w = q[0]!, x = q[1]!, y = q[2]!, z = q[3]!;
  const exx = 1 - 2 * (y * y + z * z), exy = 2 * (x * y + w * z), exz = 2 * (x * z - w * y);
  const eyx = 2 * (x * y - w * z), eyy = 1 - 2 * (x * x + z * z), eyz = 2 * (y * z + w * x);
  const nx = 2 * (x * z + w * y), ny = 2 * (y * z - w * x), nz = 1 - 2 * (x * x + y * y);
  const p = lander.position, c = carrier.position;
  const dx = p[0]! - c[0]!, dy = p[1]! - c[1]!, dz = p[2]! - c[2]!;
  const normal = dx * nx + dy * ny + dz * nz;
  out.height = normal - footHeight;
  out.inContact = out.height <= 0;
  out.point[0] = p[0]! - normal * nx;
  out.point[1] = p[1]! - normal * ny;
  out.point[2] = p[2]! - normal * nz;
  out.along = dx * exx + dy * exy + dz * exz;
  out.across = dx * eyx + dy * eyy + dz * eyz;
  out.onDeck = Math.abs(out.along) <= deckLength / 2 && Math.abs(out.across) <= deckWidth / 2;
  const vx = lander.velocity[0]! - carrier.velocity[0]!;
  const vy = lander.velocity[1]! - carrier.velocity[1]!;
  const vz = lander.velocity[2]! - carrier.velocity[2]!;
  const vn = vx * nx + vy * ny + vz * nz;
  out.closingSpeed = -vn;
  // sqrt of the sum of squares, not Math.hypot: this runs every step and V8's hypot is slow
  // and allocates; speeds are far from overflow
  const lx = vx - vn * nx, ly = vy - vn * ny, lz = vz - vn * nz;
  out.lateralSpeed = Math.sqrt(lx * lx + ly * ly + lz * lz);
  const b = lander.qWorldBody;
  const bw = b[0]!, bx = b[1]!, by = b[2]!, bz = b[3]!;
  const zbx = 2 * (bx * bz + bw * by), zby = 2 * (by * bz - bw * bx), zbz = 1 - 2 * (bx * bx + by * by);
  out.tilt = Math.acos(Math.min(1, Math.max(-1, zbx * nx + zby * ny + zbz * nz)));
  out.groundHeight = p[2]! - footHeight;
  return out;
}
