import { mkdtempSync, readdirSync, readFileSync, rmSync, truncateSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadScenario } from '../../../estimator/io/loadScenario.js';
import { folderSink } from '../../../estimator/io/log/folderSink.node.js';
import { logSourceFromFolder } from '../../../estimator/io/log/logSourceFromFolder.node.js';
import { recordTrial } from '../../../estimator/io/log/recordTrial.js';
import { replayLog, type ReplayReport } from '../../../estimator/io/log/replayLog.js';
import { ingestRosRecording, ingestRosRecordingToFolder, RecordingError, type IngestReport } from '../../../estimator/io/ros/ingestRosRecording.node.js';
import { parseRosMap } from '../../../estimator/io/ros/parseRosMap.js';
import { expectClose } from '../../helpers/expectClose.js';
import { mapForLayout, recordingFromLayout, type LayoutRecordingOptions } from './recordingFromLayout.js';
import { nanoseconds, rosTime, RosRecordingWriter } from './RosRecordingWriter.js';

let dir: string;
let log: string; // the layout `alight record` wrote
let direct: Replay;

interface Replay {
  report: ReplayReport;
  /** [t, x..., P diagonal...] after every IMU step. */
  estimates: number[][];
}

async function replay(folder: string): Promise<Replay> {
  const estimates: number[][] = [];
  const report = await replayLog(logSourceFromFolder(folder), {
    onEstimate: (t, x, P, n) => {
      const row = [t, ...x.subarray(0, n)];
      for (let i = 0; i < n; i++) row.push(P[i * n + i]!);
      estimates.push(row);
    },
  });
  return { report, estimates };
}

let serial = 0;
/** Write the recording, ingest it with the matching map, return the report and the new folder. */
async function roundTrip(options: LayoutRecordingOptions, edit: (map: Record<string, unknown>) => void = () => {}): Promise<{ report: IngestReport; folder: string }> {
  const n = serial++;
  const recording = join(dir, `flight-${n}.mcap`);
  await recordingFromLayout(log, recording, options);
  const map = mapForLayout(log, options);
  edit(map);
  const folder = join(dir, `ingested-${n}`);
  const report = await ingestRosRecording(recording, parseRosMap(JSON.stringify(map), 'map.json'), folderSink(folder));
  return { report, folder };
}

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'alight-ingest-'));
  log = join(dir, 'recorded');
  // The survey-rover demo: boxes with latency and jitter, dropouts, biased IMU and odometry.
  recordTrial(loadScenario(join(__dirname, '../../../data-demo/survey-rover.scenario.json')), folderSink(log));
  return async () => {
    rmSync(dir, { recursive: true, force: true });
  };
});

afterAll(() => undefined);

/** The two replays agree on every estimate. */
function expectSameEstimates(a: Replay, b: Replay, rel: number): void {
  expect(b.estimates.length).toBe(a.estimates.length);
  expect(b.report.filterSteps).toBe(a.report.filterSteps);
  for (const stream of ['boxes', 'imu', 'attitude', 'odometry', 'truth'] as const) {
    expect(b.report.rows[stream]!.used, stream).toBe(a.report.rows[stream]!.used);
    expect(b.report.rows[stream]!.skipped, stream).toBe(0);
  }
  let worst = 0;
  for (let k = 0; k < a.estimates.length; k++) {
    const ra = a.estimates[k]!, rb = b.estimates[k]!;
    for (let i = 0; i < ra.length; i++) worst = Math.max(worst, Math.abs(rb[i]! - ra[i]!) / (Math.abs(ra[i]!) + 1e-3));
  }
  expect(worst).toBeLessThan(rel);
  expectClose(b.report.nisMean!, a.report.nisMean!, { rel }, 'NIS mean');
  expectClose(b.report.neesMean!, a.report.neesMean!, { rel }, 'NEES mean');
}

