import { describe, expect, it } from 'vitest';
import { NewestCache } from '../../estimator/sim/NewestCache.js';

describe('NewestCache', () => {
  it('computes a key once, and drops the oldest key when full', () => {
    const cache = new NewestCache<number>(2);
    const computed: string[] = [];
    const square = (key: string) => cache.get(key, () => (computed.push(key), Number(key) ** 2));
    expect(square('3')).toBe(9);
    expect(square('3')).toBe(9);
    expect(square('4')).toBe(16);
    expect(square('5')).toBe(25); // full: '3' goes
    expect(square('4')).toBe(16);
    expect(square('3')).toBe(9);
    expect(computed).toEqual(['3', '4', '5', '3']);
  });
});
