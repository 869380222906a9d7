// Requirement finding: the largest impairment at which the lower Wilson bound of landing
// success stays at or above a target, by bisection with adaptive trial counts.
import { wilson } from './statistics/wilson.js';

export class RequirementError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'RequirementError';
  }
}

export interface Probe {
  value: number;
  trials: number;
  landed: number;
  wilsonLow: number;
  wilsonHigh: number;
  pass: boolean;
  /** meets: lower bound at or above the target; misses: upper bound below it; else inconclusive (treated as not meeting). */
  verdict: 'meets' | 'misses' | 'inconclusive';
}

export interface RequirementOptions {
  /** The good end (expected to pass) and the bad end of the searched range. */
  from: number;
  to: number;
  /** Required success rate for the lower Wilson bound, in (0, 1). */
  target: number;
  /** Largest number of trials at one probe (default 400); batches double from `firstBatch`. */
  maxTrials?: number;
  /** Trials in the first batch of a probe (default 25). */
  firstBatch?: number;
  /** Bisection steps after the two ends (default 6: bracket = range / 64). */
  steps?: number;
  z?: number;
  /**
   * Runs trials [trialStart, trialEnd) at `value` (probe number `probe`) and returns how many
   * landed. Trial streams must depend on (probe, trial) only.
   */
  landedCount: (value: number, probe: number, trialStart: number, trialEnd: number) => Promise<number>;
  onProbe?: (probe: Probe) => void;
}

export interface Requirement {
  /** Largest value (furthest from `from`) that passed; null if even `from` failed. */
  value: number | null;
  /** The first failing value beyond it (null when the whole range passed). */
  failsAt: number | null;
  probes: Probe[];
}

/**
 * Adaptive trial count at one probe: batches of firstBatch, 2·firstBatch, ... up to maxTrials.
 * Stops as soon as the lower Wilson bound reaches the target (pass), or when no outcome of the
 * remaining trials could lift it there, or the upper bound is below target (fail). Looking after
 * each batch makes a pass a little easier than one fixed-size look; the doubling keeps looks few.
 */
async function probeAt(value: number, probe: number, o: Required<Omit<RequirementOptions, 'onProbe'>>): Promise<Probe> {
  let trials = 0;
  let landed = 0;
  let batchEnd = Math.min(o.firstBatch, o.maxTrials);
  for (;;) {
    landed += await o.landedCount(value, probe, trials, batchEnd);
    trials = batchEnd;
    const w = wilson(landed, trials, o.z);
    const best = wilson(landed + (o.maxTrials - trials), o.maxTrials, o.z).low;
    const done = w.low >= o.target || w.high < o.target || best < o.target || trials >= o.maxTrials;
    if (done) {
      const verdict = w.low >= o.target ? 'meets' : w.high < o.target ? 'misses' : 'inconclusive';
      return { value, trials, landed, wilsonLow: w.low, wilsonHigh: w.high, pass: verdict === 'meets', verdict };
    }
    batchEnd = Math.min(o.maxTrials, trials * 2);
  }
}

/**
 * Bisection between `from` (good) and `to` (bad), assuming success falls monotonically from
 * one end to the other. Returns the last passing value; the answer is resolved to
 * |to - from| / 2^steps. The target must be reachable: n of n gives a lower bound n/(n + z²).
 */
export async function findRequirement(options: RequirementOptions): Promise<Requirement> {
  const o = { maxTrials: 400, firstBatch: 25, steps: 6, z: 1.96, ...options };
  if (!(o.target > 0 && o.target < 1)) throw new RequirementError(`--target must be in (0, 1), got ${o.target}`);
  if (!(Number.isFinite(o.from) && Number.isFinite(o.to)) || o.from === o.to) throw new RequirementError(`the range needs two different finite ends, got ${o.from} and ${o.to}`);
  if (o.maxTrials / (o.maxTrials + o.z * o.z) < o.target) {
    const needed = Math.ceil((o.z * o.z * o.target) / (1 - o.target));
    throw new RequirementError(`--trials ${o.maxTrials} can never show ${o.target}: even all landed gives a lower bound of ${(o.maxTrials / (o.maxTrials + o.z * o.z)).toFixed(4)}; use at least ${needed}`);
  }
  const probes: Probe[] = [];
  const run = async (value: number) => {
    const p = await probeAt(value, probes.length, o);
    probes.push(p);
    options.onProbe?.(p);
    return p.pass;
  };
  if (!(await run(o.from))) return { value: null, failsAt: o.from, probes };
  if (await run(o.to)) return { value: o.to, failsAt: null, probes };
  let good = o.from;
  let bad = o.to;
  for (let i = 0; i < o.steps; i++) {
    const mid = Number((good + (bad - good) / 2).toPrecision(12));
    if (await run(mid)) good = mid;
    else bad = mid;
  }
  return { value: good, failsAt: bad, probes };
}
