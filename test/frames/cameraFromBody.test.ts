import { describe, it } from 'vitest';
import { cameraFromBody, cameraPointFromWorldVector, worldVectorFromCameraPoint } from '../../estimator/frames/cameraFromBody.js';
import { quatFromEulerDeg } from '../../estimator/frames/quatFromEulerDeg.js';
import { mat3Multiply, mat3MultiplyVector, mat3Transpose, rotationMatrixFromQuat } from '../../estimator/frames/rotationMatrixFromQuat.js';
import { expectAllClose, expectClose } from '../helpers/expectClose.js';

const nominal = { rollDeg: 0, pitchDeg: 0, yawDeg: 0 };

describe('cameraFromBody', () => {
  it('nominal nadir mount: x_cam = -y_body, y_cam = -x_body, z_cam = -z_body (project convention, REP 103 frames)', () => {
    const R = cameraFromBody(nominal);
    expectAllClose(mat3MultiplyVector(R, [1, 0, 0]), [0, -1, 0], { abs: 0 }, 'forward is image up');
    expectAllClose(mat3MultiplyVector(R, [0, 1, 0]), [-1, 0, 0], { abs: 0 }, 'left is image left');
    expectAllClose(mat3MultiplyVector(R, [0, 0, 1]), [0, 0, -1], { abs: 0 }, 'up is behind the camera');
  });

  it('is a proper rotation for any mount (R Rᵀ = I, det = +1)', () => {
    const R = cameraFromBody({ rollDeg: 5, pitchDeg: -40, yawDeg: 17 });
    expectAllClose(mat3Multiply(R, mat3Transpose(R)), [1, 0, 0, 0, 1, 0, 0, 0, 1], { abs: 1e-15 }, 'orthonormal');
    const det = R[0]! * (R[4]! * R[8]! - R[5]! * R[7]!) - R[1]! * (R[3]! * R[8]! - R[5]! * R[6]!) + R[2]! * (R[3]! * R[7]! - R[4]! * R[6]!);
    expectClose(det, 1, { abs: 1e-15 }, 'det');
  });

  it('a point straight below a level lander lands on the optical axis, at depth = height', () => {
    const Rwb = rotationMatrixFromQuat(quatFromEulerDeg(0, 0, 63));
    const p = cameraPointFromWorldVector(Rwb, cameraFromBody(nominal), [0, 0, 0], [0, 0, -7]);
    expectAllClose(p, [0, 0, 7], { abs: 1e-15 }, 'p_cam');
  });

  it('worldVectorFromCameraPoint inverts cameraPointFromWorldVector with an offset camera', () => {
    const Rwb = rotationMatrixFromQuat(quatFromEulerDeg(4, -7, 120));
    const Rcb = cameraFromBody({ rollDeg: 1, pitchDeg: 2, yawDeg: -3 });
    const offset = [0.1, -0.05, -0.08];
    const r = [3.2, -1.7, -9.5];
    const p = cameraPointFromWorldVector(Rwb, Rcb, offset, r);
    // 1e-14 m: round trip of 10 m vectors through two rotations.
    expectAllClose(worldVectorFromCameraPoint(Rwb, Rcb, offset, p), r, { abs: 1e-14 }, 'r');
  });
});
