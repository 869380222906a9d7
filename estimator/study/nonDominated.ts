// The non-dominated (Pareto) set of settings judged on two objectives, both "higher is better":
// a setting is dominated when another is at least as good on both and strictly better on one.
// A trade-off is reported as this set, not folded into one scalar blend.

export interface TwoObjectives {
  /** Both higher-is-better. */
  a: number;
  b: number;
}

/** Indices of the non-dominated items, in input order. NaN counts as worst. */
export function nonDominated(items: readonly TwoObjectives[]): number[] {
  const v = (x: number) => (Number.isNaN(x) ? -Infinity : x);
  const out: number[] = [];
  for (let i = 0; i < items.length; i++) {
    const p = items[i]!;
    const dominated = items.some((q, j) => j !== i && v(q.a) >= v(p.a) && v(q.b) >= v(p.b) && (v(q.a) > v(p.a) || v(q.b) > v(p.b)));
    if (!dominated) out.push(i);
  }
  return out;
}
