// The trial's failure-attribution log: what the trial knows while it flies, recorded as a few
// events in a fixed ring of typed arrays. Every method allocates nothing; events() builds
// objects once, after the trial, and only for trials that did not land.
//   dropout burst:  the carrier visible but no box of it for >= max(3 frames, MIN_BURST) s
//   latency spike:  a frame later than latency + max(3 jitter, LATE_MARGIN) s
//   false box:      a spurious box accepted by the filter or starting an acquisition
//   gust:           horizontal gust beyond the mean wind > max(GUST_FLOOR, GUST_SIGMAS sigma_u(h))
//   gated boxes:    >= GATED_RUN camera boxes in a row refused by the gate
//   funnel exit:    in descend/touchdown, |estimated - true horizontal r| > funnelBase + funnelSlope h
//   blind:          in descend/touchdown, the predicted outline leaves the image or the estimated
//                   height is below the blind height (once per episode)
//   divergence, abort, acquired: as the filter and supervisor report them
//   silent divergence: the simulator's truth-side watch found the estimate far from the truth
import type { DetectorFrame, DetectorTruth } from '../world/detector.js';
import { drydenScalesInto, W20_KNOTS } from '../world/dryden.js';
import type { Scenario } from '../Scenario.js';
import { PHASES, type Phase } from '../Phase.js';
import type { UpdateStatus } from '../../models/LandingFilter.js';
import { EV_ABORT, EV_ACQUIRED, EV_BLIND, EV_BURST, EV_DIVERGENCE, EV_FALSE_BOX, EV_FUNNEL, EV_GATED, EV_GUST, EV_LATENCY, EV_SILENT, EVENT_NAMES, type FailureEvent } from './FailureEvent.js';

/** Events kept (the newest win): a trial records a handful; 128 leaves room for a noisy one. */
export const LOG_CAPACITY = 128;
/** Shortest loss run counted as a burst (s): a quarter second is 7 frames at 30 Hz, which i.i.d. loss of 5 % gives once in ~10^9 frames. */
export const MIN_BURST = 0.25;
/** A frame is late when its delay exceeds the nominal latency by max(3 jitter, this) (s). */
export const LATE_MARGIN = 0.05;
/**
 * A gust event exceeds this many sigma_u of the Dryden turbulence: the horizontal gust is 2-D,
 * its magnitude Rayleigh with P(|g| > k sigma) = exp(-k^2 / 2), so 3 sigma is exceeded 1.1 % of
 * the time (every light-turbulence trial had "gusts"); 4 sigma, 0.03 %.
 */
export const GUST_SIGMAS = 4;
/** Gusts below this (m/s) are never events, even without turbulence. */
export const GUST_FLOOR = 1;
/** Refused boxes in a row that make an event. */
export const GATED_RUN = 3;
/** Two false boxes closer than this (s) belong to one event. */
const FALSE_BOX_MERGE = 1;
const FT = 0.3048;

/** What the log reads from the supervisor's view each step (SupervisorInput satisfies it). */
export interface EstimateView {
  valid: boolean;
  /** The predicted outline leaves the image (SupervisorInput.blind). */
  blind: boolean;
  diverged: boolean;
  rx: number;
  ry: number;
  height: number;
}

export class FailureLog {
  private readonly kind = new Uint8Array(LOG_CAPACITY);
  private readonly time = new Float64Array(LOG_CAPACITY);
  private readonly phaseOf = new Uint8Array(LOG_CAPACITY);
  private readonly heightOf = new Float64Array(LOG_CAPACITY);
  private readonly value = new Float64Array(LOG_CAPACITY);
  /** Events recorded so far (the ring keeps the last LOG_CAPACITY). */
  total = 0;

  private readonly frameInterval: number;
  private readonly minBurst: number;
  private readonly lateLimit: number;
  private readonly meanEast: number;
  private readonly meanNorth: number;
  private readonly w20: number;
  private readonly funnelBase: number;
  private readonly funnelSlope: number;
  private readonly blindHeight: number;
  private readonly scales = { Lu: 0, Lv: 0, Lw: 0, sigmaU: 0, sigmaV: 0, sigmaW: 0 };

