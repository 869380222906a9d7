// The scenario: everything one landing trial needs, as read from a scenario file.
// SI units throughout; angles in degrees where the key says Deg. World frame ENU,
// body FLU, camera optical (REP 103). Validated once at the boundary (io/), then frozen.
// Studies address fields by dotted path, e.g. "detector.pixelNoise": keep names stable.
import type { FilterSpec } from '../models/FilterSettings.js';
import type { Distortion } from '../camera/distortion.js';
import type { CameraMount } from '../camera/CameraMount.js';

export type PathShape = 'straight' | 'rectangle' | 'ellipse' | 'figure-eight' | 'survey' | 'recorded';
export type CarrierKind = 'ground' | 'boat' | 'aircraft';

export interface CarrierPath {
  shape: PathShape;
  /** straight: heading of travel (deg from East, counter-clockwise). Others: rotation of the whole path. */
  headingDeg: number;
  /** rectangle/survey: extent along the first axis (m); ellipse/figure-eight: semi-axis a (m). */
  length: number;
  /** rectangle/survey: extent along the second axis (m); ellipse/figure-eight: semi-axis b (m). */
  width: number;
  /** rectangle: corner radius (m). */
  cornerRadius: number;
  /** survey: spacing between passes (m). */
  spacing: number;
  /** recorded: CSV file of t,x,y,z (relative to the scenario file). */
  file?: string;
  /** recorded: [t, x, y, z] rows (s, m ENU); given inline or filled from `file` by loadScenario. */
  points?: number[][];
}

export interface SpeedProfile {
  /** Time to reach cruise speed from rest (s); 0 = starts at speed. */
  rampTime: number;
  /** Sinusoidal speed variation amplitude (m/s) and period (s); 0 = constant. */
  variation: number;
  variationPeriod: number;
}

export interface Oscillation {
  /** Heave amplitude (m) and period (s). */
  heaveAmplitude: number;
  heavePeriod: number;
  /** Pitch amplitude (deg) and period (s). */
  pitchAmplitudeDeg: number;
  pitchPeriod: number;
}

export interface CarrierSpec {
  kind: CarrierKind;
  path: CarrierPath;
  /** Cruise speed along the path (m/s). */
  speed: number;
  profile: SpeedProfile;
  motion: Oscillation;
  /** Height of the deck (landing surface) above ground (m); for an aircraft carrier, its altitude. */
  deckHeight: number;
  /** Deck outline: length along travel and width (m). The detector sees this box outline. */
  deckLength: number;
  deckWidth: number;
  /** Height of the visible body below the deck (m), used for the 3-D outline. */
  bodyHeight: number;
}

export type TurbulenceLevel = 'none' | 'light' | 'moderate' | 'severe';

export interface WindSpec {
  /** Mean wind speed (m/s) and the direction it blows towards (deg from East, CCW). */
  speed: number;
  directionDeg: number;
  /** Dryden turbulence intensity (MIL-F-8785C low-altitude W20: light 15 kt, moderate 30 kt, severe 45 kt). */
  turbulence: TurbulenceLevel;
  /** Scripted discrete gusts on top of the turbulence (for constructed studies); [] = none. */
  gusts?: ScriptedGust[];
}

/**
 * A discrete "1 - cosine" gust (common practice for a single gust): starting at `time` (s) it
 * rises and falls over `duration` (s), peaking at `speed` (m/s, horizontal) towards `directionDeg`
 * (deg from East, CCW):  v(t) = speed/2 (1 - cos(2 pi (t - time) / duration)).
 */
export interface ScriptedGust {
  time: number;
  duration: number;
  speed: number;
  directionDeg: number;
}

