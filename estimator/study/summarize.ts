// Per sweep point statistics of a results file: success with Wilson interval, miss CEP,
// time to land, outcome counts and filter consistency (NEES/NIS) with its verdict.
import { OUTCOMES, type Outcome } from '../sim/TrialResult.js';
import { failureCauses, type CauseCount } from './failureCauses.js';
import { cep } from './statistics/cep.js';
import { neesVerdict, type Consistency } from './statistics/neesVerdict.js';
import type { EnsembleConsistency } from './statistics/ensembleConsistency.js';
import { descentConsistency } from './statistics/descentConsistency.js';
import { percentile } from './statistics/percentile.js';
import { ruleOfThree } from './statistics/ruleOfThree.js';
import { wilson } from './statistics/wilson.js';
import type { SweepHeader, SweepRecord } from './resultsFile.js';
import type { ParamValue, Params } from './sweepDesign.js';

export interface PointSummary {
  /** The varied values of this point (or group) by path. */
  point: Params;
  trials: number;
  landed: number;
  successRate: number;
  /** Wilson 95 % interval of the success rate. */
  wilsonLow: number;
  wilsonHigh: number;
  /** With no failure: rule-of-three 95 % lower bound on success, 1 - 3/n; otherwise null. */
  ruleOfThreeLow: number | null;
  /** Trials that touched the deck, and the CEP50/CEP95 of their horizontal miss (m). */
  contacts: number;
  cep50: number | null;
  cep95: number | null;
  /** Touchdown time of landed trials (s): 10th, 50th and 90th percentile. */
  timeToLandP10: number | null;
  timeToLandP50: number | null;
  timeToLandP90: number | null;
  outcomes: Record<Outcome, number>;
  /** Average over trials of each trial's mean NEES, its chi-square acceptance interval and verdict. */
  neesMean: number | null;
  neesDim: number | null;
  neesLow: number | null;
  neesHigh: number | null;
  neesVerdict: Consistency | null;
  /** Likewise for NIS over trials that had accepted camera updates. */
  nisMean: number | null;
  nisDim: number | null;
  nisLow: number | null;
  nisHigh: number | null;
  nisVerdict: Consistency | null;
  /** Mean RMS error of the relative position estimate (m). */
  positionRmse: number | null;
  /** Failed trials by attributed cause, with Wilson 95 % intervals and a trial of each to replay. */
  causes: CauseCount[];
  /**
   * Ensemble NEES of the descent per true-height bin (each trial's neesByHeight, bins of
   * DESCENT_HEIGHT_EDGES) judged by ensembleConsistency: per bin the runs, mean, median, robust
   * mean without outlier trials, its 95 % chi-square interval, outliers and verdict; overall the
   * share of bins inside and the verdict (consistent when >= 90 % of bins are). Null when no
   * trial recorded a descent (or the results file predates neesByHeight).
   */
  descentNees: EnsembleConsistency | null;
  /** descentNees.verdict, or null: the verdict every output states (summarize, simulate, replay, page, report). */
  descentNeesVerdict: Consistency | null;
}


export class SummaryError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'SummaryError';
  }
}

function mean(values: number[]): number | null {
  if (values.length === 0) return null;
  let s = 0;
  for (const v of values) s += v;
  return s / values.length;
}

function consistency(values: number[], dims: number[]) {
  const m = mean(values);
  if (m === null) return { mean: null, dim: null, low: null, high: null, verdict: null };
  const dim = dims[0]!;
  if (dims.some((d) => d !== dim) || !(dim > 0)) return { mean: m, dim: null, low: null, high: null, verdict: null };
  const v = neesVerdict(m, values.length, dim);
  return { mean: m, dim, low: v.low, high: v.high, verdict: v.verdict };
}

