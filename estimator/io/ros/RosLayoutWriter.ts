// Decoded ROS messages -> rows of the flight-log layout, by the role each topic plays in the map.
// Keeps the per-stream counts of the report (messages, rows, left out and why), the rows out of
// time order, and the truth pairing; writes through LayoutRows (256 kB pieces to a LogTextSink).
// Browser-safe: no file access here.
import type { LogTextSink } from '../log/LogRecorder.js';
import type { IngestRole, IngestStream } from './IngestReport.js';
import { LayoutRows } from './LayoutRows.js';
import type { RosMap } from './parseRosMap.js';
import { ROLE_WORDS, type Route } from './recordingRoutes.js';
import { RecordingError } from './RecordingError.js';
import { cornerBoxes, detectionBoxes, emptyBoxCounts } from './rosBoxes.js';
import { attitudeOf, cameraFromInfo, imuSpecificForce, logTimeSeconds, MessageContentError, odometryState, stampSeconds, velocityOf, type Decoded, type RosCamera } from './rosMessages.js';
import { TruthPairing } from './TruthPairing.js';
import { LOG_FILE_HEADERS, type LogFile } from '../log/logFileHeaders.js';

const FILE_OF: Partial<Record<IngestRole, LogFile>> = { boxes: 'boxes.csv', imu: 'imu.csv', attitude: 'attitude.csv', odometry: 'odometry.csv', truthLander: 'truth.csv', resets: 'resets.csv' };

export interface RosLayoutContext {
  /** Recording name for messages. */
  name: string;
  map: RosMap;
  routes: readonly Route[];
  /** Short type name ("sensor_msgs/Imu") and message type as recorded, per topic. */
  types: ReadonlyMap<string, { short: string; recorded: string }>;
  /** The camera from the first camera info. */
  camera: RosCamera;
  /** Whole seconds subtracted from every stamp. */
  origin: number;
}

export class RosLayoutWriter {
  readonly streams: Partial<Record<IngestRole, IngestStream>> = {};
  readonly warnings: string[] = [];
  private readonly rows: LayoutRows;
  private readonly context: RosLayoutContext;
  private readonly byTopic = new Map<string, Route[]>();
  private readonly shift: number;
  private readonly lastTime: Partial<Record<LogFile, number>> = {};
  private readonly unordered: Partial<Record<LogFile, number>> = {};
  private readonly truth: TruthPairing | null;
  private readonly boxCounts = emptyBoxCounts();
  private boxFrameChecked = false;
  private truthFrame: string | null = null;
  private cameraChanges = 0;
  /** World frame ids of the first attitude (when its type names one) and odometry messages. */
  private attitudeWorld: string | null = null;
  private odometryWorld: string | null = null;
  // Scratch vectors, reused for every message.
  private readonly f = new Float64Array(3);
  private readonly q = new Float64Array(4);
  private readonly qScratch = new Float64Array(4);
  private readonly v = new Float64Array(3);
  /** A reference sample [t, p, v] and views of its position and velocity. */
  private readonly sample = new Float64Array(7);
  private readonly samplePosition = this.sample.subarray(1, 4);
  private readonly sampleVelocity = this.sample.subarray(4, 7);

  constructor(sink: LogTextSink, context: RosLayoutContext) {
    this.context = context;
    const map = context.map;
    this.shift = map.camera.pixelCentres === 'integer' ? 0.5 : 0;
    this.rows = new LayoutRows(sink, LOG_FILE_HEADERS);
    for (const route of context.routes) {
      const file = FILE_OF[route.role];
      if (file) this.rows.ensure(file); // every mapped stream gets its file, rows or not
      this.byTopic.set(route.topic, [...(this.byTopic.get(route.topic) ?? []), route]);
      this.streams[route.role] = { topic: route.topic, type: context.types.get(route.topic)!.recorded, messages: 0, rows: 0, left: {} };
    }
    this.truth = map.truth
      ? new TruthPairing(map.truth.maxGap, (t, r, vC, vL) => this.row('truthLander', 'truth.csv', t).next(r[0]!).next(r[1]!).next(r[2]!).next(vC[0]!).next(vC[1]!).next(vC[2]!).next(vL[0]!).next(vL[1]!).next(vL[2]!).end())
      : null;
  }

