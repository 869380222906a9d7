// Logs written by the recorder (what `alight record` writes) from scenarios whose sensor noise
// is known, for the identification tests. The filter's model represents these scenarios' truth:
// a flat deck (bodyHeight 0, so the detector's outline box is the deck's own), a slow straight
// carrier, landing held off (the lander trails at 6 m, tilting little), no attitude, mounting,
// focal, target-size, odometry-bias, gyro or IMU-bias errors, no false boxes and no latency jitter.
// What is left differs from the filter only by the three noise terms under test (and the IMU
// noise the filter's accelNoise covers).
import { defaultScenario } from '../../../estimator/io/defaultScenario.js';
import { validateScenario } from '../../../estimator/io/validateScenario.js';
import { logSourceFromFiles, type LogSource } from '../../../estimator/io/log/LogSource.js';
import { recordTrial } from '../../../estimator/io/log/recordTrial.js';
import type { Scenario } from '../../../estimator/sim/Scenario.js';

export interface KnownNoise {
  /** Detector centre noise (px), fractional size noise, odometry noise (m/s). */
  pixelNoise: number;
  sizeNoise: number;
  odometryNoise: number;
}

export function knownNoiseScenario(noise: KnownNoise, duration = 15): Scenario {
  const s = defaultScenario();
  s.name = 'known noise';
  s.duration = duration;
  s.guidance.alignTime = duration;
  s.carrier.speed = 1;
  s.carrier.bodyHeight = 0;
  s.lander.yawPolicy = 'hold'; // yaw steered from a noisy heading at 1 m/s would turn the deck's box
  s.detector = { ...s.detector, pixelNoise: noise.pixelNoise, sizeNoise: noise.sizeNoise, latencyJitter: 0, falseBoxRate: 0 };
  s.localization = { ...s.localization, attitudeBiasDeg: 0, attitudeNoiseDeg: 0, odometryBias: 0, odometryNoise: noise.odometryNoise, odometryDrift: 0, accelBias: 0, misalignmentDeg: 0, focalError: 0, targetSizeError: 0, gyroBiasDegPerSec: 0, gyroNoiseDegPerSqrtSec: 0 };
  // The true setting: the filter's terms equal the known noise, nothing proportional to the box
  // centre (the flat deck's box centre is the deck centre's image), 0.1 px of absolute size noise.
  s.filter = { ...s.filter, pixelNoise: noise.pixelNoise, pixelNoiseFraction: 0, sizeNoise: 0.1, sizeNoiseFraction: noise.sizeNoise, odometryNoise: noise.odometryNoise };
  return validateScenario(s, 'known-noise scenario');
}

/** Record one trial into memory and give it back as a LogSource. */
export async function recordedLog(scenario: Scenario, seed: number): Promise<LogSource> {
  const files = new Map<string, string>();
  const sink = { write: (file: string, text: string) => void files.set(file, (files.get(file) ?? '') + text), close: () => undefined };
  recordTrial(scenario, sink, { key: { seed, point: 0, trial: 0 } });
  return logSourceFromFiles(files, `${scenario.name} seed ${seed}`);
}
