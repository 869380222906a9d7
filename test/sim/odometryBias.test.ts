// Must-show of the belief-driven autopilot: an odometry bias alone barely moves the touchdown.
// When the simulated autopilot tracked TRUE velocity while guidance used the biased odometry, a
// 0.04-0.05 m/s bias became a steady ~0.2 m offset (removing it alone lifted the truck demo from
// 71 to 98 % landed). Flying on its belief, the lander's camera loop corrects the position.
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadScenario } from '../../estimator/io/loadScenario.js';
import { setPaths } from '../../estimator/io/scenarioPath.js';
import type { Scenario } from '../../estimator/sim/Scenario.js';
import { runTrial } from '../../estimator/sim/runTrial.js';

const DEMO = join(import.meta.dirname, '..', '..', 'data-demo');

/** Every sensing impairment off but the odometry bias (its drift off too: a constant bias). */
function onlyOdometryBias(s: Scenario, bias: number): Scenario {
  return setPaths(s, {
    'detector.pixelNoise': 0, 'detector.sizeNoise': 0, 'detector.latency': 0, 'detector.latencyJitter': 0,
    'detector.dropout': 0, 'detector.burst': null, 'detector.falseBoxRate': 0,
    'localization.attitudeBiasDeg': 0, 'localization.attitudeNoiseDeg': 0, 'localization.odometryBias': bias,
    'localization.odometryNoise': 0, 'localization.odometryDrift': 0, 'localization.accelNoise': 0,
    'localization.accelBias': 0, 'localization.misalignmentDeg': 0, 'localization.focalError': 0,
    'localization.targetSizeError': 0, 'localization.clockOffset': 0,
    'localization.gyroBiasDegPerSec': 0, 'localization.gyroNoiseDegPerSqrtSec': 0,
  });
}

function fly(s: Scenario): { landed: number; meanMiss: number } {
  let landed = 0, miss = 0, contacts = 0;
  for (let trial = 0; trial < 100; trial++) {
    const r = runTrial(s, { key: { seed: s.seed, point: 0, trial } });
    if (r.outcome === 'landed') landed++;
    if (r.missDistance !== null) {
      miss += r.missDistance;
      contacts++;
    }
  }
  return { landed, meanMiss: miss / contacts };
}

describe('odometry bias as the only impairment', () => {
  it.each(['highway-truck', 'delivery-van'])('%s: its own bias adds < 0.02 m of mean horizontal touchdown offset and lands as often (100 trials each)', (name) => {
    const demo = loadScenario(join(DEMO, `${name}.scenario.json`));
    const bias = demo.localization.odometryBias;
    expect(bias).toBeGreaterThan(0.03); // the demos' 0.04-0.05 m/s of the issue
    const clean = fly(onlyOdometryBias(demo, 0));
    const biased = fly(onlyOdometryBias(demo, bias));
    // the same trial keys on both sides (common random numbers): the difference is the bias's
    expect(biased.meanMiss - clean.meanMiss).toBeLessThan(0.02);
    expect(biased.landed).toBe(clean.landed);
  }, 120_000);
});
