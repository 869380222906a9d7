// Scripted discrete gusts (scenario lander.wind.gusts) added to the wind: each a "1 - cosine"
// pulse, the usual shape for a single gust (common practice),
//   v(t) = speed/2 (1 - cos(2 pi (t - time) / duration))   for time <= t < time + duration,
// blowing towards directionDeg. add() allocates nothing.
import type { ScriptedGust } from '../Scenario.js';

export class ScriptedGusts {
  private readonly start: Float64Array;
  private readonly duration: Float64Array;
  private readonly east: Float64Array;
  private readonly north: Float64Array;
  readonly count: number;

  constructor(gusts: readonly ScriptedGust[]) {
    this.count = gusts.length;
    this.start = Float64Array.from(gusts, (g) => g.time);
    this.duration = Float64Array.from(gusts, (g) => g.duration);
    this.east = Float64Array.from(gusts, (g) => g.speed * Math.cos((g.directionDeg * Math.PI) / 180));
    this.north = Float64Array.from(gusts, (g) => g.speed * Math.sin((g.directionDeg * Math.PI) / 180));
  }

  /** Add the gusts blowing at time t (s) to wind[0..1] (m/s, ENU). */
  add(t: number, wind: Float64Array): void {
    for (let i = 0; i < this.count; i++) {
      const s = t - this.start[i]!;
      if (s < 0 || s >= this.duration[i]!) continue;
      const shape = 0.5 * (1 - Math.cos((2 * Math.PI * s) / this.duration[i]!));
      wind[0] = wind[0]! + shape * this.east[i]!;
      wind[1] = wind[1]! + shape * this.north[i]!;
    }
  }
}
