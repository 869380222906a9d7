import { describe, expect, it } from 'vitest';
import { LandingFilter, FilterSpecError } from '../../estimator/models/LandingFilter.js';
import { boxFromRelativePosition } from '../../estimator/camera/boxGeometry.js';
import { quatFromEulerDeg } from '../../estimator/frames/quatFromEulerDeg.js';
import { cameraFromBody, cameraPointFromWorldVector } from '../../estimator/frames/cameraFromBody.js';
import { rotationMatrixFromQuat } from '../../estimator/frames/rotationMatrixFromQuat.js';
import { averagedChiSquareInterval } from '../../estimator/stats/chiSquare.js';
import { CameraError } from '../../estimator/camera/PinholeCamera.js';
import { expectAllClose, expectClose } from '../helpers/expectClose.js';
import { camera, filterSpec, hoverForce, targetSize } from './landingFixture.js';
import { simulateTracking } from './trackingSimulation.js';
import { ImuHistory } from '../../estimator/models/ImuHistory.js';

const sigma = { position: 0.5, velocity: 0.3, accelBias: 0.05 };
const level = [1, 0, 0, 0];
const r0 = [0.4, -0.2, -9];

function started(overrides = {}): LandingFilter {
  const filter = new LandingFilter(filterSpec(overrides), camera, targetSize);
  filter.initialize(0, r0, [1, 0, 0], [1, 0, 0], sigma);
  return filter;
}

/** The box the filter's own model predicts for relative position r under attitude q. */
function boxFor(r: number[], q: ArrayLike<number> = level) {
  const p = cameraPointFromWorldVector(rotationMatrixFromQuat(q), cameraFromBody(camera.mount), camera.mount.offset, r);
  return boxFromRelativePosition(camera, p, targetSize);
}

