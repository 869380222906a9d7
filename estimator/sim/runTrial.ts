// One closed-loop landing trial: carrier + wind + lander (truth), detector and localization
// errors (what the lander senses), the landing filter, supervisor + guidance on the ESTIMATE,
// and the touchdown judgement. Synchronous and deterministic: random streams derive only
// from (key.seed, key.point, key.trial) and a stream name, one per subsystem.
// The inner loop allocates nothing of its own (preallocated typed arrays); the filter returns
// a small result object per measurement, and onStep rows are built only when asked for.
import type { Box } from '../camera/Box.js';
import { LandingFilter } from '../models/LandingFilter.js';
import { RandomStream, streamId } from '../random/RandomStream.js';
import type { TrialRecorder } from '../io/log/TrialRecorder.js';
import type { Scenario } from './Scenario.js';
import type { Phase, TrialResult } from './TrialResult.js';
import { attributeFailure } from './attribution/attributeFailure.js';
import { FailureLog } from './attribution/FailureLog.js';
import { createGuidance } from './guidance.js';
import { AttitudeHistory, attitudeHistorySize } from './AttitudeHistory.js';
import { ImuHistory } from '../models/ImuHistory.js';
import { AC_INDEX } from '../models/landingState.js';
import { OutlineForecast } from './OutlineForecast.js';
import { NadirGimbal } from './world/NadirGimbal.js';
import { withHistoryFor } from './historyFor.js';
import { blindHeight, LandingSupervisor, type SupervisorInput } from './supervisor.js';
import { judgeTouchdown } from './touchdown.js';
import { TrialState } from './trialState.js';
import type { TraceRow } from './trace.js';
import { createCarrierState, createCarrierTrajectory } from './world/carrierPath.js';
import { createDeckContact, deckContact, type DeckContact } from './world/deckContact.js';
import { Detector, type DetectorFrame } from './world/detector.js';
import { DrydenGust } from './world/dryden.js';
import { LanderDynamics } from './world/landerDynamics.js';
import { LocalizationError } from './world/localizationError.js';
import { ScriptedGusts } from './world/scriptedGusts.js';

export type { TraceRow } from './trace.js';
export { blindHeight } from './supervisor.js';

/** Streams of a trial derive from these alone. */
export interface TrialKey {
  seed: number;
  point: number;
  trial: number;
}

export interface TrialOptions {
  /** Default { seed: scenario.seed, point: 0, trial: 0 }. */
  key?: TrialKey;
  /** Called after every step with a fresh row (slows the trial; for traces and plots). */
  onStep?: (row: TraceRow) => void;
  /** Receives every input the filter saw, plus truth and estimates (for `alight record`). */
  recorder?: TrialRecorder;
  /** Record events and name the cause of a failure (default true; false only to time the trial without it). */
  attribution?: boolean;
}

const DEG = Math.PI / 180;
/** Filter start-up uncertainty: velocities (m/s) and accelerometer bias (m/s^2), 1 sigma. */
const INITIAL_SIGMA = { velocity: 1, accelBias: 0.2 };
/** Pending detector frames held between capture and arrival (latency <= 2 s at <= 1 kHz fits). */
const PENDING = 4096;
/** How far below the deck plane a first contact may be found (m): > one step's closing travel. */
const CONTACT_DEPTH = 0.25;
const TWO_PI = 2 * Math.PI;

/**
 * Fly one trial. Fixed step dt = 1 / filter.rate; IMU samples every step whose time reaches
 * the next 1 / imuRate tick (likewise odometry and camera captures); boxes reach the filter
 * at their arrival time with their (camera-clock) capture stamp.
 * The lander starts at carrier position + startOffset, moving with the carrier (handed over
 * from a GNSS-following phase) and yawed along the carrier's initial heading.
 */
