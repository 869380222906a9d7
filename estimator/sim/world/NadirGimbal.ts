// A two-axis stabilized camera mount (roll outer, pitch inner): it turns against the body's
// roll and pitch so the camera keeps looking straight down while the lander leans into a chase,
// with its own lag, rate limit and travel. Yaw follows the body. Allocation-free.
//   body attitude (ZYX):  q_wb = Rz(ψ) Ry(θ) Rx(φ)
//   gimbal:               q_g = Rx(a) Ry(b), targets a* = -φ, b* = -θ (clamped to ±maxAngle)
//   camera base:          q_wb ⊗ q_g = Rz(ψ) when a = -φ and b = -θ (level, body's yaw)
//   each angle:           Δ = clamp((target - angle)(1 - e^{-dt/τ}), ±maxRate dt)
// The camera mount (offset and small angles) sits on the gimbal: its lever arm turns with it.

export interface GimbalSpec {
  /** Time constant (s), rate limit (rad/s) and travel (rad) of each axis. */
  timeConstant: number;
  maxRate: number;
  maxAngle: number;
}

export class NadirGimbal {
  /** Gimbal angles (rad): roll a (outer), pitch b (inner). */
  roll = 0;
  pitch = 0;
  /** The gimbal's rotation q_g = Rx(a) Ry(b), [w, x, y, z], body -> camera base. */
  readonly q = Float64Array.of(1, 0, 0, 0);
  private readonly spec: GimbalSpec;
  private lastDt = NaN;
  private gain = 1;

  constructor(spec: GimbalSpec) {
    this.spec = spec;
  }

  /** Level the camera against body attitude qWorldBody (as the gimbal's controller senses it) over dt (s). */
  step(dt: number, qWorldBody: ArrayLike<number>): Float64Array {
    const { timeConstant, maxRate, maxAngle } = this.spec;
    if (dt !== this.lastDt) {
      this.lastDt = dt;
      this.gain = timeConstant > 0 ? -Math.expm1(-dt / timeConstant) : 1;
    }
    const w = qWorldBody[0]!, x = qWorldBody[1]!, y = qWorldBody[2]!, z = qWorldBody[3]!;
    // ZYX roll and pitch of the body
    const phi = Math.atan2(2 * (w * x + y * z), 1 - 2 * (x * x + y * y));
    const s = 2 * (w * y - z * x);
    const theta = Math.asin(s > 1 ? 1 : s < -1 ? -1 : s);
    this.roll = this.follow(this.roll, clamp(-phi, maxAngle), dt, maxRate);
    this.pitch = this.follow(this.pitch, clamp(-theta, maxAngle), dt, maxRate);
    // q_g = Rx(a) ⊗ Ry(b)
    const ca = Math.cos(this.roll / 2), sa = Math.sin(this.roll / 2), cb = Math.cos(this.pitch / 2), sb = Math.sin(this.pitch / 2);
    this.q[0] = ca * cb;
    this.q[1] = sa * cb;
    this.q[2] = ca * sb;
    this.q[3] = sa * sb;
    return this.q;
  }

  private follow(angle: number, target: number, dt: number, maxRate: number): number {
    let delta = (target - angle) * this.gain;
    const limit = maxRate * dt;
    if (delta > limit) delta = limit;
    else if (delta < -limit) delta = -limit;
    return angle + delta;
  }
}

function clamp(v: number, limit: number): number {
  return v > limit ? limit : v < -limit ? -limit : v;
}
