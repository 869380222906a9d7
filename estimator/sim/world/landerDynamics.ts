// The lander's true motion: a multirotor tracking a velocity command through a first-order
// lag, within acceleration, tilt and speed limits, pushed by wind through drag. The velocity
// loop closes on the velocity the lander BELIEVES (odometry or its estimate, passed in), as a
// real autopilot does: truth is only integrated. The body turns towards the thrust direction
// the loop asks for through a rate-limited first-order attitude response (AttitudeResponse),
// and the thrust acts along the body axis it has reached. step() is allocation-free.
import type { LanderSpec } from '../Scenario.js';
import { mat3TransposeMultiplyVector, rotationMatrixFromQuat } from '../../frames/rotationMatrixFromQuat.js';
import { AttitudeResponse } from './AttitudeResponse.js';
import { attitudeFromAccelerationAtHeading, GRAVITY } from './thrustAttitude.js';

const DEG = Math.PI / 180;

/** Lowest vertical acceleration thrust can give: rotors do not pull down (keep 20 % g of thrust). */
const MIN_VERTICAL_ACCEL = -0.8 * GRAVITY;

export interface LanderState {
  /** World ENU position (m), velocity (m/s), total acceleration (m/s^2). */
  position: Float64Array;
  velocity: Float64Array;
  acceleration: Float64Array;
  /** Attitude q_wb (Hamilton [w, x, y, z], body FLU -> world ENU). */
  qWorldBody: Float64Array;
  /** What the accelerometer would read, body FLU (m/s^2): f_b = R_bw (a - g_vec). */
  specificForceBody: Float64Array;
  /** Tilt of the thrust axis from vertical (rad). */
  tilt: number;
}

export function createLanderState(): LanderState {
  return {
    position: new Float64Array(3),
    velocity: new Float64Array(3),
    acceleration: new Float64Array(3),
    qWorldBody: Float64Array.of(1, 0, 0, 0),
    specificForceBody: Float64Array.of(0, 0, GRAVITY),
    tilt: 0,
  };
}

export interface LanderDynamicsOptions {
  /** Initial yaw setpoint (rad from East, CCW); setHeading() changes it. Default 0. */
  yaw?: number;
  /** Drag time constant (s): drag acceleration = (v_air - v) / tau_d. Default 4 s (a small multirotor). */
  dragTimeConstant?: number;
  /** Time constant (s) with which the velocity loop's integral action cancels a steady wind. Default 1.5 s. */
  windRejectionTime?: number;
}

export class LanderDynamics {
  readonly spec: LanderSpec;
  readonly state: LanderState = createLanderState();
  /** Cosine and sine of the yaw setpoint. */
  private cosYaw: number;
  private sinYaw: number;
  /** The attitude loop: how the body follows the attitude the thrust asks for. */
  readonly attitude: AttitudeResponse;
  /** Attitude the thrust asks for (q_wb), before the attitude response. */
  private readonly qDesired = Float64Array.of(1, 0, 0, 0);
  /** Thrust acceleration the body actually gives (world, m/s^2): |f_d| along the body z reached. */
  private readonly thrustActual = new Float64Array(3);
  private readonly dragTime: number;
  private readonly rejectionTime: number;
  /** Wind-drag acceleration the velocity loop has learnt to cancel (m/s^2, world). */
  private readonly compensation = new Float64Array(3);
  private readonly thrust = new Float64Array(3);
  private readonly specificForceWorld = new Float64Array(3);
  private readonly Rwb = new Float64Array(9);
  private readonly tanMaxTilt: number;
  private lastDt = NaN;
  private lagGain = 0;
  private rejectionFactor = 0;

