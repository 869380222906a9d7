// Dryden wind gusts, MIL-F-8785C low-altitude form (L_w = h; MIL-HDBK-1797's factor-2
// length convention is NOT used). Frozen turbulence swept past at the airspeed.
// step() is allocation-free: exact discrete-time shaping filters on a fixed-size state.
import type { TurbulenceLevel } from '../Scenario.js';
import type { RandomStream } from '../../random/RandomStream.js';

const FT = 0.3048; // m per ft
const KNOT_FT_S = 1852 / 3600 / FT; // ft/s per knot

/** W20 (wind speed at 20 ft) per level, knots (MIL-F-8785C: light 15, moderate 30, severe 45). */
export const W20_KNOTS: Record<TurbulenceLevel, number> = { none: 0, light: 15, moderate: 30, severe: 45 };

/**
 * Heights are clamped to [10 ft, 1000 ft]: below 10 ft the scale lengths collapse; above
 * 1000 ft the low-altitude values at 1000 ft are kept (the standard's medium/high-altitude
 * model is not implemented; the lander works near the ground).
 */
export const DRYDEN_MIN_HEIGHT_FT = 10;
export const DRYDEN_MAX_HEIGHT_FT = 1000;
/**
 * Airspeed floor (m/s). With frozen turbulence a hovering lander in still air would see a
 * frozen gust forever (time scale L / V -> infinity); real eddies still evolve, so the
 * field is swept past at no less than this speed.
 */
export const DRYDEN_MIN_AIRSPEED = 1;

export interface DrydenScales {
  /** Scale lengths (ft). */
  Lu: number;
  Lv: number;
  Lw: number;
  /** Intensities (ft/s, 1 sigma). */
  sigmaU: number;
  sigmaV: number;
  sigmaW: number;
}

/**
 * MIL-F-8785C low altitude (h in ft, W20 in kt), h clamped to [10, 1000] ft:
 *   L_w = h,  L_u = L_v = h / (0.177 + 0.000823 h)^1.2,
 *   sigma_w = 0.1 W20,  sigma_u = sigma_v = sigma_w / (0.177 + 0.000823 h)^0.4.
 * @example drydenScales(20, 15).Lu // 143.59 ft
 */
export function drydenScales(heightFt: number, w20Kt: number): DrydenScales {
  return drydenScalesInto(heightFt, w20Kt, { Lu: 0, Lv: 0, Lw: 0, sigmaU: 0, sigmaV: 0, sigmaW: 0 });
}

/** drydenScales writing into an existing object (allocation-free for the step loop). */
export function drydenScalesInto(heightFt: number, w20Kt: number, out: DrydenScales): DrydenScales {
  const h = Math.min(Math.max(heightFt, DRYDEN_MIN_HEIGHT_FT), DRYDEN_MAX_HEIGHT_FT);
  // base^-1.2 and base^-0.4 from one logarithm
  const logBase = Math.log(0.177 + 0.000823 * h);
  out.Lu = out.Lv = h * Math.exp(-1.2 * logBase);
  out.Lw = h;
  out.sigmaW = 0.1 * w20Kt * KNOT_FT_S;
  out.sigmaU = out.sigmaV = out.sigmaW * Math.exp(-0.4 * logBase);
  return out;
}

// P(3, y) = 1 - e^-y (1 + y + y^2/2), the regularised lower incomplete gamma, computed without
// cancellation for small y by its series e^-y sum_{k>=3} y^k / k!.
function gammaP3(y: number): number {
  if (y > 1) return 1 - Math.exp(-y) * (1 + y + (y * y) / 2);
  let term = (y * y * y) / 6;
  let sum = 0;
  for (let k = 3; term > 1e-18 * sum || k === 3; k++) {
    sum += term;
    term *= y / (k + 1);
  }
  return Math.exp(-y) * sum;
}

