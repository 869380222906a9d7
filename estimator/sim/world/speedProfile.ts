// Speed along the carrier's path as a function of time, with its exact integral (distance
// travelled) and derivative, so positions sampled from a path have exactly this speed.
// Pure functions of t; allocation-free.
import type { SpeedProfile } from '../Scenario.js';
import { CarrierPathError } from './CarrierPathError.js';

/** Distance s (m), speed v (m/s) and along-path acceleration a (m/s^2) at one time. */
export interface ProfileSample {
  s: number;
  v: number;
  a: number;
}

/**
 * Speed profile v(t) = g(t) (V + A sin(w t + phi)), with the linear ramp g(t) = min(t / T, 1),
 * V the cruise speed, A the variation amplitude, w = 2 pi / period and phi the phase the trial
 * starts at (a landing begins at any moment of the traffic's ebb and flow). t < 0 is treated as 0.
 * The ramp's end is a step in acceleration (a truck that stops accelerating), not in speed.
 * Requires A <= V so the carrier never reverses.
 */
export class SpeedProfileModel {
  private readonly cruise: number;
  private readonly ramp: number;
  private readonly amplitude: number;
  private readonly omega: number;
  private readonly distanceAtRampEnd: number;
  private readonly phase: number;

  constructor(cruiseSpeed: number, profile: SpeedProfile, phase = 0) {
    if (!(cruiseSpeed >= 0)) throw new CarrierPathError('carrier.speed', `must be >= 0 m/s, got ${cruiseSpeed}`);
    if (!(profile.rampTime >= 0)) throw new CarrierPathError('carrier.profile.rampTime', `must be >= 0 s, got ${profile.rampTime}`);
    if (!(profile.variation >= 0) || profile.variation > cruiseSpeed) {
      throw new CarrierPathError('carrier.profile.variation', `must lie in [0, speed = ${cruiseSpeed}] m/s so the carrier never reverses, got ${profile.variation}`);
    }
    const varies = profile.variation > 0 && profile.variationPeriod > 0;
    this.cruise = cruiseSpeed;
    this.ramp = profile.rampTime;
    this.amplitude = varies ? profile.variation : 0;
    this.omega = varies ? (2 * Math.PI) / profile.variationPeriod : 0;
    this.phase = phase;
    this.distanceAtRampEnd = this.ramp > 0 ? this.rampDistance(this.ramp) : 0;
  }

  // s(t) = V t^2 / (2T) + (A / T) (sin(w t + phi) - w t cos(w t + phi) - sin phi) / w^2      for t <= T
  private rampDistance(t: number): number {
    const { cruise: V, ramp: T, amplitude: A, omega: w, phase: phi } = this;
    let s = (V * t * t) / (2 * T);
    if (A > 0) s += (A / T) * (Math.sin(w * t + phi) - w * t * Math.cos(w * t + phi) - Math.sin(phi)) / (w * w);
    return s;
  }

  /** Distance, speed and along-path acceleration at time t (s), written into out. */
  sample(t: number, out: ProfileSample): ProfileSample {
    const { cruise: V, ramp: T, amplitude: A, omega: w } = this;
    const time = t > 0 ? t : 0;
    const sinWt = A > 0 ? Math.sin(w * time + this.phase) : 0;
    const cosWt = A > 0 ? Math.cos(w * time + this.phase) : 1;
    if (time < T) {
      const g = time / T;
      out.s = this.rampDistance(time);
      out.v = g * (V + A * sinWt);
      // a = (V + A sin wt) / T + g A w cos wt
      out.a = (V + A * sinWt) / T + g * A * w * cosWt;
    } else {
      // s(t) = s(T) + V (t - T) + (A / w) (cos(w T + phi) - cos(w t + phi))
      out.s = this.distanceAtRampEnd + V * (time - T);
      if (A > 0) out.s += (A / w) * (Math.cos(w * T + this.phase) - cosWt);
      out.v = V + A * sinWt;
      out.a = A * w * cosWt;
    }
    if (t < 0) out.a = 0;
    return out;
  }
}
