// Runs jobs on the calling thread and yields only the final state: `alight report` and the
// Node tests use it, so their numbers come from the very functions the page's workers call.
import type { JobRunner, JobStates } from './JobRunner.js';
import { StateChannel } from './JobRunner.js';
import { jobTable, type JobContext, type JobInput, type JobKind, type JobOutput } from './jobTable.js';

export class InlineJobRunner implements JobRunner {
  private readonly context: JobContext;
  /** Jobs run so far, by kind (tests check that a control change starts no needless job). */
  readonly started = new Map<string, number>();

  constructor(context: JobContext = {}) {
    this.context = context;
  }

  run<K extends JobKind>(kind: K, input: JobInput<K>): JobStates<JobOutput<K>> {
    this.started.set(kind, (this.started.get(kind) ?? 0) + 1);
    let cancelled = false;
    const channel = new StateChannel<JobOutput<K>>(() => (cancelled = true));
    const job = jobTable[kind] as unknown as (input: JobInput<K>, progress: (done: number, total: number) => void, context: JobContext) => JobOutput<K> | Promise<JobOutput<K>>;
    let done = 0;
    let total = 0;
    const progress = (d: number, t: number): void => {
      done = d;
      total = t;
    };
    // Start on a later tick so the graph has subscribed before the (synchronous) work begins.
    setTimeout(() => {
      if (cancelled) return;
      Promise.resolve()
        .then(() => job(input, progress, this.context))
        .then(
          (value) => channel.push({ done, total, value, final: true, cancelled: false, error: null }),
          (error: unknown) => channel.push({ done, total, value: null, final: true, cancelled: false, error: (error as Error)?.message ?? String(error) }),
        );
    }, 0);
    return channel;
  }
}
