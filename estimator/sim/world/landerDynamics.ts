// The lander's true motion: a multirotor tracking a velocity command through a first-order
// lag, within acceleration, tilt and speed limits, pushed by wind through drag; attitude
// follows the thrust direction. step() is allocation-free (state in preallocated arrays).
import type { LanderSpec } from '../Scenario.js';
import { mat3TransposeMultiplyVector, rotationMatrixFromQuat } from '../../frames/rotationMatrixFromQuat.js';
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
  /** Yaw held throughout (rad from East, CCW). Default 0. */
  yaw?: number;
  /** Drag time constant (s): drag acceleration = (v_air - v) / tau_d. Default 4 s (a small multirotor). */
  dragTimeConstant?: number;
  /** Time constant (s) with which the velocity loop's integral action cancels a steady wind. Default 1.5 s. */
  windRejectionTime?: number;
}

export class LanderDynamics {
  readonly spec: LanderSpec;
  readonly state: LanderState = createLanderState();
  /** Cosine and sine of the held yaw. */
  private readonly cosYaw: number;
  private readonly sinYaw: number;
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
    for (let k = 0; k < 3; k++) this.state.position[k] = position[k]!;
    this.updateAttitude();
  }

  /**
   * Advance by dt (s) under a world velocity command (m/s) and the air velocity (mean wind +
   * gust, m/s, world); copy the new state into out (may be this.state).
   *   commanded:  v_c clamped to maxSpeed (horizontal) and maxVerticalSpeed
   *   lag:        a_lag = (v_c - v)(1 - e^{-dt/tau}) / dt   (exact first-order step when unsaturated)
   *   thrust:     a_t = a_lag + v / tau_d + b  (own drag fed forward, b cancels wind drag),
   *               |a_t,h| <= min(maxAccel, (g + a_t,z) tan(maxTilt)), a_t,z in [-0.8 g, maxAccel]
   *   motion:     a = a_t + (w - v) / tau_d;  b' = (-w / tau_d - b) / tau_i
   */
  step(dt: number, velocityCommand: ArrayLike<number>, windVelocity: ArrayLike<number>, out: LanderState): LanderState {
    const { spec, state, thrust, compensation } = this;
    const v = state.velocity;
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
    thrust[0] = (cx - v[0]!) * gain + v[0]! * inverseDrag + compensation[0]!;
    thrust[1] = (cy - v[1]!) * gain + v[1]! * inverseDrag + compensation[1]!;
    thrust[2] = (cz - v[2]!) * gain + v[2]! * inverseDrag + compensation[2]!;
    // vertical then horizontal saturation (tilt limit depends on the vertical thrust)
    thrust[2] = Math.min(Math.max(thrust[2]!, MIN_VERTICAL_ACCEL), spec.maxAccel);
    const horizontalLimit = Math.min(spec.maxAccel, (GRAVITY + thrust[2]!) * this.tanMaxTilt);
    const th = Math.sqrt(thrust[0]! * thrust[0]! + thrust[1]! * thrust[1]!);
    if (th > horizontalLimit) {
      thrust[0] = (thrust[0]! * horizontalLimit) / th;
      thrust[1] = (thrust[1]! * horizontalLimit) / th;
    }
    const a = state.acceleration;
    const p = state.position;
    const relax = this.rejectionFactor;
    for (let k = 0; k < 3; k++) {
      const wind = windVelocity[k]!;
      a[k] = thrust[k]! + (wind - v[k]!) * inverseDrag;
      p[k] = p[k]! + v[k]! * dt + 0.5 * a[k]! * dt * dt;
      v[k] = v[k]! + a[k]! * dt;
      // b relaxes towards -w / tau_d (exact first-order step)
      compensation[k] = compensation[k]! + (-wind * inverseDrag - compensation[k]!) * relax;
    }
    this.updateAttitude();
    if (out !== state) copyLanderState(state, out);
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
    this.updateAttitude();
  }

  // Body z along the thrust; specific force f_b = R_bw (a - g_vec) = R_wb^T (a + (0, 0, g)).
  private updateAttitude(): void {
    const s = this.state;
    s.tilt = attitudeFromAccelerationAtHeading(this.thrust, this.cosYaw, this.sinYaw, s.qWorldBody);
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

