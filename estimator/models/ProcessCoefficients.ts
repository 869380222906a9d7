// Discrete-time transition and process-noise coefficients of the landing model for one step
// dt. Every block of F and Q is a scalar times I₃ except the attitude blocks, so a handful of
// scalars describe them (per axis; the noise is isotropic):
//   carrier, constant velocity:  vC' = w_c, PSD q_c            (white-noise acceleration)
//   carrier, Singer (Singer 1970, IEEE Trans. AES-6):  vC' = aC, aC' = -aC/τ + w, PSD q_w
//   lander:  vL' = R_wb (f - ba) + g + R_wb w_a, PSD q_a;  ba' = w_b, PSD q_b;  r' = vC - vL.
// Constant-velocity Q per axis (continuous white noise integrated over dt):
//   Q_rr = (q_c + q_a) dt³/3, Q_rvC = q_c dt²/2, Q_rvL = -q_a dt²/2, Q_vCvC = q_c dt,
//   Q_vLvL = q_a dt, Q_baba = q_b dt  (bias-to-velocity couplings O(q_b dt³) are dropped).
// Singer: e = exp(-dt/τ), β = τ(1 - e), α = τ(dt - β); carrier Q_ij = q_w ∫₀^dt g_i g_j ds with
//   g = [τ(s - τ(1 - e^(-s/τ))), τ(1 - e^(-s/τ)), e^(-s/τ)], by 8-point Gauss–Legendre
//   (integrand smooth: exact to round-off at filter step sizes).
// q_w = σ²/τ² where σ = carrierAccelNoise, so the Singer acceleration has the same
// low-frequency spectral density as the white-noise model and tends to it as τ → 0.
// The carrier's vertical axis (z, Up) may have its own density σ_z (carrierVerticalAccelNoise,
// default σ): a ground carrier barely moves vertically, a boat heaves. Its carrier blocks are the
// same formulas with q_cz = σ_z² in place of q_c (the *Z fields); every other block is isotropic.

export interface ProcessCoefficients {
  dt: number;
  singer: boolean;
  /** Singer transition scalars: r += α aC, vC += β aC, aC *= e. */
  alpha: number;
  beta: number;
  e: number;
  /** Per-axis process noise (already multiplied by qScale). */
  Qrr: number;
  QrVc: number;
  QrVl: number;
  QrAc: number;
  QVcVc: number;
  QVcAc: number;
  QAcAc: number;
  QVlVl: number;
  QBaBa: number;
  /** The carrier blocks of the vertical axis (z), from carrierVerticalAccelNoise. */
  QrrZ: number;
  QrVcZ: number;
  QrAcZ: number;
  QVcVcZ: number;
  QVcAcZ: number;
  QAcAcZ: number;
}

export function emptyProcessCoefficients(singer: boolean): ProcessCoefficients {
  return { dt: Number.NaN, singer, alpha: 0, beta: 0, e: 1, Qrr: 0, QrVc: 0, QrVl: 0, QrAc: 0, QVcVc: 0, QVcAc: 0, QAcAc: 0, QVlVl: 0, QBaBa: 0, QrrZ: 0, QrVcZ: 0, QrAcZ: 0, QVcVcZ: 0, QVcAcZ: 0, QAcAcZ: 0 };
}

/** Noise densities of the model (continuous PSDs, before qScale). */
export interface ProcessNoise {
  /** Carrier acceleration noise density σ (m/s² / sqrt(Hz)). */
  carrierAccelNoise: number;
  /** The carrier's vertical acceleration noise density σ_z (m/s² / sqrt(Hz)); default σ. */
  carrierVerticalAccelNoise?: number;
  /** Singer time constant τ (s); ignored for constant velocity. */
  singerTau: number;
  /** Accelerometer noise density (m/s² / sqrt(Hz)). */
  accelNoise: number;
  /** Accelerometer bias random walk (m/s³ / sqrt(Hz)). */
  accelBiasWalk: number;
  /** Multiplier on Q. */
  qScale: number;
}

// 8-point Gauss–Legendre nodes and weights on [-1, 1] (Abramowitz & Stegun 1964, Table 25.4).
const GL_NODES = [-0.9602898564975363, -0.7966664774136267, -0.5255324099163290, -0.1834346424956498, 0.1834346424956498, 0.5255324099163290, 0.7966664774136267, 0.9602898564975363];
const GL_WEIGHTS = [0.1012285362903763, 0.2223810344533745, 0.3137066458778873, 0.3626837833783620, 0.3626837833783620, 0.3137066458778873, 0.2223810344533745, 0.1012285362903763];

