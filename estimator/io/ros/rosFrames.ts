// Frame conventions met in ROS recordings, turned into alight's (world ENU, body FLU, camera
// optical; REP 103). REP 103 names the aerospace alternatives by a frame-id suffix: "_ned" for
// a world North-East-Down frame and, by the same habit, "_frd" for a body Forward-Right-Down
// frame (flight controllers such as those speaking MAVLink publish these). Both are
// right-handed and differ from ENU / FLU by fixed 180° rotations, so every conversion here is a
// swap of components or signs: exact in floating point, no rounding added.
import { quatConjugate, quatMultiply } from '../../frames/quaternion.js';
import { eulerDegFromQuat } from '../../frames/quatFromEulerDeg.js';
import type { CameraMount } from '../../sim/Scenario.js';

/** World frame of a message: east-north-up (REP 103 default) or north-east-down. */
export type WorldConvention = 'enu' | 'ned';
/** Body frame of a message: forward-left-up (REP 103 default) or forward-right-down. */
export type BodyConvention = 'flu' | 'frd';

/** The world convention a frame id implies (REP 103: the "_ned" suffix), else ENU. */
export function worldConventionOf(frameId: string): WorldConvention {
  return /_ned$/i.test(frameId) ? 'ned' : 'enu';
}

/** The body convention a frame id implies ("_frd" or "_ned" suffix), else FLU. */
export function bodyConventionOf(frameId: string): BodyConvention {
  return /_(frd|ned)$/i.test(frameId) ? 'frd' : 'flu';
}

/** v_ENU = (v_E, v_N, -v_D) from a world vector in `from`. */
export function enuVector(from: WorldConvention, x: number, y: number, z: number, out: Float64Array | number[]): Float64Array | number[] {
  if (from === 'ned') {
    out[0] = y;
    out[1] = x;
    out[2] = -z;
  } else {
    out[0] = x;
    out[1] = y;
    out[2] = z;
  }
  return out;
}

/** v_FLU = (v_F, -v_R, -v_D) from a body vector in `from`. */
export function fluVector(from: BodyConvention, x: number, y: number, z: number, out: Float64Array | number[]): Float64Array | number[] {
  if (from === 'frd') {
    out[0] = x;
    out[1] = -y;
    out[2] = -z;
  } else {
    out[0] = x;
    out[1] = y;
    out[2] = z;
  }
  return out;
}

const H = Math.SQRT1_2;
/** q_enu_ned: the 180° turn about (1, 1, 0)/√2 that maps NED vectors to ENU. */
const ENU_FROM_NED = [0, H, H, 0];
/** q_frd_flu: the 180° turn about body x that maps FLU vectors to FRD. */
const FRD_FROM_FLU = [0, 1, 0, 0];

/**
 * q_wb (Hamilton, scalar first, ENU <- FLU) from a ROS geometry_msgs/Quaternion (x, y, z, w)
 * that rotates `body` vectors into `world`:
 *   q_enu_flu = q_enu_ned ⊗ q_ned_frd ⊗ q_frd_flu   (each factor only when that frame differs).
 * @example rosAttitude('ned', 'frd', 0, 0, 0, 1) // ≈ [0.7071, 0, 0, 0.7071]: nose north is yaw +90° in ENU
 */
export function rosAttitude(world: WorldConvention, body: BodyConvention, x: number, y: number, z: number, w: number, out: Float64Array | number[] = new Float64Array(4)): Float64Array | number[] {
  out[0] = w;
  out[1] = x;
  out[2] = y;
  out[3] = z;
  if (world === 'ned') quatMultiply(ENU_FROM_NED, out, out);
  if (body === 'frd') quatMultiply(out, FRD_FROM_FLU, out);
  // One sign for the same rotation (q and -q are equal): scalar part non-negative.
  if (out[0]! < 0) for (let i = 0; i < 4; i++) out[i] = -out[i]!;
  return out;
}

/** q_bc of alight's nominal nadir mount (x_cam = -y_body, y_cam = -x_body, z_cam = -z_body): 180° about (1, -1, 0)/√2. */
const BODY_FROM_CAMERA_NOMINAL = [0, H, -H, 0];

/**
 * alight's camera mount from a ROS transform body -> camera optical frame (the tf a URDF
 * publishes from base_link to the camera's *_optical_frame): translation = camera origin in body
 * FLU (m), rotation (x, y, z, w) rotates optical-frame vectors into the body frame.
 *   R_bc = R_zyx(roll, pitch, yaw) R_bc_nominal  =>  q_adjust = q_bc ⊗ conj(q_bc_nominal)
 * (the mount convention of frames/cameraFromBody.ts).
 */
export function mountFromOpticalTransform(translation: readonly number[], rotation: readonly number[]): CameraMount {
  const qbc = [rotation[3]!, rotation[0]!, rotation[1]!, rotation[2]!];
  const adjust = quatMultiply(qbc, quatConjugate(BODY_FROM_CAMERA_NOMINAL));
  const [rollDeg, pitchDeg, yawDeg] = eulerDegFromQuat(adjust) as number[];
  // Round off the last bits of the trigonometry so a nominal mount reads as zeros.
  const tidy = (deg: number) => (Math.abs(deg) < 1e-9 ? 0 : Number(deg.toPrecision(12)));
  return { offset: [translation[0]!, translation[1]!, translation[2]!], rollDeg: tidy(rollDeg!), pitchDeg: tidy(pitchDeg!), yawDeg: tidy(yawDeg!) };
}
