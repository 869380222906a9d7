// Position-based visual servoing: PID on the estimated horizontal relative position with
// carrier-velocity feed-forward (velocity command, m/s). Allocation-free.
//   v_cmd = [vC] + kp r + ki ∫ r dt + kd (vC - vL)
// r = p_carrier - p_lander, so a positive error commands motion towards the carrier; the
// derivative of r is the relative velocity vC - vL. The command is limited so the lag tau
// asks for at most maxAccel (|v_cmd - vL| <= maxAccel tau) and in speed (maxSpeed); the integrator
// stops integrating while the output saturates (conditional anti-windup).
import type { GuidanceSpec, LanderSpec } from './Scenario.js';
import { limitNorm2, type HorizontalEstimate, type HorizontalGuidance } from './HorizontalGuidance.js';

export class PidGuidance implements HorizontalGuidance {
  private readonly spec: GuidanceSpec;
  private readonly maxSpeed: number;
  private readonly maxAccel: number;
  private readonly tau: number;
  private ix = 0;
  private iy = 0;

  constructor(spec: GuidanceSpec, lander: LanderSpec) {
    this.spec = spec;
    this.maxSpeed = lander.maxSpeed;
    this.maxAccel = lander.maxAccel;
    this.tau = lander.velocityTimeConstant;
  }

  reset(): void {
    this.ix = 0;
    this.iy = 0;
  }

  command(e: HorizontalEstimate, dt: number, out: Float64Array): void {
    const { kp, ki, kd, feedForward } = this.spec;
    const ff = feedForward ? 1 : 0;
    const rvx = e.vcx - e.vlx, rvy = e.vcy - e.vly;
    const ix = this.ix + e.rx * dt, iy = this.iy + e.ry * dt;
    out[0] = ff * e.vcx + kp * e.rx + ki * ix + kd * rvx;
    out[1] = ff * e.vcy + kp * e.ry + ki * iy + kd * rvy;
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