describe('LandingFilter: construction and bad input', () => {
  it('has 12 states, 15 with the Singer carrier model (DESIGN reference formulation)', () => {
    expect(new LandingFilter(filterSpec(), camera, targetSize).n).toBe(12);
    expect(new LandingFilter(filterSpec({ carrierModel: 'singer' }), camera, targetSize).n).toBe(15);
  });

  it('refuses a spec whose R would not be positive definite, naming the field', () => {
    expect(() => new LandingFilter(filterSpec({ pixelNoise: 0 }), camera, targetSize)).toThrow(FilterSpecError);
    expect(() => new LandingFilter(filterSpec({ sizeNoise: -1 }), camera, targetSize)).toThrow(/filter\.sizeNoise: .*positive definite/);
    expect(() => new LandingFilter(filterSpec({ odometryNoise: Number.NaN }), camera, targetSize)).toThrow(/filter\.odometryNoise/);
    expect(() => new LandingFilter(filterSpec({ gateProbability: 1 }), camera, targetSize)).toThrow(/filter\.gateProbability/);
    expect(() => new LandingFilter(filterSpec({ carrierModel: 'singer', singerTau: 0 }), camera, targetSize)).toThrow(/filter\.singerTau/);
  });

  it('refuses a bad camera or target size with a typed error', () => {
    expect(() => new LandingFilter(filterSpec(), { ...camera, fx: 0 }, targetSize)).toThrow(CameraError);
    expect(() => new LandingFilter(filterSpec(), camera, 0)).toThrow(/targetSize/);
  });

  it('rejects NaN, zero-area and off-image boxes with a named reason and leaves the state alone', () => {
    const filter = started();
    filter.propagate(0.005, hoverForce, level);
    const before = filter.x.slice();
    expect(filter.updateBox(0.005, { xMin: Number.NaN, yMin: 0, xMax: 10, yMax: 10 })).toEqual({ status: 'rejected', nis: Number.NaN, dim: 3, reason: 'box-not-finite' });
    expect(filter.updateBox(0.005, { xMin: 100, yMin: 100, xMax: 100, yMax: 150 }).reason).toBe('box-empty');
    expect(filter.updateBox(0.005, { xMin: 900, yMin: 100, xMax: 950, yMax: 150 }).reason).toBe('box-outside-image');
    expect(filter.updateOdometry(0.005, [Number.NaN, 0, 0]).reason).toBe('odometry-not-finite');
    expect(filter.propagate(0.01, [Number.NaN, 0, 9.8], level)?.reason).toBe('imu-not-finite');
    expect(filter.propagate(0.01, hoverForce, [0, 0, 0, 0])?.reason).toBe('attitude-not-finite');
    expect(filter.propagate(0.001, hoverForce, level)?.reason).toBe('time-not-increasing');
    expect(filter.updateBox(1, boxFor(r0)).reason).toBe('measurement-after-filter-time');
    expectAllClose(filter.x, before, { abs: 0 }, 'state untouched');
  });

  it('rejects measurements before initialization and boxes older than the history', () => {
    const fresh = new LandingFilter(filterSpec(), camera, targetSize);
    expect(fresh.updateBox(0, boxFor(r0)).reason).toBe('not-initialized');
    expect(fresh.propagate(0.01, hoverForce, level)?.reason).toBe('not-initialized');
    const filter = started({ historyLength: 0.05 });
    for (let k = 1; k <= 100; k++) filter.propagate(k * 0.005, hoverForce, level);
    expect(filter.updateBox(0.1, boxFor(r0)).reason).toBe('older-than-history');
  });

  it('a start at the capture of a late box re-propagates the kept IMU samples, so the boxes captured in its latency window are used, not refused as older than the history', () => {
    // hover at 200 Hz for 1 s; the first box was captured at 0.7 s and arrives at 1.0 s (0.3 s latency)
    const imu = new ImuHistory(400);
    for (let k = 1; k <= 200; k++) imu.push(k * 0.005, hoverForce, level);
    const sigma = { velocity: 0.5, accelBias: 0.1 };
    const atCapture = new LandingFilter(filterSpec({ historyLength: 0.5 }), camera, targetSize);
    expect(atCapture.initializeFromDelayedBox(0.7, boxFor(r0), level, [0, 0, 0], sigma, imu).status).toBe('accepted');
    expect(atCapture.time).toBe(1); // brought to the newest IMU sample
    const atArrival = new LandingFilter(filterSpec({ historyLength: 0.5 }), camera, targetSize);
    atArrival.initializeFromBox(1, boxFor(r0), level, [0, 0, 0], sigma);
    // a box captured at 0.8 s (in flight while the first one was): refused by a start at arrival
    expect(atArrival.updateBox(0.8, boxFor(r0)).reason).toBe('older-than-history');
    expect(atCapture.updateBox(0.8, boxFor(r0)).status).toBe('accepted');
    // 0.3 s of hover re-propagated leave the position where the first box put it (0.05 m: the second box's update moves it a little)
    expectAllClose(atCapture.x.slice(0, 3), atArrival.x.slice(0, 3), { abs: 0.05 }, 'r after a consistent second box');
  });

  it('initializeFromBox refuses a bad box or attitude and stays uninitialized', () => {
    const filter = new LandingFilter(filterSpec(), camera, targetSize);
    expect(filter.initializeFromBox(0, { xMin: 10, yMin: 10, xMax: 5, yMax: 20 }, level, [0, 0, 0], { velocity: 1, accelBias: 0.1 }).reason).toBe('box-empty');
    expect(filter.initializeFromBox(0, boxFor(r0), [Number.NaN, 0, 0, 0], [0, 0, 0], { velocity: 1, accelBias: 0.1 }).reason).toBe('attitude-not-finite');
    expect(filter.propagate(0.01, hoverForce, level)?.reason).toBe('not-initialized');
  });

  it('a box needs a known attitude: right after initialize() (no attitude yet) it is rejected', () => {
    const filter = started();
    expect(filter.updateBox(0, boxFor(r0)).reason).toBe('attitude-unknown');
  });
});