/** Statistics of one group of trial records; `seed` (the sweep's) goes into the causes' trial keys. */
export function summarizeGroup(point: Params, records: readonly SweepRecord[], seed = 0): PointSummary {
  const trials = records.length;
  const outcomes = Object.fromEntries(OUTCOMES.map((o) => [o, 0])) as Record<Outcome, number>;
  const misses: number[] = [];
  const landTimes: number[] = [];
  const nees: number[] = [], neesDims: number[] = [], nis: number[] = [], nisDims: number[] = [], rmse: number[] = [];
  for (const r of records) {
    outcomes[r.outcome]++;
    if (r.missDistance !== null) misses.push(r.missDistance);
    if (r.outcome === 'landed' && r.touchdownTime !== null) landTimes.push(r.touchdownTime);
    if (typeof r.neesMean === 'number' && Number.isFinite(r.neesMean)) {
      nees.push(r.neesMean);
      neesDims.push(r.neesDim);
    }
    if (r.nisCount > 0 && typeof r.nisMean === 'number' && Number.isFinite(r.nisMean)) {
      nis.push(r.nisMean);
      nisDims.push(r.nisDim);
    }
    if (typeof r.positionRmse === 'number' && Number.isFinite(r.positionRmse)) rmse.push(r.positionRmse);
  }
  const landed = outcomes.landed;
  const w = wilson(landed, trials);
  const n = consistency(nees, neesDims);
  const s = consistency(nis, nisDims);
  const descent = descentConsistency(records.map((r) => r.neesByHeight), neesDims[0] ?? 6);
  return {
    point,
    trials,
    landed,
    successRate: trials > 0 ? landed / trials : 0,
    wilsonLow: w.low,
    wilsonHigh: w.high,
    ruleOfThreeLow: trials > 0 && landed === trials ? 1 - ruleOfThree(trials) : null,
    contacts: misses.length,
    cep50: cep(misses, 0.5),
    cep95: cep(misses, 0.95),
    timeToLandP10: percentile(landTimes, 0.1),
    timeToLandP50: percentile(landTimes, 0.5),
    timeToLandP90: percentile(landTimes, 0.9),
    outcomes,
    neesMean: n.mean, neesDim: n.dim, neesLow: n.low, neesHigh: n.high, neesVerdict: n.verdict,
    nisMean: s.mean, nisDim: s.dim, nisLow: s.low, nisHigh: s.high, nisVerdict: s.verdict,
    positionRmse: mean(rmse),
    causes: failureCauses(records, seed),
    descentNees: descent,
    descentNeesVerdict: descent ? descent.verdict : null,
  };
}

function compareValues(a: ParamValue, b: ParamValue): number {
  if (typeof a === 'number' && typeof b === 'number') return a - b;
  return String(a) < String(b) ? -1 : String(a) > String(b) ? 1 : 0;
}

/**
 * One summary per sweep point, in point order; with `by`, one per value of that varied path
 * (pooling the other paths), in ascending value order. Points without trials are left out.
 */
export function summarize(header: SweepHeader, records: readonly SweepRecord[], by?: string): PointSummary[] {
  if (by !== undefined) {
    const paths = header.vary.map((v) => v.path);
    if (!paths.includes(by)) throw new SummaryError(`--by ${by}: not a varied path of this sweep (varied: ${paths.join(', ') || 'none'})`);
    const groups = new Map<string, { value: ParamValue; records: SweepRecord[] }>();
    for (const r of records) {
      const value = header.points[r.point]![by]!;
      const key = JSON.stringify(value);
      const group = groups.get(key) ?? { value, records: [] };
      group.records.push(r);
      groups.set(key, group);
    }
    return [...groups.values()].sort((a, b) => compareValues(a.value, b.value)).map((g) => summarizeGroup({ [by]: g.value }, g.records, header.seed));
  }
  const byPoint: SweepRecord[][] = header.points.map(() => []);
  for (const r of records) byPoint[r.point]!.push(r);
  const out: PointSummary[] = [];
  byPoint.forEach((group, i) => {
    if (group.length > 0) out.push(summarizeGroup(header.points[i]!, group.sort((a, b) => a.trial - b.trial), header.seed));
  });
  return out;
}
