// The detector, truth side: per camera frame, the box of the carrier's true outline, then
// every impairment a real detector adds — centre and size noise, i.i.d. and bursty loss,
// edge loss, Poisson false boxes, latency with jitter. observe() allocates nothing: frames
// come from a preallocated ring sized so each stays valid well past its arrival (frameRingSize).
import type { Box } from '../../camera/Box.js';
import { RandomStream } from '../../random/RandomStream.js';
import type { DetectorSpec } from '../Scenario.js';
import type { CarrierState } from './carrierPath.js';
import { CarrierOutline, type CarrierDimensions, type LanderPose, type MountedCamera } from './carrierOutline.js';
import { DetectorScript } from './detectorScript.js';
import { GilbertElliott } from './gilbertElliott.js';
import { poissonCount } from './poissonCount.js';

/** Why the carrier gave no box in a frame. */
export type DetectionLoss = 'behind-camera' | 'outside-image' | 'edge' | 'dropout' | 'burst' | 'scripted' | null;

export interface DetectorTruth {
  /** The true outline lies in the image, inside the edge margin. */
  visible: boolean;
  loss: DetectionLoss;
  /** Noise-free box of the true outline, clipped to the image (NaN corners when behind the camera). */
  box: Box;
  /** Depth of the deck centre along the optical axis (m). */
  depth: number;
}

export interface DetectorFrame {
  /** True capture time (s, simulation clock) and arrival time at the filter (s, >= capture). */
  captureTime: number;
  arrivalTime: number;
  /** The reported box (px, pixel-corner convention of camera/Box.ts). */
  box: Box;
  /** A spurious detection, not the carrier. */
  falseBox: boolean;
  /** The carrier's truth in this frame (copied; identical for all boxes of one frame). */
  truth: DetectorTruth;
}

/** Smallest ring of frames; it grows with rate x (latency + 6 jitter + 1 s) x (1 + false boxes per frame). */
export const MIN_FRAME_RING = 256;
/** False boxes: side uniform in [FALSE_BOX_MIN_SIDE px, 0.25 min(width, height)], aspect in [1/2, 2]. */
export const FALSE_BOX_MIN_SIDE = 8;
const MIN_SIZE_FACTOR = 0.05; // size noise never shrinks a box below 5 % (nor flips it)

function emptyBox(): Box {
  return { xMin: NaN, yMin: NaN, xMax: NaN, yMax: NaN };
}

function createFrame(): DetectorFrame {
  return { captureTime: 0, arrivalTime: 0, box: emptyBox(), falseBox: false, truth: { visible: false, loss: null, box: emptyBox(), depth: NaN } };
}

function copyBox(from: Box, to: Box): void {
  to.xMin = from.xMin; to.yMin = from.yMin; to.xMax = from.xMax; to.yMax = from.yMax;
}

export class Detector {
  readonly spec: DetectorSpec;
  readonly camera: MountedCamera;
  /** Time between captures (s) = 1 / rate. */
  readonly frameInterval: number;
  /** Truth of the last observed frame (whether or not a box came out). */
  readonly lastTruth: DetectorTruth = createFrame().truth;
  /** False boxes of the last observed frame: falseFrames[0 .. falseFrameCount - 1]. */
  falseFrameCount = 0;
  readonly falseFrames: DetectorFrame[] = [];
  /** Number of false boxes generated so far. */
  falseBoxTotal = 0;

  private readonly outline: CarrierOutline;
  private readonly ring: DetectorFrame[] = [];
  /**
   * Frames in the ring: a returned frame is overwritten only after this many more detections,
   * which covers at least latency + 6 jitter + 1 s of captures with twice the mean false boxes.
   */
  readonly frameRingSize: number;
  private ringIndex = 0;
  private lastArrival = -Infinity;
  private readonly noise: RandomStream;
  private readonly dropout: RandomStream;
  private readonly latency: RandomStream;
  private readonly clutter: RandomStream;
  private readonly burst: GilbertElliott | null;
  /** Scripted events (detector.script), null when there are none. */
  private readonly script: DetectorScript | null;
  private readonly raw: Box = emptyBox();

