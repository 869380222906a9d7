// A seeded, closed-loop-free truth simulation for the landing-filter tests (not a test file):
// a constant-velocity carrier with white acceleration noise (exactly the filter's process
// model), a lander trailing it (on truth, not on the estimate) under a fixed tilted attitude, an IMU
// with white noise and a constant bias, detector boxes from the projected true relative
// position (the filter's own box model, so the test isolates the estimator), delivered late,
// and odometry. Returns the per-check NEES of every run.
import { LandingFilter } from '../../estimator/models/LandingFilter.js';
import { boxFromCentreSize } from '../../estimator/camera/Box.js';
import { boxMeasurement } from '../../estimator/camera/boxGeometry.js';
import { cameraFromBody, cameraPointFromWorldVector } from '../../estimator/frames/cameraFromBody.js';
import { quatFromEulerDeg } from '../../estimator/frames/quatFromEulerDeg.js';
import { rotationMatrixFromQuat } from '../../estimator/frames/rotationMatrixFromQuat.js';
import { cholesky } from '../../estimator/filter/cholesky.js';
import { RandomStream, streamId } from '../../estimator/random/RandomStream.js';
import { STANDARD_GRAVITY } from '../../estimator/models/landingState.js';
import type { FilterSpec } from '../../estimator/sim/Scenario.js';
import { camera, filterSpec, targetSize } from './landingFixture.js';

export interface TrackingOptions {
  runs: number;
  duration: number;
  /** Detector latency in IMU steps. */
  latencySteps: number;
  /** Filter spec changes (e.g. a mistuned pixel noise). */
  spec?: Partial<FilterSpec>;
  /** True pixel noise (px); the filter assumes spec.pixelNoise. */
  truePixelNoise?: number;
}

export interface TrackingResult {
  /** nees[check][run]: NEES of the 12-state error at each check time (every 0.1 s). */
  nees: number[][];
  accepted: number;
  gated: number;
  rejected: number;
  /** RMS position error over the last second of all runs (m). */
  finalPositionRms: number;
}