describe('LandingFilter: divergence is a named event, never NaN downstream', () => {
  it('an exploding IMU input turns into "state-not-finite"; x and P keep their last good values', () => {
    const filter = started();
    filter.propagate(0.005, hoverForce, level);
    const goodX = filter.x.slice(), goodP = filter.P.slice();
    const result = filter.propagate(1e10, [1e300, 1e300, 1e300], level);
    expect(result).toEqual({ status: 'diverged', nis: Number.NaN, dim: 0, reason: 'state-not-finite' });
    expect(filter.diverged).toBe('state-not-finite');
    expectAllClose(filter.x, goodX, { abs: 0 }, 'x restored');
    expectAllClose(filter.P, goodP, { abs: 0 }, 'P restored');
    expect(filter.updateOdometry(0.005, [1, 0, 0]).status).toBe('diverged');
    expect(filter.propagate(0.02, hoverForce, level)?.status).toBe('diverged');
    filter.initialize(1, r0, [1, 0, 0], [1, 0, 0], sigma);
    expect(filter.diverged).toBe(null);
  });

  it('an absurd time step overflows P: "covariance-not-finite"', () => {
    const filter = started();
    // dt = 1e110 s: dt³ in Q overflows (1e330) while dt² stays finite and the hover keeps x finite.
    expect(filter.propagate(1e110, hoverForce, level)?.reason).toBe('covariance-not-finite');
    for (const v of filter.P) expect(Number.isFinite(v)).toBe(true);
  });

  it('a covariance driven non-positive-definite is caught as "covariance-not-positive-definite"', () => {
    const filter = started();
    filter.propagate(0.005, hoverForce, level);
    // Corrupt P from outside (as a numerical accident would): an indefinite vL block.
    const n = filter.n;
    filter.P[6 * n + 7] = 5;
    filter.P[7 * n + 6] = 5;
    const result = filter.updateOdometry(0.005, [1, 0, 0]);
    expect(result.status).toBe('diverged');
    expect(result.reason).toBe('covariance-not-positive-definite');
    for (const v of filter.P) expect(Number.isFinite(v)).toBe(true);
  });
});

describe('LandingFilter: periodic positive-definiteness test', () => {
  it('a broken block the measurements do not see is still caught within 8 updates', () => {
    const filter = started();
    filter.propagate(0.005, hoverForce, level);
    const n = filter.n;
    // Indefinite accelerometer-bias block; odometry S involves only the vL block.
    filter.P[9 * n + 10] = 1;
    filter.P[10 * n + 9] = 1;
    const statuses: string[] = [];
    for (let k = 0; k < 8; k++) statuses.push(filter.updateOdometry(0.005, [1, 0, 0]).status);
    expect(statuses).toContain('diverged');
    expect(filter.diverged).toBe('covariance-not-positive-definite');
  });
});

