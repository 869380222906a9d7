// The filter's noise terms that noise identification can free: each is one FilterSpec field,
// with its unit, what it stands for and the range the search may explore (absolute values; the
// search runs in ln of the value, so every term is positive and scale-free).
import type { FilterSpec } from '../sim/Scenario.js';

export type NoiseTermName =
  | 'pixelNoise'
  | 'pixelNoiseFraction'
  | 'sizeNoise'
  | 'sizeNoiseFraction'
  | 'odometryNoise'
  | 'carrierAccelNoise'
  | 'accelNoise'
  | 'accelBiasWalk';

export interface NoiseTerm {
  name: NoiseTermName;
  unit: string;
  meaning: string;
  /** What excites it: which measurements' innovations carry its information. */
  seenIn: string;
  /** Search range (absolute, > 0). */
  lower: number;
  upper: number;
}

export const NOISE_TERMS: readonly NoiseTerm[] = [
  { name: 'pixelNoise', unit: 'px', meaning: 'box centre noise, 1 sigma per axis', seenIn: 'box u, v', lower: 0.05, upper: 50 },
  { name: 'pixelNoiseFraction', unit: 'of box size', meaning: 'box centre noise in proportion to the box size', seenIn: 'box u, v over a range of heights', lower: 1e-4, upper: 0.3 },
  { name: 'sizeNoise', unit: 'px', meaning: 'box size noise, 1 sigma', seenIn: 'box s', lower: 0.01, upper: 50 },
  { name: 'sizeNoiseFraction', unit: 'of box size', meaning: 'box size noise in proportion to the size', seenIn: 'box s', lower: 1e-4, upper: 0.5 },
  { name: 'odometryNoise', unit: 'm/s', meaning: 'odometry velocity noise, 1 sigma per axis', seenIn: 'odometry', lower: 1e-3, upper: 3 },
  { name: 'carrierAccelNoise', unit: 'm/s²/√Hz', meaning: 'carrier acceleration noise density', seenIn: 'box innovations over seconds (carrier manoeuvres)', lower: 1e-3, upper: 20 },
  { name: 'accelNoise', unit: 'm/s²/√Hz', meaning: 'lander accelerometer noise density', seenIn: 'odometry innovations between samples', lower: 1e-3, upper: 10 },
  { name: 'accelBiasWalk', unit: 'm/s³/√Hz', meaning: 'accelerometer bias random walk', seenIn: 'slow odometry drift over tens of seconds', lower: 1e-6, upper: 1 },
];

export const NOISE_TERM_NAMES: readonly NoiseTermName[] = NOISE_TERMS.map((t) => t.name);

/**
 * The terms freed when none are named: the sensors' own noise and both bodies' motion. The lander's
 * accelNoise is in because it sets how far the predicted velocity spreads between odometry updates:
 * held at a hand-set value, it alone kept the delivery-van demo log's odometry NIS under its interval.
 */
export const DEFAULT_FREE_TERMS: readonly NoiseTermName[] = ['pixelNoise', 'sizeNoiseFraction', 'odometryNoise', 'carrierAccelNoise', 'accelNoise'];

export function noiseTerm(name: string): NoiseTerm | undefined {
  return NOISE_TERMS.find((t) => t.name === name);
}

/** A copy of spec with the named terms set. */
export function withNoiseTerms(spec: FilterSpec, values: Partial<Record<NoiseTermName, number>>): FilterSpec {
  return { ...spec, ...values };
}
