// The lander's recent attitude estimates, kept so a box can be read with the attitude the
// camera had when it was captured: a start from a box 80 ms old read with the attitude of its
// arrival put the tilt change of those 80 ms (several degrees while the lander leans into a
// chase) into the first estimate, about a metre at 10 m. Ring buffer, allocation-free.

/** Samples that cover a filter history of historyLength (s) plus 0.1 s at rate (Hz): a box older than historyLength starts nothing. */
export function attitudeHistorySize(historyLength: number, rate: number): number {
  return Math.ceil((historyLength + 0.1) * rate) + 4;
}

export class AttitudeHistory {
  private readonly times: Float64Array;
  private readonly quats: Float64Array;
  private head = 0;
  private count = 0;

  /** @param capacity samples kept (>= 1): cover the longest latency at the IMU rate. */
  constructor(readonly capacity: number) {
    if (!(capacity >= 1)) throw new RangeError(`attitude history needs room for a sample (got ${capacity})`);
    this.times = new Float64Array(capacity);
    this.quats = new Float64Array(4 * capacity);
  }

  /** Keep q_wb ([w, x, y, z]) estimated at time t (s); times must not decrease. */
  push(t: number, q: ArrayLike<number>): void {
    const i = (this.head + this.count) % this.capacity;
    if (this.count < this.capacity) this.count++;
    else this.head = (this.head + 1) % this.capacity;
    this.times[i] = t;
    for (let k = 0; k < 4; k++) this.quats[4 * i + k] = q[k]!;
  }

  /**
   * The newest sample at or before t into out (the attitude in force at t); the oldest kept when t
   * is older than all of them. Returns false (out untouched) when nothing is kept.
   */
  at(t: number, out: Float64Array): boolean {
    if (this.count === 0) return false;
    let pick = this.head;
    for (let j = this.count - 1; j >= 0; j--) {
      const i = (this.head + j) % this.capacity;
      if (this.times[i]! <= t) {
        pick = i;
        break;
      }
    }
    for (let k = 0; k < 4; k++) out[k] = this.quats[4 * pick + k]!;
    return true;
  }

  clear(): void {
    this.head = 0;
    this.count = 0;
  }
}
