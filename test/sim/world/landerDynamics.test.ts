import { describe, expect, it } from 'vitest';
import type { LanderSpec } from '../../../estimator/sim/Scenario.js';
import { createLanderState, LanderDynamics } from '../../../estimator/sim/world/landerDynamics.js';
import { GRAVITY } from '../../../estimator/sim/world/thrustAttitude.js';
import { expectClose } from '../../helpers/expectClose.js';

const spec: LanderSpec = {
  startOffset: [0, 0, 10],
  velocityTimeConstant: 0.5,
  maxAccel: 4,
  maxTiltDeg: 25,
  maxSpeed: 8,
  maxVerticalSpeed: 2,
  wind: { speed: 0, directionDeg: 0, turbulence: 'none' },
  velocitySource: 'odometry',
  // the plant's closed forms below assume an instant attitude (the response is tested on its own)
  attitudeTimeConstant: 0,
  maxAttitudeRateDeg: 1e5,
  yawPolicy: 'hold',
};
const calm = [0, 0, 0];

/** Body axis k of q in world coordinates (column k of R). */
function bodyAxis(q: Float64Array, k: 0 | 1 | 2): number[] {
  const [w, x, y, z] = q as unknown as [number, number, number, number];
  if (k === 0) return [1 - 2 * (y * y + z * z), 2 * (x * y + w * z), 2 * (x * z - w * y)];
  if (k === 1) return [2 * (x * y - w * z), 1 - 2 * (x * x + z * z), 2 * (y * z + w * x)];
  return [2 * (x * z + w * y), 2 * (y * z - w * x), 1 - 2 * (x * x + y * y)];
}

describe('LanderDynamics', () => {
  it('step() follows a small velocity step as v = v_c (1 - e^{-t/tau}) in calm air (first-order lag, closed form)', () => {
    const lander = new LanderDynamics(spec, [0, 0, 10]);
    const out = createLanderState();
    const dt = 0.01;
    for (let i = 1; i <= 150; i++) {
      lander.step(dt, [0.5, -0.3, 0.2], calm, out);
      const decay = 1 - Math.exp((-i * dt) / spec.velocityTimeConstant);
      // exact discrete step of the lag: equality up to rounding
      expectClose(out.velocity[0]!, 0.5 * decay, { abs: 1e-12 }, `vx at step ${i}`);
      expectClose(out.velocity[1]!, -0.3 * decay, { abs: 1e-12 }, `vy at step ${i}`);
      expectClose(out.velocity[2]!, 0.2 * decay, { abs: 1e-12 }, `vz at step ${i}`);
    }
    // p = v_c (t - tau (1 - e^{-t/tau})); trapezoid-in-velocity integration error O(dt^2 / tau) per unit time
    const t = 1.5;
    expectClose(out.position[0]!, 0.5 * (t - 0.5 * (1 - Math.exp(-t / 0.5))), { abs: 2e-4 }, 'x');
  });

  it('step() respects the speed, acceleration and tilt limits under a large command', () => {
    const lander = new LanderDynamics(spec, [0, 0, 10]);
    const out = createLanderState();
    let maxAccel = 0, maxTilt = 0, maxVertical = 0;
    for (let i = 0; i < 2000; i++) {
      lander.step(0.01, [30, 30, i < 1000 ? 0 : -9], calm, out);
      if (i < 1000) maxAccel = Math.max(maxAccel, Math.hypot(out.acceleration[0]!, out.acceleration[1]!));
      maxTilt = Math.max(maxTilt, out.tilt);
      maxVertical = Math.max(maxVertical, Math.abs(out.velocity[2]!));
    }
    expectClose(Math.hypot(out.velocity[0]!, out.velocity[1]!), spec.maxSpeed, { rel: 1e-9 }, 'speed settles at the limit'); // 20 s >> tau
    expect(maxVertical).toBeLessThanOrEqual(spec.maxVerticalSpeed + 1e-9);
    expect(maxAccel).toBeLessThanOrEqual(spec.maxAccel + 1e-9); // level flight: g tan 25 deg > 4, so maxAccel binds
    expect(maxTilt).toBeLessThanOrEqual((spec.maxTiltDeg * Math.PI) / 180 + 1e-12);
    expectClose(maxAccel, spec.maxAccel, { rel: 1e-9 }, 'the acceleration limit is reached');
  });

  it('step() tilts the thrust axis along the acceleration with yaw held, so the IMU reads only along body z (calm air)', () => {
    const yaw = 0.7;
    const lander = new LanderDynamics(spec, [0, 0, 10], { yaw });
    const out = createLanderState();
    lander.step(0.01, [3, 1, 0.5], calm, out);
    const z = bodyAxis(out.qWorldBody, 2);
    const f = [out.acceleration[0]!, out.acceleration[1]!, out.acceleration[2]! + GRAVITY];
    const fn = Math.hypot(f[0]!, f[1]!, f[2]!);
    for (let k = 0; k < 3; k++) expectClose(z[k]!, f[k]! / fn, { abs: 1e-12 }, `body z along a - g_vec [${k}]`); // rounding
    expectClose(out.tilt, Math.atan2(Math.hypot(f[0]!, f[1]!), f[2]!), { abs: 1e-12 }, 'tilt');
    // f_b = R_bw (a - g_vec): all along body z with magnitude |a - g_vec|
    expectClose(out.specificForceBody[0]!, 0, { abs: 1e-12 }, 'f_b x');
    expectClose(out.specificForceBody[1]!, 0, { abs: 1e-12 }, 'f_b y');
    expectClose(out.specificForceBody[2]!, fn, { rel: 1e-12 }, 'f_b z');
    // yaw held: body x projected on the horizontal points at the yaw angle
    const x = bodyAxis(out.qWorldBody, 0);
    expectClose(Math.atan2(x[1]!, x[0]!), yaw, { abs: 1e-12 }, 'yaw');
  });

  it('step() in a steady wind: the loop cancels the drag and the lander leans into the wind by atan(w / (tau_d g))', () => {
    const lander = new LanderDynamics(spec, [0, 0, 10], { dragTimeConstant: 4, windRejectionTime: 1.5 });
    const out = createLanderState();
    const wind = [6, 0, 0];
    let peak = 0;
    for (let i = 0; i < 3000; i++) {
      lander.step(0.01, calm, wind, out);
      peak = Math.max(peak, out.velocity[0]!);
    }
    expect(peak).toBeGreaterThan(0.1); // the onset of wind pushes the lander downwind before the loop catches up
    expectClose(out.velocity[0]!, 0, { abs: 1e-6 }, 'held against the wind after 30 s = 20 rejection times');
    const z = bodyAxis(out.qWorldBody, 2);
    // thrust must supply -(w / tau_d) horizontally: tilt atan(1.5 / g), leaning upwind (-x)
    expectClose(Math.atan2(-z[0]!, z[2]!), Math.atan(6 / 4 / GRAVITY), { abs: 1e-6 }, 'lean angle');
    // the accelerometer now reads the drag: f_b = R_bw (a - g_vec) with a = 0 is (0, 0, g) in the world
    const f = out.specificForceBody;
    expectClose(Math.hypot(f[0]!, f[1]!, f[2]!), GRAVITY, { rel: 1e-6 }, '|f| = g when not accelerating');
  });

  it('reset() puts the lander at rest, level, at the given position', () => {
    const lander = new LanderDynamics(spec, [0, 0, 10]);
    lander.step(0.01, [5, 0, 0], calm, lander.state);
    lander.reset([1, 2, 3]);
    expect(Array.from(lander.state.position)).toEqual([1, 2, 3]);
    expect(Array.from(lander.state.velocity)).toEqual([0, 0, 0]);
    expect(lander.state.tilt).toBe(0);
  });
});