describe('ingestRosRecording: recording -> layout -> replay', () => {
  beforeAll(async () => {
    direct = await replay(log);
    expect(direct.report.nisCount).toBeGreaterThan(200); // a real flight's worth of accepted boxes
  });

  // Tolerance 1e-9 relative: ROS stamps hold whole nanoseconds, so every time moves by up to
  // 0.5 ns (1e-10 of a 10 ms step), and vision_msgs carries a box as centre and size, whose
  // corners come back within a few ulps; nothing else changes on the way.
  it('gives the estimates of replaying the recorded layout directly (standard messages, ENU/FLU frames)', async () => {
    const { report, folder } = await roundTrip({});
    expect(report.indexed).toBe(true);
    expect(report.warnings).toEqual([]);
    expect(report.otherTopics).toEqual(['/lander/status_text']);
    const rows = (file: string) => readFileSync(join(log, file), 'utf8').trim().split('\n').length - 1;
    expect(report.files['imu.csv']).toBe(rows('imu.csv'));
    expect(report.files['boxes.csv']).toBe(rows('boxes.csv'));
    expect(report.files['odometry.csv']).toBe(rows('odometry.csv'));
    expect(report.files['truth.csv']).toBe(rows('truth.csv'));
    const camera = JSON.parse(readFileSync(join(folder, 'camera.json'), 'utf8'));
    const original = JSON.parse(readFileSync(join(log, 'camera.json'), 'utf8'));
    expect(camera.intrinsics).toEqual(original.intrinsics); // -0.5 then +0.5 px is exact for these values
    expect(camera.mount).toEqual(original.mount);
    expect(JSON.parse(readFileSync(join(folder, 'filter.json'), 'utf8'))).toEqual(JSON.parse(readFileSync(join(log, 'filter.json'), 'utf8')));
    expectSameEstimates(direct, await replay(folder), 1e-9);
  });

  // Same tolerance, plus the frame turns: FRD/NED components are swapped and negated exactly,
  // but the helper and the importer each multiply quaternions (a few ulps).
  it('turns FRD body and NED world frames (frame ids ending in _frd / _ned, REP 103) into FLU / ENU', async () => {
    const { report, folder } = await roundTrip({ aerospace: true, compression: 'zstd' });
    expect(report.warnings).toEqual([]);
    expectSameEstimates(direct, await replay(folder), 1e-9);
  });

  it('reads the attitude from its own QuaternionStamped topic and the velocity from a world-frame TwistStamped', async () => {
    const { report, folder } = await roundTrip({ attitude: 'topic', odometry: 'twist' });
    expect(report.streams.attitude!.type).toBe('geometry_msgs/msg/QuaternionStamped');
    expect(report.streams.odometry!.type).toBe('geometry_msgs/msg/TwistStamped');
    expect(report.warnings).toEqual([]); // both in "odom"
    expectSameEstimates(direct, await replay(folder), 1e-9);
  });

  it('reads a recording whose recorder was stopped hard (no index) front to back, and says what was lost', async () => {
    const { report, folder } = await roundTrip({ index: false, chunkSize: 1 << 16 });
    expect(report.indexed).toBe(false);
    expect(report.warnings.join('\n')).toMatch(/no usable index/);
    expect(report.warnings.join('\n')).toMatch(/did not finish it/);
    // The recorder's last open chunk never reached the file: fewer rows, none wrong.
    const ingested = await replay(folder);
    expect(ingested.report.rows.imu!.read).toBeLessThan(direct.report.rows.imu!.read);
    expect(ingested.report.rows.imu!.read).toBeGreaterThan(direct.report.rows.imu!.read * 0.9);
    const k = ingested.estimates.length - 1;
    for (let i = 0; i < ingested.estimates[0]!.length; i++) expectClose(ingested.estimates[k]![i]!, direct.estimates[k]![i]!, { rel: 1e-9, abs: 1e-12 }, `estimate ${i}`);
  });

  it('writes the same bytes when two threads share the topics (the folder version: a worker converts half of them)', async () => {
    const recording = join(dir, 'two-threads.mcap');
    await recordingFromLayout(log, recording, {});
    const map = parseRosMap(JSON.stringify(mapForLayout(log, {})), 'map.json');
    const one = join(dir, 'one-thread');
    await ingestRosRecording(recording, map, folderSink(one));
    const two = join(dir, 'two-threads');
    const report = await ingestRosRecordingToFolder(recording, map, two);
    expect(report.threads, 'dist/ingest-worker.mjs is built by `npm run build`').toBe(2);
    const files = readdirSync(one).sort();
    expect(readdirSync(two).sort()).toEqual(files);
    for (const file of files) expect(readFileSync(join(two, file)).equals(readFileSync(join(one, file))), file).toBe(true);
    expect(report.streams.imu!.rows).toBe(report.files['imu.csv']);
  });

  it('counts detections of another class instead of writing them', async () => {
    const { report } = await roundTrip({}, (map) => {
      (map.boxes as Record<string, unknown>).classId = 'truck';
    });
    expect(report.streams.boxes!.rows).toBe(0);
    expect(report.streams.boxes!.left['other-class']).toBe(Number(readFileSync(join(log, 'boxes.csv'), 'utf8').trim().split('\n').length - 1));
  });
});

