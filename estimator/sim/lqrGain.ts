// LQR gains for one axis of the relative double integrator, from the discrete Riccati
// equation (dareSolve). State e = [r, rdot] (relative position p_carrier - p_lander and
// its rate, m and m/s); control u = lander acceleration (m/s^2) enters as rdot' = -u.
// Exact zero-order-hold discretisation over dt:
//   A = [[1, dt], [0, 1]],  B = -[[dt^2/2], [dt]]
// The continuous cost  J = ∫ q r^2 + qv rdot^2 + rho u^2 dt  becomes per step
// Q = dt diag(q, qv), R = dt rho (rectangle rule), so gains do not depend on the loop
// rate as dt -> 0 and tend to the continuous closed form
//   K = [sqrt(q/rho), sqrt(qv/rho + 2 sqrt(q/rho))]   (derived here from the CARE; see lqrGain test).
// Sign: the optimal u = -K e with K from the DARE; B carries the minus, so K < 0 and the
// gains reported here are kr = -K[0], kv = -K[1] > 0 (accelerate towards the carrier).
import { Matrix } from 'ml-matrix';
import { dareSolve } from './dareSolve.js';

export interface LqrGain {
  /** Position gain (1/s^2) and rate gain (1/s): a_lander = kr * r + kv * rdot. */
  kr: number;
  kv: number;
  /** Riccati solution X (2x2) for inspection. */
  X: Matrix;
}

/**
 * Discrete LQR gains for the relative double integrator per axis.
 * @param q position weight (1/m^2), qv velocity weight (s^2/m^2), rho control weight (s^4/m^2), dt step (s).
 */
export function lqrGain(q: number, qv: number, rho: number, dt: number): LqrGain {
  const A = new Matrix([[1, dt], [0, 1]]);
  const B = new Matrix([[-0.5 * dt * dt], [-dt]]);
  const Q = new Matrix([[q * dt, 0], [0, qv * dt]]);
  const R = new Matrix([[rho * dt]]);
  const { X, K } = dareSolve(A, B, Q, R);
  return { kr: -K.get(0, 0), kv: -K.get(0, 1), X };
}
