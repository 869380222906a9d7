// Innovation whiteness, online: sample autocorrelations of a normalized-innovation sequence at
// lags 1..L against the ±1.96/sqrt(N) band (Box and Jenkins 1976, "Time Series Analysis:
// Forecasting and Control", large-sample standard error 1/sqrt(N) of an autocorrelation of
// white noise), and the portmanteau statistic of Ljung and Box (1978, "On a measure of lack of
// fit in time series models", Biometrika 65(2):297-303), Q = N (N + 2) sum_k r_k^2 / (N - k),
// compared with chi-square(L). Memory O(L) whatever N: a log of any length fits.
// add() allocates nothing (ring buffers preallocated).
import { chiSquareCdf, chiSquareQuantile } from '../../stats/chiSquare.js';

export interface WhitenessResult {
  /** What the sequence is, e.g. "box u innovation / sqrt(S_uu)". */
  series: string;
  /** Samples N and lags L tested. */
  count: number;
  lags: number;
  /** r_1..r_L: sample autocorrelations (mean removed). */
  autocorrelation: number[];
  /** 1.96 / sqrt(N): a white sequence keeps about 95 % of r_k inside ±bound. */
  bound: number;
  /** How many r_k lie outside ±bound. */
  outside: number;
  /** Ljung–Box Q, its chi-square(L) 95 % threshold and p-value. */
  ljungBox: number;
  threshold: number;
  pValue: number;
  /** True when Q is under the threshold (p >= 0.05). */
  white: boolean;
}

export class WhitenessAccumulator {
  readonly series: string;
  readonly lags: number;
  private n = 0;
  private sum = 0;
  private sumSquares = 0;
  /** lagged[k-1] = sum_t x_t x_{t+k}. */
  private readonly lagged: Float64Array;
  /** The first L samples (for the head sums) and the last L (ring, for products and tail sums). */
  private readonly head: Float64Array;
  private readonly ring: Float64Array;

  constructor(series: string, lags = 20) {
    if (!(Number.isInteger(lags) && lags >= 1)) throw new RangeError(`whiteness lags must be a positive integer, got ${lags}`);
    this.series = series;
    this.lags = lags;
    this.lagged = new Float64Array(lags);
    this.head = new Float64Array(lags);
    this.ring = new Float64Array(lags);
  }

  get count(): number {
    return this.n;
  }

  add(x: number): void {
    const L = this.lags;
    // ring[(n - k) mod L] holds x_{n-k} for k = 1..min(n, L).
    for (let k = 1; k <= L && k <= this.n; k++) this.lagged[k - 1]! += this.ring[(this.n - k) % L]! * x;
    if (this.n < L) this.head[this.n] = x;
    this.ring[this.n % L] = x;
    this.sum += x;
    this.sumSquares += x * x;
    this.n++;
  }

  /** The test; needs N > L + 1 samples (null otherwise: too few to say anything). */
  result(): WhitenessResult | null {
    const N = this.n;
    const L = this.lags;
    if (N <= L + 1) return null;
    const mean = this.sum / N;
    // c_0 = sum (x_t - m)^2
    const c0 = this.sumSquares - N * mean * mean;
    const autocorrelation: number[] = [];
    let headSum = 0;
    let tailSum = 0;
    let q = 0;
    for (let k = 1; k <= L; k++) {
      headSum += this.head[k - 1]!; // sum of the first k samples
      tailSum += this.ring[(N - k) % L]!; // sum of the last k samples
      // c_k = sum_{t=1}^{N-k} (x_t - m)(x_{t+k} - m)
      //     = P_k - m [(S - tail_k) + (S - head_k)] + (N - k) m^2
      const ck = this.lagged[k - 1]! - mean * (2 * this.sum - tailSum - headSum) + (N - k) * mean * mean;
      const r = c0 > 0 ? ck / c0 : 0;
      autocorrelation.push(r);
      q += (r * r) / (N - k);
    }
    q *= N * (N + 2);
    const bound = 1.96 / Math.sqrt(N);
    const threshold = chiSquareQuantile(0.95, L);
    const pValue = 1 - chiSquareCdf(q, L);
    return {
      series: this.series,
      count: N,
      lags: L,
      autocorrelation,
      bound,
      outside: autocorrelation.filter((r) => Math.abs(r) > bound).length,
      ljungBox: q,
      threshold,
      pValue,
      white: q <= threshold,
    };
  }
}

export interface WhitenessSummary {
  /** The test, named with its sources. */
  method: string;
  lags: number;
  /** True when every test with enough samples passed; null when none had enough. */
  white: boolean | null;
  tests: WhitenessResult[];
}

/** The tests of several series together: white only when every testable one is. */
export function whitenessSummary(accumulators: readonly WhitenessAccumulator[], lags: number): WhitenessSummary {
  const tests = accumulators.map((a) => a.result()).filter((r): r is WhitenessResult => r !== null);
  return {
    method:
      'sample autocorrelation at lags 1..L against ±1.96/sqrt(N) (Box and Jenkins 1976) and the Ljung-Box portmanteau Q vs chi-square(L) at 5 % (Ljung and Box 1978)',
    lags,
    white: tests.length > 0 ? tests.every((t) => t.white) : null,
    tests,
  };
}
