import { describe, expect, it } from 'vitest';
import { RandomStream } from '../../../estimator/random/RandomStream.js';
import type { DetectorSpec } from '../../../estimator/sim/Scenario.js';
import { createCarrierState, type CarrierState } from '../../../estimator/sim/world/carrierPath.js';
import type { LanderPose, MountedCamera } from '../../../estimator/sim/world/carrierOutline.js';
import { Detector, type DetectorFrame } from '../../../estimator/sim/world/detector.js';
import { gilbertElliottLossRate } from '../../../estimator/sim/world/gilbertElliott.js';
import { expectClose } from '../../helpers/expectClose.js';

// Hartley & Zisserman, "Multiple View Geometry", ch. 6 example: f = 500, c = (320, 240).
const camera: MountedCamera = {
  fx: 500, fy: 500, cx: 320, cy: 240, width: 640, height: 480,
  distortion: { k1: 0, k2: 0, k3: 0, p1: 0, p2: 0 },
  mount: { offset: [0, 0, 0], rollDeg: 0, pitchDeg: 0, yawDeg: 0 },
};
const clean: DetectorSpec = {
  rate: 30, pixelNoise: 0, sizeNoise: 0, latency: 0, latencyJitter: 0,
  dropout: 0, burst: null, falseBoxRate: 0, edgeMargin: 0,
};
// Level lander at the origin, nominal nadir camera: x_cam = -y_world, y_cam = -x_world, z_cam = -z_world.
const lander: LanderPose = { position: [0, 0, 0], qWorldBody: [1, 0, 0, 0] };

/** Carrier whose deck centre sits at optical-frame point (X, Y, Z) of the level nadir camera. */
function carrierAtCameraPoint(X: number, Y: number, Z: number): CarrierState {
  const carrier = createCarrierState();
  carrier.position.set([-Y, -X, -Z]);
  return carrier;
}

function detector(spec: Partial<DetectorSpec>, dims = { deckLength: 0.4, deckWidth: 0.2, bodyHeight: 0 }, cam = camera, seed = 1): Detector {
  return new Detector(cam, { ...clean, ...spec }, dims, RandomStream.fromKey([seed, 0, 0, 42]));
}

