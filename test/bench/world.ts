// world: nanoseconds per call of the truth-side models a trial steps through — carrier
// state on a figure-eight (arc-length Newton), Dryden gust step, lander step, detector frame
// (8-corner outline with distortion, all impairments). Median of 5 repetitions each.
import type { BenchSection } from './sections.js';
import { RandomStream } from '../../estimator/random/RandomStream.js';
import type { CarrierSpec, DetectorSpec, LanderSpec } from '../../estimator/sim/Scenario.js';
import { createCarrierState, createCarrierTrajectory } from '../../estimator/sim/world/carrierPath.js';
import { Detector } from '../../estimator/sim/world/detector.js';
import { DrydenGust } from '../../estimator/sim/world/dryden.js';
import { createLanderState, LanderDynamics } from '../../estimator/sim/world/landerDynamics.js';

const carrierSpec: CarrierSpec = {
  kind: 'ground', path: { shape: 'figure-eight', headingDeg: 0, length: 40, width: 15, cornerRadius: 0, spacing: 0 },
  speed: 3, profile: { rampTime: 5, variation: 0.5, variationPeriod: 10 },
  motion: { heaveAmplitude: 0, heavePeriod: 0, pitchAmplitudeDeg: 0, pitchPeriod: 0 },
  deckHeight: 1, deckLength: 2, deckWidth: 1.5, bodyHeight: 0.8,
};
const landerSpec: LanderSpec = {
  startOffset: [0, 0, 10], velocityTimeConstant: 0.4, maxAccel: 4, maxTiltDeg: 25, maxSpeed: 10, maxVerticalSpeed: 2,
  wind: { speed: 3, directionDeg: 0, turbulence: 'moderate' },
  velocitySource: 'odometry', attitudeTimeConstant: 0.1, maxAttitudeRateDeg: 200, yawPolicy: 'carrier-heading',
};
const detectorSpec: DetectorSpec = {
  rate: 30, pixelNoise: 1.5, sizeNoise: 0.05, latency: 0.08, latencyJitter: 0.01, dropout: 0.05,
  burst: { enter: 0.02, exit: 0.3 }, falseBoxRate: 0.5, edgeMargin: 5,
};

function nsPerCall(calls: number, body: (i: number) => void): number {
  const times: number[] = [];
  for (let rep = 0; rep < 5; rep++) {
    const start = performance.now();
    for (let i = 0; i < calls; i++) body(i);
    times.push(((performance.now() - start) * 1e6) / calls);
  }
  return Math.round(times.sort((a, b) => a - b)[2]!);
}

export const world: BenchSection = {
  name: 'world',
  async run() {
    const trajectory = createCarrierTrajectory(carrierSpec);
    const carrier = createCarrierState();
    const gust = new DrydenGust('moderate', RandomStream.fromKey([1]));
    const wind = new Float64Array(3);
    const lander = new LanderDynamics(landerSpec, [0, 0, 10]);
    const landerState = createLanderState();
    const command = Float64Array.of(1, 0.5, -0.2);
    const detector = new Detector({
      fx: 600, fy: 600, cx: 320, cy: 240, width: 640, height: 480,
      distortion: { k1: -0.1, k2: 0.01, k3: 0, p1: 0, p2: 0 },
      mount: { offset: [0, 0, -0.05], rollDeg: 0, pitchDeg: 0, yawDeg: 0 },
    }, detectorSpec, carrierSpec, RandomStream.fromKey([2]));
    const pose = { position: Float64Array.of(0.5, 0.2, 9), qWorldBody: Float64Array.of(1, 0, 0, 0) };
    return {
      carrierStateNs: nsPerCall(200_000, (i) => trajectory.stateAt(i * 0.01, carrier)),
      drydenStepNs: nsPerCall(200_000, () => gust.step(0.01, 8, 4, wind)),
      landerStepNs: nsPerCall(200_000, () => lander.step(0.01, command, wind, landerState)),
      detectorFrameNs: nsPerCall(50_000, (i) => detector.observe(i / 30, pose, carrier)),
    };
  },
};