/** Fill `out` for step dt (s). Recomputes only when dt changed since the last call. */
export function processCoefficients(dt: number, noise: ProcessNoise, out: ProcessCoefficients): ProcessCoefficients {
  if (out.dt === dt) return out;
  out.dt = dt;
  const qc = noise.carrierAccelNoise * noise.carrierAccelNoise * noise.qScale;
  const sz = noise.carrierVerticalAccelNoise ?? noise.carrierAccelNoise;
  const qcz = sz * sz * noise.qScale;
  const qa = noise.accelNoise * noise.accelNoise * noise.qScale;
  const qb = noise.accelBiasWalk * noise.accelBiasWalk * noise.qScale;
  const dt2 = dt * dt, dt3 = dt2 * dt;
  out.QrVl = (-qa * dt2) / 2;
  out.QVlVl = qa * dt;
  out.QBaBa = qb * dt;
  if (!out.singer) {
    out.Qrr = (qa * dt3) / 3 + (qc * dt3) / 3;
    out.QrVc = (qc * dt2) / 2;
    out.QVcVc = qc * dt;
    out.QrrZ = (qa * dt3) / 3 + (qcz * dt3) / 3;
    out.QrVcZ = (qcz * dt2) / 2;
    out.QVcVcZ = qcz * dt;
    return out;
  }
  const tau = noise.singerTau;
  const oneMinusE = -Math.expm1(-dt / tau);
  out.e = 1 - oneMinusE;
  out.beta = tau * oneMinusE;
  out.alpha = tau * (dt - out.beta);
  let rr = 0, rv = 0, ra = 0, vv = 0, va = 0, aa = 0;
  for (let k = 0; k < 8; k++) {
    const s = (dt / 2) * (GL_NODES[k]! + 1);
    const w = (dt / 2) * GL_WEIGHTS[k]!;
    const om = -Math.expm1(-s / tau);
    const gr = tau * (s - tau * om), gv = tau * om, ga = 1 - om;
    rr += w * gr * gr; rv += w * gr * gv; ra += w * gr * ga;
    vv += w * gv * gv; va += w * gv * ga; aa += w * ga * ga;
  }
  const qw = qc / (tau * tau), qwz = qcz / (tau * tau);
  out.Qrr = (qa * dt3) / 3 + qw * rr;
  out.QrVc = qw * rv;
  out.QrAc = qw * ra;
  out.QVcVc = qw * vv;
  out.QVcAc = qw * va;
  out.QAcAc = qw * aa;
  out.QrrZ = (qa * dt3) / 3 + qwz * rr;
  out.QrVcZ = qwz * rv;
  out.QrAcZ = qwz * ra;
  out.QVcVcZ = qwz * vv;
  out.QVcAcZ = qwz * va;
  out.QAcAcZ = qwz * aa;
  return out;
}

/**
 * A few coefficient sets keyed by their exact dt. A clock t = k Δ gives steps t - t_prev that
 * differ from Δ in the last bits (about ten distinct values in a trial), so a single set would
 * be recomputed at most steps — with the Singer model that is nine exponentials each time.
 * Allocation-free after construction; entries are replaced round-robin.
 */
export class ProcessCoefficientCache {
  private readonly entries: ProcessCoefficients[];
  private next = 0;

  constructor(singer: boolean, readonly noise: ProcessNoise, size = 16) {
    this.entries = Array.from({ length: size }, () => emptyProcessCoefficients(singer));
  }

  /** The coefficients for step dt (s), computed on first use. Do not modify the result. */
  get(dt: number): ProcessCoefficients {
    const entries = this.entries;
    for (let i = 0; i < entries.length; i++) if (entries[i]!.dt === dt) return entries[i]!;
    const entry = entries[this.next]!;
    this.next = (this.next + 1) % entries.length;
    entry.dt = Number.NaN;
    return processCoefficients(dt, this.noise, entry);
  }

  /** Forget every entry. */
  clear(): void {
    for (const entry of this.entries) entry.dt = Number.NaN;
  }
}