  /** True when `topic` serves only as the camera (its repeats need no decoding). */
  cameraOnly(topic: string): boolean {
    return topic === this.context.map.camera.topic && this.byTopic.get(topic)!.length === 1;
  }

  /** A camera info equal to the first: counted only. */
  sameCamera(): void {
    this.streams.camera!.messages++;
  }

  /** A message the decoder refused: counted for each role of its topic. */
  undecodable(topic: string, logTime: bigint, error: Error): void {
    for (const route of this.byTopic.get(topic)!) {
      this.streams[route.role]!.messages++;
      this.leave(route.role, 'undecodable');
    }
    if (this.warnings.filter((w) => w.includes('cannot be decoded')).length < 5) this.warnings.push(`topic ${topic}: a message at log time ${logTime} ns cannot be decoded (${error.message}): left out`);
  }

  /** One decoded message: a row (or several, or none) for each role of its topic. */
  message(topic: string, msg: Decoded, logTime: bigint): void {
    for (const route of this.byTopic.get(topic)!) {
      this.streams[route.role]!.messages++;
      try {
        this.apply(route.role, topic, this.context.types.get(topic)!.short, msg, logTime);
      } catch (error) {
        if (!(error instanceof MessageContentError)) throw error;
        this.leave(route.role, error.message.includes('no orientation') ? 'no-orientation' : 'unusable');
        if (this.warnings.filter((w) => w.startsWith(`topic ${topic}`)).length < 3) this.warnings.push(`topic ${topic}: ${error.message}`);
      }
    }
  }

  private apply(role: IngestRole, topic: string, type: string, msg: Decoded, logTime: bigint): void {
    const { map, origin, camera } = this.context;
    switch (role) {
      case 'camera': {
        const c = cameraFromInfo(msg, map.camera.image, this.shift);
        if (c.width !== camera.width || c.height !== camera.height || c.fx !== camera.fx || c.fy !== camera.fy || c.cx !== camera.cx || c.cy !== camera.cy) this.cameraChanges++;
        return;
      }
      case 'imu': {
        const t = stampSeconds(msg.header.stamp, origin), f = imuSpecificForce(msg, map.imu.body, this.f);
        return this.row(role, 'imu.csv', t).next(f[0]!).next(f[1]!).next(f[2]!).end();
      }
      case 'attitude': {
        if (this.attitudeWorld === null && type !== 'sensor_msgs/Imu') this.attitudeWorld = msg.header.frame_id;
        const t = stampSeconds(msg.header.stamp, origin), q = attitudeOf(type, msg, map.attitude, this.q);
        return this.row(role, 'attitude.csv', t).next(q[0]!).next(q[1]!).next(q[2]!).next(q[3]!).end();
      }
      case 'odometry': {
        if (this.odometryWorld === null) this.odometryWorld = msg.header.frame_id;
        const t = stampSeconds(msg.header.stamp, origin), v = velocityOf(type, msg, map.odometry!, this.qScratch, this.v);
        return this.row(role, 'odometry.csv', t).next(v[0]!).next(v[1]!).next(v[2]!).end();
      }
      case 'boxes':
        return this.boxes(topic, type, msg, logTime);
      case 'truthLander':
      case 'truthCarrier': {
        const frameId: string = msg.header.frame_id;
        if (this.truthFrame === null) this.truthFrame = frameId;
        else if (frameId !== this.truthFrame) throw new RecordingError(`${this.at(role, topic)}: reference in frame "${frameId}" but the other reference topic is in "${this.truthFrame}": both must share one world frame`);
        const sample = this.sample; // the pairing copies it
        sample[0] = stampSeconds(msg.header.stamp, origin);
        odometryState(msg, this.qScratch, this.samplePosition, this.sampleVelocity);
        if (role === 'truthLander') this.truth!.lander(sample);
        else this.truth!.carrier(sample);
        return;
      }
      case 'resets': {
        const t = msg.header?.stamp ? stampSeconds(msg.header.stamp, origin) : logTimeSeconds(logTime, origin);
        return this.row(role, 'resets.csv', t).end();
      }
    }
  }

