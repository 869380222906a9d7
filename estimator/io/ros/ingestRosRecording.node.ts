// Node-only: a ROS 2 recording (.mcap, CDR messages) -> the flight-log layout (README.md,
// "Flight-log layout"), as the map file says (parseRosMap). One streaming pass: messages come
// a chunk at a time from the file handle, are decoded by the definitions the recording carries
// and become CSV rows buffered in 64 kB pieces, so memory does not grow with the recording.
// Problems that make the recording unusable (a mapped topic missing, a message type alight
// cannot read, frames that disagree) stop it with a RecordingError naming the topic; single
// messages that cannot be used are counted per stream and reported.
import { parse } from '@foxglove/rosmsg';
import { MessageReader } from '@foxglove/rosmsg2-serialization';
import type { LogTextSink } from '../log/LogRecorder.js';
import { LOG_FORMAT, LOG_VERSION } from '../log/parseLogCamera.js';
import { LayoutRows } from './LayoutRows.js';
import { openRecording, RecordingOpenError, type RecordedChannel, type RecordedMessage, type Recording } from './openRecording.node.js';
import type { RosMap } from './parseRosMap.js';
import { cornerBoxes, detectionBoxes, emptyBoxCounts } from './rosBoxes.js';
import { attitudeOf, cameraFromInfo, imuSpecificForce, logTimeSeconds, MessageContentError, odometryState, ROLE_TYPES, shortTypeName, stampSeconds, velocityOf, type Decoded, type RosCamera } from './rosMessages.js';
import { TruthPairing } from './TruthPairing.js';

/** A recording that cannot be turned into a flight log: the message names the file and topic. */
export class RecordingError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'RecordingError';
  }
}

export type IngestRole = 'camera' | 'boxes' | 'imu' | 'attitude' | 'odometry' | 'truthLander' | 'truthCarrier' | 'resets';

export interface IngestStream {
  topic: string;
  /** Message type as recorded. */
  type: string;
  messages: number;
  /** Rows written (boxes: one per detection kept). */
  rows: number;
  /** Messages or detections left out, by reason. */
  left: Record<string, number>;
}

export interface IngestReport {
  recording: string;
  bytes: number;
  /** Read through the file's index (log-time order); false: front to back (no usable summary). */
  indexed: boolean;
  /** Whole seconds subtracted from every stamp. */
  timeOrigin: number;
  camera: { topic: string; frameId: string; width: number; height: number; fx: number; fy: number; cx: number; cy: number };
  streams: Partial<Record<IngestRole, IngestStream>>;
  /** Rows written per file of the layout. */
  files: Record<string, number>;
  /** Topics of the recording the map does not use. */
  otherTopics: string[];
  warnings: string[];
  seconds: number;
}

const HEADERS = {
  'imu.csv': 'time,fx,fy,fz',
  'attitude.csv': 'time,qw,qx,qy,qz',
  'odometry.csv': 'time,vx,vy,vz',
  'boxes.csv': 'time,arrival,xMin,yMin,xMax,yMax,score',
  'truth.csv': 'time,rx,ry,rz,vcx,vcy,vcz,vlx,vly,vlz',
  'resets.csv': 'time',
} as const;

interface Route {
  role: IngestRole;
  topic: string;
}

function routesOf(map: RosMap): Route[] {
  const routes: Route[] = [
    { role: 'camera', topic: map.camera.topic },
    { role: 'boxes', topic: map.boxes.topic },
    { role: 'imu', topic: map.imu.topic },
    { role: 'attitude', topic: map.attitude.topic },
  ];
  if (map.odometry) routes.push({ role: 'odometry', topic: map.odometry.topic });
  if (map.truth) routes.push({ role: 'truthLander', topic: map.truth.lander }, { role: 'truthCarrier', topic: map.truth.carrier });
  if (map.resets) routes.push({ role: 'resets', topic: map.resets.topic });
  return routes;
}

const ROLE_WORDS: Record<IngestRole, string> = { camera: 'camera', boxes: 'boxes', imu: 'imu', attitude: 'attitude', odometry: 'odometry', truthLander: 'truth.lander', truthCarrier: 'truth.carrier', resets: 'resets' };

