import { describe, expect, it } from 'vitest';
import { defaultScenario } from '../../estimator/io/defaultScenario.js';
import type { SweepHeader, SweepRecord } from '../../estimator/study/resultsFile.js';
import { summarize } from '../../estimator/study/summarize.js';
import { summaryCsv, summaryTable } from '../../estimator/study/summaryTable.js';
import { fakeTrial } from './fakeTrial.js';

const header: SweepHeader = {
  v: 1, kind: 'alight-sweep', tool: '0.1.0', seed: 3, trials: 30, design: 'grid',
  vary: [{ path: 'a', values: [1, 2] }, { path: 'b', values: ['x', 'y'] }],
  points: [{ a: 1, b: 'x' }, { a: 1, b: 'y' }, { a: 2, b: 'x' }, { a: 2, b: 'y' }],
  scenario: defaultScenario(),
};
const records: SweepRecord[] = [];
for (let t = 0; t < 29; t++) records.push({ v: 1, point: 0, trial: t, params: header.points[0]!, ...fakeTrial(defaultScenario(), { seed: 1, point: 0, trial: t }), outcome: 'landed' });
for (let t = 0; t < 30; t++) records.push({ v: 1, point: 2, trial: t, params: header.points[2]!, ...fakeTrial(defaultScenario(), { seed: 1, point: 2, trial: t }), outcome: t < 15 ? 'landed' : 'aborted' });

describe('summaryTable and summaryCsv', () => {
  it('summaryCsv has a column per path, the statistics and outcome counts', () => {
    const csv = summaryCsv(summarize(header, records), ['a', 'b']).split('\n');
    expect(csv[0]!.startsWith('a,b,trials,landed,successRate,wilsonLow,wilsonHigh')).toBe(true);
    expect(csv[0]!.includes(',outcome.off-carrier,outcome.aborted,')).toBe(true);
    expect(csv[0]!.includes(',outcome.diverged,outcome.silent-divergence,cause.dropout-burst,')).toBe(true);
    expect(csv[0]!.endsWith(',cause.no-single-cause,cause.not-attributed')).toBe(true);
    expect(csv[1]!.startsWith('1,x,29,29,1,')).toBe(true);
  });  it('summaryTable shows each point with its Wilson interval, the rule-of-three bound and outcome totals', () => {
    const text = summaryTable(summarize(header, records));
    const lines = text.trim().split('\n');
    expect(lines[0]).toMatch(/^point\s+trials\s+landed\s+success %\s+wilson95 %\s+cep50 m\s+cep95 m/);
    // rates in whole percent: one of 29 trials moves the rate by 3.4 %, so decimals would be noise
    expect(lines[1]).toMatch(/^a=1 b=x\s+29\s+29\s+100\s+88-100 \(r3 >= 90\)\s+\d+\.\d\d\s+\d+\.\d\d\s/); // Newcombe 1998: 29/29 -> 0.8830; CEP in m to the cm
    expect(lines[2]).toMatch(/^a=2 b=x\s+30\s+15\s+50\s+/);
    // every row lines up under the header: same length once padded
    expect(new Set(lines.slice(0, 3).map((l) => l.length)).size).toBe(1);
    expect(text).toContain('outcomes: landed 44, off-pad 0, hard-contact 0, off-carrier 0, aborted 15');
    // these records predate attribution: their failures are counted as not attributed, with a trial to replay
    expect(text).toMatch(/failures by cause.*\na=2 b=x: not-attributed 15 \(\d{2}-\d{2} %, e\.g\. trial 2\/15\)\n$/);
  });
});