  // context of the latest step, stamped on events recorded between steps
  private phase = 0;
  private height = 0;
  // open runs: the serial number of the event they extend, -1 when none is open
  private lostSince = Number.NaN;
  private burstEvent = -1;
  private lateEvent = -1;
  private gatedSince = Number.NaN;
  private gatedCount = 0;
  private gatedEvent = -1;
  private gustEvent = -1;
  private funnelEvent = -1;
  private falseBoxEvent = -1;
  private blindSeen = false;
  private divergenceSeen = false;

  constructor(scenario: Scenario, blindHeight: number) {
    const { detector, guidance, lander } = scenario;
    this.frameInterval = 1 / detector.rate;
    this.minBurst = Math.max(3 * this.frameInterval, MIN_BURST);
    this.lateLimit = detector.latency + Math.max(3 * detector.latencyJitter, LATE_MARGIN);
    const direction = (lander.wind.directionDeg * Math.PI) / 180;
    this.meanEast = lander.wind.speed * Math.cos(direction);
    this.meanNorth = lander.wind.speed * Math.sin(direction);
    this.w20 = W20_KNOTS[lander.wind.turbulence];
    this.funnelBase = guidance.funnelBase;
    this.funnelSlope = guidance.funnelSlope;
    this.blindHeight = blindHeight;
  }

  private record(kind: number, t: number, value: number): number {
    const serial = this.total++;
    const slot = serial % LOG_CAPACITY;
    this.kind[slot] = kind;
    this.time[slot] = t;
    this.phaseOf[slot] = this.phase;
    this.heightOf[slot] = this.height;
    this.value[slot] = value;
    return serial;
  }

  /** Slot of an open event, or -1 when it was never opened or has left the ring. */
  private slotOf(serial: number): number {
    return serial >= 0 && this.total - serial <= LOG_CAPACITY ? serial % LOG_CAPACITY : -1;
  }

  private raise(serial: number, value: number): void {
    const slot = this.slotOf(serial);
    if (slot >= 0 && value > this.value[slot]!) this.value[slot] = value;
  }

  /** A camera frame captured at t: `frame` is what the detector delivered for the carrier (null: nothing). */
  capture(t: number, frame: DetectorFrame | null, truth: DetectorTruth): void {
    if (truth.visible && (frame === null || frame.falseBox)) {
      if (!(this.lostSince === this.lostSince)) this.lostSince = t; // NaN: a new run starts
      const length = t - this.lostSince + this.frameInterval;
      if (length >= this.minBurst - 1e-9) {
        if (this.burstEvent < 0) {
          this.burstEvent = this.record(EV_BURST, this.lostSince, length);
        } else this.raise(this.burstEvent, length);
      }
    } else if (frame !== null || !truth.visible) {
      this.lostSince = Number.NaN;
      this.burstEvent = -1;
    }
    if (frame !== null) {
      const delay = frame.arrivalTime - frame.captureTime;
      if (delay > this.lateLimit) {
        if (this.lateEvent < 0) this.lateEvent = this.record(EV_LATENCY, t, delay);
        else this.raise(this.lateEvent, delay);
      } else this.lateEvent = -1;
    }
  }

  /** A box update's outcome at t (falseBox: the box was not the carrier). */
  box(t: number, falseBox: boolean, status: UpdateStatus): void {
    if (status === 'gated') {
      if (this.gatedCount === 0) this.gatedSince = t;
      this.gatedCount++;
      if (this.gatedCount >= GATED_RUN) {
        if (this.gatedEvent < 0) this.gatedEvent = this.record(EV_GATED, this.gatedSince, this.gatedCount);
        else this.raise(this.gatedEvent, this.gatedCount);
      }
    } else if (status === 'accepted') {
      this.gatedCount = 0;
      this.gatedEvent = -1;
      if (falseBox) this.falseBoxTaken(t);
    }
  }

