import { describe, expect, it } from 'vitest';
import { OutlineBoxModel } from '../../estimator/models/OutlineBoxModel.js';
import { BoxMeasurementModel } from '../../estimator/models/BoxMeasurementModel.js';
import { CarrierOutline } from '../../estimator/sim/world/carrierOutline.js';
import { createCarrierState } from '../../estimator/sim/world/carrierPath.js';
import { quatFromEulerDeg } from '../../estimator/frames/quatFromEulerDeg.js';
import type { Box } from '../../estimator/camera/Box.js';
import { expectClose } from '../helpers/expectClose.js';
import { camera } from './landingFixture.js';

const tilted = { ...camera, mount: { offset: [0.08, -0.03, -0.05] as [number, number, number], rollDeg: 2, pitchDeg: -4, yawDeg: 7 } };
const deck = { deckLength: 3, deckWidth: 1.8, bodyHeight: 2 };
// lander pitched 14 deg nose-down flying along +x, rolled 3 deg, yawed 20 deg; carrier ahead below
const q = quatFromEulerDeg(3, 14, 20);
const x = [1.2, -0.4, -4.5, 5.5, 2.0, 0.1];

function evaluate(model: OutlineBoxModel, box: BoxMeasurementModel, state: number[], h: Float64Array, H: Float64Array): boolean {
  return model.evaluate(state, box.Rcw, box.offsetCam, box.Rwb, h, H);
}

