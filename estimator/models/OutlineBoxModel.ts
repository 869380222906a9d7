// The detector's box predicted from the deck outline: the deck's corners (and its footprint
// bodyHeight below, when the carrier has a body) placed at the estimated relative position with
// the deck's heading, projected through the believed camera (mount, intrinsics, distortion) at
// the lander's estimated attitude, then boxed as the detector boxes the true outline. A tilted,
// body-fixed camera sees the flat deck obliquely: its box centre moves along travel and the box
// grows, which the centre-projection model cannot show. Allocation-free (preallocated arrays).
//
// Corner k in deck axes c_k = (±L/2, ±W/2, 0 or -b); deck level, heading ψ:
//   d_k = R_z(ψ) c_k,   p_k = M (r + d_k) - o,   M = R_cb R_wbᵀ,  o = R_cb t_b,   (u_k, v_k) = π(p_k)
// Box edges: xMin = u_a, xMax = u_b, yMin = v_c, yMax = v_d (a..d the active corners), and
//   centre-size          h = [(u_a + u_b)/2, (v_c + v_d)/2, sqrt(w h)],  w = u_b - u_a, h = v_d - v_c
//   centre-width-height  h = [(u_a + u_b)/2, (v_c + v_d)/2, w, h]
// Jacobian over [r, v_c] (6 columns), chain rule through the active corner of each edge:
//   ∂(u_k, v_k)/∂r = J_k M,   ∂(u_k, v_k)/∂ψ = J_k M ∂d_k/∂ψ,  ∂d_k/∂ψ = (-sψ cx - cψ cy, cψ cx - sψ cy, 0)
//   ∂s = (h ∂w + w ∂h) / (2 s)
// Deck-scale state s (when the filter carries it, at x[scaleIndex]): the true outline is the
// assumed one times (1 + s), so c_k ← (1 + s) c_k and d_k = (1 + s) R_z(ψ) c_k, giving one more
// column  ∂(u_k, v_k)/∂s = J_k M R_z(ψ) c_k  (the corner offset before scaling), through the same
// box rows as r and ψ. H is then m x 7 over [r, v_c, s].
// Pointing-bias states δ = (δx, δy) (when the filter carries them, at x[pointingIndex]): the camera
// really looks δ (rad, small angles about the camera's x and y axes) off where the filter believes
// (attitude and gyro bias, mount misalignment), so every camera point is turned by δ to first order:
//   p'_k = (I + [δ]×) p_k,  δ = (δx, δy, 0)
// and H gains, through the same box rows, ∂p'_k/∂δx = (0, -p_kz, p_ky), ∂p'_k/∂δy = (p_kz, 0, -p_kx)
// (p_k before the turn); the r column becomes J_k (I + [δ]×) M. H is m x 8 over [r, v_c, δ], or
// m x 9 over [r, v_c, δ, s] with both.
// Heading from the carrier velocity estimate (the deck is taken to point along travel):
//   ψ = atan2(v_cy, v_cx),  ∂ψ/∂v_c = (-v_cy, v_cx, 0) / (v_cx² + v_cy²)
// Below minSpeed the direction of v_c is mostly noise (σ_ψ ≈ σ_v / |v_c|): ψ is then the
// lander's own yaw (a lander that yaws along the carrier, as the simulator's default yaw policy
// does, knows the deck's heading that way) and ∂ψ/∂v_c = 0. Either way h is a function of the
// state and the attitude alone, so a delayed box replays exactly.
import type { PinholeCamera } from '../camera/PinholeCamera.js';
import { project, projectJacobian } from '../camera/project.js';

/** The deck outline the filter believes in (m): length along travel, width, body below the deck. */
export interface DeckOutline {
  deckLength: number;
  deckWidth: number;
  bodyHeight: number;
}

/** The box terms measured: centre and sqrt(width height), or centre, width and height. */
export type BoxTerms = 'centre-size' | 'centre-width-height';

const MIN_DEPTH = 1e-3; // m: a corner closer than this has no meaningful image

