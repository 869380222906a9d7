// Position-based visual servoing: PID on the estimated horizontal relative position with
// carrier-velocity feed-forward (velocity command, m/s). Allocation-free.
//   v_cmd = [vC + tau aC] + kp r + ki ∫ r dt + kd (vC - vL)
// (tau aC: the velocity loop's lag tau leads a carrier accelerating at aC, the Singer estimate)
// r = p_carrier - p_lander, so a positive error commands motion towards the carrier; the
// derivative of r is the relative velocity vC - vL. The command is limited so the lag tau
// asks for at most maxAccel (|v_cmd - vL| <= maxAccel tau) and in speed (maxSpeed); the integrator
// stops integrating while the output saturates (conditional anti-windup) and while the
// lander is farther than alignRadius from the deck (an integration zone).
import type { GuidanceSpec, LanderSpec } from './Scenario.js';
import { limitNorm2, type HorizontalEstimate, type HorizontalGuidance } from './HorizontalGuidance.js';

export class PidGuidance implements HorizontalGuidance {
  private readonly spec: GuidanceSpec;
  private readonly maxSpeed: number;
  private readonly maxAccel: number;
  private readonly tau: number;
  private ix = 0;
  private iy = 0;
  private readonly integralRadius2: number;

  constructor(spec: GuidanceSpec, lander: LanderSpec) {
    this.spec = spec;
    this.maxSpeed = lander.maxSpeed;
    this.maxAccel = lander.maxAccel;
    this.tau = lander.velocityTimeConstant;
    this.integralRadius2 = spec.alignRadius * spec.alignRadius;
  }

  reset(): void {
    this.ix = 0;
    this.iy = 0;
  }

  command(e: HorizontalEstimate, dt: number, out: Float64Array): void {
    const { kp, ki, kd, feedForward } = this.spec;
    const ff = feedForward ? 1 : 0;
    const rvx = e.vcx - e.vlx, rvy = e.vcy - e.vly;
    // integrate only near the deck (inside alignRadius): the integral is there to remove a small
    // steady offset; fed the approach's metre-sized transient it wound up and overshot the deck by
    // 7 cm, which then decayed at ki's slow pace through the whole descent (boat, every impairment off)
    const near = e.rx * e.rx + e.ry * e.ry < this.integralRadius2;
    const ix = near ? this.ix + e.rx * dt : this.ix, iy = near ? this.iy + e.ry * dt : this.iy;
    out[0] = ff * (e.vcx + this.tau * e.acx) + kp * e.rx + ki * ix + kd * rvx;
    out[1] = ff * (e.vcy + this.tau * e.acy) + kp * e.ry + ki * iy + kd * rvy;
    let dx = out[0]! - e.vlx, dy = out[1]! - e.vly;
    const dn = Math.sqrt(dx * dx + dy * dy);
    const dmax = this.maxAccel * this.tau;
    let clipped = false;
    if (dn > dmax) {
      dx *= dmax / dn;
      dy *= dmax / dn;
      out[0] = e.vlx + dx;
      out[1] = e.vly + dy;
      clipped = true;
    }
    clipped = limitNorm2(out, this.maxSpeed) || clipped;
    if (!clipped) {
      this.ix = ix;
      this.iy = iy;
    }
  }
}
