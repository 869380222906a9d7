// Node-only worker_threads entry, bundled to dist/ingest-worker.mjs: the converting side of a
// two-thread `alight ingest` (convertInWorker.node.ts). It takes the job, then batches of
// messages, converts each batch with the one-thread code and hands the buffer back; at the end
// it answers with its counts, or with the error (its files closed first).
import { parentPort } from 'node:worker_threads';
import { folderSink } from '../log/folderSink.node.js';
import type { FromWorker, ToWorker, WorkerJob } from './convertInWorker.node.js';
import { MessageConverter } from './convertMessages.js';
import { forEachMessage } from './MessageBatch.js';
import { decoderFor } from './recordingRoutes.js';
import { RecordingError } from './RecordingError.js';
import { RosLayoutWriter } from './RosLayoutWriter.js';

if (!parentPort) throw new Error('ingestWorker.node.ts runs only as a worker thread');
const port = parentPort;
const answer = (reply: FromWorker, transfer: ArrayBuffer[] = []) => port.postMessage(reply, transfer);

let job: WorkerJob;
let layout: RosLayoutWriter;
let converter: MessageConverter;
let failed = false;

function fail(error: Error): void {
  failed = true;
  layout?.abort(); // the files are closed before the error goes up
  answer({ type: 'failed', message: error.message, recording: error instanceof RecordingError, stack: error.stack });
}

port.on('message', (message: ToWorker) => {
  if (message.type === 'batch') {
    if (!failed) {
      try {
        forEachMessage(message.buffer, message.used, (channelId, logTime, data) => converter.message(channelId, logTime, data));
      } catch (error) {
        fail(error as Error);
      }
    }
    answer({ type: 'free', buffer: message.buffer }, [message.buffer]);
    return;
  }
  if (failed) return;
  try {
    if (message.type === 'job') {
      job = message.job;
      const channels = new Map(job.channels.map((c) => [c.topic, c]));
      const topics = [...channels.keys()];
      const decoders = new Map(topics.map((t) => [t, decoderFor(job.name, job.routes.find((r) => r.topic === t)!, channels.get(t)!)]));
      layout = new RosLayoutWriter(folderSink(job.folder), { name: job.name, map: job.map, routes: job.routes, types: new Map(job.types), camera: job.camera, origin: job.origin });
      converter = new MessageConverter(channels, topics, decoders, layout, job.firstCamera);
    } else if (message.type === 'damaged') {
      fail(converter.damaged(job.name, message.reason));
    } else {
      const files = layout.finish();
      answer({ type: 'done', result: { streams: layout.streams, files, warnings: layout.warnings } });
    }
  } catch (error) {
    fail(error as Error);
  }
});
