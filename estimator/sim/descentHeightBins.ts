// The true-height bins of a descent in which each trial records its mean NEES, so an ensemble
// of trials can be judged bin by bin (estimator/study/statistics/ensembleConsistency.ts).
// Fixed edges, the same for every scenario, so results of different studies line up; finer
// near the deck, where the box grows fastest and a bias matters most.

/** Bin edges (m of true height above the deck); bin i is [edges[i], edges[i + 1]), the last one open-ended. */
export const DESCENT_HEIGHT_EDGES: readonly number[] = Object.freeze([0, 0.5, 1, 1.5, 2, 3, 4, 6, 8, 12]);

/** Number of bins: one per edge (the last holds everything above the last edge). */
export const DESCENT_HEIGHT_BINS = DESCENT_HEIGHT_EDGES.length;

/** Bin index of a true height (m); heights below 0 fall in the first bin. */
export function descentHeightBin(height: number): number {
  const edges = DESCENT_HEIGHT_EDGES;
  let i = 0;
  while (i + 1 < edges.length && height >= edges[i + 1]!) i++;
  return i;
}

/** Labels of the bins, e.g. "0-0.5 m", "12+ m". */
export function descentHeightLabels(): string[] {
  const edges = DESCENT_HEIGHT_EDGES;
  return edges.map((low, i) => (i + 1 < edges.length ? `${low}-${edges[i + 1]} m` : `${low}+ m`));
}