export interface LanderSpec {
  /** Start position relative to the carrier's deck centre, world ENU axes (m). */
  startOffset: [number, number, number];
  /** First-order lag of velocity-command tracking (s). */
  velocityTimeConstant: number;
  /** Limits: horizontal acceleration (m/s^2), tilt (deg), horizontal speed (m/s), vertical speed (m/s). */
  maxAccel: number;
  maxTiltDeg: number;
  maxSpeed: number;
  maxVerticalSpeed: number;
  wind: WindSpec;
  /**
   * What the autopilot's velocity loop closes on: 'odometry' (the latest odometry sample, as an
   * autopilot fed by VIO / optical flow / GNSS velocity) or 'estimate' (the landing filter's
   * lander-velocity estimate; odometry before the filter starts or after it diverged). Never truth.
   */
  velocitySource: VelocitySource;
  /** Attitude response: first-order time constant (s) and body rotation-rate limit (deg/s). */
  attitudeTimeConstant: number;
  maxAttitudeRateDeg: number;
  /**
   * Yaw setpoint: 'carrier-heading' (along the carrier's estimated velocity once it moves faster
   * than 0.5 m/s, else held) or 'hold' (the carrier's heading at the start, throughout).
   */
  yawPolicy: YawPolicy;
}

export type VelocitySource = 'odometry' | 'estimate';
export type YawPolicy = 'carrier-heading' | 'hold';

export interface Intrinsics {
  fx: number;
  fy: number;
  cx: number;
  cy: number;
}

export interface LensSpec {
  /** Lens focal length and sensor size (m); the image size comes from width/height. */
  focalLength: number;
  sensorWidth: number;
  sensorHeight: number;
}

export type { Distortion } from '../camera/distortion.js';

export type { CameraMount } from '../camera/CameraMount.js';

export interface CameraSpec {
  /** Exactly one of intrinsics or lens. */
  intrinsics?: Intrinsics;
  lens?: LensSpec;
  /** Image size (px). */
  width: number;
  height: number;
  distortion: Distortion;
  mount: CameraMount;
  /** 'body-fixed', or 'nadir-gimbal': roll/pitch stabilized against the estimated attitude (NadirGimbal). */
  stabilization: CameraStabilization;
  /** nadir-gimbal: per-axis time constant (s), rate limit (deg/s) and travel (deg). */
  gimbalTimeConstant: number;
  gimbalMaxRateDeg: number;
  gimbalMaxAngleDeg: number;
}

export type CameraStabilization = 'body-fixed' | 'nadir-gimbal';

export interface BurstLoss {
  /** Gilbert–Elliott: P(good -> bad) and P(bad -> good) per frame; no loss in good, full loss in bad. */
  enter: number;
  exit: number;
}

/**
 * A scripted detector event over the frames captured in [time, time + duration) (s):
 *   dropout:   the carrier's box is lost (its loss is 'scripted');
 *   latency:   every such frame arrives `latency` (s) after capture instead of the usual delay;
 *   false-box: the detector reports a box of the carrier's size half an image away instead of
 *              the carrier (a confusable object), flagged falseBox.
 */
export interface DetectorEvent {
  kind: 'dropout' | 'latency' | 'false-box';
  time: number;
  duration: number;
  /** latency only: arrival delay (s). */
  latency?: number;
}

export interface DetectorSpec {
  /** Frame rate (Hz). */
  rate: number;
  /** Box centre noise (px, 1 sigma) and box size noise (fraction of size, 1 sigma). */
  pixelNoise: number;
  sizeNoise: number;
  /** Latency from capture to arrival (s) and its jitter (s, 1 sigma, truncated at 0). */
  latency: number;
  latencyJitter: number;
  /** Independent per-frame dropout probability. */
  dropout: number;
  /** Bursty loss on top of i.i.d. dropout; null = none. */
  burst: BurstLoss | null;
  /** False boxes per second (Poisson), placed uniformly in the image. */
  falseBoxRate: number;
  /** A box whose true outline comes closer than this to the image edge is lost (px). */
  edgeMargin: number;
  /** Scripted events (constructed studies of a known cause); [] = none. */
  script?: DetectorEvent[];
}

export type BiasDraw = 'per-trial' | 'fixed';

