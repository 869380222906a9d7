import { describe, it } from 'vitest';
import { eulerDegFromQuat, quatFromEulerDeg } from '../../estimator/frames/quatFromEulerDeg.js';
import { quatFromAxisAngle, quatMultiply, quatRotate } from '../../estimator/frames/quaternion.js';
import { expectAllClose } from '../helpers/expectClose.js';

const DEG = Math.PI / 180;

describe('quatFromEulerDeg', () => {
  it('equals qz(yaw) ⊗ qy(pitch) ⊗ qx(roll) (ZYX convention, common practice)', () => {
    const [roll, pitch, yaw] = [12, -33, 140];
    const expected = quatMultiply(quatMultiply(quatFromAxisAngle([0, 0, 1], yaw * DEG), quatFromAxisAngle([0, 1, 0], pitch * DEG)), quatFromAxisAngle([1, 0, 0], roll * DEG));
    // 1e-15: products of unit-magnitude terms.
    expectAllClose(quatFromEulerDeg(roll, pitch, yaw), expected, { abs: 1e-15 }, 'q');
  });

  it('positive pitch puts the nose down in FLU / ENU (REP 103 axes)', () => {
    const nose = quatRotate(quatFromEulerDeg(0, 30, 0), [1, 0, 0]);
    expectAllClose(nose, [Math.cos(30 * DEG), 0, -Math.sin(30 * DEG)], { abs: 1e-15 }, 'nose');
  });

  it('eulerDegFromQuat inverts it', () => {
    // 1e-12 deg: asin/atan2 round-off scaled by 180/pi.
    expectAllClose(eulerDegFromQuat(quatFromEulerDeg(-20, 45, -170)), [-20, 45, -170], { abs: 1e-12 }, 'angles');
  });
});
