// Derivative-free minimisation by the Nelder–Mead simplex (Nelder and Mead 1965), with the
// standard coefficients reflection 1, expansion 2, contraction 1/2, shrink 1/2 (Lagarias et al. 1998).

export interface NelderMeadOptions {
  /** Initial step along each coordinate (same units as x). */
  step: readonly number[];
  /** Budget of objective evaluations (default 60). */
  maxEvaluations?: number;
  /** Stop when the spread of the simplex values falls below this (default 1e-6). */
  tolerance?: number;
  /** Box bounds: trial points are clamped into [lower, upper]. */
  lower?: readonly number[];
  upper?: readonly number[];
}

export interface NelderMeadResult {
  x: number[];
  value: number;
  evaluations: number;
}

/** Minimises f (async allowed); a NaN value counts as +Infinity (worst). */
export async function nelderMead(f: (x: number[]) => number | Promise<number>, x0: readonly number[], options: NelderMeadOptions): Promise<NelderMeadResult> {
  const n = x0.length;
  const { maxEvaluations = 60, tolerance = 1e-6, lower, upper } = options;
  let evaluations = 0;
  const clamp = (x: number[]) => x.map((v, i) => Math.min(upper?.[i] ?? Infinity, Math.max(lower?.[i] ?? -Infinity, v)));
  const evaluate = async (x: number[]) => {
    evaluations++;
    const v = await f(x);
    return Number.isNaN(v) ? Infinity : v;
  };
  const simplex: { x: number[]; v: number }[] = [];
  const start = clamp([...x0]);
  simplex.push({ x: start, v: await evaluate(start) });
  for (let i = 0; i < n; i++) {
    const x = [...start];
    x[i]! += options.step[i]!;
    let moved = clamp(x);
    if (moved[i] === start[i]) {
      x[i] = start[i]! - options.step[i]!; // at a bound: step the other way
      moved = clamp(x);
    }
    simplex.push({ x: moved, v: await evaluate(moved) });
  }
  const combine = (a: number[], b: number[], t: number) => clamp(a.map((ai, i) => ai + t * (b[i]! - ai)));
  while (evaluations < maxEvaluations) {
    simplex.sort((a, b) => a.v - b.v);
    const best = simplex[0]!, worst = simplex[n]!, second = simplex[n - 1]!;
    if (Math.abs(worst.v - best.v) <= tolerance) break;
    const centroid = Array.from({ length: n }, (_, i) => simplex.slice(0, n).reduce((s, p) => s + p.x[i]!, 0) / n);
    // Reflection x_r = c + (c - x_worst).
    const xr = combine(centroid, worst.x, -1);
    const vr = await evaluate(xr);
    if (vr < best.v) {
      // Expansion x_e = c + 2 (c - x_worst).
      const xe = combine(centroid, worst.x, -2);
      const ve = await evaluate(xe);
      simplex[n] = ve < vr ? { x: xe, v: ve } : { x: xr, v: vr };
    } else if (vr < second.v) {
      simplex[n] = { x: xr, v: vr };
    } else {
      // Contraction towards the better of x_r and x_worst.
      const outside = vr < worst.v;
      const xc = outside ? combine(centroid, xr, 0.5) : combine(centroid, worst.x, 0.5);
      const vc = await evaluate(xc);
      if (vc < (outside ? vr : worst.v)) simplex[n] = { x: xc, v: vc };
      else {
        // Shrink every vertex half-way to the best.
        for (let k = 1; k <= n && evaluations < maxEvaluations; k++) {
          const xs = combine(best.x, simplex[k]!.x, 0.5);
          simplex[k] = { x: xs, v: await evaluate(xs) };
        }
      }
    }
  }
  simplex.sort((a, b) => a.v - b.v);
  return { x: simplex[0]!.x, value: simplex[0]!.v, evaluations };
}
