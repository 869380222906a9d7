// Spearman's rank correlation: Pearson's correlation of the ranks, ties given their average
// rank (common practice). Used to ask whether success falls as an impairment grows.
//   rho = sum (a_i - mean a)(b_i - mean b) / sqrt(sum (a_i - mean a)^2 sum (b_i - mean b)^2)
// with a, b the (average) ranks of x and y. NaN when either side is constant (no order to test).

/** Average ranks (1-based) of the values; tied values share the mean of the ranks they span. */
export function averageRanks(values: readonly number[]): number[] {
  const order = values.map((v, i) => i).sort((i, j) => values[i]! - values[j]!);
  const ranks = new Array<number>(values.length);
  for (let start = 0; start < order.length; ) {
    let end = start;
    while (end + 1 < order.length && values[order[end + 1]!] === values[order[start]!]) end++;
    const rank = (start + end) / 2 + 1;
    for (let k = start; k <= end; k++) ranks[order[k]!] = rank;
    start = end + 1;
  }
  return ranks;
}

/**
 * Spearman's rho of paired samples x, y (same length, at least 2).
 * @example spearman([1, 2, 3, 4], [40, 30, 20, 10]) // -1
 */
export function spearman(x: readonly number[], y: readonly number[]): number {
  if (x.length !== y.length || x.length < 2) throw new RangeError(`spearman: needs two samples of the same length >= 2, got ${x.length} and ${y.length}`);
  const a = averageRanks(x), b = averageRanks(y);
  const n = a.length, mean = (n + 1) / 2;
  let sab = 0, saa = 0, sbb = 0;
  for (let i = 0; i < n; i++) {
    const da = a[i]! - mean, db = b[i]! - mean;
    sab += da * db;
    saa += da * da;
    sbb += db * db;
  }
  return saa === 0 || sbb === 0 ? Number.NaN : sab / Math.sqrt(saa * sbb);
}
