// Test helper: a flight-log folder (as `alight record` writes it) turned into the ROS 2
// recording a lander would have made of the same flight, plus the map file that reads it back.
// The streams become the standard messages: sensor_msgs/Imu (specific force; orientation =
// the attitude estimate, or a separate geometry_msgs/QuaternionStamped topic),
// nav_msgs/Odometry (twist in the body frame, as its definition says) or a world-frame
// geometry_msgs/TwistStamped, vision_msgs/Detection2DArray (capture stamp in the header,
// arrival as the log time), sensor_msgs/CameraInfo, two nav_msgs/Odometry references for
// truth and std_msgs/Header resets. Pixel coordinates go to ROS's integer pixel centres (-0.5).
// With `aerospace`, IMU and odometry are written in FRD / NED frames to exercise conversions.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { quatConjugate, quatMultiply, quatRotate } from '../../../estimator/frames/quaternion.js';
import { nanoseconds, rosTime, RosRecordingWriter, type RecordingWriterOptions } from './RosRecordingWriter.js';

export interface LayoutRecordingOptions extends RecordingWriterOptions {
  /** Where the attitude goes: the IMU's orientation (default) or its own topic. */
  attitude?: 'imu' | 'topic';
  /** Odometry as nav_msgs/Odometry (default) or geometry_msgs/TwistStamped. */
  odometry?: 'odometry' | 'twist';
  /** Write IMU and odometry in FRD body / NED world frames (frame ids "base_link_frd", "odom_ned"). */
  aerospace?: boolean;
}

type Row = number[];

function csv(folder: string, file: string): { columns: string[]; rows: Row[] } | null {
  let text: string;
  try {
    text = readFileSync(join(folder, file), 'utf8');
  } catch {
    return null;
  }
  const lines = text.split('\n').filter((l) => l.length > 0);
  return { columns: lines[0]!.split(','), rows: lines.slice(1).map((l) => l.split(',').map(Number)) };
}

const H = Math.SQRT1_2;
const NED_FROM_ENU = [0, H, H, 0]; // its own inverse up to sign
const FLU_FROM_FRD = [0, 1, 0, 0];
const header = (ns: bigint, frame_id: string) => ({ stamp: rosTime(ns), frame_id });
const vector = (v: ArrayLike<number>) => ({ x: v[0]!, y: v[1]!, z: v[2]! });
const quaternion = (q: ArrayLike<number>) => ({ x: q[1]!, y: q[2]!, z: q[3]!, w: q[0]! });
const zeros = (n: number) => new Float64Array(n);

/** The recording's map file (as JSON) for `recordingFromLayout`'s topics. */
export function mapForLayout(folder: string, options: LayoutRecordingOptions = {}): Record<string, unknown> {
  const camera = JSON.parse(readFileSync(join(folder, 'camera.json'), 'utf8'));
  let filter: unknown;
  try {
    filter = JSON.parse(readFileSync(join(folder, 'filter.json'), 'utf8'));
  } catch {
    filter = undefined;
  }
  const has = (file: string) => (csv(folder, file)?.rows.length ?? 0) > 0; // a channel with no messages is absent from a recording cut short
  return {
    format: 'alight-ros-map',
    version: 1,
    camera: { topic: '/camera/camera_info', mount: camera.mount },
    targetSize: camera.targetSize,
    ...(camera.outline ? { outline: camera.outline } : {}),
    boxes: { topic: '/deck/detections', classId: 'deck' },
    imu: { topic: '/imu/data' },
    ...(options.attitude === 'topic' ? { attitude: { topic: '/lander/attitude' } } : {}),
    ...(has('odometry.csv') ? { odometry: { topic: options.odometry === 'twist' ? '/lander/velocity' : '/odom' } } : {}),
    ...(has('truth.csv') ? { truth: { lander: '/mocap/lander', carrier: '/mocap/carrier' } } : {}),
    ...(has('resets.csv') ? { resets: { topic: '/lander/estimate_reset' } } : {}),
    timeOrigin: 0,
    ...(filter !== undefined ? { filter } : {}),
  };
}

