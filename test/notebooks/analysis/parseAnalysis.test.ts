import { describe, expect, it } from 'vitest';
import { defaultScenario } from '../../../estimator/io/defaultScenario.js';
import { analysisToText, AnalysisError } from '../../../notebooks/analysis/Analysis.js';
import { parseAnalysis } from '../../../notebooks/analysis/parseAnalysis.js';
import type { Parameter } from '../../../notebooks/studies/Parameter.js';

const PARAMS: Parameter[] = [
  { kind: 'number', name: 'trials', label: 'Trials', unit: '', min: 1, max: 50, step: 1, default: 5, integer: true },
  { kind: 'choice', name: 'confidence', label: 'Confidence', options: [{ value: '0.95', label: '95 %' }, { value: '0.99', label: '99 %' }], default: '0.95' },
];
const lookup = () => PARAMS;

function text(overrides: Record<string, unknown>): string {
  return JSON.stringify({ study: 'detection', scenario: defaultScenario(), parameters: { trials: 8 }, seed: 3, toolVersion: '0.1.0', ...overrides });
}

describe('parseAnalysis', () => {
  it('reads a valid file and fills omitted parameters with their defaults', () => {
    const analysis = parseAnalysis(text({}), 'a.json', lookup);
    expect(analysis.study).toBe('detection');
    expect(analysis.parameters).toEqual({ trials: 8, confidence: '0.95' });
    expect(analysis.seed).toBe(3);
    expect(analysis.scenario.detector.rate).toBe(30);
  });

  it('round-trips through its text form', () => {
    const analysis = parseAnalysis(text({}), 'a.json', lookup);
    expect(parseAnalysis(analysisToText(analysis), 'b.json', lookup)).toEqual(analysis);
  });

  it('names the file and every bad field', () => {
    const bad = [
      '{ "study": "detection",',
      '  "scenario": { "version": 1 },',
      '  "parameters": {',
      '    "trials": 0.5,',
      '    "confidence": "0.5",',
      '    "extra": 1 },',
      '  "seed": -1,',
      '  "toolVersion": "",',
      '  "colour": "red" }',
    ].join('\n');
    try {
      parseAnalysis(bad, 'bad.json', lookup);
      expect.fail('should have thrown');
    } catch (error) {
      expect(error).toBeInstanceOf(AnalysisError);
      expect((error as AnalysisError).problems).toEqual([
        'bad.json:9: unknown field "colour" (expected study, scenario, parameters, seed, toolVersion)',
        'bad.json:7: field "seed" must be a non-negative whole number, got -1',
        'bad.json:8: field "toolVersion" must be a version string, got ""',
        'bad.json:4: parameters.trials must be within [1, 50], got 0.5',
        'bad.json:5: parameters.confidence must be one of "0.95", "0.99", got "0.5"',
        'bad.json:6: parameters.extra is not a control of the "detection" study (it has trials, confidence)',
      ]);
    }
  });

  it('refuses an unknown study and text that is not JSON', () => {
    expect(() => parseAnalysis(text({ study: 'weather' }), 'w.json', lookup)).toThrow('w.json:1: field "study" must be one of landing, detection, localization, tuning, carrier, replay, test-card, got "weather"');
    expect(() => parseAnalysis('{ nope', 'n.json', lookup)).toThrow("n.json:1:3: not valid JSON: expected a string, found 'n'");
    expect(() => parseAnalysis('{ "seed": 1,\n "seed": 2 }', 'd.json', lookup)).toThrow('d.json:2:2: not valid JSON: duplicate key "seed" (first given on line 1); each key may appear once');
  });

  it('passes scenario problems on with their field path', () => {
    const scenario = { ...defaultScenario(), detector: { ...defaultScenario().detector, pixelNoise: -2 } };
    expect(() => parseAnalysis(text({ scenario }), 's.json', lookup)).toThrow(/pixelNoise/);
    const twoLines = `{ "study": "detection", "seed": 1, "toolVersion": "0.1.0",\n  "scenario": { "version": 1, "detector": { "pixelNoise": -2 } } }`;
    expect(() => parseAnalysis(twoLines, 's.json', lookup)).toThrow('s.json:2: detector.pixelNoise: must be >= 0, got -2');
  });
});