  /**
   * camera: the TRUE camera (intrinsics, distortion, mount with misalignment). The stream seeds
   * one child stream per impairment, so changing one impairment leaves the others' draws alone.
   */
  constructor(camera: MountedCamera, spec: DetectorSpec, dims: CarrierDimensions, stream: RandomStream) {
    if (!(spec.rate > 0)) throw new RangeError(`detector.rate must be positive, got ${spec.rate}`);
    this.spec = spec;
    this.outline = new CarrierOutline(camera, dims);
    this.camera = this.outline.camera; // copied into the one camera shape (PinholeCamera.ts)
    this.frameInterval = 1 / spec.rate;
    this.noise = RandomStream.childOf(stream);
    this.dropout = RandomStream.childOf(stream);
    this.latency = RandomStream.childOf(stream);
    this.clutter = RandomStream.childOf(stream);
    const burstStream = RandomStream.childOf(stream);
    this.burst = spec.burst ? new GilbertElliott(spec.burst.enter, spec.burst.exit, burstStream) : null;
    this.script = spec.script && spec.script.length > 0 ? new DetectorScript(spec.script) : null;
    const perFrame = 1 + 2 * spec.falseBoxRate * this.frameInterval + 1;
    const window = spec.rate * (Math.max(spec.latency, this.script ? this.script.maxLatency : 0) + 6 * spec.latencyJitter + 1);
    this.frameRingSize = Math.max(MIN_FRAME_RING, Math.ceil(window * perFrame) + 64);
    for (let i = 0; i < this.frameRingSize; i++) this.ring.push(createFrame());
  }

  /** Capture time of frame k (s): k / rate. */
  captureTime(k: number): number {
    return k * this.frameInterval;
  }

  private nextFrame(): DetectorFrame {
    const frame = this.ring[this.ringIndex]!;
    this.ringIndex = (this.ringIndex + 1) % this.frameRingSize;
    return frame;
  }