/** A small recording written by hand: one CameraInfo, IMU, and the given extra messages. */
async function smallRecording(name: string, extra: (w: RosRecordingWriter) => Promise<void>): Promise<string> {
  const path = join(dir, name);
  const w = await RosRecordingWriter.create(path);
  await w.channel('/camera/camera_info', 'sensor_msgs/CameraInfo');
  await w.channel('/imu/data', 'sensor_msgs/Imu');
  const ns = nanoseconds(100.25);
  await w.add('/camera/camera_info', ns, {
    header: { stamp: rosTime(ns), frame_id: 'cam_optical' }, height: 480, width: 640, distortion_model: 'plumb_bob',
    d: [0.01, 0, 0, 0, 0], k: [500, 0, 319.5, 0, 500, 239.5, 0, 0, 1], r: [1, 0, 0, 0, 1, 0, 0, 0, 1], p: [500, 0, 319.5, 0, 0, 500, 239.5, 0, 0, 0, 1, 0],
    binning_x: 0, binning_y: 0, roi: { x_offset: 0, y_offset: 0, height: 0, width: 0, do_rectify: false },
  });
  for (let i = 0; i < 10; i++) {
    const t = nanoseconds(100.25 + i * 0.01);
    await w.add('/imu/data', t, {
      header: { stamp: rosTime(t), frame_id: 'base_link' }, orientation: { x: 0, y: 0, z: 0, w: 1 }, orientation_covariance: new Float64Array(9),
      angular_velocity: { x: 0, y: 0, z: 0 }, angular_velocity_covariance: new Float64Array(9), linear_acceleration: { x: 0.1, y: -0.2, z: 9.81 }, linear_acceleration_covariance: new Float64Array(9),
    });
  }
  await extra(w);
  await w.close();
  return path;
}

const smallMap = (boxes: Record<string, unknown>) =>
  parseRosMap(JSON.stringify({ format: 'alight-ros-map', version: 1, camera: { topic: '/camera/camera_info' }, targetSize: 2, boxes, imu: { topic: '/imu/data' } }), 'map.json');

/** The message a recording is refused with, the same on one thread and on two (the worker's errors come back as RecordingErrors). */
async function ingestError(path: string, map = smallMap({ topic: '/boxes' })): Promise<string> {
  const refusal = (error: unknown) => {
    expect(error).toBeInstanceOf(RecordingError);
    return (error as Error).message;
  };
  const one = await ingestRosRecording(path, map, folderSink(join(dir, `bad-${serial++}`)), { name: 'flight.mcap' }).then(() => 'no error', refusal);
  const two = await ingestRosRecordingToFolder(path, map, join(dir, `bad-${serial++}`), { name: 'flight.mcap' }).then(() => 'no error', refusal);
  expect(two).toBe(one);
  return one;
}

