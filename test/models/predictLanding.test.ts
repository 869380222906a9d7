import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { predictLanding, predictLandingLoops } from '../../estimator/models/predictLanding.js';
import { predictLandingSource } from '../../estimator/codegen/predictLandingSource.js';
import { emptyProcessCoefficients, processCoefficients } from '../../estimator/models/ProcessCoefficients.js';
import { landingStateDimension } from '../../estimator/models/landingState.js';
import { rotationMatrixFromQuat } from '../../estimator/frames/rotationMatrixFromQuat.js';
import { quatFromEulerDeg } from '../../estimator/frames/quatFromEulerDeg.js';
import { RandomStream, streamId } from '../../estimator/random/RandomStream.js';
import { expectAllClose, expectClose } from '../helpers/expectClose.js';

// the carrier's vertical noise differs from its horizontal one, so the z blocks are checked apart
const noise = { carrierAccelNoise: 0.4, carrierVerticalAccelNoise: 0.07, singerTau: 1.5, accelNoise: 0.06, accelBiasWalk: 0.003, qScale: 1.7 };
const Rwb = rotationMatrixFromQuat(quatFromEulerDeg(8, -5, 130));
const f = [0.7, -0.4, 9.6];

function randomSpd(n: number, stream: RandomStream): Float64Array {
  const A = Array.from({ length: n * n }, () => stream.gaussian());
  const P = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
    let s = i === j ? 0.5 : 0;
    for (let k = 0; k < n; k++) s += A[i * n + k]! * A[j * n + k]!;
    P[i * n + j] = s / n;
  }
  return P;
}

const MODELS = [
  { singer: false, deckScale: false, pointing: false },
  { singer: true, deckScale: false, pointing: false },
  { singer: false, deckScale: true, pointing: false },
  { singer: true, deckScale: true, pointing: false },
  // the two pointing-bias states (random constants before s)
  { singer: false, deckScale: false, pointing: true },
  { singer: true, deckScale: false, pointing: true },
  { singer: false, deckScale: true, pointing: true },
  { singer: true, deckScale: true, pointing: true },
];

for (const { singer, deckScale, pointing } of MODELS) {
  const n = landingStateDimension(singer, deckScale, pointing);
  describe(`predictLanding (${singer ? 'Singer' : 'constant velocity'}, ${n} states${pointing ? ' with the pointing states' : ''}${deckScale ? ' with the deck scale' : ''})`, () => {
    const stream = RandomStream.fromKey(deckScale || pointing ? [99, singer ? 1 : 0, n, streamId('predict')] : [99, singer ? 1 : 0, streamId('predict')]);
    const x0 = Float64Array.from({ length: n }, () => stream.gaussian());
    const P0 = randomSpd(n, stream);
    const dt = 0.01;
    const c = processCoefficients(dt, noise, emptyProcessCoefficients(singer));

    /** The state map x -> x⁺ alone (P untouched in a scratch copy). */
    function step(x: ArrayLike<number>): Float64Array {
      const out = Float64Array.from(x);
      predictLanding(out, new Float64Array(n * n), n, f, Rwb, c);
      return out;
    }

    it('propagates P as J P Jᵀ + Q with J the central-difference Jacobian of the state map', () => {
      const J = new Float64Array(n * n);
      const h = 1e-5;
      for (let k = 0; k < n; k++) {
        const plus = x0.slice(), minus = x0.slice();
        plus[k]! += h;
        minus[k]! -= h;
        const a = step(plus), b = step(minus);
        for (let i = 0; i < n; i++) J[i * n + k] = (a[i]! - b[i]!) / (2 * h);
      }
      const x = x0.slice(), P = P0.slice();
      expect(predictLanding(x, P, n, f, Rwb, c)).toBe(true);
      const Qfree = P.slice();
      // Expected J P0 Jᵀ; subtract from P to recover Q, which must match the coefficients.
      const expected = new Float64Array(n * n);
      for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
        let s = 0;
        for (let a = 0; a < n; a++) for (let b = 0; b < n; b++) s += J[i * n + a]! * P0[a * n + b]! * J[j * n + b]!;
        expected[i * n + j] = s;
      }
      for (let i = 0; i < n * n; i++) Qfree[i] = P[i]! - expected[i]!;
      // 1e-9: the state map is affine in x, so central differences are exact up to round-off / h.
      for (let a = 0; a < 3; a++) {
        const z = a === 2;
        expectClose(Qfree[a * n + a]!, z ? c.QrrZ : c.Qrr, { abs: 1e-9 }, 'Q_rr');
        expectClose(Qfree[a * n + 3 + a]!, z ? c.QrVcZ : c.QrVc, { abs: 1e-9 }, 'Q_rvC');
        expectClose(Qfree[(3 + a) * n + 3 + a]!, z ? c.QVcVcZ : c.QVcVc, { abs: 1e-9 }, 'Q_vCvC');
        if (singer) expectClose(Qfree[(12 + a) * n + 12 + a]!, z ? c.QAcAcZ : c.QAcAc, { abs: 1e-9 }, 'Q_aCaC');
        expectClose(Qfree[(6 + a) * n + 6 + a]!, c.QVlVl, { abs: 1e-9 }, 'Q_vLvL');
        expectClose(Qfree[a * n + 6 + a]!, c.QrVl, { abs: 1e-9 }, 'Q_rvL');
      }
      const off = Qfree.slice();
      for (let a = 0; a < 3; a++) for (const [i, j] of [[a, a], [a, 3 + a], [3 + a, a], [a, 6 + a], [6 + a, a], [3 + a, 3 + a], [6 + a, 6 + a], [9 + a, 9 + a], [a, 12 + a], [12 + a, a], [3 + a, 12 + a], [12 + a, 3 + a], [12 + a, 12 + a]]) {
        if (i! < n && j! < n) off[i! * n + j!] = 0;
      }
      expectAllClose(off, new Float64Array(n * n), { abs: 1e-9 }, 'no other Q entries');
    });

    if (deckScale) {
      it('keeps the deck scale a random constant: s and P_ss unchanged, P_xs ← F P_xs', () => {
        const x = x0.slice(), P = P0.slice();
        predictLanding(x, P, n, f, Rwb, c);
        const s = n - 1;
        expect(x[s]).toBe(x0[s]);
        expect(P[s * n + s]).toBe(P0[s * n + s]);
        // F P_xs by the central-difference F of the state map (affine: exact to round-off / h, 1e-9)
        const h = 1e-5;
        for (let i = 0; i < n - 1; i++) {
          let expected = 0;
          for (let k = 0; k < n; k++) {
            const plus = x0.slice(), minus = x0.slice();
            plus[k]! += h;
            minus[k]! -= h;
            expected += ((step(plus)[i]! - step(minus)[i]!) / (2 * h)) * P0[k * n + s]!;
          }
          expectClose(P[i * n + s]!, expected, { abs: 1e-9 }, `P_xs[${i}]`);
        }
      });
    }

    it('keeps P exactly symmetric', () => {
      const x = x0.slice(), P = P0.slice();
      predictLanding(x, P, n, f, Rwb, c);
      for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) expect(P[i * n + j]).toBe(P[j * n + i]);
    });

    it('integrates a constant acceleration exactly: r and vL after one step (kinematics, common practice)', () => {
      const x = x0.slice();
      predictLanding(x, new Float64Array(n * n), n, f, Rwb, c);
      const fb = [f[0]! - x0[9]!, f[1]! - x0[10]!, f[2]! - x0[11]!];
      for (let i = 0; i < 3; i++) {
        const a = Rwb[3 * i]! * fb[0]! + Rwb[3 * i + 1]! * fb[1]! + Rwb[3 * i + 2]! * fb[2]! - (i === 2 ? 9.80665 : 0);
        const carrier = singer ? c.alpha * x0[12 + i]! : 0;
        expectClose(x[6 + i]!, x0[6 + i]! + a * dt, { abs: 1e-14 }, `vL[${i}]`);
        expectClose(x[i]!, x0[i]! + dt * (x0[3 + i]! - x0[6 + i]!) - 0.5 * a * dt * dt + carrier, { abs: 1e-14 }, `r[${i}]`);
      }
    });
  });
}

