// Filter tuning search: Q, R and gate multipliers on a log-spaced grid, then Nelder–Mead in
// log space from the best grid cell. Used by `alight tune` on scenarios and on flight logs.
import { nelderMead } from './nelderMead.js';

export interface Multipliers {
  q: number;
  r: number;
  gate: number;
}

export interface SurfaceSample extends Multipliers {
  score: number;
  stage: 'grid' | 'refine';
}

export interface SearchOptions {
  /** Search ranges (multipliers, > 0). Defaults q, r: [0.1, 10]; gate: [0.5, 4]. lo = hi fixes the axis. */
  q?: [number, number];
  r?: [number, number];
  gate?: [number, number];
  /** Grid points per searched axis, log-spaced, ends included (default 5). */
  grid?: number;
  /** Nelder–Mead evaluations after the grid (default 30; 0 = grid only). */
  refine?: number;
  /** Higher scores are better (default false: the score is a cost, lower is better). */
  maximize?: boolean;
  /** Called after every new evaluation (progress). */
  onSample?: (sample: SurfaceSample, evaluations: number) => void;
}

export interface SearchResult {
  best: SurfaceSample;
  /** Every evaluated setting, grid first, then refinement, in evaluation order. */
  surface: SurfaceSample[];
}

export class SearchError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'SearchError';
  }
}

const AXES = ['q', 'r', 'gate'] as const;
const DEFAULTS: Record<(typeof AXES)[number], [number, number]> = { q: [0.1, 10], r: [0.1, 10], gate: [0.5, 4] };

/** Round multipliers to 6 significant digits: readable settings and a stable cache key. */
function tidy(v: number): number {
  return Number(v.toPrecision(6));
}

/**
 * Searches the multipliers that minimise `score` (maximise with `maximize: true`).
 * The score may be async (e.g. a batch of simulated trials or a log replay); each distinct
 * setting is evaluated once. Grid values: lo · (hi/lo)^(i/(grid-1)).
 * @example await searchMultipliers(({ q, r }) => Math.log(q) ** 2 + Math.log(r / 2) ** 2, { gate: [1, 1] })
 */
export async function searchMultipliers(score: (m: Multipliers) => number | Promise<number>, options: SearchOptions = {}): Promise<SearchResult> {
  const grid = options.grid ?? 5;
  const refine = options.refine ?? 30;
  if (!Number.isInteger(grid) || grid < 1) throw new SearchError(`grid must be a positive integer, got ${grid}`);
  const ranges = AXES.map((axis) => {
    const [lo, hi] = options[axis] ?? DEFAULTS[axis];
    if (!(lo > 0 && hi >= lo && Number.isFinite(hi))) throw new SearchError(`${axis} range must satisfy 0 < lo <= hi, got [${lo}, ${hi}]`);
    return { axis, lo: Math.log(lo), hi: Math.log(hi), free: hi > lo };
  });
  const sign = options.maximize ? -1 : 1;
  const surface: SurfaceSample[] = [];
  const cache = new Map<string, SurfaceSample>();
  const evaluate = async (logs: number[], stage: SurfaceSample['stage']): Promise<SurfaceSample> => {
    const m = { q: tidy(Math.exp(logs[0]!)), r: tidy(Math.exp(logs[1]!)), gate: tidy(Math.exp(logs[2]!)) };
    const key = `${m.q},${m.r},${m.gate}`;
    const known = cache.get(key);
    if (known) return known;
    const value = await score(m);
    const sample: SurfaceSample = { ...m, score: value, stage };
    cache.set(key, sample);
    surface.push(sample);
    options.onSample?.(sample, surface.length);
    return sample;
  };
  const better = (a: SurfaceSample, b: SurfaceSample) => {
    const va = Number.isNaN(a.score) ? Infinity : sign * a.score;
    const vb = Number.isNaN(b.score) ? Infinity : sign * b.score;
    return va < vb;
  };
  const levels = ranges.map((r) => (r.free && grid > 1 ? Array.from({ length: grid }, (_, i) => r.lo + ((r.hi - r.lo) * i) / (grid - 1)) : [r.free ? (r.lo + r.hi) / 2 : r.lo]));
  let best: SurfaceSample | null = null;
  for (const lq of levels[0]!) {
    for (const lr of levels[1]!) {
      for (const lg of levels[2]!) {
        const s = await evaluate([lq, lr, lg], 'grid');
        if (!best || better(s, best)) best = s;
      }
    }
  }
  const free = ranges.map((r, i) => (r.free ? i : -1)).filter((i) => i >= 0);
  if (refine > 0 && free.length > 0) {
    const start = [Math.log(best!.q), Math.log(best!.r), Math.log(best!.gate)];
    const full = (x: number[]) => {
      const logs = [...start];
      free.forEach((axis, k) => (logs[axis] = x[k]!));
      return logs;
    };
    const result = await nelderMead(
      async (x) => {
        const s = await evaluate(full(x), 'refine');
        return Number.isNaN(s.score) ? Infinity : sign * s.score;
      },
      free.map((i) => start[i]!),
      {
        // Half a grid spacing: the refinement explores between the grid's cells.
        step: free.map((i) => (ranges[i]!.hi - ranges[i]!.lo) / Math.max(1, grid - 1) / 2),
        lower: free.map((i) => ranges[i]!.lo),
        upper: free.map((i) => ranges[i]!.hi),
        maxEvaluations: refine,
        tolerance: 1e-9,
      },
    );
    const refined = await evaluate(full(result.x), 'refine');
    if (better(refined, best!)) best = refined;
  }
  for (const s of surface) if (better(s, best!)) best = s;
  return { best: best!, surface };
}
