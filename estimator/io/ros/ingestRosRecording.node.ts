// Node-only: a ROS 2 recording (.mcap, CDR messages) -> the flight-log layout (README.md,
// "Replaying a ROS 2 recording"), as the map file says (parseRosMap). One streaming pass:
// messages come a chunk at a time from the file handle, are decoded by the definitions the
// recording carries and become CSV rows buffered in 64 kB pieces (RosLayoutWriter), so memory
// does not grow with the recording. Problems that make the recording unusable stop it with a
// RecordingError naming the topic; single messages that cannot be used are counted and reported.
import type { MessageReader } from '@foxglove/rosmsg2-serialization';
import { folderSink } from '../log/folderSink.node.js';
import type { LogTextSink } from '../log/LogRecorder.js';
import { LOG_FORMAT, LOG_VERSION } from '../log/parseLogCamera.js';
import { convertInWorker, ingestWorkerPath, type PartResult } from './convertInWorker.node.js';
import { convertMessages } from './convertMessages.js';
import type { IngestReport } from './IngestReport.js';
import { openRecording, RecordingOpenError, type Recording } from './openRecording.node.js';
import type { RosMap } from './parseRosMap.js';
import { checkRoute, decoderFor, ROLE_WORDS, routesOf, type Route } from './recordingRoutes.js';
import { RecordingError } from './RecordingError.js';
import { RosLayoutWriter } from './RosLayoutWriter.js';
import { cameraFromInfo, MessageContentError, shortTypeName, type Decoded, type RosCamera } from './rosMessages.js';

export { RecordingError } from './RecordingError.js';
export type { IngestReport, IngestRole, IngestStream } from './IngestReport.js';

export interface IngestOptions {
  /** Name of the recording in messages (default: its path). */
  name?: string;
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

/** Open a recording; a file that is not one becomes a RecordingError. */
async function openNamed(path: string, name: string): Promise<Recording> {
  try {
    return await openRecording(path);
  } catch (error) {
    if (error instanceof RecordingOpenError) throw new RecordingError(`${name}: ${error.message}`);
    throw error;
  }
}

/**
 * Convert the recording at `path` into a flight log written to `sink`, in one pass.
 * @throws RecordingError (unusable recording; what was written is not a usable log).
 */
export async function ingestRosRecording(path: string, map: RosMap, sink: LogTextSink, options: IngestOptions = {}): Promise<IngestReport> {
  const started = performance.now();
  const name = options.name ?? path;
  const recording = await openNamed(path, name);
  try {
    return await onePass(recording, name, map, sink, await prepare(recording, name, map, sink), started);
  } finally {
    await recording.close();
  }
}

async function onePass(recording: Recording, name: string, map: RosMap, sink: LogTextSink, prepared: Prepared, started: number): Promise<IngestReport> {
  const layout = new RosLayoutWriter(sink, { name, map, routes: prepared.routes, types: prepared.types, camera: prepared.camera, origin: prepared.origin });
  await convertMessages({ name, recording, topics: prepared.topics, decoders: prepared.decoders, layout, firstCamera: prepared.firstCamera });
  const files = layout.finish();
  return report(recording, name, map, prepared, { streams: layout.streams, files, warnings: layout.warnings }, 1, started);
}

/**
 * Convert the recording at `path` into the log folder `folder`. With `threads` 2 (the default)
 * and an indexed recording, this thread reads the recording and a worker thread converts the
 * messages (convertInWorker): the same code in the same order, so the folder is byte for byte
 * what ingestRosRecording writes.
 */
export async function ingestRosRecordingToFolder(path: string, map: RosMap, folder: string, options: IngestOptions & { threads?: number } = {}): Promise<IngestReport> {
  const started = performance.now();
  const name = options.name ?? path;
  const recording = await openNamed(path, name);
  try {
    const sink = folderSink(folder);
    const prepared = await prepare(recording, name, map, sink);
    const worker = (options.threads ?? 2) >= 2 && recording.indexed ? ingestWorkerPath() : null;
    if (worker === null) return await onePass(recording, name, map, sink, prepared, started);
    sink.close(); // camera.json and filter.json are written; the worker opens the CSV files
    const channels = prepared.topics.map((t) => recording.channels.get(t)!);
    const job = { name, map, routes: prepared.routes, types: [...prepared.types], camera: prepared.camera, origin: prepared.origin, folder, firstCamera: prepared.firstCamera, channels };
    const result = await convertInWorker(worker, job, recording, prepared.topics);
    return report(recording, name, map, prepared, result, 2, started);
  } finally {
    await recording.close();
  }
}

interface Prepared {
  routes: Route[];
  topics: string[];
  types: Map<string, { short: string; recorded: string }>;
  decoders: Map<string, MessageReader>;
  camera: RosCamera;
  firstCamera: Uint8Array;
  origin: number;
  warnings: string[];
}

/** Check every mapped topic, read the camera and the time origin, write camera.json and filter.json. */
async function prepare(recording: Recording, name: string, map: RosMap, sink: LogTextSink): Promise<Prepared> {
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
  const types = new Map(topics.map((t) => [t, { short: shortTypeName(recording.channels.get(t)!.schemaName), recorded: recording.channels.get(t)!.schemaName }]));

  // The camera from its first message; the time origin from the first IMU stamp.
  const at = (role: 'camera' | 'imu', topic: string) => `${name}: topic ${topic} (${ROLE_WORDS[role]})`;
  const first = await firstMessage(name, recording, map.camera.topic, decoders.get(map.camera.topic)!);
  if (first === null) throw new RecordingError(`${at('camera', map.camera.topic)} has no messages: the camera's intrinsics are needed`);
  let camera: RosCamera;
  try {
    camera = cameraFromInfo(first.msg, map.camera.image, map.camera.pixelCentres === 'integer' ? 0.5 : 0);
  } catch (error) {
    if (error instanceof MessageContentError) throw new RecordingError(`${at('camera', map.camera.topic)}: ${error.message}`);
    throw error;
  }
  const firstImu = await firstMessage(name, recording, map.imu.topic, decoders.get(map.imu.topic)!);
  if (firstImu === null) throw new RecordingError(`${at('imu', map.imu.topic)} has no messages: the filter cannot run without the IMU`);
  const origin: number = map.timeOrigin ?? firstImu.msg.header.stamp.sec;

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
    ...(map.outline ? { outline: map.outline } : {}),
    timeOffsets: map.timeOffsets,
  };
  sink.write('camera.json', JSON.stringify(cameraJson, null, 2) + '\n');
  if (map.filter) sink.write('filter.json', JSON.stringify(map.filter, null, 2) + '\n');

  return { routes, topics, types, decoders, camera, firstCamera: first.data, origin, warnings };
}

function report(recording: Recording, name: string, map: RosMap, p: Prepared, part: PartResult, threads: number, started: number): IngestReport {
  if (recording.truncated) part.warnings.push(recording.truncated);
  const used = new Set(p.topics);
  const c = p.camera;
  return {
    recording: name,
    bytes: recording.bytes,
    indexed: recording.indexed,
    threads,
    timeOrigin: p.origin,
    camera: { topic: map.camera.topic, frameId: c.frameId, width: c.width, height: c.height, fx: c.fx, fy: c.fy, cx: c.cx, cy: c.cy },
    streams: part.streams,
    files: part.files,
    otherTopics: [...recording.channels.keys()].filter((t) => !used.has(t)).sort(),
    warnings: [...p.warnings, ...part.warnings],
    seconds: (performance.now() - started) / 1000,
  };
}
