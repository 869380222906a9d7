import { describe, expect, it } from 'vitest';
import { rankSensitivity } from '../../estimator/study/rankSensitivity.js';
import { differenceInterval } from '../../estimator/study/statistics/differenceInterval.js';

describe('rankSensitivity', () => {
  it('rankSensitivity orders impairments by success lost over their range, with Newcombe intervals', () => {
    const rows = rankSensitivity(
      [{ path: 'detector.latency', from: 0, to: 0.2 }, { path: 'detector.pixelNoise', from: 0.5, to: 8 }, { path: 'lander.wind.speed', from: 0, to: 8 }],
      [{ good: [95, 100], bad: [90, 100] }, { good: [96, 100], bad: [60, 100] }, { good: [94, 100], bad: [94, 100] }],
    );
    expect(rows.map((r) => r.path)).toEqual(['detector.pixelNoise', 'detector.latency', 'lander.wind.speed']);
    const top = rows[0]!;
    expect(top.loss).toBeCloseTo(0.36, 12);
    expect(top.lossPerUnit).toBeCloseTo(0.36 / 7.5, 12);
    const d = differenceInterval(96, 100, 60, 100);
    expect([top.lossLow, top.lossHigh]).toEqual([d.low, d.high]);
    expect(rows[2]!.lossLow).toBeLessThan(0);
    expect(rows[2]!.lossHigh).toBeGreaterThan(0);
  });
});
