// Will the detector lose the carrier at the image edge now? The lander predicts the image of
// the deck outline (deck and the body below it, known dimensions) from what it believes: its
// relative-position estimate, its attitude estimate, the carrier's estimated heading and the
// camera as it believes it is. When the predicted outline reaches the edge margin, boxes stop
// because the target overflows the image, not because it is lost: the supervisor then neither
// aborts for a lost target nor waits for boxes. A fixed multiple of the deck length (the
// previous rule) said "blind" too low when the height estimate was unbiased, and the lander
// aborted with the deck filling the image. Allocation-free per call.
import type { Box } from '../camera/Box.js';
import type { CarrierState } from './world/carrierPath.js';
import { createCarrierState } from './world/carrierPath.js';
import { CarrierOutline, type CarrierDimensions, type MountedCamera } from './world/carrierOutline.js';

/** Extra room (fraction of the image's smaller side) for estimate error: say "blind" a little early rather than abort with the deck in view. */
export const FORECAST_MARGIN = 0.03;

export class OutlineForecast {
  private readonly outline: CarrierOutline;
  private readonly carrier: CarrierState = createCarrierState();
  private readonly pose = { position: new Float64Array(3), qWorldBody: Float64Array.of(1, 0, 0, 0) };
  private readonly box: Box = { xMin: 0, yMin: 0, xMax: 0, yMax: 0 };
  private readonly left: number;
  private readonly top: number;
  private readonly right: number;
  private readonly bottom: number;

  /**
   * @param camera the camera as the lander believes it (intrinsics, distortion, mount)
   * @param edgeMargin the detector's edge margin (px): an outline closer than this is lost
   */
  constructor(camera: MountedCamera, dims: CarrierDimensions, edgeMargin: number) {
    this.outline = new CarrierOutline(camera, dims);
    const m = edgeMargin + FORECAST_MARGIN * Math.min(camera.width, camera.height);
    this.left = m;
    this.top = m;
    this.right = camera.width - m;
    this.bottom = camera.height - m;
  }

  /**
   * True when the predicted outline reaches the margin (or lies partly behind the camera or
   * beyond the lens's field), seen from relative position r = p_carrier - p_lander (m, ENU),
   * attitude q_wb, with the deck's heading (unit vector cos, sin; the deck level).
   */
  leaving(r: ArrayLike<number>, qWorldBody: ArrayLike<number>, headingCos: number, headingSin: number): boolean {
    const c = this.carrier;
    for (let k = 0; k < 3; k++) c.position[k] = r[k]!;
    // deck yaw ψ about up: q = [cos ψ/2, 0, 0, sin ψ/2] from the heading's unit vector (half-angle identities)
    const halfCos = Math.sqrt(Math.max(0, (1 + headingCos) / 2));
    const halfSin = Math.sqrt(Math.max(0, (1 - headingCos) / 2)) * (headingSin < 0 ? -1 : 1);
    c.qWorldDeck[0] = halfCos; c.qWorldDeck[1] = 0; c.qWorldDeck[2] = 0; c.qWorldDeck[3] = halfSin;
    for (let k = 0; k < 4; k++) this.pose.qWorldBody[k] = qWorldBody[k]!;
    const problem = this.outline.box(this.pose, c, this.box);
    if (problem !== null) return true;
    const b = this.box;
    return b.xMin < this.left || b.yMin < this.top || b.xMax > this.right || b.yMax > this.bottom;
  }
}
