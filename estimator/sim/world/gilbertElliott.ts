// Bursty frame loss: the two-state Gilbert–Elliott channel (no loss in Good, all frames lost
// in Bad), and the closed forms its long-run behaviour must match. lost() allocates nothing.
import type { RandomStream } from '../../random/RandomStream.js';

/** Long-run fraction of frames lost: p / (p + r) (Gilbert 1960). */
export function gilbertElliottLossRate(enter: number, exit: number): number {
  return enter + exit > 0 ? enter / (enter + exit) : 0;
}

/** Mean number of consecutive lost frames: 1 / r (geometric sojourn in Bad). */
export function gilbertElliottMeanBurst(exit: number): number {
  return 1 / exit;
}

export class GilbertElliott {
  readonly enter: number;
  readonly exit: number;
  private readonly stream: RandomStream;
  private bad: boolean;

  /**
   * enter = p = P(Good -> Bad), exit = r = P(Bad -> Good), per frame, both in [0, 1].
   * The first frame's state is drawn from the stationary distribution, so the loss rate
   * holds from the start rather than only in the long run.
   */
  constructor(enter: number, exit: number, stream: RandomStream) {
    if (!(enter >= 0 && enter <= 1)) throw new RangeError(`GilbertElliott: enter must lie in [0, 1], got ${enter}`);
    if (!(exit > 0 && exit <= 1)) throw new RangeError(`GilbertElliott: exit must lie in (0, 1], got ${exit}`);
    this.enter = enter;
    this.exit = exit;
    this.stream = stream;
    this.bad = stream.bernoulli(gilbertElliottLossRate(enter, exit));
  }

  /** Advance one frame: true when this frame is lost. The chain moves after each frame. */
  lost(): boolean {
    const lost = this.bad;
    this.bad = this.bad ? !this.stream.bernoulli(this.exit) : this.stream.bernoulli(this.enter);
    return lost;
  }
}
