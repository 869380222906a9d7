// What alight takes from each standard ROS 2 message, already decoded from CDR into plain
// objects (field names as in the .msg definitions). Conventions: header stamps are measurement
// times; vectors are turned into world ENU / body FLU (REP 103) by rosFrames; nav_msgs/Odometry
// carries its twist in child_frame_id (the message definition says so), turned into the world
// by the message's own orientation. Browser-safe; writes into caller-owned arrays.
import { quatRotate } from '../../frames/quaternion.js';
import type { Distortion } from '../../sim/Scenario.js';
import { bodyConventionOf, enuVector, fluVector, rosAttitude, worldConventionOf, type BodyConvention, type WorldConvention } from './rosFrames.js';
import type { Convention } from './parseRosMap.js';

/* eslint-disable @typescript-eslint/no-explicit-any -- decoded messages are checked field by field */
export type Decoded = any;

/** A message that does not hold what its role needs: the importer turns it into a message naming the topic. */
export class MessageContentError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'MessageContentError';
  }
}

/** "sensor_msgs/msg/Imu" and "sensor_msgs/Imu" name one type: the short form. */
export function shortTypeName(schemaName: string): string {
  return schemaName.replace('/msg/', '/');
}

/** The message types each role reads (short names). Boxes also read any type through corner fields. */
export const ROLE_TYPES = {
  camera: ['sensor_msgs/CameraInfo'],
  boxes: ['vision_msgs/Detection2DArray', 'vision_msgs/Detection2D'],
  imu: ['sensor_msgs/Imu'],
  attitude: ['sensor_msgs/Imu', 'geometry_msgs/QuaternionStamped', 'geometry_msgs/PoseStamped', 'geometry_msgs/PoseWithCovarianceStamped', 'nav_msgs/Odometry'],
  odometry: ['nav_msgs/Odometry', 'geometry_msgs/TwistStamped', 'geometry_msgs/TwistWithCovarianceStamped'],
  truth: ['nav_msgs/Odometry'],
} as const;

/** A ROS time {sec, nanosec} (ROS 1 style {sec, nsec} too) in seconds after `originSec`: the whole seconds subtract exactly. */
export function stampSeconds(stamp: Decoded, originSec: number): number {
  return stamp.sec - originSec + (stamp.nanosec ?? stamp.nsec) / 1e9;
}

/** A recorder's log time (ns since the epoch) in seconds after `originSec`. */
export function logTimeSeconds(logTime: bigint, originSec: number): number {
  return Number(logTime / 1_000_000_000n) - originSec + Number(logTime % 1_000_000_000n) / 1e9;
}

const world = (c: Convention<WorldConvention>, frameId: string): WorldConvention => (c === 'auto' ? worldConventionOf(frameId) : c);
const body = (c: Convention<BodyConvention>, frameId: string): BodyConvention => (c === 'auto' ? bodyConventionOf(frameId) : c);

export interface RosCamera {
  width: number;
  height: number;
  fx: number;
  fy: number;
  cx: number;
  cy: number;
  distortion: Distortion;
  frameId: string;
}

/**
 * sensor_msgs/CameraInfo -> intrinsics in alight's pixel coordinates. `pixelShift` (0.5 for
 * ROS's integer pixel centres) moves the principal point like every box. raw: K and D
 * (plumb_bob = k1 k2 p1 p2 k3; rational_polynomial accepted when k4..k6 are 0); rectified: P,
 * no distortion. Skew, binning and a region of interest are not modelled: refused.
 */
export function cameraFromInfo(msg: Decoded, image: 'raw' | 'rectified', pixelShift: number): RosCamera {
  const K: ArrayLike<number> = msg.k ?? msg.K;
  const P: ArrayLike<number> = msg.p ?? msg.P;
  const D: ArrayLike<number> = msg.d ?? msg.D ?? [];
  const model: string = msg.distortion_model ?? '';
  if (!(msg.width > 0 && msg.height > 0)) throw new MessageContentError(`image size ${msg.width} x ${msg.height} px: a camera needs a positive width and height`);
  if ((msg.binning_x ?? 0) > 1 || (msg.binning_y ?? 0) > 1) throw new MessageContentError(`binning ${msg.binning_x} x ${msg.binning_y} is not supported: give the intrinsics of the image the detector saw`);
  const roi = msg.roi;
  if (roi && (roi.x_offset !== 0 || roi.y_offset !== 0 || (roi.width !== 0 && roi.width !== msg.width) || (roi.height !== 0 && roi.height !== msg.height))) throw new MessageContentError('a region of interest is not supported: give the intrinsics of the image the detector saw');
  const [fx, skew, cx, fy, cy] = image === 'raw' ? [K[0]!, K[1]!, K[2]!, K[4]!, K[5]!] : [P[0]!, P[1]!, P[2]!, P[5]!, P[6]!];
  if (!(fx > 0 && fy > 0)) throw new MessageContentError(`${image === 'raw' ? 'K' : 'P'} has focal lengths ${fx}, ${fy}: a calibrated camera needs positive ones`);
  if (skew !== 0) throw new MessageContentError(`${image === 'raw' ? 'K' : 'P'} has skew ${skew}: alight's pinhole has none`);
  const distortion: Distortion = { k1: 0, k2: 0, k3: 0, p1: 0, p2: 0 };
  if (image === 'raw' && D.length > 0) {
    if (model !== 'plumb_bob' && model !== 'rational_polynomial') throw new MessageContentError(`distortion model "${model}" is not supported (plumb_bob, or rational_polynomial with k4..k6 = 0; or map camera.image "rectified")`);
    for (let i = 5; i < D.length; i++) if (D[i] !== 0) throw new MessageContentError(`distortion coefficient ${i} is ${D[i]}: only k1 k2 p1 p2 k3 are modelled (Brown–Conrady)`);
    distortion.k1 = D[0] ?? 0;
    distortion.k2 = D[1] ?? 0;
    distortion.p1 = D[2] ?? 0;
    distortion.p2 = D[3] ?? 0;
    distortion.k3 = D[4] ?? 0;
  }
  return { width: msg.width, height: msg.height, fx, fy, cx: cx + pixelShift, cy: cy + pixelShift, distortion, frameId: msg.header?.frame_id ?? '' };
}

