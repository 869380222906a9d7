import { describe, expect, it } from 'vitest';
import { eulerDegFromQuat } from '../../../estimator/frames/quatFromEulerDeg.js';
import { quatConjugate, quatMultiply } from '../../../estimator/frames/quaternion.js';
import { RandomStream } from '../../../estimator/random/RandomStream.js';
import type { CameraSpec, LocalizationSpec } from '../../../estimator/sim/Scenario.js';
import { LocalizationError } from '../../../estimator/sim/world/localizationError.js';
import { expectClose } from '../../helpers/expectClose.js';

const perfect: LocalizationSpec = {
  biasDraw: 'fixed', // the mechanics below use each error as written
  attitudeBiasDeg: 0, attitudeNoiseDeg: 0, odometryRate: 10, odometryBias: 0, odometryNoise: 0, odometryDrift: 0,
  imuRate: 200, accelNoise: 0, accelBias: 0, misalignmentDeg: 0, focalError: 0, targetSizeError: 0, clockOffset: 0,
  gyroBiasDegPerSec: 0, gyroNoiseDegPerSqrtSec: 0, attitudeCorrectionTime: 1,
};
const make = (spec: Partial<LocalizationSpec>, seed = 1) => new LocalizationError({ ...perfect, ...spec }, RandomStream.fromKey([seed, 0, 0, 9]));
const qTrue = Float64Array.of(Math.cos(0.3), 0.1, -0.2, Math.sin(0.3));
{
  const n = Math.hypot(...qTrue);
  for (let i = 0; i < 4; i++) qTrue[i]! /= n;
}

/** ZYX angles (deg) of conj(q_true) (x) q_est: the body-frame attitude error. */
function errorDeg(qEst: Float64Array): number[] {
  return Array.from(eulerDegFromQuat(quatMultiply(quatConjugate(qTrue), qEst)));
}

