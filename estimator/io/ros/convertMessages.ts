// The message loop of a conversion: every message of `topics`, in the recording's order, decoded
// (by a FixedLayoutReader where the type allows, else by the library's reader from aligned
// bytes) and handed to a RosLayoutWriter. Shared by the main thread and the
// worker thread of a two-thread conversion, so each output file comes from this same code.
import type { MessageReader } from '@foxglove/rosmsg2-serialization';
import { parse } from '@foxglove/rosmsg';
import { AlignedBytes, sameAfterStamp } from './AlignedBytes.js';
import { FixedLayoutReader } from './FixedLayoutReader.js';
import type { RecordedMessage, Recording } from './openRecording.node.js';
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

/** Run the loop; on any error the layout's files are closed and the error goes up. */
export async function convertMessages({ name, recording, topics, decoders, layout, firstCamera }: MessageLoop): Promise<void> {
  const topicById = new Map(topics.map((t) => [recording.channels.get(t)!.id, t]));
  const aligned = new AlignedBytes();
  const fast = new Map(topics.map((t) => [t, fixedLayoutReaderFor(recording.channels.get(t)!.schemaData)]));
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
      if (layout.cameraOnly(topic) && sameAfterStamp(message.data, firstCamera)) {
        layout.sameCamera();
        continue;
      }
      let msg: Decoded = fast.get(topic)?.read(message.data) ?? null;
      if (msg === null) {
        try {
          msg = decoders.get(topic)!.readMessage(aligned.place(message.data));
        } catch (error) {
          layout.undecodable(topic, message.logTime, error as Error);
          continue;
        }
      }
      layout.message(topic, msg, message.logTime);
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
