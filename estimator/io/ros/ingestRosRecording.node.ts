// Node-only: a ROS 2 recording (.mcap, CDR messages) -> the flight-log layout (README.md,
// "Replaying a ROS 2 recording"), as the map file says (parseRosMap). One streaming pass:
// messages come a chunk at a time from the file handle, are decoded by the definitions the
// recording carries and become CSV rows buffered in 64 kB pieces (RosLayoutWriter), so memory
// does not grow with the recording. Problems that make the recording unusable stop it with a
// RecordingError naming the topic; single messages that cannot be used are counted and reported.
import type { MessageReader } from '@foxglove/rosmsg2-serialization';
import type { LogTextSink } from '../log/LogRecorder.js';
import { LOG_FORMAT, LOG_VERSION } from '../log/parseLogCamera.js';
import { AlignedBytes, sameAfterStamp } from './AlignedBytes.js';
import type { IngestReport } from './IngestReport.js';
import { openRecording, RecordingOpenError, type RecordedMessage, type Recording } from './openRecording.node.js';
import type { RosMap } from './parseRosMap.js';
import { checkRoute, decoderFor, ROLE_WORDS, routesOf } from './recordingRoutes.js';
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

/**
 * Convert the recording at `path` into a flight log written to `sink`.
 * @throws RecordingError (unusable recording; what was written is not a usable log).
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
    return { ...(await convert(recording, name, map, sink)), seconds: (performance.now() - started) / 1000 };
  } finally {
    await recording.close();
  }
}

async function convert(recording: Recording, name: string, map: RosMap, sink: LogTextSink): Promise<Omit<IngestReport, 'seconds'>> {
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
    timeOffsets: map.timeOffsets,
  };
  sink.write('camera.json', JSON.stringify(cameraJson, null, 2) + '\n');
  if (map.filter) sink.write('filter.json', JSON.stringify(map.filter, null, 2) + '\n');

  const layout = new RosLayoutWriter(sink, { name, map, routes, types, camera, origin });
  const topicById = new Map(topics.map((t) => [recording.channels.get(t)!.id, t]));
  const aligned = new AlignedBytes();
  try {
    const iterator = recording.messages(topics);
    let lastLogTime = 0n;
    for (;;) {
      let step: IteratorResult<RecordedMessage>;
      try {
        step = await iterator.next();
      } catch (error) {
        // The container library found damage (a checksum, a cut chunk): say where.
        throw new RecordingError(`${name}: the recording is damaged after log time ${lastLogTime} ns (${(error as Error).message})`);
      }
      if (step.done) break;
      const message = step.value;
      lastLogTime = message.logTime;
      const topic = topicById.get(message.channelId)!;
      // Every frame brings a camera info, nearly always the same: compare bytes, decode none.
      if (layout.cameraOnly(topic) && sameAfterStamp(message.data, first.data)) {
        layout.sameCamera();
        continue;
      }
      let msg: Decoded;
      try {
        msg = decoders.get(topic)!.readMessage(aligned.place(message.data));
      } catch (error) {
        layout.undecodable(topic, message.logTime, error as Error);
        continue;
      }
      layout.message(topic, msg, message.logTime);
    }
  } catch (error) {
    layout.abort(); // the sink's files are closed before the error goes up
    throw error;
  }
  const files = layout.finish();
  if (recording.truncated) layout.warnings.push(recording.truncated);
  const used = new Set(topics);
  return {
    recording: name,
    bytes: recording.bytes,
    indexed: recording.indexed,
    timeOrigin: origin,
    camera: { topic: map.camera.topic, frameId: camera.frameId, width: camera.width, height: camera.height, fx: camera.fx, fy: camera.fy, cx: camera.cx, cy: camera.cy },
    streams: layout.streams,
    files,
    otherTopics: [...recording.channels.keys()].filter((t) => !used.has(t)).sort(),
    warnings: [...warnings, ...layout.warnings],
  };
}
