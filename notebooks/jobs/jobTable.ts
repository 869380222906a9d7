// Every job a study can run, by name. The worker and the in-process runner both call these,
// so page and report compute with the same functions. Each job takes (input, progress, context).
import { landingJob } from './landingJob.js';
import { sweepJob } from './sweepJob.js';
import { tuningJob } from './tuningJob.js';
import { replayJob } from './replayJob.js';

/** What only some hosts can give a job (Node: reading a demo log folder from disk, by name). */
export interface JobContext {
  openLogFolder?: (name: string) => unknown;
}

export const jobTable = {
  landing: landingJob,
  sweep: sweepJob,
  tuning: tuningJob,
  replay: replayJob,
};

type Table = typeof jobTable;
export type JobKind = keyof Table;
export type JobInput<K extends JobKind> = Parameters<Table[K]>[0];
export type JobOutput<K extends JobKind> = Awaited<ReturnType<Table[K]>>;
