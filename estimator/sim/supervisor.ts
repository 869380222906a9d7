// Landing supervisor: the phase logic around guidance. Allocation-free per step.
//   acquire -> trail -> align -> descend -> touchdown, with abort back to acquire.
// acquire:   before the first box or after an abort until a box newer than the abort is
//            accepted and the filter's start is confirmed (input.confirmed: boxes after the
//            starting box agreed with it, so a lone false box is not descended on): keep the last horizontal command (dead reckoning), climb back towards
//            the trailing height while the estimate is fresh (seen < 2 lostTimeout ago), else hold.
// trail:     track the carrier at guidance.trailHeight above the deck.
// align:     inside alignRadius; after alignTime continuously inside -> descend.
// descend:   descend at descentRate only while the horizontal error e is inside the funnel
//              e < funnel = funnelBase + funnelSlope * h   (h = height above deck, m)
//            slower outside it, holding height at e = 2 funnel and climbing at descentRate
//            from e = 3 funnel (linear between: no thrust chatter); below flareHeight -> touchdown.
// touchdown: committed: keep tracking horizontally, descend until contact; no abort.
// While blind (the predicted outline leaves the image: input.blind, or below a fixed blind
// height if one is given) and no box came for 0.1 s, descents run 1.5x faster and without
// heave feed-forward.
// Abort (trail/align/descend): target unseen longer than lostTimeout (except in a descent
// while blind, where the target overflows the image), or the filter diverged. Vertical commands feed forward the carrier's estimated vertical velocity
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
  /** The predicted image of the deck outline reaches the image edge (OutlineForecast): boxes are expected to stop. */
  blind: boolean;
  /** The filter's latest start was confirmed by the boxes after it (not a lone, possibly false, box). */
  confirmed: boolean;
}

/**
 * A planning figure: the height above the deck (m) at which a level nadir camera centred over
 * the deck sees the deck's longest side Lmax reach the edge margin along the image's shorter
 * axis (the worst orientation):
 *   h = Lmax max(fx, fy) / (min(W, H) - 2 edgeMargin)
 * The supervisor does not use it: it asks OutlineForecast each step, from its estimates.
 */
export function blindHeight(camera: { fx: number; fy: number; width: number; height: number }, deckLength: number, deckWidth: number, edgeMargin: number): number {
  const pixels = Math.max(Math.min(camera.width, camera.height) - 2 * edgeMargin, 1);
  return (Math.max(deckLength, deckWidth) * Math.max(camera.fx, camera.fy)) / pixels;
}

/** Vertical gain holding the trailing height (1/s) and its rate limit (m/s): gentle, because a
 * fast height change unloads the rotors and any horizontal correction then tilts the camera far. */
const HEIGHT_GAIN = 0.5;
const HEIGHT_RATE = 1;
/** Below the blind height the descent speeds up by this factor: no new boxes come, so the
 * estimate only drifts from here on; less time blind means less drift. */
const BLIND_DESCENT_FACTOR = 1.5;
/** ... once boxes have actually stopped this long (s): the forecast errs early on purpose, and
 * boxes still coming are worth more than the faster descent. */
const BLIND_AFTER = 0.1;

export class LandingSupervisor {
  phase: Phase = 'acquire';
  aborts = 0;
  /** Why the last abort happened ('target-lost' | 'diverged'), null before any. */
  lastAbort: string | null = null;
  private readonly spec: GuidanceSpec;
  private readonly lander: LanderSpec;
  private readonly guidance: HorizontalGuidance;
  private readonly blindHeight: number;
  private alignSince = 0;
  private abortedAt = -Infinity;

  /**
   * @param blindHeight height above the deck (m) below which the target is expected to
   *   overflow the image (the detector then loses it at the edge): a descent below it does
   *   not abort for a lost target, it carries on on the estimate. Default 0.
   */
  constructor(spec: GuidanceSpec, lander: LanderSpec, guidance: HorizontalGuidance, blindHeight = 0) {
    this.spec = spec;
    this.lander = lander;
    this.guidance = guidance;
    this.blindHeight = blindHeight;
  }

  private abort(t: number, reason: string): void {
    this.aborts++;
    this.lastAbort = reason;
    this.abortedAt = t;
    this.phase = 'acquire';
    this.guidance.reset();
  }

  private climbTowards(target: number, height: number, vcz: number): number {
    let v = HEIGHT_GAIN * (target - height);
    v = v > HEIGHT_RATE ? HEIGHT_RATE : v < -HEIGHT_RATE ? -HEIGHT_RATE : v;
    v += vcz;
    const m = this.lander.maxVerticalSpeed;
    return v > m ? m : v < -m ? -m : v;
  }

  /** Descent command: heave fed forward while boxes come; blind, a plain faster descent (an
   * extrapolated heave velocity is worse than none). */
  private descent(s: SupervisorInput): number {
    return this.isBlind(s) && s.unseenFor > BLIND_AFTER ? -BLIND_DESCENT_FACTOR * this.spec.descentRate : s.vcz - this.spec.descentRate;
  }

  /** Boxes are expected to stop: the predicted outline leaves the image, or below the fixed blind height (if one was given). */
  private isBlind(s: SupervisorInput): boolean {
    return s.blind || s.height < this.blindHeight;
  }

  /**
   * One supervisor step at time t (s): updates the phase and writes the lander velocity
   * command (m/s, world ENU) into out[0..2]. Returns the phase.
   */
  step(t: number, dt: number, s: SupervisorInput, out: Float64Array): Phase {
    const g = this.spec;
    if (this.phase === 'trail' || this.phase === 'align' || this.phase === 'descend') {
      if (s.diverged || !s.valid) this.abort(t, 'diverged');
      else if (s.unseenFor > g.lostTimeout && !(this.phase === 'descend' && this.isBlind(s))) this.abort(t, 'target-lost');
    }
    if (this.phase === 'acquire') {
      if (s.valid && s.confirmed && s.lastSeen > this.abortedAt && s.unseenFor < g.lostTimeout) this.phase = 'trail';
      else {
        // keep the last horizontal command (dead reckoning on the carrier's last velocity);
        // climb back towards the trailing height while the estimate is still fresh, else hold
        const fresh = s.valid && s.unseenFor < 2 * g.lostTimeout;
        out[2] = fresh && s.height < g.trailHeight ? this.climbTowards(g.trailHeight, s.height, s.vcz) : 0;
        return this.phase;
      }
    }
    this.guidance.command(s, dt, out);
    const error = Math.sqrt(s.rx * s.rx + s.ry * s.ry);
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
        // continuous in the error, so the thrust does not chatter at the funnel's edge:
        // 1 inside the funnel, falling linearly to 0 (hold) at 2 funnel and -1 (climb) at 3 funnel
        let factor = error <= funnel ? 1 : Math.max(-1, 2 - error / funnel);
        if (this.phase === 'touchdown') factor = 1;
        if (factor < 0 && h >= g.trailHeight) factor = 0;
        out[2] = factor > 0 ? factor * this.descent(s) + (1 - factor) * s.vcz : s.vcz - factor * g.descentRate;
        break;
      }
      case 'touchdown':
        out[2] = this.descent(s);
        break;
    }
    const m = this.lander.maxVerticalSpeed;
    if (out[2]! > m) out[2] = m;
    else if (out[2]! < -m) out[2] = -m;
    return this.phase;
  }
}