export class OutlineBoxModel {
  /** Measurement dimension m: 3 (centre-size) or 4 (centre-width-height). */
  readonly m: number;
  /** Number of outline corners: 4 (flat deck) or 8 (deck and footprint). */
  readonly corners: number;
  /** Heading ψ (rad from East, CCW) used by the last evaluation, and whether it came from v_c. */
  heading = Number.NaN;
  headingFromVelocity = false;
  private readonly deckCorners: Float64Array;
  private readonly pCam = new Float64Array(3);
  private readonly pixel = new Float64Array(2);
  private readonly Jp = new Float64Array(6);
  private readonly work = new Float64Array(4);
  /** Per corner: pixel (2), ∂pixel/∂r (2x3), ∂pixel/∂ψ (2). */
  private readonly uv: Float64Array;
  private readonly G: Float64Array;
  private readonly g: Float64Array;
  /** Per corner ∂pixel/∂s (2), deck-scale state only. */
  private readonly gs: Float64Array;
  /** Per corner ∂pixel/∂δx (2) and ∂pixel/∂δy (2), pointing states only. */
  private readonly gp: Float64Array;
  /** (I + [δ]×) M and (I + [δ]×) o of the evaluation (pointing states only). */
  private readonly Mturned = new Float64Array(9);
  private readonly oTurned = new Float64Array(3);
  /** Rows of the box terms over [r (3), ψ (1)] (and s): m x rowWidth. */
  private readonly rows: Float64Array;
  private readonly rowWidth: number;
  /** Columns of H: 6 over [r, v_c], then 2 for δ (pointing states), then 1 for s (deck-scale state). */
  readonly columns: number;

  /**
   * @param scaleIndex index of the deck-scale state s in x, or -1 (default) when the filter carries none
   * @param pointingIndex index of δx (δy follows) in x, or -1 (default) when the filter carries no pointing states
   */
  constructor(readonly camera: PinholeCamera, readonly outline: DeckOutline, readonly terms: BoxTerms, readonly minSpeed: number, readonly scaleIndex = -1, readonly pointingIndex = -1) {
    for (const key of ['deckLength', 'deckWidth'] as const) {
      if (!(outline[key] > 0) || !Number.isFinite(outline[key])) throw new RangeError(`outline.${key} must be a positive number of metres, got ${outline[key]}`);
    }
    if (!(outline.bodyHeight >= 0) || !Number.isFinite(outline.bodyHeight)) throw new RangeError(`outline.bodyHeight must be a non-negative number of metres, got ${outline.bodyHeight}`);
    this.m = terms === 'centre-width-height' ? 4 : 3;
    this.corners = outline.bodyHeight > 0 ? 8 : 4;
    this.deckCorners = new Float64Array(3 * this.corners);
    for (let k = 0; k < this.corners; k++) {
      this.deckCorners[3 * k] = k & 1 ? outline.deckLength / 2 : -outline.deckLength / 2;
      this.deckCorners[3 * k + 1] = k & 2 ? outline.deckWidth / 2 : -outline.deckWidth / 2;
      this.deckCorners[3 * k + 2] = k & 4 ? -outline.bodyHeight : 0;
    }
    this.uv = new Float64Array(2 * this.corners);
    this.G = new Float64Array(6 * this.corners);
    this.g = new Float64Array(2 * this.corners);
    this.gs = new Float64Array(2 * this.corners);
    this.gp = new Float64Array(4 * this.corners);
    const extra = (pointingIndex >= 0 ? 2 : 0) + (scaleIndex >= 0 ? 1 : 0);
    this.rowWidth = 4 + extra;
    this.columns = 6 + extra;
    this.rows = new Float64Array(this.rowWidth * this.m);
  }

