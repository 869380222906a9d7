// A synthetic ROS 2 recording of any length, written as it is generated (memory stays flat), for
// the import benchmark: the message mix of a lander with a 200 Hz IMU (orientation included),
// a 30 Hz camera with its CameraInfo and a Detection2DArray per frame, 20 Hz visual odometry and
// 100 Hz motion-capture references of lander and carrier. Values are a slow orbit: plausible
// numbers, not a flight (no filter claims are made on them). Uncompressed chunks, as rosbag2
// writes by default. Returns the file size in bytes.
import { statSync } from 'node:fs';
import { nanoseconds, rosTime, RosRecordingWriter } from './RosRecordingWriter.js';

export interface SyntheticRecordingOptions {
  /** Recording length (s). */
  duration: number;
  /** First stamp (s since the epoch), e.g. a 2026 wall-clock time. */
  start?: number;
}

const zeros = (n: number) => new Float64Array(n);

export async function writeSyntheticRecording(path: string, options: SyntheticRecordingOptions): Promise<number> {
  const w = await RosRecordingWriter.create(path, { chunkSize: 4 << 20 });
  await w.channel('/down_cam/camera_info', 'sensor_msgs/CameraInfo');
  await w.channel('/deck_detector/detections', 'vision_msgs/Detection2DArray');
  await w.channel('/imu/data', 'sensor_msgs/Imu');
  await w.channel('/vio/odometry', 'nav_msgs/Odometry');
  await w.channel('/mocap/lander/odom', 'nav_msgs/Odometry');
  await w.channel('/mocap/carrier/odom', 'nav_msgs/Odometry');
  const start = options.start ?? 1_796_000_000;
  const covariance9 = zeros(9), covariance36 = zeros(36);
  const reference = (ns: bigint, child: string, x: number, y: number, vx: number, vy: number) => ({
    header: { stamp: rosTime(ns), frame_id: 'mocap' },
    child_frame_id: child,
    pose: { pose: { position: { x, y, z: 5 }, orientation: { x: 0, y: 0, z: 0, w: 1 } }, covariance: covariance36 },
    twist: { twist: { linear: { x: vx, y: vy, z: 0 }, angular: { x: 0, y: 0, z: 0 } }, covariance: covariance36 },
  });
  // One tick = 5 ms (the IMU); the other streams every k ticks (30 Hz ~ every 6.67 ticks: every 7th, close enough).
  const ticks = Math.round(options.duration * 200);
  for (let i = 0; i < ticks; i++) {
    const t = i / 200;
    const ns = nanoseconds(start + t);
    const a = 0.05 * t, c = Math.cos(a), s = Math.sin(a);
    await w.add('/imu/data', ns, {
      header: { stamp: rosTime(ns), frame_id: 'base_link' },
      orientation: { x: 0, y: 0, z: Math.sin(a / 2), w: Math.cos(a / 2) }, orientation_covariance: covariance9,
      angular_velocity: { x: 0.01, y: -0.02, z: 0.05 }, angular_velocity_covariance: covariance9,
      linear_acceleration: { x: 0.2 * c, y: 0.2 * s, z: 9.81 }, linear_acceleration_covariance: covariance9,
    });
    if (i % 7 === 0) {
      await w.add('/down_cam/camera_info', ns, {
        header: { stamp: rosTime(ns), frame_id: 'down_cam_optical' }, height: 480, width: 640, distortion_model: 'plumb_bob',
        d: [-0.05, 0.01, 0, 0, 0], k: [505, 0, 319.5, 0, 505, 239.5, 0, 0, 1], r: [1, 0, 0, 0, 1, 0, 0, 0, 1], p: [505, 0, 319.5, 0, 0, 505, 239.5, 0, 0, 0, 1, 0],
        binning_x: 0, binning_y: 0, roi: { x_offset: 0, y_offset: 0, height: 0, width: 0, do_rectify: false },
      });
      const arrival = nanoseconds(start + t + 0.06);
      await w.add('/deck_detector/detections', arrival, {
        header: { stamp: rosTime(ns), frame_id: 'down_cam_optical' },
        detections: [{
          header: { stamp: rosTime(ns), frame_id: 'down_cam_optical' },
          results: [{ hypothesis: { class_id: 'deck', score: 0.9 }, pose: { pose: { position: { x: 0, y: 0, z: 0 }, orientation: { x: 0, y: 0, z: 0, w: 1 } }, covariance: covariance36 } }],
          bbox: { center: { position: { x: 320 + 40 * c, y: 240 + 40 * s }, theta: 0 }, size_x: 80, size_y: 60 },
          id: '',
        }],
      });
    }
    if (i % 10 === 0) await w.add('/vio/odometry', ns, { ...reference(ns, 'base_link', 10 * c, 10 * s, -0.5 * s, 0.5 * c), header: { stamp: rosTime(ns), frame_id: 'odom' } });
    if (i % 2 === 0) {
      await w.add('/mocap/lander/odom', ns, reference(ns, 'lander', 10 * c, 10 * s, -0.5 * s, 0.5 * c));
      await w.add('/mocap/carrier/odom', ns, reference(ns, 'carrier', 10 * c + 1, 10 * s, -0.5 * s, 0.5 * c));
    }
  }
  await w.close();
  return statSync(path).size;
}
