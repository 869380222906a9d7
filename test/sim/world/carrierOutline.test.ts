import { describe, expect, it } from 'vitest';
import type { Box } from '../../../estimator/camera/Box.js';
import { quatFromEulerDeg } from '../../../estimator/frames/quatFromEulerDeg.js';
import { createCarrierState } from '../../../estimator/sim/world/carrierPath.js';
import { CarrierOutline, foldRadius, type MountedCamera } from '../../../estimator/sim/world/carrierOutline.js';
import { expectClose } from '../../helpers/expectClose.js';

const camera: MountedCamera = {
  fx: 500, fy: 500, cx: 320, cy: 240, width: 640, height: 480,
  distortion: { k1: 0, k2: 0, k3: 0, p1: 0, p2: 0 },
  mount: { offset: [0, 0, 0], rollDeg: 0, pitchDeg: 0, yawDeg: 0 },
};
const tiny = { deckLength: 1e-4, deckWidth: 1e-4, bodyHeight: 0 };
const box = (): Box => ({ xMin: 0, yMin: 0, xMax: 0, yMax: 0 });

describe('CarrierOutline', () => {
  it('box() of a target straight below a lander rolled by phi sits at u = cx + f tan(phi) (pinhole, hand-derived)', () => {
    const outline = new CarrierOutline(camera, tiny);
    const carrier = createCarrierState();
    carrier.position.set([0, 0, -10]);
    const out = box();
    expect(outline.box({ position: [0, 0, 0], qWorldBody: quatFromEulerDeg(10, 0, 0) }, carrier, out)).toBeNull();
    // a 0.1 mm target at 10 m is 5e-3 px wide: its box centre is the point's image
    expectClose((out.xMin + out.xMax) / 2, 320 + 500 * Math.tan((10 * Math.PI) / 180), { abs: 1e-6 }, 'u');
    expectClose((out.yMin + out.yMax) / 2, 240, { abs: 1e-6 }, 'v');
    expectClose(outline.centreDepth, 10 * Math.cos((10 * Math.PI) / 180), { abs: 1e-12 }, 'depth');
  });

  it('box() follows the mount: a camera pitched 5 deg in its mount moves the image like a pitched body', () => {
    const mounted = new CarrierOutline({ ...camera, mount: { ...camera.mount, pitchDeg: 5 } }, tiny);
    const pitched = new CarrierOutline(camera, tiny);
    const carrier = createCarrierState();
    carrier.position.set([1, -0.5, -8]);
    const a = box(), b = box();
    mounted.box({ position: [0, 0, 0], qWorldBody: [1, 0, 0, 0] }, carrier, a);
    pitched.box({ position: [0, 0, 0], qWorldBody: quatFromEulerDeg(0, 5, 0) }, carrier, b);
    // mount rotations are about the body axes, so both describe the same camera orientation (zero offset)
    expectClose(a.xMin, b.xMin, { abs: 1e-9 }, 'u');
    expectClose(a.yMin, b.yMin, { abs: 1e-9 }, 'v');
  });

  it('box() reports a target behind the camera, and one far outside the lens field', () => {
    const outline = new CarrierOutline({ ...camera, distortion: { ...camera.distortion, k1: -0.3 } }, tiny);
    const carrier = createCarrierState();
    carrier.position.set([0, 0, 5]);
    expect(outline.box({ position: [0, 0, 0], qWorldBody: [1, 0, 0, 0] }, carrier, box())).toBe('behind-camera');
    // k1 = -0.3 folds at r = 1/sqrt(0.9) = 1.054, before the image corners: 20 m sideways at 1 m depth is beyond
    carrier.position.set([0, 20, -1]);
    expect(outline.box({ position: [0, 0, 0], qWorldBody: [1, 0, 0, 0] }, carrier, box())).toBe('outside-field');
    expectClose(foldRadius({ k1: -0.3, k2: 0, k3: 0, p1: 0, p2: 0 }), 1 / Math.sqrt(0.9), { abs: 1e-3 }, 'fold'); // scan step 1e-3
    expect(foldRadius({ k1: 0.1, k2: 0, k3: 0, p1: 0, p2: 0 })).toBe(Infinity);
  });
});
