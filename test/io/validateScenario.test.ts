import { describe, expect, it } from 'vitest';
import { defaultScenario } from '../../estimator/io/defaultScenario.js';
import { validateScenario } from '../../estimator/io/validateScenario.js';

describe('validateScenario', () => {
  it('fills defaults into a parsed object and deep-freezes the result', () => {
    const s = validateScenario({ version: 1, lander: { wind: { speed: 4 } } }, 'obj');
    expect(s.lander.wind).toEqual({ speed: 4, directionDeg: 0, turbulence: 'none', gusts: [] });
    expect(s.lander.maxSpeed).toBe(defaultScenario().lander.maxSpeed);
    expect(Object.isFrozen(s.lander.wind)).toBe(true);
    expect(Object.isFrozen(s.lander.startOffset)).toBe(true);
  });

  it('names the field without a line when no positions are given', () => {
    expect(() => validateScenario({ version: 1, seed: 1.5 }, 'obj')).toThrow('obj: seed: must be integer, got 1.5');
    expect(() => validateScenario({ version: 2 }, 'obj')).toThrow('obj: version: must be 1, got 2');
    expect(() => validateScenario(null, 'obj')).toThrow('obj: (top level): must be object, got null');
  });
});
