// Paths made of straight lines and circular arcs, laid down like a turtle: straight,
// rectangle with rounded corners, lawn-mower survey. Evaluation is allocation-free.
import type { PlanarPath, PlanarPoint } from './PlanarPath.js';

/**
 * Builds a path from lines and arcs, each starting where the previous one ended with the
 * same heading, so position and tangent are continuous (curvature steps between pieces).
 * @example new SegmentPath().line(10).arc(2, Math.PI / 2).line(5)
 */
export class SegmentPath implements PlanarPath {
  closed = false;
  length = 0;
  // Per segment: start distance, start x, y, start heading (rad), curvature (1/m).
  private starts: number[] = [];
  private xs: number[] = [];
  private ys: number[] = [];
  private headings: number[] = [];
  private curvatures: number[] = [];
  private endX = 0;
  private endY = 0;
  private endHeading = 0;
  private unbounded = false;

  private push(length: number, curvature: number): this {
    if (this.unbounded) throw new Error('SegmentPath: nothing can follow an unbounded line');
    if (!(length > 0)) return this; // zero-length pieces (a sharp corner's arc) add nothing
    this.starts.push(this.length);
    this.xs.push(this.endX);
    this.ys.push(this.endY);
    this.headings.push(this.endHeading);
    this.curvatures.push(curvature);
    const h0 = this.endHeading;
    if (curvature === 0) {
      this.endX += length * Math.cos(h0);
      this.endY += length * Math.sin(h0);
    } else {
      const h1 = h0 + curvature * length;
      this.endX += (Math.sin(h1) - Math.sin(h0)) / curvature;
      this.endY -= (Math.cos(h1) - Math.cos(h0)) / curvature;
      this.endHeading = h1;
    }
    this.length += length;
    return this;
  }

  /** Straight piece of the given length (m); Infinity makes the path unbounded (must be last). */
  line(length: number): this {
    if (length === Infinity) {
      this.push(1, 0);
      this.length = Infinity;
      this.unbounded = true;
      return this;
    }
    return this.push(length, 0);
  }

  /** Circular arc of radius (m) turning by angle (rad, positive = left / counter-clockwise). */
  arc(radius: number, angle: number): this {
    if (radius === 0) {
      this.endHeading += angle; // sharp corner: heading jumps
      return this;
    }
    return this.push(radius * Math.abs(angle), Math.sign(angle) / radius);
  }

  /** Mark the path closed; the caller has made it end where it starts. */
  close(): this {
    this.closed = true;
    return this;
  }

  /** Where the last piece ends (for checks that a closed path really closes). */
  end(): { x: number; y: number; heading: number } {
    return { x: this.endX, y: this.endY, heading: this.endHeading };
  }

  evaluate(s: number, out: PlanarPoint): PlanarPoint {
    const starts = this.starts;
    // Binary search for the last segment starting at or before s.
    let lo = 0;
    let hi = starts.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (starts[mid]! <= s) lo = mid;
      else hi = mid - 1;
    }
    const u = s - starts[lo]!;
    const h0 = this.headings[lo]!;
    const k = this.curvatures[lo]!;
    if (k === 0) {
      out.x = this.xs[lo]! + u * Math.cos(h0);
      out.y = this.ys[lo]! + u * Math.sin(h0);
      out.tx = Math.cos(h0);
      out.ty = Math.sin(h0);
    } else {
      // On an arc: heading h = h0 + k u; p = p0 + ((sin h - sin h0) / k, -(cos h - cos h0) / k)
      const h = h0 + k * u;
      out.x = this.xs[lo]! + (Math.sin(h) - Math.sin(h0)) / k;
      out.y = this.ys[lo]! - (Math.cos(h) - Math.cos(h0)) / k;
      out.tx = Math.cos(h);
      out.ty = Math.sin(h);
    }
    out.curvature = k;
    return out;
  }
}

/** Unbounded straight line from the origin along +x. */
export function straightPath(): SegmentPath {
  return new SegmentPath().line(Infinity);
}

/**
 * Rectangle length x width (m) with rounded corners of the given radius, driven
 * counter-clockwise, starting at the middle of the bottom side heading +x.
 * Occupies x in [-length/2, length/2], y in [0, width].
 */
export function roundedRectanglePath(length: number, width: number, cornerRadius: number): SegmentPath {
  const r = cornerRadius;
  const along = length - 2 * r;
  const across = width - 2 * r;
  const q = Math.PI / 2;
  return new SegmentPath()
    .line(along / 2).arc(r, q).line(across).arc(r, q)
    .line(along).arc(r, q).line(across).arc(r, q)
    .line(along / 2).close();
}

/** Number of passes a survey of this width flies: enough to cover it, rounded up to even. */
export function surveyPassCount(width: number, spacing: number): number {
  const n = Math.floor(width / spacing + 1e-9) + 1;
  return Math.max(2, n + (n % 2));
}

/**
 * Lawn-mower survey: passes of the given length along +x / -x, spacing (m) apart,
 * joined by semicircles of radius spacing / 2, then a return leg along the x = -spacing/2
 * side back to the start, so the pattern repeats. Starts at the origin heading +x.
 */
export function surveyPath(length: number, width: number, spacing: number): SegmentPath {
  const n = surveyPassCount(width, spacing);
  const r = spacing / 2;
  const path = new SegmentPath();
  for (let pass = 0; pass < n; pass++) {
    path.line(length);
    if (pass < n - 1) path.arc(r, pass % 2 === 0 ? Math.PI : -Math.PI);
  }
  // Back from (0, (n-1) spacing) heading -x to the origin heading +x.
  return path.arc(r, Math.PI / 2).line((n - 2) * spacing).arc(r, Math.PI / 2).close();
}
