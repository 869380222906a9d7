// The real trial of a study: the closed-loop simulation, keyed by (seed, point, trial) only.
import type { Scenario } from '../sim/Scenario.js';
import type { TrialResult } from '../sim/TrialResult.js';
import { runTrial } from '../sim/runTrial.js';
import type { TrialKey } from './trialExecutor.js';

export function simulateTrial(scenario: Scenario, key: TrialKey): TrialResult {
  return runTrial(scenario, { key: { seed: key.seed, point: key.point, trial: key.trial } });
}
