// Scripted detector events (scenario detector.script): windows of capture time in which the
// carrier is lost, frames arrive late, or a confusable box is reported instead of the carrier.
// They make constructed studies whose cause is known. Queries allocate nothing.
import type { DetectorEvent } from '../Scenario.js';

const KIND_DROPOUT = 0;
const KIND_LATENCY = 1;
const KIND_FALSE_BOX = 2;

export class DetectorScript {
  private readonly kind: Uint8Array;
  private readonly start: Float64Array;
  private readonly end: Float64Array;
  private readonly delay: Float64Array;
  readonly count: number;
  /** Longest scripted delay (s), 0 without latency events: sizes the detector's frame ring. */
  readonly maxLatency: number;

  constructor(events: readonly DetectorEvent[]) {
    this.count = events.length;
    this.kind = new Uint8Array(this.count);
    this.start = new Float64Array(this.count);
    this.end = new Float64Array(this.count);
    this.delay = new Float64Array(this.count);
    let maxLatency = 0;
    events.forEach((e, i) => {
      this.kind[i] = e.kind === 'dropout' ? KIND_DROPOUT : e.kind === 'latency' ? KIND_LATENCY : KIND_FALSE_BOX;
      this.start[i] = e.time;
      this.end[i] = e.time + e.duration;
      this.delay[i] = e.latency ?? 0;
      if (e.kind === 'latency') maxLatency = Math.max(maxLatency, e.latency ?? 0);
    });
    this.maxLatency = maxLatency;
  }

  /** Index of the first event of this kind whose window [time, time + duration) holds t, else -1. */
  private find(kind: number, t: number): number {
    for (let i = 0; i < this.count; i++) if (this.kind[i] === kind && t >= this.start[i]! && t < this.end[i]!) return i;
    return -1;
  }

  /** The carrier's box of a frame captured at t is lost. */
  lostAt(t: number): boolean {
    return this.find(KIND_DROPOUT, t) >= 0;
  }

  /** Scripted delay (s) of a frame captured at t, or NaN when none applies. */
  latencyAt(t: number): number {
    const i = this.find(KIND_LATENCY, t);
    return i >= 0 ? this.delay[i]! : Number.NaN;
  }

  /** A confusable box replaces the carrier's in the frame captured at t. */
  falseBoxAt(t: number): boolean {
    return this.find(KIND_FALSE_BOX, t) >= 0;
  }
}
