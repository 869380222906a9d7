import { describe, expect, it } from 'vitest';
import { distortNormalized, distortionJacobian, undistortNormalized, UndistortionError } from '../../estimator/camera/distortion.js';
import { expectAllClose, expectClose } from '../helpers/expectClose.js';

const d = { k1: -0.28, k2: 0.09, k3: -0.012, p1: 0.0011, p2: -0.0007 };

describe('distortion (Brown 1966, radial k1 k2 k3 and tangential p1 p2 form)', () => {
  it('reduces to radial scaling 1 + k1 r² on the x axis', () => {
    const radialOnly = { k1: 0.1, k2: 0, k3: 0, p1: 0, p2: 0 };
    // Exact: 0.5 (1 + 0.1 · 0.25) = 0.5125.
    expectAllClose(distortNormalized(0.5, 0, radialOnly, [0, 0]), [0.5125, 0], { abs: 1e-15 }, 'distorted');
  });

  it('distortionJacobian matches central finite differences', () => {
    const J = distortionJacobian(0.31, -0.22, d, [0, 0, 0, 0]);
    const h = 1e-6;
    const a = [0, 0], b = [0, 0];
    distortNormalized(0.31 + h, -0.22, d, a);
    distortNormalized(0.31 - h, -0.22, d, b);
    // 1e-8: O(h²) truncation on O(1) derivatives.
    expectClose(J[0]!, (a[0]! - b[0]!) / (2 * h), { abs: 1e-8 }, 'dxd/dx');
    expectClose(J[2]!, (a[1]! - b[1]!) / (2 * h), { abs: 1e-8 }, 'dyd/dx');
    distortNormalized(0.31, -0.22 + h, d, a);
    distortNormalized(0.31, -0.22 - h, d, b);
    expectClose(J[1]!, (a[0]! - b[0]!) / (2 * h), { abs: 1e-8 }, 'dxd/dy');
    expectClose(J[3]!, (a[1]! - b[1]!) / (2 * h), { abs: 1e-8 }, 'dyd/dy');
  });

  it('undistortNormalized inverts distortNormalized across the field', () => {
    for (const [x, y] of [[0, 0], [0.4, 0.3], [-0.5, 0.35], [0.02, -0.6]]) {
      const dist = distortNormalized(x!, y!, d, [0, 0]);
      // 1e-13: Newton stops at 1e-14 residual; the Jacobian is near 1.
      expectAllClose(undistortNormalized(dist[0]!, dist[1]!, d, [0, 0]), [x!, y!], { abs: 1e-13 }, `(${x}, ${y})`);
    }
  });

  it('throws UndistortionError where the lens model has no inverse instead of returning junk', () => {
    // xd = x (1 - 0.5 x²) never exceeds 0.544 on the x axis, so xd = 0.8 has no preimage.
    expect(() => undistortNormalized(0.8, 0, { k1: -0.5, k2: 0, k3: 0, p1: 0, p2: 0 }, [0, 0])).toThrow(UndistortionError);
  });
});
