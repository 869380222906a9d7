// Node-only: a conversion in two parts on two threads. The mapped topics are split so both parts
// decode about as many messages (per-message work dominates; counts come from the recording's
// statistics); topics that must meet stay together (the two truth topics are paired). Each part
// writes its own files, so nothing is merged but the counts.
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';
import { convertPart, type PartJob, type PartResult } from './convertPart.node.js';
import type { Route } from './recordingRoutes.js';
import { RecordingError } from './RecordingError.js';

/** Two non-empty route lists of about equal message counts, or null when the topics cannot be split. */
export function splitRoutes(routes: readonly Route[], counts: ReadonlyMap<string, number>): [Route[], Route[]] | null {
  // Units: the routes of one topic, with both truth topics in one unit.
  const units = new Map<string, Route[]>();
  for (const route of routes) {
    const key = route.role === 'truthLander' || route.role === 'truthCarrier' ? '(truth)' : route.topic;
    units.set(key, [...(units.get(key) ?? []), route]);
  }
  if (units.size < 2 || routes.some((r) => !counts.has(r.topic))) return null;
  const weight = (unit: Route[]) => [...new Set(unit.map((r) => r.topic))].reduce((sum, t) => sum + counts.get(t)!, 0);
  const parts: [Route[], Route[]] = [[], []];
  const loads = [0, 0];
  for (const unit of [...units.values()].sort((a, b) => weight(b) - weight(a))) {
    const k = loads[0]! <= loads[1]! ? 0 : 1;
    parts[k].push(...unit);
    loads[k] += weight(unit);
  }
  return parts[1].length > 0 ? parts : null;
}

/** The bundled worker beside the CLI bundle (dist/), or dist/ of the repository when run from source; null when not built. */
export function ingestWorkerPath(): string | null {
  for (const url of [new URL('./ingest-worker.mjs', import.meta.url), new URL('../../../dist/ingest-worker.mjs', import.meta.url)]) {
    const path = fileURLToPath(url);
    if (existsSync(path)) return path;
  }
  return null;
}

/** Old-generation heap limit of the worker thread (MB); a whole conversion runs in 48 MB. */
const WORKER_HEAP_MB = 128;

type WorkerReply = { ok: true; result: PartResult } | { ok: false; message: string; recording: boolean; stack?: string };

function partInWorker(workerPath: string, job: PartJob): { done: Promise<PartResult>; stop: () => Promise<number> } {
  // A part's live data is small (a chunk, a few rows): a modest heap limit makes the worker
  // collect sooner instead of growing towards V8's default, which kept peak memory near 450 MB.
  const worker = new Worker(workerPath, { resourceLimits: { maxOldGenerationSizeMb: WORKER_HEAP_MB } });
  const done = new Promise<PartResult>((resolve, reject) => {
    worker.once('message', (reply: WorkerReply) => {
      if (reply.ok) resolve(reply.result);
      else reject(reply.recording ? new RecordingError(reply.message) : Object.assign(new Error(reply.message), { stack: reply.stack }));
    });
    worker.once('error', reject);
    worker.once('exit', (code) => reject(new Error(`the ingest worker stopped (exit ${code}) before answering`)));
  });
  worker.postMessage(job);
  return { done, stop: () => worker.terminate() };
}

/** Run part A here and part B in a worker; both end (their files closed) before an error of either goes up. */
export async function runParts(workerPath: string, a: PartJob, b: PartJob): Promise<[PartResult, PartResult]> {
  const other = partInWorker(workerPath, b);
  try {
    const [here, there] = await Promise.allSettled([convertPart(a), other.done]);
    if (here.status === 'rejected') throw here.reason;
    if (there.status === 'rejected') throw there.reason;
    return [here.value, there.value];
  } finally {
    await other.stop();
  }
}
