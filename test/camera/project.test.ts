import { describe, expect, it } from 'vitest';
import { NO_DISTORTION, type PinholeCamera } from '../../estimator/camera/PinholeCamera.js';
import { backProject, project, projectJacobian, undistortPixel, BehindCameraError } from '../../estimator/camera/project.js';
import { expectAllClose, expectClose } from '../helpers/expectClose.js';

const ideal: PinholeCamera = { fx: 500, fy: 500, cx: 320, cy: 240, width: 640, height: 480, distortion: NO_DISTORTION };
// A wide lens with strong barrel distortion and some decentering (invented but realistic values).
const wide: PinholeCamera = { fx: 610, fy: 605, cx: 322.5, cy: 238.25, width: 640, height: 480, distortion: { k1: -0.28, k2: 0.09, k3: -0.012, p1: 0.0011, p2: -0.0007 } };

describe('project', () => {
  it('f = 500, c = (320, 240): (0.2, -0.1, 2) m -> (370, 215) px (Hartley & Zisserman, Multiple View Geometry, ch. 6)', () => {
    // 1e-12 px: exact arithmetic on small numbers.
    expectAllClose(project(ideal, [0.2, -0.1, 2]), [370, 215], { abs: 1e-12 }, 'pixel');
  });

  it('refuses a point behind the camera with a typed error', () => {
    expect(() => project(ideal, [0, 0, -1])).toThrow(BehindCameraError);
  });

  it('back-projects every pixel of a distorted grid to a point that projects back (round trip)', () => {
    for (let u = 10; u < 640; u += 70) {
      for (let v = 10; v < 480; v += 70) {
        const p = backProject(wide, u, v, 4.5);
        expectClose(p[2]!, 4.5, { abs: 0 }, 'depth');
        // 1e-9 px: Newton undistortion stops at 1e-14 in normalized units.
        expectAllClose(project(wide, p), [u, v], { abs: 1e-9 }, `pixel (${u}, ${v})`);
      }
    }
  });

  it('undistortPixel of a distorted projection equals the ideal projection (round trip)', () => {
    const p = [0.7, -0.45, 2.1];
    const idealCam = { ...wide, distortion: NO_DISTORTION };
    const d = project(wide, p);
    expectAllClose(undistortPixel(wide, d[0]!, d[1]!), project(idealCam, p), { abs: 1e-9 }, 'undistorted');
  });

  it('projectJacobian matches central finite differences (with distortion)', () => {
    const p = [0.8, -0.5, 2.3];
    const J = projectJacobian(wide, p);
    const h = 1e-6;
    for (let k = 0; k < 3; k++) {
      const plus = [...p], minus = [...p];
      plus[k]! += h;
      minus[k]! -= h;
      const a = project(wide, plus), b = project(wide, minus);
      // 1e-5 relative: central difference truncation O(h²) plus round-off ~1e-10 / h.
      expectClose(J[k]!, (a[0]! - b[0]!) / (2 * h), { rel: 1e-6, abs: 1e-5 }, `du/dp${k}`);
      expectClose(J[3 + k]!, (a[1]! - b[1]!) / (2 * h), { rel: 1e-6, abs: 1e-5 }, `dv/dp${k}`);
    }
  });
});