export function runTrial(scenario: Scenario, options: TrialOptions = {}): TrialResult {
  const key = options.key ?? { seed: scenario.seed, point: 0, trial: 0 };
  const { carrier: carrierSpec, lander: landerSpec, localization, detector: detectorSpec } = scenario;
  const filterSpec = withHistoryFor(scenario.filter, detectorSpec, localization.clockOffset); // no box arrives too old to use
  const onStep = options.onStep;
  const recorder = options.recorder;

  // the swell and the traffic are met at a random moment of their cycles
  const phaseStream = trialStream(key, 'carrier-phase');
  const carrier = createCarrierTrajectory(carrierSpec, carrierSpec.path.points, { speed: TWO_PI * phaseStream.uniform(), heave: TWO_PI * phaseStream.uniform(), pitch: TWO_PI * phaseStream.uniform() });
  const cs = createCarrierState();
  carrier.stateAt(0, cs);
  const start = new Float64Array(3);
  for (let k = 0; k < 3; k++) start[k] = cs.position[k]! + landerSpec.startOffset[k]!;
  const lander = new LanderDynamics(landerSpec, start, { yaw: cs.heading });
  const ls = lander.state;
  ls.velocity.set(cs.velocity);
  const windDirection = landerSpec.wind.directionDeg * DEG;
  const gust = new DrydenGust(landerSpec.wind.turbulence, trialStream(key, 'wind'), windDirection);
  const meanWind = Float64Array.of(landerSpec.wind.speed * Math.cos(windDirection), landerSpec.wind.speed * Math.sin(windDirection), 0);
  const errors = new LocalizationError(localization, trialStream(key, 'localization'));
  const dims = { deckLength: carrierSpec.deckLength, deckWidth: carrierSpec.deckWidth, bodyHeight: carrierSpec.bodyHeight };
  const detector = new Detector(errors.trueCamera(scenario.camera), detectorSpec, dims, trialStream(key, 'detector'));
  const dt = 1 / filterSpec.rate;
  const guidance = createGuidance(scenario.guidance, landerSpec, dt);
  const believed = errors.believedCamera(scenario.camera);
  const targetSize = errors.believedTargetSize(carrierSpec);
  const filter = new LandingFilter(filterSpec, believed, targetSize, errors.believedOutline(carrierSpec));
  // the flight-log layout's onboard estimate has the 12 or 15 states of the reference formulation
  // (the deck-scale state, when carried, is not part of it)
  const loggedX = filter.x.subarray(0, filter.deckScaleIndex >= 0 ? filter.deckScaleIndex : filter.n);
  const blind = blindHeight(believed, carrierSpec.deckLength, carrierSpec.deckWidth, detectorSpec.edgeMargin);
  // blind when the predicted outline leaves the image (the fixed figure `blind` only marks the attribution log)
  const supervisor = new LandingSupervisor(scenario.guidance, landerSpec, guidance);
  const forecast = new OutlineForecast(believed, dims, detectorSpec.edgeMargin);
  const st = new TrialState(filter.n, filter.boxDim, filter.deckScaleIndex);
  const log = options.attribution === false ? null : new FailureLog(scenario, blind);
  const scripted = landerSpec.wind.gusts && landerSpec.wind.gusts.length > 0 ? new ScriptedGusts(landerSpec.wind.gusts) : null;
  st.command.set(cs.velocity);
  st.autopilotVelocity.set(cs.velocity); // handed over at matched speed: the autopilot's belief starts there
  const velocityFromEstimate = landerSpec.velocitySource === 'estimate';
  const yawFollowsCarrier = landerSpec.yawPolicy === 'carrier-heading';
  st.heading[0] = Math.cos(cs.heading);
  st.heading[1] = Math.sin(cs.heading);
  const contact = createDeckContact();
  // attitude estimates back to the oldest box that may start the filter (as replay keeps them)
  // a stabilized camera: the filter sees the camera base q̂_wb ⊗ q_g (gimbal angles from its
  // encoders) and the specific force in that frame, R(q_g)^T f_b, so its propagation is unchanged
  const gimbal = scenario.camera.stabilization === 'nadir-gimbal'
    ? new NadirGimbal({ timeConstant: scenario.camera.gimbalTimeConstant, maxRate: scenario.camera.gimbalMaxRateDeg * DEG, maxAngle: scenario.camera.gimbalMaxAngleDeg * DEG })
    : null;
  const qFilter = gimbal ? st.qCameraEstimate : st.qEstimate, fFilter = gimbal ? st.forceCamera : st.force;
  const cameraPose = gimbal ? { position: ls.position, qWorldBody: st.qCameraTrue } : ls;
  const attitudes = new AttitudeHistory(attitudeHistorySize(filterSpec.historyLength, localization.imuRate));
  const imuSamples = new ImuHistory(attitudeHistorySize(filterSpec.historyLength, localization.imuRate));
  const pending: DetectorFrame[] = new Array<DetectorFrame>(PENDING);
  let pendingHead = 0, pendingCount = 0;
  const input: SupervisorInput = { rx: 0, ry: 0, vcx: 0, vcy: 0, vlx: 0, vly: 0, acx: 0, acy: 0, valid: false, height: 0, vcz: 0, unseenFor: Infinity, lastSeen: -Infinity, diverged: false, blind: false, confirmed: false };

  const steps = Math.round(scenario.duration * filterSpec.rate);
  const imuPeriod = 1 / localization.imuRate, odometryPeriod = 1 / localization.odometryRate;
  const capturePeriod = 1 / detectorSpec.rate;
  let nextImu = 0, nextOdometry = 0, nextCapture = 0;
  let initialized = false, reacquire = false, restartPending = false, abortsSeen = 0, lastSeen = -Infinity, touchdownTime: number | null = null;
  let phase: Phase = 'acquire';
  const eps = 1e-9 * dt;

  for (let step = 1; step <= steps; step++) {
    const t = step * dt;
    // truth: wind, lander, carrier
    const ax = ls.velocity[0]! - meanWind[0]!, ay = ls.velocity[1]! - meanWind[1]!;
    const airspeed = Math.sqrt(ax * ax + ay * ay); // not Math.hypot: slow and allocating per step
    gust.step(dt, Math.max(ls.position[2]!, 1), airspeed, st.wind);
    for (let k = 0; k < 3; k++) st.wind[k] = st.wind[k]! + meanWind[k]!;
    if (scripted) scripted.add(t, st.wind);
    lander.step(dt, st.command, st.wind, ls, st.autopilotVelocity); // the autopilot flies on its belief
    if (gimbal) st.levelCamera(dt, gimbal, ls.qWorldBody);
    carrier.stateAt(t, cs);
    deckContact(ls, cs, carrierSpec.deckLength, carrierSpec.deckWidth, contact);
    if (contactEnds(contact)) { // judged after the loop (contact is left as it is here)
      touchdownTime = t;
      st.addPhaseTime(phase, dt);
      break;
    }
    for (let k = 0; k < 3; k++) {
      st.rTrue[k] = cs.position[k]! - ls.position[k]!;
      st.vCTrue[k] = cs.velocity[k]!;
    }
    st.clearStep();
    // IMU -> filter propagation
    if (t >= nextImu - eps) {
      nextImu += imuPeriod;
      errors.attitude(ls.qWorldBody, st.qEstimate, t);
      errors.specificForce(ls.specificForceBody, st.force);
      if (gimbal) st.onGimbal(gimbal.q);
      attitudes.push(t, qFilter);
      imuSamples.push(t, fFilter, qFilter);
      if (initialized) {
        const r = filter.propagate(t, fFilter, qFilter);
        if (r && r.status === 'diverged') st.noteDivergence(filter.diverged);
      }
      recorder?.imu(t, fFilter, qFilter);
    }
    // odometry
    if (t >= nextOdometry - eps) {
      nextOdometry += odometryPeriod;
      errors.odometry(t, ls.velocity, st.odometry);
      st.haveOdometry = true;
      if (!velocityFromEstimate || !initialized || filter.diverged !== null) st.autopilotVelocity.set(st.odometry);
      if (initialized) {
        const r = filter.updateOdometry(filter.time, st.odometry);
        if (r.status === 'diverged') st.noteDivergence(filter.diverged);
      }
      recorder?.odometry(t, st.odometry);
    }
    // camera capture at the first step on or after each frame tick (the truth is known only at
    // steps, so the capture time is the step time: frame spacing jitters by up to one step)
    if (t >= nextCapture - eps) {
      nextCapture += capturePeriod;
      const frame = detector.observe(t, cameraPose, cs);
      st.noteOutline(detector.lastTruth.box);
      log?.capture(t, frame, detector.lastTruth);
      if (frame) st.boxes++;
      else if (detector.lastTruth.visible) st.dropped++;
      if (frame && pendingCount < PENDING) pending[(pendingHead + pendingCount++) % PENDING] = frame;
      if (detector.falseFrameCount > 0) pendingCount = enqueueFalseFrames(detector, pending, pendingHead, pendingCount);
    }
    while (pendingCount > 0 && pending[pendingHead]!.arrivalTime <= t + eps) {
      const frame = pending[pendingHead]!;
      pendingHead = (pendingHead + 1) % PENDING;
      pendingCount--;
      const stamp = errors.cameraTimestamp(frame.captureTime);
      recorder?.box(t, stamp, frame.box, 1);
      st.lastBox = frame.box;
      // (re-)acquisition: the first box, after a divergence, and after an abort (a lost target
      // may have been a false box all along, so the estimate starts afresh from the next box)
      // The filter starts at the box's capture stamp and re-propagates the IMU samples since (as
      // replay does, README.md, "Flight-log layout"), so the boxes captured while this one was
      // in flight are applied too; a box older than the filter's history starts nothing.
      if (!initialized || reacquire || filter.diverged) {
        if (acquire(filter, st, attitudes, imuSamples, frame.box, t, stamp, filterSpec.historyLength)) {
          st.startedAfresh(initialized); // a re-start (after an abort, divergence or refused boxes) must be confirmed
          log?.acquired(t, frame.falseBox, initialized);
          initialized = true;
          reacquire = false;
          guidance.reset();
          lastSeen = t;
        }
        continue;
      }
      if (updateWithBox(filter, st, frame, stamp, log, t)) lastSeen = t;
      // a start its successors disagree with (every box since gated) was likely a false box, and
      // a filter that refuses every box for a third of a second has lost the carrier: start again
      // from the next step's boxes (as a reset row, so replay does the same)
      else if (st.gatedInARow >= (st.confirmed ? LOST_AFTER_GATED : RESTART_AFTER_GATED)) restartPending = true;
    }
    // estimate -> supervisor -> command for the next step
    const x = filter.x;
    input.valid = initialized && filter.diverged === null;
    input.confirmed = st.confirmed;
    input.diverged = filter.diverged !== null;
    input.rx = x[0]!; input.ry = x[1]!; input.height = -x[2]!;
    input.vcx = x[3]!; input.vcy = x[4]!; input.vcz = x[5]!;
    input.vlx = x[6]!; input.vly = x[7]!;
    if (filter.n >= AC_INDEX + 3) { input.acx = x[AC_INDEX]!; input.acy = x[AC_INDEX + 1]!; }
    input.lastSeen = lastSeen;
    input.unseenFor = t - lastSeen;
    // forecast only in the descent (projecting the outline every step cost a tenth of a trial's
    // time, bench trial.cpuMs 29.7 -> 26.6 ms): only the descent acts on it, and at trailing height
    // the deck is far inside the image
    input.blind = input.valid && (phase === 'descend' || phase === 'touchdown') && forecast.leaving(x, qFilter, st.heading[0]!, st.heading[1]!);
    // truth judges the estimate while boxes are expected (blind, it only dead-reckons towards contact)
    if (input.valid && !input.blind) {
      const named = st.watchEstimate(t, x, filter.P);
      if (named !== null) log?.farFromTruth(t, named === 'silent-divergence');
    }
    else st.watch.pause();
    phase = supervisor.step(t, dt, input, st.command);
    if (input.valid) steerFromEstimate(lander, st, x, dt, velocityFromEstimate, yawFollowsCarrier);
    if (restartPending) {
      restartPending = false;
      st.gatedInARow = 0;
      reacquire = true;
      recorder?.reset?.(t);
    }
    if (supervisor.aborts > abortsSeen) {
      abortsSeen = supervisor.aborts;
      reacquire = true;
      log?.abort(t, supervisor.lastAbort);
      recorder?.reset?.(t); // a bit-exact replay of a restarted trial needs it
    }
    st.addPhaseTime(phase, dt);
    log?.step(t, phase, st.rTrue, st.wind, input);
    for (let k = 0; k < 3; k++) st.vLTrue[k] = ls.velocity[k]!;
    if (input.valid && Math.abs(filter.time - t) < eps + 1e-12) {
      const nees = st.errors.add(x, filter.P, filter.n, st.rTrue, st.vCTrue, st.vLTrue);
      if (phase === 'descend' || phase === 'touchdown') st.addDescentNees(-st.rTrue[2]!, nees);
    }
    if (recorder) recordStep(recorder, st, t, initialized ? filter : null, loggedX);
    if (onStep) onStep(st.row(t, phase, input.valid ? x : null, input.valid ? filter.P : null));
  }

  const result = st.result({
    touchdown: touchdownTime === null ? null : judgeTouchdown(scenario.envelope, contact),
    touchdownTime,
    aborts: supervisor.aborts,
    lastAbort: supervisor.lastAbort,
    falseBoxes: detector.falseBoxTotal,
    peakAttitudeRate: lander.attitude.peakRate,
  });
  if (log) {
    const attribution = attributeFailure(result.outcome === 'landed' ? [] : log.events(), result.outcome, touchdownTime ?? steps * dt);
    result.cause = attribution.cause;
    result.causeChain = attribution.causeChain;
  }
  if (filter.deckScaleIndex >= 0) {
    const scale = filter.deckScale();
    result.deckScaleEstimate = initialized && Number.isFinite(scale.value) ? scale : null;
  }
  return result;
}