  /** Count a false box taken at t into the open false-box event, or open one. */
  private falseBoxTaken(t: number): void {
    const slot = this.slotOf(this.falseBoxEvent);
    if (slot >= 0 && t - this.time[slot]! < FALSE_BOX_MERGE) this.value[slot] = this.value[slot]! + 1;
    else this.falseBoxEvent = this.record(EV_FALSE_BOX, t, 1);
  }

  /** The filter (re)started from a box at t; `again`: not the first acquisition. */
  acquired(t: number, falseBox: boolean, again: boolean): void {
    this.record(EV_ACQUIRED, t, again ? 1 : 0);
    this.falseBoxEvent = -1;
    if (falseBox) this.falseBoxTaken(t);
    this.gatedCount = 0;
    this.gatedEvent = -1;
    this.funnelEvent = -1;
    this.blindSeen = false;
    this.divergenceSeen = false;
  }

  /** The simulator named the estimate far from the truth at t; `silent`: the filter's NIS stayed calm. */
  farFromTruth(t: number, silent: boolean): void {
    this.record(EV_SILENT, t, silent ? 1 : 0);
  }

  /** The supervisor aborted at t ('target-lost' or 'diverged'). */
  abort(t: number, reason: string | null): void {
    this.record(EV_ABORT, t, reason === 'diverged' ? 1 : 0);
  }

  /** Once per step, after the supervisor: phase, truth and estimate of this step; wind (m/s, ENU, with gusts). */
  step(t: number, phase: Phase, rTrue: Float64Array, wind: Float64Array, s: EstimateView): void {
    this.phase = PHASES.indexOf(phase);
    this.height = -rTrue[2]!;
    // gust beyond the mean wind; the Dryden intensity is only looked up for a strong one
    const ge = wind[0]! - this.meanEast, gn = wind[1]! - this.meanNorth;
    const g2 = ge * ge + gn * gn;
    let gusting = false;
    if (g2 > GUST_FLOOR * GUST_FLOOR) {
      const sigma = this.w20 > 0 ? drydenScalesInto(Math.max(this.height, 0) / FT, this.w20, this.scales).sigmaU * FT : 0;
      gusting = g2 > GUST_SIGMAS * GUST_SIGMAS * sigma * sigma;
    }
    if (gusting) {
      const g = Math.sqrt(g2);
      if (this.gustEvent < 0) this.gustEvent = this.record(EV_GUST, t, g);
      else this.raise(this.gustEvent, g);
    } else this.gustEvent = -1;
    if (s.diverged && !this.divergenceSeen) {
      this.divergenceSeen = true;
      this.record(EV_DIVERGENCE, t, 1);
    }
    const descending = phase === 'descend' || phase === 'touchdown';
    if (!s.valid || !descending) {
      this.funnelEvent = -1;
      return;
    }
    const ex = s.rx - rTrue[0]!, ey = s.ry - rTrue[1]!;
    const e = Math.sqrt(ex * ex + ey * ey);
    if (e > this.funnelBase + this.funnelSlope * Math.max(s.height, 0)) {
      if (this.funnelEvent < 0) this.funnelEvent = this.record(EV_FUNNEL, t, e);
      else this.raise(this.funnelEvent, e);
    } else this.funnelEvent = -1;
    if (!this.blindSeen && (s.blind || s.height < this.blindHeight)) {
      this.blindSeen = true;
      this.record(EV_BLIND, t, s.height);
    }
  }

  /** The kept events in time order, as results carry them (allocates: call once, after the trial). */
  events(): FailureEvent[] {
    const out: FailureEvent[] = [];
    for (let serial = Math.max(0, this.total - LOG_CAPACITY); serial < this.total; serial++) {
      const slot = serial % LOG_CAPACITY;
      out.push({ t: this.time[slot]!, event: EVENT_NAMES[this.kind[slot]!]!, phase: PHASES[this.phaseOf[slot]!]!, height: this.heightOf[slot]!, value: this.value[slot]! });
    }
    // runs are stamped with their start, so a burst may be recorded after a later-starting event
    return out.sort((a, b) => a.t - b.t);
  }
}
