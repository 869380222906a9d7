import { describe, expect, it } from 'vitest';
import { STUDIES } from '../../../notebooks/studies/studies.js';
import type { NumberParameter } from '../../../notebooks/studies/Parameter.js';
import { minimumSuccesses } from '../../../estimator/study/statistics/trialsNeeded.js';

/** The highest success claim any study's controls offer (its success-target controls' maximum). */
function highestClaim(): number {
  let high = 0;
  for (const study of STUDIES) {
    for (const p of study.parameters) {
      if (p.kind === 'number' && /success|target/i.test(p.label) && p.max < 1) high = Math.max(high, p.max);
    }
  }
  return high;
}

/** Straight successes the project's Wilson rule needs before the lower bound reaches `target`. */
function straightSuccessesNeeded(target: number): number {
  for (let n = 1; n < 100_000; n++) if (minimumSuccesses(n, target) === n) return n;
  throw new Error(`no n reaches ${target}`);
}

describe('study trial caps', () => {
  it('every study that runs trials lets a user choose enough of them to support the highest claim the page offers', () => {
    const claim = highestClaim();
    expect(claim).toBe(0.99); // the detection and test-card claim controls reach 99 %
    // Wilson 1927 score interval (z = 1.96): n of n has lower bound n / (n + z^2), so 0.95 needs
    // n >= 0.95 z^2 / 0.05 = 72.99 -> 73; 0.99 needs 380.3 -> 381 (derived from the formula).
    const needed = straightSuccessesNeeded(claim);
    expect(needed).toBe(381);
    const caps = STUDIES.flatMap((s) =>
      s.parameters.filter((p): p is NumberParameter => p.kind === 'number' && p.name === 'trials').map((p) => ({ study: s.id, max: p.max })),
    );
    expect(caps.length).toBeGreaterThanOrEqual(4);
    const short = caps.filter((c) => c.max < needed);
    expect(short, `studies whose trial cap cannot support a ${claim} claim (needs ${needed} straight successes)`).toEqual([]);
  });

  it('straightSuccessesNeeded follows the Wilson rule: 73 for a 95 % claim', () => {
    expect(straightSuccessesNeeded(0.95)).toBe(73);
  });
});
