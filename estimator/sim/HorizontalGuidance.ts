// What every horizontal guidance law shares: the estimate it sees, the interface it
// implements, and the norm limit it saturates with. The laws import this; `guidance.ts`
// picks a law and imports the laws, so no law imports its own caller.

/** The estimated horizontal relative state a law sees (m, m/s, world ENU axes x, y). */
export interface HorizontalEstimate {
  /** r = p_carrier - p_lander, horizontal (m). */
  rx: number;
  ry: number;
  /** Estimated carrier and lander horizontal velocity (m/s). */
  vcx: number;
  vcy: number;
  vlx: number;
  vly: number;
  /** Estimated carrier horizontal acceleration (m/s^2): the Singer state, 0 for a constant-velocity carrier model. */
  acx: number;
  acy: number;
}

export interface HorizontalGuidance {
  /** Forget integrator state (after an abort or a filter re-initialization). */
  reset(): void;
  /** Velocity command (m/s, world ENU x, y) into out[0], out[1] for a step of dt (s). */
  command(estimate: HorizontalEstimate, dt: number, out: Float64Array): void;
}

/** Scale (out[0], out[1]) down so its norm is at most `limit`; returns true when it clipped. */
export function limitNorm2(out: Float64Array, limit: number): boolean {
  const norm = Math.sqrt(out[0]! * out[0]! + out[1]! * out[1]!); // not Math.hypot: slow per step
  if (norm <= limit) return false;
  const s = limit / norm;
  out[0] = out[0]! * s;
  out[1] = out[1]! * s;
  return true;
}
