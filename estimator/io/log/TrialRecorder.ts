// What the simulator hands to `alight record`: every input the lander's filter saw, in the
// order it saw it, plus the simulator's truth and the filter's own estimates. SIM-LOOP calls
// these methods from runTrial; REPLAY's writers turn them into the flight-log layout
// (estimator/README.md, "Flight-log layout") so a simulated trial replays like a real flight.
// Arrays passed in may be reused by the caller after the call returns: copy, do not keep.

import type { Box } from '../../camera/Box.js';

export interface TrialRecorder {
  /**
   * One IMU step of the filter at t (s, IMU clock): specific force f in body FLU (m/s^2) and
   * the estimated attitude q_wb [w, x, y, z] the filter used with it. Written to imu.csv and
   * attitude.csv (same time), so replay feeds propagate() exactly these two.
   */
  imu(t: number, f: ArrayLike<number>, q: ArrayLike<number>): void;
  /** An attitude estimate at a time with no IMU step (rarely needed: imu() carries q). */
  attitude(t: number, q: ArrayLike<number>): void;
  /** Lander velocity in world ENU (m/s) measured at t (applied at min(t, filter clock); also those only used to start the filter). */
  odometry(t: number, v: ArrayLike<number>): void;
  /**
   * A detector box as it reached the filter: tArrival = the simulation step that handed it
   * over (s), tCapture = its capture stamp on the camera clock (s; the filter applies it at
   * min(tCapture, filter clock)); score in [0, 1] (1 when unknown). False boxes are recorded
   * too: the lander cannot tell them apart.
   */
  box(tArrival: number, tCapture: number, box: Box, score: number): void;
  /** Simulator truth at t: r = p_carrier - p_lander (ENU, m), carrier and lander velocity (m/s). */
  truth(t: number, r: ArrayLike<number>, vC: ArrayLike<number>, vL: ArrayLike<number>): void;
  /**
   * Optional: the lander dropped its estimate at t (e.g. the supervisor aborted and will
   * re-acquire), so the next box handed over starts the filter afresh (resets.csv). Needed
   * for a bit-exact replay of trials with such restarts; divergence restarts need no call.
   */
  reset?(t: number): void;
  /** The filter's state x and covariance diagonal at filter time t, after every event up to t (onboard.csv). */
  estimate(t: number, x: ArrayLike<number>, Pdiag: ArrayLike<number>): void;
}
