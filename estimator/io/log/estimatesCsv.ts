// The replay's estimates CSV (and a recorded log's onboard.csv): time, state x, covariance
// diagonal. Numbers print in JavaScript's shortest round-trip form, so a value read back is
// the same double that was written (what makes record -> replay exact).
import { STATE_COLUMNS } from './logStreams.js';

/**
 * Header line for an n-state filter: 12, or 15 with the Singer carrier acceleration; 13 or 16
 * with the deck-scale state, whose column (last) is `deck_scale`.
 */
export function estimatesHeader(n: number): string {
  const deckScale = n === 13 || n === 16;
  const names: string[] = deckScale ? [...STATE_COLUMNS.slice(0, n - 1), 'deck_scale'] : STATE_COLUMNS.slice(0, n);
  return ['time', ...names, ...names.map((c) => `P_${c}`)].join(',');
}

/** One row: time, x[0..n-1], P[i*n+i] for i < n (P row-major n x n). */
export function estimatesRow(t: number, x: ArrayLike<number>, P: ArrayLike<number>, n: number): string {
  let line = String(t);
  for (let i = 0; i < n; i++) line += ',' + x[i]!;
  for (let i = 0; i < n; i++) line += ',' + P[i * n + i]!;
  return line;
}

/** Same row from an already extracted diagonal. */
export function estimatesRowFromDiagonal(t: number, x: ArrayLike<number>, Pdiag: ArrayLike<number>, n: number): string {
  let line = String(t);
  for (let i = 0; i < n; i++) line += ',' + x[i]!;
  for (let i = 0; i < n; i++) line += ',' + Pdiag[i]!;
  return line;
}