function acceptedTypes(role: IngestRole, map: RosMap): readonly string[] | null {
  switch (role) {
    case 'boxes':
      return map.boxes.corners ? null : ROLE_TYPES.boxes;
    case 'truthLander':
    case 'truthCarrier':
      return ROLE_TYPES.truth;
    case 'resets':
      return null;
    default:
      return ROLE_TYPES[role];
  }
}

/** Check that a mapped topic is recorded in a form its role can read. */
function checkRoute(name: string, route: Route, channel: RecordedChannel | undefined, recording: Recording, map: RosMap): asserts channel is RecordedChannel {
  const at = `${name}: topic ${route.topic} (${ROLE_WORDS[route.role]})`;
  if (channel === undefined) {
    const topics = [...recording.channels.values()].map((c) => `${c.topic} (${c.schemaName})`).sort();
    throw new RecordingError(`${at} is not in the recording; it has ${topics.length === 0 ? 'no topics' : `these topics: ${topics.join(', ')}`}`);
  }
  if (channel.messageEncoding !== 'cdr') throw new RecordingError(`${at}: messages are encoded as "${channel.messageEncoding}"; alight reads ROS 2 CDR ("cdr")`);
  if (channel.schemaEncoding !== 'ros2msg') throw new RecordingError(`${at}: its definition is "${channel.schemaEncoding || 'missing'}"; alight reads ROS 2 .msg definitions ("ros2msg")`);
  const type = shortTypeName(channel.schemaName);
  const accepted = acceptedTypes(route.role, map);
  if (accepted !== null && !accepted.includes(type)) {
    const hint = route.role === 'boxes' ? '; for a message of your own, give boxes.corners in the map' : '';
    throw new RecordingError(`${at}: message type ${channel.schemaName} cannot give ${ROLE_WORDS[route.role]} (accepted: ${accepted.join(', ')}${hint})`);
  }
}

/** A decoder from the definition the recording carries. */
function decoderFor(name: string, route: Route, channel: RecordedChannel): MessageReader {
  const at = `${name}: topic ${route.topic} (${ROLE_WORDS[route.role]})`;
  try {
    return new MessageReader(parse(new TextDecoder().decode(channel.schemaData), { ros2: true }));
  } catch (error) {
    throw new RecordingError(`${at}: its message definition ${channel.schemaName} cannot be parsed (${(error as Error).message})`);
  }
}

/** The first message of a topic, decoded (null when the topic has none). */
async function firstMessage(name: string, recording: Recording, topic: string, reader: MessageReader): Promise<{ msg: Decoded; data: Uint8Array } | null> {
  let data: Uint8Array | undefined;
  try {
    for await (const m of recording.messages([topic])) {
      data = m.data;
      break;
    }
  } catch (error) {
    throw new RecordingError(`${name}: the recording is damaged (${(error as Error).message})`);
  }
  if (data === undefined) return null;
  try {
    return { msg: reader.readMessage(data), data };
  } catch (error) {
    throw new RecordingError(`${name}: topic ${topic}: its first message cannot be decoded (${(error as Error).message})`);
  }
}

/**
 * A reused buffer that holds each message at byte offset 4 (mod 8): CDR aligns 8-byte values
 * relative to the end of its 4-byte encapsulation header, so there they are also aligned in
 * memory and the decoder hands out arrays (covariances) as views instead of copying them value
 * by value. Decoded arrays are therefore only valid until the next message.
 */
class AlignedBytes {
  private buffer = new ArrayBuffer(1 << 12);

  place(data: Uint8Array): Uint8Array {
    if (data.length + 4 > this.buffer.byteLength) this.buffer = new ArrayBuffer(2 * (data.length + 4));
    const view = new Uint8Array(this.buffer, 4, data.length);
    view.set(data);
    return view;
  }
}

/** Two CDR messages equal after the encapsulation header and header.stamp (4 + 8 bytes). */
function sameAfterStamp(a: Uint8Array, b: Uint8Array): boolean {
  if (a.length !== b.length) return false;
  for (let i = 12; i < a.length; i++) if (a[i] !== b[i]) return false;
  return true;
}

export interface IngestOptions {
  /** Name of the recording in messages (default: its path). */
  name?: string;
  /** Called now and then with bytes of the file read so far (approximate) and its size. */
  onProgress?: (messages: number) => void;
}

/**
 * Convert the recording at `path` into a flight log written to `sink`.
 * @throws RecordingError (unusable recording; nothing useful was written).
 */
