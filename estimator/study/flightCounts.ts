// How many flights confirm or refute a claim "success rate >= p0" at a confidence C, judged by
// the exact one-sided binomial bound (Clopper and Pearson 1934, Biometrika 26):
//   confirmed with f failures in n flights  <=>  lower bound of (n - f)/n >= p0
//                                           <=>  P(X >= n - f | p0) <= 1 - C      X ~ Bin(n, p0)
//   refuted with f failures in n flights    <=>  upper bound of (n - f)/n < p0
//                                           <=>  P(X <= n - f | p0) < 1 - C
// (the bound crosses p0 exactly where the tail at p0 crosses 1 - C, so no bound is solved for).
// The planning rate (a study's simulated success rate) picks the number of flights: the fewest
// for which the expected verdict comes out with at least the wanted chance if it is the truth.
import { binomialTail } from './statistics/binomialTail.js';

export interface FlightCounts {
  /** Flights that must all land to confirm the claim when none may fail: ceil(ln(1 - C) / ln p0). */
  allLand: number;
  /** What the planning rate leads one to expect. 'undecided': it equals the claim, no test separates them. */
  expect: 'confirm' | 'refute' | 'undecided';
  /** Flights planned; null when no plan within maxFlights (planning rate too close to the claim). */
  flights: number | null;
  /** With that many flights: confirmed with at most this many failures (-1: no count confirms). */
  confirmMaxFailures: number | null;
  /** Refuted once failures reach this many (flights + 1: no count refutes). */
  refuteMinFailures: number | null;
  /** Chance of the expected verdict if the planning rate is the true rate. */
  chance: number | null;
}

export interface FlightCountOptions {
  /** Wanted chance of the expected verdict (default 0.8). */
  power?: number;
  /** Search limit (default 2000 flights). */
  maxFlights?: number;
}

/** P(X <= k), X ~ Bin(n, p). */
const atMost = (n: number, p: number, k: number) => (k < 0 ? 0 : 1 - binomialTail(n, p, k + 1));

/** Most failures in n flights that still confirm p0 at confidence C (-1 when none does). */
export function confirmMaxFailures(n: number, p0: number, confidence: number): number {
  const alpha = 1 - confidence;
  let f = -1;
  while (f + 1 <= n && binomialTail(n, p0, n - (f + 1)) <= alpha) f++;
  return f;
}

/** Fewest failures in n flights that refute p0 at confidence C (n + 1 when none does). */
export function refuteMinFailures(n: number, p0: number, confidence: number): number {
  const alpha = 1 - confidence;
  let f = n + 1;
  while (f - 1 >= 0 && atMost(n, p0, n - (f - 1)) < alpha) f--;
  return f;
}

/**
 * Flights to confirm or refute "success >= claimRate" at `confidence`, planned on `planningRate`.
 * @example flightCounts(0.95, 0.95, 1).flights // 59: every flight must land
 */
export function flightCounts(claimRate: number, confidence: number, planningRate: number, options: FlightCountOptions = {}): FlightCounts {
  const { power = 0.8, maxFlights = 2000 } = options;
  if (!(claimRate > 0 && claimRate < 1)) throw new RangeError(`flightCounts: the claimed rate must be in (0, 1), got ${claimRate}`);
  if (!(confidence > 0 && confidence < 1)) throw new RangeError(`flightCounts: confidence must be in (0, 1), got ${confidence}`);
  if (!(planningRate >= 0 && planningRate <= 1)) throw new RangeError(`flightCounts: the planning rate must be in [0, 1], got ${planningRate}`);
  if (!(power > 0 && power < 1)) throw new RangeError(`flightCounts: power must be in (0, 1), got ${power}`);
  const alpha = 1 - confidence;
  let allLand = Math.max(1, Math.ceil(Math.log(alpha) / Math.log(claimRate) - 1e-9));
  while (Math.pow(claimRate, allLand) > alpha) allLand++; // p0^n <= alpha: the tail with no failure
  const none = { flights: null, confirmMaxFailures: null, refuteMinFailures: null, chance: null };
  if (planningRate === claimRate) return { allLand, expect: 'undecided', ...none };
  const expect = planningRate > claimRate ? 'confirm' : 'refute';
  for (let n = expect === 'confirm' ? allLand : 1; n <= maxFlights; n++) {
    const c = confirmMaxFailures(n, claimRate, confidence);
    const r = refuteMinFailures(n, claimRate, confidence);
    // failures F ~ Bin(n, 1 - planningRate): successes n - F
    const chance = expect === 'confirm' ? (c < 0 ? 0 : binomialTail(n, planningRate, n - c)) : r > n ? 0 : atMost(n, planningRate, n - r);
    if (chance >= power) return { allLand, expect, flights: n, confirmMaxFailures: c, refuteMinFailures: r, chance };
  }
  return { allLand, expect, ...none };
}
