import { describe, expect, it } from 'vitest';
import type { CameraSpec } from '../../../estimator/sim/Scenario.js';
import { fieldOfViewDeg, intrinsicsFromSpec, pinholeFromSpec, pixelsPerMetre } from '../../../estimator/sim/world/cameraFromSpec.js';
import { expectClose } from '../../helpers/expectClose.js';

const base: Omit<CameraSpec, 'intrinsics' | 'lens'> = {
  width: 640,
  height: 480,
  distortion: { k1: -0.1, k2: 0.01, k3: 0, p1: 0, p2: 0 },
  mount: { offset: [0, 0, -0.05], rollDeg: 0, pitchDeg: 0, yawDeg: 0 },
  stabilization: 'body-fixed', gimbalTimeConstant: 0.05, gimbalMaxRateDeg: 120, gimbalMaxAngleDeg: 45,
};

describe('intrinsicsFromSpec', () => {
  it('a 3.6 mm lens on a 3.6 x 2.7 mm sensor at 640 x 480 gives fx = fy = 640, c = (320, 240) (f width / sensorWidth, hand-derived)', () => {
    const k = intrinsicsFromSpec({ ...base, lens: { focalLength: 0.0036, sensorWidth: 0.0036, sensorHeight: 0.0027 } });
    expectClose(k.fx, 640, { rel: 1e-14 }, 'fx'); // rounding of 3.6e-3 / 3.6e-3
    expectClose(k.fy, 640, { rel: 1e-14 }, 'fy');
    expect([k.cx, k.cy]).toEqual([320, 240]);
  });

  it('passes given intrinsics through and rejects a spec with both or neither', () => {
    const given = { fx: 500, fy: 510, cx: 321, cy: 239 };
    expect(intrinsicsFromSpec({ ...base, intrinsics: given })).toEqual(given);
    expect(pinholeFromSpec({ ...base, intrinsics: given })).toMatchObject({ ...given, width: 640, height: 480 });
    expect(() => intrinsicsFromSpec({ ...base })).toThrow(/either intrinsics or lens/);
    expect(() => intrinsicsFromSpec({ ...base, intrinsics: given, lens: { focalLength: 1, sensorWidth: 1, sensorHeight: 1 } })).toThrow(/not both/);
    expect(() => intrinsicsFromSpec({ ...base, lens: { focalLength: 0.004, sensorWidth: 0, sensorHeight: 0.003 } })).toThrow(/camera.lens.sensorWidth/);
  });
});

describe('fieldOfViewDeg and pixelsPerMetre', () => {
  it('fx = 640 over 640 x 480 px sees 2 atan(1/2) = 53.130 deg by 2 atan(3/8) = 41.112 deg, and 64 px/m at 10 m (hand-derived)', () => {
    const k = { fx: 640, fy: 640, cx: 320, cy: 240 };
    const fov = fieldOfViewDeg(k, 640, 480);
    expectClose(fov.horizontal, 53.1301024, { abs: 1e-6 }, 'horizontal'); // 2 atan(0.5) in degrees to 7 decimals
    expectClose(fov.vertical, 41.1120904, { abs: 1e-6 }, 'vertical'); // 2 atan(0.375)
    expectClose(pixelsPerMetre(k, 10), 64, { rel: 1e-15 }, 'px per m');
    expect(() => pixelsPerMetre(k, 0)).toThrow(/height must be positive/);
  });
});
