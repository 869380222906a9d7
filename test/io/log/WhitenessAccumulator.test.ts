import { describe, expect, it } from 'vitest';
import { WhitenessAccumulator } from '../../../estimator/io/log/WhitenessAccumulator.js';
import { RandomStream } from '../../../estimator/random/RandomStream.js';
import { expectClose } from '../../helpers/expectClose.js';

/** The textbook batch form: r_k = sum (x_t - m)(x_{t+k} - m) / sum (x_t - m)^2 (Box and Jenkins 1976). */
function batchAutocorrelation(x: number[], lags: number): number[] {
  const m = x.reduce((a, b) => a + b, 0) / x.length;
  const c0 = x.reduce((a, b) => a + (b - m) ** 2, 0);
  const out: number[] = [];
  for (let k = 1; k <= lags; k++) {
    let c = 0;
    for (let t = 0; t + k < x.length; t++) c += (x[t]! - m) * (x[t + k]! - m);
    out.push(c / c0);
  }
  return out;
}

function fill(acc: WhitenessAccumulator, x: number[]): void {
  for (const v of x) acc.add(v);
}

describe('WhitenessAccumulator', () => {
  it('online autocorrelations equal the batch formula and Q follows Ljung-Box 1978', () => {
    const stream = RandomStream.fromKey([7, 0, 0, 1]);
    const x = Array.from({ length: 500 }, () => 3 + stream.gaussian());
    const acc = new WhitenessAccumulator('test', 10);
    fill(acc, x);
    const result = acc.result()!;
    const batch = batchAutocorrelation(x, 10);
    // rounding only: both sum the same 500 products in different order
    for (let k = 0; k < 10; k++) expectClose(result.autocorrelation[k]!, batch[k]!, { abs: 1e-10 }, `r_${k + 1}`);
    const q = 500 * 502 * batch.reduce((a, r, i) => a + (r * r) / (500 - i - 1), 0);
    expectClose(result.ljungBox, q, { rel: 1e-9 }, 'Q'); // rounding only
    // chi-square(10) upper 5 % point 18.307 (NIST/SEMATECH e-Handbook 1.3.6.7.4)
    expectClose(result.threshold, 18.307, { abs: 5e-4 }, 'threshold'); // table gives 3 decimals
    expectClose(result.bound, 1.96 / Math.sqrt(500), { rel: 1e-15 }, 'bound');
  });

  it('rejects seeded white noise about 5 % of the time and always rejects an AR(1) sequence with phi = 0.5', () => {
    let rejected = 0;
    let arRejected = 0;
    let arLag1 = 0;
    for (let run = 0; run < 100; run++) {
      const stream = RandomStream.fromKey([7, 1, run, 2]);
      const white = new WhitenessAccumulator('white', 20);
      const ar = new WhitenessAccumulator('ar1', 20);
      let a = 0;
      for (let i = 0; i < 1000; i++) {
        const e = stream.gaussian();
        white.add(e);
        a = 0.5 * a + e;
        ar.add(a);
      }
      if (!white.result()!.white) rejected++;
      const r = ar.result()!;
      if (!r.white) arRejected++;
      arLag1 += r.autocorrelation[0]! / 100;
    }
    // Size of a 5 % test: Binomial(100, 0.05) lies in 1..11 with probability > 0.98 (common practice).
    expect(rejected).toBeGreaterThanOrEqual(1);
    expect(rejected).toBeLessThanOrEqual(11);
    expect(arRejected).toBe(100);
    // AR(1): r_1 -> phi = 0.5; mean of 100 runs, each with standard error about 1/sqrt(1000)
    expectClose(arLag1, 0.5, { abs: 0.02 }, 'AR(1) mean r_1');
  });

  it('returns null with too few samples and refuses a bad lag count', () => {
    const acc = new WhitenessAccumulator('short', 5);
    fill(acc, [1, 2, 3, 4, 5, 6]);
    expect(acc.result()).toBeNull();
    acc.add(7);
    expect(acc.result()).not.toBeNull();
    expect(() => new WhitenessAccumulator('x', 0)).toThrow(/positive integer/);
  });
});
