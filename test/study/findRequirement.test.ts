import { describe, expect, it } from 'vitest';
import { findRequirement } from '../../estimator/study/findRequirement.js';
import { RandomStream } from '../../estimator/random/RandomStream.js';
import { wilson } from '../../estimator/study/statistics/wilson.js';

// A seeded stand-in for "run trials at value v": success probability 1 - v/10 (falls with v).
const landedCount = async (value: number, probe: number, start: number, end: number) => {
  let landed = 0;
  for (let t = start; t < end; t++) if (RandomStream.fromKey([3, probe, t]).uniform() < 1 - value / 10) landed++;
  return landed;
};

describe('findRequirement', () => {
  it('findRequirement brackets the largest value whose lower Wilson bound meets the target', async () => {
    const r = await findRequirement({ from: 0, to: 5, target: 0.8, maxTrials: 400, steps: 6, landedCount });
    // True rate 0.8 at v = 2; the lower bound of n <= 400 trials reaches 0.8 only with a margin,
    // so the answer lies below 2 and above the point where the rate is 0.8 + ~2 standard errors.
    expect(r.value).not.toBeNull();
    expect(r.value!).toBeLessThan(2);
    expect(r.value!).toBeGreaterThan(0.8);
    expect(r.failsAt! - r.value!).toBeCloseTo(5 / 64, 12);
    for (const p of r.probes) {
      expect(p.pass).toBe(p.wilsonLow >= 0.8);
      expect(p.wilsonLow).toBe(wilson(p.landed, p.trials).low);
    }
  });
  it('findRequirement stops a clearly failing probe after the first batch (adaptive trial count)', async () => {
    const r = await findRequirement({ from: 0, to: 9, target: 0.8, maxTrials: 400, firstBatch: 25, steps: 1, landedCount });
    const bad = r.probes.find((p) => p.value === 9)!;
    expect(bad.trials).toBe(25);
    expect(bad.pass).toBe(false);
  });
  it('findRequirement reports when even the good end fails, and refuses an unreachable target', async () => {
    const r = await findRequirement({ from: 6, to: 9, target: 0.8, landedCount });
    expect(r.value).toBeNull();
    expect(r.probes).toHaveLength(1);
    await expect(findRequirement({ from: 0, to: 1, target: 0.95, maxTrials: 50, landedCount })).rejects.toThrow(/--trials 50 can never show 0.95.*at least 73/);
  });
});
