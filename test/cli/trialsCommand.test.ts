import { describe, expect, it } from 'vitest';
import { main } from '../../estimator/cli/main.js';
import { fakeIo } from './fakeIo.js';

describe('alight trials', () => {
  it('alight trials --target 0.9 --rate 0.95 --json gives 35 all-landed trials (n/(n+z²) >= 0.9)', async () => {
    const io = fakeIo('/');
    expect(await main(['trials', '--target', '0.9', '--rate', '0.95', '--json'], io)).toBe(0);
    const r = JSON.parse(io.out.join('')) as { needed: { allSucceed: number; ruleOfThree: number; atExpectedCount: number; withPower: number } };
    expect(r.needed.allSucceed).toBe(35);
    expect(r.needed.ruleOfThree).toBe(30); // Hanley and Lippman-Hand 1983: 3 / (1 - 0.9)
    expect(r.needed.withPower).toBeGreaterThan(r.needed.atExpectedCount);
  });
  it('alight trials --observed 5/5 says the Wilson lower bound is below 60 %', async () => {
    const io = fakeIo('/');
    expect(await main(['trials', '--observed', '5/5'], io)).toBe(0);
    // Newcombe 1998 formula with k = n = 5: 5 / (5 + 1.96²) = 0.5656.
    expect(io.out.join('')).toContain('Wilson 95 % interval 56.6 % to 100.0 %');
    expect(io.out.join('')).toContain('up to about 60.0 %');
  });
  it('alight trials refuses a bad --observed and a target outside (0, 1)', async () => {
    const a = fakeIo('/');
    expect(await main(['trials', '--observed', '6/5'], a)).toBe(2);
    expect(a.err.join('')).toContain('--observed expects K/N');
    const b = fakeIo('/');
    expect(await main(['trials', '--target', '1.5'], b)).toBe(2);
    expect(b.err.join('')).toContain('--target expects a rate between 0 and 1, got "1.5"');
  });
});
