// Job: what `alight tune <scenario>` does, with the same library calls, so the page and the
// report show the numbers `alight tune <scenario> --logs K --trials N --grid G --free ... --seed S
// --json` prints: noise identified from K recorded trials, then the landing trade-off of Q and R
// multipliers around the identified setting.
import type { Scenario } from '../../estimator/sim/Scenario.js';
import type { SettingCheck } from '../../estimator/io/log/settingCheck.js';
import { applyParams } from '../../estimator/study/applyParams.js';
import { identifyScenarioNoise } from '../../estimator/study/identifyScenarioNoise.js';
import type { NoiseIdentification } from '../../estimator/study/identifyNoise.js';
import { landingTradeOff, type LandingTradeOff } from '../../estimator/study/landingTradeOff.js';
import type { NoiseTermName } from '../../estimator/study/noiseTerms.js';
import { simulateTrial } from '../../estimator/study/simulateTrial.js';
import { inProcessExecutor } from '../../estimator/study/trialExecutor.js';
import type { Progress } from './JobState.js';

export interface TuningInput {
  scenario: Scenario;
  seed: number;
  /** Recorded trials to identify from, and the terms freed. */
  logs: number;
  free: NoiseTermName[];
  /** Trade-off: trials per setting, grid points per multiplier and the multiplier ranges. */
  trials: number;
  grid: number;
  q: [number, number];
  r: [number, number];
}

export interface TuningOutput {
  identification: NoiseIdentification;
  checks: { current: SettingCheck; recommended: SettingCheck };
  warnings: string[];
  /** Null until the trade-off grid has finished. */
  tradeOff: LandingTradeOff | null;
}

/** Progress units: the identification counts as one unit per recorded log, then one per trade-off trial. */
export async function tuningJob(input: TuningInput, progress: Progress<TuningOutput>): Promise<TuningOutput> {
  const total = input.logs + input.grid * input.grid * input.trials;
  progress(0, total, null);
  const identified = await identifyScenarioNoise(input.scenario, { seed: input.seed, logs: input.logs, free: input.free });
  // Only what the figures need crosses to the page (the replay reports stay behind).
  const out: TuningOutput = { identification: identified.identification, checks: identified.checks, warnings: identified.warnings, tradeOff: null };
  let done = input.logs;
  progress(done, total, () => out);
  const executor = inProcessExecutor(simulateTrial, applyParams);
  try {
    out.tradeOff = await landingTradeOff(executor, input.scenario, identified.recommended, {
      seed: input.seed, trials: input.trials, grid: input.grid, q: input.q, r: input.r,
      onTrial: () => progress(++done, total, () => out),
    });
  } finally {
    await executor.close();
  }
  progress(total, total, null);
  return out;
}
