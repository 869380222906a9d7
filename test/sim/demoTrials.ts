// Shared by the demo must-show tests (issue 10): load a demo, switch impairments off, fly
// seeded trials in this thread, and read the along-travel miss.
import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { loadScenario } from '../../estimator/io/loadScenario.js';
import { setPaths } from '../../estimator/io/scenarioPath.js';
import type { Scenario } from '../../estimator/sim/Scenario.js';
import type { TrialResult } from '../../estimator/sim/TrialResult.js';
import { runTrial } from '../../estimator/sim/runTrial.js';

export const DEMO_DIR = join(import.meta.dirname, '..', '..', 'data-demo');
export const demoNames = readdirSync(DEMO_DIR).filter((f) => f.endsWith('.scenario.json')).sort();

export function loadDemo(name: string): Scenario {
  return loadScenario(join(DEMO_DIR, name.endsWith('.json') ? name : `${name}.scenario.json`));
}

/** Every detector and localization impairment off (weather left as the demo has it). */
export function sensingPerfect(s: Scenario): Scenario {
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

/** Trials 0..n-1 of point `point` under the scenario's seed (the keys alight sweep uses). */
export function flyTrials(s: Scenario, n: number, point = 0): TrialResult[] {
  const out: TrialResult[] = [];
  for (let trial = 0; trial < n; trial++) out.push(runTrial(s, { key: { seed: s.seed, point, trial }, attribution: false }));
  return out;
}

export const landedCount = (results: readonly TrialResult[]): number => results.filter((r) => r.outcome === 'landed').length;

/** Mean along-travel miss (m) of the trials that touched the deck (off-carrier contacts are metres away and say nothing of a bias). */
export function meanAlongMiss(results: readonly TrialResult[]): number {
  const along = results.filter((r) => r.missX !== null && r.outcome !== 'off-carrier').map((r) => r.missX!);
  return along.reduce((a, b) => a + b, 0) / along.length;
}

export function meanMiss(results: readonly TrialResult[]): number {
  const miss = results.filter((r) => r.missDistance !== null).map((r) => r.missDistance!);
  return miss.reduce((a, b) => a + b, 0) / miss.length;
}
