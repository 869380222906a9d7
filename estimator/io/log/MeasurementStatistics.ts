// What a replay learns about one kind of measurement (boxes or odometry) from the filter's
// answers alone: NIS mean with chi-square acceptance bounds (Bar-Shalom, Li, Kirubarajan
// 2001, section 5.4), gate rejections, refusals by reason, and the NIS sequence's whiteness.
// Counting only; add() allocates nothing but the first entry of a new refusal reason.
import { averagedChiSquareInterval } from '../../stats/chiSquare.js';
import type { UpdateResult } from '../../models/LandingFilter.js';
import { WhitenessAccumulator } from './WhitenessAccumulator.js';

export interface NisSummary {
  /** Mean NIS over accepted updates (gated ones are outside the gate by construction). */
  mean: number | null;
  count: number;
  dim: number;
  /** Two-sided acceptance interval of the mean at `level` for N = count samples, or null. */
  bounds: [number, number] | null;
  /** True when the mean lies inside the bounds. */
  consistent: boolean | null;
  /** Updates refused by the gate (NIS above the chi-square threshold). */
  gated: number;
  /** Updates the filter refused for another reason, by reason (e.g. box-outside-image). */
  refused: Record<string, number>;
}

export class MeasurementStatistics {
  readonly name: string;
  private count = 0;
  private sum = 0;
  private dim = 3;
  private gated = 0;
  private readonly refused: Record<string, number> = {};
  /** Whiteness of the NIS sequence of accepted updates. */
  readonly nisWhiteness: WhitenessAccumulator;

  constructor(name: string, lags: number) {
    this.name = name;
    this.nisWhiteness = new WhitenessAccumulator(`${name} NIS sequence (accepted updates, in order)`, lags);
  }

  /** Why the last refused update was refused (the filter's reason). */
  lastReason = '';

  /** Record one update result; true when it counts as used (accepted or gated). */
  add(result: UpdateResult): boolean {
    if (result.status === 'accepted') {
      if (Number.isFinite(result.nis)) {
        this.count++;
        this.sum += result.nis;
        this.dim = result.dim;
        this.nisWhiteness.add(result.nis);
      }
      return true;
    }
    if (result.status === 'gated') {
      this.gated++;
      return true;
    }
    this.lastReason = result.reason ?? result.status;
    this.refuse(this.lastReason);
    return false;
  }

  refuse(reason: string): void {
    this.refused[reason] = (this.refused[reason] ?? 0) + 1;
  }

  get gateRejections(): number {
    return this.gated;
  }

  summary(level: number): NisSummary {
    const mean = this.count > 0 ? this.sum / this.count : null;
    const bounds = this.count > 0 ? averagedChiSquareInterval(this.count, this.dim, level) : null;
    return {
      mean,
      count: this.count,
      dim: this.dim,
      bounds,
      consistent: mean !== null && bounds !== null ? mean >= bounds[0] && mean <= bounds[1] : null,
      gated: this.gated,
      refused: { ...this.refused },
    };
  }
}