export async function ingestRosRecording(path: string, map: RosMap, sink: LogTextSink, options: IngestOptions = {}): Promise<IngestReport> {
  const started = performance.now();
  const name = options.name ?? path;
  let recording: Recording;
  try {
    recording = await openRecording(path);
  } catch (error) {
    if (error instanceof RecordingOpenError) throw new RecordingError(`${name}: ${error.message}`);
    throw error;
  }
  try {
    return await convert(recording, name, map, sink, started, options);
  } finally {
    await recording.close();
  }
}

async function convert(recording: Recording, name: string, map: RosMap, sink: LogTextSink, started: number, options: IngestOptions): Promise<IngestReport> {
  const routes = routesOf(map);
  const topics = [...new Set(routes.map((r) => r.topic))];
  const warnings: string[] = [];
  if (!recording.indexed) {
    warnings.push('the recording has no usable index (it was not closed properly, e.g. the recorder was stopped hard): read front to back, in file order');
    // Channels appear as the file is read: scan until every mapped topic has shown up.
    for await (const _ of recording.messages(topics)) if (topics.every((t) => recording.channels.has(t))) break;
  }
  const decoders = new Map<string, MessageReader>();
  for (const route of routes) {
    const channel = recording.channels.get(route.topic);
    checkRoute(name, route, channel, recording, map); // a topic serving two roles is checked for both
    if (!decoders.has(route.topic)) decoders.set(route.topic, decoderFor(name, route, channel));
  }
  const types = new Map(topics.map((t) => [t, shortTypeName(recording.channels.get(t)!.schemaName)]));

  // The camera from its first message; the time origin from the first IMU stamp.
  const at = (role: IngestRole, topic: string) => `${name}: topic ${topic} (${ROLE_WORDS[role]})`;
  const first = await firstMessage(name, recording, map.camera.topic, decoders.get(map.camera.topic)!);
  if (first === null) throw new RecordingError(`${at('camera', map.camera.topic)} has no messages: the camera's intrinsics are needed`);
  const shift = map.camera.pixelCentres === 'integer' ? 0.5 : 0;
  let camera: RosCamera;
  try {
    camera = cameraFromInfo(first.msg, map.camera.image, shift);
  } catch (error) {
    if (error instanceof MessageContentError) throw new RecordingError(`${at('camera', map.camera.topic)}: ${error.message}`);
    throw error;
  }
  const firstImu = await firstMessage(name, recording, map.imu.topic, decoders.get(map.imu.topic)!);
  if (firstImu === null) throw new RecordingError(`${at('imu', map.imu.topic)} has no messages: the filter cannot run without the IMU`);
  const origin = map.timeOrigin ?? firstImu.msg.header.stamp.sec;

  const note = [map.note, `converted by alight ingest from ${name}; times are seconds after ${origin} s of the recording's clock (ROS time)`].filter(Boolean).join('; ');
  const cameraJson = {
    format: LOG_FORMAT,
    version: LOG_VERSION,
    note,
    width: camera.width,
    height: camera.height,
    intrinsics: { fx: camera.fx, fy: camera.fy, cx: camera.cx, cy: camera.cy },
    distortion: camera.distortion,
    mount: map.camera.mount,
    targetSize: map.targetSize,
    timeOffsets: map.timeOffsets,
  };
  sink.write('camera.json', JSON.stringify(cameraJson, null, 2) + '\n');
  if (map.filter) sink.write('filter.json', JSON.stringify(map.filter, null, 2) + '\n');
  const rows = new LayoutRows(sink, HEADERS);
  for (const file of ['boxes.csv', 'imu.csv', 'attitude.csv'] as const) rows.ensure(file);
  if (map.odometry) rows.ensure('odometry.csv');
  if (map.truth) rows.ensure('truth.csv');
  if (map.resets) rows.ensure('resets.csv');

  const streams: Partial<Record<IngestRole, IngestStream>> = {};
  for (const route of routes) streams[route.role] = { topic: route.topic, type: recording.channels.get(route.topic)!.schemaName, messages: 0, rows: 0, left: {} };
  const leave = (role: IngestRole, reason: string, n = 1) => {
    const s = streams[role]!;
    s.left[reason] = (s.left[reason] ?? 0) + n;
  };
  const lastTime: Record<string, number> = {};
  const unordered: Record<string, number> = {};
  const write = (role: IngestRole, file: keyof typeof HEADERS, t: number, line: string, orderTime = t) => {
    if (orderTime < (lastTime[file] ?? -Infinity)) unordered[file] = (unordered[file] ?? 0) + 1;
    lastTime[file] = orderTime;
    rows.add(file, line);
    streams[role]!.rows++;
  };

  const f = new Float64Array(3), q = new Float64Array(4), qScratch = new Float64Array(4), v = new Float64Array(3);
  const truth = map.truth
    ? new TruthPairing(map.truth.maxGap, (t, r, vC, vL) => write('truthLander', 'truth.csv', t, `${t},${r[0]},${r[1]},${r[2]},${vC[0]},${vC[1]},${vC[2]},${vL[0]},${vL[1]},${vL[2]}`))
    : null;
  const byTopic = new Map<string, Route[]>();
  for (const route of routes) byTopic.set(route.topic, [...(byTopic.get(route.topic) ?? []), route]);
  const boxCounts = emptyBoxCounts();
  let boxFrameChecked = false;
  let truthFrame: string | null = null;
  let cameraChanges = 0;
  let count = 0;
  const stampOf = (msg: Decoded, logTime: bigint, mode: 'header' | 'receive'): number | null =>
    mode === 'receive' ? logTimeSeconds(logTime, origin) : msg.header?.stamp ? stampSeconds(msg.header.stamp, origin) : null;

  const aligned = new AlignedBytes();
  const cameraOnlyTopic = byTopic.get(map.camera.topic)!.length === 1 ? map.camera.topic : null;
  const topicById = new Map<number, string>();
  for (const t of topics) topicById.set(recording.channels.get(t)!.id, t);

  try {
    const iterator = recording.messages(topics);
    let lastLogTime = 0n;
    for (;;) {
      let step: IteratorResult<RecordedMessage>;
      try {
        step = await iterator.next();
      } catch (error) {
        // The container library found damage (a checksum, a cut chunk): say where, keep nothing half-read.
        throw new RecordingError(`${name}: the recording is damaged after log time ${lastLogTime} ns (${(error as Error).message})`);
      }
      if (step.done) break;
      const message = step.value;
      lastLogTime = message.logTime;
      const topic = topicById.get(message.channelId)!;
      if (topic === cameraOnlyTopic && sameAfterStamp(message.data, first.data)) {
        streams.camera!.messages++; // the same camera again (every frame brings one): nothing to decode
        continue;
      }
      let msg: Decoded;
      try {
        msg = decoders.get(topic)!.readMessage(aligned.place(message.data));
      } catch (error) {
        for (const route of byTopic.get(topic)!) {
          streams[route.role]!.messages++;
          leave(route.role, 'undecodable');
        }
        if (warnings.filter((w) => w.includes('cannot be decoded')).length < 5) warnings.push(`topic ${topic}: a message at log time ${message.logTime} ns cannot be decoded (${(error as Error).message}): left out`);
        continue;
      }
      if (++count % 65536 === 0) options.onProgress?.(count);
      for (const route of byTopic.get(topic)!) {
        const role = route.role;
        streams[role]!.messages++;
        const type = types.get(topic)!;
        try {
          switch (role) {
            case 'camera': {
              const c = cameraFromInfo(msg, map.camera.image, shift);
              if (c.width !== camera.width || c.height !== camera.height || c.fx !== camera.fx || c.fy !== camera.fy || c.cx !== camera.cx || c.cy !== camera.cy) cameraChanges++;
              break;
            }
            case 'imu': {
              const t = stampSeconds(msg.header.stamp, origin);
              imuSpecificForce(msg, map.imu.body, f);
              write(role, 'imu.csv', t, `${t},${f[0]},${f[1]},${f[2]}`);
              break;
            }
            case 'attitude': {
              const t = stampSeconds(msg.header.stamp, origin);
              attitudeOf(type, msg, map.attitude, q);
              write(role, 'attitude.csv', t, `${t},${q[0]},${q[1]},${q[2]},${q[3]}`);
              break;
            }
            case 'odometry': {
              const t = stampSeconds(msg.header.stamp, origin);
              velocityOf(type, msg, map.odometry!, qScratch, v);
              write(role, 'odometry.csv', t, `${t},${v[0]},${v[1]},${v[2]}`);
              break;
            }
            case 'boxes': {
              const capture = stampOf(msg, message.logTime, map.boxes.stamp);
              if (capture === null) {
                leave(role, 'no-header');
                break;
              }
              const frameId: string = msg.header?.frame_id ?? '';
              if (!boxFrameChecked && frameId !== '' && camera.frameId !== '') {
                if (frameId !== camera.frameId) throw new RecordingError(`${at('boxes', topic)}: boxes in frame "${frameId}" but the camera info (topic ${map.camera.topic}) is for frame "${camera.frameId}": map the camera that saw the boxes`);
                boxFrameChecked = true;
              }
              const arrival = map.boxes.arrival === 'receive' ? logTimeSeconds(message.logTime, origin) : capture;
              const emit = (xMin: number, yMin: number, xMax: number, yMax: number, score: number) =>
                write(role, 'boxes.csv', capture, `${capture},${arrival},${xMin},${yMin},${xMax},${yMax},${score}`, arrival);
              if (map.boxes.corners) cornerBoxes(msg, map.boxes.corners, map.boxes.list, map.boxes.score, shift, emit, boxCounts);
              else detectionBoxes(type, msg, map.boxes.classId, shift, emit, boxCounts);
              break;
            }
            case 'truthLander':
            case 'truthCarrier': {
              const frameId: string = msg.header.frame_id;
              if (truthFrame === null) truthFrame = frameId;
              else if (frameId !== truthFrame) throw new RecordingError(`${at(role, topic)}: reference in frame "${frameId}" but the other reference topic is in "${truthFrame}": both must share one world frame`);
              const sample = new Float64Array(7);
              sample[0] = stampSeconds(msg.header.stamp, origin);
              odometryState(msg, qScratch, sample.subarray(1, 4), sample.subarray(4, 7));
              if (role === 'truthLander') truth!.lander(sample);
              else truth!.carrier(sample);
              break;
            }
            case 'resets': {
              const t = stampOf(msg, message.logTime, msg.header?.stamp ? 'header' : 'receive')!;
              write(role, 'resets.csv', t, String(t));
              break;
            }
          }
        } catch (error) {
          if (!(error instanceof MessageContentError)) throw error;
          leave(role, error.message.includes('no orientation') ? 'no-orientation' : 'unusable');
          if (warnings.filter((w) => w.startsWith(`topic ${topic}`)).length < 3) warnings.push(`topic ${topic}: ${error.message}`);
        }
      }
    }
  } catch (error) {
    rows.close(); // the sink's files are closed before the error goes up
    throw error;
  }
  if (truth) {
    truth.finish();
    if (truth.counts.unpaired > 0) leave('truthLander', 'no-carrier-sample-around', truth.counts.unpaired);
  }
  if (boxCounts.rotated > 0) leave('boxes', 'rotated-box', boxCounts.rotated);
  if (boxCounts.otherClass > 0) leave('boxes', 'other-class', boxCounts.otherClass);
  if (boxCounts.badField > 0) leave('boxes', 'corner-or-score-field-missing', boxCounts.badField);
  rows.close();

  for (const role of ['boxes', 'imu', 'attitude'] as const) {
    if (streams[role]!.messages === 0) throw new RecordingError(`${at(role, streams[role]!.topic)} has no messages: a flight log needs ${role}`);
  }
  if (cameraChanges > 0) warnings.push(`topic ${map.camera.topic}: ${cameraChanges} camera info messages differ from the first; the first is used`);
  for (const [file, n] of Object.entries(unordered)) warnings.push(`${file}: ${n} rows out of time order (stamps not in the order the recorder received them); replay skips and lists them`);
  if (recording.truncated) warnings.push(recording.truncated);
  const used = new Set(topics);
  return {
    recording: name,
    bytes: recording.bytes,
    indexed: recording.indexed,
    timeOrigin: origin,
    camera: { topic: map.camera.topic, frameId: camera.frameId, width: camera.width, height: camera.height, fx: camera.fx, fy: camera.fy, cx: camera.cx, cy: camera.cy },
    streams,
    files: Object.fromEntries(rows.rows),
    otherTopics: [...recording.channels.keys()].filter((t) => !used.has(t)).sort(),
    warnings,
    seconds: (performance.now() - started) / 1000,
  };
}
