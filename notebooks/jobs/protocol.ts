// Messages between the page and a job worker. One worker runs one job; cancel = terminate.
import type { JobKind } from './jobTable.js';

export interface StartMessage {
  type: 'start';
  kind: JobKind;
  input: unknown;
}

export type WorkerMessage =
  | { type: 'progress'; done: number; total: number; partial: unknown }
  | { type: 'result'; done: number; total: number; value: unknown }
  | { type: 'error'; message: string };

/** Least time between two progress messages (ms): keeps figures lively without flooding the page. */
export const PROGRESS_INTERVAL_MS = 150;
