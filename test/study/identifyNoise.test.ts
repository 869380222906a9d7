import { describe, expect, it } from 'vitest';
import { RandomStream } from '../../estimator/random/RandomStream.js';
import { identifyNoise } from '../../estimator/study/identifyNoise.js';
import { roundTo, supportedDigits } from '../../estimator/study/termValueText.js';
import { expectClose } from '../helpers/expectClose.js';

/** N seeded draws of N(0, sigma²). */
function draws(n: number, sigma: number, seed: number): number[] {
  const rng = RandomStream.fromKey([seed]);
  return Array.from({ length: n }, () => sigma * rng.gaussian());
}

/** -2 ln L of zero-mean Gaussian samples with variance v: sum (ln 2 pi v + x² / v). */
function minus2LogL(xs: readonly number[], v: number): number {
  return xs.reduce((a, x) => a + Math.log(2 * Math.PI * v) + (x * x) / v, 0);
}

describe('identifyNoise', () => {
  it('finds the sample standard deviation of Gaussian data with the curvature interval exp(±1.96 / sqrt(2N))', async () => {
    // For D(σ) = sum (ln 2πσ² + x²/σ²) the optimum is σ̂² = mean x² and, in z = ln σ,
    // D'' = 4N there, so C = 2 / D'' = 1 / (2N): the textbook large-sample variance of ln σ̂
    // (Wilks 1938, chi-square(1) rise of 3.84 = 1.96²).
    const xs = draws(500, 2, 11);
    const sigmaHat = Math.sqrt(xs.reduce((a, x) => a + x * x, 0) / xs.length);
    const r = await identifyNoise(({ sigma }) => minus2LogL(xs, sigma! * sigma!), [{ name: 'sigma', unit: 'px', start: 8, lower: 0.01, upper: 100 }]);
    const t = r.terms[0]!;
    expect(t.status).toBe('identified');
    // Tolerance 0.5 %: the simplex stops when its values agree within 0.01 in D; D rises by
    // 2N δ² at δ off in ln σ, so δ stays below sqrt(0.01 / 1000) ≈ 0.3 % (0.5 % leaves room for the stop rule).
    expectClose(t.estimate, sigmaHat, { rel: 5e-3 }, 'sigma');
    const half = 1.959964 / Math.sqrt(2 * xs.length);
    // Tolerance 1 %: the central difference over ±0.1 in ln σ overstates D'' by (e^0.2 + e^-0.2 - 2) / 0.04 - 1 = 0.7 %.
    expectClose(Math.log(t.high! / t.estimate), half, { rel: 0.01 }, 'upper half-width');
    expectClose(Math.log(t.estimate / t.low!), half, { rel: 0.01 }, 'lower half-width');
    expect(t.digits).toBe(3); // ±6 % of about 1.9: width 0.23, a quarter is 0.058, so steps of 0.01 ("1.87"), not 0.1
    expect(t.recommended).toBe(roundTo(t.estimate, 3));
  });

  it('says a term the objective ignores is not identifiable and keeps its start', async () => {
    const xs = draws(200, 1, 12);
    const r = await identifyNoise(({ sigma }) => minus2LogL(xs, sigma! * sigma!), [
      { name: 'sigma', unit: 'px', start: 3, lower: 0.01, upper: 100 },
      { name: 'unused', unit: 'm/s', start: 0.2, lower: 1e-3, upper: 10 },
    ]);
    const unused = r.terms[1]!;
    expect(unused.status).toBe('not-identifiable');
    expect(unused.low).toBeNull();
    expect(unused.high).toBeNull();
    expect(unused.recommended).toBe(0.2);
    expect(unused.warning).toContain('not identifiable');
    expect(r.terms[0]!.status).toBe('identified');
  });

  it('bounds a variance component whose true value is zero from above only', async () => {
    // x ~ N(0, 1 + b²) with unit-variance data: the likelihood is flat as b -> 0 and rises for large b.
    const xs = draws(400, 1, 13);
    const r = await identifyNoise(({ b }) => minus2LogL(xs, 1 + b! * b!), [{ name: 'b', unit: 'px', start: 0.5, lower: 1e-3, upper: 10 }]);
    const b = r.terms[0]!;
    expect(b.status).toBe('upper-bound-only');
    expect(b.low).toBeNull();
    // 1 + b² must stay within the variance's own 95 % range (about 1 ± 2 sqrt(2/400) = 1 ± 0.14): b below about 0.6.
    expect(b.high!).toBeGreaterThan(0.1);
    expect(b.high!).toBeLessThan(0.7);
    expect(b.warning).toContain('only from above');
  });

  it('moves a refused start up until the objective accepts it', async () => {
    const xs = draws(300, 1, 14);
    const r = await identifyNoise(({ s }) => (s! < 0.1 ? Infinity : minus2LogL(xs, s! * s!)), [{ name: 's', unit: 'px', start: 0.01, lower: 1e-3, upper: 10 }]);
    expect(r.terms[0]!.status).toBe('identified');
    expectClose(r.terms[0]!.estimate, 1, { rel: 0.1 }, 's'); // 300 unit-variance draws: ±8 % at 95 %
  });

  it('supportedDigits follows the interval width', () => {
    expect(supportedDigits(5, 3, 8)).toBe(1); // width 5: steps of 1
    expect(supportedDigits(0.169, 0.124, 0.231)).toBe(2); // width 0.107: steps of 0.01
    expect(supportedDigits(1, 0.995, 1.005)).toBe(3); // width 0.01: 0.001 is the finest shown
  });
});