/**
 * Gust generator. u (longitudinal) lies along the mean-wind direction given at construction,
 * v is horizontal and to its left, w is up; output in world ENU (m/s).
 *
 * u: first-order Markov, R_u(xi) = sigma_u^2 exp(-xi / L_u); exact discretisation with
 *    x = V dt / L_u:  u+ = e^-x u + sqrt(1 - e^-2x) n.
 * v, w: Dryden transfer function (1 + sqrt(3) T s) / (1 + T s)^2, T = L / V, realised in
 *    states z1, z2 scaled to unit stationary variance, output sigma (z1 + sqrt(3) z2) / 2:
 *    Phi = e^-x [[1 + x, x], [-x, 1 - x]],
 *    Q = [[P(3, 2x), 2 x^2 e^-2x], [2 x^2 e^-2x, P(3, 2x) + 4 x e^-2x]]  (Phi Phi^T + Q = I),
 *    so R(xi) = sigma^2 exp(-xi / L) (1 - xi / (2 L)).
 */
export class DrydenGust {
  private readonly stream: RandomStream;
  private readonly w20Kt: number;
  private readonly cosDir: number;
  private readonly sinDir: number;
  /** Normalised filter states: u, then (z1, z2) for v and for w. */
  private readonly state = new Float64Array(5);
  private started = false;
  private readonly scratch: DrydenScales = { Lu: 0, Lv: 0, Lw: 0, sigmaU: 0, sigmaV: 0, sigmaW: 0 };

  /** directionRad: direction the mean wind blows towards (rad from East, CCW); default East. */
  constructor(level: TurbulenceLevel, stream: RandomStream, directionRad = 0) {
    this.w20Kt = W20_KNOTS[level];
    this.stream = stream;
    this.cosDir = Math.cos(directionRad);
    this.sinDir = Math.sin(directionRad);
  }

  /** Draw the initial state from the stationary distribution (each normalised state ~ N(0, 1)). */
  private start(): void {
    for (let i = 0; i < 5; i++) this.state[i] = this.stream.gaussian();
    this.started = true;
  }

  /**
   * Advance by dt (s) at height heightM (m above ground) and airspeed (m/s, floored at
   * DRYDEN_MIN_AIRSPEED); write the gust velocity in world ENU (m/s) into out. Level 'none'
   * writes zeros and draws nothing.
   */
  step(dt: number, heightM: number, airspeed: number, out: Float64Array): Float64Array {
    if (this.w20Kt === 0) {
      out[0] = 0; out[1] = 0; out[2] = 0;
      return out;
    }
    const scales = drydenScalesInto(heightM / FT, this.w20Kt, this.scratch);
    const V = Math.max(airspeed, DRYDEN_MIN_AIRSPEED) / FT; // ft/s
    const s = this.state;
    if (!this.started) this.start();
    else if (dt > 0) {
      const rng = this.stream;
      // u: first-order
      const xu = (V * dt) / scales.Lu;
      s[0] = Math.exp(-xu) * s[0]! + Math.sqrt(-Math.expm1(-2 * xu)) * rng.gaussian();
      // v (states 1, 2) with L_v, w (states 3, 4) with L_w
      this.secondOrder(1, (V * dt) / scales.Lv);
      this.secondOrder(3, (V * dt) / scales.Lw);
    }
    const u = scales.sigmaU * s[0]! * FT;
    const v = (scales.sigmaV * (s[1]! + Math.sqrt(3) * s[2]!) * FT) / 2;
    const w = (scales.sigmaW * (s[3]! + Math.sqrt(3) * s[4]!) * FT) / 2;
    out[0] = u * this.cosDir - v * this.sinDir;
    out[1] = u * this.sinDir + v * this.cosDir;
    out[2] = w;
    return out;
  }

  private secondOrder(i: number, x: number): void {
    const s = this.state;
    const e = Math.exp(-x);
    const e2 = e * e;
    const z1 = s[i]!, z2 = s[i + 1]!;
    const q11 = gammaP3(2 * x);
    const q12 = 2 * x * x * e2;
    const q22 = q11 + 4 * x * e2;
    // Cholesky of Q
    const l11 = Math.sqrt(q11);
    const l21 = l11 > 0 ? q12 / l11 : 0;
    const l22 = Math.sqrt(Math.max(q22 - l21 * l21, 0));
    const n1 = this.stream.gaussian(), n2 = this.stream.gaussian();
    s[i] = e * ((1 + x) * z1 + x * z2) + l11 * n1;
    s[i + 1] = e * (-x * z1 + (1 - x) * z2) + l21 * n1 + l22 * n2;
  }
}

