// The carrier's true motion: deck-centre position, velocity, acceleration, heading and deck
// attitude at any time. stateAt is allocation-free (writes into a CarrierState from createCarrierState).
import { NewestCache } from '../NewestCache.js';
import type { CarrierSpec } from '../Scenario.js';
import { CarrierPathError } from './CarrierPathError.js';
import { createPlanarPoint, type PlanarPath } from './PlanarPath.js';
import { ellipsePath, figureEightPath, type ParametricPath } from './parametricPath.js';
import { RecordedPath, type RecordedSample } from './recordedPath.js';
import { roundedRectanglePath, straightPath, surveyPath } from './segmentPath.js';
import { SpeedProfileModel, type ProfileSample } from './speedProfile.js';
import { attitudeFromAcceleration, pitchQuaternionInPlace } from './thrustAttitude.js';

const DEG = Math.PI / 180;

export interface CarrierState {
  /** Deck centre in world ENU (m), its velocity (m/s) and acceleration (m/s^2). */
  position: Float64Array;
  velocity: Float64Array;
  acceleration: Float64Array;
  /** Heading of travel (rad from East, counter-clockwise) = yaw of the deck. */
  heading: number;
  /** Deck attitude q_wd (Hamilton [w, x, y, z], deck FLU -> world ENU), heave/pitch/bank included. */
  qWorldDeck: Float64Array;
  /** Distance travelled along the path (m). */
  distance: number;
}

export function createCarrierState(): CarrierState {
  return {
    position: new Float64Array(3),
    velocity: new Float64Array(3),
    acceleration: new Float64Array(3),
    heading: 0,
    qWorldDeck: Float64Array.of(1, 0, 0, 0),
    distance: 0,
  };
}

export interface CarrierTrajectory {
  /** Path length (m) of one lap; Infinity for straight and recorded paths. */
  readonly pathLength: number;
  readonly closed: boolean;
  stateAt(t: number, out: CarrierState): CarrierState;
}

function positive(field: string, value: number): number {
  if (!(value > 0) || !Number.isFinite(value)) throw new CarrierPathError(field, `must be a positive number, got ${value}`);
  return value;
}

// Arc-length tables of the curved paths take ~0.5 ms to build and every trial of a study
// builds the same one: keep the newest few. A ParametricPath carries nothing from one
// evaluation to the next, so sharing it leaves every trial's numbers as they were.
const curveCache = new NewestCache<ParametricPath>(16);

function cachedCurve(shape: 'ellipse' | 'figure-eight', a: number, b: number): ParametricPath {
  return curveCache.get(`${shape} ${a} ${b}`, () => (shape === 'ellipse' ? ellipsePath(a, b) : figureEightPath(a, b)));
}

/** The plane curve of a path spec (recorded paths are handled separately). */
export function planarPathFromSpec(spec: CarrierSpec['path']): PlanarPath {
  switch (spec.shape) {
    case 'straight':
      return straightPath();
    case 'rectangle': {
      const length = positive('carrier.path.length', spec.length);
      const width = positive('carrier.path.width', spec.width);
      if (!(spec.cornerRadius >= 0) || 2 * spec.cornerRadius > Math.min(length, width)) {
        throw new CarrierPathError('carrier.path.cornerRadius', `must lie in [0, min(length, width) / 2 = ${Math.min(length, width) / 2}] m, got ${spec.cornerRadius}`);
      }
      return roundedRectanglePath(length, width, spec.cornerRadius);
    }
    case 'ellipse':
      return cachedCurve('ellipse', positive('carrier.path.length', spec.length), positive('carrier.path.width', spec.width));
    case 'figure-eight':
      return cachedCurve('figure-eight', positive('carrier.path.length', spec.length), positive('carrier.path.width', spec.width));
    case 'survey':
      return surveyPath(
        positive('carrier.path.length', spec.length),
        positive('carrier.path.width', spec.width),
        positive('carrier.path.spacing', spec.spacing),
      );
    case 'recorded':
      throw new CarrierPathError('carrier.path.shape', 'a recorded path needs its rows (t, x, y, z)');
  }
}

/**
 * The carrier's trajectory. Geometric paths start at the world origin and are rotated by
 * path.headingDeg; the distance along them follows the speed profile exactly. Recorded
 * paths replay rows [t, x, y, z] in their own timing (speed and profile unused; trial time 0
 * = first row; the deck is at z + deckHeight). Heave adds deck height, pitch tilts the deck
 * about its lateral axis; an 'aircraft' carrier also banks and pitches with its acceleration
 * (thrust attitude), and its deckHeight is its altitude.
 */
export function createCarrierTrajectory(spec: CarrierSpec, recordedRows?: number[][], phases: CarrierPhases = NO_PHASES): CarrierTrajectory {
  const deck = new DeckMotion(spec, phases);
  if (spec.path.shape === 'recorded') {
    if (!recordedRows) throw new CarrierPathError('carrier.path.file', 'a recorded path needs its rows (t, x, y, z)');
    return new RecordedTrajectory(new RecordedPath(recordedRows), spec.deckHeight, deck);
  }
  return new GeometricTrajectory(planarPathFromSpec(spec.path), spec, deck, phases.speed);
}

// Classes, not object literals with closures: a trial builds a new trajectory, and optimized
// code that had inlined the previous trial's closure was thrown away at the first call
// (V8 "wrong call target"); prototype methods are the same function in every trial.

/**
 * Where each periodic motion stands at t = 0 (rad): the speed variation, the heave and the
 * pitch. A trial draws them, so the landings of a study meet the swell and the traffic at
 * random moments, not every one at the same (which turned one phase's error into a bias).
 */
