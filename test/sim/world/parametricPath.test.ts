import { describe, expect, it } from 'vitest';
import { ellipsePath, figureEightPath } from '../../../estimator/sim/world/parametricPath.js';
import { createPlanarPoint } from '../../../estimator/sim/world/PlanarPath.js';
import { expectClose } from '../../helpers/expectClose.js';

/** Arc length of a curve from 0 to theta by composite Simpson with n panels (independent of the table). */
function simpsonLength(speed: (t: number) => number, theta: number, n = 4000): number {
  const h = theta / n;
  let sum = speed(0) + speed(theta);
  for (let i = 1; i < n; i++) sum += (i % 2 ? 4 : 2) * speed(i * h);
  return (sum * h) / 3;
}

describe('ParametricPath', () => {
  it('thetaAt(s) inverts the arc length: Simpson length from 0 to thetaAt(s) equals s (identity)', () => {
    const a = 40, b = 15;
    const path = figureEightPath(a, b);
    const speed = (t: number) => Math.hypot(a * Math.cos(t), 2 * b * Math.cos(2 * t));
    for (const fraction of [0.013, 0.25, 0.5, 0.61, 0.999]) {
      const s = fraction * path.length;
      // Simpson with 4000 panels on a smooth integrand: error ~1e-12 m; Hermite table ~1e-9 m
      expectClose(simpsonLength(speed, path.thetaAt(s)), s, { abs: 1e-7 }, `s = ${s.toFixed(2)}`);
    }
  });

  it('ellipse circumference matches Ramanujan\'s second approximation (Ramanujan 1914, "Modular equations and approximations to pi" [memory])', () => {
    const a = 60, b = 30;
    const h = ((a - b) / (a + b)) ** 2;
    const ramanujan = Math.PI * (a + b) * (1 + (3 * h) / (10 + Math.sqrt(4 - 3 * h)));
    // Ramanujan II's relative error is of order h^5 (3 h^5 / 2^17 ~ 4e-10 at h = 1/9 [memory]); 1e-9 allows it
    expectClose(ellipsePath(a, b).length, ramanujan, { rel: 1e-9 }, 'circumference');
  });

  it('evaluate() gives a unit tangent and the signed curvature of the ellipse at its ends, b/a^2 and a/b^2', () => {
    const a = 60, b = 30;
    const path = ellipsePath(a, b);
    const point = createPlanarPoint();
    path.evaluate(0, point); // (0, 0): the end of the minor (y) semi-axis, where kappa = b / a^2
    expectClose(point.curvature, b / (a * a), { rel: 1e-12 }, 'curvature at the end of the minor axis'); // exact formula
    expectClose(Math.hypot(point.tx, point.ty), 1, { abs: 1e-15 }, 'unit tangent');
    path.evaluate(path.length / 4, point); // end of the major axis, turning left
    expectClose(point.curvature, a / (b * b), { rel: 1e-7 }, 'curvature at the end of the major axis'); // theta from the table
    expect(point.x).toBeCloseTo(a, 6);
  });
});
