// Several jobs seen as one: work adds up, the result is final when every job is.
import type { JobState } from './JobState.js';

export function combineStates<T>(states: readonly JobState<T>[]): JobState<(T | null)[]> {
  return {
    done: states.reduce((s, x) => s + x.done, 0),
    total: states.reduce((s, x) => s + x.total, 0),
    value: states.some((s) => s.value !== null) ? states.map((s) => s.value) : null,
    final: states.every((s) => s.final),
    cancelled: states.some((s) => s.cancelled),
    error: states.find((s) => s.error !== null)?.error ?? null,
  };
}
