// Browser only: runs each job in its own module Web Worker (dist/notebooks/worker.js), at most
// `concurrency` at a time, and reports activity for the progress bar. Cancel = terminate.
// A sweep is split into one interleaved part per core and its parts merged as they report, so a
// study of hundreds of trials per point uses every core the browser offers; the merged results
// are the very records, summaries and file one worker would give.
import type { JobState } from './JobState.js';
import { mergeSweepParts, plannedTrials, splitSweep, type SweepInput, type SweepOutput } from './sweepJob.js';
import { StateChannel, type JobRunner, type JobStates } from './JobRunner.js';
import type { JobInput, JobKind, JobOutput } from './jobTable.js';
import type { WorkerMessage } from './protocol.js';

export interface Activity {
  id: number;
  label: string;
  done: number;
  total: number;
}

interface Pending {
  id: number;
  label: string;
  start(): void;
  cancel(): void;
}

export class WorkerJobRunner implements JobRunner {
  private readonly url: string;
  private readonly concurrency: number;
  private readonly queue: Pending[] = [];
  private readonly running = new Map<number, Pending>();
  private readonly activity = new Map<number, Activity>();
  private listeners: ((activity: readonly Activity[]) => void)[] = [];
  private nextId = 1;

  constructor(url: string, concurrency: number) {
    this.url = url;
    this.concurrency = Math.max(1, concurrency);
  }

  onActivity(listener: (activity: readonly Activity[]) => void): void {
    this.listeners.push(listener);
  }

  /** Stop every running and queued job; their figures keep the partial results, marked cancelled. */
  cancelAll(): void {
    for (const p of [...this.queue, ...this.running.values()]) p.cancel();
  }

  run<K extends JobKind>(kind: K, input: JobInput<K>, label: string): JobStates<JobOutput<K>> {
    if (kind === 'sweep' && this.concurrency > 1) return this.runSplit(input as SweepInput, label) as unknown as JobStates<JobOutput<K>>;
    return this.runOne(kind, input, label);
  }

  /** One sweep as parts on several workers, seen as one job. */
  private runSplit(input: SweepInput, label: string): JobStates<SweepOutput> {
    const parts = splitSweep(input, this.concurrency);
    // Each part's trials are known before it starts: a part still queued (or cancelled unstarted) counts its share.
    const planned = parts.map((p) => plannedTrials(p));
    const states: JobState<SweepOutput>[] = parts.map((_, k) => ({ done: 0, total: planned[k]!, value: null, final: false, cancelled: false, error: null }));
    const channels: JobStates<SweepOutput>[] = [];
    const merged = new StateChannel<SweepOutput>(() => {
      for (const c of channels) void c.return?.();
    });
    const publish = (): void => {
      const final = states.every((s) => s.final);
      merged.push({
        done: states.reduce((sum, s) => sum + s.done, 0),
        total: states.reduce((sum, s, k) => sum + Math.max(s.total, planned[k]!), 0),
        value: states.some((s) => s.value !== null) ? mergeSweepParts(input, states.map((s) => s.value)) : null,
        final,
        cancelled: states.some((s) => s.cancelled),
        error: states.find((s) => s.error !== null)?.error ?? null,
      });
    };
    parts.forEach((part, k) => {
      const channel = this.runOne('sweep', part, label);
      channels.push(channel);
      void (async () => {
        for await (const state of channel) {
          states[k] = state;
          // One part failing fails the sweep: stop the others rather than finish work no one reads.
          if (state.error !== null) {
            channels.forEach((c, j) => {
              if (j !== k && !states[j]!.final) {
                states[j] = { ...states[j]!, final: true };
                void c.return?.();
              }
            });
          }
          publish();
        }
      })();
    });
    return merged;
  }

  private runOne<K extends JobKind>(kind: K, input: JobInput<K>, label: string): JobStates<JobOutput<K>> {
    const id = this.nextId++;
    let worker: Worker | null = null;
    let last: JobState<JobOutput<K>> = { done: 0, total: 0, value: null, final: false, cancelled: false, error: null };
    const finish = (): void => {
      worker?.terminate();
      worker = null;
      this.running.delete(id);
      const queued = this.queue.findIndex((p) => p.id === id);
      if (queued >= 0) this.queue.splice(queued, 1);
      this.activity.delete(id);
      this.notify();
      this.pump();
    };
    const channel = new StateChannel<JobOutput<K>>(finish);
    const pending: Pending = {
      id,
      label,
      start: () => {
        worker = new Worker(this.url, { type: 'module', name: `alight ${kind}` });
        worker.onmessage = (event: MessageEvent<WorkerMessage>) => {
          const message = event.data;
          if (message.type === 'progress') {
            last = { done: message.done, total: message.total, value: (message.partial as JobOutput<K> | null) ?? last.value, final: false, cancelled: false, error: null };
            this.activity.set(id, { id, label, done: message.done, total: message.total });
            this.notify();
            channel.push(last);
          } else if (message.type === 'result') {
            channel.push({ done: message.done, total: message.total, value: message.value as JobOutput<K>, final: true, cancelled: false, error: null });
            finish();
          } else {
            channel.push({ ...last, final: true, error: message.message });
            finish();
          }
        };
        worker.onerror = (event) => {
          event.preventDefault();
          channel.push({ ...last, final: true, error: event.message || 'worker failed to start' });
          finish();
        };
        worker.postMessage({ type: 'start', kind, input });
      },
      cancel: () => {
        channel.push({ ...last, final: true, cancelled: true });
        finish();
      },
    };
    this.activity.set(id, { id, label, done: 0, total: 0 });
    this.queue.push(pending);
    this.notify();
    this.pump();
    return channel;
  }

  private pump(): void {
    while (this.running.size < this.concurrency && this.queue.length > 0) {
      const next = this.queue.shift()!;
      this.running.set(next.id, next);
      next.start();
    }
  }

  private notify(): void {
    const list = [...this.activity.values()];
    for (const l of this.listeners) l(list);
  }
}