/** A subsystem's random stream: from the trial key and the stream's name alone (recordTrial draws the same localization errors with it). */
export function trialStream(key: TrialKey, name: string): RandomStream {
  return RandomStream.fromKey([key.seed, key.point, key.trial, streamId(name)]);
}

// The step loop's less common paths live in these small functions, so runTrial itself stays
// small for the JIT (compiled once per worker, not again each time a rare branch first runs).

/**
 * Does this step end the trial? Contact with the deck: on its outline and at most one step's
 * travel below its plane. A lander that sinks past the deck plane beside the deck has missed
 * it and is judged there (off-pad: contact.onDeck cleared), as is one touching the ground.
 */
function contactEnds(contact: DeckContact): boolean {
  const onDeckContact = contact.inContact && contact.onDeck && contact.height > -CONTACT_DEPTH;
  if (!(onDeckContact || contact.height <= -CONTACT_DEPTH || contact.groundHeight <= 0)) return false;
  if (!onDeckContact) contact.onDeck = false;
  return true;
}

/** (Re-)start the filter from a box, read with the attitude estimated at its capture; true when it started (needs odometry and a box the history still covers). */
function acquire(filter: LandingFilter, st: TrialState, attitudes: AttitudeHistory, imu: ImuHistory, box: Box, t: number, stamp: number, historyLength: number): boolean {
  if (!st.haveOdometry || t - stamp > historyLength || !attitudes.at(stamp, st.qCapture)) return false;
  return filter.initializeFromDelayedBox(Math.min(stamp, t), box, st.qCapture, st.odometry, INITIAL_SIGMA, imu).status === 'accepted';
}

