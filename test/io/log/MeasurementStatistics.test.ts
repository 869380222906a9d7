import { describe, expect, it } from 'vitest';
import { MeasurementStatistics } from '../../../estimator/io/log/MeasurementStatistics.js';

describe('MeasurementStatistics', () => {
  it('averages NIS over accepted updates, counts gated ones and refusals by reason', () => {
    const s = new MeasurementStatistics('box', 5);
    expect(s.add({ status: 'accepted', nis: 2, dim: 3, reason: null })).toBe(true);
    expect(s.add({ status: 'accepted', nis: 4, dim: 3, reason: null })).toBe(true);
    expect(s.add({ status: 'gated', nis: 30, dim: 3, reason: 'outside-gate' })).toBe(true);
    expect(s.add({ status: 'rejected', nis: Number.NaN, dim: 3, reason: 'box-outside-image' })).toBe(false);
    expect(s.lastReason).toBe('box-outside-image');
    expect(s.add({ status: 'diverged', nis: Number.NaN, dim: 0, reason: null })).toBe(false);
    const summary = s.summary(0.95);
    expect(summary).toMatchObject({ mean: 3, count: 2, dim: 3, gated: 1, refused: { 'box-outside-image': 1, diverged: 1 }, consistent: true });
    // N = 2, d = 3: [chi2(0.025, 6) / 2, chi2(0.975, 6) / 2] = [1.237 / 2, 14.449 / 2] (NIST/SEMATECH table values for 6 dof [memory])
    expect(summary.bounds![0]).toBeCloseTo(0.6187, 3);
    expect(summary.bounds![1]).toBeCloseTo(7.2247, 3);
  });

  it('says nothing about a kind with no accepted update', () => {
    const summary = new MeasurementStatistics('odometry', 5).summary(0.95);
    expect([summary.mean, summary.bounds, summary.consistent]).toEqual([null, null, null]);
  });
});