describe('ingestRosRecording: recordings it refuses, by name', () => {
  it('reads boxes from a message of the user\'s own with four corner fields, times after the first IMU second', async () => {
    const def = 'std_msgs/Header header\nfloat32 left\nfloat32 top\nfloat32 right\nfloat32 bottom\nfloat32 confidence';
    const path = await smallRecording('corners.mcap', async (w) => {
      await w.channel('/deck_box', 'my_detector/DeckBox', `${def}\n================================================================================\nMSG: std_msgs/Header\nbuiltin_interfaces/Time stamp\nstring frame_id\n================================================================================\nMSG: builtin_interfaces/Time\nint32 sec\nuint32 nanosec`);
      const capture = nanoseconds(100.3), arrival = nanoseconds(100.34);
      await w.add('/deck_box', arrival, { header: { stamp: rosTime(capture), frame_id: 'cam_optical' }, left: 100, top: 50, right: 140, bottom: 90, confidence: 0.75 });
    });
    const folder = join(dir, 'corners');
    const report = await ingestRosRecording(path, smallMap({ topic: '/deck_box', corners: { xMin: 'left', yMin: 'top', xMax: 'right', yMax: 'bottom' }, score: 'confidence' }), folderSink(folder));
    expect(report.timeOrigin).toBe(100);
    // Capture 0.3 s and arrival 0.34 s after the origin; corners +0.5 px (ROS pixel centres are integers).
    const [capture, arrival, ...rest] = readFileSync(join(folder, 'boxes.csv'), 'utf8').trim().split('\n')[1]!.split(',').map(Number);
    expectClose(capture!, 0.3, { abs: 1e-9 }, 'capture'); // nanosecond stamps
    expectClose(arrival!, 0.34, { abs: 1e-9 }, 'arrival');
    expect(rest).toEqual([100.5, 50.5, 140.5, 90.5, 0.75]);
    const camera = JSON.parse(readFileSync(join(folder, 'camera.json'), 'utf8'));
    expect(camera.intrinsics).toEqual({ fx: 500, fy: 500, cx: 320, cy: 240 });
    expect(camera.distortion).toEqual({ k1: 0.01, k2: 0, k3: 0, p1: 0, p2: 0 });
    expect(readFileSync(join(folder, 'imu.csv'), 'utf8').split('\n')[1]).toBe('0.25,0.1,-0.2,9.81');
  });

  it('leaves out rotated vision_msgs boxes (theta != 0) and counts them', async () => {
    const path = await smallRecording('rotated.mcap', async (w) => {
      await w.channel('/boxes', 'vision_msgs/Detection2DArray');
      const t = nanoseconds(100.3);
      const detection = (theta: number) => ({
        header: { stamp: rosTime(t), frame_id: '' },
        results: [],
        bbox: { center: { position: { x: 320, y: 240 }, theta }, size_x: 40, size_y: 20 },
        id: '',
      });
      await w.add('/boxes', t, { header: { stamp: rosTime(t), frame_id: 'cam_optical' }, detections: [detection(0), detection(0.3)] });
    });
    const folder = join(dir, 'rotated');
    const report = await ingestRosRecording(path, smallMap({ topic: '/boxes' }), folderSink(folder));
    expect(report.streams.boxes!.rows).toBe(1);
    expect(report.streams.boxes!.left).toEqual({ 'rotated-box': 1 });
    // Centre (320, 240) with integer pixel centres is (320.5, 240.5) in alight's; no hypotheses: score 1.
    expect(readFileSync(join(folder, 'boxes.csv'), 'utf8').trim().split('\n')[1]!.split(',').slice(2)).toEqual(['300.5', '230.5', '340.5', '250.5', '1']);
  });

  it('uses the first camera info and says how many later ones differ from it', async () => {
    const info = (fx: number, sec: number) => ({
      header: { stamp: rosTime(nanoseconds(sec)), frame_id: 'cam_optical' }, height: 480, width: 640, distortion_model: 'plumb_bob',
      d: [0.01, 0, 0, 0, 0], k: [fx, 0, 319.5, 0, 500, 239.5, 0, 0, 1], r: [1, 0, 0, 0, 1, 0, 0, 0, 1], p: [fx, 0, 319.5, 0, 0, 500, 239.5, 0, 0, 0, 1, 0],
      binning_x: 0, binning_y: 0, roi: { x_offset: 0, y_offset: 0, height: 0, width: 0, do_rectify: false },
    });
    const path = await smallRecording('camera-changes.mcap', async (w) => {
      await w.channel('/boxes', 'vision_msgs/Detection2DArray');
      await w.add('/camera/camera_info', nanoseconds(100.3), info(500, 100.3)); // the same camera again
      await w.add('/camera/camera_info', nanoseconds(100.4), info(510, 100.4)); // a new calibration mid-flight
      await w.add('/boxes', nanoseconds(100.4), { header: { stamp: rosTime(nanoseconds(100.4)), frame_id: 'cam_optical' }, detections: [] });
    });
    const folder = join(dir, 'camera-changes');
    const report = await ingestRosRecording(path, smallMap({ topic: '/boxes' }), folderSink(folder));
    expect(report.streams.camera!.messages).toBe(3);
    expect(report.warnings).toEqual(['topic /camera/camera_info: 1 camera info messages differ from the first; the first is used']);
    expect(JSON.parse(readFileSync(join(folder, 'camera.json'), 'utf8')).intrinsics.fx).toBe(500);
  });

  it('stops on a damaged chunk (checksum mismatch) instead of writing changed numbers', async () => {
    const path = await smallRecording('flipped.mcap', async (w) => {
      await w.channel('/boxes', 'vision_msgs/Detection2DArray');
    });
    const bytes = readFileSync(path);
    const g = Buffer.alloc(8);
    g.writeDoubleLE(9.81);
    const at = bytes.indexOf(g); // inside the first IMU message of the chunk
    expect(at).toBeGreaterThan(0);
    bytes[at + 7] ^= 0x01; // 9.81 becomes another number
    writeFileSync(path, bytes);
    expect(await ingestError(path)).toMatch(/^flight\.mcap: the recording is damaged \(Incorrect chunk CRC/);
  });

  it('warns when attitude and odometry name different world frames (REP 105: map and odom drift apart)', async () => {
    const path = await smallRecording('two-worlds.mcap', async (w) => {
      await w.channel('/boxes', 'vision_msgs/Detection2DArray');
      await w.channel('/attitude', 'geometry_msgs/QuaternionStamped');
      await w.channel('/velocity', 'geometry_msgs/TwistStamped');
      const t = nanoseconds(100.3);
      await w.add('/attitude', t, { header: { stamp: rosTime(t), frame_id: 'map' }, quaternion: { x: 0, y: 0, z: 0, w: 1 } });
      await w.add('/velocity', t, { header: { stamp: rosTime(t), frame_id: 'odom' }, twist: { linear: { x: 1, y: 0, z: 0 }, angular: { x: 0, y: 0, z: 0 } } });
      await w.add('/boxes', t, { header: { stamp: rosTime(t), frame_id: 'cam_optical' }, detections: [] });
    });
    const map = parseRosMap(JSON.stringify({ format: 'alight-ros-map', version: 1, camera: { topic: '/camera/camera_info' }, targetSize: 2, boxes: { topic: '/boxes' }, imu: { topic: '/imu/data' }, attitude: { topic: '/attitude' }, odometry: { topic: '/velocity' } }), 'map.json');
    const report = await ingestRosRecording(path, map, folderSink(join(dir, 'two-worlds')));
    expect(report.warnings).toEqual(['attitude in frame "map" but odometry in "odom": REP 105 lets such frames drift apart, alight takes them as one world frame']);
  });

  it('names a mapped topic that is not recorded, and lists what is', async () => {
    const path = await smallRecording('no-boxes.mcap', async () => {});
    expect(await ingestError(path)).toBe('flight.mcap: topic /boxes (boxes) is not in the recording; it has these topics: /camera/camera_info (sensor_msgs/msg/CameraInfo), /imu/data (sensor_msgs/msg/Imu)');
  });

  it('names a topic whose message type cannot give its stream', async () => {
    const path = await smallRecording('wrong-type.mcap', async (w) => {
      await w.channel('/boxes', 'geometry_msgs/PoseStamped');
    });
    expect(await ingestError(path)).toMatch(/^flight\.mcap: topic \/boxes \(boxes\): message type geometry_msgs\/msg\/PoseStamped cannot give boxes \(accepted: vision_msgs\/Detection2DArray, vision_msgs\/Detection2D; for a message of your own, give boxes.corners in the map\)$/);
  });

  it('names a topic whose messages are not CDR', async () => {
    const path = await smallRecording('json-boxes.mcap', async (w) => {
      await w.channel('/boxes', 'vision_msgs/Detection2DArray', undefined, 'json');
    });
    expect(await ingestError(path)).toBe('flight.mcap: topic /boxes (boxes): messages are encoded as "json"; alight reads ROS 2 CDR ("cdr")');
  });

  it('names an IMU topic without messages', async () => {
    const path = join(dir, 'empty-imu.mcap');
    const w = await RosRecordingWriter.create(path);
    await w.channel('/camera/camera_info', 'sensor_msgs/CameraInfo');
    await w.channel('/imu/data', 'sensor_msgs/Imu');
    await w.channel('/boxes', 'vision_msgs/Detection2DArray');
    await w.close();
    expect(await ingestError(path)).toBe('flight.mcap: topic /camera/camera_info (camera) has no messages: the camera\'s intrinsics are needed');
  });

  it('refuses a file that is not MCAP', async () => {
    const path = join(dir, 'not.mcap');
    writeFileSync(path, 'time,fx,fy,fz\n0,0,0,9.81\n');
    expect(await ingestError(path)).toMatch(/^flight\.mcap: not an MCAP file/);
  });

  it('refuses boxes seen by another camera than the mapped camera info', async () => {
    const path = await smallRecording('other-camera.mcap', async (w) => {
      await w.channel('/boxes', 'vision_msgs/Detection2DArray');
      const t = nanoseconds(100.3);
      await w.add('/boxes', t, { header: { stamp: rosTime(t), frame_id: 'rear_cam_optical' }, detections: [] });
    });
    expect(await ingestError(path)).toBe('flight.mcap: topic /boxes (boxes): boxes in frame "rear_cam_optical" but the camera info (topic /camera/camera_info) is for frame "cam_optical": map the camera that saw the boxes');
  });

  it('counts a damaged message and keeps the rest; a file cut inside a record keeps what came before', async () => {
    const path = await smallRecording('damaged.mcap', async (w) => {
      await w.channel('/boxes', 'vision_msgs/Detection2DArray');
      const t = nanoseconds(100.3);
      await w.addRaw('/boxes', t, new Uint8Array([0, 1, 0, 0, 1, 2])); // a CDR header and too few bytes
      await w.add('/boxes', nanoseconds(100.31), { header: { stamp: rosTime(t), frame_id: 'cam_optical' }, detections: [] });
    });
    const report = await ingestRosRecording(path, smallMap({ topic: '/boxes' }), folderSink(join(dir, 'damaged')));
    expect(report.streams.boxes!.messages).toBe(2);
    expect(report.streams.boxes!.left).toEqual({ undecodable: 1 });
    expect(report.warnings[0]).toMatch(/^topic \/boxes: a message at log time 100300000000 ns cannot be decoded/);

    const cut = join(dir, 'cut.mcap');
    writeFileSync(cut, readFileSync(path));
    truncateSync(cut, statSync(cut).size - 200); // inside the summary: no index, data intact
    const cutReport = await ingestRosRecording(cut, smallMap({ topic: '/boxes' }), folderSink(join(dir, 'cut')));
    expect(cutReport.indexed).toBe(false);
    expect(cutReport.files['imu.csv']).toBe(10);
  });
});
