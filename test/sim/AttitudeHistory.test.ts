import { describe, expect, it } from 'vitest';
import { AttitudeHistory, attitudeHistorySize } from '../../estimator/sim/AttitudeHistory.js';

describe('AttitudeHistory', () => {
  it('at() gives the newest sample at or before the time asked, the oldest kept before that', () => {
    const h = new AttitudeHistory(3);
    const out = new Float64Array(4);
    expect(h.at(1, out)).toBe(false);
    for (let i = 0; i < 5; i++) h.push(i * 0.01, [i, 0, 0, 0]); // keeps t = 0.02, 0.03, 0.04
    h.at(0.035, out);
    expect(out[0]).toBe(3);
    h.at(0.04, out);
    expect(out[0]).toBe(4);
    h.at(1, out);
    expect(out[0]).toBe(4);
    h.at(0, out); // older than anything kept
    expect(out[0]).toBe(2);
    h.clear();
    expect(h.at(1, out)).toBe(false);
  });

  it('attitudeHistorySize() covers the filter history plus 0.1 s at the rate', () => {
    expect(attitudeHistorySize(0.3, 100)).toBe(44); // 40 samples + 4 spare
  });
});