  constructor(spec: LanderSpec, position: ArrayLike<number>, options: LanderDynamicsOptions = {}) {
    this.spec = spec;
    const yaw = options.yaw ?? 0;
    this.cosYaw = Math.cos(yaw);
    this.sinYaw = Math.sin(yaw);
    this.dragTime = options.dragTimeConstant ?? 4;
    this.rejectionTime = options.windRejectionTime ?? 1.5;
    this.tanMaxTilt = Math.tan(spec.maxTiltDeg * DEG);
    this.attitude = new AttitudeResponse(spec.attitudeTimeConstant, spec.maxAttitudeRateDeg * DEG);
    for (let k = 0; k < 3; k++) this.state.position[k] = position[k]!;
    this.placeAttitude();
  }

  /** Yaw setpoint as its cosine and sine (unit vector of the heading, ENU); the body turns to it through the attitude response. */
  setHeading(cosYaw: number, sinYaw: number): void {
    this.cosYaw = cosYaw;
    this.sinYaw = sinYaw;
  }

  /**
   * Advance by dt (s) under a world velocity command (m/s) and the air velocity (mean wind +
   * gust, m/s, world); copy the new state into out (may be this.state). The loop closes on
   * velocityBelief v̂ (world, m/s; default the true velocity, for tests of the plant alone).
   *   commanded:  v_c clamped to maxSpeed (horizontal) and maxVerticalSpeed
   *   lag:        a_lag = (v_c - v̂)(1 - e^{-dt/tau}) / dt   (exact first-order step when unsaturated)
   *   thrust:     a_t = a_lag + v̂ / tau_d + b  (own drag fed forward, b cancels wind drag),
   *               |a_t,h| <= min(maxAccel, (g + a_t,z) tan(maxTilt)), a_t,z in [-0.8 g, maxAccel]
   *   attitude:   q_d from body z along f_d = a_t + (0, 0, g) at the yaw setpoint; q follows q_d
   *               through the attitude response; thrust acts along the body z reached:
   *               a_t' = |f_d| z_b - (0, 0, g)
   *   motion:     a = a_t' + (w - v) / tau_d;  b' = (-w / tau_d - b) / tau_i
   * With v̂ = v + β (a bias β) the loop settles at v = v_c - β (1 - 1 / (G τ_d)), G the lag's gain:
   * the lander flies what it believes (less the small share of β the drag feed-forward returns).
   */
  step(dt: number, velocityCommand: ArrayLike<number>, windVelocity: ArrayLike<number>, out: LanderState, velocityBelief?: ArrayLike<number>): LanderState {
    const { spec, state, thrust, compensation } = this;
    const v = state.velocity;
    const vb = velocityBelief ?? v;
    // command limits
    let cx = velocityCommand[0]!, cy = velocityCommand[1]!;
    const ch = Math.sqrt(cx * cx + cy * cy);
    if (ch > spec.maxSpeed) {
      cx *= spec.maxSpeed / ch;
      cy *= spec.maxSpeed / ch;
    }
    const cz = Math.min(Math.max(velocityCommand[2]!, -spec.maxVerticalSpeed), spec.maxVerticalSpeed);
    if (dt !== this.lastDt) {
      // step factors depend on dt only: recompute when it changes
      this.lastDt = dt;
      this.lagGain = -Math.expm1(-dt / spec.velocityTimeConstant) / dt;
      this.rejectionFactor = -Math.expm1(-dt / this.rejectionTime);
    }
    const gain = this.lagGain;
    const inverseDrag = 1 / this.dragTime;
    thrust[0] = (cx - vb[0]!) * gain + vb[0]! * inverseDrag + compensation[0]!;
    thrust[1] = (cy - vb[1]!) * gain + vb[1]! * inverseDrag + compensation[1]!;
    thrust[2] = (cz - vb[2]!) * gain + vb[2]! * inverseDrag + compensation[2]!;
    // vertical then horizontal saturation (tilt limit depends on the vertical thrust)
    thrust[2] = Math.min(Math.max(thrust[2]!, MIN_VERTICAL_ACCEL), spec.maxAccel);
    const horizontalLimit = Math.min(spec.maxAccel, (GRAVITY + thrust[2]!) * this.tanMaxTilt);
    const th = Math.sqrt(thrust[0]! * thrust[0]! + thrust[1]! * thrust[1]!);
    if (th > horizontalLimit) {
      thrust[0] = (thrust[0]! * horizontalLimit) / th;
      thrust[1] = (thrust[1]! * horizontalLimit) / th;
    }
    const applied = this.turnBody(dt);
    const a = state.acceleration;
    const p = state.position;
    const relax = this.rejectionFactor;
    for (let k = 0; k < 3; k++) {
      const wind = windVelocity[k]!;
      a[k] = applied[k]! + (wind - v[k]!) * inverseDrag;
      p[k] = p[k]! + v[k]! * dt + 0.5 * a[k]! * dt * dt;
      v[k] = v[k]! + a[k]! * dt;
      // b relaxes towards -w / tau_d (exact first-order step)
      compensation[k] = compensation[k]! + (-wind * inverseDrag - compensation[k]!) * relax;
    }
    this.updateSensedForce();
    if (out !== state) copyLanderState(state, out);
    return out;
  }

