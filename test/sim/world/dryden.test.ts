import { describe, expect, it } from 'vitest';
import { RandomStream } from '../../../estimator/random/RandomStream.js';
import { DrydenGust, drydenScales } from '../../../estimator/sim/world/dryden.js';
import { expectClose } from '../../helpers/expectClose.js';

const FT = 0.3048;

describe('drydenScales', () => {
  it('drydenScales(20, 15) gives L_u = 143.59 ft and sigma_u / sigma_w = 1.9291 (MIL-F-8785C low altitude; REFERENCES.md)', () => {
    const s = drydenScales(20, 15);
    expectClose(s.Lu, 143.59, { abs: 0.005 }, 'L_u'); // reference printed to 2 decimals
    expectClose(s.Lv, 143.59, { abs: 0.005 }, 'L_v');
    expectClose(s.Lw, 20, { rel: 1e-15 }, 'L_w = h'); // definition
    expectClose(s.sigmaU / s.sigmaW, 1.9291, { abs: 5e-5 }, 'sigma_u / sigma_w'); // reference printed to 4 decimals
    // sigma_w = 0.1 W20 with W20 = 15 kt = 25.3171 ft/s (1 kt = 1852/3600 m/s, 1 ft = 0.3048 m, exact definitions)
    expectClose(s.sigmaW, 2.53171, { abs: 1e-5 }, 'sigma_w');
  });

  it('drydenScales(1000, 30) makes all lengths 1000 ft and all sigmas equal (MIL-F-8785C; REFERENCES.md)', () => {
    const s = drydenScales(1000, 30);
    for (const L of [s.Lu, s.Lv, s.Lw]) expectClose(L, 1000, { rel: 1e-12 }, 'L'); // 0.177 + 0.823 = 1 exactly up to rounding
    for (const sigma of [s.sigmaU, s.sigmaV]) expectClose(sigma, s.sigmaW, { rel: 1e-12 }, 'sigma');
  });

  it('drydenScales clamps heights to [10, 1000] ft', () => {
    expect(drydenScales(2, 15)).toEqual(drydenScales(10, 15));
    expect(drydenScales(5000, 15)).toEqual(drydenScales(1000, 15));
  });
});

/** Zero-mean sample autocorrelation at lag k. */
function autocorrelation(x: Float64Array, k: number): number {
  let num = 0, den = 0;
  for (let i = 0; i < x.length; i++) {
    den += x[i]! * x[i]!;
    if (i + k < x.length) num += x[i]! * x[i + k]!;
  }
  return num / den;
}

