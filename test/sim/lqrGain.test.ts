import { Matrix } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { dareResidual } from '../../estimator/sim/dareSolve.js';
import { lqrGain } from '../../estimator/sim/lqrGain.js';
import { expectClose } from '../helpers/expectClose.js';

// Continuous double integrator r'' = -u, cost ∫ q r^2 + qv r'^2 + rho u^2 dt. Derived here from
// the CARE A'P + PA - P B B' P / rho + Q = 0 with P = [[p1, p2], [p2, p3]]:
//   (1,1): q - p2^2/rho = 0            -> p2 = sqrt(q rho)
//   (2,2): 2 p2 + qv - p3^2/rho = 0    -> p3 = sqrt(rho (qv + 2 p2))
// K = B'P/rho -> kr = sqrt(q/rho), kv = sqrt(qv/rho + 2 sqrt(q/rho)).
function continuousGain(q: number, qv: number, rho: number): [number, number] {
  const kr = Math.sqrt(q / rho);
  return [kr, Math.sqrt(qv / rho + 2 * kr)];
}

describe('lqrGain', () => {
  it('tends to the continuous closed form as dt -> 0, with an O(dt) gap', () => {
    for (const [q, qv, rho] of [[1, 0.5, 1], [4, 0, 0.5], [0.3, 2, 3]] as const) {
      const [kr, kv] = continuousGain(q, qv, rho);
      const coarse = lqrGain(q, qv, rho, 0.01);
      const fine = lqrGain(q, qv, rho, 0.0005);
      // zero-order hold + rectangle-rule cost: first-order in dt
      expectClose(fine.kr, kr, { rel: 3e-3 }, `kr q=${q} (O(dt), dt = 0.5 ms)`);
      expectClose(fine.kv, kv, { rel: 3e-3 }, `kv q=${q} (O(dt), dt = 0.5 ms)`);
      expect(Math.abs(fine.kr - kr)).toBeLessThan(Math.abs(coarse.kr - kr));
      expect(Math.abs(fine.kv - kv)).toBeLessThan(Math.abs(coarse.kv - kv));
    }
  });

  it('solves its discrete Riccati equation (residual ~0)', () => {
    const dt = 0.01;
    const { X } = lqrGain(1, 0.5, 1, dt);
    const A = new Matrix([[1, dt], [0, 1]]);
    const B = new Matrix([[-0.5 * dt * dt], [-dt]]);
    const Q = new Matrix([[dt, 0], [0, 0.5 * dt]]);
    const R = new Matrix([[dt]]);
    expect(dareResidual(A, B, Q, R, X)).toBeLessThan(1e-12 * X.max()); // round-off level
  });

  it('gives positive gains that stabilize the discrete loop', () => {
    const dt = 0.01;
    const { kr, kv } = lqrGain(1, 0.5, 1, dt);
    expect(kr).toBeGreaterThan(0);
    expect(kv).toBeGreaterThan(0);
    // e' = [r, rdot], a = kr r + kv rdot, rdot' = -a
    let r = 1, v = 0;
    for (let k = 0; k < 3000; k++) {
      const a = kr * r + kv * v;
      r += dt * v - 0.5 * dt * dt * a;
      v -= dt * a;
    }
    expect(Math.hypot(r, v)).toBeLessThan(1e-6);
  });
});
