import { describe, expect, it } from 'vitest';
import { DetectorScript } from '../../../estimator/sim/world/detectorScript.js';
import { ScriptedGusts } from '../../../estimator/sim/world/scriptedGusts.js';
import { expectClose } from '../../helpers/expectClose.js';

describe('DetectorScript', () => {
  const script = new DetectorScript([
    { kind: 'dropout', time: 2, duration: 1 },
    { kind: 'latency', time: 5, duration: 0.5, latency: 0.7 },
    { kind: 'false-box', time: 8, duration: 0.1 },
  ]);

  it('applies each event over [time, time + duration) of capture time only', () => {
    expect([1.99, 2, 2.99, 3].map((t) => script.lostAt(t))).toEqual([false, true, true, false]);
    expect(script.latencyAt(5.2)).toBe(0.7);
    expect(script.latencyAt(5.5)).toBeNaN();
    expect([8, 8.05, 8.1].map((t) => script.falseBoxAt(t))).toEqual([true, true, false]);
    expect(script.maxLatency).toBe(0.7);
  });
});

describe('ScriptedGusts', () => {
  it('adds a 1 - cosine pulse: zero at its ends, the full speed at its middle, along its direction', () => {
    const gusts = new ScriptedGusts([{ time: 1, duration: 2, speed: 6, directionDeg: 90 }]);
    const wind = new Float64Array(3);
    gusts.add(2, wind); // middle: (1 - cos(pi)) / 2 = 1
    expectClose(wind[0]!, 0, { abs: 1e-12 }, 'east (rounding of cos 90 deg)');
    expectClose(wind[1]!, 6, { rel: 1e-12 }, 'north at the peak (exact up to rounding)');
    wind.fill(0);
    gusts.add(1.5, wind); // quarter: (1 - cos(pi/2)) / 2 = 0.5
    expectClose(wind[1]!, 3, { rel: 1e-12 }, 'north at a quarter (rounding)');
    wind.fill(0);
    gusts.add(3, wind);
    expect(wind[1]).toBe(0);
  });
});
