// ekf: 12-state predict + tight camera update pairs per second, fast path (LandingFilter,
// block-structured, allocation-free) against the plain ml-matrix path (PlainLandingFilter),
// measured in this one run. Both run the identical input sequence.
import type { BenchSection } from './sections.js';
import { LandingFilter } from '../../estimator/models/LandingFilter.js';
import { PlainLandingFilter } from '../../estimator/models/PlainLandingFilter.js';
import { boxFromRelativePosition } from '../../estimator/camera/boxGeometry.js';
import type { Box } from '../../estimator/camera/Box.js';
import { quatFromEulerDeg } from '../../estimator/frames/quatFromEulerDeg.js';
import { camera, filterSpec, targetSize } from '../models/landingFixture.js';

interface PairFilter {
  initialize(t: number, r: number[], vC: number[], vL: number[], sigma: { position: number; velocity: number; accelBias: number }): void;
  propagate(t: number, f: ArrayLike<number>, q: ArrayLike<number>): unknown;
  updateBox(t: number, box: Box): unknown;
}

const BOXES: Box[] = Array.from({ length: 64 }, (_, k) => boxFromRelativePosition(camera, [0.4 * Math.sin(k / 5), -0.3 * Math.cos(k / 7), 8 + 0.5 * Math.sin(k / 3)], targetSize));
const FORCE = new Float64Array([0.2, -0.1, 9.81]);
const ATTITUDE = Float64Array.from(quatFromEulerDeg(2, -3, 35));

/** Run `pairs` predict+update pairs from a fresh filter; returns pairs per second. */
function pairsPerSecond(filter: PairFilter, pairs: number): number {
  filter.initialize(0, [0.5, 0.2, -8], [2, 0, 0], [2, 0, 0], { position: 1, velocity: 0.5, accelBias: 0.1 });
  const dt = 1 / 200;
  const start = performance.now();
  for (let k = 1; k <= pairs; k++) {
    const t = k * dt;
    filter.propagate(t, FORCE, ATTITUDE);
    filter.updateBox(t, BOXES[k & 63]!);
  }
  return pairs / ((performance.now() - start) / 1000);
}

export const ekf: BenchSection = {
  name: 'ekf',
  async run() {
    const spec = filterSpec({ historyLength: 0.2 });
    const fastFilter = new LandingFilter(spec, camera, targetSize);
    const plainFilter = new PlainLandingFilter(spec, camera, targetSize);
    pairsPerSecond(fastFilter, 50_000); // warm-up (JIT)
    pairsPerSecond(plainFilter, 2_000);
    // Best of several short repeats for both paths: on a shared machine the best window is the
    // one least disturbed by other processes, and both paths get the same treatment.
    let fast = 0;
    for (let i = 0; i < 7; i++) fast = Math.max(fast, pairsPerSecond(fastFilter, 100_000));
    let plain = 0;
    for (let i = 0; i < 5; i++) plain = Math.max(plain, pairsPerSecond(plainFilter, 4_000));
    return { fastPairsPerSec: Math.round(fast), plainPairsPerSec: Math.round(plain), ratio: Number((fast / plain).toFixed(1)) };
  },
};
