// Sweep designs: which scenario values each sweep point gets (grid, random, Latin hypercube).
import { MAX_POINTS } from './studyLimits.js';
import { RandomStream, streamId } from '../random/RandomStream.js';

export type ParamValue = number | string | boolean;
/** The varied values of one sweep point, by dotted scenario path, in --vary order. */
export type Params = Record<string, ParamValue>;
export type DesignKind = 'grid' | 'random' | 'lhs';
export const DESIGN_KINDS: readonly DesignKind[] = ['grid', 'random', 'lhs'];

/** One varied path: a numeric range FROM:TO in COUNT steps, or an explicit list of values. */
export interface VarySpec {
  path: string;
  from?: number;
  to?: number;
  count?: number;
  values?: ParamValue[];
}

export class DesignError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'DesignError';
  }
}

/** Round to 12 significant digits so 0.1 steps print as 0.3, not 0.30000000000000004. */
function tidy(v: number): number {
  return Number(v.toPrecision(12));
}

function parseValue(text: string): ParamValue {
  const t = text.trim();
  if (t === 'true' || t === 'false') return t === 'true';
  const n = Number(t);
  return t !== '' && Number.isFinite(n) ? n : t;
}

/**
 * Parse "PATH=FROM:TO:COUNT" (COUNT evenly spaced values, ends included) or
 * "PATH=A,B,C" (explicit values: numbers, true/false or words).
 * @example parseVary('detector.pixelNoise=0:4:5') // { path, from: 0, to: 4, count: 5 }
 */
export function parseVary(text: string): VarySpec {
  const eq = text.indexOf('=');
  const path = eq > 0 ? text.slice(0, eq).trim() : '';
  if (!/^[A-Za-z][A-Za-z0-9]*(\.[A-Za-z0-9]+)*$/.test(path)) {
    throw new DesignError(`--vary "${text}": expected PATH=FROM:TO:COUNT or PATH=A,B,C with a dotted scenario path`);
  }
  const rest = text.slice(eq + 1);
  const parts = rest.split(':');
  if (parts.length === 3) {
    const [from, to, count] = parts.map(Number) as [number, number, number];
    if (![from, to].every(Number.isFinite) || !Number.isInteger(count) || count < 1 || parts.some((p) => p.trim() === '')) {
      throw new DesignError(`--vary "${text}": FROM and TO must be numbers and COUNT a positive integer`);
    }
    if (count > MAX_POINTS) throw new DesignError(`--vary "${text}": COUNT ${count} is over the limit of ${MAX_POINTS} points`);
    if (count === 1 && from !== to) throw new DesignError(`--vary "${text}": COUNT 1 needs FROM = TO`);
    return { path, from, to, count };
  }
  if (parts.length === 1 && rest.trim() !== '') return { path, values: rest.split(',').map(parseValue) };
  throw new DesignError(`--vary "${text}": expected PATH=FROM:TO:COUNT or PATH=A,B,C`);
}

/** The grid values of one varied path. */
export function varyValues(spec: VarySpec): ParamValue[] {
  if (spec.values) return spec.values.slice();
  const { from = 0, to = 0, count = 1 } = spec;
  if (count === 1) return [from];
  return Array.from({ length: count }, (_, i) => tidy(from + ((to - from) * i) / (count - 1)));
}

function valueAt(spec: VarySpec, u: number): ParamValue {
  if (spec.values) return spec.values[Math.min(spec.values.length - 1, Math.floor(u * spec.values.length))]!;
  return spec.from! + (spec.to! - spec.from!) * u;
}

export interface DesignOptions {
  /** Seed of the random and LHS designs (drawn from their own stream, not the trials'). */
  seed: number;
  /** Points of the random and LHS designs (default: the largest COUNT or list length). */
  points?: number;
}

/**
 * The sweep points. grid: the Cartesian product, first --vary slowest. random: uniform
 * draws inside each range. lhs: Latin hypercube, each range cut into M strata and each
 * stratum used once per path (McKay, Beckman, Conover 1979).
 */
export function designPoints(vary: readonly VarySpec[], kind: DesignKind, options: DesignOptions): Params[] {
  const paths = new Set<string>();
  for (const v of vary) {
    if (paths.has(v.path)) throw new DesignError(`--vary ${v.path} given twice`);
    paths.add(v.path);
  }
  if (vary.length === 0) return [{}];
  if (kind === 'grid') {
    let points: Params[] = [{}];
    for (const spec of vary) {
      const values = varyValues(spec);
      points = points.flatMap((p) => values.map((value) => ({ ...p, [spec.path]: value })));
    }
    return points;
  }
  const m = options.points ?? Math.max(...vary.map((v) => v.values?.length ?? v.count ?? 1));
  if (!Number.isInteger(m) || m < 1) throw new DesignError(`--points must be a positive integer, got ${m}`);
  const stream = RandomStream.fromKey([options.seed, streamId(`design-${kind}`)]);
  const columns = vary.map((spec) => {
    const u = new Float64Array(m);
    if (kind === 'random') for (let i = 0; i < m; i++) u[i] = stream.uniform();
    else {
      // Fisher–Yates permutation of strata, one uniform draw inside each.
      const order = Array.from({ length: m }, (_, i) => i);
      for (let i = m - 1; i > 0; i--) {
        const j = stream.integer(i + 1);
        [order[i], order[j]] = [order[j]!, order[i]!];
      }
      for (let i = 0; i < m; i++) u[i] = (order[i]! + stream.uniform()) / m;
    }
    return { spec, u };
  });
  return Array.from({ length: m }, (_, i) => Object.fromEntries(columns.map(({ spec, u }) => [spec.path, valueAt(spec, u[i]!)])));
}
