// Test and bench helper: writes ROS 2 recordings (.mcap, CDR messages, ros2msg definitions)
// with the same libraries' writers a real tool chain would use: @mcap/core's McapWriter over a
// file handle, @foxglove/rosmsg2-serialization's MessageWriter. Standard definitions come from
// @foxglove/rosmsg-msgs-common (ROS 2 Humble); vision_msgs (not in that package) are written
// out below as the vision_msgs 4.x .msg files read [memory].
import { open, type FileHandle } from 'node:fs/promises';
import { McapWriter } from '@mcap/core';
import { FileHandleWritable } from '@mcap/nodejs';
import { parse, stringify } from '@foxglove/rosmsg';
import { ros2humble } from '@foxglove/rosmsg-msgs-common';
import { MessageWriter } from '@foxglove/rosmsg2-serialization';

const SEPARATOR = '\n================================================================================\n';

/** vision_msgs 4.x (ROS 2 Humble) definitions, dependencies after the root, as rosbag2 stores them. */
const VISION_MSGS: Record<string, string[]> = {
  'vision_msgs/Detection2DArray': ['std_msgs/Header header\nDetection2D[] detections', 'vision_msgs/Detection2D'],
  'vision_msgs/Detection2D': ['std_msgs/Header header\nObjectHypothesisWithPose[] results\nBoundingBox2D bbox\nstring id', 'vision_msgs/ObjectHypothesisWithPose', 'vision_msgs/BoundingBox2D'],
  'vision_msgs/ObjectHypothesisWithPose': ['ObjectHypothesis hypothesis\ngeometry_msgs/PoseWithCovariance pose', 'vision_msgs/ObjectHypothesis', 'geometry_msgs/PoseWithCovariance'],
  'vision_msgs/ObjectHypothesis': ['string class_id\nfloat64 score'],
  'vision_msgs/BoundingBox2D': ['vision_msgs/Pose2D center\nfloat64 size_x\nfloat64 size_y', 'vision_msgs/Pose2D'],
  'vision_msgs/Pose2D': ['vision_msgs/Point2D position\nfloat64 theta', 'vision_msgs/Point2D'],
  'vision_msgs/Point2D': ['float64 x\nfloat64 y'],
};

/** A parsed .msg definition (the type @foxglove/rosmsg works with). */
type MessageDefinition = Parameters<typeof stringify>[0][number];
const standard = ros2humble as Record<string, MessageDefinition>;

/** The .msg text of a type with all its dependencies (rosbag2's concatenated form). */
export function ros2SchemaText(type: string, extra: Record<string, string> = {}): string {
  const parts: string[] = [];
  const seen = new Set<string>();
  const visit = (name: string, root: boolean) => {
    if (seen.has(name)) return;
    seen.add(name);
    const own = extra[name] ?? VISION_MSGS[name]?.[0];
    if (own !== undefined) {
      parts.push(root ? own : `MSG: ${name}\n${own}`);
      for (const dep of VISION_MSGS[name]?.slice(1) ?? []) visit(dep, false);
      for (const line of own.split('\n')) {
        const field = line.trim().split(/\s+/)[0]!.replace(/\[\d*\]$/, '');
        if (field.includes('/') && !field.startsWith('vision_msgs/')) visit(field, false);
      }
      return;
    }
    const definition = standard[name];
    if (!definition) throw new Error(`no definition for ${name}`);
    const text = stringify([definition]).trim();
    parts.push(root ? text : `MSG: ${name}\n${text}`);
    for (const f of definition.definitions) if (f.isComplex) visit(f.type, false);
  };
  visit(type, true);
  return parts.join(SEPARATOR);
}

/** ns (bigint) of a time in seconds, rounded to the nearest nanosecond. */
export const nanoseconds = (t: number): bigint => BigInt(Math.round(t * 1e9));
/** A ROS 2 builtin_interfaces/Time. */
export const rosTime = (ns: bigint) => ({ sec: Number(ns / 1_000_000_000n), nanosec: Number(ns % 1_000_000_000n) });

export interface RecordingWriterOptions {
  /** Chunk compression (default none). */
  compression?: 'zstd' | 'none';
  /** Write the summary and index (default true; false = a recorder killed before closing). */
  index?: boolean;
  chunkSize?: number;
}

/** An MCAP file of ROS 2 messages, written in log-time order. */
export class RosRecordingWriter {
  private constructor(
    private readonly handle: FileHandle,
    private readonly writer: McapWriter,
    private readonly index: boolean,
  ) {}

  private readonly channels = new Map<string, { id: number; writer: MessageWriter }>();
  private sequence = 0;

  static async create(path: string, options: RecordingWriterOptions = {}): Promise<RosRecordingWriter> {
    const handle = await open(path, 'w');
    let compressChunk: ((data: Uint8Array) => { compression: string; compressedData: Uint8Array }) | undefined;
    if (options.compression === 'zstd') {
      const zstdModule = (await import('@foxglove/wasm-zstd')) as unknown as typeof import('@foxglove/wasm-zstd') & { default?: typeof import('@foxglove/wasm-zstd') };
      const zstd = zstdModule.default ?? zstdModule;
      await zstd.isLoaded;
      compressChunk = (data) => ({ compression: 'zstd', compressedData: zstd.compress(data, 1) });
    }
    const index = options.index !== false;
    const writer = new McapWriter({
      writable: new FileHandleWritable(handle),
      chunkSize: options.chunkSize ?? 1 << 20,
      compressChunk,
      useStatistics: index,
      useSummaryOffsets: index,
      useChunkIndex: index,
      useMessageIndex: index,
      useAttachmentIndex: index,
      useMetadataIndex: index,
      repeatChannels: index,
      repeatSchemas: index,
    });
    await writer.start({ profile: 'ros2', library: 'alight tests' });
    return new RosRecordingWriter(handle, writer, index);
  }

  /** Register `topic` with ROS 2 type `type` (e.g. "sensor_msgs/Imu"); `definitionText` overrides the standard one; `messageEncoding` the CDR. */
  async channel(topic: string, type: string, definitionText?: string, messageEncoding = 'cdr'): Promise<void> {
    const [pkg, name] = type.split('/');
    const text = definitionText ?? ros2SchemaText(type);
    const schemaId = await this.writer.registerSchema({ name: `${pkg}/msg/${name}`, encoding: 'ros2msg', data: new TextEncoder().encode(text) });
    const id = await this.writer.registerChannel({ topic, schemaId, messageEncoding, metadata: new Map() });
    this.channels.set(topic, { id, writer: new MessageWriter(parse(text, { ros2: true })) });
  }

  async add(topic: string, logTime: bigint, message: unknown): Promise<void> {
    const channel = this.channels.get(topic)!;
    await this.writer.addMessage({ channelId: channel.id, sequence: this.sequence++, logTime, publishTime: logTime, data: channel.writer.writeMessage(message) });
  }

  /** Raw bytes as a message (for damaged-message tests). */
  async addRaw(topic: string, logTime: bigint, data: Uint8Array): Promise<void> {
    await this.writer.addMessage({ channelId: this.channels.get(topic)!.id, sequence: this.sequence++, logTime, publishTime: logTime, data });
  }

  async close(): Promise<void> {
    if (this.index) await this.writer.end();
    await this.handle.close();
  }
}
