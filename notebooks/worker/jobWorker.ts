// The Web Worker entry (dist/notebooks/worker.js): runs one job from the job table and posts
// throttled progress with partial results, then the result. The page terminates it to cancel.
import { jobTable, type JobContext } from '../jobs/jobTable.js';
import { PROGRESS_INTERVAL_MS, type StartMessage, type WorkerMessage } from '../jobs/protocol.js';

interface WorkerScope {
  onmessage: ((event: MessageEvent<StartMessage>) => void) | null;
  postMessage(message: WorkerMessage): void;
}
const scope = self as unknown as WorkerScope;

scope.onmessage = (event) => {
  const { kind, input } = event.data;
  const job = jobTable[kind] as unknown as (input: unknown, progress: (done: number, total: number, partial: (() => unknown) | null) => void, context: JobContext) => unknown;
  let lastPost = 0;
  let done = 0;
  let total = 0;
  const progress = (d: number, t: number, partial: (() => unknown) | null): void => {
    done = d;
    total = t;
    const now = performance.now();
    if (now - lastPost < PROGRESS_INTERVAL_MS && d < t) return;
    lastPost = now;
    scope.postMessage({ type: 'progress', done: d, total: t, partial: partial ? partial() : null });
  };
  Promise.resolve()
    .then(() => job(input, progress, {}))
    .then(
      (value) => scope.postMessage({ type: 'result', done, total, value }),
      (error: unknown) => scope.postMessage({ type: 'error', message: (error as Error)?.message ?? String(error) }),
    );
};
