import { describe, expect, it } from 'vitest';
import { AttitudeResponse } from '../../../estimator/sim/world/AttitudeResponse.js';
import { expectClose } from '../../helpers/expectClose.js';

const DEG = Math.PI / 180;
/** Rotation by angle (rad) about a unit axis, [w, x, y, z]. */
const axisAngle = (axis: number[], angle: number) => Float64Array.of(Math.cos(angle / 2), ...axis.map((a) => a * Math.sin(angle / 2)));
/** Angle (rad) between two unit quaternions. */
const angleBetween = (p: Float64Array, q: Float64Array) => 2 * Math.acos(Math.min(1, Math.abs(p[0]! * q[0]! + p[1]! * q[1]! + p[2]! * q[2]! + p[3]! * q[3]!)));

describe('AttitudeResponse', () => {
  it('step() closes a small error as θ_k = θ_0 e^{-k dt / τ} about the error axis (first-order lag, closed form)', () => {
    const response = new AttitudeResponse(0.1, 1000 * DEG); // the rate limit never binds here
    const axis = [0.6, 0, 0.8];
    const target = axisAngle(axis, 10 * DEG);
    const q = Float64Array.of(1, 0, 0, 0);
    for (let k = 1; k <= 30; k++) {
      response.step(0.01, target, q);
      // rounding only: the step is exact for a rotation about a fixed axis
      expectClose(angleBetween(q, target), 10 * DEG * Math.exp((-k * 0.01) / 0.1), { abs: 1e-12 }, `error after step ${k}`);
    }
    // the body turned about the error axis only
    expectClose(q[2]!, 0, { abs: 1e-15 }, 'no rotation off the axis');
  });

  it('step() never turns faster than the rate limit and records the rates it turned at', () => {
    const response = new AttitudeResponse(0.05, 200 * DEG);
    const q = Float64Array.of(1, 0, 0, 0);
    const target = axisAngle([0, 1, 0], 40 * DEG); // a 40 deg jump: the limit binds at first
    let previous = Float64Array.from(q);
    let reached = false;
    for (let k = 0; k < 100 && !reached; k++) {
      reached = response.step(0.01, target, q);
      const rate = angleBetween(previous, q) / 0.01;
      expect(rate).toBeLessThanOrEqual(200 * DEG * (1 + 1e-9)); // rounding of acos
      expectClose(response.rate, rate, { abs: 1e-5 }, 'reported rate'); // acos near 1 loses half the digits: ~1e-8 rad over 0.01 s
      previous = Float64Array.from(q);
    }
    // 1 s: about 0.2 s at the limit, then 16 time constants of lag
    expect(angleBetween(q, target)).toBeLessThan(1e-5);
    expectClose(response.peakRate, 200 * DEG, { rel: 1e-12 }, 'the limit was reached'); // rounding
  });

  it('step() with τ = 0 and no binding limit reproduces an instant attitude exactly', () => {
    const response = new AttitudeResponse(0, 1e5 * DEG);
    const q = Float64Array.of(1, 0, 0, 0);
    const target = axisAngle([0, 0.6, 0.8], 30 * DEG);
    expect(response.step(0.01, target, q)).toBe(true);
    expect(Array.from(q)).toEqual(Array.from(target));
  });

  it('step() takes the shorter way round when the target quaternion has the other sign', () => {
    const response = new AttitudeResponse(0.1, 1000 * DEG);
    const q = Float64Array.of(1, 0, 0, 0);
    const target = axisAngle([1, 0, 0], 20 * DEG).map((v) => -v); // same rotation, negated
    response.step(0.01, target, q);
    expectClose(angleBetween(q, target), 20 * DEG * Math.exp(-0.1), { abs: 1e-12 }, 'error shrinks'); // rounding
  });

  it('refuses a negative time constant or a rate limit that is not positive', () => {
    expect(() => new AttitudeResponse(-1, 1)).toThrow(/time constant >= 0/);
    expect(() => new AttitudeResponse(0.1, 0)).toThrow(/rate limit > 0/);
  });
});