export interface CarrierPhases {
  speed: number;
  heave: number;
  pitch: number;
}

export const NO_PHASES: CarrierPhases = Object.freeze({ speed: 0, heave: 0, pitch: 0 });

/** Heave on z and the deck attitude: the tail every trajectory's stateAt shares. */
class DeckMotion {
  private readonly heaveOmega: number;
  private readonly pitchOmega: number;
  private readonly heaveAmplitude: number;
  private readonly pitchAmplitude: number;
  private readonly banks: boolean;
  private readonly heavePhase: number;
  private readonly pitchPhase: number;

  constructor(spec: CarrierSpec, phases: CarrierPhases) {
    this.heavePhase = phases.heave;
    this.pitchPhase = phases.pitch;
    const motion = spec.motion;
    this.heaveOmega = motion.heaveAmplitude !== 0 && motion.heavePeriod > 0 ? (2 * Math.PI) / motion.heavePeriod : 0;
    this.pitchOmega = motion.pitchAmplitudeDeg !== 0 && motion.pitchPeriod > 0 ? (2 * Math.PI) / motion.pitchPeriod : 0;
    this.heaveAmplitude = this.heaveOmega > 0 ? motion.heaveAmplitude : 0;
    this.pitchAmplitude = this.pitchOmega > 0 ? motion.pitchAmplitudeDeg * DEG : 0;
    this.banks = spec.kind === 'aircraft';
  }

  finish(t: number, out: CarrierState): CarrierState {
    const heaveAmplitude = this.heaveAmplitude, heaveOmega = this.heaveOmega;
    if (heaveAmplitude !== 0) {
      // z += A sin(w t + phi); z' = A w cos(w t + phi); z'' = -A w^2 sin(w t + phi)
      const sin = Math.sin(heaveOmega * t + this.heavePhase), cos = Math.cos(heaveOmega * t + this.heavePhase);
      out.position[2] = out.position[2]! + heaveAmplitude * sin;
      out.velocity[2] = out.velocity[2]! + heaveAmplitude * heaveOmega * cos;
      out.acceleration[2] = out.acceleration[2]! - heaveAmplitude * heaveOmega * heaveOmega * sin;
    }
    const q = out.qWorldDeck;
    if (this.banks) {
      attitudeFromAcceleration(out.acceleration, out.heading, q);
    } else {
      q[0] = Math.cos(out.heading / 2); q[1] = 0; q[2] = 0; q[3] = Math.sin(out.heading / 2);
    }
    if (this.pitchAmplitude !== 0) pitchQuaternionInPlace(q, this.pitchAmplitude * Math.sin(this.pitchOmega * t + this.pitchPhase));
    return out;
  }
}

class RecordedTrajectory implements CarrierTrajectory {
  readonly pathLength = Infinity;
  readonly closed = false;
  private readonly sample: RecordedSample = { position: new Float64Array(3), velocity: new Float64Array(3), acceleration: new Float64Array(3), heading: 0 };

  constructor(private readonly recorded: RecordedPath, private readonly deckHeight: number, private readonly deck: DeckMotion) {}

  stateAt(t: number, out: CarrierState): CarrierState {
    const sample = this.sample;
    this.recorded.sample(t, sample);
    out.position.set(sample.position);
    out.position[2] = out.position[2]! + this.deckHeight;
    out.velocity.set(sample.velocity);
    out.acceleration.set(sample.acceleration);
    out.heading = sample.heading;
    out.distance = NaN; // not tracked for recordings
    return this.deck.finish(t, out);
  }
}

class GeometricTrajectory implements CarrierTrajectory {
  readonly pathLength: number;
  readonly closed: boolean;
  private readonly profile: SpeedProfileModel;
  private readonly cr: number;
  private readonly sr: number;
  private readonly deckHeight: number;
  private readonly point = createPlanarPoint();
  private readonly speed: ProfileSample = { s: 0, v: 0, a: 0 };

  constructor(private readonly path: PlanarPath, spec: CarrierSpec, private readonly deck: DeckMotion, speedPhase: number) {
    this.pathLength = path.length;
    this.closed = path.closed;
    this.profile = new SpeedProfileModel(spec.speed, spec.profile, speedPhase);
    const rotation = spec.path.headingDeg * DEG;
    this.cr = Math.cos(rotation);
    this.sr = Math.sin(rotation);
    this.deckHeight = spec.deckHeight;
  }

  stateAt(t: number, out: CarrierState): CarrierState {
    const path = this.path, point = this.point, speed = this.speed, cr = this.cr, sr = this.sr;
    this.profile.sample(t, speed);
    const s = path.closed ? speed.s % path.length : speed.s;
    path.evaluate(s, point);
    // rotate the path into the world by the path heading
    const tx = cr * point.tx - sr * point.ty;
    const ty = sr * point.tx + cr * point.ty;
    out.position[0] = cr * point.x - sr * point.y;
    out.position[1] = sr * point.x + cr * point.y;
    out.position[2] = this.deckHeight;
    out.velocity[0] = speed.v * tx;
    out.velocity[1] = speed.v * ty;
    out.velocity[2] = 0;
    // a = s'' T + s'^2 kappa N, N = left normal (-ty, tx)
    const centripetal = speed.v * speed.v * point.curvature;
    out.acceleration[0] = speed.a * tx - centripetal * ty;
    out.acceleration[1] = speed.a * ty + centripetal * tx;
    out.acceleration[2] = 0;
    out.heading = Math.atan2(ty, tx);
    out.distance = speed.s;
    return this.deck.finish(t, out);
  }
}
