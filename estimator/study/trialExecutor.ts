// Running trials: the executor interface, and the in-process executor (also used by workers).
import type { Scenario } from '../sim/Scenario.js';
import type { TrialResult } from '../sim/TrialResult.js';
import { formatRecord } from './resultsFile.js';
import type { Params } from './sweepDesign.js';

/** Streams of a trial derive from these alone (same as runTrial's TrialKey). */
export interface TrialKey {
  seed: number;
  point: number;
  trial: number;
}
export type TrialFunction = (scenario: Scenario, key: TrialKey) => TrialResult;
/** Returns the scenario with the point's values set (validated), e.g. by setPath. */
export type ApplyParams = (scenario: Scenario, params: Params) => Scenario;

export interface TrialJob {
  scenario: Scenario;
  seed: number;
  points: Params[];
  /** Work as (point, trial) pairs: items[2i] = point, items[2i + 1] = trial. */
  items: Int32Array;
}

/** Receives each finished trial as its record line (no newline), in completion order. */
export type LineSink = (line: string) => void;

export interface TrialExecutor {
  /** Runs every item of the job; resolves when all lines were delivered. */
  run(job: TrialJob, sink: LineSink): Promise<void>;
  /** Releases threads; the executor may not be used afterwards. */
  close(): Promise<void>;
}

export class TrialError extends Error {
  /** False when a point's values were refused (bad input); true when the trial itself failed. */
  readonly internal: boolean;
  constructor(message: string, internal = false) {
    super(message);
    this.name = 'TrialError';
    this.internal = internal;
  }
}

/** Runs items[start..end) (pair indices) synchronously; shared by the in-process executor and the worker. */
export function runItems(job: TrialJob, start: number, end: number, trial: TrialFunction, apply: ApplyParams,
  cache: Map<number, Scenario>, sink: LineSink): void {
  for (let i = start; i < end; i++) {
    const point = job.items[2 * i]!;
    const index = job.items[2 * i + 1]!;
    const params = job.points[point]!;
    let scenario = cache.get(point);
    try {
      if (!scenario) {
        scenario = apply(job.scenario, params);
        cache.set(point, scenario);
      }
      sink(formatRecord(point, index, params, trial(scenario, { seed: job.seed, point, trial: index })));
    } catch (error) {
      if (error instanceof TrialError) throw error;
      const refused = (error as Error)?.name === 'ScenarioError';
      throw new TrialError(`point ${point} ${JSON.stringify(params)} trial ${index}: ${(error as Error)?.message ?? String(error)}`, !refused);
    }
  }
}

/** Runs trials on the calling thread, yielding to the event loop every ~50 ms (progress, signals). */
export function inProcessExecutor(trial: TrialFunction, apply: ApplyParams): TrialExecutor {
  return {
    async run(job, sink) {
      const cache = new Map<number, Scenario>();
      const total = job.items.length / 2;
      let i = 0;
      while (i < total) {
        const started = Date.now();
        let end = i;
        while (end < total && Date.now() - started < 50) {
          runItems(job, end, end + 1, trial, apply, cache, sink);
          end++;
        }
        i = end;
        if (i < total) await new Promise((resolve) => setTimeout(resolve, 0));
      }
    },
    async close() {},
  };
}