describe('generated straight-line predicts (predictLanding.generated.ts)', () => {
  for (const { singer, deckScale, pointing } of MODELS) {
    const n = landingStateDimension(singer, deckScale, pointing);
    it(`gives the loops' x and P to the last bit (${singer ? 'Singer' : 'constant velocity'}, n = ${n}), on random covariances, attitudes and step lengths`, () => {
      const stream = RandomStream.fromKey([7, n, streamId('generated-predict')]);
      for (let trial = 0; trial < 200; trial++) {
        const P1 = randomSpd(n, stream), P2 = P1.slice();
        const x1 = Float64Array.from({ length: n }, () => stream.gaussian()), x2 = x1.slice();
        const R = rotationMatrixFromQuat(quatFromEulerDeg(30 * stream.gaussian(), 30 * stream.gaussian(), 360 * stream.uniform()));
        const force = [stream.gaussian(), stream.gaussian(), 9.8 + stream.gaussian()];
        const c = processCoefficients(0.002 + 0.02 * stream.uniform(), noise, emptyProcessCoefficients(singer));
        expect(predictLanding(x1, P1, n, force, R, c)).toBe(true);
        expect(predictLandingLoops(x2, P2, n, force, R, c)).toBe(true);
        expect(Array.from(P1)).toEqual(Array.from(P2));
        expect(Array.from(x1)).toEqual(Array.from(x2));
      }
    });

    it(`reports a non-finite P or x like the loops do (${singer ? 'Singer' : 'constant velocity'}, n = ${n})`, () => {
      const stream = RandomStream.fromKey([8, n, streamId('generated-predict')]);
      const c = processCoefficients(0.01, noise, emptyProcessCoefficients(singer));
      for (const index of [0, 5 * n + 7, 11 * n + 11, 3 * n + 10, n * n - 1]) {
        const P = randomSpd(n, stream);
        P[index] = Number.NaN;
        expect(predictLanding(new Float64Array(n), P, n, f, Rwb, c)).toBe(false);
      }
      const x = new Float64Array(n);
      x[4] = Number.POSITIVE_INFINITY;
      expect(predictLanding(x, randomSpd(n, stream), n, f, Rwb, c)).toBe(false);
    });
  }

  it('is what its generator writes (run `npm run codegen` after changing the generator)', () => {
    const committed = readFileSync(new URL('../../estimator/models/predictLanding.generated.ts', import.meta.url), 'utf8');
    expect(committed).toBe(predictLandingSource());
  });
});
