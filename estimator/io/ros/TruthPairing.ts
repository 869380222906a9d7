// truth.csv from two reference topics (lander and carrier odometry, one world frame): a row at
// each lander message, the carrier's position and velocity interpolated linearly between its
// two messages around that time. Streaming: lander samples wait in a short queue until a
// carrier sample at or after their time arrives; the queue is bounded (samples too old to be
// paired are counted, not kept).
//   r = p_c(t) - p_l(t),   x_c(t) = x_c(t0) + (t - t0) / (t1 - t0) (x_c(t1) - x_c(t0))

/** [t, px, py, pz, vx, vy, vz] of one reference sample (s, ENU m, ENU m/s). */
export type ReferenceSample = Float64Array;

export interface TruthCounts {
  rows: number;
  /** Lander samples with no carrier samples around them within maxGap. */
  unpaired: number;
}

const MAX_WAITING = 4096;
/** Carrier samples kept to pair lander samples that come later in the recording. */
const CARRIER_HISTORY = 256;
const WIDTH = 7;

/**
 * Reference samples in one preallocated ring (oldest first): a sample is copied in, so callers
 * may reuse theirs, and a long recording allocates nothing per sample.
 */
class SampleRing {
  readonly data: Float64Array;
  private readonly capacity: number;
  private start = 0;
  length = 0;

  constructor(capacity: number) {
    this.capacity = capacity;
    this.data = new Float64Array(capacity * WIDTH);
  }

  /** Where sample i (0 = oldest) starts in data. */
  at(i: number): number {
    return ((this.start + i) % this.capacity) * WIDTH;
  }

  push(sample: ReferenceSample): void {
    if (this.length === this.capacity) this.shift();
    this.data.set(sample, this.at(this.length));
    this.length++;
  }

  shift(): void {
    this.start = (this.start + 1) % this.capacity;
    this.length--;
  }
}

export class TruthPairing {
  private readonly maxGap: number;
  private readonly emit: (t: number, r: Float64Array, vC: Float64Array, vL: Float64Array) => void;
  private readonly waiting = new SampleRing(MAX_WAITING);
  private readonly carriers = new SampleRing(CARRIER_HISTORY);
  private readonly r = new Float64Array(3);
  private readonly vC = new Float64Array(3);
  private readonly vL = new Float64Array(3);
  readonly counts: TruthCounts = { rows: 0, unpaired: 0 };

  constructor(maxGap: number, emit: (t: number, r: Float64Array, vC: Float64Array, vL: Float64Array) => void) {
    this.maxGap = maxGap;
    this.emit = emit;
  }

  /** A lander sample (copied: the caller may reuse it). */
  lander(sample: ReferenceSample): void {
    const h = this.carriers;
    if (h.length > 0 && h.data[h.at(h.length - 1)]! >= sample[0]!) return this.pairWithHistory(sample, 0);
    if (this.waiting.length >= MAX_WAITING) this.counts.unpaired++; // the oldest waiting sample gives way
    this.waiting.push(sample);
  }

  /** A carrier sample (copied: the caller may reuse it). */
  carrier(sample: ReferenceSample): void {
    const h = this.carriers;
    if (h.length > 0 && !(sample[0]! > h.data[h.at(h.length - 1)]!)) return; // out of order or repeated: the earlier one stands
    h.push(sample);
    const w = this.waiting;
    while (w.length > 0 && w.data[w.at(0)]! <= sample[0]!) {
      this.pairWithHistory(w.data, w.at(0));
      w.shift();
    }
  }

  /** The recording ended: lander samples still waiting have no carrier sample after them. */
  finish(): void {
    this.counts.unpaired += this.waiting.length;
    while (this.waiting.length > 0) this.waiting.shift();
  }

  /** Pair the lander sample at `l` in `lander` whose time the carrier history reaches. */
  private pairWithHistory(lander: Float64Array, l: number): void {
    const t = lander[l]!;
    const h = this.carriers, d = h.data;
    let k = h.length - 1;
    while (k > 0 && d[h.at(k)]! > t) k--;
    const c0 = h.at(k);
    if (d[c0] === t) return this.pair(lander, l, c0, c0, 0);
    if (d[c0]! > t || k + 1 >= h.length) {
      this.counts.unpaired++;
      return;
    }
    const c1 = h.at(k + 1);
    if (d[c1]! - d[c0]! > this.maxGap) {
      this.counts.unpaired++;
      return;
    }
    this.pair(lander, l, c0, c1, (t - d[c0]!) / (d[c1]! - d[c0]!));
  }

  private pair(lander: Float64Array, l: number, c0: number, c1: number, w: number): void {
    const d = this.carriers.data;
    for (let i = 0; i < 3; i++) {
      const p = w === 0 ? d[c0 + 1 + i]! : d[c0 + 1 + i]! + w * (d[c1 + 1 + i]! - d[c0 + 1 + i]!);
      const v = w === 0 ? d[c0 + 4 + i]! : d[c0 + 4 + i]! + w * (d[c1 + 4 + i]! - d[c0 + 4 + i]!);
      this.r[i] = p - lander[l + 1 + i]!;
      this.vC[i] = v;
      this.vL[i] = lander[l + 4 + i]!;
    }
    this.counts.rows++;
    this.emit(lander[l]!, this.r, this.vC, this.vL);
  }
}
