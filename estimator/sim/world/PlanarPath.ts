// A plane curve parametrised by arc length s (m): the geometry of a carrier path before
// timing, rotation and height are applied. Implementations are allocation-free.

/** Point on the curve: position (m), unit tangent, signed curvature (1/m, positive = turning left). */
export interface PlanarPoint {
  x: number;
  y: number;
  tx: number;
  ty: number;
  curvature: number;
}

export interface PlanarPath {
  /** Total arc length (m); Infinity for an open, unbounded path. */
  readonly length: number;
  /** Closed paths repeat: s is taken modulo length. */
  readonly closed: boolean;
  evaluate(s: number, out: PlanarPoint): PlanarPoint;
}

export function createPlanarPoint(): PlanarPoint {
  return { x: 0, y: 0, tx: 1, ty: 0, curvature: 0 };
}
