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

export class TruthPairing {
  private readonly maxGap: number;
  private readonly emit: (t: number, r: Float64Array, vC: Float64Array, vL: Float64Array) => void;
  private readonly waiting: ReferenceSample[] = [];
  private readonly carriers: ReferenceSample[] = [];
  private readonly r = new Float64Array(3);
  private readonly vC = new Float64Array(3);
  private readonly vL = new Float64Array(3);
  readonly counts: TruthCounts = { rows: 0, unpaired: 0 };

  constructor(maxGap: number, emit: (t: number, r: Float64Array, vC: Float64Array, vL: Float64Array) => void) {
    this.maxGap = maxGap;
    this.emit = emit;
  }

  lander(sample: ReferenceSample): void {
    const last = this.carriers.at(-1);
    if (last !== undefined && last[0]! >= sample[0]!) return this.pairWithHistory(sample);
    if (this.waiting.length >= MAX_WAITING) {
      this.waiting.shift();
      this.counts.unpaired++;
    }
    this.waiting.push(sample);
  }

  carrier(sample: ReferenceSample): void {
    const last = this.carriers.at(-1);
    if (last !== undefined && !(sample[0]! > last[0]!)) return; // out of order or repeated: the earlier one stands
    if (this.carriers.length >= CARRIER_HISTORY) this.carriers.shift();
    this.carriers.push(sample);
    while (this.waiting.length > 0 && this.waiting[0]![0]! <= sample[0]!) this.pairWithHistory(this.waiting.shift()!);
  }

  /** The recording ended: lander samples still waiting have no carrier sample after them. */
  finish(): void {
    this.counts.unpaired += this.waiting.length;
    this.waiting.length = 0;
  }

  /** Pair a lander sample whose time the carrier history reaches. */
  private pairWithHistory(lander: ReferenceSample): void {
    const t = lander[0]!;
    const h = this.carriers;
    let k = h.length - 1;
    while (k > 0 && h[k]![0]! > t) k--;
    const c0 = h[k]!;
    if (c0[0] === t) return this.pair(lander, c0, c0, 0);
    const c1 = h[k + 1];
    if (c0[0]! > t || c1 === undefined || c1[0]! - c0[0]! > this.maxGap) {
      this.counts.unpaired++;
      return;
    }
    this.pair(lander, c0, c1, (t - c0[0]!) / (c1[0]! - c0[0]!));
  }

  private pair(lander: ReferenceSample, c0: ReferenceSample, c1: ReferenceSample, w: number): void {
    for (let i = 0; i < 3; i++) {
      const p = w === 0 ? c0[1 + i]! : c0[1 + i]! + w * (c1[1 + i]! - c0[1 + i]!);
      const v = w === 0 ? c0[4 + i]! : c0[4 + i]! + w * (c1[4 + i]! - c0[4 + i]!);
      this.r[i] = p - lander[1 + i]!;
      this.vC[i] = v;
      this.vL[i] = lander[4 + i]!;
    }
    this.counts.rows++;
    this.emit(lander[0]!, this.r, this.vC, this.vL);
  }
}