/** sensor_msgs/Imu -> specific force in body FLU (m/s^2). */
export function imuSpecificForce(msg: Decoded, convention: Convention<BodyConvention>, out: Float64Array): Float64Array {
  const a = msg.linear_acceleration;
  fluVector(body(convention, msg.header.frame_id), a.x, a.y, a.z, out);
  return out;
}

/** The orientation field of an attitude message and the frame ids that say its conventions. */
function orientationOf(type: string, msg: Decoded): { q: Decoded; worldId: string; bodyId: string } {
  switch (type) {
    case 'sensor_msgs/Imu': {
      if (msg.orientation_covariance?.[0] === -1) throw new MessageContentError('orientation_covariance[0] is -1: this IMU gives no orientation; name an attitude topic in the map');
      // The message names only the sensor frame: an FRD sensor frame ("_frd", "_ned") is taken
      // to report its orientation against NED, as aerospace drivers do; otherwise ENU (REP 103).
      const id: string = msg.header.frame_id;
      return { q: msg.orientation, worldId: bodyConventionOf(id) === 'frd' ? `${id}_ned` : id, bodyId: id };
    }
    case 'geometry_msgs/QuaternionStamped':
      return { q: msg.quaternion, worldId: msg.header.frame_id, bodyId: '' };
    case 'geometry_msgs/PoseStamped':
      return { q: msg.pose.orientation, worldId: msg.header.frame_id, bodyId: '' };
    case 'geometry_msgs/PoseWithCovarianceStamped':
      return { q: msg.pose.pose.orientation, worldId: msg.header.frame_id, bodyId: '' };
    default: // nav_msgs/Odometry
      return { q: msg.pose.pose.orientation, worldId: msg.header.frame_id, bodyId: msg.child_frame_id };
  }
}

/** An attitude message -> q_wb (ENU <- FLU, scalar first). */
export function attitudeOf(type: string, msg: Decoded, conventions: { world: Convention<WorldConvention>; body: Convention<BodyConvention> }, out: Float64Array): Float64Array {
  const { q, worldId, bodyId } = orientationOf(type, msg);
  rosAttitude(world(conventions.world, worldId), body(conventions.body, bodyId), q.x, q.y, q.z, q.w, out);
  return out;
}

/**
 * A velocity message -> lander velocity in world ENU (m/s). nav_msgs/Odometry: twist in the
 * child (body) frame, v_w = q_wb ⊗ v_b ⊗ conj(q_wb) with the message's own orientation.
 * TwistStamped / TwistWithCovarianceStamped: the twist is in header.frame_id, a world frame.
 */
export function velocityOf(type: string, msg: Decoded, conventions: { world: Convention<WorldConvention>; body: Convention<BodyConvention> }, q: Float64Array, out: Float64Array): Float64Array {
  if (type === 'nav_msgs/Odometry') {
    const v = msg.twist.twist.linear;
    attitudeOf(type, msg, conventions, q);
    fluVector(body(conventions.body, msg.child_frame_id), v.x, v.y, v.z, out);
    quatRotate(q, out, out);
    return out;
  }
  const v = type === 'geometry_msgs/TwistStamped' ? msg.twist.linear : msg.twist.twist.linear;
  enuVector(world(conventions.world, msg.header.frame_id), v.x, v.y, v.z, out);
  return out;
}

/** nav_msgs/Odometry -> position (world ENU, m) into p and velocity (world ENU, m/s) into v. */
export function odometryState(msg: Decoded, q: Float64Array, p: Float64Array, v: Float64Array): void {
  const auto = { world: 'auto', body: 'auto' } as const;
  const pos = msg.pose.pose.position;
  enuVector(worldConventionOf(msg.header.frame_id), pos.x, pos.y, pos.z, p);
  velocityOf('nav_msgs/Odometry', msg, auto, q, v);
}

/** The value at a dotted path ("corners.x_min"), or undefined. */
export function fieldAt(msg: Decoded, path: string): unknown {
  let v: Decoded = msg;
  for (const key of path.split('.')) v = v === null || typeof v !== 'object' ? undefined : v[key];
  return v;
}
