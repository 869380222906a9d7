import { describe, expect, it } from 'vitest';
import { emptyProcessCoefficients, processCoefficients, ProcessCoefficientCache } from '../../estimator/models/ProcessCoefficients.js';
import { expectClose } from '../helpers/expectClose.js';

describe('processCoefficients', () => {
  it('constant velocity: the continuous white-noise integrals q dt³/3, q dt²/2, q dt (Bar-Shalom et al. 2001, continuous white-noise acceleration model)', () => {
    const c = processCoefficients(0.02, { carrierAccelNoise: 0.5, singerTau: 1, accelNoise: 0.1, accelBiasWalk: 0.01, qScale: 2 }, emptyProcessCoefficients(false));
    const qc = 0.25 * 2, qa = 0.01 * 2, qb = 1e-4 * 2, dt = 0.02;
    // 1e-15 relative: closed forms evaluated directly.
    expectClose(c.Qrr, ((qc + qa) * dt ** 3) / 3, { rel: 1e-14 }, 'Q_rr');
    expectClose(c.QrVc, (qc * dt ** 2) / 2, { rel: 1e-14 }, 'Q_rvC');
    expectClose(c.QrVl, (-qa * dt ** 2) / 2, { rel: 1e-14 }, 'Q_rvL');
    expectClose(c.QVcVc, qc * dt, { rel: 1e-14 }, 'Q_vCvC');
    expectClose(c.QBaBa, qb * dt, { rel: 1e-14 }, 'Q_baba');
  });

  it('Singer: quadrature equals the closed-form acceleration and velocity-acceleration terms (Singer 1970, IEEE Trans. AES-6)', () => {
    const tau = 1.5, sigma = 0.4, dt = 0.05;
    const c = processCoefficients(dt, { carrierAccelNoise: sigma, singerTau: tau, accelNoise: 0, accelBiasWalk: 0, qScale: 1 }, emptyProcessCoefficients(true));
    const qw = (sigma * sigma) / (tau * tau);
    const e1 = Math.exp(-dt / tau), e2 = Math.exp((-2 * dt) / tau);
    // ∫₀^dt e^(-2s/τ) ds and ∫₀^dt τ(1 - e^(-s/τ)) e^(-s/τ) ds, worked by hand.
    const aa = (qw * tau * (1 - e2)) / 2;
    const va = qw * tau * (tau * (1 - e1) - (tau * (1 - e2)) / 2);
    // 1e-13 relative: 8-point Gauss–Legendre on a smooth integrand is exact to round-off here.
    expectClose(c.QAcAc, aa, { rel: 1e-13 }, 'Q_aa');
    expectClose(c.QVcAc, va, { rel: 1e-12 }, 'Q_va');
    expectClose(c.e, e1, { rel: 1e-15 }, 'e');
    expectClose(c.beta, tau * (1 - e1), { rel: 1e-14 }, 'beta');
  });

  it('Singer tends to the white-noise model as tau -> 0 (same low-frequency density)', () => {
    const dt = 0.01, sigma = 0.3;
    const singer = processCoefficients(dt, { carrierAccelNoise: sigma, singerTau: 1e-5, accelNoise: 0, accelBiasWalk: 0, qScale: 1 }, emptyProcessCoefficients(true));
    const cv = processCoefficients(dt, { carrierAccelNoise: sigma, singerTau: 1, accelNoise: 0, accelBiasWalk: 0, qScale: 1 }, emptyProcessCoefficients(false));
    // 1e-2 relative: corrections are O(tau / dt) = 1e-3.
    expectClose(singer.QVcVc, cv.QVcVc, { rel: 1e-2 }, 'Q_vCvC');
    expectClose(singer.Qrr, cv.Qrr, { rel: 1e-2 }, 'Q_rr');
    expectClose(singer.QrVc, cv.QrVc, { rel: 1e-2 }, 'Q_rvC');
  });
});

describe('carrier vertical acceleration noise', () => {
  const base = { carrierAccelNoise: 0.5, singerTau: 2, accelNoise: 0.1, accelBiasWalk: 0.01, qScale: 1.3 };
  for (const singer of [false, true]) {
    it(`${singer ? 'Singer' : 'constant velocity'}: the z blocks are the horizontal formulas with sigma_z; absent, they equal the horizontal blocks to the bit`, () => {
      const withZ = processCoefficients(0.02, { ...base, carrierVerticalAccelNoise: 0.05 }, emptyProcessCoefficients(singer));
      // the z blocks of sigma 0.5 / sigma_z 0.05 are the horizontal blocks of a carrier whose noise is 0.05
      const small = processCoefficients(0.02, { ...base, carrierAccelNoise: 0.05 }, emptyProcessCoefficients(singer));
      const pairs = [['QrrZ', 'Qrr'], ['QrVcZ', 'QrVc'], ['QVcVcZ', 'QVcVc'], ['QrAcZ', 'QrAc'], ['QVcAcZ', 'QVcAc'], ['QAcAcZ', 'QAcAc']] as const;
      for (const [z, h] of pairs) expect(withZ[z]).toBe(small[h]);
      // horizontal blocks untouched by sigma_z; the lander's share of Q_rr is in both
      const plain = processCoefficients(0.02, base, emptyProcessCoefficients(singer));
      for (const [z, h] of pairs) {
        expect(withZ[h]).toBe(plain[h]);
        expect(plain[z]).toBe(plain[h]); // default sigma_z = sigma: the very same numbers
      }
      expect(withZ.QrVcZ).toBeLessThan(plain.QrVc / 50); // 100x smaller density, 100x smaller carrier blocks
    });
  }
});

describe('ProcessCoefficientCache', () => {
  const noise = { carrierAccelNoise: 0.4, singerTau: 1.5, accelNoise: 0.06, accelBiasWalk: 0.003, qScale: 1.7 };

  it('returns exactly what processCoefficients computes for each dt, keeping steps that differ in the last bits apart', () => {
    const cache = new ProcessCoefficientCache(true, noise, 4);
    // t - t_prev for t = k / 100: values a clock really produces, all ≈ 0.01
    const steps = [0.03 - 0.02, 0.01, 0.07 - 0.06, 0.02 - 0.01];
    expect(new Set(steps).size).toBeGreaterThan(1);
    for (let round = 0; round < 2; round++) {
      for (const dt of steps) {
        const expected = processCoefficients(dt, noise, emptyProcessCoefficients(true));
        expect({ ...cache.get(dt) }).toEqual({ ...expected });
      }
    }
    expect(cache.get(steps[0]!)).toBe(cache.get(steps[0]!)); // kept, not recomputed
  });

  it('replaces entries round-robin when more step lengths come than it holds, and clear() forgets all', () => {
    const cache = new ProcessCoefficientCache(false, noise, 2);
    const a = cache.get(0.01), b = cache.get(0.02);
    expect(cache.get(0.01)).toBe(a);
    const c = cache.get(0.03); // replaces the oldest entry (a's)
    expect(c).toBe(a);
    expect(c.dt).toBe(0.03);
    expect(cache.get(0.02)).toBe(b);
    cache.clear();
    expect(b.dt).toBeNaN();
    expect(cache.get(0.02).QVlVl).toBe(processCoefficients(0.02, noise, emptyProcessCoefficients(false)).QVlVl);
  });
});
