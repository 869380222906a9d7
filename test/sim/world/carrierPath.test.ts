import { describe, expect, it } from 'vitest';
import type { CarrierSpec, PathShape } from '../../../estimator/sim/Scenario.js';
import { createCarrierState, createCarrierTrajectory } from '../../../estimator/sim/world/carrierPath.js';
import { SpeedProfileModel } from '../../../estimator/sim/world/speedProfile.js';
import { GRAVITY } from '../../../estimator/sim/world/thrustAttitude.js';
import { expectClose } from '../../helpers/expectClose.js';

function spec(shape: PathShape, overrides: Partial<CarrierSpec> = {}): CarrierSpec {
  return {
    kind: 'ground',
    path: { shape, headingDeg: 30, length: 60, width: 30, cornerRadius: 6, spacing: 8 },
    speed: 4,
    profile: { rampTime: 5, variation: 1, variationPeriod: 9 },
    motion: { heaveAmplitude: 0, heavePeriod: 0, pitchAmplitudeDeg: 0, pitchPeriod: 0 },
    deckHeight: 1.2,
    deckLength: 3,
    deckWidth: 2,
    bodyHeight: 1,
    ...overrides,
  };
}

const shapes: PathShape[] = ['straight', 'rectangle', 'ellipse', 'figure-eight', 'survey'];

