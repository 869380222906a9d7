import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { quatFromEulerDeg } from '../../../estimator/frames/quatFromEulerDeg.js';
import { quatMultiply } from '../../../estimator/frames/quaternion.js';
import { loadScenario } from '../../../estimator/io/loadScenario.js';
import { setPath } from '../../../estimator/io/scenarioPath.js';
import { runTrial } from '../../../estimator/sim/runTrial.js';
import { NadirGimbal } from '../../../estimator/sim/world/NadirGimbal.js';
import { differenceInterval } from '../../../estimator/study/statistics/differenceInterval.js';
import { expectClose } from '../../helpers/expectClose.js';

const DEG = Math.PI / 180;

describe('NadirGimbal', () => {
  it('step() levels the camera base against a steady lean, keeping the body yaw (q_wb ⊗ q_g = Rz(ψ))', () => {
    const g = new NadirGimbal({ timeConstant: 0.05, maxRate: 1000 * DEG, maxAngle: 45 * DEG });
    const body = quatFromEulerDeg(8, -15, 30, new Float64Array(4)); // roll, pitch, yaw
    for (let k = 0; k < 200; k++) g.step(0.01, body); // 2 s = 40 time constants
    const base = quatMultiply(body, g.q, new Float64Array(4));
    const level = quatFromEulerDeg(0, 0, 30, new Float64Array(4));
    // rounding after 40 time constants of lag: e^-40
    for (let i = 0; i < 4; i++) expectClose(Math.abs(base[i]!), Math.abs(level[i]!), { abs: 1e-12 }, `component ${i}`);
  });

  it('step() turns no faster than its rate limit and no further than its travel', () => {
    const g = new NadirGimbal({ timeConstant: 0, maxRate: 100 * DEG, maxAngle: 20 * DEG });
    const body = quatFromEulerDeg(0, 30, 0, new Float64Array(4)); // a 30 deg pitch: beyond the travel
    g.step(0.01, body);
    expectClose(g.pitch, -1 * DEG, { abs: 1e-15 }, 'one step at 100 deg/s'); // rounding
    for (let k = 0; k < 100; k++) g.step(0.01, body);
    expectClose(g.pitch, -20 * DEG, { abs: 1e-15 }, 'stops at its travel'); // rounding
    expectClose(g.roll, 0, { abs: 1e-15 }, 'no roll asked');
  });
});

describe('stabilized camera on the highway truck (12 m/s)', () => {
  it('lands at least as often as the body-fixed camera (100 trials each, same keys; Newcombe interval of the difference)', () => {
    const truck = loadScenario(join(import.meta.dirname, '..', '..', '..', 'data-demo', 'highway-truck.scenario.json'));
    expect(truck.carrier.speed).toBe(12);
    const landed = (stabilization: string) => {
      const s = setPath(truck, 'camera.stabilization', stabilization);
      let k = 0;
      for (let trial = 0; trial < 100; trial++) if (runTrial(s, { key: { seed: truck.seed, point: 0, trial } }).outcome === 'landed') k++;
      return k;
    };
    const gimbal = landed('nadir-gimbal'), body = landed('body-fixed');
    const d = differenceInterval(gimbal, 100, body, 100); // Newcombe 1998, method 10
    expect(gimbal).toBeGreaterThanOrEqual(body);
    expect(d.low).toBeLessThanOrEqual(d.difference);
    expect(d.high).toBeGreaterThanOrEqual(d.difference);
    expect(d.high).toBeGreaterThan(0); // measured 100 vs 100 landed: difference 0, interval about [-0.037, 0.037]
  }, 120_000);
});
