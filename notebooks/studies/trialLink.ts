// A permalink that opens one trial of a sweep in the landing study, step by step: the sweep
// point's scenario, the sweep's seed and the trial's (point, trial) key, so the landing study
// flies exactly the trial the sweep flew.
import type { Scenario } from '../../estimator/sim/Scenario.js';
import { applyParams } from '../../estimator/study/applyParams.js';
import type { TrialKeyRef } from '../../estimator/study/failureCauses.js';
import type { Params } from '../../estimator/study/sweepDesign.js';
import { VERSION } from '../../estimator/version.js';
import { analysisToText } from '../analysis/Analysis.js';
import { permalinkFragment } from '../analysis/permalink.js';
import { landingStudy } from './landingStudy.js';
import { parameterProblem } from './Parameter.js';

/**
 * The fragment (#analysis=...) of the landing study on this trial, or null when the point's
 * values fall outside the landing study's controls (its speed and noise sliders).
 */
export function trialLink(base: Scenario, params: Params, key: TrialKeyRef): string | null {
  const scenario = applyParams(base, params);
  const parameters = { trial: key.trial, point: key.point, speed: scenario.carrier.speed, pixelNoise: scenario.detector.pixelNoise, time: 8 };
  for (const spec of landingStudy.parameters) {
    const value = parameters[spec.name as keyof typeof parameters];
    if (value !== undefined && parameterProblem(spec, value) !== null) return null;
  }
  return permalinkFragment(analysisToText({ study: 'landing', scenario, parameters, seed: key.seed, toolVersion: VERSION }));
}
