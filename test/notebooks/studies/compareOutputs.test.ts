import { describe, expect, it } from 'vitest';
import { compareOutputs } from '../../../notebooks/studies/compareOutputs.js';
import type { FigureOutput } from '../../../notebooks/studies/Study.js';
import { expectClose } from '../../helpers/expectClose.js';

function output(csv: string, numbers: FigureOutput['numbers'] = []): FigureOutput {
  return { kind: 'svg', markup: '', csv, numbers, final: true, status: '' };
}

describe('compareOutputs', () => {
  it('matches success counts row by row and gives Newcombe intervals of B - A', () => {
    const a = new Map([['success', output('x,trials,landed,successRate\n1,80,48,0.6\n2,10,5,0.5\n', [{ key: 'k', label: 'success', value: 0.6, text: '60 %' }])]]);
    const b = new Map([['success', output('x,trials,landed,successRate\n1,70,56,0.8\n3,10,5,0.5\n', [{ key: 'k', label: 'success', value: 0.8, text: '80 %' }])]]);
    const c = compareOutputs(a, b);
    expect(c.counts).toHaveLength(1); // x = 2 and x = 3 have no partner
    const d = c.counts[0]!;
    expect(d.row).toBe('x = 1');
    expect(d.a).toEqual({ landed: 48, trials: 80 });
    // Newcombe 1998 ("Interval estimation for the difference between independent proportions",
    // Statistics in Medicine 17:873-890), method 10, worked example 56/70 - 48/80: 0.0524 to 0.3339
    // (the printed values recalled from memory [memory]; the formula is the one differenceInterval cites).
    expectClose(d.low, 0.0524, { abs: 5e-5 }, 'low (4 decimals as printed)');
    expectClose(d.high, 0.3339, { abs: 5e-5 }, 'high (4 decimals as printed)');
    expect(d.reading).toBe('B higher');
    expect(c.numbers).toEqual([{ figure: 'success', key: 'k', label: 'success', a: 0.6, b: 0.8, aText: '60 %', bText: '80 %' }]);
  });

  it('lists a point once when several figures tabulate the same counts', () => {
    const csv = 'x,trials,landed\n1,5,4\n';
    const c = compareOutputs(new Map([['success', output(csv)], ['claims', output(csv)]]), new Map([['success', output(csv)], ['claims', output(csv)]]));
    expect(c.counts.map((d) => d.figure)).toEqual(['success']);
  });

  it('reads quoted identifiers and says when an interval includes zero', () => {
    const a = new Map([['s', output('shape,speed,trials,landed\n"a, b",2,5,4\n')]]);
    const b = new Map([['s', output('shape,speed,trials,landed\n"a, b",2,5,3\n')]]);
    const [d] = compareOutputs(a, b).counts;
    expect(d!.row).toBe('shape = a, b, speed = 2');
    expect(d!.difference).toBeCloseTo(-0.2, 12); // 3/5 - 4/5, rounding only
    expect(d!.reading).toBe('no difference shown');
  });
});
