// Mahalanobis (chi-square) gate: accept a measurement when NIS = yᵀ S⁻¹ y is at most
// chi2_m(p) · scale, where p is the probability mass inside the gate for a consistent filter
// (Bar-Shalom, Li, Kirubarajan 2001, validation region; common practice).
import { chiSquareQuantile } from '../stats/chiSquare.js';

/** Gate threshold on NIS for an m-dimensional measurement. */
export function gateThreshold(probability: number, dimension: number, scale = 1): number {
  if (!(probability > 0 && probability < 1)) throw new RangeError(`gate probability must be in (0, 1), got ${probability}`);
  if (!(scale > 0)) throw new RangeError(`gate scale must be positive, got ${scale}`);
  return chiSquareQuantile(probability, dimension) * scale;
}
