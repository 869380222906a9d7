// The lander's own sensing errors, applied to truth before the filter sees it: attitude
// estimate (bias + noise + integrated gyro error), odometry (bias + noise + drifting bias), accelerometer (bias +
// noise), camera misalignment, wrong focal length, wrong target size, camera clock offset.
// The per-sample methods allocate nothing (out parameters, preallocated scratch).
import { quatFromEulerDeg } from '../../frames/quatFromEulerDeg.js';
import { quatMultiply } from '../../frames/quaternion.js';
import type { FilterCamera } from '../../models/FilterCamera.js';
import type { DeckOutline } from '../../models/OutlineBoxModel.js';
import { cameraMount, pinholeCamera } from '../../camera/PinholeCamera.js';
import { RandomStream } from '../../random/RandomStream.js';
import type { CameraMount, CameraSpec, CarrierSpec, LocalizationSpec } from '../Scenario.js';
import { intrinsicsFromSpec } from './cameraFromSpec.js';
import type { MountedCamera } from './carrierOutline.js';

export class LocalizationError {
  readonly spec: LocalizationSpec;
  private readonly attitudeStream: RandomStream;
  private readonly odometryStream: RandomStream;
  private readonly imuStream: RandomStream;
  /** Current odometry bias per world axis (m/s): starts at odometryBias, then random-walks. */
  readonly odometryBiasNow: Float64Array;
  private lastOdometryTime = NaN;
  private readonly error = new Float64Array(4);
  private readonly gyroStream: RandomStream;
  /** Integrated gyro error the attitude estimator has not yet corrected, per body axis (deg). */
  readonly gyroError = new Float64Array(3);
  private lastAttitudeTime = NaN;
  /** This trial's biases per axis (roll, pitch, yaw / body x, y, z): drawn, or as written (LocalizationSpec.biasDraw). */
  readonly attitudeBias = new Float64Array(3);
  readonly accelBias = new Float64Array(3);
  readonly gyroBias = new Float64Array(3);
  readonly misalignment = new Float64Array(3);
  /** This trial's focal and deck-size factors the filter is off by: 1 + error. */
  readonly focalScale: number;
  readonly sizeScale: number;

  /** One child stream per channel, so e.g. more IMU samples do not shift the odometry draws. */
  constructor(spec: LocalizationSpec, stream: RandomStream) {
    this.spec = spec;
    this.attitudeStream = RandomStream.childOf(stream);
    this.odometryStream = RandomStream.childOf(stream);
    this.imuStream = RandomStream.childOf(stream);
    this.gyroStream = RandomStream.childOf(stream); // after the channels above: they keep their draws
    // per-trial biases: a 1-sigma spread drawn per axis (its own child stream, created last), or the values as written
    const draw = spec.biasDraw === 'fixed' ? null : RandomStream.childOf(stream);
    const pick = (value: number): number => (draw === null ? value : value * draw.gaussian());
    for (let k = 0; k < 3; k++) {
      this.attitudeBias[k] = pick(spec.attitudeBiasDeg);
      this.accelBias[k] = pick(spec.accelBias);
      this.gyroBias[k] = pick(spec.gyroBiasDegPerSec);
      this.misalignment[k] = pick(spec.misalignmentDeg);
    }
    this.odometryBiasNow = Float64Array.of(pick(spec.odometryBias), pick(spec.odometryBias), pick(spec.odometryBias));
    this.focalScale = 1 + pick(spec.focalError);
    this.sizeScale = 1 + pick(spec.targetSizeError);
  }

  /**
   * Estimated attitude at time t (s; calls in time order): q_est = q_true (x) q_err,
   * q_err = ZYX(roll, pitch, yaw) with each angle = attitudeBiasDeg + attitudeNoiseDeg n + g(t)
   * (a body-frame error, white noise per sample) and g the integrated gyro error, pulled back
   * with time constant τ = attitudeCorrectionTime (exact step of dg = (b - g/τ) dt + σ dW):
   *   g <- g e^{-dt/τ} + b τ (1 - e^{-dt/τ}) + σ sqrt(τ/2 (1 - e^{-2dt/τ})) n
   * It starts at its steady mean b τ (the estimator has run long before the trial).
   */
  attitude(qTrue: ArrayLike<number>, out: Float64Array, t = NaN): Float64Array {
    const noise = this.spec.attitudeNoiseDeg, bias = this.attitudeBias;
    this.stepGyroError(t);
    const g = this.gyroError;
    const rng = this.attitudeStream;
    const roll = bias[0]! + noise * rng.gaussian() + g[0]!, pitch = bias[1]! + noise * rng.gaussian() + g[1]!, yaw = bias[2]! + noise * rng.gaussian() + g[2]!;
    quatFromEulerDeg(roll, pitch, yaw, this.error);
    quatMultiply(qTrue, this.error, out);
    return out;
  }