describe('createCarrierTrajectory', () => {
  it('gives every trajectory of a kind the same stateAt function (no closure per trial)', () => {
    // A new closure per trial made optimized trial code that had inlined the last one deoptimize
    // at its first call in every trial; prototype methods are one function for all trials.
    const first = createCarrierTrajectory(spec('ellipse')), second = createCarrierTrajectory(spec('ellipse', { speed: 7 }));
    expect(second.stateAt).toBe(first.stateAt);
    const recorded = (offset: number) => createCarrierTrajectory(spec('recorded'), [[0, offset, 0, 0], [1, offset + 1, 0, 0], [2, offset + 2, 0, 0]]);
    expect(recorded(0).stateAt).toBe(recorded(5).stateAt);
  });

  for (const shape of shapes) {
    it(`stateAt() on a ${shape} path moves at exactly the profile speed (central differences)`, () => {
      const s = spec(shape);
      const trajectory = createCarrierTrajectory(s);
      const profile = new SpeedProfileModel(s.speed, s.profile);
      const expected = { s: 0, v: 0, a: 0 };
      const a = createCarrierState(), b = createCarrierState(), mid = createCarrierState();
      const h = 1e-4;
      for (let t = 0.1; t < 120; t += 0.731) {
        trajectory.stateAt(t - h, a);
        trajectory.stateAt(t + h, b);
        trajectory.stateAt(t, mid);
        profile.sample(t, expected);
        const fdSpeed = Math.hypot(b.position[0]! - a.position[0]!, b.position[1]! - a.position[1]!) / (2 * h);
        // chord vs arc over 2h at curvature <= 1/4 m and 5 m/s: relative error ~ (v h kappa)^2 / 6 < 1e-9
        expectClose(fdSpeed, expected.v, { abs: 1e-6 }, `${shape} speed at t=${t}`);
        expectClose(Math.hypot(mid.velocity[0]!, mid.velocity[1]!), expected.v, { abs: 1e-9 }, 'velocity norm'); // arithmetic only
        // the reported velocity is the derivative of the position
        for (let k = 0; k < 3; k++) expectClose((b.position[k]! - a.position[k]!) / (2 * h), mid.velocity[k]!, { abs: 1e-6 }, `v[${k}]`);
        expectClose(mid.heading, Math.atan2(mid.velocity[1]!, mid.velocity[0]!), { abs: 1e-9 }, 'heading follows the tangent');
      }
    });
  }

  it('stateAt() acceleration is the derivative of the velocity on an ellipse (smooth curvature)', () => {
    const trajectory = createCarrierTrajectory(spec('ellipse'));
    const a = createCarrierState(), b = createCarrierState(), mid = createCarrierState();
    const h = 1e-4;
    for (let t = 0.3; t < 60; t += 1.13) {
      if (Math.abs(t - 5) < 0.01) continue; // ramp end: step in along-track acceleration
      trajectory.stateAt(t - h, a);
      trajectory.stateAt(t + h, b);
      trajectory.stateAt(t, mid);
      // central difference of velocity: truncation ~ h^2 |v'''| ~ 1e-8, rounding ~ 1e-12 / h ~ 1e-8
      for (let k = 0; k < 2; k++) expectClose((b.velocity[k]! - a.velocity[k]!) / (2 * h), mid.acceleration[k]!, { abs: 1e-5 }, `a[${k}] at ${t}`);
    }
  });

  for (const shape of ['rectangle', 'ellipse', 'figure-eight', 'survey'] as PathShape[]) {
    it(`a ${shape} path is continuous and closes on itself`, () => {
      const s = spec(shape, { profile: { rampTime: 0, variation: 0, variationPeriod: 0 }, speed: 1 });
      const trajectory = createCarrierTrajectory(s);
      expect(trajectory.closed).toBe(true);
      const L = trajectory.pathLength;
      const start = trajectory.stateAt(0, createCarrierState());
      const end = trajectory.stateAt(L - 1e-9, createCarrierState());
      // 1e-9 s before closing at 1 m/s: within 1e-8 m (plus the Newton / turtle round-off)
      for (let k = 0; k < 3; k++) expectClose(end.position[k]!, start.position[k]!, { abs: 1e-7 }, `closure p[${k}]`);
      for (let k = 0; k < 2; k++) expectClose(end.velocity[k]!, start.velocity[k]!, { abs: 1e-7 }, `closure v[${k}]`);
      // continuity: no jump between samples 1 cm apart exceeds the 1 cm travelled
      const prev = createCarrierState(), cur = createCarrierState();
      trajectory.stateAt(0, prev);
      let maxStep = 0, maxTurn = 0;
      for (let t = 0.01; t <= L; t += 0.01) {
        trajectory.stateAt(t, cur);
        maxStep = Math.max(maxStep, Math.hypot(cur.position[0]! - prev.position[0]!, cur.position[1]! - prev.position[1]!));
        maxTurn = Math.max(maxTurn, Math.abs(Math.atan2(Math.sin(cur.heading - prev.heading), Math.cos(cur.heading - prev.heading))));
        prev.position.set(cur.position);
        prev.heading = cur.heading;
      }
      expect(maxStep).toBeLessThanOrEqual(0.01 + 1e-9);
      expect(maxTurn).toBeLessThan(0.01); // curvature <= 1/4 m here, so <= 0.0025 rad per cm
    });
  }

  it('a rounded rectangle turns no faster than 1 / cornerRadius, and through 2 pi per lap', () => {
    const trajectory = createCarrierTrajectory(spec('rectangle', { speed: 1, profile: { rampTime: 0, variation: 0, variationPeriod: 0 } }));
    const prev = createCarrierState(), cur = createCarrierState();
    trajectory.stateAt(0, prev);
    let total = 0;
    let maxCurvature = 0, maxAccel = 0;
    const ds = 0.005;
    for (let t = ds; t <= trajectory.pathLength + 1e-9; t += ds) {
      trajectory.stateAt(t, cur);
      const turn = Math.atan2(Math.sin(cur.heading - prev.heading), Math.cos(cur.heading - prev.heading));
      total += turn;
      maxCurvature = Math.max(maxCurvature, Math.abs(turn) / ds);
      maxAccel = Math.max(maxAccel, Math.hypot(cur.acceleration[0]!, cur.acceleration[1]!));
      prev.heading = cur.heading;
    }
    // centripetal acceleration v^2 kappa on a 6 m corner at 1 m/s is at most 1/6 m/s^2
    expectClose(maxAccel, 1 / 6, { rel: 1e-12 }, 'peak centripetal acceleration');
    expect(maxCurvature).toBeLessThanOrEqual(1 / 6 + 1e-9);
    expectClose(maxCurvature, 1 / 6, { rel: 1e-6 }, 'corners reach 1/r'); // samples inside an arc turn by exactly ds / r
    expectClose(total, 2 * Math.PI, { abs: 1e-9 }, 'one lap turns once'); // sum of exact increments
    // perimeter = 2 (L - 2r) + 2 (W - 2r) + 2 pi r (hand-derived)
    expectClose(trajectory.pathLength, 2 * 48 + 2 * 18 + 12 * Math.PI, { rel: 1e-12 }, 'perimeter');
  });

  it('an ellipse with equal semi-axes is a circle of circumference 2 pi a (Gauss-Legendre table)', () => {
    const trajectory = createCarrierTrajectory(spec('ellipse', { path: { shape: 'ellipse', headingDeg: 0, length: 20, width: 20, cornerRadius: 0, spacing: 0 } }));
    expectClose(trajectory.pathLength, 40 * Math.PI, { rel: 1e-13 }, 'circumference'); // Gauss-Legendre is exact to round-off here
  });

  it('an aircraft carrier banks by atan(v^2 / (R g)) in a steady circle (coordinated turn, common practice)', () => {
    const R = 20, v = 6;
    const trajectory = createCarrierTrajectory(spec('ellipse', {
      kind: 'aircraft', speed: v, profile: { rampTime: 0, variation: 0, variationPeriod: 0 },
      path: { shape: 'ellipse', headingDeg: 0, length: R, width: R, cornerRadius: 0, spacing: 0 },
    }));
    const state = trajectory.stateAt(7.3, createCarrierState());
    const q = state.qWorldDeck;
    // tilt of deck z axis from vertical: cos(tilt) = 1 - 2 (qx^2 + qy^2)
    const tilt = Math.acos(1 - 2 * (q[1]! ** 2 + q[2]! ** 2));
    expectClose(tilt, Math.atan((v * v) / (R * GRAVITY)), { abs: 1e-9 }, "bank angle"); // the circle's curvature is exact from the curve, not the table
  });

  it('heave and pitch move the deck height and attitude sinusoidally', () => {
    const trajectory = createCarrierTrajectory(spec('straight', {
      kind: 'boat', motion: { heaveAmplitude: 0.5, heavePeriod: 8, pitchAmplitudeDeg: 4, pitchPeriod: 6 },
    }));
    const state = trajectory.stateAt(2, createCarrierState()); // quarter heave period: crest
    expectClose(state.position[2]!, 1.2 + 0.5, { abs: 1e-12 }, 'deck at crest');
    expectClose(state.velocity[2]!, 0, { abs: 1e-12 }, 'vertical speed at crest');
    trajectory.stateAt(1.5, state); // quarter pitch period: full pitch
    const q = state.qWorldDeck;
    // deck x axis vertical component = 2 (qx qz - qw qy) = -sin(pitch) (FLU: positive pitch = nose down)
    expectClose(2 * (q[1]! * q[3]! - q[0]! * q[2]!), -Math.sin(4 * Math.PI / 180), { abs: 1e-12 }, 'pitch');
  });

  it('a recorded path replays its rows with Hermite-interpolated velocity and stops at the end', () => {
    const rows = [[10, 0, 0, 0], [11, 2, 0, 0], [12, 4, 0, 0], [13, 6, 1, 0]];
    const trajectory = createCarrierTrajectory(spec('recorded'), rows);
    const state = trajectory.stateAt(1, createCarrierState()); // row t = 11
    expectClose(state.position[0]!, 2, { abs: 1e-12 }, 'passes through the row');
    expectClose(state.position[2]!, 1.2, { abs: 1e-12 }, 'deck height on top of the recorded z');
    expectClose(state.velocity[0]!, 2, { abs: 1e-12 }, 'central-difference tangent');
    trajectory.stateAt(50, state);
    expect([state.position[0], state.position[1], state.velocity[0]]).toEqual([6, 1, 0]);
    expect(() => createCarrierTrajectory(spec('recorded'), [[0, 0, 0, 0], [0, 1, 1, 1]])).toThrow(/row 2: time must increase/);
    expect(() => createCarrierTrajectory(spec('recorded'))).toThrow(/carrier.path.file/);
  });

  it('rejects a corner radius larger than half the rectangle, naming the field', () => {
    expect(() => createCarrierTrajectory(spec('rectangle', { path: { shape: 'rectangle', headingDeg: 0, length: 10, width: 8, cornerRadius: 5, spacing: 0 } })))
      .toThrow(/carrier.path.cornerRadius/);
  });
});

describe('createCarrierTrajectory shares the arc-length table of a curved path between trials', () => {
  it('gives bit-identical states whatever another trajectory on the same cached path evaluated in between', () => {
    for (const shape of ['ellipse', 'figure-eight'] as const) {
      const a = createCarrierTrajectory(spec(shape)), b = createCarrierTrajectory(spec(shape));
      const sa = createCarrierState(), sb = createCarrierState();
      for (let k = 0; k < 200; k++) {
        const t = k * 0.37;
        a.stateAt(t, sa);
        b.stateAt(1000 - t, sb); // disturb any state the shared path could carry
        const again = createCarrierState();
        b.stateAt(t, again);
        expect(Array.from(again.position)).toEqual(Array.from(sa.position));
        expect(Array.from(again.velocity)).toEqual(Array.from(sa.velocity));
        expect(again.heading).toBe(sa.heading);
      }
      expect(b.pathLength).toBe(a.pathLength);
    }
  });
});
