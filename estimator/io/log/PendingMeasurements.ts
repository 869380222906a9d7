// Measurements whose time is ahead of the filter clock (a box or odometry sample between two
// IMU steps): held, sorted by time, until the next IMU step reaches them, then applied as
// delayed measurements. Preallocated; push/pop allocate nothing.

export const PENDING_BOX = 0;
export const PENDING_ODOMETRY = 1;

export class PendingMeasurements {
  readonly capacity: number;
  private readonly kinds: Int8Array;
  private readonly times: Float64Array;
  private readonly data: Float64Array;
  private readonly streams: string[];
  /** The head's data (copied on peek so callers get a stable array). */
  private readonly headData = new Float64Array(4);
  private count = 0;
  /** Refusals keyed by stream, then reason. */
  private readonly refused = new Map<string, Record<string, number>>();

  constructor(capacity: number) {
    this.capacity = capacity;
    this.kinds = new Int8Array(capacity);
    this.times = new Float64Array(capacity);
    this.data = new Float64Array(4 * capacity);
    this.streams = new Array<string>(capacity).fill('');
  }

  get size(): number {
    return this.count;
  }

  /** Insert by time (after equal times, keeping arrival order); false when full. */
  push(kind: number, time: number, values: ArrayLike<number>, stream: string): boolean {
    if (this.count === this.capacity) return false;
    let i = this.count;
    while (i > 0 && this.times[i - 1]! > time) {
      this.kinds[i] = this.kinds[i - 1]!;
      this.times[i] = this.times[i - 1]!;
      this.streams[i] = this.streams[i - 1]!;
      this.data.copyWithin(4 * i, 4 * (i - 1), 4 * i);
      i--;
    }
    this.kinds[i] = kind;
    this.times[i] = time;
    this.streams[i] = stream;
    for (let k = 0; k < values.length && k < 4; k++) this.data[4 * i + k] = values[k]!;
    this.count++;
    return true;
  }

  peekTime(): number {
    return this.times[0]!;
  }

  peekKind(): number {
    return this.kinds[0]!;
  }

  peekData(): Float64Array {
    for (let k = 0; k < 4; k++) this.headData[k] = this.data[k]!;
    return this.headData;
  }

  /** Note whether the head was used by the filter (refusals are tallied per stream and reason). */
  markOutcome(used: boolean, reason: string): void {
    if (used) return;
    const stream = this.streams[0]!;
    const reasons = this.refused.get(stream) ?? {};
    reasons[reason] = (reasons[reason] ?? 0) + 1;
    this.refused.set(stream, reasons);
  }

  pop(): void {
    if (this.count === 0) return;
    this.kinds.copyWithin(0, 1, this.count);
    this.times.copyWithin(0, 1, this.count);
    this.data.copyWithin(0, 4, 4 * this.count);
    for (let i = 1; i < this.count; i++) this.streams[i - 1] = this.streams[i]!;
    this.count--;
  }

  /** Empty the queue: how many were left, per stream. */
  drain(): Map<string, number> {
    const left = new Map<string, number>();
    for (let i = 0; i < this.count; i++) left.set(this.streams[i]!, (left.get(this.streams[i]!) ?? 0) + 1);
    this.count = 0;
    return left;
  }

  /** Held measurements the filter refused when they were applied, per stream and reason. */
  refusedCounts(): Map<string, Record<string, number>> {
    return this.refused;
  }
}
