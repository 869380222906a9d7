// Brown–Conrady lens distortion on normalized image coordinates (x, y) = (X/Z, Y/Z).
// Allocation-free: results go into `out`.
//   r² = x² + y²,  radial = 1 + k1 r² + k2 r⁴ + k3 r⁶
//   xd = x radial + 2 p1 x y + p2 (r² + 2 x²)
//   yd = y radial + p1 (r² + 2 y²) + 2 p2 x y

/** Brown–Conrady coefficients: radial k1, k2, k3 and tangential p1, p2 (dimensionless). */
export interface Distortion {
  k1: number;
  k2: number;
  k3: number;
  p1: number;
  p2: number;
}

/** out = [xd, yd]. */
export function distortNormalized(x: number, y: number, d: Distortion, out: Float64Array | number[]): Float64Array | number[] {
  const r2 = x * x + y * y;
  const radial = 1 + r2 * (d.k1 + r2 * (d.k2 + r2 * d.k3));
  out[0] = x * radial + 2 * d.p1 * x * y + d.p2 * (r2 + 2 * x * x);
  out[1] = y * radial + d.p1 * (r2 + 2 * y * y) + 2 * d.p2 * x * y;
  return out;
}

/** Jacobian ∂(xd, yd)/∂(x, y), row-major 2x2 into out[0..3]. */
export function distortionJacobian(x: number, y: number, d: Distortion, out: Float64Array | number[]): Float64Array | number[] {
  const r2 = x * x + y * y;
  const radial = 1 + r2 * (d.k1 + r2 * (d.k2 + r2 * d.k3));
  // dradial/dr² = k1 + 2 k2 r² + 3 k3 r⁴; dr²/dx = 2x
  const dRadial = d.k1 + r2 * (2 * d.k2 + 3 * d.k3 * r2);
  out[0] = radial + 2 * x * x * dRadial + 2 * d.p1 * y + 6 * d.p2 * x;
  out[1] = 2 * x * y * dRadial + 2 * d.p1 * x + 2 * d.p2 * y;
  out[2] = 2 * x * y * dRadial + 2 * d.p1 * x + 2 * d.p2 * y;
  out[3] = radial + 2 * y * y * dRadial + 6 * d.p1 * y + 2 * d.p2 * x;
  return out;
}

/** Undistortion did not converge (strong distortion far outside the calibrated field). */
export class UndistortionError extends Error {
  constructor(readonly xd: number, readonly yd: number) {
    super(`undistortion did not converge for normalized point (${xd}, ${yd})`);
    this.name = 'UndistortionError';
  }
}

const MAX_ITERATIONS = 30;
const TOLERANCE = 1e-14;

/**
 * Invert distortNormalized by Newton's method from (x, y) = (xd, yd):
 * (x, y) <- (x, y) - J⁻¹ (distort(x, y) - (xd, yd)). Converges in a few steps inside the
 * lens's calibrated field; throws UndistortionError otherwise rather than returning junk.
 * `work` must hold 4 numbers.
 */
export function undistortNormalized(xd: number, yd: number, d: Distortion, out: Float64Array | number[], work: Float64Array | number[] = new Float64Array(4)): Float64Array | number[] {
  if (d.k1 === 0 && d.k2 === 0 && d.k3 === 0 && d.p1 === 0 && d.p2 === 0) {
    out[0] = xd;
    out[1] = yd;
    return out;
  }
  let x = xd, y = yd;
  for (let i = 0; i < MAX_ITERATIONS; i++) {
    distortNormalized(x, y, d, work);
    const ex = work[0]! - xd, ey = work[1]! - yd;
    if (Math.abs(ex) < TOLERANCE && Math.abs(ey) < TOLERANCE) {
      out[0] = x;
      out[1] = y;
      return out;
    }
    distortionJacobian(x, y, d, work);
    const a = work[0]!, b = work[1]!, c = work[2]!, e = work[3]!;
    const det = a * e - b * c;
    if (!(Math.abs(det) > 1e-12)) break;
    x -= (e * ex - b * ey) / det;
    y -= (a * ey - c * ex) / det;
  }
  throw new UndistortionError(xd, yd);
}