describe('LandingFilter: updates', () => {
  it('initializeFromBox back-projects the first box to r with the loose covariance', () => {
    const q = quatFromEulerDeg(3, -2, 40);
    const r = [1.2, -0.7, -8.5];
    const filter = new LandingFilter(filterSpec(), camera, targetSize);
    const result = filter.initializeFromBox(2, boxFor(r, q), q, [0.5, 0, 0], { velocity: 1, accelBias: 0.1 });
    expect(result.status).toBe('accepted');
    // 1e-9 m: back-projection of a noise-free box of the same model.
    expectAllClose(filter.x.slice(0, 3), r, { abs: 1e-9 }, 'r');
    expectAllClose(filter.x.slice(3, 9), [0.5, 0, 0, 0.5, 0, 0], { abs: 0 }, 'vC = vL prior, vL as given');
    expect(filter.time).toBe(2);
    const n = filter.n;
    // Depth from size is the least certain direction: world z variance dominates at nadir.
    expect(filter.P[2 * n + 2]!).toBeGreaterThan(filter.P[0]!);
  });

  it('a box far from the prediction is gated with its NIS above the chi-square threshold (gateProbability 0.997)', () => {
    const filter = started();
    filter.propagate(0.005, hoverForce, level);
    const result = filter.updateBox(0.005, boxFor([r0[0]! + 2.5, r0[1]!, r0[2]!]));
    expect(result.status).toBe('gated');
    expect(result.reason).toBe('outside-gate');
    expect(result.nis).toBeGreaterThan(14.16); // chi2_3(0.997) = 14.16 [computed by chiSquareQuantile]
  });

  for (const [label, overrides, dim] of [['flat', {}, 3], ['outline, centre-size', { boxModel: 'outline' }, 3], ['outline, centre-width-height', { boxModel: 'outline', boxTerms: 'centre-width-height' }, 4]] as const) {
  it(`a delayed box applied at its capture time equals applying it on time (replay of IMU and odometry; ${label})`, () => {
    const q = quatFromEulerDeg(2, -1, 25);
    const dt = 0.005;
    const late = started(overrides), onTime = started(overrides);
    const force = (k: number) => [0.2 * Math.sin(k / 9), -0.1, 9.81 + 0.05 * Math.cos(k / 5)];
    const capture = 20 * dt + 0.4 * dt; // between two IMU samples
    const box = boxFor([0.35, -0.15, -8.7], q);
    let y: number[] = [], S: number[] = [];
    for (let k = 1; k <= 40; k++) {
      const t = k * dt;
      late.propagate(t, force(k), q);
      if (k === 21) {
        onTime.propagate(capture, force(k), q); // split the IMU step at the capture time
        expect(onTime.updateBox(capture, box).status).toBe('accepted');
        y = Array.from(onTime.lastInnovation.slice(0, dim));
        S = Array.from(onTime.lastInnovationCovariance.slice(0, dim * dim));
      }
      onTime.propagate(t, force(k), q);
      if (k % 4 === 0) {
        late.updateOdometry(t, [1 + 0.01 * k, 0.02, 0]);
        onTime.updateOdometry(t, [1 + 0.01 * k, 0.02, 0]);
      }
    }
    const result = late.updateBox(capture, box);
    expect(result.status).toBe('accepted');
    // 1e-12: identical operations in identical order; only the bookkeeping differs.
    expectAllClose(late.x, onTime.x, { abs: 1e-12 }, 'x');
    expectAllClose(late.P, onTime.P, { abs: 1e-12 }, 'P');
    expect(late.time).toBe(onTime.time);
    // the kept innovation is the one at the capture time, not overwritten by the replayed odometry
    expect(late.lastUpdateDim).toBe(dim);
    expectAllClose(late.lastInnovation.slice(0, dim), y, { abs: 1e-12 }, 'y'); // same operations as x, P above
    expectAllClose(late.lastInnovationCovariance.slice(0, dim * dim), S, { abs: 1e-12 }, 'S');
  });
  }

  it('size and centre noise in proportion to the box: R = diag(σp² + (φc s)², σp² + (φc s)², σs² + (φ s)²) · rScale', () => {
    // A nearly certain position (σ = 0.1 mm) makes S = R to ~1e-6; the box is the model's own,
    // grown by 10 % about its centre, so only the size channel has an innovation.
    const spec = filterSpec({ sizeNoise: 1.5, sizeNoiseFraction: 0.06, pixelNoise: 2, pixelNoiseFraction: 0.02, rScale: 2 });
    const filter = new LandingFilter(spec, camera, targetSize);
    filter.initialize(0, r0, [1, 0, 0], [1, 0, 0], { position: 1e-4, velocity: 0.3, accelBias: 0.05 });
    filter.propagate(0.005, hoverForce, level); // vC = vL: r stays r0
    const box = boxFor(r0);
    const s = Math.sqrt((box.xMax - box.xMin) * (box.yMax - box.yMin));
    const cu = (box.xMin + box.xMax) / 2, cv = (box.yMin + box.yMax) / 2, k = 1.1;
    const grown = { xMin: cu - (k * (box.xMax - box.xMin)) / 2, xMax: cu + (k * (box.xMax - box.xMin)) / 2, yMin: cv - (k * (box.yMax - box.yMin)) / 2, yMax: cv + (k * (box.yMax - box.yMin)) / 2 };
    const result = filter.updateBox(0.005, grown);
    const expected = ((k - 1) * s) ** 2 / ((1.5 ** 2 + (0.06 * s) ** 2) * 2);
    expect(s).toBeGreaterThan(30); // the fractional term dominates (0.06 s > 1.5 px)
    // 1e-4 relative: H P Hᵀ with σ = 0.1 mm adds ~1e-6 of R.
    expectClose(result.nis, expected, { rel: 1e-4 }, 'NIS of a 10 % larger box');
    // Loose: the fix moves along the ray by Δp = p (1 - k) = (k s)(k - 1) ∂p/∂s at the measured size
    // k s, and R_fix = J R_box Jᵀ, so NIS = (k s (k - 1))² / ((σs² + (φ k s)²) rScale).
    const loose = new LandingFilter({ ...spec, cameraUpdate: 'loose' }, camera, targetSize);
    loose.initialize(0, r0, [1, 0, 0], [1, 0, 0], { position: 1e-4, velocity: 0.3, accelBias: 0.05 });
    loose.propagate(0.005, hoverForce, level);
    const expectedLoose = (k * s * (k - 1)) ** 2 / ((1.5 ** 2 + (0.06 * k * s) ** 2) * 2);
    expectClose(loose.updateBox(0.005, grown).nis, expectedLoose, { rel: 1e-4 }, 'loose NIS of a 10 % larger box'); // as above
  });

  it('a delayed box is seen through the attitude at its capture, not the attitude of the next IMU step', () => {
    // The lander tilts by degrees per step; the box captured at step 20 was projected through
    // attitude(20). Applying it with attitude(21) shifted the innovation by many pixels.
    const dt = 0.005;
    const attitude = (k: number) => quatFromEulerDeg(2 + 3 * Math.sin(k / 2), -1 + 4 * Math.cos(k / 3), 25);
    const late = started(), onTime = started();
    const box = boxFor([0.35, -0.15, -8.7], attitude(20));
    for (let k = 1; k <= 40; k++) {
      const t = k * dt;
      late.propagate(t, hoverForce, attitude(k));
      onTime.propagate(t, hoverForce, attitude(k));
      if (k === 20) expect(onTime.updateBox(t, box).status).toBe('accepted');
    }
    const result = late.updateBox(20 * dt, box);
    expect(result.status).toBe('accepted');
    // 1e-12: same operations; the attitude differs at most in its last bit (re-normalized).
    expectAllClose(late.x, onTime.x, { abs: 1e-12 }, 'x');
    expectAllClose(late.P, onTime.P, { abs: 1e-12 }, 'P');
  });

  it('keeps P exactly symmetric over 20 000 predict/update pairs (upper triangle computed and mirrored)', () => {
    const filter = started();
    const q = quatFromEulerDeg(1, 2, 70);
    for (let k = 1; k <= 20_000; k++) {
      const t = k * 0.005;
      filter.propagate(t, hoverForce, q);
      if (k % 2 === 0) filter.updateBox(t, boxFor([0.3 * Math.sin(k / 50), 0.2, -9 + 0.3 * Math.cos(k / 70)], q));
    }
    const n = filter.n;
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) expect(filter.P[i * n + j]).toBe(filter.P[j * n + i]);
    expect(filter.diverged).toBe(null);
  });
});

