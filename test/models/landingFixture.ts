// Shared invented set-up for the landing-filter tests and the ekf benchmark: a 640x480 camera
// with mild distortion, nadir mount with a small offset, a 12-state tight filter at 200 Hz.
import type { FilterSpec } from '../../estimator/sim/Scenario.js';
import type { FilterCamera } from '../../estimator/models/FilterCamera.js';

export const camera: FilterCamera = {
  fx: 520, fy: 518, cx: 320, cy: 240, width: 640, height: 480,
  distortion: { k1: -0.12, k2: 0.03, k3: 0, p1: 0.0005, p2: -0.0003 },
  mount: { offset: [0.05, 0, -0.04], rollDeg: 0, pitchDeg: 0, yawDeg: 0 },
};

export const targetSize = 1.8; // m, sqrt(deck length x width)

export function filterSpec(overrides: Partial<FilterSpec> = {}): FilterSpec {
  return {
    // the flat box model: the mechanics tests draw their boxes from it (OutlineBoxModel.test.ts
    // and the outline cases below name boxModel 'outline' themselves)
    rate: 200, cameraUpdate: 'tight', boxModel: 'flat', carrierModel: 'constant-velocity',
    carrierAccelNoise: 0.3, singerTau: 2, accelNoise: 0.05, accelBiasWalk: 0.002,
    pixelNoise: 2, sizeNoise: 1.5, sizeNoiseFraction: 0, pixelNoiseFraction: 0, odometryNoise: 0.05,
    gateProbability: 0.997, qScale: 1, rScale: 1, gateScale: 1, historyLength: 0.3,
    ...overrides,
  };
}

export const hoverForce = [0, 0, 9.80665]; // specific force of a level hover, body FLU (m/s²)
