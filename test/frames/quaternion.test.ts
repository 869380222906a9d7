import { describe, expect, it } from 'vitest';
import { quatConjugate, quatFromAxisAngle, quatMultiply, quatNormalize, quatRotate } from '../../estimator/frames/quaternion.js';
import { rotationMatrixFromQuat, mat3MultiplyVector, quatFromRotationMatrix } from '../../estimator/frames/rotationMatrixFromQuat.js';
import { expectAllClose } from '../helpers/expectClose.js';

// Tolerances: 1e-15..1e-14 absolute = a few ulps of unit-magnitude arithmetic.
describe('quaternion', () => {
  it('quatMultiply follows Hamilton i j = k (common practice: Hamilton convention, scalar first)', () => {
    const i = [0, 1, 0, 0], j = [0, 0, 1, 0];
    expectAllClose(quatMultiply(i, j), [0, 0, 0, 1], { abs: 0 }, 'i j');
    expectAllClose(quatMultiply(j, i), [0, 0, 0, -1], { abs: 0 }, 'j i');
  });

  it('quatRotate turns body x into world y for a +90 deg yaw (right-hand rule about z)', () => {
    const q = quatFromAxisAngle([0, 0, 1], Math.PI / 2);
    expectAllClose(quatRotate(q, [1, 0, 0]), [0, 1, 0], { abs: 1e-15 }, 'rotated');
  });

  it('quatRotate agrees with q ⊗ [0, v] ⊗ conj(q) and with the rotation matrix', () => {
    const q = quatNormalize([0.9, -0.2, 0.3, 0.25]);
    const v = [0.4, -1.3, 2.2];
    const sandwich = quatMultiply(quatMultiply(q, [0, ...v]), quatConjugate(q));
    const rotated = quatRotate(q, v);
    expectAllClose(rotated, Array.from(sandwich).slice(1), { abs: 1e-14 }, 'sandwich');
    expectAllClose(mat3MultiplyVector(rotationMatrixFromQuat(q), v), rotated, { abs: 1e-14 }, 'matrix');
  });

  it('quatFromRotationMatrix inverts rotationMatrixFromQuat (including the w < 0 sign fix)', () => {
    for (const q0 of [[0.9, -0.2, 0.3, 0.25], [0.05, 0.9, 0.1, -0.4], [0.1, 0.1, -0.95, 0.2], [0.02, 0.1, 0.2, 0.97]]) {
      const q = quatNormalize(q0);
      expectAllClose(quatFromRotationMatrix(rotationMatrixFromQuat(q)), q, { abs: 1e-14 }, `q ${q0}`);
    }
  });

  it('quatNormalize refuses a zero quaternion with a message', () => {
    expect(() => quatNormalize([0, 0, 0, 0])).toThrow(/cannot be normalized/);
  });
});