  /**
   * One camera frame captured at tCapture. Returns the carrier's detection (or null when it is
   * lost) and leaves this frame's false boxes in falseFrames[0 .. falseFrameCount - 1]; all
   * boxes of a frame share its arrival time
   *   arrival = max(tCapture + max(0, latency + jitter n), previous arrival)   (order preserved).
   * Random draws per frame are the same whatever happens to the box, so runs stay comparable.
   */
  observe(tCapture: number, lander: LanderPose, carrier: CarrierState): DetectorFrame | null {
    const { spec, camera, raw } = this;
    const truth = this.lastTruth;
    const W = camera.width, H = camera.height;
    // truth: the outline's box, clipped
    const problem = this.outline.box(lander, carrier, raw);
    truth.depth = this.outline.centreDepth;
    let loss: DetectionLoss = null;
    if (problem === 'behind-camera') {
      loss = 'behind-camera';
      truth.box.xMin = truth.box.yMin = truth.box.xMax = truth.box.yMax = NaN;
    } else {
      truth.box.xMin = Math.max(raw.xMin, 0);
      truth.box.yMin = Math.max(raw.yMin, 0);
      truth.box.xMax = Math.min(raw.xMax, W);
      truth.box.yMax = Math.min(raw.yMax, H);
      const m = spec.edgeMargin;
      if (problem === 'outside-field' || !(truth.box.xMax > truth.box.xMin && truth.box.yMax > truth.box.yMin)) loss = 'outside-image';
      else if (raw.xMin < m || raw.yMin < m || raw.xMax > W - m || raw.yMax > H - m) loss = 'edge';
    }
    // impairment draws, in a fixed order every frame
    const du = this.noise.gaussian(), dv = this.noise.gaussian(), ds = this.noise.gaussian();
    const dropped = this.dropout.uniform() < spec.dropout;
    const burstLost = this.burst ? this.burst.lost() : false;
    let delay = Math.max(0, spec.latency + (spec.latencyJitter > 0 ? spec.latencyJitter * this.latency.gaussian() : 0));
    const script = this.script;
    if (script !== null) {
      const scripted = script.latencyAt(tCapture);
      if (scripted === scripted) delay = scripted; // not NaN
    }
    if (loss === null && dropped) loss = 'dropout';
    if (loss === null && burstLost) loss = 'burst';
    if (loss === null && script !== null && script.lostAt(tCapture)) loss = 'scripted';
    truth.visible = loss === null || loss === 'dropout' || loss === 'burst' || loss === 'scripted';
    truth.loss = loss;
    const arrival = Math.max(tCapture + delay, this.lastArrival);
    this.lastArrival = arrival;

    let detection: DetectorFrame | null = null;
    if (loss === null) {
      // centre noise (px) and fractional size noise on the clipped true box
      let u = (truth.box.xMin + truth.box.xMax) / 2 + spec.pixelNoise * du;
      let v = (truth.box.yMin + truth.box.yMax) / 2 + spec.pixelNoise * dv;
      // scripted confusion: the carrier's box moved half an image away (wrapped), reported as if it were the carrier
      const confused = script !== null && script.falseBoxAt(tCapture);
      if (confused) {
        u = (u + W / 2) % W;
        v = (v + H / 2) % H;
      }
      const factor = Math.max(MIN_SIZE_FACTOR, 1 + spec.sizeNoise * ds);
      const halfW = ((truth.box.xMax - truth.box.xMin) * factor) / 2;
      const halfH = ((truth.box.yMax - truth.box.yMin) * factor) / 2;
      const frame = this.nextFrame();
      frame.box.xMin = Math.max(u - halfW, 0);
      frame.box.yMin = Math.max(v - halfH, 0);
      frame.box.xMax = Math.min(u + halfW, W);
      frame.box.yMax = Math.min(v + halfH, H);
      if (frame.box.xMax > frame.box.xMin && frame.box.yMax > frame.box.yMin) {
        this.fill(frame, tCapture, arrival, confused);
        if (confused) {
          this.falseBoxTotal++;
          truth.loss = 'scripted';
        }
        detection = frame;
      } else {
        truth.loss = 'edge'; // noise pushed the box off the image
      }
    }
    // false boxes: Poisson count with mean rate / frame rate, uniform in the image
    const count = poissonCount(this.clutter, spec.falseBoxRate * this.frameInterval);
    this.falseFrameCount = count;
    this.falseBoxTotal += count;
    const maxSide = 0.25 * Math.min(W, H);
    for (let i = 0; i < count; i++) {
      const side = FALSE_BOX_MIN_SIDE + (maxSide - FALSE_BOX_MIN_SIDE) * this.clutter.uniform();
      const aspect = Math.exp(Math.LN2 * (2 * this.clutter.uniform() - 1));
      const w = Math.min(side * Math.sqrt(aspect), W), h = Math.min(side / Math.sqrt(aspect), H);
      const x = (W - w) * this.clutter.uniform(), y = (H - h) * this.clutter.uniform();
      const frame = this.nextFrame();
      frame.box.xMin = x; frame.box.yMin = y; frame.box.xMax = x + w; frame.box.yMax = y + h;
      this.fill(frame, tCapture, arrival, true);
      this.falseFrames[i] = frame;
    }
    return detection;
  }

  private fill(frame: DetectorFrame, captureTime: number, arrivalTime: number, falseBox: boolean): void {
    frame.captureTime = captureTime;
    frame.arrivalTime = arrivalTime;
    frame.falseBox = falseBox;
    frame.truth.visible = this.lastTruth.visible;
    frame.truth.loss = this.lastTruth.loss;
    frame.truth.depth = this.lastTruth.depth;
    copyBox(this.lastTruth.box, frame.truth.box);
  }
}
