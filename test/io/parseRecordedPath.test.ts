import { describe, expect, it } from 'vitest';
import { parseRecordedPath } from '../../estimator/io/parseRecordedPath.js';

describe('parseRecordedPath', () => {
  it('reads rows after an optional header and comments', () => {
    expect(parseRecordedPath('# road test\nt,x,y,z\n0,0,0,0\n0.5, 1.5, 0.1, 0\n\n1,3,0.2,0\n', 'road.csv')).toEqual([
      [0, 0, 0, 0],
      [0.5, 1.5, 0.1, 0],
      [1, 3, 0.2, 0],
    ]);
  });

  it('names file and line of every bad row', () => {
    expect(() => parseRecordedPath('t,x,y,z\n0,0,0,0\n1,2,0\n1,abc,0,0\n0,1,1,1\n', 'road.csv')).toThrow(
      'road.csv:3: expected 4 numbers t,x,y,z, got "1,2,0"\nroad.csv:4: expected 4 numbers t,x,y,z, got "1,abc,0,0"\nroad.csv:5: t must increase, got 0 after 0',
    );
    expect(() => parseRecordedPath('0,0,0,0\n', 'one.csv')).toThrow('one.csv: a recorded path needs at least 2 rows, got 1');
  });
});
