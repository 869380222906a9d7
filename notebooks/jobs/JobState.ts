// What a running job reports, in the page (from a Web Worker) and in `alight report` (in process).

export interface JobState<T> {
  /** Work units finished and planned (trials, grid cells, log rows...). */
  done: number;
  total: number;
  /** The result so far (partial while !final), or null before the first progress. */
  value: T | null;
  /** True for the last state of a job: complete, cancelled or failed. */
  final: boolean;
  cancelled: boolean;
  error: string | null;
}

/** Progress callback handed to every job: `partial` is called only when a progress message is sent. */
export type Progress<T> = (done: number, total: number, partial: (() => T) | null) => void;

export function progressText(state: JobState<unknown>, unit: string): string {
  if (state.error) return `failed: ${state.error}`;
  if (state.cancelled) return `cancelled after ${state.done} of ${state.total} ${unit}`;
  if (!state.final) return `running: ${state.done} of ${state.total} ${unit}`;
  return `${state.total} ${unit}`;
}
