// Landing supervisor: the phase logic around guidance. Allocation-free per step.
//   acquire -> trail -> align -> descend -> touchdown, with abort back to acquire.
// acquire:   no usable estimate, or re-acquiring after an abort: hold horizontally on the
//            (propagated) estimate if any, climb back towards the trailing height.
// trail:     track the carrier at guidance.trailHeight above the deck.
// align:     inside alignRadius; after alignTime continuously inside -> descend.
// descend:   descend at descentRate only while the horizontal error e is inside the funnel
//              e < funnelBase + funnelSlope * h            (h = height above deck, m)
//            hold height while e < 2 funnel, climb beyond; below flareHeight -> touchdown.
// touchdown: committed: keep tracking horizontally, descend until contact; no abort.
// Abort (trail/align/descend): target unseen longer than lostTimeout, or the filter
// diverged. Vertical commands feed forward the carrier's estimated vertical velocity
// (heave) and are limited to the lander's maxVerticalSpeed.
import type { Phase } from './TrialResult.js';
import type { GuidanceSpec, LanderSpec } from './Scenario.js';
import type { HorizontalEstimate, HorizontalGuidance } from './guidance.js';

/** What the supervisor sees each step (from the filter, never from truth). */
export interface SupervisorInput extends HorizontalEstimate {
  /** An estimate exists (filter initialized and not diverged). */
  valid: boolean;
  /** Estimated height of the lander above the deck, -r_z (m). */
  height: number;
  /** Estimated carrier vertical velocity (m/s). */
  vcz: number;
  /** Time since the last accepted box (s); Infinity when none yet. */
  unseenFor: number;
  /** Time of the last accepted box (s); -Infinity when none yet. */
  lastSeen: number;
  /** The filter reported divergence. */
  diverged: boolean;
}

/** Vertical gain holding the trailing height (1/s). */
const HEIGHT_GAIN = 0.8;

export class LandingSupervisor {
  phase: Phase = 'acquire';
  aborts = 0;
  /** Why the last abort happened ('target-lost' | 'diverged'), null before any. */
  lastAbort: string | null = null;
  private readonly spec: GuidanceSpec;
  private readonly lander: LanderSpec;
  private readonly guidance: HorizontalGuidance;
  private alignSince = 0;
  private abortedAt = -Infinity;

  constructor(spec: GuidanceSpec, lander: LanderSpec, guidance: HorizontalGuidance) {
    this.spec = spec;
    this.lander = lander;
    this.guidance = guidance;
  }

  private abort(t: number, reason: string): void {
    this.aborts++;
    this.lastAbort = reason;
    this.abortedAt = t;
    this.phase = 'acquire';
    this.guidance.reset();
  }

  private climbTowards(target: number, height: number, vcz: number): number {
    const v = vcz + HEIGHT_GAIN * (target - height);
    const m = this.lander.maxVerticalSpeed;
    return v > m ? m : v < -m ? -m : v;
  }

  /**
   * One supervisor step at time t (s): updates the phase and writes the lander velocity
   * command (m/s, world ENU) into out[0..2]. Returns the phase.
   */
  step(t: number, dt: number, s: SupervisorInput, out: Float64Array): Phase {
    const g = this.spec;
    if (this.phase === 'trail' || this.phase === 'align' || this.phase === 'descend') {
      if (s.diverged || !s.valid) this.abort(t, 'diverged');
      else if (s.unseenFor > g.lostTimeout) this.abort(t, 'target-lost');
    }
    if (this.phase === 'acquire') {
      if (!s.valid) {
        out[0] = 0;
        out[1] = 0;
        out[2] = 0;
        return this.phase;
      }
      if (s.lastSeen > this.abortedAt && s.unseenFor < g.lostTimeout) this.phase = 'trail';
    }
    if (this.phase === 'acquire') {
      this.guidance.command(s, dt, out);
      out[2] = this.climbTowards(g.trailHeight, s.height, s.vcz);
      return this.phase;
    }
    this.guidance.command(s, dt, out);
    const error = Math.hypot(s.rx, s.ry);
    const h = s.height;
    switch (this.phase) {
      case 'trail':
        if (error < g.alignRadius) {
          this.phase = 'align';
          this.alignSince = t;
        }
        out[2] = this.climbTowards(g.trailHeight, h, s.vcz);
        break;
      case 'align':
        if (error >= g.alignRadius) this.phase = 'trail';
        else if (t - this.alignSince >= g.alignTime) this.phase = 'descend';
        out[2] = this.climbTowards(g.trailHeight, h, s.vcz);
        break;
      case 'descend': {
        const funnel = g.funnelBase + g.funnelSlope * Math.max(h, 0);
        if (h < g.flareHeight) this.phase = 'touchdown';
        if (error < funnel || this.phase === 'touchdown') out[2] = s.vcz - g.descentRate;
        else if (error < 2 * funnel) out[2] = s.vcz;
        else out[2] = h < g.trailHeight ? s.vcz + g.descentRate : s.vcz;
        break;
      }
      case 'touchdown':
        out[2] = s.vcz - g.descentRate;
        break;
    }
    const m = this.lander.maxVerticalSpeed;
    if (out[2]! > m) out[2] = m;
    else if (out[2]! < -m) out[2] = -m;
    return this.phase;
  }
}
