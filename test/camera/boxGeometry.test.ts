import { describe, expect, it } from 'vitest';
import { boxFromRelativePosition, boxMeasurement, boxMeasurementJacobian, relativePositionFromBox, relativePositionFromMeasurement, relativePositionJacobian } from '../../estimator/camera/boxGeometry.js';
import { boxProblem, boxSize } from '../../estimator/camera/Box.js';
import type { PinholeCamera } from '../../estimator/camera/PinholeCamera.js';
import { expectAllClose, expectClose } from '../helpers/expectClose.js';

const cam: PinholeCamera = { fx: 610, fy: 605, cx: 322.5, cy: 238.25, width: 640, height: 480, distortion: { k1: -0.28, k2: 0.09, k3: -0.012, p1: 0.0011, p2: -0.0007 } };
const L = 1.6; // target size sqrt(deck area), m

function fdColumn(f: (p: number[]) => ArrayLike<number>, p: number[], k: number, h: number): number[] {
  const plus = [...p], minus = [...p];
  plus[k]! += h;
  minus[k]! -= h;
  const a = f(plus), b = f(minus);
  return [0, 1, 2].map((i) => (a[i]! - b[i]!) / (2 * h));
}

describe('box geometry', () => {
  it('size of a target L at depth Z is sqrt(fx fy) L / Z (pinhole similar triangles, common practice)', () => {
    const box = boxFromRelativePosition(cam, [0, 0, 8], L);
    expectClose(boxSize(box), (Math.sqrt(610 * 605) * L) / 8, { rel: 1e-15 }, 's');
  });

  it('relativePositionFromBox inverts boxFromRelativePosition (round trip with distortion)', () => {
    for (const p of [[0.3, -0.2, 6], [-2.1, 1.4, 9.5], [1.0, 0.9, 3.2]]) {
      const box = boxFromRelativePosition(cam, p, L);
      // 1e-9 m: undistortion residual 1e-14 times depth, plus rounding of corners.
      expectAllClose(relativePositionFromBox(cam, box, L), p, { abs: 1e-9 }, `p ${p}`);
    }
  });

  it('boxMeasurementJacobian matches central finite differences', () => {
    const p = [0.9, -0.6, 5.5];
    const J = boxMeasurementJacobian(cam, L, p);
    for (let k = 0; k < 3; k++) {
      const col = fdColumn((q) => boxMeasurement(cam, L, q), p, k, 1e-6);
      // 1e-5 px/m absolute: truncation O(h²) and round-off 1e-13 / 1e-6 on values ~100.
      for (let i = 0; i < 3; i++) expectClose(J[3 * i + k]!, col[i]!, { rel: 1e-7, abs: 1e-5 }, `J[${i}][${k}]`);
    }
  });

  it('relativePositionJacobian matches central finite differences of the back-projection', () => {
    const p = [0.9, -0.6, 5.5];
    const m = boxMeasurement(cam, L, p);
    const J = relativePositionJacobian(cam, L, p);
    for (let k = 0; k < 3; k++) {
      const col = fdColumn((z) => relativePositionFromMeasurement(cam, L, z[0]!, z[1]!, z[2]!), Array.from(m), k, 1e-4);
      // 1e-9 m/px: truncation O(h²) on second derivatives ~1e-4, round-off 1e-15 / 1e-4.
      for (let i = 0; i < 3; i++) expectClose(J[3 * i + k]!, col[i]!, { rel: 1e-6, abs: 1e-9 }, `J[${i}][${k}]`);
    }
  });

  it('boxProblem names NaN, empty and off-image boxes', () => {
    expect(boxProblem({ xMin: NaN, yMin: 0, xMax: 1, yMax: 1 }, 640, 480)).toBe('box-not-finite');
    expect(boxProblem({ xMin: 5, yMin: 5, xMax: 5, yMax: 9 }, 640, 480)).toBe('box-empty');
    expect(boxProblem({ xMin: 700, yMin: 5, xMax: 720, yMax: 9 }, 640, 480)).toBe('box-outside-image');
    expect(boxProblem({ xMin: 600, yMin: 5, xMax: 660, yMax: 30 }, 640, 480)).toBe(null);
  });
});
