import { describe, expect, it } from 'vitest';
import { defaultScenario } from '../../estimator/io/defaultScenario.js';
import { getPath, setPath, setPaths } from '../../estimator/io/scenarioPath.js';
import { validateScenario } from '../../estimator/io/validateScenario.js';

const base = validateScenario(defaultScenario(), 'default');

describe('setPath', () => {
  it('returns a validated copy and leaves the original alone', () => {
    const changed = setPath(base, 'detector.pixelNoise', 8);
    expect(changed.detector.pixelNoise).toBe(8);
    expect(base.detector.pixelNoise).toBe(1.5);
    expect(Object.isFrozen(changed.detector)).toBe(true);
    expect(setPath(base, 'lander.startOffset.2', 12).lander.startOffset).toEqual([-2, 0.5, 12]);
    expect(setPath(base, 'guidance.law', 'lqr').guidance.law).toBe('lqr');
  });

  it('refuses an unknown path with the fields that do exist', () => {
    expect(() => setPath(base, 'detector.pixelNose', 3)).toThrow(
      'unknown scenario field "detector.pixelNose" (detector has: rate, pixelNoise, sizeNoise, latency, latencyJitter, dropout, burst, falseBoxRate, edgeMargin, script)',
    );
    expect(() => setPath(base, 'detector.rate.x', 3)).toThrow('unknown scenario field "detector.rate.x" (detector.rate is a value, not a section)');
  });

  it('refuses an out-of-range value naming the field', () => {
    expect(() => setPath(base, 'detector.pixelNoise', -3)).toThrow('changed scenario: detector.pixelNoise: must be >= 0, got -3');
    expect(() => setPath(base, 'detector.dropout', 'x')).toThrow('changed scenario: detector.dropout: must be number, got "x"');
  });
});

describe('setPaths', () => {
  it('sets fields that are only valid together, which one-at-a-time setPath refuses', () => {
    expect(() => setPath(base, 'filter.rate', 50)).toThrow('changed scenario: localization.imuRate: must be <= filter.rate (50 Hz), got 100');
    const s = setPaths(base, { 'filter.rate': 50, 'localization.imuRate': 50 });
    expect([s.filter.rate, s.localization.imuRate]).toEqual([50, 50]);
    expect(() => setPaths(base, { 'filter.rate': 50, 'filter.nope': 1 })).toThrow('unknown scenario field "filter.nope"');
  });
});

describe('getPath', () => {
  it('reads nested fields and array entries', () => {
    expect(getPath(base, 'filter.rate')).toBe(100);
    expect(getPath(base, 'lander.startOffset.0')).toBe(-2);
    expect(() => getPath(base, 'nope')).toThrow(/unknown scenario field "nope" \(the scenario has: version, name/);
  });
});