  /** Body towards the attitude the thrust asks for; returns the thrust acceleration it gives (world). */
  private turnBody(dt: number): Float64Array {
    const { thrust, state } = this;
    attitudeFromAccelerationAtHeading(thrust, this.cosYaw, this.sinYaw, this.qDesired);
    if (this.attitude.step(dt, this.qDesired, state.qWorldBody)) return thrust; // reached: exactly as asked
    const fx = thrust[0]!, fy = thrust[1]!, fz = thrust[2]! + GRAVITY;
    const f = Math.sqrt(fx * fx + fy * fy + fz * fz);
    // body z = third column of R_wb, from q directly
    const w = state.qWorldBody[0]!, x = state.qWorldBody[1]!, y = state.qWorldBody[2]!, z = state.qWorldBody[3]!;
    const out = this.thrustActual;
    out[0] = f * 2 * (x * z + w * y);
    out[1] = f * 2 * (y * z - w * x);
    out[2] = f * (1 - 2 * (x * x + y * y)) - GRAVITY;
    return out;
  }

  /** Place the lander (e.g. at the start) at rest. */
  reset(position: ArrayLike<number>): void {
    for (let k = 0; k < 3; k++) {
      this.state.position[k] = position[k]!;
      this.state.velocity[k] = 0;
      this.state.acceleration[k] = 0;
      this.compensation[k] = 0;
      this.thrust[k] = 0;
    }
    this.placeAttitude();
  }

  /** Body at the attitude the current thrust asks for, with no transient (start, reset). */
  private placeAttitude(): void {
    attitudeFromAccelerationAtHeading(this.thrust, this.cosYaw, this.sinYaw, this.state.qWorldBody);
    this.attitude.resetRates();
    this.updateSensedForce();
  }

  // Tilt of the body z reached; specific force f_b = R_bw (a - g_vec) = R_wb^T (a + (0, 0, g)).
  private updateSensedForce(): void {
    const s = this.state;
    const q = s.qWorldBody;
    s.tilt = Math.acos(Math.min(1, 1 - 2 * (q[1]! * q[1]! + q[2]! * q[2]!)));
    const f = this.specificForceWorld;
    f[0] = s.acceleration[0]!; f[1] = s.acceleration[1]!; f[2] = s.acceleration[2]! + GRAVITY;
    rotationMatrixFromQuat(s.qWorldBody, this.Rwb);
    mat3TransposeMultiplyVector(this.Rwb, f, s.specificForceBody);
  }
}

export function copyLanderState(from: LanderState, to: LanderState): LanderState {
  to.position.set(from.position);
  to.velocity.set(from.velocity);
  to.acceleration.set(from.acceleration);
  to.qWorldBody.set(from.qWorldBody);
  to.specificForceBody.set(from.specificForceBody);
  to.tilt = from.tilt;
  return to;
}

