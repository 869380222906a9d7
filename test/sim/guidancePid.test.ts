import { describe, expect, it } from 'vitest';
import { defaultScenario } from '../../estimator/io/defaultScenario.js';
import { PidGuidance } from '../../estimator/sim/guidancePid.js';
import { expectClose } from '../helpers/expectClose.js';

const s = defaultScenario();
const estimate = (rx: number, ry: number, vcx = 0, vcy = 0, vlx = 0, vly = 0, acx = 0, acy = 0) => ({ rx, ry, vcx, vcy, vlx, vly, acx, acy });

describe('PidGuidance', () => {
  it('commands kp r + ki ∫r + kd (vC - vL) plus the carrier velocity', () => {
    const g = new PidGuidance({ ...s.guidance, kp: 0.5, ki: 0.1, kd: 0.2, feedForward: true, alignRadius: 2 }, { ...s.lander, maxAccel: 100 });
    const out = new Float64Array(2);
    g.command(estimate(1, -0.5, 3, 0, 2.5, 0), 0.1, out);
    // 3 + 0.5*1 + 0.1*(0.1*1) + 0.2*(3-2.5) = 3.61 ; 0 + 0.5*-0.5 + 0.1*(-0.05) + 0 = -0.255
    expectClose(out[0]!, 3.61, { abs: 1e-12 }, 'vx (exact arithmetic)');
    expectClose(out[1]!, -0.255, { abs: 1e-12 }, 'vy (exact arithmetic)');
  });

  it('drops the feed-forward when asked', () => {
    const g = new PidGuidance({ ...s.guidance, kp: 1, ki: 0, kd: 0, feedForward: false }, { ...s.lander, maxAccel: 100 });
    const out = new Float64Array(2);
    g.command(estimate(0.2, 0, 5, 0, 5, 0), 0.01, out);
    expectClose(out[0]!, 0.2, { abs: 1e-12 }, 'kp r only (exact)');
  });

  it('saturates the command at maxSpeed and at maxAccel tau from the lander velocity, keeping direction', () => {
    const lander = { ...s.lander, maxSpeed: 5, maxAccel: 4, velocityTimeConstant: 0.5 };
    const g = new PidGuidance({ ...s.guidance, kp: 10, ki: 0, kd: 0, feedForward: false }, lander);
    const out = new Float64Array(2);
    g.command(estimate(30, 40, 0, 0, 0, 0), 0.01, out);
    expectClose(Math.hypot(out[0]!, out[1]!), 2, { rel: 1e-12 }, 'accel limit 4 * 0.5 (exact)');
    expectClose(out[0]! / out[1]!, 0.75, { rel: 1e-12 }, 'direction kept (exact)');
    g.command(estimate(30, 40, 0, 0, 4, 3), 0.01, out);
    expectClose(Math.hypot(out[0]!, out[1]!), 5, { rel: 1e-12 }, 'speed limit (exact)');
  });

  it('stops integrating while saturated and resets on demand', () => {
    const g = new PidGuidance({ ...s.guidance, kp: 0, ki: 1, kd: 0, feedForward: false, alignRadius: 2 }, { ...s.lander, maxSpeed: 100, maxAccel: 100 });
    const out = new Float64Array(2);
    for (let k = 0; k < 10; k++) g.command(estimate(1, 0), 0.1, out);
    expectClose(out[0]!, 1, { abs: 1e-12 }, '∫ 1 dt over 1 s (exact sum)');
    g.reset();
    g.command(estimate(1, 0), 0.1, out);
    expectClose(out[0]!, 0.1, { abs: 1e-12 }, 'after reset (exact)');
    const tight = new PidGuidance({ ...s.guidance, kp: 0, ki: 1, kd: 0, feedForward: false, alignRadius: 2 }, { ...s.lander, maxSpeed: 0.05, maxAccel: 100 });
    for (let k = 0; k < 50; k++) tight.command(estimate(1, 0), 0.1, out);
    tight.command(estimate(-1, 0), 0.1, out);
    expect(out[0]!).toBeLessThan(0.05); // no wound-up integrator holding it at the limit
  });

  it('integrates only inside alignRadius (no wind-up on the approach) and leads the carrier acceleration by the velocity lag tau', () => {
    const lander = { ...s.lander, maxAccel: 100, velocityTimeConstant: 0.3 };
    const g = new PidGuidance({ ...s.guidance, kp: 0, ki: 1, kd: 0, feedForward: true, alignRadius: 0.5 }, lander);
    const out = new Float64Array(2);
    for (let k = 0; k < 10; k++) g.command(estimate(2, 0), 0.1, out); // 2 m out: nothing integrated
    g.command(estimate(0.3, 0), 0.1, out);
    expectClose(out[0]!, 0.03, { abs: 1e-12 }, 'one step of ki r dt inside the zone (exact)');
    g.reset();
    g.command(estimate(0, 0, 4, 0, 4, 0, 0.5, -0.2), 0.1, out);
    expectClose(out[0]!, 4 + 0.3 * 0.5, { abs: 1e-12 }, 'vC + tau aC (exact)');
    expectClose(out[1]!, 0.3 * -0.2, { abs: 1e-12 }, 'tau aC across (exact)');
  });
});
