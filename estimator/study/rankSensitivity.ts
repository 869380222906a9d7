// Sensitivity ranking: one impairment at a time around the scenario, how much landing success
// is lost from the good to the bad end of each impairment's plausible range, with an interval.
import { differenceInterval } from './statistics/differenceInterval.js';
import { wilson } from './statistics/wilson.js';
import type { PlausibleRange } from './plausibleRanges.js';

export interface EndResult {
  value: number;
  trials: number;
  landed: number;
  rate: number;
  low: number;
  high: number;
}

export interface SensitivityRow {
  path: string;
  good: EndResult;
  bad: EndResult;
  /** Success lost over the plausible range (good rate - bad rate), Newcombe hybrid 95 % interval. */
  loss: number;
  lossLow: number;
  lossHigh: number;
  /** Loss per unit of the parameter (per m, per px, ...). */
  lossPerUnit: number;
}

export function endResult(value: number, landed: number, trials: number): EndResult {
  const w = wilson(landed, trials);
  return { value, trials, landed, rate: trials > 0 ? landed / trials : 0, low: w.low, high: w.high };
}

/**
 * Rows ranked by the loss over the range, largest first (ties: wider interval lower, then path).
 * Each factor's ends are separate samples, so the difference interval is for independent proportions.
 */
export function rankSensitivity(factors: readonly PlausibleRange[], counts: readonly { good: [number, number]; bad: [number, number] }[]): SensitivityRow[] {
  const rows = factors.map((f, i) => {
    const c = counts[i]!;
    const good = endResult(f.from, c.good[0], c.good[1]);
    const bad = endResult(f.to, c.bad[0], c.bad[1]);
    const d = differenceInterval(c.good[0], c.good[1], c.bad[0], c.bad[1]);
    return { path: f.path, good, bad, loss: d.difference, lossLow: d.low, lossHigh: d.high, lossPerUnit: d.difference / Math.abs(f.to - f.from) };
  });
  return rows.sort((a, b) => b.loss - a.loss || b.lossLow - a.lossLow || (a.path < b.path ? -1 : 1));
}
