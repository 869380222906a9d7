// Circular error probable: the radius that contains a given share of the touchdown misses.
import { percentile } from './percentile.js';

/**
 * Empirical circular error probable of horizontal miss distances (m): the level-quantile
 * of the distances, e.g. level 0.5 for CEP50 and 0.95 for CEP95. Null when there is no miss
 * to measure (no contact in any trial). For a circular Gaussian with per-axis sigma the
 * distance is Rayleigh, so CEP50 -> sigma sqrt(2 ln 2) and CEP95 -> sigma sqrt(-2 ln 0.05).
 * @example cep([0.1, 0.2, 0.3], 0.5) // 0.2
 */
export function cep(missDistances: ArrayLike<number>, level: number): number | null {
  for (let i = 0; i < missDistances.length; i++) {
    if (!(missDistances[i]! >= 0)) throw new RangeError(`cep: miss distance ${i} must be a non-negative number, got ${missDistances[i]}`);
  }
  return percentile(missDistances, level);
}
