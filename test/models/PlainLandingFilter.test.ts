import { describe, expect, it } from 'vitest';
import { LandingFilter } from '../../estimator/models/LandingFilter.js';
import { PlainLandingFilter } from '../../estimator/models/PlainLandingFilter.js';
import { boxFromRelativePosition } from '../../estimator/camera/boxGeometry.js';
import { cameraFromBody, cameraPointFromWorldVector } from '../../estimator/frames/cameraFromBody.js';
import { quatFromEulerDeg } from '../../estimator/frames/quatFromEulerDeg.js';
import { rotationMatrixFromQuat } from '../../estimator/frames/rotationMatrixFromQuat.js';
import type { CameraUpdateMode, CarrierModel, FilterSpec } from '../../estimator/sim/Scenario.js';
import { expectClose } from '../helpers/expectClose.js';
import { camera, filterSpec, targetSize } from './landingFixture.js';

/** The fast filter's kept y and S equal the plain filter's (1e-9 relative: same numbers, different operation order). */
function expectSameInnovation(fast: LandingFilter, plain: PlainLandingFilter, label: string): void {
  const y = plain.lastInnovation!, S = plain.lastInnovationCovariance!, m = y.rows;
  expect(fast.lastUpdateDim).toBe(m);
  for (let i = 0; i < m; i++) {
    expectClose(fast.lastInnovation[i]!, y.get(i, 0), { rel: 1e-9, abs: 1e-12 }, `${label}: y[${i}]`);
    for (let j = 0; j < m; j++) expectClose(fast.lastInnovationCovariance[m * i + j]!, S.get(i, j), { rel: 1e-9, abs: 1e-12 }, `${label}: S[${i}][${j}]`);
  }
}

// Two implementations of one filter: block-structured typed arrays vs dense ml-matrix objects.
describe('PlainLandingFilter and LandingFilter give the same state to 1e-9', () => {
  const cases: [CarrierModel, CameraUpdateMode, Partial<FilterSpec>][] = [
    ['constant-velocity', 'tight', {}], ['constant-velocity', 'loose', {}], ['singer', 'tight', {}], ['singer', 'loose', {}],
    ['constant-velocity', 'tight', { boxModel: 'outline', headingMinSpeed: 0 }], ['singer', 'tight', { boxModel: 'outline', boxTerms: 'centre-width-height', headingMinSpeed: 0 }],
  ];
  const deck = { deckLength: 2.2, deckWidth: 1.5, bodyHeight: 0.8 };
  for (const [carrierModel, cameraUpdate, box] of cases) {
    it(`${carrierModel}, ${cameraUpdate} camera update${box.boxModel ? `, ${box.boxModel} ${box.boxTerms ?? 'centre-size'}` : ''}, 2000 IMU steps with boxes and odometry`, () => {
      // the Singer cases also carry box noise in proportion to the box size (sizeNoiseFraction, pixelNoiseFraction)
      // and a carrier vertical noise of its own
      const spec = filterSpec({ carrierModel, cameraUpdate, ...box, ...(carrierModel === 'singer' ? { sizeNoiseFraction: 0.05, pixelNoiseFraction: 0.02, carrierVerticalAccelNoise: 0.9 } : {}) });
      const fast = new LandingFilter(spec, camera, targetSize, deck);
      const plain = new PlainLandingFilter(spec, camera, targetSize, deck);
      const sigma = { position: 1, velocity: 0.5, accelBias: 0.1 };
      fast.initialize(0, [1, 0.5, -8], [2, 0, 0], [1.5, 0, 0], sigma);
      plain.initialize(0, [1, 0.5, -8], [2, 0, 0], [1.5, 0, 0], sigma);
      const Rcb = cameraFromBody(camera.mount);
      let accepted = 0;
      for (let k = 1; k <= 2000; k++) {
        const t = k / 200;
        const q = quatFromEulerDeg(3 * Math.sin(t), -2, 40 + 5 * t);
        const f = [0.3 * Math.sin(t), 0.1, 9.81];
        fast.propagate(t, f, q);
        plain.propagate(t, f, q);
        if (k % 7 === 0) {
          const p = cameraPointFromWorldVector(rotationMatrixFromQuat(q), Rcb, camera.mount.offset, [0.3 + 0.2 * Math.sin(t), -0.2, -8 - Math.cos(t)]);
          const box = boxFromRelativePosition(camera, p, targetSize);
          const a = fast.updateBox(t, box), b = plain.updateBox(t, box);
          expect(a.status).toBe(b.status);
          if (a.status === 'accepted') {
            accepted++;
            // 1e-9 relative on NIS: same numbers, different operation order.
            expectClose(a.nis, b.nis, { rel: 1e-9, abs: 1e-12 }, `NIS at ${t}`);
            expectSameInnovation(fast, plain, `box at ${t}`);
          }
        }
        if (k % 11 === 0) {
          const a = fast.updateOdometry(t, [1.5, 0.1, 0]);
          plain.updateOdometry(t, [1.5, 0.1, 0]);
          if (a.status === 'accepted') expectSameInnovation(fast, plain, `odometry at ${t}`);
        }
      }
      expect(accepted).toBeGreaterThan(250);
      const n = fast.n;
      // 1e-9 as the issue demands (observed agreement is ~1e-14).
      for (let i = 0; i < n; i++) expectClose(fast.x[i]!, plain.x.get(i, 0), { abs: 1e-9 }, `x[${i}]`);
      for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
        expectClose(fast.P[i * n + j]!, plain.P.get(i, j), { abs: 1e-9 }, `P[${i}][${j}]`);
        expect(fast.P[i * n + j]).toBe(fast.P[j * n + i]);
      }
    });
  }
});
