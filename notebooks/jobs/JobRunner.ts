// The `jobs` builtin of every study graph: runs a named job and yields its states. The page runs
// jobs in Web Workers (progressive, cancellable); `alight report` runs them in process.
import type { JobState } from './JobState.js';
import type { JobInput, JobKind, JobOutput } from './jobTable.js';

/** An async iterator whose `return()` cancels the job at once (the graph calls it on invalidation). */
export type JobStates<T> = AsyncIterableIterator<JobState<T>>;

export interface JobRunner {
  run<K extends JobKind>(kind: K, input: JobInput<K>, label: string): JobStates<JobOutput<K>>;
}

/** A queue of states with a "latest wins" read: progress that arrives faster than frames is coalesced. */
export class StateChannel<T> implements AsyncIterableIterator<JobState<T>> {
  private latest: JobState<T> | null = null;
  private waiting: ((result: IteratorResult<JobState<T>>) => void) | null = null;
  private finished = false;
  private readonly onReturn: () => void;

  constructor(onReturn: () => void) {
    this.onReturn = onReturn;
  }

  push(state: JobState<T>): void {
    if (this.finished && this.latest === null) return;
    if (this.waiting) {
      const resolve = this.waiting;
      this.waiting = null;
      if (state.final) this.finished = true;
      resolve({ value: state, done: false });
      return;
    }
    // Never coalesce away the final state.
    if (this.latest?.final) return;
    this.latest = state;
  }

  next(): Promise<IteratorResult<JobState<T>>> {
    if (this.latest) {
      const value = this.latest;
      this.latest = null;
      if (value.final) this.finished = true;
      return Promise.resolve({ value, done: false });
    }
    if (this.finished) return Promise.resolve({ value: undefined, done: true });
    return new Promise((resolve) => (this.waiting = resolve));
  }

  return(): Promise<IteratorResult<JobState<T>>> {
    if (!this.finished) this.onReturn();
    this.finished = true;
    this.latest = null;
    if (this.waiting) this.waiting({ value: undefined, done: true });
    this.waiting = null;
    return Promise.resolve({ value: undefined, done: true });
  }

  [Symbol.asyncIterator](): this {
    return this;
  }
}