describe('LandingFilter tracks a constant-velocity carrier from noisy, late boxes (seeded Monte Carlo)', () => {
  const runs = 25;
  const [lo, hi] = averagedChiSquareInterval(runs, 12, 0.95);

  it('NEES of the 12-state error averaged over 25 runs is inside the 95 % chi-square interval at about 95 % of checks (Bar-Shalom, Li, Kirubarajan 2001, section 5.4)', () => {
    const result = simulateTracking({ runs, duration: 8, latencySteps: 3 });
    const means = result.nees.map((c) => c.reduce((a, b) => a + b, 0) / c.length);
    const inside = means.filter((m) => m >= lo && m <= hi).length / means.length;
    // 80 correlated checks, each a 95 % test: at least 85 % inside is the pass mark.
    expect(inside).toBeGreaterThanOrEqual(0.85);
    // Almost every box accepted (gate 0.997), none rejected, and the estimate is close.
    expect(result.gated / result.accepted).toBeLessThan(0.01);
    expect(result.rejected).toBe(0);
    expect(result.finalPositionRms).toBeLessThan(0.15);
  });

  it('the same check fails when the filter assumes 2 px but the detector delivers 8 px', () => {
    const result = simulateTracking({ runs, duration: 8, latencySteps: 3, truePixelNoise: 8 });
    const means = result.nees.map((c) => c.reduce((a, b) => a + b, 0) / c.length);
    expect(means.filter((m) => m >= lo && m <= hi).length / means.length).toBeLessThan(0.1);
  });
});

