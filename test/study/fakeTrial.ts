// A tiny deterministic stand-in for runTrial, for unit tests of the sweep machinery: the
// outcome depends on (seed, point, trial) and detector.pixelNoise only, like the real trial.
import { RandomStream } from '../../estimator/random/RandomStream.js';
import type { Scenario } from '../../estimator/sim/Scenario.js';
import type { TrialResult } from '../../estimator/sim/TrialResult.js';
import type { TrialKey } from '../../estimator/study/trialExecutor.js';

/** Lands with probability 1 - pixelNoise / 10; miss ~ circular Gaussian with sigma 0.05 pixelNoise. */
export function fakeTrial(scenario: Scenario, key: TrialKey): TrialResult {
  const s = RandomStream.fromKey([key.seed, key.point, key.trial]);
  const noise = scenario.detector.pixelNoise;
  const landed = s.uniform() >= noise / 10;
  const mx = s.normal(0, 0.05 * noise), my = s.normal(0, 0.05 * noise);
  return {
    outcome: landed ? 'landed' : 'off-pad',
    missDistance: Math.hypot(mx, my),
    missX: mx,
    missY: my,
    closingSpeed: 0.4,
    lateralSpeed: 0.1,
    tiltDeg: 2,
    touchdownTime: 20 + 5 * s.uniform(),
    positionRmse: 0.1 * noise,
    velocityRmse: 0.05,
    neesMean: 6 * (0.8 + 0.4 * s.uniform()),
    neesDim: 6,
    nisMean: 3 * (0.8 + 0.4 * s.uniform()),
    nisDim: 3,
    nisCount: 100,
    phaseTimes: { acquire: 1, trail: 5, align: 3, descend: 10, touchdown: 1 },
    boxes: 500,
    dropped: 10,
    falseBoxes: 0,
    gateRejections: 1,
    aborts: 0,
    divergence: null,
    peakAttitudeRateDeg: 40,
  };
}
