import { describe, it } from 'vitest';
import { attitudeFromAcceleration, GRAVITY } from '../../../estimator/sim/world/thrustAttitude.js';
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

describe('attitudeFromAcceleration', () => {
  it('attitudeFromAcceleration() keeps the ZYX yaw and points body z along a - g_vec', () => {
    const out = new Float64Array(4);
    const a = [2, -3, 1];
    const tilt = attitudeFromAcceleration(a, -2.5, out);
    expectClose(Math.hypot(...out), 1, { abs: 1e-15 }, '|q|'); // rounding
    const r = axes(out);
    const f = [a[0]!, a[1]!, a[2]! + GRAVITY];
    const n = Math.hypot(...f);
    for (let k = 0; k < 3; k++) expectClose(r[6 + k]!, f[k]! / n, { abs: 1e-12 }, `z_b[${k}]`);
    expectClose(Math.atan2(r[1]!, r[0]!), -2.5, { abs: 1e-12 }, 'heading of body x');
    expectClose(tilt, Math.acos(f[2]! / n), { abs: 1e-12 }, 'tilt');
  });
});