describe('LandingFilter: NIS', () => {
  it('reports NIS = yᵀ S⁻¹ y for an accepted box (0 for the predicted box itself)', () => {
    const q = quatFromEulerDeg(0, 0, 10);
    const filter = started();
    filter.propagate(0.005, hoverForce, q);
    const predicted = boxFor(Array.from(filter.x.slice(0, 3)), q);
    const result = filter.updateBox(0.005, predicted);
    expect(result.status).toBe('accepted');
    // 1e-12: the innovation is round-off only.
    expectClose(result.nis, 0, { abs: 1e-12 }, 'NIS');
  });

  it('keeps y and S of the last accepted or gated update (NIS = yᵀ S⁻¹ y from them), NaN after a refused one', () => {
    const filter = started();
    filter.propagate(0.005, hoverForce, level);
    const result = filter.updateBox(0.005, boxFor([r0[0]! + 2.5, r0[1]!, r0[2]!]));
    expect(result.status).toBe('gated');
    expect(filter.lastUpdateDim).toBe(3);
    const y = filter.lastInnovation.slice(0, 3), S = filter.lastInnovationCovariance.slice(0, 9);
    // px: 2.5 m further east at 9 m below is about fy · 2.5 / 9 = 144 px up the image (nominal mount: y_cam = -x_body)
    expectClose(y[1]!, -518 * 2.5 / 9, { rel: 0.05 }, 'v innovation'); // 5 %: the prior's r and the mount offset shift it a little
    expect(Math.abs(y[0]!)).toBeLessThan(1);
    expect(S[1]).toBe(S[3]);
    // NIS from y and S by Cramer's rule (independent of the filter's cofactor code)
    const det = (m: number[]) => m[0]! * (m[4]! * m[8]! - m[5]! * m[7]!) - m[1]! * (m[3]! * m[8]! - m[5]! * m[6]!) + m[2]! * (m[3]! * m[7]! - m[4]! * m[6]!);
    const d = det(Array.from(S));
    const solved = [0, 1, 2].map((c) => det(Array.from(S, (v, k) => (k % 3 === c ? y[Math.floor(k / 3)]! : v))) / d);
    // 1e-9 relative: two ways of solving one well-conditioned 3x3 system
    expectClose(y[0]! * solved[0]! + y[1]! * solved[1]! + y[2]! * solved[2]!, result.nis, { rel: 1e-9 }, 'NIS from y, S');
    filter.updateOdometry(0.005, [1.1, 0, 0]);
    expectClose(filter.lastInnovation[0]!, 0.1, { abs: 1e-12 }, 'odometry y = vL - x_vL'); // round-off only
    expect(filter.updateBox(0.005, { xMin: 10, yMin: 10, xMax: 5, yMax: 20 }).status).toBe('rejected');
    expect(filter.lastUpdateDim).toBe(0);
    expect(Array.from(filter.lastInnovation).every(Number.isNaN)).toBe(true);
  });
});
