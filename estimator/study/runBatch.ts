// Run a batch of trials through any executor and collect the parsed records by point —
// the building block of requirement finding, sensitivity and tuning.
import type { Scenario } from '../sim/Scenario.js';
import type { SweepRecord } from './resultsFile.js';
import type { Params } from './sweepDesign.js';
import type { TrialExecutor } from './trialExecutor.js';

export interface BatchRequest {
  scenario: Scenario;
  seed: number;
  /** The settings to run; point i of the batch uses key point `pointOffset + i`. */
  points: Params[];
  /** Key point of the first setting (default 0); earlier indices are not run. */
  pointOffset?: number;
  /** Trial indices [trialStart, trialEnd) at every point. */
  trialStart: number;
  trialEnd: number;
}

/**
 * Records per point, each sorted by trial. Keys are (seed, pointOffset + index, trial): batches
 * that run other settings at the same key point reuse its random streams (common random numbers).
 */
export async function runBatch(executor: TrialExecutor, request: BatchRequest, onTrial?: () => void): Promise<SweepRecord[][]> {
  const { points, trialStart, trialEnd } = request;
  const offset = request.pointOffset ?? 0;
  const pairs: number[] = [];
  for (let p = 0; p < points.length; p++) for (let t = trialStart; t < trialEnd; t++) pairs.push(offset + p, t);
  const out: SweepRecord[][] = points.map(() => []);
  // Placeholders below the offset are never run (scenarios are built lazily per point).
  const jobPoints = [...Array.from({ length: offset }, () => points[0]!), ...points];
  await executor.run({ scenario: request.scenario, seed: request.seed, points: jobPoints, items: Int32Array.from(pairs) }, (line) => {
    const record = JSON.parse(line) as SweepRecord;
    out[record.point - offset]!.push(record);
    onTrial?.();
  });
  for (const list of out) list.sort((a, b) => a.trial - b.trial);
  return out;
}
