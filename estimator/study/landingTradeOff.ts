// Tuning for landing: the same trials (common random numbers: key point 0 for every setting)
// flown with Q and R multipliers on a log grid around a base setting (e.g. the identified
// noise), each judged on landing success (Wilson 95 %) and on consistency (ANEES against its
// chi-square interval, Bar-Shalom, Li, Kirubarajan 2001, 5.4). The answer is the set of
// non-dominated settings on (success, closeness of ANEES to its dimension), not one blend.
import type { FilterSpec } from '../sim/Scenario.js';
import type { Scenario } from '../sim/Scenario.js';
import { nonDominated } from './nonDominated.js';
import { runBatch } from './runBatch.js';
import { summarizeGroup, type PointSummary } from './summarize.js';
import type { TrialExecutor } from './trialExecutor.js';

export interface TradeOffOptions {
  seed: number;
  trials: number;
  /** Multiplier ranges (> 0) and points per axis, log-spaced with the ends included (lo = hi fixes an axis). */
  q: [number, number];
  r: [number, number];
  grid: number;
  onSetting?: (done: number, total: number) => void;
  onTrial?: () => void;
}

export interface TradeOffSetting {
  qScale: number;
  rScale: number;
  summary: PointSummary;
  /** |ln(ANEES / n)|: 0 for a consistent mean, ln 2 for a factor 2 either way; null without NEES. */
  neesDistance: number | null;
  nonDominated: boolean;
}

export interface LandingTradeOff {
  settings: TradeOffSetting[];
  /** Indices of the non-dominated settings, by success (best first). */
  front: number[];
  /** The most successful non-dominated setting whose NEES verdict is consistent, else the front's most consistent one; null when no setting has NEES. */
  chosen: number | null;
  rule: string;
}

export const TRADE_OFF_RULE = 'settings kept: no other lands more often while being at least as consistent (|ln(ANEES/n)|), or is more consistent while landing as often; ' +
  'named: the most successful of them whose NEES verdict is consistent, else the most consistent of them';

function levels([lo, hi]: [number, number], n: number): number[] {
  if (!(lo > 0 && hi >= lo)) throw new RangeError(`landingTradeOff: a multiplier range needs 0 < lo <= hi, got ${lo}:${hi}`);
  if (hi === lo || n <= 1) return [hi === lo ? lo : Math.sqrt(lo * hi)];
  return Array.from({ length: n }, (_, i) => Number((lo * (hi / lo) ** (i / (n - 1))).toPrecision(6)));
}

export async function landingTradeOff(executor: TrialExecutor, scenario: Scenario, base: FilterSpec, options: TradeOffOptions): Promise<LandingTradeOff> {
  const grid: { qScale: number; rScale: number }[] = [];
  for (const qScale of levels(options.q, options.grid)) for (const rScale of levels(options.r, options.grid)) grid.push({ qScale, rScale });
  const tuned: Scenario = { ...scenario, filter: { ...base } };
  const settings: TradeOffSetting[] = [];
  for (const [k, g] of grid.entries()) {
    const params = { 'filter.qScale': g.qScale, 'filter.rScale': g.rScale };
    const [records] = await runBatch(executor, { scenario: tuned, seed: options.seed, points: [params], trialStart: 0, trialEnd: options.trials }, options.onTrial);
    const summary = summarizeGroup(params, records!);
    const neesDistance = summary.neesMean !== null && summary.neesDim !== null && summary.neesMean > 0 ? Math.abs(Math.log(summary.neesMean / summary.neesDim)) : null;
    settings.push({ ...g, summary, neesDistance, nonDominated: false });
    options.onSetting?.(k + 1, grid.length);
  }
  const front = nonDominated(settings.map((s) => ({ a: s.summary.successRate, b: s.neesDistance === null ? Number.NaN : -s.neesDistance })));
  for (const i of front) settings[i]!.nonDominated = true;
  front.sort((i, j) => settings[j]!.summary.successRate - settings[i]!.summary.successRate);
  const consistent = front.filter((i) => settings[i]!.summary.neesVerdict === 'consistent');
  const withNees = front.filter((i) => settings[i]!.neesDistance !== null);
  const chosen = consistent[0] ?? withNees.sort((i, j) => settings[i]!.neesDistance! - settings[j]!.neesDistance!)[0] ?? null;
  return { settings, front, chosen, rule: TRADE_OFF_RULE };
}
