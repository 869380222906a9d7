import { describe, expect, it } from 'vitest';
import { defaultScenario } from '../../../estimator/io/defaultScenario.js';
import { VERSION } from '../../../estimator/version.js';
import { analysisToText } from '../../../notebooks/analysis/Analysis.js';
import { permalinkFragment } from '../../../notebooks/analysis/permalink.js';
import { readLink } from '../../../notebooks/host/readLink.js';
import { seedProblem } from '../../../notebooks/host/seedProblem.js';
import { parameterProblem, parseNumberList } from '../../../notebooks/studies/Parameter.js';

const b64 = (bytes: number[]): string => '#analysis=' + Buffer.from(bytes).toString('base64url');

describe('readLink', () => {
  it('opens a good analysis link as it is', () => {
    const a = { study: 'carrier' as const, scenario: defaultScenario(), parameters: { maxSpeed: 4, trials: 1, target: 0.7, envelopeRule: 'lower' }, seed: 3, toolVersion: VERSION };
    const r = readLink(permalinkFragment(analysisToText(a)));
    expect(r.problem).toBeNull();
    expect(r.analysis.study).toBe('carrier');
    expect(r.analysis.seed).toBe(3);
  });

  it("names garbage base64 in words, not in the decoder's", () => {
    const r = readLink('#analysis=abc$def');
    expect(r.problem).toContain('character "$" at position 4 is not base64url');
    expect(r.analysis.study).toBe('landing');
    expect(readLink('#analysis=abcde').problem).toContain('cannot encode whole bytes');
  });

  it('says invalid UTF-8 in words and still opens the study the text names', () => {
    const text = Buffer.from('{"study":"detection","seed":1,"x":"');
    const r = readLink(b64([...text, 0xff, 0xfe, 0x22, 0x7d]));
    expect(r.problem).toContain('its bytes are not UTF-8 text');
    expect(r.problem).not.toMatch(/encoded data|TypeError/);
    expect(r.analysis.study).toBe('detection');
  });

  it('opens the named study when the analysis inside is refused', () => {
    const r = readLink('#analysis=' + Buffer.from('{"study":"tuning","seed":-1}').toString('base64url'));
    expect(r.analysis.study).toBe('tuning');
    expect(r.problem).toContain('field "seed" must be a non-negative whole number');
  });

  it('names an unknown study and an unknown fragment', () => {
    expect(readLink('#study=nonsense').problem).toBe('This link asks for a study named "nonsense", and there is none: the studies are landing, detection, localization, tuning, carrier, replay, test-card.');
    expect(readLink('#study=%E0%A4%A').problem).toContain('"%E0%A4%A"');
    expect(readLink('#whatever').problem).toContain('names neither a study');
    expect(readLink('#study=replay')).toMatchObject({ problem: null, analysis: { study: 'replay' } });
    expect(readLink('').problem).toBeNull();
  });
});

describe('seedProblem', () => {
  it('accepts whole numbers 0 .. 2^53 - 1 and names every other entry', () => {
    expect(seedProblem('0')).toBe(0);
    expect(seedProblem(' 42 ')).toBe(42);
    expect(seedProblem('9007199254740991')).toBe(9007199254740991);
    expect(seedProblem('-5')).toBe('The seed -5 is negative: seeds run from 0 to 9007199254740991.');
    expect(seedProblem('1.5')).toBe('The seed 1.5 is not a whole number: seeds have no fraction.');
    expect(seedProblem('1e20')).toContain('The seed 1e20 is too large');
    expect(seedProblem('9007199254740992')).toContain('too large');
    expect(seedProblem('abc')).toBe('The seed "abc" is not a number: type a whole number from 0 to 9007199254740991.');
    expect(seedProblem('')).toBe('The seed is empty: type a whole number from 0 to 9007199254740991.');
    expect(seedProblem('1e3')).toContain('type plain digits (1000)');
  });
});

describe('parseNumberList', () => {
  it('reads comma or space separated values and names what is wrong', () => {
    expect(parseNumberList('', 12)).toEqual([]);
    expect(parseNumberList(' 0, 0.1 0.25;1 ', 12)).toEqual([0, 0.1, 0.25, 1]);
    expect(parseNumberList('0, x', 12)).toBe('"x" is not a number');
    expect(parseNumberList('3', 12)).toBe('a sweep needs at least two values');
    expect(parseNumberList('1,2,3', 2)).toBe('at most 2 values, got 3');
    expect(parseNumberList('1,2,1', 12)).toBe('a value appears twice');
    const spec = { kind: 'list' as const, name: 'values', label: 'Swept values', unit: '', maxItems: 12, default: '' };
    expect(parameterProblem(spec, '1,2')).toBeNull();
    expect(parameterProblem(spec, 3)).toBe('must be a list of numbers as text, got 3');
    expect(parameterProblem(spec, '1,,y')).toBe('"y" is not a number (got "1,,y")');
  });
});
