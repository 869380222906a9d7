import { describe, expect, it } from 'vitest';
import { checkRowValues } from '../../../estimator/io/log/checkRowValues.js';
import { ProblemLog } from '../../../estimator/io/log/LogProblem.js';

describe('checkRowValues', () => {
  it('turns x/y/w/h into corners and passes good rows', () => {
    const problems = new ProblemLog();
    const v = Float64Array.of(1, 10, 20, 5, 6, 1.1, 0.8); // capture, x, y, w, h, arrival, score
    expect(checkRowValues('boxes', 1, v, problems, 'boxes.csv', 2)).toBe(true);
    expect(Array.from(v)).toEqual([1, 10, 20, 15, 26, 1.1, 0.8]);
    expect(checkRowValues('attitude', 0, Float64Array.of(0, 0.7071068, 0, 0, 0.7071068), problems, 'attitude.csv', 2)).toBe(true);
    expect(problems.total).toBe(0);
  });

  it('turns ZYX Euler angles (deg) into the quaternion q_wb', () => {
    const v = Float64Array.of(2, 0, 0, 90, 0); // time, rollDeg, pitchDeg, yawDeg, (slot for qz)
    expect(checkRowValues('attitude', 1, v, new ProblemLog(), 'attitude.csv', 2)).toBe(true);
    // yaw 90 deg about z: q = [cos 45, 0, 0, sin 45] (frames/quatFromEulerDeg example)
    expect(v[1]).toBeCloseTo(Math.SQRT1_2, 15);
    expect([v[2], v[3]]).toEqual([0, 0]);
    expect(v[4]).toBeCloseTo(Math.SQRT1_2, 15);
  });

  it('reports each domain problem once with its column', () => {
    const problems = new ProblemLog();
    const bad: [Parameters<typeof checkRowValues>[0], number, number[]][] = [
      ['boxes', 0, [1, 10, 10, 5, 20, 1.1, 1]],
      ['boxes', 0, [1, 10, 10, 20, 5, 1.1, 1]],
      ['boxes', 1, [1, 10, 10, 5, -1, 1.1, 1]],
      ['boxes', 0, [1.2, 10, 10, 20, 20, 1.1, 1]],
      ['boxes', 0, [1, 10, 10, 20, 20, 1.1, -0.1]],
      ['attitude', 0, [0, 1.01, 0, 0, 0]],
    ];
    for (const [stream, layout, values] of bad) expect(checkRowValues(stream, layout, Float64Array.from(values), problems, `${stream}.csv`, 9)).toBe(false);
    expect(problems.shown.map((p) => [p.kind, p.column])).toEqual([
      ['box-inverted', 'xMax'],
      ['box-inverted', 'yMax'],
      ['box-inverted', 'h'],
      ['capture-after-arrival', 'arrival'],
      ['score-out-of-range', 'score'],
      ['quaternion-not-unit', 'qw'],
    ]);
  });
});
