// Failures of one sweep point (or group) by cause: how many trials failed for each cause the
// attribution named (sim/attribution/attributeFailure.ts), as a rate over the point's trials
// with its Wilson interval, and one trial of each cause to replay step by step.
import type { SweepRecord } from './resultsFile.js';
import { wilson } from './statistics/wilson.js';

/** Trials from results written before attribution existed carry no cause. */
export const NOT_ATTRIBUTED = 'not-attributed';

/** A trial's key: with the results' scenario and the point's values it replays that trial exactly. */
export interface TrialKeyRef {
  seed: number;
  point: number;
  trial: number;
}

export interface CauseCount {
  /** A FailureCause, or 'not-attributed'. */
  cause: string;
  /** Trials that failed for this cause, and their share of all the point's trials with its Wilson interval. */
  count: number;
  rate: number;
  wilsonLow: number;
  wilsonHigh: number;
  /** Outcomes these failures ended in, by name. */
  outcomes: Record<string, number>;
  /** The representative trial: the lowest-numbered one that failed for this cause (a stable pick). */
  example: TrialKeyRef;
}

/**
 * Group a point's failed trials by cause, most frequent first (ties by name).
 * `z`: normal quantile of the Wilson interval (default 1.96, two-sided 95 %).
 */
export function failureCauses(records: readonly SweepRecord[], seed: number, z = 1.96): CauseCount[] {
  const n = records.length;
  const groups = new Map<string, { count: number; outcomes: Record<string, number>; example: SweepRecord }>();
  for (const r of records) {
    if (r.outcome === 'landed') continue;
    const cause = r.cause ?? NOT_ATTRIBUTED;
    const g = groups.get(cause);
    if (g === undefined) groups.set(cause, { count: 1, outcomes: { [r.outcome]: 1 }, example: r });
    else {
      g.count++;
      g.outcomes[r.outcome] = (g.outcomes[r.outcome] ?? 0) + 1;
      if (r.point < g.example.point || (r.point === g.example.point && r.trial < g.example.trial)) g.example = r;
    }
  }
  return [...groups.entries()]
    .sort(([a, x], [b, y]) => y.count - x.count || (a < b ? -1 : 1))
    .map(([cause, g]) => {
      const w = wilson(g.count, n, z);
      return { cause, count: g.count, rate: g.count / n, wilsonLow: w.low, wilsonHigh: w.high, outcomes: g.outcomes, example: { seed, point: g.example.point, trial: g.example.trial } };
    });
}
