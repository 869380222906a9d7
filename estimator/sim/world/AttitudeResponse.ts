// The multirotor's attitude loop as the outer loops see it: the body turns towards the attitude
// the thrust asks for along the shortest rotation, as a first-order lag whose rate is limited.
// A real attitude loop (rate loop inside, motor lag, inertia) cannot jump: without this the
// simulated camera turned 20-40 degrees in one 10 ms step. Allocation-free (owns its scratch).
//   e      = conj(q) ⊗ q_d                   body-frame error rotation, angle θ = 2 atan2(|e_xyz|, e_w)
//   Δθ     = min(θ (1 - exp(-dt / τ_att)), ω_max dt)
//   q     <- q ⊗ [cos(Δθ/2), sin(Δθ/2) e_xyz / |e_xyz|]
// τ_att = 0 with ω_max = Infinity reproduces an instant attitude exactly (q = q_d).

export class AttitudeResponse {
  /** Time constant τ_att (s) and rate limit ω_max (rad/s). */
  readonly timeConstant: number;
  readonly maxRate: number;
  /** Body rotation rate of the last step (rad/s): the angle turned over dt. */
  rate = 0;
  /** Largest rate of any step so far (rad/s). */
  peakRate = 0;
  private lastDt = NaN;
  private gain = 1;
  private readonly e = new Float64Array(4);

  constructor(timeConstant: number, maxRate: number) {
    if (!(timeConstant >= 0) || !(maxRate > 0)) throw new RangeError(`attitude response needs a time constant >= 0 and a rate limit > 0 (got ${timeConstant} s, ${maxRate} rad/s)`);
    this.timeConstant = timeConstant;
    this.maxRate = maxRate;
  }

  /**
   * Turn q (unit, [w, x, y, z], in place) towards qTarget over dt (s); returns true when q reached
   * it (q then equals qTarget exactly).
   */
  step(dt: number, qTarget: ArrayLike<number>, q: Float64Array): boolean {
    if (dt !== this.lastDt) {
      this.lastDt = dt;
      this.gain = this.timeConstant > 0 ? -Math.expm1(-dt / this.timeConstant) : 1;
    }
    const e = this.e;
    // e = conj(q) ⊗ q_d
    const qw = q[0]!, qx = -q[1]!, qy = -q[2]!, qz = -q[3]!;
    const pw = qTarget[0]!, px = qTarget[1]!, py = qTarget[2]!, pz = qTarget[3]!;
    e[0] = qw * pw - qx * px - qy * py - qz * pz;
    e[1] = qw * px + qx * pw + qy * pz - qz * py;
    e[2] = qw * py - qx * pz + qy * pw + qz * px;
    e[3] = qw * pz + qx * py - qy * px + qz * pw;
    if (e[0]! < 0) for (let k = 0; k < 4; k++) e[k] = -e[k]!; // the shorter way round
    const sinHalf = Math.sqrt(e[1]! * e[1]! + e[2]! * e[2]! + e[3]! * e[3]!);
    const angle = 2 * Math.atan2(sinHalf, e[0]!);
    let turn = angle * this.gain;
    const limit = this.maxRate * dt;
    if (turn > limit) turn = limit;
    if (turn >= angle || sinHalf < 1e-15) {
      for (let k = 0; k < 4; k++) q[k] = qTarget[k]!;
      this.note(angle / dt);
      return true;
    }
    const c = Math.cos(turn / 2), s = Math.sin(turn / 2) / sinHalf;
    const ax = e[1]! * s, ay = e[2]! * s, az = e[3]! * s;
    // q <- q ⊗ [c, a]
    const w = q[0]!, x = q[1]!, y = q[2]!, z = q[3]!;
    let nw = w * c - x * ax - y * ay - z * az;
    let nx = w * ax + x * c + y * az - z * ay;
    let ny = w * ay - x * az + y * c + z * ax;
    let nz = w * az + x * ay - y * ax + z * c;
    const norm = Math.sqrt(nw * nw + nx * nx + ny * ny + nz * nz);
    nw /= norm; nx /= norm; ny /= norm; nz /= norm;
    q[0] = nw; q[1] = nx; q[2] = ny; q[3] = nz;
    this.note(turn / dt);
    return false;
  }

  /** Place the attitude without a transient (start of a trial): forget the rates. */
  resetRates(): void {
    this.rate = 0;
    this.peakRate = 0;
  }

  private note(rate: number): void {
    this.rate = rate;
    if (rate > this.peakRate) this.peakRate = rate;
  }
}