  private boxes(topic: string, type: string, msg: Decoded, logTime: bigint): void {
    const { map, origin, camera } = this.context;
    const capture = map.boxes.stamp === 'receive' ? logTimeSeconds(logTime, origin) : msg.header?.stamp ? stampSeconds(msg.header.stamp, origin) : null;
    if (capture === null) return this.leave('boxes', 'no-header');
    const frameId: string = msg.header?.frame_id ?? '';
    if (!this.boxFrameChecked && frameId !== '' && camera.frameId !== '') {
      if (frameId !== camera.frameId) throw new RecordingError(`${this.at('boxes', topic)}: boxes in frame "${frameId}" but the camera info (topic ${map.camera.topic}) is for frame "${camera.frameId}": map the camera that saw the boxes`);
      this.boxFrameChecked = true;
    }
    const arrival = map.boxes.arrival === 'receive' ? logTimeSeconds(logTime, origin) : capture;
    const emit = (xMin: number, yMin: number, xMax: number, yMax: number, score: number) =>
      this.row('boxes', 'boxes.csv', capture, arrival).next(arrival).next(xMin).next(yMin).next(xMax).next(yMax).next(score).end();
    if (map.boxes.corners) cornerBoxes(msg, map.boxes.corners, map.boxes.list, map.boxes.score, this.shift, emit, this.boxCounts);
    else detectionBoxes(type, msg, map.boxes.classId, this.shift, emit, this.boxCounts);
  }

  private at(role: IngestRole, topic: string): string {
    return `${this.context.name}: topic ${topic} (${ROLE_WORDS[role]})`;
  }

  private leave(role: IngestRole, reason: string, n = 1): void {
    const s = this.streams[role]!;
    s.left[reason] = (s.left[reason] ?? 0) + n;
  }

  /** Start a row of `file` at time `t` (its first column); the caller adds the other values and ends it. */
  private row(role: IngestRole, file: LogFile, t: number, orderTime = t): LayoutRows {
    if (orderTime < (this.lastTime[file] ?? -Infinity)) this.unordered[file] = (this.unordered[file] ?? 0) + 1;
    this.lastTime[file] = orderTime;
    this.streams[role]!.rows++;
    return this.rows.start(file, t);
  }

  /** Close the files after a failure (nothing more is counted). */
  abort(): void {
    this.rows.close();
  }

  /** The recording ended: pair what can be, count what was left, close the files. Returns rows per file. */
  finish(): Record<string, number> {
    if (this.truth) {
      this.truth.finish();
      if (this.truth.counts.unpaired > 0) this.leave('truthLander', 'no-carrier-sample-around', this.truth.counts.unpaired);
    }
    const b = this.boxCounts;
    if (b.rotated > 0) this.leave('boxes', 'rotated-box', b.rotated);
    if (b.otherClass > 0) this.leave('boxes', 'other-class', b.otherClass);
    if (b.badField > 0) this.leave('boxes', 'corner-or-score-field-missing', b.badField);
    this.rows.close();
    for (const role of ['boxes', 'imu', 'attitude'] as const) {
      if (this.streams[role]?.messages === 0) throw new RecordingError(`${this.at(role, this.streams[role]!.topic)} has no messages: a flight log needs ${role}`);
    }
    if (this.cameraChanges > 0) this.warnings.push(`topic ${this.context.map.camera.topic}: ${this.cameraChanges} camera info messages differ from the first; the first is used`);
    const [aw, ow] = [this.attitudeWorld, this.odometryWorld];
    if (aw && ow && aw !== ow) this.warnings.push(`attitude in frame "${aw}" but odometry in "${ow}": REP 105 lets such frames drift apart, alight takes them as one world frame`);
    for (const [file, n] of Object.entries(this.unordered)) this.warnings.push(`${file}: ${n} rows out of time order (stamps not in the order the recorder received them); replay skips and lists them`);
    return Object.fromEntries(this.rows.rows);
  }
}
