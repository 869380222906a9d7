import { describe, expect, it } from 'vitest';
import { BoxMeasurementModel } from '../../estimator/models/BoxMeasurementModel.js';
import { quatFromEulerDeg } from '../../estimator/frames/quatFromEulerDeg.js';
import { expectAllClose, expectClose } from '../helpers/expectClose.js';
import { camera, targetSize } from './landingFixture.js';

const tilted = { ...camera, mount: { offset: [0.08, -0.03, -0.05] as [number, number, number], rollDeg: 2, pitchDeg: -4, yawDeg: 7 } };
const q = quatFromEulerDeg(6, -4, 75);
const r = [1.1, -0.6, -7.5];

describe('BoxMeasurementModel', () => {
  it('tight: H_r matches central finite differences of h(r) through attitude, mount and distortion', () => {
    const model = new BoxMeasurementModel(tilted, targetSize);
    model.setAttitude(q);
    const h = new Float64Array(3), Hb = new Float64Array(9), hp = new Float64Array(3), hm = new Float64Array(3), scratch = new Float64Array(9);
    expect(model.tight(r, h, Hb)).toBe(null);
    const H = Hb.slice();
    const step = 1e-5;
    for (let k = 0; k < 3; k++) {
      const plus = [...r], minus = [...r];
      plus[k]! += step;
      minus[k]! -= step;
      model.tight(plus, hp, scratch);
      model.tight(minus, hm, scratch);
      // 1e-5 px/m: O(step²) truncation on second derivatives ~10 px/m², round-off 1e-13 / 1e-5.
      for (let i = 0; i < 3; i++) expectClose(H[3 * i + k]!, (hp[i]! - hm[i]!) / (2 * step), { rel: 1e-7, abs: 1e-5 }, `H[${i}][${k}]`);
    }
  });

  it('loose: the fix from the predicted box is r itself, with covariance T diag(var) Tᵀ, T = ∂r/∂(u, v, s) by finite differences', () => {
    const model = new BoxMeasurementModel(tilted, targetSize);
    model.setAttitude(q);
    const h = new Float64Array(3), Hb = new Float64Array(9);
    model.tight(r, h, Hb);
    const fix = new Float64Array(3), Rr = new Float64Array(9);
    const variances = [4, 4, 2.25];
    expect(model.loose(h[0]!, h[1]!, h[2]!, variances[0]!, variances[1]!, variances[2]!, fix, Rr)).toBe(null);
    // 1e-9 m: undistortion converges to 1e-14 in normalized units at 8 m.
    expectAllClose(fix, r, { abs: 1e-9 }, 'fix');
    const T = new Float64Array(9);
    const step = 1e-4, plus = new Float64Array(3), minus = new Float64Array(3), scratch = new Float64Array(9);
    for (let k = 0; k < 3; k++) {
      const zp = [h[0]!, h[1]!, h[2]!], zm = [h[0]!, h[1]!, h[2]!];
      zp[k]! += step;
      zm[k]! -= step;
      model.loose(zp[0]!, zp[1]!, zp[2]!, 1, 1, 1, plus, scratch);
      model.loose(zm[0]!, zm[1]!, zm[2]!, 1, 1, 1, minus, scratch);
      for (let i = 0; i < 3; i++) T[3 * i + k] = (plus[i]! - minus[i]!) / (2 * step);
    }
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) {
      let expected = 0;
      for (let k = 0; k < 3; k++) expected += T[3 * i + k]! * variances[k]! * T[3 * j + k]!;
      // 1e-8 m²: finite-difference truncation O(step²) on T entries ~0.02 m/px.
      expectClose(Rr[3 * i + j]!, expected, { rel: 1e-6, abs: 1e-8 }, `R_r[${i}][${j}]`);
    }
  });

  it('names a target behind the camera', () => {
    const model = new BoxMeasurementModel(camera, targetSize);
    model.setAttitude([1, 0, 0, 0]);
    expect(model.tight([0, 0, 5], new Float64Array(3), new Float64Array(9))).toBe('target-behind-camera');
  });
});