/** Box update at its (clamped) capture stamp, tallied in st (and the log); true when the filter accepted it. */
function updateWithBox(filter: LandingFilter, st: TrialState, frame: DetectorFrame, stamp: number, log: FailureLog | null, t: number): boolean {
  const box = frame.box;
  const r = filter.updateBox(Math.min(stamp, filter.time), box);
  st.noteUpdate(box, r);
  log?.box(t, frame.falseBox, r.status);
  if (r.status === 'accepted') {
    st.addNis(r.nis);
    return true;
  }
  if (r.status === 'gated') {
    st.gateRejections++;
    st.gatedInARow++;
  }
  else if (r.status === 'diverged') st.noteDivergence(filter.diverged);
  return false;
}

/** Consecutive gated boxes after which an unconfirmed start is dropped and the next box starts afresh. */
const RESTART_AFTER_GATED = 3;
/** Consecutive gated boxes after which even a confirmed filter is taken as lost (a healthy one gates a true box with probability 0.003). */
const LOST_AFTER_GATED = 10;

/** Speed (m/s) of the estimated carrier above which its velocity gives the yaw setpoint. */
const HEADING_MIN_SPEED = 0.5;
/** Time constant (s) of the low-pass on the heading's unit vector: at 1 m/s a 0.1 m/s velocity error swings the raw heading by 6 deg. */
const HEADING_SMOOTHING = 1;

