// The lander's own sensing errors, applied to truth before the filter sees it: attitude
// estimate (bias + noise), odometry (bias + noise + drifting bias), accelerometer (bias +
// noise), camera misalignment, wrong focal length, wrong target size, camera clock offset.
// The per-sample methods allocate nothing (out parameters, preallocated scratch).
import { quatFromEulerDeg } from '../../frames/quatFromEulerDeg.js';
import { quatMultiply } from '../../frames/quaternion.js';
import type { FilterCamera } from '../../models/FilterCamera.js';
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

  /** One child stream per channel, so e.g. more IMU samples do not shift the odometry draws. */
  constructor(spec: LocalizationSpec, stream: RandomStream) {
    this.spec = spec;
    this.attitudeStream = RandomStream.childOf(stream);
    this.odometryStream = RandomStream.childOf(stream);
    this.imuStream = RandomStream.childOf(stream);
    this.odometryBiasNow = Float64Array.of(spec.odometryBias, spec.odometryBias, spec.odometryBias);
  }

  /**
   * Estimated attitude: q_est = q_true (x) q_err, q_err = ZYX(roll, pitch, yaw) with each angle
   * = attitudeBiasDeg + attitudeNoiseDeg n (a body-frame error, white noise per sample).
   */
  attitude(qTrue: ArrayLike<number>, out: Float64Array): Float64Array {
    const { attitudeBiasDeg: bias, attitudeNoiseDeg: noise } = this.spec;
    const rng = this.attitudeStream;
    const roll = bias + noise * rng.gaussian(), pitch = bias + noise * rng.gaussian(), yaw = bias + noise * rng.gaussian();
    quatFromEulerDeg(roll, pitch, yaw, this.error);
    quatMultiply(qTrue, this.error, out);
    return out;
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
    const { accelBias: bias, accelNoise: noise } = this.spec;
    for (let k = 0; k < 3; k++) out[k] = fTrue[k]! + bias + noise * this.imuStream.gaussian();
    return out;
  }

  /** Capture time as the camera stamps it: t + clockOffset (camera clock minus IMU clock). */
  cameraTimestamp(tCapture: number): number {
    return tCapture + this.spec.clockOffset;
  }

  /** The mount as it really is: misalignmentDeg added about each axis (roll, pitch, yaw). */
  trueMount(mount: CameraMount): CameraMount {
    const m = this.spec.misalignmentDeg;
    return cameraMount({ offset: mount.offset, rollDeg: mount.rollDeg + m, pitchDeg: mount.pitchDeg + m, yawDeg: mount.yawDeg + m });
  }

  /** The camera as it really is: the spec's intrinsics and distortion, misaligned mount. */
  trueCamera(camera: CameraSpec): MountedCamera {
    const k = intrinsicsFromSpec(camera);
    return pinholeCamera({ fx: k.fx, fy: k.fy, cx: k.cx, cy: k.cy, width: camera.width, height: camera.height, distortion: camera.distortion }, this.trueMount(camera.mount));
  }

  /** The camera as the filter believes it: focal lengths scaled by (1 + focalError), nominal mount. */
  believedCamera(camera: CameraSpec): FilterCamera {
    const k = intrinsicsFromSpec(camera);
    const scale = 1 + this.spec.focalError;
    return pinholeCamera({ fx: k.fx * scale, fy: k.fy * scale, cx: k.cx, cy: k.cy, width: camera.width, height: camera.height, distortion: camera.distortion }, camera.mount);
  }

  /** Target size the filter assumes (m): sqrt(deckLength deckWidth) (1 + targetSizeError). */
  believedTargetSize(carrier: Pick<CarrierSpec, 'deckLength' | 'deckWidth'>): number {
    return Math.sqrt(carrier.deckLength * carrier.deckWidth) * (1 + this.spec.targetSizeError);
  }
}