export interface LocalizationSpec {
  /**
   * 'per-trial': every bias and calibration error below is a 1-sigma spread drawn per trial and
   * per axis (zero mean across a study); 'fixed': the values as written, sign included.
   * Optional in code (absent = 'per-trial'); the scenario schema fills it.
   */
  biasDraw?: BiasDraw;
  /** Attitude estimate error: constant bias (deg, per axis roll/pitch/yaw) and white noise (deg, 1 sigma). */
  attitudeBiasDeg: number;
  attitudeNoiseDeg: number;
  /** Odometry (lander velocity) rate (Hz), bias (m/s), white noise (m/s), drift (bias random walk, m/s per sqrt(s)). */
  odometryRate: number;
  odometryBias: number;
  odometryNoise: number;
  odometryDrift: number;
  /** IMU rate (Hz), accelerometer noise (m/s^2, 1 sigma per sample) and constant bias (m/s^2). */
  imuRate: number;
  accelNoise: number;
  accelBias: number;
  /** Camera mounting misalignment not known to the filter (deg, about each axis). */
  misalignmentDeg: number;
  /** Fractional error of the focal length the filter assumes (0.02 = 2 % too long). */
  focalError: number;
  /** Fractional error of the target size the filter assumes. */
  targetSizeError: number;
  /** Camera clock minus IMU clock (s). */
  clockOffset: number;
  /**
   * Gyro errors, integrated by the lander's attitude estimator and pulled back by its gravity
   * (and heading) reference with time constant attitudeCorrectionTime (s): constant bias (deg/s,
   * every axis) and angle random walk (deg/sqrt(s), i.e. deg/s/sqrt(Hz)). They add to the
   * attitude bias and noise above: bias b gives a steady error b τ, the walk σ sqrt(τ / 2).
   */
  gyroBiasDegPerSec: number;
  gyroNoiseDegPerSqrtSec: number;
  attitudeCorrectionTime: number;
}

// The filter's own settings live beside the filter; the scenario composes them.
export type { CameraUpdateMode, CarrierModel, FilterSpec } from '../models/FilterSettings.js';

export type GuidanceLaw = 'pid' | 'lqr';

export interface GuidanceSpec {
  law: GuidanceLaw;
  /** PID gains on horizontal relative position (1/s, 1/s^2, dimensionless). */
  kp: number;
  ki: number;
  kd: number;
  /** Feed forward the estimated carrier velocity. */
  feedForward: boolean;
  /** LQR weights: position (1/m^2), velocity (s^2/m^2), acceleration command (s^4/m^2). */
  lqrPosition: number;
  lqrVelocity: number;
  lqrControl: number;
  /** Supervisor: trailing height above deck (m), alignment radius (m) and time (s) before descent. */
  trailHeight: number;
  alignRadius: number;
  alignTime: number;
  /** Descent rate (m/s) and the funnel: allowed horizontal error = funnelBase + funnelSlope * height. */
  descentRate: number;
  funnelBase: number;
  funnelSlope: number;
  /** Abort when the target is unseen this long (s); re-acquire afterwards. */
  lostTimeout: number;
  /** Height above deck at which the motors are cut / contact is expected (m). */
  flareHeight: number;
}

export interface LandingEnvelope {
  /** Landing pad radius on the deck (m). */
  padRadius: number;
  /** Max vertical closing speed (m/s), max horizontal relative speed (m/s), max tilt (deg) at contact. */
  maxClosingSpeed: number;
  maxLateralSpeed: number;
  maxTiltDeg: number;
}

export interface Scenario {
  /** Schema version of the file. */
  version: 1;
  name: string;
  description: string;
  seed: number;
  /** Simulated time limit (s). */
  duration: number;
  carrier: CarrierSpec;
  lander: LanderSpec;
  camera: CameraSpec;
  detector: DetectorSpec;
  localization: LocalizationSpec;
  filter: FilterSpec;
  guidance: GuidanceSpec;
  envelope: LandingEnvelope;
}
