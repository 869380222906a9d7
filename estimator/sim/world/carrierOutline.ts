// The image of the carrier's true 3-D outline: the 8 corners of the deck rectangle and of its
// footprint bodyHeight below, projected through the true camera (mount, intrinsics,
// distortion) and boxed. Without distortion the box of the projected corners is exactly the
// box of the silhouette (perspective maps the convex hull onto the hull of the images); with
// distortion the outline's edges bow slightly and the corner box is a close approximation.
// Allocation-free: the class owns its scratch arrays.
import type { Box } from '../../camera/Box.js';
import { type PinholeCamera, pinholeCamera } from '../../camera/PinholeCamera.js';
import { UndistortionError } from '../../camera/distortion.js';
import { normalizedFromPixel, project } from '../../camera/project.js';
import { cameraFromBody, cameraPointFromWorldVector } from '../../frames/cameraFromBody.js';
import { rotationMatrixFromQuat } from '../../frames/rotationMatrixFromQuat.js';
import type { CameraMount, Distortion } from '../Scenario.js';
import type { CarrierState } from './carrierPath.js';

/** Outline dimensions (m), as in CarrierSpec. */
export interface CarrierDimensions {
  deckLength: number;
  deckWidth: number;
  bodyHeight: number;
}

/** A camera with its mount: the FilterCamera shape (here the TRUE one, misalignment included). */
export interface MountedCamera extends PinholeCamera {
  mount: CameraMount;
}

/** Where the lander is: world ENU position (m) and attitude q_wb. */
export interface LanderPose {
  position: ArrayLike<number>;
  qWorldBody: ArrayLike<number>;
}

/** Why the outline has no usable image. 'outside-field': a corner beyond the lens's field, where the distortion polynomial folds back. */
export type OutlineProblem = 'behind-camera' | 'outside-field' | null;

const MIN_DEPTH = 0.01; // m: corners nearer the camera plane than this are treated as behind it
const FIELD_MARGIN = 1.5; // corners may lie up to 1.5x the image corners' normalized radius

export class CarrierOutline {
  readonly camera: MountedCamera;
  readonly dims: CarrierDimensions;
  private readonly Rcb: Float64Array;
  private readonly offset: Float64Array;
  private readonly maxRadius2: number;
  private readonly Rwb = new Float64Array(9);
  private readonly Rwd = new Float64Array(9);
  private readonly r = new Float64Array(3);
  private readonly pCam = new Float64Array(3);
  private readonly pixel = new Float64Array(2);
  /** Depth (m, camera z) of the deck centre at the last call. */
  centreDepth = NaN;

  constructor(input: MountedCamera, dims: CarrierDimensions) {
    const camera = pinholeCamera(input); // the one camera shape (PinholeCamera.ts)
    this.camera = camera;
    this.dims = dims;
    this.Rcb = cameraFromBody(camera.mount);
    this.offset = Float64Array.from(camera.mount.offset);
    // Usable field: 1.5x the normalized radius of the farthest image corner, and never past the
    // radius where the radial polynomial folds back (d/dr [r (1 + k1 r^2 + k2 r^4 + k3 r^6)] = 0).
    const fold = foldRadius(camera.distortion);
    let r2 = 0;
    for (const [u, v] of [[0, 0], [camera.width, 0], [0, camera.height], [camera.width, camera.height]] as const) {
      try {
        const n = normalizedFromPixel(camera, u, v);
        r2 = Math.max(r2, n[0]! * n[0]! + n[1]! * n[1]!);
      } catch (error) {
        if (!(error instanceof UndistortionError)) throw error;
        r2 = Infinity; // the image corner lies beyond the fold
      }
    }
    const field = Math.min(Math.sqrt(r2) * FIELD_MARGIN, fold);
    this.maxRadius2 = field * field;
  }

  /**
   * Bounding box (px, unclipped) of the projected outline into out. Corner c in deck axes
   * (+-L/2, +-W/2, 0 or -bodyHeight): p = p_deck + R_wd c, p_cam = R_cb (R_wb^T (p - p_lander) - t_b).
   */
  box(lander: LanderPose, carrier: CarrierState, out: Box): OutlineProblem {
    const { Rwb, Rwd, r, pCam, pixel, camera } = this;
    rotationMatrixFromQuat(lander.qWorldBody, Rwb);
    rotationMatrixFromQuat(carrier.qWorldDeck, Rwd);
    const halfL = this.dims.deckLength / 2, halfW = this.dims.deckWidth / 2, depth = this.dims.bodyHeight;
    for (let k = 0; k < 3; k++) r[k] = carrier.position[k]! - lander.position[k]!;
    cameraPointFromWorldVector(Rwb, this.Rcb, this.offset, r, pCam);
    this.centreDepth = pCam[2]!;
    out.xMin = Infinity; out.yMin = Infinity; out.xMax = -Infinity; out.yMax = -Infinity;
    let problem: OutlineProblem = null;
    for (let corner = 0; corner < 8; corner++) {
      const cx = corner & 1 ? halfL : -halfL;
      const cy = corner & 2 ? halfW : -halfW;
      const cz = corner & 4 ? -depth : 0;
      if (corner >= 4 && depth === 0) break; // flat outline: the footprint coincides with the deck
      for (let k = 0; k < 3; k++) {
        r[k] = carrier.position[k]! + Rwd[3 * k]! * cx + Rwd[3 * k + 1]! * cy + Rwd[3 * k + 2]! * cz - lander.position[k]!;
      }
      cameraPointFromWorldVector(Rwb, this.Rcb, this.offset, r, pCam);
      const Z = pCam[2]!;
      if (!(Z > MIN_DEPTH)) return 'behind-camera';
      const x = pCam[0]! / Z, y = pCam[1]! / Z;
      if (x * x + y * y > this.maxRadius2) problem = 'outside-field';
      project(camera, pCam, pixel);
      out.xMin = Math.min(out.xMin, pixel[0]!);
      out.xMax = Math.max(out.xMax, pixel[0]!);
      out.yMin = Math.min(out.yMin, pixel[1]!);
      out.yMax = Math.max(out.yMax, pixel[1]!);
    }
    return problem;
  }
}

/** Smallest normalized radius (<= 10) where 1 + 3 k1 r^2 + 5 k2 r^4 + 7 k3 r^6 reaches 0; Infinity if none. */
export function foldRadius(d: Distortion): number {
  for (let r = 0; r <= 10; r += 0.001) {
    const r2 = r * r;
    if (1 + r2 * (3 * d.k1 + r2 * (5 * d.k2 + r2 * 7 * d.k3)) <= 0) return r;
  }
  return Infinity;
}