/** Write the recording of the log in `folder` to `path`. */
export async function recordingFromLayout(folder: string, path: string, options: LayoutRecordingOptions = {}): Promise<void> {
  const camera = JSON.parse(readFileSync(join(folder, 'camera.json'), 'utf8'));
  const imu = csv(folder, 'imu.csv')!;
  const attitude = csv(folder, 'attitude.csv')!;
  const odometry = csv(folder, 'odometry.csv');
  const boxes = csv(folder, 'boxes.csv')!;
  const truth = csv(folder, 'truth.csv');
  const resetRows = csv(folder, 'resets.csv');
  const resets = resetRows && resetRows.rows.length > 0 ? resetRows : null;
  const aero = options.aerospace === true;
  const bodyFrame = aero ? 'base_link_frd' : 'base_link';
  const worldFrame = aero ? 'odom_ned' : 'odom';

  const events: { ns: bigint; topic: string; message: unknown }[] = [];
  const attitudeAt = new Map<number, number[]>(); // time -> q_wb
  for (const r of attitude.rows) attitudeAt.set(r[0]!, [r[1]!, r[2]!, r[3]!, r[4]!]);
  /** A q_wb (ENU <- FLU) as the message's frames state it. */
  const asRecorded = (q: number[]) => (aero ? quatMultiply(quatMultiply(NED_FROM_ENU, q), FLU_FROM_FRD) : q);
  let latestQ = [1, 0, 0, 0];
  const attitudeTimes = attitude.rows.map((r) => r[0]!);
  let k = 0;
  const attitudeAtOrBefore = (t: number) => {
    while (k < attitudeTimes.length && attitudeTimes[k]! <= t) latestQ = attitudeAt.get(attitudeTimes[k++]!)!;
    return latestQ;
  };

  const t0 = imu.rows[0]![0]!;
  events.push({
    ns: nanoseconds(t0),
    topic: '/camera/camera_info',
    message: {
      header: header(nanoseconds(t0), 'camera_optical_frame'),
      height: camera.height,
      width: camera.width,
      distortion_model: 'plumb_bob',
      d: [camera.distortion.k1, camera.distortion.k2, camera.distortion.p1, camera.distortion.p2, camera.distortion.k3],
      k: [camera.intrinsics.fx, 0, camera.intrinsics.cx - 0.5, 0, camera.intrinsics.fy, camera.intrinsics.cy - 0.5, 0, 0, 1],
      r: [1, 0, 0, 0, 1, 0, 0, 0, 1],
      p: [camera.intrinsics.fx, 0, camera.intrinsics.cx - 0.5, 0, 0, camera.intrinsics.fy, camera.intrinsics.cy - 0.5, 0, 0, 0, 1, 0],
      binning_x: 0,
      binning_y: 0,
      roi: { x_offset: 0, y_offset: 0, height: 0, width: 0, do_rectify: false },
    },
  });
  for (const [t, fx, fy, fz] of imu.rows) {
    const ns = nanoseconds(t!);
    const q = asRecorded(attitudeAt.get(t!) ?? attitudeAtOrBefore(t!));
    events.push({
      ns,
      topic: '/imu/data',
      message: {
        header: header(ns, bodyFrame),
        orientation: quaternion(q),
        orientation_covariance: options.attitude === 'topic' ? [-1, 0, 0, 0, 0, 0, 0, 0, 0] : zeros(9),
        angular_velocity: { x: 0, y: 0, z: 0 },
        angular_velocity_covariance: zeros(9),
        linear_acceleration: aero ? { x: fx!, y: -fy!, z: -fz! } : { x: fx!, y: fy!, z: fz! },
        linear_acceleration_covariance: zeros(9),
      },
    });
  }
  if (options.attitude === 'topic') {
    for (const [t, ...q] of attitude.rows) events.push({ ns: nanoseconds(t!), topic: '/lander/attitude', message: { header: header(nanoseconds(t!), worldFrame), quaternion: quaternion(asRecorded(q)) } });
  }
  if (odometry) {
    k = 0;
    latestQ = [1, 0, 0, 0];
    for (const [t, vx, vy, vz] of odometry.rows) {
      const ns = nanoseconds(t!);
      if (options.odometry === 'twist') {
        const v = aero ? [vy!, vx!, -vz!] : [vx!, vy!, vz!];
        events.push({ ns, topic: '/lander/velocity', message: { header: header(ns, worldFrame), twist: { linear: vector(v), angular: vector([0, 0, 0]) } } });
        continue;
      }
      const q = attitudeAtOrBefore(t!);
      const vBody = quatRotate(quatConjugate(q), [vx!, vy!, vz!]); // v_b = conj(q_wb) v_w q_wb
      const recorded = aero ? [vBody[0]!, -vBody[1]!, -vBody[2]!] : vBody;
      events.push({
        ns,
        topic: '/odom',
        message: {
          header: header(ns, worldFrame),
          child_frame_id: bodyFrame,
          pose: { pose: { position: vector([0, 0, 0]), orientation: quaternion(asRecorded(q)) }, covariance: zeros(36) },
          twist: { twist: { linear: vector(recorded), angular: vector([0, 0, 0]) }, covariance: zeros(36) },
        },
      });
    }
  }
  // Boxes: one Detection2DArray per (capture, arrival), in arrival order.
  const c = boxes.columns;
  const col = (name: string) => c.indexOf(name);
  const [ti, ai, x0, y0, x1, y1, si] = ['time', 'arrival', 'xMin', 'yMin', 'xMax', 'yMax', 'score'].map(col);
  let group: { capture: number; arrival: number; detections: unknown[] } | null = null;
  const flush = () => {
    if (group === null) return;
    events.push({ ns: nanoseconds(group.arrival), topic: '/deck/detections', message: { header: header(nanoseconds(group.capture), 'camera_optical_frame'), detections: group.detections } });
    group = null;
  };
  for (const r of boxes.rows) {
    const capture = r[ti!]!, arrival = ai! >= 0 ? r[ai!]! : capture;
    if (group === null || group.capture !== capture || group.arrival !== arrival) {
      flush();
      group = { capture, arrival, detections: [] };
    }
    const xMin = r[x0!]! - 0.5, yMin = r[y0!]! - 0.5, xMax = r[x1!]! - 0.5, yMax = r[y1!]! - 0.5;
    group.detections.push({
      header: header(nanoseconds(capture), 'camera_optical_frame'),
      results: [{ hypothesis: { class_id: 'deck', score: si! >= 0 ? r[si!]! : 1 }, pose: { pose: { position: vector([0, 0, 0]), orientation: { x: 0, y: 0, z: 0, w: 1 } }, covariance: zeros(36) } }],
      bbox: { center: { position: { x: (xMin + xMax) / 2, y: (yMin + yMax) / 2 }, theta: 0 }, size_x: xMax - xMin, size_y: yMax - yMin },
      id: '',
    });
  }
  flush();
  if (truth) {
    for (const [t, rx, ry, rz, vcx, vcy, vcz, vlx, vly, vlz] of truth.rows) {
      const ns = nanoseconds(t!);
      const reference = (p: number[], v: number[]) => ({
        header: header(ns, 'mocap'),
        child_frame_id: 'body',
        pose: { pose: { position: vector(p), orientation: { x: 0, y: 0, z: 0, w: 1 } }, covariance: zeros(36) },
        twist: { twist: { linear: vector(v), angular: vector([0, 0, 0]) }, covariance: zeros(36) },
      });
      events.push({ ns, topic: '/mocap/lander', message: reference([0, 0, 0], [vlx!, vly!, vlz!]) });
      events.push({ ns, topic: '/mocap/carrier', message: reference([rx!, ry!, rz!], [vcx!, vcy!, vcz!]) });
    }
  }
  for (const [t] of resets?.rows ?? []) events.push({ ns: nanoseconds(t!), topic: '/lander/estimate_reset', message: header(nanoseconds(t!), '') });

  events.sort((a, b) => (a.ns < b.ns ? -1 : a.ns > b.ns ? 1 : 0)); // stable: same-time messages keep their order
  const writer = await RosRecordingWriter.create(path, options);
  await writer.channel('/camera/camera_info', 'sensor_msgs/CameraInfo');
  await writer.channel('/imu/data', 'sensor_msgs/Imu');
  if (options.attitude === 'topic') await writer.channel('/lander/attitude', 'geometry_msgs/QuaternionStamped');
  if (odometry) await writer.channel(options.odometry === 'twist' ? '/lander/velocity' : '/odom', options.odometry === 'twist' ? 'geometry_msgs/TwistStamped' : 'nav_msgs/Odometry');
  await writer.channel('/deck/detections', 'vision_msgs/Detection2DArray');
  if (truth) {
    await writer.channel('/mocap/lander', 'nav_msgs/Odometry');
    await writer.channel('/mocap/carrier', 'nav_msgs/Odometry');
  }
  if (resets) await writer.channel('/lander/estimate_reset', 'std_msgs/Header');
  await writer.channel('/lander/status_text', 'std_msgs/String');
  for (const e of events) await writer.add(e.topic, e.ns, e.message);
  await writer.close();
}
