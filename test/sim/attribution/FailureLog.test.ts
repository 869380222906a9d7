import { describe, expect, it } from 'vitest';
import { defaultScenario } from '../../../estimator/io/defaultScenario.js';
import { setPaths } from '../../../estimator/io/scenarioPath.js';
import { FailureLog } from '../../../estimator/sim/attribution/FailureLog.js';
import { drydenScales } from '../../../estimator/sim/world/dryden.js';

const FT = 0.3048;
const view = { valid: true, blind: false, diverged: false, rx: 0, ry: 0, height: 3 };
const rTrue = Float64Array.of(0, 0, -3); // 3 m above the deck

function gustEvents(turbulence: 'none' | 'light', east: number): number[] {
  const log = new FailureLog(setPaths(defaultScenario(), { 'lander.wind.turbulence': turbulence }), 1);
  for (let k = 1; k <= 10; k++) log.step(k * 0.01, 'trail', rTrue, Float64Array.of(east, 0, 0), view);
  return log.events().filter((e) => e.event === 'gust').map((e) => e.value);
}

describe('FailureLog gust events', () => {
  // light turbulence at 3 m (clamped to 10 ft): sigma_u from MIL-F-8785C, W20 = 15 kt
  const sigmaU = drydenScales(10, 15).sigmaU * FT;

  it('count a gust only beyond 4 sigma_u of the turbulence (a 2-D gust passes 3 sigma 1.1 % of the time)', () => {
    expect(sigmaU).toBeGreaterThan(1.4); // about 1.5 m/s
    expect(gustEvents('light', 3.5 * sigmaU)).toEqual([]);
    expect(gustEvents('light', 4.2 * sigmaU)).toHaveLength(1); // one event for the whole run, at its peak
  });

  it('count any gust above 1 m/s in still air, once per run', () => {
    expect(gustEvents('none', 0.9)).toEqual([]);
    expect(gustEvents('none', 1.5)).toEqual([1.5]);
  });
});