/**
 * What the lander takes from its estimate each step: the autopilot's velocity (velocitySource
 * 'estimate'), the carrier's heading (for the outline forecast) and with it the yaw setpoint
 * (yawPolicy 'carrier-heading'):
 *   h <- h + (v_c,h / |v_c,h| - h) dt / τ_h, setpoint along h / |h|   (while |v_c,h| > 0.5 m/s)
 */
function steerFromEstimate(lander: LanderDynamics, st: TrialState, x: Float64Array, dt: number, velocity: boolean, yaw: boolean): void {
  if (velocity) for (let k = 0; k < 3; k++) st.autopilotVelocity[k] = x[6 + k]!;
  const vx = x[3]!, vy = x[4]!;
  const speed = Math.sqrt(vx * vx + vy * vy);
  if (!(speed > HEADING_MIN_SPEED)) return;
  const a = dt / HEADING_SMOOTHING;
  const hx = st.heading[0]! + (vx / speed - st.heading[0]!) * a, hy = st.heading[1]! + (vy / speed - st.heading[1]!) * a;
  const norm = Math.sqrt(hx * hx + hy * hy);
  if (!(norm > 1e-6)) return; // a reversal cancelled it: keep the old one this step
  st.heading[0] = hx / norm;
  st.heading[1] = hy / norm;
  if (yaw) lander.setHeading(st.heading[0]!, st.heading[1]!);
}

/** Queue this capture's false boxes behind the pending frames (as room allows); returns the new count. */
function enqueueFalseFrames(detector: Detector, pending: DetectorFrame[], head: number, count: number): number {
  for (let i = 0; i < detector.falseFrameCount && count < PENDING; i++) pending[(head + count++) % PENDING] = detector.falseFrames[i]!;
  return count;
}

/** Truth, and the estimate once the filter runs (null before), to the recorder. */
function recordStep(recorder: TrialRecorder, st: TrialState, t: number, filter: LandingFilter | null, loggedX: Float64Array): void {
  recorder.truth(t, st.rTrue, st.vCTrue, st.vLTrue);
  if (filter) recorder.estimate(t, loggedX, st.diagonal(filter.P));
}