describe('LocalizationError', () => {
  it('attitude() with bias only is q_true rotated by the bias about each body axis', () => {
    const est = make({ attitudeBiasDeg: 2 }).attitude(qTrue, new Float64Array(4));
    const e = errorDeg(est);
    for (let k = 0; k < 3; k++) expectClose(e[k]!, 2, { abs: 1e-9 }, `axis ${k}`); // rounding through two products
  });

  it('attitude() noise has the configured sd per axis (10 000 seeded samples)', () => {
    const loc = make({ attitudeNoiseDeg: 0.5 });
    const out = new Float64Array(4);
    const N = 10_000;
    const sum2 = [0, 0, 0];
    for (let i = 0; i < N; i++) {
      const e = errorDeg(loc.attitude(qTrue, out));
      for (let k = 0; k < 3; k++) sum2[k]! += e[k]! ** 2;
    }
    // sd of a sample sd sigma/sqrt(2N) = 0.7 %; 4 % covers it and the small-angle ZYX coupling (~1e-4)
    for (let k = 0; k < 3; k++) expectClose(Math.sqrt(sum2[k]! / N), 0.5, { rel: 0.04 }, `axis ${k}`);
  });

  it('attitude() carries the integrated gyro bias as the steady error b τ from the start (attitudeCorrectionTime τ)', () => {
    const errors = make({ gyroBiasDegPerSec: 0.2, attitudeCorrectionTime: 1.5 });
    const out = new Float64Array(4);
    for (let i = 0; i < 50; i++) {
      const e = errorDeg(errors.attitude(qTrue, out, i * 0.01));
      // b τ = 0.3 deg about each axis (ZYX angles of small equal rotations: second-order differences)
      for (let k = 0; k < 3; k++) expectClose(e[k]!, 0.3, { abs: 2e-3 }, `axis ${k} at step ${i}`);
    }
  });

  it('attitude() gyro angle random walk settles at sd σ sqrt(τ / 2) (Ornstein–Uhlenbeck stationary variance; 200 000 seeded samples)', () => {
    const errors = make({ gyroNoiseDegPerSqrtSec: 0.05, attitudeCorrectionTime: 2 }, 7);
    const out = new Float64Array(4);
    let sum = 0, sumSq = 0, n = 0;
    for (let i = 0; i < 200_000; i++) {
      errors.attitude(qTrue, out, i * 0.01);
      const g = errors.gyroError[0]!;
      sum += g; sumSq += g * g; n++;
    }
    const sd = Math.sqrt(sumSq / n - (sum / n) ** 2);
    // 2000 s of a process correlated over 2 s: about 500 independent samples, sd of the sd ~3 %: 10 %
    expectClose(sd, 0.05 * Math.sqrt(2 / 2), { rel: 0.1 }, 'stationary sd');
  });

  it('odometry() adds the bias, whose random walk grows as drift^2 t (increment variance)', () => {
    const loc = make({ odometryBias: 0.1, odometryDrift: 0.05 });
    const out = new Float64Array(3);
    const v = [1, -2, 0.5];
    loc.odometry(0, v, out);
    expectClose(out[0]! - v[0]!, 0.1, { abs: 1e-15 }, 'initial bias'); // no time elapsed: no drift yet
    const N = 40_000, dt = 0.1;
    let previous = out[1]! - v[1]!;
    let sum2 = 0;
    for (let i = 1; i <= N; i++) {
      loc.odometry(i * dt, v, out);
      const b = out[1]! - v[1]!;
      sum2 += (b - previous) ** 2;
      previous = b;
    }
    // increments ~ N(0, drift^2 dt): sample variance within 4 sd (sqrt(2/N) = 0.7 %) -> 3 %
    expectClose(sum2 / N, 0.05 ** 2 * dt, { rel: 0.03 }, 'increment variance');
    expect(() => loc.odometry(0, v, out)).toThrow(/time order/);
  });

  it('specificForce() has mean f + bias and sd accelNoise (20 000 seeded samples)', () => {
    const loc = make({ accelBias: 0.05, accelNoise: 0.2 });
    const out = new Float64Array(3);
    const N = 20_000;
    let sum = 0, sum2 = 0;
    for (let i = 0; i < N; i++) {
      const e = loc.specificForce([0, 0, 9.8], out)[2]! - 9.8;
      sum += e; sum2 += e * e;
    }
    expectClose(sum / N, 0.05, { abs: (4 * 0.2) / Math.sqrt(N) }, 'bias'); // 4 standard errors
    expectClose(Math.sqrt(sum2 / N - (sum / N) ** 2), 0.2, { rel: 0.03 }, 'noise sd'); // > 4 sd of a sample sd
  });

  it('believedCamera() scales the focal length and keeps the nominal mount; trueCamera() carries the misalignment', () => {
    const spec: CameraSpec = {
      intrinsics: { fx: 600, fy: 610, cx: 320, cy: 240 }, width: 640, height: 480,
      distortion: { k1: -0.05, k2: 0, k3: 0, p1: 0, p2: 0 },
      mount: { offset: [0.1, 0, -0.05], rollDeg: 0, pitchDeg: 5, yawDeg: 0 },
      stabilization: 'body-fixed', gimbalTimeConstant: 0.05, gimbalMaxRateDeg: 120, gimbalMaxAngleDeg: 45,
    };
    const loc = make({ focalError: 0.02, misalignmentDeg: 1.5 });
    const believed = loc.believedCamera(spec);
    expectClose(believed.fx, 612, { rel: 1e-15 }, 'fx'); // 600 * 1.02
    expectClose(believed.fy, 622.2, { rel: 1e-15 }, 'fy');
    expect(believed.mount).toEqual(spec.mount);
    const truth = loc.trueCamera(spec);
    expect(truth.fx).toBe(600);
    expect(truth.mount).toMatchObject({ rollDeg: 1.5, pitchDeg: 6.5, yawDeg: 1.5, offset: [0.1, 0, -0.05] });
  });

  it('believedTargetSize() is sqrt(L W)(1 + error) and cameraTimestamp() adds the clock offset', () => {
    const loc = make({ targetSizeError: -0.1, clockOffset: 0.015 });
    expectClose(loc.believedTargetSize({ deckLength: 4, deckWidth: 1 }), 1.8, { rel: 1e-15 }, 'size'); // sqrt(4) * 0.9
    expectClose(loc.cameraTimestamp(2), 2.015, { abs: 1e-15 }, 'stamp');
  });

  it('biasDraw per-trial: each bias is drawn per trial and per axis with the spec as 1 sigma (zero mean), and the noise channels keep their draws', () => {
    const spec = { biasDraw: 'per-trial' as const, attitudeBiasDeg: 0.3, accelBias: 0.05, misalignmentDeg: 0.4, odometryBias: 0.05, focalError: 0.01, targetSizeError: 0.08, gyroBiasDegPerSec: 0.1 };
    const trials = 4000;
    const sums = { att: [0, 0, 0], att2: [0, 0, 0], size: 0, size2: 0, odo: 0, odo2: 0, cross: 0 };
    for (let seed = 1; seed <= trials; seed++) {
      const loc = make(spec, seed);
      for (let k = 0; k < 3; k++) {
        sums.att[k]! += loc.attitudeBias[k]!;
        sums.att2[k]! += loc.attitudeBias[k]! ** 2;
      }
      sums.cross += loc.attitudeBias[0]! * loc.attitudeBias[1]!;
      sums.size += loc.sizeScale - 1;
      sums.size2 += (loc.sizeScale - 1) ** 2;
      sums.odo += loc.odometryBiasNow[2]!;
      sums.odo2 += loc.odometryBiasNow[2]! ** 2;
    }
    // 4000 draws: the mean's sd is sigma / 63, the sd's relative sd about 1.1 %; 5 sd margins
    for (let k = 0; k < 3; k++) {
      expect(Math.abs(sums.att[k]! / trials)).toBeLessThan((5 * 0.3) / Math.sqrt(trials));
      expectClose(Math.sqrt(sums.att2[k]! / trials), 0.3, { rel: 0.06 }, `attitude bias sd, axis ${k}`);
    }
    expect(Math.abs(sums.cross / trials)).toBeLessThan((5 * 0.09) / Math.sqrt(trials)); // axes independent
    expectClose(Math.sqrt(sums.size2 / trials), 0.08, { rel: 0.06 }, 'size error sd');
    expect(Math.abs(sums.size / trials)).toBeLessThan((5 * 0.08) / Math.sqrt(trials));
    expectClose(Math.sqrt(sums.odo2 / trials), 0.05, { rel: 0.06 }, 'odometry bias sd');
    // the bias stream is made after the noise channels': a drawn and a fixed bias see the same noise
    const fixed = make({ ...spec, biasDraw: 'fixed' }, 7), drawn = make(spec, 7);
    const fa = new Float64Array(3), fb = new Float64Array(3);
    fixed.specificForce([0, 0, 9.8], fa);
    drawn.specificForce([0, 0, 9.8], fb);
    for (let k = 0; k < 3; k++) expectClose(fa[k]! - fixed.accelBias[k]!, fb[k]! - drawn.accelBias[k]!, { abs: 1e-12 }, `noise draw ${k}`);
    expect(fixed.accelBias[0]).toBe(0.05);
  });
});