describe('Detector', () => {
  it('observe() boxes a flat target centred at (0.2, -0.1, 2) m around pixel (370, 215) (Hartley & Zisserman ch. 6 example)', () => {
    const frame = detector({}).observe(0, lander, carrierAtCameraPoint(0.2, -0.1, 2))!;
    expect(frame).not.toBeNull();
    // centre from the pinhole u = f X / Z + cx; deck length (world x) spans image y: 500 * 0.4 / 2 = 100 px,
    // width spans image x: 50 px. Equal depth at all corners: exact up to rounding.
    expectClose((frame.box.xMin + frame.box.xMax) / 2, 370, { abs: 1e-9 }, 'u');
    expectClose((frame.box.yMin + frame.box.yMax) / 2, 215, { abs: 1e-9 }, 'v');
    expectClose(frame.box.xMax - frame.box.xMin, 50, { abs: 1e-9 }, 'width');
    expectClose(frame.box.yMax - frame.box.yMin, 100, { abs: 1e-9 }, 'height');
    expect(frame.falseBox).toBe(false);
    expect(frame.truth).toMatchObject({ visible: true, loss: null, depth: 2 });
  });

  it('observe() includes the body below the deck: the far footprint pulls the box towards the principal point (pinhole, hand-derived)', () => {
    const h = 1; // body height: footprint at depth 3 m
    const frame = detector({}, { deckLength: 0.4, deckWidth: 0.2, bodyHeight: h }).observe(0, lander, carrierAtCameraPoint(1, 0, 2))!;
    // near side of the footprint at X = 1 - 0.1, Z = 3: u = 320 + 500 * 0.9 / 3 = 470 (deck's would be 545)
    expectClose(frame.box.xMin, 470, { abs: 1e-9 }, 'xMin from the footprint');
    expectClose(frame.box.xMax, 320 + (500 * 1.1) / 2, { abs: 1e-9 }, 'xMax from the deck');
  });

  it('observe() distorts the outline with the Brown-Conrady radial term (Brown 1966)', () => {
    const k1 = -0.2;
    const distorted = { ...camera, distortion: { ...camera.distortion, k1 } };
    const frame = detector({}, { deckLength: 1e-4, deckWidth: 1e-4, bodyHeight: 0 }, distorted).observe(0, lander, carrierAtCameraPoint(0.6, 0, 2))!;
    // x = 0.3, r^2 = 0.09: u = 320 + 500 * 0.3 * (1 + k1 r^2); a 0.1 mm target is a point to 1e-4 px
    expectClose((frame.box.xMin + frame.box.xMax) / 2, 320 + 150 * (1 + k1 * 0.09), { abs: 1e-3 }, 'distorted u');
  });

  it('observe() loses a box closer than the edge margin, and one behind the camera', () => {
    const d = detector({ edgeMargin: 10 });
    // box right edge at u = 320 + 500 X / 2 + 25; margin line at 630 -> X = 1.14
    expect(d.observe(0, lander, carrierAtCameraPoint(1.13, 0, 2))).not.toBeNull();
    expect(d.observe(0.033, lander, carrierAtCameraPoint(1.15, 0, 2))).toBeNull();
    expect(d.lastTruth).toMatchObject({ visible: false, loss: 'edge' });
    expect(d.observe(0.066, lander, carrierAtCameraPoint(0, 0, -2))).toBeNull();
    expect(d.lastTruth.loss).toBe('behind-camera');
    // a negative margin lets a partly visible carrier through, clipped to the image
    const clipped = detector({ edgeMargin: -40 }).observe(0, lander, carrierAtCameraPoint(1.2, 0, 2))!;
    expect(clipped.box.xMax).toBe(640);
  });

  it('observe() centre and size noise have the configured standard deviations (20 000 seeded frames)', () => {
    const d = detector({ pixelNoise: 2, sizeNoise: 0.05 });
    const carrier = carrierAtCameraPoint(0, 0, 2);
    const N = 20_000;
    let su = 0, suu = 0, ss = 0, sss = 0;
    for (let i = 0; i < N; i++) {
      const f = d.observe(i / 30, lander, carrier)!;
      const du = (f.box.xMin + f.box.xMax) / 2 - 320;
      const ds = Math.sqrt((f.box.xMax - f.box.xMin) * (f.box.yMax - f.box.yMin)) / Math.sqrt(50 * 100) - 1;
      su += du; suu += du * du; ss += ds; sss += ds * ds;
    }
    // sd of a sample sd ~ sigma / sqrt(2N) = 0.5 %; 3 % allows 6 sd. Mean within 4 sigma / sqrt(N).
    expectClose(Math.sqrt(suu / N - (su / N) ** 2), 2, { rel: 0.03 }, 'centre noise sd');
    expectClose(su / N, 0, { abs: (4 * 2) / Math.sqrt(N) }, 'centre noise mean');
    expectClose(Math.sqrt(sss / N - (ss / N) ** 2), 0.05, { rel: 0.03 }, 'size noise sd');
  });

  it('observe() makes false boxes at the Poisson rate, inside the image (30 000 seeded frames)', () => {
    const d = detector({ falseBoxRate: 3 });
    const carrier = carrierAtCameraPoint(0, 0, 2);
    const N = 30_000;
    let count = 0;
    let inside = true;
    for (let i = 0; i < N; i++) {
      d.observe(i / 30, lander, carrier);
      for (let j = 0; j < d.falseFrameCount; j++) {
        const b = d.falseFrames[j]!.box;
        count++;
        inside &&= d.falseFrames[j]!.falseBox && b.xMin >= 0 && b.yMin >= 0 && b.xMax <= 640 && b.yMax <= 480 && b.xMax > b.xMin;
      }
    }
    // Poisson with mean 3/s * 1000 s = 3000: sd 55; tolerance 4 sd
    expectClose(count, 3000, { abs: 220 }, 'false boxes in 1000 s');
    expect(count).toBe(d.falseBoxTotal);
    expect(inside).toBe(true);
  });

  it('observe() delays boxes by the latency with its jitter, and never reorders arrivals', () => {
    const d = detector({ latency: 0.1, latencyJitter: 0.004 });
    const carrier = carrierAtCameraPoint(0, 0, 2);
    const N = 20_000;
    let sum = 0, sum2 = 0;
    for (let i = 0; i < N; i++) {
      const f = d.observe(i / 30, lander, carrier)!;
      const delay = f.arrivalTime - f.captureTime;
      sum += delay; sum2 += delay * delay;
    }
    // jitter << frame interval: reordering never binds. Mean within 4 sd/sqrt(N); sd within 3 % (6 sd of a sample sd)
    expectClose(sum / N, 0.1, { abs: (4 * 0.004) / Math.sqrt(N) }, 'mean latency');
    expectClose(Math.sqrt(sum2 / N - (sum / N) ** 2), 0.004, { rel: 0.03 }, 'jitter');
    const wild = detector({ latency: 0.05, latencyJitter: 0.08 });
    let previous = -Infinity, ordered = true, causal = true;
    for (let i = 0; i < 5000; i++) {
      const f = wild.observe(i / 30, lander, carrier)!;
      ordered &&= f.arrivalTime >= previous;
      causal &&= f.arrivalTime >= f.captureTime;
      previous = f.arrivalTime;
    }
    expect(ordered).toBe(true);
    expect(causal).toBe(true);
  });

  it('observe() drops frames at the i.i.d. rate plus the Gilbert–Elliott burst rate (Gilbert 1960; Elliott 1963)', () => {
    const carrier = carrierAtCameraPoint(0, 0, 2);
    const N = 40_000;
    const lossRate = (d: Detector) => {
      let lost = 0;
      for (let i = 0; i < N; i++) if (d.observe(i / 30, lander, carrier) === null) lost++;
      return lost / N;
    };
    // i.i.d.: sd sqrt(p(1-p)/N) = 0.0015 at p = 0.1; tolerance 4 sd
    expectClose(lossRate(detector({ dropout: 0.1 })), 0.1, { abs: 0.006 }, 'i.i.d. dropout');
    // independent i.i.d. and burst: 1 - (1 - p)(1 - pi), pi = p_GE/(p_GE + r); sd ~ 0.0026 (chain + i.i.d.); tolerance 4 sd
    const pi = gilbertElliottLossRate(0.05, 0.5);
    expectClose(lossRate(detector({ dropout: 0.05, burst: { enter: 0.05, exit: 0.5 } })), 1 - 0.95 * (1 - pi), { abs: 0.011 }, 'with bursts');
  });

  it('observe() is deterministic for a seed and returns frames from a ring that outlives the latency', () => {
    const run = (seed: number) => {
      const d = detector({ pixelNoise: 1, sizeNoise: 0.02, dropout: 0.2, falseBoxRate: 5, latency: 0.08, latencyJitter: 0.02 }, undefined, camera, seed);
      const out: number[] = [];
      for (let i = 0; i < 300; i++) {
        const f: DetectorFrame | null = d.observe(i / 30, lander, carrierAtCameraPoint(0.1, 0, 3));
        out.push(f ? f.box.xMin + f.arrivalTime : -1, d.falseFrameCount);
      }
      return out;
    };
    expect(run(3)).toEqual(run(3));
    expect(run(3)).not.toEqual(run(4));
  });

  it('frameRingSize keeps frames alive through long latency at a high frame rate', () => {
    const d = detector({ rate: 1000, latency: 2, latencyJitter: 0.01, falseBoxRate: 100 });
    // 1000 Hz x (2 + 0.06 + 1) s x (1 + 2 * 0.1 + 1) frames per capture
    expect(d.frameRingSize).toBeGreaterThanOrEqual(Math.ceil(1000 * 3.06 * 2.2));
    const first = d.observe(0, lander, carrierAtCameraPoint(0, 0, 2))!;
    const kept = { ...first.box };
    for (let i = 1; i < 2100; i++) d.observe(i / 1000, lander, carrierAtCameraPoint(0.1, 0, 2));
    expect(first.box).toEqual(kept); // not yet overwritten after 2.1 s of captures
  });
});
