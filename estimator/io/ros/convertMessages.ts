// The message loop of a conversion: every message of `topics`, in the recording's order, decoded
// (by a FixedLayoutReader where the type allows, else by the library's reader from aligned
// bytes) and handed to a RosLayoutWriter. One MessageConverter serves both ways messages come:
// straight from the recording (convertMessages, one thread) and in batches from the thread that
// reads the recording (the worker of a two-thread conversion), so each file comes from this code.
import type { MessageReader } from '@foxglove/rosmsg2-serialization';
import { parse } from '@foxglove/rosmsg';
import { AlignedBytes, sameAfterStamp } from './AlignedBytes.js';
import { FixedLayoutReader } from './FixedLayoutReader.js';
import type { RecordedChannel, RecordedMessage, Recording } from './openRecording.node.js';
import { RecordingError } from './RecordingError.js';
import type { RosLayoutWriter } from './RosLayoutWriter.js';
import type { Decoded } from './rosMessages.js';

export interface MessageLoop {
  /** Recording name for messages. */
  name: string;
  recording: Recording;
  topics: readonly string[];
  decoders: ReadonlyMap<string, MessageReader>;
  layout: RosLayoutWriter;
  /** Bytes of the first camera info: repeats of it need no decoding. */
  firstCamera: Uint8Array;
}

/** Decodes one message at a time and hands it to the layout. Hot path: fixed-layout types allocate nothing here. */
export class MessageConverter {
  private readonly topicById: Map<number, string>;
  private readonly fast: Map<string, FixedLayoutReader | null>;
  private readonly aligned = new AlignedBytes();
  private readonly decoders: ReadonlyMap<string, MessageReader>;
  private readonly layout: RosLayoutWriter;
  private readonly firstCamera: Uint8Array;
  /** Log time of the last message handed in (for the message about a damaged recording). */
  lastLogTime = 0n;

  constructor(channels: ReadonlyMap<string, RecordedChannel>, topics: readonly string[], decoders: ReadonlyMap<string, MessageReader>, layout: RosLayoutWriter, firstCamera: Uint8Array) {
    this.topicById = new Map(topics.map((t) => [channels.get(t)!.id, t]));
    this.fast = new Map(topics.map((t) => [t, fixedLayoutReaderFor(channels.get(t)!.schemaData)]));
    this.decoders = decoders;
    this.layout = layout;
    this.firstCamera = firstCamera;
  }

  message(channelId: number, logTime: bigint, data: Uint8Array): void {
    this.lastLogTime = logTime;
    const topic = this.topicById.get(channelId)!;
    const layout = this.layout;
    // Every frame brings a camera info, nearly always the same: compare bytes, decode none.
    if (layout.cameraOnly(topic) && sameAfterStamp(data, this.firstCamera)) {
      layout.sameCamera();
      return;
    }
    let msg: Decoded = this.fast.get(topic)?.read(data) ?? null;
    if (msg === null) {
      try {
        msg = this.decoders.get(topic)!.readMessage(this.aligned.place(data));
      } catch (error) {
        layout.undecodable(topic, logTime, error as Error);
        return;
      }
    }
    layout.message(topic, msg, logTime);
  }

  /** The error for damage the container library found (a checksum, a cut chunk), saying where. */
  damaged(name: string, reason: string): RecordingError {
    return new RecordingError(`${name}: the recording is damaged after log time ${this.lastLogTime} ns (${reason})`);
  }
}

/** Run the loop on one thread; on any error the layout's files are closed and the error goes up. */
export async function convertMessages({ name, recording, topics, decoders, layout, firstCamera }: MessageLoop): Promise<void> {
  const converter = new MessageConverter(recording.channels, topics, decoders, layout, firstCamera);
  try {
    const iterator = recording.messages(topics);
    for (;;) {
      let step: IteratorResult<RecordedMessage>;
      try {
        step = await iterator.next();
      } catch (error) {
        throw converter.damaged(name, (error as Error).message);
      }
      if (step.done) break;
      const message = step.value;
      converter.message(message.channelId, message.logTime, message.data);
    }
  } catch (error) {
    layout.abort(); // the sink's files are closed before the error goes up
    throw error;
  }
}

/** The fixed-layout reader of a topic's type, or null (the library's reader decodes it). */
function fixedLayoutReaderFor(schemaData: Uint8Array): FixedLayoutReader | null {
  try {
    return FixedLayoutReader.of(parse(new TextDecoder().decode(schemaData), { ros2: true }));
  } catch {
    return null; // decoderFor reported an unreadable definition before the loop started
  }
}
