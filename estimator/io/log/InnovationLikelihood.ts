// The innovation likelihood of one kind of measurement (boxes or odometry) over a replay: for a
// linear-Gaussian filter with the right noise the innovations y_k are independent N(0, S_k), so
//   -2 ln L = sum_k ( ln|2 pi S_k| + y_kᵀ S_k⁻¹ y_k )
// (Mehra 1970, "On the identification of variances and adaptive Kalman filtering", IEEE TAC
// 15(2); Bar-Shalom, Li, Kirubarajan 2001). Minimising it over the noise settings identifies
// them when the data excite them. Counting only; add() allocates nothing.
//
// Beyond a threshold c (the gate) the squared term NIS grows only logarithmically:
// rho = c (1 + ln(NIS / c)), continuous with NIS and its slope at c (a Cauchy-type robust loss,
// common practice in robust estimation). A false box or a burst of bad boxes then weighs little
// whatever its size, yet a noise setting far too small still pays: as S shrinks by s² per axis,
// ln|S| falls by 3 ln s² while each term beyond the gate rises by c ln s², and c > 3.

export interface LikelihoodSummary {
  /** -2 ln L over the updates counted (accepted and gated; NIS beyond the gate log-weighted), in the measurement's units. */
  minus2LogL: number;
  /** Updates counted: accepted, and gated. */
  count: number;
  gated: number;
  /** sum of ln|2 pi S_k| alone (the spread term) and sum of the (weighted) NIS alone. */
  logDetSum: number;
  nisSum: number;
}

const LOG_2PI = Math.log(2 * Math.PI);

export class InnovationLikelihood {
  private count = 0;
  private gated = 0;
  private logDetSum = 0;
  private nisSum = 0;

  /** @param gate NIS beyond which the term grows like ln NIS (the filter's gate threshold). */
  constructor(private readonly gate: number) {}

  /**
   * One update with innovation y (3) and its covariance S (3x3 row-major), as the filter left
   * them; `gated` when the filter refused it at the gate. A non-positive |S| is ignored (the
   * filter reports that as a divergence).
   */
  add(y: Float64Array, S: Float64Array, gated: boolean): void {
    const a = S[0]!, b = S[1]!, c = S[2]!, d = S[4]!, e = S[5]!, f = S[8]!;
    // |S| of the symmetric 3x3 by cofactors; S⁻¹ = adj(S) / |S|.
    const c00 = d * f - e * e, c01 = c * e - b * f, c02 = b * e - c * d;
    const det = a * c00 + b * c01 + c * c02;
    if (!(det > 0) || !Number.isFinite(det)) return;
    const c11 = a * f - c * c, c12 = b * c - a * e, c22 = a * d - b * b;
    const y0 = y[0]!, y1 = y[1]!, y2 = y[2]!;
    // yᵀ S⁻¹ y
    let nis = (y0 * (c00 * y0 + c01 * y1 + c02 * y2) + y1 * (c01 * y0 + c11 * y1 + c12 * y2) + y2 * (c02 * y0 + c12 * y1 + c22 * y2)) / det;
    if (!Number.isFinite(nis)) return;
    // rho = 2 sqrt(c NIS) - c beyond the gate c
    if (nis > this.gate) nis = this.gate * (1 + Math.log(nis / this.gate));
    this.count++;
    if (gated) this.gated++;
    // ln|2 pi S| = 3 ln 2 pi + ln|S|
    this.logDetSum += 3 * LOG_2PI + Math.log(det);
    this.nisSum += nis;
  }

  summary(): LikelihoodSummary {
    return { minus2LogL: this.logDetSum + this.nisSum, count: this.count, gated: this.gated, logDetSum: this.logDetSum, nisSum: this.nisSum };
  }
}
