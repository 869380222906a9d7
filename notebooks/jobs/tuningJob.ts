// Job: the filter-multiplier search of `alight tune` on simulated trials, with the same library
// pieces (search, batch runner, summaries, tuning cost), so the recommended point here equals
// `alight tune <scenario> --trials N --grid G --refine E --gate 1:1 --seed S --json`.
import type { Scenario } from '../../estimator/sim/Scenario.js';
import { applyParams } from '../../estimator/study/applyParams.js';
import { runBatch } from '../../estimator/study/runBatch.js';
import { searchMultipliers, type Multipliers, type SurfaceSample } from '../../estimator/study/search.js';
import { simulateTrial } from '../../estimator/study/simulateTrial.js';
import { summarizeGroup, type PointSummary } from '../../estimator/study/summarize.js';
import { inProcessExecutor } from '../../estimator/study/trialExecutor.js';
import { tuningCost } from '../../estimator/study/tuningCost.js';
import type { Progress } from './JobState.js';

export interface TuningInput {
  scenario: Scenario;
  seed: number;
  trials: number;
  grid: number;
  refine: number;
  /** Weight of NEES consistency against landing success in the cost (alight tune --nees-weight). */
  neesWeight: number;
  /** Multiplier ranges (alight tune defaults: 0.1..10); the gate stays at 1. */
  q: [number, number];
  r: [number, number];
}

export interface TuningSample extends SurfaceSample {
  summary: PointSummary;
}

export interface TuningOutput {
  samples: TuningSample[];
  best: TuningSample | null;
}

export async function tuningJob(input: TuningInput, progress: Progress<TuningOutput>): Promise<TuningOutput> {
  const executor = inProcessExecutor(simulateTrial, applyParams);
  const details = new Map<string, PointSummary>();
  const samples: TuningSample[] = [];
  const planned = (input.grid * input.grid + input.refine + 1) * input.trials;
  let done = 0;
  const snapshot = (): TuningOutput => ({ samples: samples.slice(), best: null });
  const result = await searchMultipliers(
    async (m: Multipliers) => {
      const params = { 'filter.qScale': m.q, 'filter.rScale': m.r, 'filter.gateScale': m.gate };
      // Key point 0 for every setting: common random numbers across the surface (as alight tune).
      const [records] = await runBatch(executor, { scenario: input.scenario, seed: input.seed, points: [params], trialStart: 0, trialEnd: input.trials }, () => {
        done++;
        progress(done, Math.max(planned, done), snapshot);
      });
      const summary = summarizeGroup(params, records!);
      details.set(`${m.q},${m.r},${m.gate}`, summary);
      return tuningCost(summary, input.neesWeight);
    },
    {
      q: input.q,
      r: input.r,
      gate: [1, 1],
      grid: input.grid,
      refine: input.refine,
      onSample: (s) => samples.push({ ...s, summary: details.get(`${s.q},${s.r},${s.gate}`)! }),
    },
  );
  await executor.close();
  progress(done, done, null);
  const best = samples.find((s) => s.q === result.best.q && s.r === result.best.r && s.gate === result.best.gate) ?? null;
  return { samples, best };
}
