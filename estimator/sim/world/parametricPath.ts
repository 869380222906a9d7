// Closed smooth curves p(theta), theta in [0, 2 pi), re-parametrised by arc length so a
// carrier moves along them at the commanded speed: ellipse and figure-eight.
// Evaluation is allocation-free: theta(s) is a cubic Hermite interpolant on a table of exact
// (s, theta, dtheta/ds) knots built once; the tangent is the curve's own unit tangent, so the
// reported speed is exact and the position agrees with it to ~1e-9 m.
import type { PlanarPath, PlanarPoint } from './PlanarPath.js';

/** A point of a closed curve and its first two derivatives with respect to theta. */
export interface CurveSample {
  x: number;
  y: number;
  dx: number;
  dy: number;
  ddx: number;
  ddy: number;
}

/** A closed curve: all of p, p', p'' at theta in one call (the trigonometry is shared). */
export interface ClosedCurve {
  at(theta: number, out: CurveSample): CurveSample;
}

// 8-point Gauss-Legendre nodes and weights on [-1, 1] (Abramowitz & Stegun, table 25.4).
const GL_NODES = [
  -0.9602898564975363, -0.7966664774136267, -0.525532409916329, -0.1834346424956498,
  0.1834346424956498, 0.525532409916329, 0.7966664774136267, 0.9602898564975363,
];
const GL_WEIGHTS = [
  0.1012285362903763, 0.2223810344533745, 0.3137066458778873, 0.362683783378362,
  0.362683783378362, 0.3137066458778873, 0.2223810344533745, 0.1012285362903763,
];

const TABLE_INTERVALS = 2048;

export class ParametricPath implements PlanarPath {
  readonly closed = true;
  readonly length: number;
  private readonly curve: ClosedCurve;
  /** cumulative[i] = arc length from theta = 0 to theta = i h, h = 2 pi / TABLE_INTERVALS. */
  private readonly cumulative = new Float64Array(TABLE_INTERVALS + 1);
  /** slope[i] = dtheta/ds = 1 / |p'(theta_i)| at the knots. */
  private readonly slope = new Float64Array(TABLE_INTERVALS + 1);
  private readonly step = (2 * Math.PI) / TABLE_INTERVALS;
  private readonly sample: CurveSample = { x: 0, y: 0, dx: 0, dy: 0, ddx: 0, ddy: 0 };

  constructor(curve: ClosedCurve) {
    this.curve = curve;
    for (let i = 0; i < TABLE_INTERVALS; i++) {
      this.cumulative[i + 1] = this.cumulative[i]! + this.arcLength(i * this.step, (i + 1) * this.step);
    }
    for (let i = 0; i <= TABLE_INTERVALS; i++) this.slope[i] = 1 / this.speed(i * this.step);
    this.length = this.cumulative[TABLE_INTERVALS]!;
  }

  private speed(theta: number): number {
    const { dx, dy } = this.curve.at(theta, this.sample);
    return Math.sqrt(dx * dx + dy * dy);
  }

  // integral_a^b |p'(theta)| dtheta by 8-point Gauss-Legendre
  private arcLength(a: number, b: number): number {
    const half = (b - a) / 2;
    const mid = (a + b) / 2;
    let sum = 0;
    for (let k = 0; k < 8; k++) sum += GL_WEIGHTS[k]! * this.speed(mid + half * GL_NODES[k]!);
    return sum * half;
  }

  /**
   * Curve parameter theta at arc length s in [0, length]: cubic Hermite between the knots
   * (s_i, theta_i) with slopes dtheta/ds = 1 / |p'(theta_i)| (error ~ h^4 max|theta''''| / 384).
   */
  thetaAt(s: number): number {
    const c = this.cumulative;
    let lo = 0;
    let hi = TABLE_INTERVALS - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (c[mid]! <= s) lo = mid;
      else hi = mid - 1;
    }
    const h = c[lo + 1]! - c[lo]!;
    const u = (s - c[lo]!) / h;
    const u2 = u * u, u3 = u2 * u;
    const t0 = lo * this.step;
    // theta = h00 t0 + h10 h m0 + h01 t1 + h11 h m1, with t1 = t0 + step
    return t0 + (-2 * u3 + 3 * u2) * this.step + h * ((u3 - 2 * u2 + u) * this.slope[lo]! + (u3 - u2) * this.slope[lo + 1]!);
  }

  evaluate(s: number, out: PlanarPoint): PlanarPoint {
    const { x, y, dx, dy, ddx, ddy } = this.curve.at(this.thetaAt(s), this.sample);
    const speed = Math.sqrt(dx * dx + dy * dy);
    out.x = x;
    out.y = y;
    out.tx = dx / speed;
    out.ty = dy / speed;
    // signed curvature kappa = (x' y'' - y' x'') / |p'|^3
    out.curvature = (dx * ddy - dy * ddx) / (speed * speed * speed);
    return out;
  }
}

/**
 * Ellipse with semi-axes a (along x) and b (along y), counter-clockwise, starting at the
 * origin heading +x: p = (a sin theta, b (1 - cos theta)).
 */
export function ellipsePath(a: number, b: number): ParametricPath {
  return new ParametricPath({
    at(t, out) {
      const sin = Math.sin(t), cos = Math.cos(t);
      out.x = a * sin;
      out.y = b * (1 - cos);
      out.dx = a * cos;
      out.dy = b * sin;
      out.ddx = -a * sin;
      out.ddy = b * cos;
      return out;
    },
  });
}

/**
 * Figure-eight (lemniscate of Gerono) reaching +-a along x and +-b along y, crossing
 * itself at the origin where it starts: p = (a sin theta, b sin 2 theta). |p'| never
 * vanishes, so the curvature stays bounded.
 */
export function figureEightPath(a: number, b: number): ParametricPath {
  return new ParametricPath({
    at(t, out) {
      const sin = Math.sin(t), cos = Math.cos(t), sin2 = Math.sin(2 * t), cos2 = Math.cos(2 * t);
      out.x = a * sin;
      out.y = b * sin2;
      out.dx = a * cos;
      out.dy = 2 * b * cos2;
      out.ddx = -a * sin;
      out.ddy = -4 * b * sin2;
      return out;
    },
  });
}
