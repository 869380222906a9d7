import { describe, expect, it } from 'vitest';
import { applyFilterSettings, defaultFilterSpec, FilterSettingsError, parseFilterSettings } from '../../../estimator/io/log/filterSettings.js';

describe('filter settings', () => {
  it('applies a partial FilterSpec over a base and leaves the rest alone', () => {
    const base = { ...defaultFilterSpec(), pixelNoise: 3 };
    const spec = parseFilterSettings('{ "qScale": 2, "cameraUpdate": "loose" }', 'settings.json', base);
    expect(spec).toEqual({ ...base, qScale: 2, cameraUpdate: 'loose' });
    expect(applyFilterSettings(base, { filter: { rScale: 0.5 } }, 'wrapped.json').rScale).toBe(0.5);
  });

  it('reports every problem with file, line and field', () => {
    const text = '{\n  "qScale": 0,\n  "carrierModel": "kalman",\n  "gateProbabilty": 0.99\n}';
    try {
      parseFilterSettings(text, 'settings.json', defaultFilterSpec());
      expect.fail('should throw');
    } catch (error) {
      expect(error).toBeInstanceOf(FilterSettingsError);
      const problems = (error as FilterSettingsError).problems;
      expect(problems).toContain('settings.json:2: qScale: must be > 0, got 0');
      expect(problems).toContain('settings.json:3: carrierModel: must be one of "constant-velocity", "singer", got "kalman"');
      expect(problems.some((p) => p.startsWith('settings.json:4: gateProbabilty: unknown key'))).toBe(true);
    }
  });

  it('takes the deck-scale state (a fraction from 0 to 0.5), naming file, line and field when out of range', () => {
    expect(parseFilterSettings('{ "deckScaleSigma": 0.05 }', 'settings.json', defaultFilterSpec()).deckScaleSigma).toBe(0.05);
    expect(() => parseFilterSettings('{\n  "deckScaleSigma": 0.7\n}', 'settings.json', defaultFilterSpec())).toThrow('settings.json:2: deckScaleSigma: must be <= 0.5, got 0.7');
  });

  it('reports JSON syntax errors by line and column, and non-objects', () => {
    expect(() => parseFilterSettings('{\n "qScale": 1,,\n}', 's.json', defaultFilterSpec())).toThrow(/^s\.json:2:\d+: /);
    expect(() => parseFilterSettings('[1, 2]', 's.json', defaultFilterSpec())).toThrow('s.json: expected an object of filter settings');
  });
});
