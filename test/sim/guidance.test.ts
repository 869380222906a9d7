import { describe, expect, it } from 'vitest';
import { defaultScenario } from '../../estimator/io/defaultScenario.js';
import { createGuidance, limitNorm2 } from '../../estimator/sim/guidance.js';
import { LqrGuidance } from '../../estimator/sim/guidanceLqr.js';
import { PidGuidance } from '../../estimator/sim/guidancePid.js';

describe('limitNorm2', () => {
  it('scales a 2-vector down to the limit keeping its direction, and reports clipping', () => {
    const v = Float64Array.of(3, 4);
    expect(limitNorm2(v, 2.5)).toBe(true);
    expect(Array.from(v)).toEqual([1.5, 2]);
    expect(limitNorm2(v, 10)).toBe(false);
    expect(Array.from(v)).toEqual([1.5, 2]);
  });
});

describe('createGuidance', () => {
  it('builds the law the scenario names', () => {
    const s = defaultScenario();
    expect(createGuidance({ ...s.guidance, law: 'pid' }, s.lander, 0.01)).toBeInstanceOf(PidGuidance);
    expect(createGuidance({ ...s.guidance, law: 'lqr' }, s.lander, 0.01)).toBeInstanceOf(LqrGuidance);
  });
});
