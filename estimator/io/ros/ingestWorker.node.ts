// Node-only worker_threads entry, bundled to dist/ingest-worker.mjs: runs one part of a
// two-thread `alight ingest` (convertPart) and answers with its counts, or with the error.
import { parentPort } from 'node:worker_threads';
import { convertPart, type PartJob } from './convertPart.node.js';
import { RecordingError } from './RecordingError.js';

if (!parentPort) throw new Error('ingestWorker.node.ts runs only as a worker thread');
const port = parentPort;
port.once('message', (job: PartJob) => {
  convertPart(job).then(
    (result) => port.postMessage({ ok: true, result }),
    (error: Error) => port.postMessage({ ok: false, message: error.message, recording: error instanceof RecordingError, stack: error.stack }),
  );
});
