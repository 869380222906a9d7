// Node-only: a conversion on two threads as a pipeline. This thread reads the recording through
// the container library (chunks, checksums, log-time order: about half the work) and moves the
// mapped topics' messages, packed in 4 MB batches (MessageBatch), to a worker thread that decodes
// and converts them all with the one-thread code (MessageConverter, RosLayoutWriter) and writes
// the files: the folder is the one a single pass writes, byte for byte. The batch buffers go
// back and forth (transferred, not copied), at most MAX_IN_FLIGHT at a time, so memory stays
// bounded when the worker is the slower side. This replaced a split of the topics in two parts,
// which made both threads read and check every chunk of the file.
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';
import type { IngestRole, IngestStream } from './IngestReport.js';
import { BATCH_BYTES, MessageBatch } from './MessageBatch.js';
import type { RecordedChannel, RecordedMessage, Recording } from './openRecording.node.js';
import type { RosMap } from './parseRosMap.js';
import type { Route } from './recordingRoutes.js';
import { RecordingError } from './RecordingError.js';
import type { RosCamera } from './rosMessages.js';

/** Everything the worker needs besides the messages; plain data, so it crosses as it is. */
export interface WorkerJob {
  name: string;
  map: RosMap;
  routes: Route[];
  types: [string, { short: string; recorded: string }][];
  camera: RosCamera;
  origin: number;
  folder: string;
  firstCamera: Uint8Array;
  /** The mapped topics' channels. */
  channels: RecordedChannel[];
}

export interface PartResult {
  streams: Partial<Record<IngestRole, IngestStream>>;
  files: Record<string, number>;
  warnings: string[];
}

/** What this thread sends: the job, batches, then the end or the damage that stopped the reading. */
export type ToWorker = { type: 'job'; job: WorkerJob } | { type: 'batch'; buffer: ArrayBuffer; used: number } | { type: 'end' } | { type: 'damaged'; reason: string };
/** What the worker answers: batch buffers back, then its result or its error. */
export type FromWorker = { type: 'free'; buffer: ArrayBuffer } | { type: 'done'; result: PartResult } | { type: 'failed'; message: string; recording: boolean; stack?: string };

/** Batches sent and not yet handed back: 16 MB in flight keeps both threads busy. */
const MAX_IN_FLIGHT = 4;
/** Old-generation heap limit of the worker thread (MB); a whole conversion runs in 48 MB. */
const WORKER_HEAP_MB = 128;

/** The bundled worker beside the CLI bundle (dist/), or dist/ of the repository when run from source; null when not built. */
export function ingestWorkerPath(): string | null {
  for (const url of [new URL('./ingest-worker.mjs', import.meta.url), new URL('../../../dist/ingest-worker.mjs', import.meta.url)]) {
    const path = fileURLToPath(url);
    if (existsSync(path)) return path;
  }
  return null;
}

/** Read `topics` of `recording` here and convert them in a worker; the worker's files are closed before an error goes up. */
export async function convertInWorker(workerPath: string, job: WorkerJob, recording: Recording, topics: readonly string[]): Promise<PartResult> {
  // A modest heap limit makes the worker collect sooner instead of growing towards V8's default.
  const worker = new Worker(workerPath, { resourceLimits: { maxOldGenerationSizeMb: WORKER_HEAP_MB } });
  const free: ArrayBuffer[] = [];
  let inFlight = 0;
  let stopped = false;
  let wake: (() => void) | null = null;
  const wakeUp = () => {
    const w = wake;
    wake = null;
    w?.();
  };
  const done = new Promise<PartResult>((resolve, reject) => {
    worker.on('message', (reply: FromWorker) => {
      if (reply.type === 'free') {
        inFlight--;
        if (reply.buffer.byteLength === BATCH_BYTES) free.push(reply.buffer);
        wakeUp();
      } else if (reply.type === 'done') resolve(reply.result);
      else reject(reply.recording ? new RecordingError(reply.message) : Object.assign(new Error(reply.message), { stack: reply.stack }));
    });
    worker.once('error', reject);
    worker.once('exit', (code) => reject(new Error(`the ingest worker stopped (exit ${code}) before answering`)));
  });
  done.catch(() => {
    stopped = true; // the worker failed: stop reading
    wakeUp();
  });
  const post = (message: ToWorker, transfer: ArrayBuffer[] = []) => worker.postMessage(message, transfer);
  const batch = new MessageBatch();
  const send = async () => {
    if (batch.used === 0) return;
    post({ type: 'batch', buffer: batch.buffer, used: batch.used }, [batch.buffer]);
    inFlight++;
    while (!stopped && inFlight >= MAX_IN_FLIGHT) await new Promise<void>((resolve) => (wake = resolve));
    batch.reset(free.pop() ?? new ArrayBuffer(BATCH_BYTES));
  };
  try {
    post({ type: 'job', job });
    const iterator = recording.messages(topics);
    while (!stopped) {
      let step: IteratorResult<RecordedMessage>;
      try {
        step = await iterator.next();
      } catch (error) {
        await send(); // the messages before the damage are converted, as on one thread
        post({ type: 'damaged', reason: (error as Error).message });
        break;
      }
      if (step.done) {
        await send();
        post({ type: 'end' });
        break;
      }
      const m = step.value;
      if (!batch.add(m.channelId, m.logTime, m.data)) {
        await send();
        batch.add(m.channelId, m.logTime, m.data);
      }
    }
    return await done;
  } finally {
    await worker.terminate();
  }
}
