// LQR on the relative double integrator, per horizontal axis (gains from lqrGain, i.e. the
// discrete Riccati equation). Allocation-free after construction.
//   a = kr r + kv (vC - vL) + aC         desired lander acceleration (m/s^2), |a| <= maxAccel;
//                                        aC the estimated carrier acceleration (r'' = aC - aL)
//   v_cmd = vL + tau a                   velocity command a first-order lag tau turns into a
// |v_cmd| <= maxSpeed. The carrier's velocity enters through the relative rate, so no
// separate feed-forward is needed (guidance.feedForward only affects the PID law).
import type { GuidanceSpec, LanderSpec } from './Scenario.js';
import { limitNorm2, type HorizontalEstimate, type HorizontalGuidance } from './HorizontalGuidance.js';
import { lqrGain } from './lqrGain.js';
import { NewestCache } from './NewestCache.js';

export class LqrGuidance implements HorizontalGuidance {
  /** Position (1/s^2) and rate (1/s) gains. */
  readonly kr: number;
  readonly kv: number;
  private readonly tau: number;
  private readonly maxAccel: number;
  private readonly maxSpeed: number;

  constructor(spec: GuidanceSpec, lander: LanderSpec, dt: number) {
    const gain = cachedGain(spec.lqrPosition, spec.lqrVelocity, spec.lqrControl, dt);
    this.kr = gain.kr;
    this.kv = gain.kv;
    this.tau = lander.velocityTimeConstant;
    this.maxAccel = lander.maxAccel;
    this.maxSpeed = lander.maxSpeed;
  }

  reset(): void {}

  command(e: HorizontalEstimate, _dt: number, out: Float64Array): void {
    out[0] = this.kr * e.rx + this.kv * (e.vcx - e.vlx) + e.acx;
    out[1] = this.kr * e.ry + this.kv * (e.vcy - e.vly) + e.acy;
    limitNorm2(out, this.maxAccel);
    out[0] = e.vlx + this.tau * out[0]!;
    out[1] = e.vly + this.tau * out[1]!;
    limitNorm2(out, this.maxSpeed);
  }
}

// Every trial of a study solves the same Riccati equation (about 0.3 ms with ml-matrix, 4 % of
// a trial that lands in 8 s): keep the newest few gains, keyed by the exact weights and step.
const gainCache = new NewestCache<{ kr: number; kv: number }>(16);

function cachedGain(q: number, qv: number, rho: number, dt: number): { kr: number; kv: number } {
  return gainCache.get(`${q} ${qv} ${rho} ${dt}`, () => {
    const { kr, kv } = lqrGain(q, qv, rho, dt);
    return { kr, kv };
  });
}