describe('OutlineBoxModel', () => {
  for (const terms of ['centre-size', 'centre-width-height'] as const) {
    it(`${terms}: H over [r, v_c] matches central finite differences (heading from v_c, body below, distortion, mount)`, () => {
      const box = new BoxMeasurementModel(tilted, 1);
      box.setAttitude(q);
      const model = new OutlineBoxModel(box.camera, deck, terms, 0.5);
      const m = model.m;
      const h = new Float64Array(m), H = new Float64Array(6 * m), hp = new Float64Array(m), hm = new Float64Array(m), scratch = new Float64Array(6 * m);
      expect(evaluate(model, box, x, h, H)).toBe(true);
      expect(model.headingFromVelocity).toBe(true);
      const step = 1e-6;
      for (let k = 0; k < 6; k++) {
        const plus = [...x], minus = [...x];
        plus[k]! += step;
        minus[k]! -= step;
        evaluate(model, box, plus, hp, scratch);
        evaluate(model, box, minus, hm, scratch);
        // 1e-4 px per unit: O(step²) truncation on curvature ~100 px/m², round-off 1e-13 / 1e-6
        for (let i = 0; i < m; i++) expectClose(H[6 * i + k]!, (hp[i]! - hm[i]!) / (2 * step), { rel: 1e-6, abs: 1e-4 }, `H[${i}][${k}]`);
      }
      // v_c moves the box through the heading only: a heading change of 90 deg changes the box
      expect(Math.abs(H[6 * 2 + 3]!) + Math.abs(H[6 * 2 + 4]!)).toBeGreaterThan(0.1);
    });
  }

  it('predicts the box the simulator\'s detector draws of the same outline (two implementations agree)', () => {
    // Same camera, true pose, a level deck heading along v_c: the filter's prediction is the
    // truth's noise-free box. Agreement to 1e-9 px: same corners, same projection, round-off.
    const box = new BoxMeasurementModel(tilted, 1);
    box.setAttitude(q);
    const model = new OutlineBoxModel(box.camera, deck, 'centre-width-height', 0.5);
    const h = new Float64Array(4), H = new Float64Array(24);
    expect(evaluate(model, box, x, h, H)).toBe(true);
    const truth = new CarrierOutline(tilted, deck);
    const carrier = createCarrierState();
    const heading = Math.atan2(x[4]!, x[3]!);
    carrier.position.set([x[0]!, x[1]!, x[2]!]);
    carrier.heading = heading;
    carrier.qWorldDeck.set([Math.cos(heading / 2), 0, 0, Math.sin(heading / 2)]);
    const out: Box = { xMin: 0, yMin: 0, xMax: 0, yMax: 0 };
    expect(truth.box({ position: [0, 0, 0], qWorldBody: q }, carrier, out)).toBe(null);
    expectClose(h[0]!, (out.xMin + out.xMax) / 2, { abs: 1e-9 }, 'u');
    expectClose(h[1]!, (out.yMin + out.yMax) / 2, { abs: 1e-9 }, 'v');
    expectClose(h[2]!, out.xMax - out.xMin, { abs: 1e-9 }, 'w');
    expectClose(h[3]!, out.yMax - out.yMin, { abs: 1e-9 }, 'h');
  });

  it('shifts the box along travel and grows it when a tilted camera sees the deck obliquely (the flat model does neither)', () => {
    // Nadir camera on a lander pitched 15 deg nose-down, deck 1.5 m below, 2.5 x 2 m, heading
    // along body forward. Geometry (issue 10, small-angle estimate): centre shift along travel
    // about L² tan(θ) / (4 h) = 0.25 m, i.e. about 0.25 fx / h px; size up by roughly 18 %.
    const cam = { ...camera, distortion: { k1: 0, k2: 0, k3: 0, p1: 0, p2: 0 }, mount: { offset: [0, 0, 0] as [number, number, number], rollDeg: 0, pitchDeg: 0, yawDeg: 0 } };
    const box = new BoxMeasurementModel(cam, Math.sqrt(2.5 * 2));
    const pitch = quatFromEulerDeg(0, 15, 0);
    box.setAttitude(pitch);
    // r chosen so the deck centre lies on the optical axis
    const h0 = 1.5;
    const r = [-h0 * Math.tan(15 * Math.PI / 180), 0, -h0];
    const model = new OutlineBoxModel(box.camera, { deckLength: 2.5, deckWidth: 2, bodyHeight: 0 }, 'centre-size', 0.5);
    const h = new Float64Array(3), H = new Float64Array(18), flat = new Float64Array(3), Hf = new Float64Array(9);
    expect(evaluate(model, box, [...r, 5, 0, 0], h, H)).toBe(true);
    expect(box.tight(r, flat, Hf)).toBe(null);
    // along travel = body forward = image up (-v); the outline box centre sits ahead of the centre's image
    const shiftPx = flat[1]! - h[1]!;
    const shiftMetres = (shiftPx * (h0 / Math.cos(15 * Math.PI / 180))) / camera.fy;
    expect(shiftMetres).toBeGreaterThan(0.15); // the 0.25 m estimate is first-order in tilt: exact value lower
    expect(shiftMetres).toBeLessThan(0.35);
    expect(h[2]! / flat[2]!).toBeGreaterThan(1.08);
    expect(Math.abs(flat[0]! - h[0]!)).toBeLessThan(1e-9); // no shift across travel (symmetric)
  });

  it('takes the lander yaw as heading below minSpeed, with no v_c Jacobian', () => {
    const box = new BoxMeasurementModel(tilted, 1);
    box.setAttitude(q);
    const model = new OutlineBoxModel(box.camera, deck, 'centre-size', 0.5);
    const h = new Float64Array(3), H = new Float64Array(18);
    expect(evaluate(model, box, [1, 0, -5, 0.1, 0.2, 0], h, H)).toBe(true);
    expect(model.headingFromVelocity).toBe(false);
    expectClose(model.heading, 20 * Math.PI / 180, { abs: 1e-12 }, 'lander yaw'); // exact rotation
    expect([H[3]!, H[4]!, H[9]!, H[10]!, H[15]!, H[16]!].map(Math.abs)).toEqual([0, 0, 0, 0, 0, 0]);
    evaluate(model, box, [1, 0, -5, 0, 3, 0], h, H);
    expectClose(model.heading, Math.PI / 2, { abs: 1e-12 }, 'from v_c');
    evaluate(model, box, [1, 0, -5, 0.2, 0, 0], h, H);
    expectClose(model.heading, 20 * Math.PI / 180, { abs: 1e-12 }, 'lander yaw again');
  });

  it('refuses a corner behind the camera', () => {
    const box = new BoxMeasurementModel(tilted, 1);
    box.setAttitude(q);
    const model = new OutlineBoxModel(box.camera, deck, 'centre-size', 0.5);
    expect(evaluate(model, box, [0, 0, 0.5, 5, 0, 0], new Float64Array(3), new Float64Array(18))).toBe(false);
  });
});
