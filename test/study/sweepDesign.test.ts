import { describe, expect, it } from 'vitest';
import { designPoints, parseVary, varyValues } from '../../estimator/study/sweepDesign.js';

describe('sweepDesign', () => {
  it('parseVary reads PATH=FROM:TO:COUNT and PATH=A,B,C', () => {
    expect(parseVary('detector.pixelNoise=0:4:5')).toEqual({ path: 'detector.pixelNoise', from: 0, to: 4, count: 5 });
    expect(parseVary('filter.cameraUpdate=tight,loose')).toEqual({ path: 'filter.cameraUpdate', values: ['tight', 'loose'] });
    expect(() => parseVary('detector.pixelNoise=0:4')).toThrow(/PATH=FROM:TO:COUNT/);
    expect(() => parseVary('detector.pixelNoise=0:4:x')).toThrow(/COUNT a positive integer/);
    expect(() => parseVary('=1:2:3')).toThrow(/dotted scenario path/);
  });
  it('varyValues spaces COUNT values evenly with both ends, tidied to 12 digits', () => {
    expect(varyValues({ path: 'a', from: 0, to: 0.3, count: 4 })).toEqual([0, 0.1, 0.2, 0.3]);
    expect(varyValues({ path: 'a', from: 2, to: 2, count: 1 })).toEqual([2]);
  });
  it('designPoints grid is the Cartesian product, first --vary slowest', () => {
    const points = designPoints([{ path: 'a', from: 0, to: 1, count: 2 }, { path: 'b', values: ['x', 'y', 'z'] }], 'grid', { seed: 1 });
    expect(points).toEqual([
      { a: 0, b: 'x' }, { a: 0, b: 'y' }, { a: 0, b: 'z' },
      { a: 1, b: 'x' }, { a: 1, b: 'y' }, { a: 1, b: 'z' },
    ]);
  });
  it('designPoints lhs puts exactly one point in each of the M strata of every path (McKay et al. 1979)', () => {
    const m = 16;
    const points = designPoints([{ path: 'a', from: 0, to: 8, count: m }, { path: 'b', from: -1, to: 1, count: 2 }], 'lhs', { seed: 7 });
    expect(points).toHaveLength(m);
    const strataA = points.map((p) => Math.floor(((p.a as number) / 8) * m)).sort((x, y) => x - y);
    const strataB = points.map((p) => Math.floor((((p.b as number) + 1) / 2) * m)).sort((x, y) => x - y);
    expect(strataA).toEqual(Array.from({ length: m }, (_, i) => i));
    expect(strataB).toEqual(Array.from({ length: m }, (_, i) => i));
  });
  it('designPoints random is reproducible from the seed and stays inside the ranges', () => {
    const vary = [{ path: 'a', from: 2, to: 3, count: 10 }];
    const one = designPoints(vary, 'random', { seed: 5 });
    expect(designPoints(vary, 'random', { seed: 5 })).toEqual(one);
    expect(designPoints(vary, 'random', { seed: 6 })).not.toEqual(one);
    for (const p of one) expect(p.a as number).toBeGreaterThanOrEqual(2);
    for (const p of one) expect(p.a as number).toBeLessThan(3);
  });
  it('designPoints refuses a path given twice', () => {
    expect(() => designPoints([{ path: 'a', values: [1] }, { path: 'a', values: [2] }], 'grid', { seed: 1 })).toThrow(/given twice/);
  });
});
