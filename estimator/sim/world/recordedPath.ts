// A carrier path replayed from recorded rows (t, x, y, z): cubic Hermite interpolation with
// finite-difference tangents, so position and velocity are continuous and the velocity is
// the derivative of the interpolated position. Evaluation is allocation-free.
import { CarrierPathError } from './CarrierPathError.js';

/** Position, velocity, acceleration (ENU, m, m/s, m/s^2) and heading of travel (rad). */
export interface RecordedSample {
  position: Float64Array;
  velocity: Float64Array;
  acceleration: Float64Array;
  heading: number;
}

export class RecordedPath {
  /** Time of the first row: trial time 0 maps onto it. */
  readonly startTime: number;
  readonly duration: number;
  private readonly t: Float64Array;
  private readonly p: Float64Array; // n x 3
  private readonly m: Float64Array; // n x 3 tangents dp/dt
  private readonly chordHeading: Float64Array; // heading of each interval's chord (carried over when still)

  /** rows: [t, x, y, z] with strictly increasing t; at least two rows. `source` names them in errors. */
  constructor(rows: readonly (readonly number[])[], source = 'carrier.path.file') {
    const n = rows.length;
    if (n < 2) throw new CarrierPathError(source, `a recorded path needs at least 2 rows of t,x,y,z, got ${n}`);
    this.t = new Float64Array(n);
    this.p = new Float64Array(3 * n);
    for (let i = 0; i < n; i++) {
      const row = rows[i]!;
      if (row.length < 4 || !row.slice(0, 4).every(Number.isFinite)) {
        throw new CarrierPathError(`${source} row ${i + 1}`, `expected four finite numbers t,x,y,z, got ${JSON.stringify(row)}`);
      }
      if (i > 0 && !(row[0]! > rows[i - 1]![0]!)) {
        throw new CarrierPathError(`${source} row ${i + 1}`, `time must increase strictly, got ${row[0]} after ${rows[i - 1]![0]}`);
      }
      this.t[i] = row[0]!;
      for (let k = 0; k < 3; k++) this.p[3 * i + k] = row[k + 1]!;
    }
    this.startTime = this.t[0]!;
    this.duration = this.t[n - 1]! - this.startTime;
    // Tangents: central differences inside, one-sided at the ends (zero at the very ends so the
    // carrier comes to rest when the recording runs out rather than jumping in velocity).
    this.m = new Float64Array(3 * n);
    for (let i = 1; i < n - 1; i++) {
      const dt = this.t[i + 1]! - this.t[i - 1]!;
      for (let k = 0; k < 3; k++) this.m[3 * i + k] = (this.p[3 * (i + 1) + k]! - this.p[3 * (i - 1) + k]!) / dt;
    }
    this.chordHeading = new Float64Array(n - 1);
    let heading = 0;
    let seen = false;
    for (let i = 0; i < n - 1; i++) {
      const dx = this.p[3 * (i + 1)]! - this.p[3 * i]!;
      const dy = this.p[3 * (i + 1) + 1]! - this.p[3 * i + 1]!;
      if (Math.hypot(dx, dy) > 1e-9) {
        heading = Math.atan2(dy, dx);
        if (!seen) this.chordHeading.fill(heading, 0, i); // still at the start: face the first move
        seen = true;
      }
      this.chordHeading[i] = heading;
    }
  }

  /**
   * State at trial time t (s after the first row). Before the first row and after the last
   * the carrier stands still at the end point.
   * Hermite basis on u in [0, 1], interval length h:
   *   p = h00 p0 + h10 h m0 + h01 p1 + h11 h m1, v = dp/du / h, a = d2p/du2 / h^2.
   */
  sample(t: number, out: RecordedSample): RecordedSample {
    const times = this.t;
    const n = times.length;
    const time = Math.min(Math.max(t + this.startTime, times[0]!), times[n - 1]!);
    let lo = 0;
    let hi = n - 2;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (times[mid]! <= time) lo = mid;
      else hi = mid - 1;
    }
    const h = times[lo + 1]! - times[lo]!;
    const u = (time - times[lo]!) / h;
    const u2 = u * u;
    const u3 = u2 * u;
    const h00 = 2 * u3 - 3 * u2 + 1, h10 = u3 - 2 * u2 + u, h01 = -2 * u3 + 3 * u2, h11 = u3 - u2;
    const d00 = 6 * u2 - 6 * u, d10 = 3 * u2 - 4 * u + 1, d01 = -6 * u2 + 6 * u, d11 = 3 * u2 - 2 * u;
    const e00 = 12 * u - 6, e10 = 6 * u - 4, e01 = -12 * u + 6, e11 = 6 * u - 2;
    const outside = t + this.startTime <= times[0]! || t + this.startTime >= times[n - 1]!;
    for (let k = 0; k < 3; k++) {
      const p0 = this.p[3 * lo + k]!, p1 = this.p[3 * (lo + 1) + k]!;
      const m0 = this.m[3 * lo + k]! * h, m1 = this.m[3 * (lo + 1) + k]! * h;
      out.position[k] = h00 * p0 + h10 * m0 + h01 * p1 + h11 * m1;
      out.velocity[k] = outside ? 0 : (d00 * p0 + d10 * m0 + d01 * p1 + d11 * m1) / h;
      out.acceleration[k] = outside ? 0 : (e00 * p0 + e10 * m0 + e01 * p1 + e11 * m1) / (h * h);
    }
    const vx = out.velocity[0]!, vy = out.velocity[1]!;
    out.heading = Math.hypot(vx, vy) > 1e-6 ? Math.atan2(vy, vx) : this.chordHeading[lo]!;
    return out;
  }
}
