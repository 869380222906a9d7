// Maximum-likelihood identification of noise terms: minimise D(θ) = -2 ln L (any objective of
// that kind, e.g. the innovation likelihood of a log replay) over the named terms in ln θ, then
// give each an approximate 95 % interval and say when the data do not pin it down.
// - Search: Nelder–Mead in ln θ (nelderMead.ts), restarted from its best point with half the
//   step until a restart gains less than 0.05 in D (a simplex can stall on a ridge).
// - Interval: D rises by chi2_1(0.95) = 3.84 at the 95 % profile-likelihood bounds (Wilks 1938);
//   in the quadratic approximation that is ln θ̂ ± 1.96 sqrt(C_ii) with C = 2 H⁻¹, H the
//   Hessian of D in ln θ by central differences (correlations between terms included). A term
//   bounded on one side only gets that side from where its conditional profile crosses 3.84.
// - Identifiability: a conditional profile (others held) scanned out to the search bounds; a
//   side on which D never rises by 3.84 is open (nothing bounds the term there). Both sides
//   open, or an interval wider than a factor 100: not identifiable; one side open: only a bound.
// Browser-safe; the objective may be async (a replay).
import { curvatureCovariance } from './curvatureCovariance.js';
import { nelderMead } from './nelderMead.js';
import { roundTo, supportedDigits, type Identifiability } from './termValueText.js';

export type { Identifiability } from './termValueText.js';

/** chi-square(1) upper 5 % point (NIST/SEMATECH e-Handbook 1.3.6.7.4): 3.841. */
export const PROFILE_RISE_95 = 3.841;
const Z95 = 1.959964;
/** An interval wider than this ratio (high / low) claims no value. */
const WIDEST_RATIO = 100;
/** An estimate this close (in ln θ) to a search bound sits at it. */
const AT_BOUND = 0.02;

export interface FreeTerm {
  name: string;
  unit: string;
  /** Starting value (> 0; clamped into the bounds) and search bounds (absolute, > 0). */
  start: number;
  lower: number;
  upper: number;
}


export interface ProfilePoint {
  value: number;
  /** D at this value with the other terms at their estimates, minus D at the optimum. */
  rise: number;
}

export interface TermEstimate {
  name: string;
  unit: string;
  start: number;
  /** The value at the likelihood's optimum (a search result: read `status` before using it). */
  estimate: number;
  /** Approximate 95 % interval; null on a side the data do not bound. */
  low: number | null;
  high: number | null;
  status: Identifiability;
  /** 'lower' / 'upper' when the estimate sits at a search bound. */
  atBound: 'lower' | 'upper' | null;
  /** Significant digits the interval supports (0 = no value claimed). */
  digits: number;
  /** The value to put in the settings: the estimate when identified; else the start, moved inside the one-sided bound if it lies outside. */
  recommended: number;
  /** Why no precise value is claimed, in words; null when identified. */
  warning: string | null;
  profile: ProfilePoint[];
}

export interface NoiseIdentification {
  method: string;
  terms: TermEstimate[];
  /** D at the start and at the optimum. */
  startMinus2LogL: number;
  minus2LogL: number;
  evaluations: number;
}

export interface IdentifyOptions {
  /** Nelder–Mead evaluations per run (default 40 per free term). */
  maxEvaluations?: number;
  /** Profile points per side of the estimate (default 5). */
  profilePoints?: number;
  onEvaluation?: (values: Record<string, number>, minus2LogL: number, evaluations: number) => void;
}

export const IDENTIFY_METHOD =
  'maximum innovation likelihood, -2 ln L = sum (ln|2 pi S_k| + y_k\' S_k^-1 y_k) (Mehra 1970; Bar-Shalom, Li, Kirubarajan 2001), ' +
  'searched in ln of each term; 95 % interval from the curvature of -2 ln L (a rise of 3.84, Wilks 1938), sides the profile never closes left open';

