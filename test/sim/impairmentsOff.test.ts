// Must-show of the blind-height forecast: with every sensing impairment off (wind left as the
// demo has it: weather, not a sensor), no demo trial aborts, for a lost target or otherwise.
// The previous fixed blind height (1.2 x the deck's longest side) let an unbiased lander abort
// "target-lost" with the deck filling the image.
import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadScenario } from '../../estimator/io/loadScenario.js';
import { setPaths } from '../../estimator/io/scenarioPath.js';
import type { Scenario } from '../../estimator/sim/Scenario.js';
import { runTrial } from '../../estimator/sim/runTrial.js';

const DEMO = join(import.meta.dirname, '..', '..', 'data-demo');
const demoNames = readdirSync(DEMO).filter((f) => f.endsWith('.scenario.json')).sort();

/** Every detector and localization impairment off. */
function impairmentsOff(s: Scenario): Scenario {
  return setPaths(s, {
    'detector.pixelNoise': 0, 'detector.sizeNoise': 0, 'detector.latency': 0, 'detector.latencyJitter': 0,
    'detector.dropout': 0, 'detector.burst': null, 'detector.falseBoxRate': 0,
    'localization.attitudeBiasDeg': 0, 'localization.attitudeNoiseDeg': 0, 'localization.odometryBias': 0,
    'localization.odometryNoise': 0, 'localization.odometryDrift': 0, 'localization.accelNoise': 0,
    'localization.accelBias': 0, 'localization.misalignmentDeg': 0, 'localization.focalError': 0,
    'localization.targetSizeError': 0, 'localization.clockOffset': 0,
    'localization.gyroBiasDegPerSec': 0, 'localization.gyroNoiseDegPerSqrtSec': 0,
  });
}

describe('impairments off', () => {
  it.each(demoNames)('%s: 30 trials, not one abort (no "target-lost" with the deck in view)', (name) => {
    const s = impairmentsOff(loadScenario(join(DEMO, name)));
    const aborted: number[] = [];
    for (let trial = 0; trial < 30; trial++) if (runTrial(s, { key: { seed: s.seed, point: 0, trial } }).aborts > 0) aborted.push(trial);
    expect(aborted).toEqual([]);
  }, 60_000);
});
