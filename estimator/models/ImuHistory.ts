// The lander's recent IMU samples (time, specific force, attitude estimate), kept so a filter can
// start at a box's capture time and re-propagate to now: a start at the box's arrival had no
// history before it, so every box captured during the latency window was refused as too old,
// and the single-box start (about a metre off in height at 8 m) then gated the boxes after it.
// Ring buffer, allocation-free.

export class ImuHistory {
  private readonly times: Float64Array;
  private readonly forces: Float64Array;
  private readonly quats: Float64Array;
  private head = 0;
  private count = 0;

  /** @param capacity samples kept (>= 1): cover the longest latency at the IMU rate. */
  constructor(readonly capacity: number) {
    if (!(capacity >= 1)) throw new RangeError(`IMU history needs room for a sample (got ${capacity})`);
    this.times = new Float64Array(capacity);
    this.forces = new Float64Array(3 * capacity);
    this.quats = new Float64Array(4 * capacity);
  }

  /** Keep the sample at time t (s): specific force f (body FLU, m/s²), attitude q_wb [w, x, y, z]. Times must not decrease. */
  push(t: number, f: ArrayLike<number>, q: ArrayLike<number>): void {
    const i = (this.head + this.count) % this.capacity;
    if (this.count < this.capacity) this.count++;
    else this.head = (this.head + 1) % this.capacity;
    this.times[i] = t;
    for (let k = 0; k < 3; k++) this.forces[3 * i + k] = f[k]!;
    for (let k = 0; k < 4; k++) this.quats[4 * i + k] = q[k]!;
  }

  /** Samples kept. */
  get size(): number {
    return this.count;
  }

  /** Time of the j-th kept sample, oldest first (0 <= j < size). */
  time(j: number): number {
    return this.times[(this.head + j) % this.capacity]!;
  }

  /** Force and attitude of the j-th kept sample into f (3) and q (4). */
  sample(j: number, f: Float64Array, q: Float64Array): void {
    const i = (this.head + j) % this.capacity;
    for (let k = 0; k < 3; k++) f[k] = this.forces[3 * i + k]!;
    for (let k = 0; k < 4; k++) q[k] = this.quats[4 * i + k]!;
  }

  clear(): void {
    this.head = 0;
    this.count = 0;
  }
}