  /**
   * h(x) into hOut (m) and H over [r, v_c] into H (m x 6, row-major; then the columns of δ and s
   * when the filter carries them: m x columns).
   * @param x filter state (r at 0..2, v_c at 3..5, s at scaleIndex)
   * @param M R_cb R_wbᵀ (world -> camera), o = R_cb t_b, Rwb the attitude (its yaw is the heading below minSpeed)
   * @returns false when a corner is behind the camera
   */
  evaluate(x: ArrayLike<number>, M: Float64Array, o: Float64Array, Rwb: Float64Array, hOut: Float64Array, H: Float64Array): boolean {
    const vx = x[3]!, vy = x[4]!, speed2 = vx * vx + vy * vy;
    let dpsiX = 0, dpsiY = 0;
    if (speed2 >= this.minSpeed * this.minSpeed && speed2 > 0) {
      this.heading = Math.atan2(vy, vx);
      this.headingFromVelocity = true;
      // ∂ψ/∂v_c = (-v_cy, v_cx, 0) / |v_c|²
      dpsiX = -vy / speed2;
      dpsiY = vx / speed2;
    } else {
      // the lander's yaw: its body x axis in the world, R_wb e_x = (R00, R10)
      this.heading = Math.atan2(Rwb[3]!, Rwb[0]!);
      this.headingFromVelocity = false;
    }
    const c = Math.cos(this.heading), s = Math.sin(this.heading);
    const { pCam, pixel, Jp, work, uv, G, g, gs, gp, deckCorners, camera } = this;
    const pointing = this.pointingIndex >= 0;
    const Mn = M, on = o; // the believed (nominal) camera: p_k before the turn by δ
    let dx = 0, dy = 0;
    if (pointing) {
      // (I + [δ]×) with δ = (δx, δy, 0): rows (1, 0, δy), (0, 1, -δx), (-δy, δx, 1)
      dx = x[this.pointingIndex]!;
      dy = x[this.pointingIndex + 1]!;
      const A = this.Mturned, b = this.oTurned;
      for (let j = 0; j < 3; j++) {
        A[j] = Mn[j]! + dy * Mn[6 + j]!;
        A[3 + j] = Mn[3 + j]! - dx * Mn[6 + j]!;
        A[6 + j] = Mn[6 + j]! - dy * Mn[j]! + dx * Mn[3 + j]!;
      }
      b[0] = on[0]! + dy * on[2]!;
      b[1] = on[1]! - dx * on[2]!;
      b[2] = on[2]! - dy * on[0]! + dx * on[1]!;
      M = A;
      o = b;
    }
    const r0 = x[0]!, r1 = x[1]!, r2 = x[2]!;
    const scaled = this.scaleIndex >= 0;
    const k1 = scaled ? 1 + x[this.scaleIndex]! : 1;
    if (!(k1 > 0)) return false; // a deck of no size (s <= -1) has no image
    let a = 0, b = 0, lo = 0, hi = 0;
    for (let k = 0; k < this.corners; k++) {
      // c_k (1 + s); the product is exact when the filter has no scale state (k1 = 1)
      const cx = deckCorners[3 * k]! * k1, cy = deckCorners[3 * k + 1]! * k1, cz = deckCorners[3 * k + 2]! * k1;
      // d_k = R_z(ψ) c_k and ∂d_k/∂ψ
      const d0 = c * cx - s * cy, d1 = s * cx + c * cy;
      const e0 = -s * cx - c * cy, e1 = c * cx - s * cy;
      const w0 = r0 + d0, w1 = r1 + d1, w2 = r2 + cz;
      for (let i = 0; i < 3; i++) pCam[i] = M[3 * i]! * w0 + M[3 * i + 1]! * w1 + M[3 * i + 2]! * w2 - o[i]!;
      if (!(pCam[2]! > MIN_DEPTH)) return false;
      project(camera, pCam, pixel);
      projectJacobian(camera, pCam, Jp, work);
      uv[2 * k] = pixel[0]!;
      uv[2 * k + 1] = pixel[1]!;
      for (let row = 0; row < 2; row++) {
        // G = J_k M (2x3), g = G ∂d_k/∂ψ
        const j0 = Jp[3 * row]!, j1 = Jp[3 * row + 1]!, j2 = Jp[3 * row + 2]!;
        const m0 = j0 * M[0]! + j1 * M[3]! + j2 * M[6]!;
        const m1 = j0 * M[1]! + j1 * M[4]! + j2 * M[7]!;
        const m2 = j0 * M[2]! + j1 * M[5]! + j2 * M[8]!;
        G[6 * k + 3 * row] = m0;
        G[6 * k + 3 * row + 1] = m1;
        G[6 * k + 3 * row + 2] = m2;
        g[2 * k + row] = m0 * e0 + m1 * e1;
        // ∂/∂s = G R_z(ψ) c_k = G d_k / (1 + s)
        if (scaled) gs[2 * k + row] = (m0 * d0 + m1 * d1 + m2 * cz) / k1;
      }
      if (pointing) {
        // p_k before the turn, then ∂pixel/∂δ = J_k ∂p'_k/∂δ
        const q0 = Mn[0]! * w0 + Mn[1]! * w1 + Mn[2]! * w2 - on[0]!;
        const q1 = Mn[3]! * w0 + Mn[4]! * w1 + Mn[5]! * w2 - on[1]!;
        const q2 = Mn[6]! * w0 + Mn[7]! * w1 + Mn[8]! * w2 - on[2]!;
        for (let row = 0; row < 2; row++) {
          const j0 = Jp[3 * row]!, j1 = Jp[3 * row + 1]!, j2 = Jp[3 * row + 2]!;
          gp[4 * k + row] = -j1 * q2 + j2 * q1; // (0, -p_z, p_y)
          gp[4 * k + 2 + row] = j0 * q2 - j2 * q0; // (p_z, 0, -p_x)
        }
      }
      if (uv[2 * k]! < uv[2 * a]!) a = k;
      if (uv[2 * k]! > uv[2 * b]!) b = k;
      if (uv[2 * k + 1]! < uv[2 * lo + 1]!) lo = k;
      if (uv[2 * k + 1]! > uv[2 * hi + 1]!) hi = k;
    }
    const width = uv[2 * b]! - uv[2 * a]!, height = uv[2 * hi + 1]! - uv[2 * lo + 1]!;
    hOut[0] = (uv[2 * a]! + uv[2 * b]!) / 2;
    hOut[1] = (uv[2 * lo + 1]! + uv[2 * hi + 1]!) / 2;
    const R = this.rows;
    for (let j = 0; j < 3; j++) {
      const du = (G[6 * a + j]! + G[6 * b + j]!) / 2;
      const dv = (G[6 * lo + 3 + j]! + G[6 * hi + 3 + j]!) / 2;
      const dw = G[6 * b + j]! - G[6 * a + j]!;
      const dh = G[6 * hi + 3 + j]! - G[6 * lo + 3 + j]!;
      this.boxRows(j, du, dv, dw, dh, width, height);
    }
    this.boxRows(3, (g[2 * a]! + g[2 * b]!) / 2, (g[2 * lo + 1]! + g[2 * hi + 1]!) / 2, g[2 * b]! - g[2 * a]!, g[2 * hi + 1]! - g[2 * lo + 1]!, width, height);
    if (pointing) {
      for (let e = 0; e < 2; e++) {
        const o2 = 2 * e;
        this.boxRows(4 + e, (gp[4 * a + o2]! + gp[4 * b + o2]!) / 2, (gp[4 * lo + o2 + 1]! + gp[4 * hi + o2 + 1]!) / 2, gp[4 * b + o2]! - gp[4 * a + o2]!, gp[4 * hi + o2 + 1]! - gp[4 * lo + o2 + 1]!, width, height);
      }
    }
    const sRow = pointing ? 6 : 4;
    if (scaled) this.boxRows(sRow, (gs[2 * a]! + gs[2 * b]!) / 2, (gs[2 * lo + 1]! + gs[2 * hi + 1]!) / 2, gs[2 * b]! - gs[2 * a]!, gs[2 * hi + 1]! - gs[2 * lo + 1]!, width, height);
    if (this.m === 4) {
      hOut[2] = width;
      hOut[3] = height;
    } else {
      hOut[2] = Math.sqrt(width * height);
    }
    const c7 = this.columns, w = this.rowWidth;
    for (let i = 0; i < this.m; i++) {
      H[c7 * i] = R[w * i]!;
      H[c7 * i + 1] = R[w * i + 1]!;
      H[c7 * i + 2] = R[w * i + 2]!;
      // ∂/∂v_c = ∂/∂ψ · ∂ψ/∂v_c
      H[c7 * i + 3] = R[w * i + 3]! * dpsiX;
      H[c7 * i + 4] = R[w * i + 3]! * dpsiY;
      H[c7 * i + 5] = 0;
      if (pointing) {
        H[c7 * i + 6] = R[w * i + 4]!;
        H[c7 * i + 7] = R[w * i + 5]!;
      }
      if (scaled) H[c7 * i + c7 - 1] = R[w * i + sRow]!;
    }
    return true;
  }

  /** Column j of the box-term rows from the edge derivatives (du, dv, dw, dh). */
  private boxRows(j: number, du: number, dv: number, dw: number, dh: number, width: number, height: number): void {
    const R = this.rows, w = this.rowWidth;
    R[j] = du;
    R[w + j] = dv;
    if (this.m === 4) {
      R[2 * w + j] = dw;
      R[3 * w + j] = dh;
    } else {
      // s = sqrt(w h): ∂s = (h ∂w + w ∂h) / (2 s)
      R[2 * w + j] = (height * dw + width * dh) / (2 * Math.sqrt(width * height));
    }
  }
}