export function simulateTracking(options: TrackingOptions): TrackingResult {
  const spec = filterSpec({ rate: 100, carrierAccelNoise: 0.2, accelNoise: 0.04, accelBiasWalk: 0.001, pixelNoise: 2, sizeNoise: 1.5, odometryNoise: 0.05, historyLength: 0.2, ...options.spec });
  const dt = 1 / spec.rate;
  const steps = Math.round(options.duration / dt);
  const truePixel = options.truePixelNoise ?? spec.pixelNoise;
  const q = Float64Array.from(quatFromEulerDeg(2, -1.5, 30));
  const Rwb = rotationMatrixFromQuat(q);
  const Rcb = cameraFromBody(camera.mount);
  const sigma = { position: 0.5, velocity: 0.3, accelBias: 0.05 };
  const qc = spec.carrierAccelNoise ** 2;
  const LQ = new Float64Array(4);
  cholesky([(qc * dt ** 3) / 3, (qc * dt ** 2) / 2, (qc * dt ** 2) / 2, qc * dt], 2, LQ);
  const checksPerRun = Math.floor(steps / 10);
  const nees: number[][] = Array.from({ length: checksPerRun }, () => []);
  const result: TrackingResult = { nees, accepted: 0, gated: 0, rejected: 0, finalPositionRms: 0 };
  let finalSq = 0, finalCount = 0;
  const pCam = new Float64Array(3), meas = new Float64Array(3), L = new Float64Array(144), e = new Float64Array(12), z = new Float64Array(12);

  for (let run = 0; run < options.runs; run++) {
    const stream = RandomStream.fromKey([4242, run, streamId('tracking')]);
    const filter = new LandingFilter(spec, camera, targetSize);
    const r0 = [0.4, -0.3, -10], v0 = [2, 0.5, 0];
    filter.initialize(0, r0, v0, v0, sigma);
    // Truth = estimate + a draw from the filter's prior (a consistent start).
    const pC = [0, 0, 0].map((_, i) => r0[i]! + sigma.position * stream.gaussian());
    const pL = [0, 0, 0];
    const vC = v0.map((v) => v + sigma.velocity * stream.gaussian());
    const vL = v0.map((v) => v + sigma.velocity * stream.gaussian());
    const bias = [0, 0, 0].map(() => sigma.accelBias * stream.gaussian());
    const pending: { due: number; t: number; u: number; v: number; s: number }[] = [];
    for (let k = 1; k <= steps; k++) {
      const t = k * dt, tm = t - dt / 2;
      // Lander: piecewise-constant acceleration over the step (what the IMU sample represents):
      // follows the TRUE carrier 10 m above it (truth feedback only, so the target stays in view)
      // plus a weave, so the IMU path is exercised.
      const a = [
        0.8 * (pC[0]! - pL[0]!) + 1.5 * (vC[0]! - vL[0]!) + 0.3 * Math.sin(0.7 * tm),
        0.8 * (pC[1]! - pL[1]!) + 1.5 * (vC[1]! - vL[1]!) + 0.2 * Math.cos(0.5 * tm),
        0.8 * (pC[2]! - pL[2]! + 10) + 1.5 * (vC[2]! - vL[2]!) + 0.1 * Math.sin(0.9 * tm),
      ];
      for (let i = 0; i < 3; i++) {
        pL[i] = pL[i]! + vL[i]! * dt + 0.5 * a[i]! * dt * dt;
        vL[i] = vL[i]! + a[i]! * dt;
        const w0 = stream.gaussian(), w1 = stream.gaussian();
        pC[i] = pC[i]! + vC[i]! * dt + LQ[0]! * w0;
        vC[i] = vC[i]! + LQ[2]! * w0 + LQ[3]! * w1;
      }
      // IMU: f = R_wbᵀ (a - g) + bias + white noise of density accelNoise.
      const world = [a[0]!, a[1]!, a[2]! + STANDARD_GRAVITY];
      const f = [0, 1, 2].map((i) => Rwb[i]! * world[0]! + Rwb[3 + i]! * world[1]! + Rwb[6 + i]! * world[2]! + bias[i]! + (spec.accelNoise / Math.sqrt(dt)) * stream.gaussian());
      filter.propagate(t, f, q);
      if (k % 5 === 0) {
        const r = [pC[0]! - pL[0]!, pC[1]! - pL[1]!, pC[2]! - pL[2]!];
        cameraPointFromWorldVector(Rwb, Rcb, camera.mount.offset, r, pCam);
        boxMeasurement(camera, targetSize, pCam, meas);
        const u = meas[0]! + truePixel * stream.gaussian(), v = meas[1]! + truePixel * stream.gaussian();
        const s = meas[2]! + spec.sizeNoise * stream.gaussian();
        if (u > 0 && u < camera.width && v > 0 && v < camera.height) pending.push({ due: k + options.latencySteps, t, u, v, s });
        const odo = vL.map((x) => x + spec.odometryNoise * stream.gaussian());
        filter.updateOdometry(t, odo);
      }
      while (pending.length > 0 && pending[0]!.due <= k) {
        const box = pending.shift()!;
        const res = filter.updateBox(box.t, boxFromCentreSize(box.u, box.v, box.s));
        if (res.status === 'accepted') result.accepted++;
        else if (res.status === 'gated') result.gated++;
        else result.rejected++;
      }
      if (k % 10 === 0) {
        const truth = [pC[0]! - pL[0]!, pC[1]! - pL[1]!, pC[2]! - pL[2]!, ...vC, ...vL, ...bias];
        for (let i = 0; i < 12; i++) e[i] = truth[i]! - filter.x[i]!;
        // NEES = eᵀ P⁻¹ e = |L⁻¹ e|² with P = L Lᵀ.
        if (!cholesky(filter.P, 12, L)) throw new Error(`P not positive definite at t = ${t}`);
        let value = 0;
        for (let i = 0; i < 12; i++) {
          let sum = e[i]!;
          for (let j = 0; j < i; j++) sum -= L[i * 12 + j]! * z[j]!;
          z[i] = sum / L[i * 12 + i]!;
          value += z[i]! * z[i]!;
        }
        nees[k / 10 - 1]!.push(value);
        if (t > options.duration - 1) {
          finalSq += e[0]! ** 2 + e[1]! ** 2 + e[2]! ** 2;
          finalCount++;
        }
      }
    }
  }
  result.finalPositionRms = Math.sqrt(finalSq / finalCount);
  return result;
}
