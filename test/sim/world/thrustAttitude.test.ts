import { describe, it } from 'vitest';
import { RandomStream } from '../../../estimator/random/RandomStream.js';
import { attitudeFromAcceleration, GRAVITY, quaternionFromAxes } from '../../../estimator/sim/world/thrustAttitude.js';
import { expectClose } from '../../helpers/expectClose.js';

/** Columns of R(q) (body axes in the world), Hamilton convention. */
function axes(q: ArrayLike<number>): number[] {
  const w = q[0]!, x = q[1]!, y = q[2]!, z = q[3]!;
  return [
    1 - 2 * (y * y + z * z), 2 * (x * y + w * z), 2 * (x * z - w * y),
    2 * (x * y - w * z), 1 - 2 * (x * x + z * z), 2 * (y * z + w * x),
    2 * (x * z + w * y), 2 * (y * z - w * x), 1 - 2 * (x * x + y * y),
  ];
}

describe('quaternionFromAxes', () => {
  it('quaternionFromAxes(R(q)) recovers q for random rotations and the 180-degree turns of every branch (identity)', () => {
    const stream = RandomStream.fromKey([11]);
    const cases: number[][] = [[0, 1, 0, 0], [0, 0, 1, 0], [0, 0, 0, 1], [1, 0, 0, 0]];
    for (let i = 0; i < 200; i++) {
      const q = [stream.gaussian(), stream.gaussian(), stream.gaussian(), stream.gaussian()];
      const n = Math.hypot(...q);
      cases.push(q.map((v) => (v * (q[0]! < 0 ? -1 : 1)) / n));
    }
    const out = new Float64Array(4);
    for (const q of cases) {
      const r = axes(q);
      quaternionFromAxes(r[0]!, r[1]!, r[2]!, r[3]!, r[4]!, r[5]!, r[6]!, r[7]!, r[8]!, out);
      const back = axes(out);
      for (let k = 0; k < 9; k++) expectClose(back[k]!, r[k]!, { abs: 1e-12 }, `R[${k}] of ${q}`); // round-off
    }
  });
});

describe('attitudeFromAcceleration', () => {
  it('attitudeFromAcceleration() keeps the ZYX yaw and points body z along a - g_vec', () => {
    const out = new Float64Array(4);
    const a = [2, -3, 1];
    const tilt = attitudeFromAcceleration(a, -2.5, out);
    const r = axes(out);
    const f = [a[0]!, a[1]!, a[2]! + GRAVITY];
    const n = Math.hypot(...f);
    for (let k = 0; k < 3; k++) expectClose(r[6 + k]!, f[k]! / n, { abs: 1e-12 }, `z_b[${k}]`);
    expectClose(Math.atan2(r[1]!, r[0]!), -2.5, { abs: 1e-12 }, 'heading of body x');
    expectClose(tilt, Math.acos(f[2]! / n), { abs: 1e-12 }, 'tilt');
  });
});