describe('DrydenGust', () => {
  // One long seeded record: lander at 10 m, airspeed 10 m/s, light turbulence, one sample per L_u / 10.
  const heightM = 10;
  const airspeed = 10;
  const scales = drydenScales(heightM / FT, 15);
  const Lu = scales.Lu * FT; // m
  const Lw = scales.Lw * FT;
  const spacing = Lu / 10; // m of frozen field per step
  const dt = spacing / airspeed;
  const N = 1_000_000;
  const u = new Float64Array(N), v = new Float64Array(N), w = new Float64Array(N);
  const gust = new DrydenGust('light', RandomStream.fromKey([2026, 0, 0, 7]));
  const out = new Float64Array(3);
  for (let i = 0; i < N; i++) {
    gust.step(dt, heightM, airspeed, out);
    u[i] = out[0]!; v[i] = out[1]!; w[i] = out[2]!;
  }
  const distance = N * spacing;

  it('step() samples have the standard deviations sigma_u, sigma_v, sigma_w of MIL-F-8785C (seeded, 1e6 samples)', () => {
    // Sample-variance spread for a correlated record of length D: sd/sigma^2 ~ sqrt(4 int_0^inf rho^2 / D)
    // = sqrt(2 L / D) for the exponential (u): 0.45 % here; v and w are narrower. 2 % is > 4 sd.
    expect(distance / Lu).toBeGreaterThan(99_000);
    const variance = (x: Float64Array) => x.reduce((sum, value) => sum + value * value, 0) / x.length;
    expectClose(variance(u), (scales.sigmaU * FT) ** 2, { rel: 0.02 }, 'var u');
    expectClose(variance(v), (scales.sigmaV * FT) ** 2, { rel: 0.02 }, 'var v');
    expectClose(variance(w), (scales.sigmaW * FT) ** 2, { rel: 0.02 }, 'var w');
  });

  it('step() u decays as exp(-xi / L_u) along the frozen field: fitted L_u within 3 % (MIL-F-8785C)', () => {
    // Fit -ln rho(xi_k) = xi_k / L through the origin over lags xi = L/10 ... L.
    let sxx = 0, sxy = 0;
    for (let k = 1; k <= 10; k++) {
      const xi = k * spacing;
      sxx += xi * xi;
      sxy += xi * -Math.log(autocorrelation(u, k));
    }
    // Bartlett's formula for AR(1), rho_1 = e^-0.1, lag 10: var(rho_hat) ~ 8.7 / N -> sd 0.003 at
    // rho = 0.37, i.e. 0.8 % in L; 3 % is about 4 sd.
    expectClose(sxx / sxy, Lu, { rel: 0.03 }, 'fitted L_u');
  });

  it('step() w has the Dryden transverse correlation exp(-xi/L)(1 - xi/(2L)) with L_w = h (MIL-F-8785C)', () => {
    for (const k of [1, 2, 3, 6]) {
      const xi = (k * spacing) / Lw;
      // sd of rho_hat ~ sqrt(few / N) ~ 0.003 for these short correlation times; 0.012 is 4 sd
      expectClose(autocorrelation(w, k), Math.exp(-xi) * (1 - xi / 2), { abs: 0.012 }, `rho_w at ${xi.toFixed(2)} L`);
    }
  });

  it('step() keeps the standard correlation at a coarse step (xi = 2 L_u per step: the discretisation is exact)', () => {
    const coarse = new DrydenGust('moderate', RandomStream.fromKey([2026, 0, 0, 8]));
    const M = 200_000;
    const cu = new Float64Array(M), cw = new Float64Array(M);
    const stepLength = 2 * Lu; // m of frozen field per step
    for (let i = 0; i < M; i++) {
      coarse.step(stepLength / airspeed, heightM, airspeed, out);
      cu[i] = out[0]!; cw[i] = out[2]!;
    }
    // lag-1 correlation sd ~ sqrt((1 - rho^2)^2 / M) < 0.0023; 0.01 is > 4 sd
    expectClose(autocorrelation(cu, 1), Math.exp(-2), { abs: 0.01 }, 'rho_u(2 L_u)');
    const xi = stepLength / Lw;
    expectClose(autocorrelation(cw, 1), Math.exp(-xi) * (1 - xi / 2), { abs: 0.01 }, 'rho_w');
    // moderate: W20 = 30 kt, so sigma_w = 0.1 W20 doubles light's
    const variance = cw.reduce((sum, value) => sum + value * value, 0) / M;
    expectClose(variance, (2 * scales.sigmaW * FT) ** 2, { rel: 0.02 }, 'var w'); // nearly independent samples: sd 0.3 %
  });

  it('step() with level none writes zeros; the same seed gives the same gusts', () => {
    const none = new DrydenGust('none', RandomStream.fromKey([1]));
    expect(Array.from(none.step(0.01, 5, 3, new Float64Array(3)))).toEqual([0, 0, 0]);
    const a = new DrydenGust('severe', RandomStream.fromKey([5]), 1);
    const b = new DrydenGust('severe', RandomStream.fromKey([5]), 1);
    const oa = new Float64Array(3), ob = new Float64Array(3);
    for (let i = 0; i < 100; i++) {
      a.step(0.01, 5, 0, oa);
      b.step(0.01, 5, 0, ob);
    }
    expect(Array.from(oa)).toEqual(Array.from(ob));
    expect(Math.hypot(oa[0]!, oa[1]!, oa[2]!)).toBeGreaterThan(0);
  });
});
