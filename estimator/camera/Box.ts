// The detector's box at the boundary: pixel corners, origin at the image's top-left corner,
// x to the right, y down, continuous coordinates in which pixel (i, j) covers [i, i+1) x [j, j+1)
// and so has its centre at (i + 0.5, j + 0.5). Size s = sqrt(area) in px.

/** Box corners (px): xMin < xMax, yMin < yMax. */
export interface Box {
  xMin: number;
  yMin: number;
  xMax: number;
  yMax: number;
}

/** Why a box cannot be used as a measurement, or null when it can. */
export type BoxProblem = 'box-not-finite' | 'box-empty' | 'box-outside-image' | null;

/** Box from (x, y, w, h) with (x, y) the top-left corner, as many detectors write it. */
export function boxFromXywh(x: number, y: number, w: number, h: number): Box {
  return { xMin: x, yMin: y, xMax: x + w, yMax: y + h };
}

/** Box centred at (u, v) with a square side s (px). */
export function boxFromCentreSize(u: number, v: number, s: number): Box {
  return { xMin: u - s / 2, yMin: v - s / 2, xMax: u + s / 2, yMax: v + s / 2 };
}

/** Centre u (px). */
export function boxCentreU(box: Box): number {
  return (box.xMin + box.xMax) / 2;
}

/** Centre v (px). */
export function boxCentreV(box: Box): number {
  return (box.yMin + box.yMax) / 2;
}

/** s = sqrt((xMax - xMin)(yMax - yMin)) (px); NaN-free only for valid boxes. */
export function boxSize(box: Box): number {
  return Math.sqrt((box.xMax - box.xMin) * (box.yMax - box.yMin));
}

/**
 * Check a box against an image of width x height px: corners finite, positive area, and
 * the centre inside the image (a box may be clipped at the edge but not lie off it).
 */
export function boxProblem(box: Box, width: number, height: number): BoxProblem {
  const { xMin, yMin, xMax, yMax } = box;
  if (!Number.isFinite(xMin) || !Number.isFinite(yMin) || !Number.isFinite(xMax) || !Number.isFinite(yMax)) return 'box-not-finite';
  if (!(xMax > xMin) || !(yMax > yMin)) return 'box-empty';
  const u = (xMin + xMax) / 2, v = (yMin + yMax) / 2;
  if (u < 0 || u > width || v < 0 || v > height) return 'box-outside-image';
  return null;
}
