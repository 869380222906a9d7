import { describe, expect, it } from 'vitest';
import { defaultScenario } from '../../estimator/io/defaultScenario.js';
import { LqrGuidance } from '../../estimator/sim/guidanceLqr.js';
import { lqrGain } from '../../estimator/sim/lqrGain.js';
import { createGuidance } from '../../estimator/sim/guidance.js';
import { expectClose } from '../helpers/expectClose.js';

const s = defaultScenario();

describe('LqrGuidance', () => {
  it('uses the Riccati gains and turns the acceleration into a lagged velocity command', () => {
    const lander = { ...s.lander, velocityTimeConstant: 0.4, maxAccel: 50, maxSpeed: 50 };
    const g = new LqrGuidance({ ...s.guidance, lqrPosition: 2, lqrVelocity: 1, lqrControl: 0.5 }, lander, 0.01);
    const { kr, kv } = lqrGain(2, 1, 0.5, 0.01);
    expect(g.kr).toBe(kr);
    const out = new Float64Array(2);
    g.command({ rx: 1, ry: 0, vcx: 3, vcy: 0, vlx: 2, vly: 1, acx: 0, acy: 0 }, 0.01, out);
    expectClose(out[0]!, 2 + 0.4 * (kr * 1 + kv * 1), { rel: 1e-12 }, 'x (exact)');
    expectClose(out[1]!, 1 + 0.4 * (kv * -1), { rel: 1e-12 }, 'y (exact)');
  });

  it('limits acceleration and speed', () => {
    const lander = { ...s.lander, velocityTimeConstant: 0.5, maxAccel: 2, maxSpeed: 3 };
    const g = createGuidance({ ...s.guidance, law: 'lqr' }, lander, 0.01);
    const out = new Float64Array(2);
    g.command({ rx: 100, ry: 0, vcx: 0, vcy: 0, vlx: 0, vly: 0, acx: 0, acy: 0 }, 0.01, out);
    expectClose(out[0]!, 1, { abs: 1e-12 }, 'maxAccel * tau (exact)');
    g.command({ rx: 100, ry: 0, vcx: 0, vcy: 0, vlx: 2.9, vly: 0, acx: 0, acy: 0 }, 0.01, out);
    expectClose(out[0]!, 3, { abs: 1e-12 }, 'maxSpeed (exact)');
  });

  it('keeps the gains of each weight set and step apart (the gain cache is keyed by all four)', () => {
    const lander = { ...s.lander, velocityTimeConstant: 0.4, maxAccel: 50, maxSpeed: 50 };
    const weights = [[2, 1, 0.5, 0.01], [2, 1, 0.5, 0.02], [2, 1, 0.25, 0.01], [2, 2, 0.5, 0.01], [3, 1, 0.5, 0.01], [2, 1, 0.5, 0.01]] as const;
    for (const [q, qv, rho, dt] of weights) {
      const g = new LqrGuidance({ ...s.guidance, lqrPosition: q, lqrVelocity: qv, lqrControl: rho }, lander, dt);
      const { kr, kv } = lqrGain(q, qv, rho, dt);
      expect([g.kr, g.kv]).toEqual([kr, kv]);
    }
  });

  it('adds the estimated carrier acceleration to the desired lander acceleration (r\'\' = aC - aL)', () => {
    const lander = { ...s.lander, velocityTimeConstant: 0.4, maxAccel: 50, maxSpeed: 50 };
    const g = new LqrGuidance({ ...s.guidance, lqrPosition: 2, lqrVelocity: 1, lqrControl: 0.5 }, lander, 0.01);
    const out = new Float64Array(2);
    g.command({ rx: 0, ry: 0, vcx: 3, vcy: 0, vlx: 3, vly: 0, acx: 0.5, acy: -0.25 }, 0.01, out);
    expectClose(out[0]!, 3 + 0.4 * 0.5, { rel: 1e-12 }, 'x (exact)');
    expectClose(out[1]!, 0.4 * -0.25, { abs: 1e-12 }, 'y (exact)');
  });
});