  private stepGyroError(t: number): void {
    const { gyroNoiseDegPerSqrtSec: sigma, attitudeCorrectionTime: tau } = this.spec;
    const g = this.gyroError, b = this.gyroBias;
    if (Number.isNaN(this.lastAttitudeTime) || Number.isNaN(t)) {
      if (Number.isNaN(this.lastAttitudeTime)) for (let k = 0; k < 3; k++) g[k] = b[k]! * tau;
      this.lastAttitudeTime = t;
      return;
    }
    const dt = t - this.lastAttitudeTime;
    this.lastAttitudeTime = t;
    if (!(dt > 0) || (b[0] === 0 && b[1] === 0 && b[2] === 0 && sigma === 0)) return;
    const decay = Math.exp(-dt / tau);
    const walk = sigma * Math.sqrt((tau / 2) * -Math.expm1((-2 * dt) / tau));
    for (let k = 0; k < 3; k++) g[k] = g[k]! * decay + b[k]! * tau * (1 - decay) + walk * this.gyroStream.gaussian();
  }

  /**
   * Measured lander velocity (world, m/s) at time t: v + b(t) + odometryNoise n per axis, with
   * the bias random walk b(t) = b(t_prev) + odometryDrift sqrt(t - t_prev) n (starts at odometryBias
   * on every axis). Calls must come in time order.
   */
  odometry(t: number, velocityTrue: ArrayLike<number>, out: Float64Array): Float64Array {
    const { odometryNoise: noise, odometryDrift: drift } = this.spec;
    const rng = this.odometryStream;
    const dt = Number.isNaN(this.lastOdometryTime) ? 0 : t - this.lastOdometryTime;
    if (dt < 0) throw new RangeError(`odometry samples must come in time order: ${t} s after ${this.lastOdometryTime} s`);
    this.lastOdometryTime = t;
    const step = drift * Math.sqrt(dt);
    const b = this.odometryBiasNow;
    for (let k = 0; k < 3; k++) {
      b[k] = b[k]! + step * rng.gaussian();
      out[k] = velocityTrue[k]! + b[k]! + noise * rng.gaussian();
    }
    return out;
  }

  /** Accelerometer reading (body FLU, m/s^2): f + accelBias + accelNoise n per axis. */
  specificForce(fTrue: ArrayLike<number>, out: Float64Array): Float64Array {
    const noise = this.spec.accelNoise, bias = this.accelBias;
    for (let k = 0; k < 3; k++) out[k] = fTrue[k]! + bias[k]! + noise * this.imuStream.gaussian();
    return out;
  }

  /** Capture time as the camera stamps it: t + clockOffset (camera clock minus IMU clock). */
  cameraTimestamp(tCapture: number): number {
    return tCapture + this.spec.clockOffset;
  }

  /** The mount as it really is: this trial's misalignment added about each axis (roll, pitch, yaw). */
  trueMount(mount: CameraMount): CameraMount {
    const m = this.misalignment;
    return cameraMount({ offset: mount.offset, rollDeg: mount.rollDeg + m[0]!, pitchDeg: mount.pitchDeg + m[1]!, yawDeg: mount.yawDeg + m[2]! });
  }

  /** The camera as it really is: the spec's intrinsics and distortion, misaligned mount. */
  trueCamera(camera: CameraSpec): MountedCamera {
    const k = intrinsicsFromSpec(camera);
    return pinholeCamera({ fx: k.fx, fy: k.fy, cx: k.cx, cy: k.cy, width: camera.width, height: camera.height, distortion: camera.distortion }, this.trueMount(camera.mount));
  }

  /** The camera as the filter believes it: focal lengths scaled by this trial's focal factor (1 + focalError), nominal mount. */
  believedCamera(camera: CameraSpec): FilterCamera {
    const k = intrinsicsFromSpec(camera);
    const scale = this.focalScale;
    return pinholeCamera({ fx: k.fx * scale, fy: k.fy * scale, cx: k.cx, cy: k.cy, width: camera.width, height: camera.height, distortion: camera.distortion }, camera.mount);
  }

  /** Deck outline the filter assumes (m): every dimension scaled by this trial's size factor (1 + targetSizeError, drawn or as written). */
  believedOutline(carrier: Pick<CarrierSpec, 'deckLength' | 'deckWidth' | 'bodyHeight'>): DeckOutline {
    const scale = this.sizeScale;
    return { deckLength: carrier.deckLength * scale, deckWidth: carrier.deckWidth * scale, bodyHeight: carrier.bodyHeight * scale };
  }

  /** Target size the filter assumes (m): sqrt(deckLength deckWidth) times this trial's size factor. */
  believedTargetSize(carrier: Pick<CarrierSpec, 'deckLength' | 'deckWidth'>): number {
    return Math.sqrt(carrier.deckLength * carrier.deckWidth) * this.sizeScale;
  }
}