export async function identifyNoise(objective: (values: Record<string, number>) => number | Promise<number>, free: readonly FreeTerm[], options: IdentifyOptions = {}): Promise<NoiseIdentification> {
  const n = free.length;
  if (n === 0) throw new RangeError('identifyNoise: name at least one term to identify');
  for (const t of free) {
    if (!(t.lower > 0 && t.upper > t.lower && Number.isFinite(t.upper))) throw new RangeError(`identifyNoise: ${t.name}: bounds must satisfy 0 < lower < upper, got [${t.lower}, ${t.upper}]`);
  }
  const lo = free.map((t) => Math.log(t.lower)), hi = free.map((t) => Math.log(t.upper));
  let evaluations = 0;
  const cache = new Map<string, number>();
  const D = async (z: readonly number[]): Promise<number> => {
    const key = z.map((v) => v.toPrecision(12)).join(',');
    const known = cache.get(key);
    if (known !== undefined) return known;
    const values = Object.fromEntries(free.map((t, i) => [t.name, Math.exp(z[i]!)]));
    const raw = await objective(values);
    const v = Number.isFinite(raw) ? raw : Infinity;
    evaluations++;
    cache.set(key, v);
    options.onEvaluation?.(values, v, evaluations);
    return v;
  };

  const z0 = free.map((t, i) => Math.min(hi[i]!, Math.max(lo[i]!, Math.log(t.start > 0 ? t.start : t.lower))));
  let startD = await D(z0);
  // A start the objective refuses (e.g. a filter that diverges with noise far too small): move
  // every term up together, a factor 2 at a time, until it accepts one.
  for (let k = 0; k < 12 && !Number.isFinite(startD); k++) {
    for (let i = 0; i < n; i++) z0[i] = Math.min(hi[i]!, z0[i]! + Math.LN2);
    startD = await D(z0);
  }
  if (!Number.isFinite(startD)) throw new RangeError('identifyNoise: the objective refuses the start and every setting up to 4096 times larger');
  let best = { x: z0, value: startD };
  let step = Math.LN2;
  for (let run = 0; run < 4; run++) {
    const result = await nelderMead(D, best.x, { step: free.map(() => step), lower: lo, upper: hi, maxEvaluations: options.maxEvaluations ?? 40 * n, tolerance: 0.01 });
    const gain = best.value - result.value;
    if (result.value < best.value) best = { x: result.x, value: result.value };
    if (run > 0 && !(gain > 0.05)) break;
    step /= 2;
  }
  const zHat = best.x, dHat = best.value;

  const C = await curvatureCovariance(D, zHat, dHat, n);
  const points = options.profilePoints ?? 5;
  const terms: TermEstimate[] = [];
  for (let i = 0; i < n; i++) {
    const t = free[i]!;
    const profile: ProfilePoint[] = [{ value: Math.exp(zHat[i]!), rise: 0 }];
    const open = { lower: true, upper: true };
    // Where the conditional profile crosses the 3.84 rise, by linear interpolation in ln θ.
    const crossing = { lower: Number.NaN, upper: Number.NaN };
    for (const side of [-1, 1] as const) {
      const end = side < 0 ? lo[i]! : hi[i]!;
      let previous = { z: zHat[i]!, rise: 0 };
      for (let k = 1; k <= points; k++) {
        // Points crowd near the estimate (quadratic spacing) where the curve bends most.
        const z = [...zHat];
        z[i] = zHat[i]! + (end - zHat[i]!) * (k / points) ** 2;
        if (Math.abs(z[i]! - zHat[i]!) < 1e-9) continue;
        const rise = (await D(z)) - dHat;
        profile.push({ value: Math.exp(z[i]!), rise });
        if (rise >= PROFILE_RISE_95) {
          open[side < 0 ? 'lower' : 'upper'] = false;
          crossing[side < 0 ? 'lower' : 'upper'] = Math.exp(previous.z + ((PROFILE_RISE_95 - previous.rise) / (rise - previous.rise)) * (z[i]! - previous.z));
          break;
        }
        previous = { z: z[i]!, rise };
      }
    }
    profile.sort((a, b) => a.value - b.value);
    const sd = C !== null && C[i * n + i]! > 0 ? Math.sqrt(C[i * n + i]!) : Infinity;
    const atBound = zHat[i]! - lo[i]! < AT_BOUND ? 'lower' : hi[i]! - zHat[i]! < AT_BOUND ? 'upper' : null;
    // Both sides closed: the curvature interval (correlations with the other terms included);
    // one side open: the closed side's profile crossing (the curvature at a flat side means nothing).
    const twoSided = !open.lower && !open.upper && Number.isFinite(sd);
    const low = open.lower ? null : twoSided ? Math.exp(zHat[i]! - Z95 * sd) : crossing.lower;
    const high = open.upper ? null : twoSided ? Math.exp(zHat[i]! + Z95 * sd) : crossing.upper;
    let status: Identifiability;
    if (low !== null && high !== null && high / low <= WIDEST_RATIO && atBound === null) status = 'identified';
    else if (high !== null && low === null) status = 'upper-bound-only';
    else if (low !== null && high === null) status = 'lower-bound-only';
    else status = 'not-identifiable';
    // A one-sided term keeps its start unless the start lies beyond the bound the data set.
    const oneSided = status === 'upper-bound-only' ? Math.min(t.start, high!) : status === 'lower-bound-only' ? Math.max(t.start, low!) : t.start;
    const digits = status === 'identified' ? supportedDigits(Math.exp(zHat[i]!), low!, high!) : 0;
    const estimate = Math.exp(zHat[i]!);
    terms.push({
      name: t.name,
      unit: t.unit,
      start: t.start,
      estimate,
      low,
      high,
      status,
      atBound,
      digits,
      recommended: status === 'identified' ? roundTo(estimate, digits) : status === 'not-identifiable' ? t.start : roundTo(oneSided, 2),
      warning: warningFor(t, status, atBound, low, high),
      profile,
    });
  }
  return { method: IDENTIFY_METHOD, terms, startMinus2LogL: startD, minus2LogL: dHat, evaluations };
}

function warningFor(t: FreeTerm, status: Identifiability, atBound: 'lower' | 'upper' | null, low: number | null, high: number | null): string | null {
  const bound = atBound === 'lower' ? ` and the optimum sits at the search's lower bound ${t.lower} ${t.unit}` : atBound === 'upper' ? ` and the optimum sits at the search's upper bound ${t.upper} ${t.unit}` : '';
  switch (status) {
    case 'identified':
      return null;
    case 'upper-bound-only':
      return `${t.name}: the data bound it only from above (at most about ${roundTo(high!, 2)} ${t.unit})${bound}; no precise value claimed`;
    case 'lower-bound-only':
      return `${t.name}: the data bound it only from below (at least about ${roundTo(low!, 2)} ${t.unit})${bound}; no precise value claimed`;
    case 'not-identifiable':
      return `${t.name}: not identifiable from this data (the likelihood is flat${low !== null && high !== null ? ` across ${roundTo(low, 2)}..${roundTo(high, 2)} ${t.unit}` : ''}${bound}); no value claimed, the current setting is kept`;
  }
}
