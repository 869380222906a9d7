import { describe, expect, it } from 'vitest';
import { defaultScenario } from '../../estimator/io/defaultScenario.js';
import { describeProblems, formatHeader, formatRecord, parseResults, type SweepHeader } from '../../estimator/study/resultsFile.js';
import { fakeTrial } from './fakeTrial.js';

const header: SweepHeader = {
  v: 1, kind: 'alight-sweep', tool: '0.1.0', seed: 3, trials: 2, design: 'grid',
  vary: [{ path: 'detector.pixelNoise', values: [1, 2] }],
  points: [{ 'detector.pixelNoise': 1 }, { 'detector.pixelNoise': 2 }],
  scenario: defaultScenario(),
};
const record = (point: number, trial: number) =>
  formatRecord(point, trial, header.points[point]!, fakeTrial(defaultScenario(), { seed: 3, point, trial }));

describe('resultsFile', () => {
  it('formatRecord starts with v, point, trial, params, then the trial result fields', () => {
    expect(record(1, 0)).toMatch(/^\{"v":1,"point":1,"trial":0,"params":\{"detector.pixelNoise":2\},"outcome":"/);
  });
  it('parseResults reads a clean file with no problems', () => {
    const text = [formatHeader(header), record(0, 0), record(0, 1), record(1, 0)].join('\n') + '\n';
    const parsed = parseResults(text, 'r.jsonl');
    expect(parsed.problems).toEqual([]);
    expect(parsed.records.map((r) => r.line)).toEqual([2, 3, 4]);
    expect(parsed.intactLength).toBe(text.length);
  });
  it('parseResults reports truncated, foreign, out-of-range and repeated lines by line number', () => {
    const text = [
      formatHeader(header),
      record(0, 0),
      record(0, 1).slice(0, 50),
      '{"some":"other tool"}',
      record(0, 0),
      record(1, 1).replace('"point":1', '"point":5'),
      record(1, 1).replace('"outcome":"', '"outcome":"x'),
      record(1, 0).slice(0, 30),
    ].join('\n');
    const parsed = parseResults(text, 'r.jsonl');
    expect(parsed.records).toHaveLength(1);
    expect(parsed.problems.map((p) => p.line)).toEqual([3, 4, 5, 6, 7, 8]);
    const listing = describeProblems('r.jsonl', parsed.problems);
    expect(listing).toContain('r.jsonl:3: not valid JSON (truncated or foreign line)');
    expect(listing).toContain('r.jsonl:4: field "v": expected 1');
    expect(listing).toContain('r.jsonl:5: point 0 trial 0 repeats line 2');
    expect(listing).toContain('r.jsonl:6: field "point": expected an integer in [0, 1], got 5');
    expect(listing).toContain('r.jsonl:7: field "outcome"');
    expect(listing).toContain('r.jsonl:8: cut off (no end of line)');
    expect(parsed.intactLength).toBe(text.length - record(1, 0).slice(0, 30).length);
  });
  it('parseResults refuses a file whose first line is no sweep header', () => {
    expect(() => parseResults('{"a":1}\n', 'x.jsonl')).toThrow(/x\.jsonl:1: not an alight sweep header/);
    expect(() => parseResults('time,x\n', 'x.csv')).toThrow(/x\.csv:1: not an alight results file/);
  });
});
