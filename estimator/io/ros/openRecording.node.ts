// Node-only: an MCAP recording opened for streaming. Indexed files (the normal case: the
// recorder closed the file and wrote its summary) are read through a seekable readable over a
// file handle, a chunk at a time, messages in log-time order. A file without a usable summary
// (a recorder that was killed) is read front to back with the stream reader instead, messages
// in file order, and the report says so; a file cut inside a record keeps everything before
// the cut. Compressed chunks (zstd, lz4) are decompressed by WebAssembly builds loaded on demand.
import { open, stat, type FileHandle } from 'node:fs/promises';
import { createReadStream } from 'node:fs';
import { McapIndexedReader, McapStreamReader, type McapTypes } from '@mcap/core';
import { FileHandleReadable } from '@mcap/nodejs';

export interface RecordedChannel {
  id: number;
  topic: string;
  messageEncoding: string;
  /** Schema name, e.g. "sensor_msgs/msg/Imu" ('' without a schema). */
  schemaName: string;
  schemaEncoding: string;
  schemaData: Uint8Array;
}

export interface RecordedMessage {
  channelId: number;
  /** Receive time of the recorder, ns since its epoch. */
  logTime: bigint;
  data: Uint8Array;
}

export interface Recording {
  bytes: number;
  /** True when read through the file's index (log-time order). */
  indexed: boolean;
  /** Why the index could not be used (when not indexed). */
  unindexedReason?: string;
  /** Channels by topic (every channel of the file; for an unindexed file, those before the first stop of the scan). */
  channels: Map<string, RecordedChannel>;
  /** Messages per topic from the file's statistics (indexed files that carry them; else empty). */
  messageCounts: Map<string, number>;
  /** Messages of the given topics, in log-time order (indexed) or file order. */
  messages(topics: readonly string[]): AsyncGenerator<RecordedMessage>;
  /** Set after messages() finished on a file cut short: what was lost. */
  truncated: string | null;
  close(): Promise<void>;
}

/** A recording that cannot be read at all (not MCAP, unreadable). */
export class RecordingOpenError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'RecordingOpenError';
  }
}

let handlers: McapTypes.DecompressHandlers | undefined;

/** zstd and lz4 decompressors (WebAssembly), loaded once on first use. */
async function decompressHandlers(): Promise<McapTypes.DecompressHandlers> {
  if (handlers) return handlers;
  const zstdModule = (await import('@foxglove/wasm-zstd')) as unknown as { default?: typeof import('@foxglove/wasm-zstd') } & typeof import('@foxglove/wasm-zstd');
  const zstd = zstdModule.default ?? zstdModule;
  const lz4Module = (await import('@foxglove/wasm-lz4')) as unknown as { default: typeof import('@foxglove/wasm-lz4').default };
  const lz4 = (lz4Module.default as unknown as { default?: typeof import('@foxglove/wasm-lz4').default }).default ?? lz4Module.default;
  await zstd.isLoaded;
  await lz4.isLoaded;
  handlers = {
    zstd: (buffer, size) => zstd.decompress(buffer, Number(size)),
    lz4: (buffer, size) => lz4(buffer, Number(size)),
  };
  return handlers;
}

function channelOf(channel: McapTypes.Channel, schema: McapTypes.Schema | undefined): RecordedChannel {
  return {
    id: channel.id,
    topic: channel.topic,
    messageEncoding: channel.messageEncoding,
    schemaName: schema?.name ?? '',
    schemaEncoding: schema?.encoding ?? '',
    schemaData: schema?.data ?? new Uint8Array(0),
  };
}

const MAGIC = [0x89, 0x4d, 0x43, 0x41, 0x50]; // "\x89MCAP"

/** Open `path`. Throws RecordingOpenError for a file that is not MCAP or cannot be read. */
export async function openRecording(path: string): Promise<Recording> {
  let handle: FileHandle;
  try {
    handle = await open(path, 'r');
  } catch (error) {
    throw new RecordingOpenError(`cannot read the recording (${(error as { code?: string }).code ?? (error as Error).message})`);
  }
  const bytes = (await stat(path)).size;
  const head = new Uint8Array(8);
  await handle.read(head, 0, 8, 0);
  if (bytes < 8 || MAGIC.some((b, i) => head[i] !== b)) {
    await handle.close();
    throw new RecordingOpenError('not an MCAP file (it does not start with the MCAP magic bytes); ROS 2 records MCAP with `ros2 bag record -s mcap`, the default since Iron');
  }
  const decompress = await decompressHandlers();
  try {
    const reader = await McapIndexedReader.Initialize({ readable: new FileHandleReadable(handle), decompressHandlers: decompress });
    const channels = new Map<string, RecordedChannel>();
    const messageCounts = new Map<string, number>();
    for (const channel of reader.channelsById.values()) {
      channels.set(channel.topic, channelOf(channel, reader.schemasById.get(channel.schemaId)));
      const count = reader.statistics?.channelMessageCounts.get(channel.id);
      if (count !== undefined) messageCounts.set(channel.topic, Number(count));
    }
    return {
      bytes,
      indexed: true,
      channels,
      messageCounts,
      truncated: null,
      messages: (topics) => reader.readMessages({ topics, validateCrcs: true }),
      close: () => handle.close(),
    };
  } catch (error) {
    await handle.close();
    return streamedRecording(path, bytes, (error as Error).message);
  }
}

/** Front-to-back reading of a file whose index cannot be used. */
async function streamedRecording(path: string, bytes: number, reason: string): Promise<Recording> {
  const decompress = await decompressHandlers();
  const recording: Recording = {
    bytes,
    indexed: false,
    unindexedReason: reason,
    channels: new Map(),
    messageCounts: new Map(),
    truncated: null,
    async *messages(topics) {
      const wanted = new Set(topics);
      const schemas = new Map<number, McapTypes.Schema>();
      const ids = new Set<number>();
      const reader = new McapStreamReader({ decompressHandlers: decompress, validateCrcs: true });
      let read = 0;
      let broken: string | null = null;
      for await (const chunk of createReadStream(path, { highWaterMark: 1 << 20 })) {
        reader.append(chunk as Buffer);
        read += (chunk as Buffer).length;
        for (;;) {
          let record: McapTypes.TypedMcapRecord | undefined;
          try {
            record = reader.nextRecord();
          } catch (error) {
            broken = (error as Error).message;
          }
          if (record === undefined) break;
          if (record.type === 'Schema') schemas.set(record.id, record);
          else if (record.type === 'Channel') {
            if (!recording.channels.has(record.topic)) recording.channels.set(record.topic, channelOf(record, schemas.get(record.schemaId)));
            if (wanted.has(record.topic)) ids.add(record.id);
          } else if (record.type === 'Message' && ids.has(record.channelId)) yield record;
        }
        if (broken !== null) break;
      }
      if (broken !== null) recording.truncated = `a damaged record stops the reading after ${read} of ${bytes} bytes (${broken}): what follows could not be read`;
      else if (!reader.done()) {
        const rest = reader.bytesRemaining();
        recording.truncated = rest > 0
          ? `the file ends inside a record: its last ${rest} of ${read} bytes could not be read`
          : 'the file ends without its closing records (the recorder did not finish it): everything in it was read, but a recorder usually loses its last unwritten chunk';
      }
    },
    close: async () => undefined,
  };
  return recording;
}
