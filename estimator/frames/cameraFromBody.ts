// Camera mounting extrinsics: the rotation R_cb from body FLU into the optical frame
// (x right, y down, z forward; REP 103) and the camera position in the body frame.
//
// Nominal mount: nadir-looking, image top towards body forward:
//   x_cam = -y_body, y_cam = -x_body, z_cam = -z_body.
// The mount's roll/pitch/yaw (deg) rotate the camera away from nominal about the BODY axes
// (ZYX as quatFromEulerDeg): R_bc = R_zyx(roll, pitch, yaw) R_bc_nominal, and R_cb = R_bcᵀ.
// So a camera "yaw" turns the image about the body z axis, whatever the mount.
import type { CameraMount } from '../camera/CameraMount.js';
import { quatFromEulerDeg } from './quatFromEulerDeg.js';
import { mat3Multiply, mat3Transpose, rotationMatrixFromQuat } from './rotationMatrixFromQuat.js';

/** R_cb of the nominal nadir mount (row-major; also its own inverse's transpose). */
export const NOMINAL_CAMERA_FROM_BODY: readonly number[] = Object.freeze([0, -1, 0, -1, 0, 0, 0, 0, -1]);

/** Rotation body FLU -> camera optical (row-major 3x3) for a mount. */
export function cameraFromBody(mount: Pick<CameraMount, 'rollDeg' | 'pitchDeg' | 'yawDeg'>, out: Float64Array = new Float64Array(9)): Float64Array {
  const adjust = rotationMatrixFromQuat(quatFromEulerDeg(mount.rollDeg, mount.pitchDeg, mount.yawDeg));
  const bodyFromCameraNominal = mat3Transpose(NOMINAL_CAMERA_FROM_BODY);
  const bodyFromCamera = mat3Multiply(adjust, bodyFromCameraNominal);
  return mat3Transpose(bodyFromCamera, out);
}

/**
 * A world-frame vector r (e.g. r = p_target - p_lander, ENU) seen from the camera:
 * p_cam = R_cb (R_wbᵀ r - t_b), with t_b the camera offset in body FLU.
 * R_wb and R_cb are row-major 3x3. Allocation-free.
 */
export function cameraPointFromWorldVector(R_wb: ArrayLike<number>, R_cb: ArrayLike<number>, offset: ArrayLike<number>, r: ArrayLike<number>, out: Float64Array | number[] = new Float64Array(3)): Float64Array | number[] {
  const r0 = r[0]!, r1 = r[1]!, r2 = r[2]!;
  const b0 = R_wb[0]! * r0 + R_wb[3]! * r1 + R_wb[6]! * r2 - offset[0]!;
  const b1 = R_wb[1]! * r0 + R_wb[4]! * r1 + R_wb[7]! * r2 - offset[1]!;
  const b2 = R_wb[2]! * r0 + R_wb[5]! * r1 + R_wb[8]! * r2 - offset[2]!;
  out[0] = R_cb[0]! * b0 + R_cb[1]! * b1 + R_cb[2]! * b2;
  out[1] = R_cb[3]! * b0 + R_cb[4]! * b1 + R_cb[5]! * b2;
  out[2] = R_cb[6]! * b0 + R_cb[7]! * b1 + R_cb[8]! * b2;
  return out;
}

/** Inverse of cameraPointFromWorldVector: r = R_wb (R_cbᵀ p_cam + t_b). */
export function worldVectorFromCameraPoint(R_wb: ArrayLike<number>, R_cb: ArrayLike<number>, offset: ArrayLike<number>, pCam: ArrayLike<number>, out: Float64Array | number[] = new Float64Array(3)): Float64Array | number[] {
  const c0 = pCam[0]!, c1 = pCam[1]!, c2 = pCam[2]!;
  const b0 = R_cb[0]! * c0 + R_cb[3]! * c1 + R_cb[6]! * c2 + offset[0]!;
  const b1 = R_cb[1]! * c0 + R_cb[4]! * c1 + R_cb[7]! * c2 + offset[1]!;
  const b2 = R_cb[2]! * c0 + R_cb[5]! * c1 + R_cb[8]! * c2 + offset[2]!;
  out[0] = R_wb[0]! * b0 + R_wb[1]! * b1 + R_wb[2]! * b2;
  out[1] = R_wb[3]! * b0 + R_wb[4]! * b1 + R_wb[5]! * b2;
  out[2] = R_wb[6]! * b0 + R_wb[7]! * b1 + R_wb[8]! * b2;
  return out;
}
