// The sizes a study accepts, stated once and enforced before any trial runs. A results file is
// read whole to summarize, merge or put in canonical order, and one JSON Lines record of a
// trial is about 530 bytes, so a file is kept under about 270 MB: far below the longest
// string V8 holds (2^29 characters), which a bigger file would overflow with a crash.

/** Most trials at one sweep point (also per probe of require, per end of sensitivity, per setting of tune). */
export const MAX_TRIALS_PER_POINT = 100_000;
/** Most points of one sweep design (and values of one --vary range). */
export const MAX_POINTS = 10_000;
/** Most trials in one results file: points x trials per point. */
export const MAX_TRIALS_PER_FILE = 500_000;
/** Largest results file read (bytes): MAX_TRIALS_PER_FILE records with room for long scenarios. */
export const MAX_RESULTS_BYTES = 400 * 1024 * 1024;

export class StudyLimitError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'StudyLimitError';
  }
}

/** Points a design will have, computed without building it. */
export function designSize(vary: readonly { count?: number; values?: readonly unknown[] }[], kind: 'grid' | 'random' | 'lhs', points?: number): number {
  if (vary.length === 0) return 1;
  if (kind !== 'grid') return points ?? Math.max(...vary.map((v) => v.values?.length ?? v.count ?? 1));
  return vary.reduce((n, v) => n * (v.values?.length ?? v.count ?? 1), 1);
}

/**
 * Refuse a study over the limits, naming the limit and what to do instead.
 * @example checkStudySize(1, 1e9) // throws: 1000000000 trials per point is over the limit of 100000 ...
 */
export function checkStudySize(points: number, trials: number): void {
  if (trials > MAX_TRIALS_PER_POINT) {
    throw new StudyLimitError(`${trials} trials per point is over the limit of ${MAX_TRIALS_PER_POINT}; a success rate is known to about ±0.3 % at that count, split a bigger study into several sweeps`);
  }
  if (points > MAX_POINTS) throw new StudyLimitError(`${points} sweep points is over the limit of ${MAX_POINTS}; sweep fewer values or use --design lhs with --points M`);
  if (points * trials > MAX_TRIALS_PER_FILE) {
    throw new StudyLimitError(`${points} points x ${trials} trials = ${points * trials} trials is over the limit of ${MAX_TRIALS_PER_FILE} per results file (about 270 MB); split the study into several sweeps (e.g. by --vary range)`);
  }
}
