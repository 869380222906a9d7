import { describe, expect, it } from 'vitest';
import { createPlanarPoint } from '../../../estimator/sim/world/PlanarPath.js';
import { roundedRectanglePath, SegmentPath, surveyPassCount, surveyPath } from '../../../estimator/sim/world/segmentPath.js';
import { expectClose } from '../../helpers/expectClose.js';

describe('SegmentPath', () => {
  it('line().arc() puts a quarter turn of radius r where the geometry says (hand-derived)', () => {
    const path = new SegmentPath().line(10).arc(2, Math.PI / 2).line(5);
    const p = createPlanarPoint();
    path.evaluate(10 + Math.PI, p); // end of the arc: (12, 2) heading +y
    expectClose(p.x, 12, { abs: 1e-12 }, 'x');
    expectClose(p.y, 2, { abs: 1e-12 }, 'y');
    expectClose(p.ty, 1, { abs: 1e-12 }, 'heading +y');
    path.evaluate(10 + Math.PI / 2, p); // mid-arc: on the circle about (10, 2)
    expectClose(Math.hypot(p.x - 10, p.y - 2), 2, { abs: 1e-12 }, 'on the circle');
    expectClose(p.curvature, 0.5, { rel: 1e-15 }, '1 / r');
    expectClose(path.length, 15 + Math.PI, { abs: 1e-12 }, 'length');
  });

  it('roundedRectanglePath ends where it starts, heading the same way', () => {
    const end = roundedRectanglePath(30, 12, 3).end();
    expectClose(end.x, 0, { abs: 1e-12 }, 'x');
    expectClose(end.y, 0, { abs: 1e-12 }, 'y');
    expectClose(end.heading, 2 * Math.PI, { abs: 1e-12 }, 'one full turn');
  });

  it('surveyPath flies an even number of passes spacing apart and returns to the start', () => {
    expect(surveyPassCount(30, 10)).toBe(4); // passes at y = 0, 10, 20, 30
    expect(surveyPassCount(25, 10)).toBe(4); // 3 passes cover 0..20, rounded up to even
    expect(surveyPassCount(1, 10)).toBe(2);
    const path = surveyPath(50, 30, 10);
    const p = createPlanarPoint();
    // 4 passes of 50 m, 3 semicircles of radius 5, two quarter circles and a 20 m return leg
    expectClose(path.length, 4 * 50 + 3 * 5 * Math.PI + 5 * Math.PI + 20, { abs: 1e-9 }, 'length');
    path.evaluate(50 + 5 * Math.PI + 25, p); // middle of the second pass, flown towards -x
    expectClose(p.y, 10, { abs: 1e-12 }, 'second pass at y = spacing');
    expectClose(p.tx, -1, { abs: 1e-12 }, 'flown back');
    const end = path.end();
    expectClose(end.x, 0, { abs: 1e-9 }, 'closes x');
    expectClose(end.y, 0, { abs: 1e-9 }, 'closes y');
  });
});
