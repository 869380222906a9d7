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
    // printed in whole percent: one of 5 trials moves the rate by 20 %
    expect(io.out.join('')).toContain('5 of 5: observed success 100 %, Wilson 95 % interval 57 % to 100 %.');
    expect(io.out.join('')).toContain('up to about 60 %'); // Hanley and Lippman-Hand 1983: 3 / 5
  });
  it('alight trials --observed 925/1000 prints one decimal, as 1000 trials resolve', async () => {
    const io = fakeIo('/');
    expect(await main(['trials', '--observed', '925/1000'], io)).toBe(0);
    // Wilson 1927 score interval, worked by hand: centre 0.92339, half-width 0.016375 -> 0.9070 to 0.9398
    expect(io.out.join('')).toBe('925 of 1000: observed success 92.5 %, Wilson 95 % interval 90.7 % to 94.0 %.\n');
  });
  it('alight trials --target text lines up its counts under one column and names rates in %', async () => {
    const io = fakeIo('/');
    expect(await main(['trials', '--target', '0.9', '--rate', '0.95'], io)).toBe(0);
    const lines = io.out.join('').trimEnd().split('\n');
    expect(lines[0]).toBe('To show success >= 90 % (lower Wilson 95 % bound):');
    expect(lines[1]).toMatch(/^  every trial lands: +35 trials \(rule-of-three estimate: 30\)$/); // Hanley and Lippman-Hand 1983: 3 / (1 - 0.9)
    expect(lines[2]).toMatch(/^  at a true rate of 95 %: +\d+ trials/);
    const column = lines.slice(1).map((l) => /^  .*?: +/.exec(l)![0].length);
    expect(new Set(column).size).toBe(1);
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