describe('LanderDynamics (flying on its belief)', () => {
  it('step() settles at v = v_c - β (1 - 1 / (G τ_d)) when the velocity it closes on reads v + β (the autopilot flies what it believes)', () => {
    const lander = new LanderDynamics({ ...spec, attitudeTimeConstant: 0.1, maxAttitudeRateDeg: 200 }, [0, 0, 10]);
    const out = createLanderState();
    const beta = [0.05, -0.04, 0.03];
    const belief = new Float64Array(3);
    for (let i = 0; i < 2000; i++) {
      for (let k = 0; k < 3; k++) belief[k] = out.velocity[k]! + beta[k]!;
      lander.step(0.01, [2, 1, 0], calm, out, belief);
    }
    // (c - v - β) G + β / τ_d = 0 with G = (1 - e^{-dt/τ}) / dt the lag's gain and τ_d = 4 s the
    // drag time constant: the drag fed forward from the belief leaves a small share of β
    const G = -Math.expm1(-0.01 / spec.velocityTimeConstant) / 0.01;
    const share = 1 - 1 / (G * 4);
    // 20 s >> tau and the attitude time constant: settled to rounding
    expectClose(out.velocity[0]!, 2 - beta[0]! * share, { abs: 1e-9 }, 'vx');
    expectClose(out.velocity[1]!, 1 - beta[1]! * share, { abs: 1e-9 }, 'vy');
    expectClose(out.velocity[2]!, 0 - beta[2]! * share, { abs: 1e-9 }, 'vz');
  });

  it('step() turns the body no faster than maxAttitudeRateDeg, and the thrust follows the body it has reached', () => {
    const lander = new LanderDynamics({ ...spec, attitudeTimeConstant: 0.1, maxAttitudeRateDeg: 150 }, [0, 0, 10]);
    const out = createLanderState();
    lander.step(0.01, [8, 0, 0], calm, out); // asks for the full tilt at once
    expectClose(lander.attitude.rate, (150 * Math.PI) / 180, { rel: 1e-12 }, 'limited to 150 deg/s'); // rounding
    expectClose(out.tilt, 1.5 * (Math.PI / 180), { rel: 1e-9 }, 'tilted 1.5 deg in 10 ms'); // rounding of acos
    // horizontal acceleration from the tilt reached, not the one asked for (g tan 25 deg at full tilt)
    const f = Math.hypot(out.acceleration[0]!, out.acceleration[2]! + GRAVITY);
    expectClose(out.acceleration[0]! / f, Math.sin(out.tilt), { rel: 1e-9 }, 'thrust along the body z'); // calm air, v ~ 0
  });
});
