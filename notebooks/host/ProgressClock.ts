// The run line's reading: share of the work done and the time left, across every job started
// since the page was last idle. Jobs that start later (a queue of ten sweeps) join the batch with
// their share, and the shown share never goes backwards within a batch: a bar that runs back
// reads as lost work.
import type { Activity } from '../jobs/WorkerJobRunner.js';

export interface ProgressReading {
  /** 0..1, never less than the last reading of the same batch. */
  fraction: number;
  /** e.g. "pixel noise sweep: 312 of 800 trials · about 12 s left". */
  text: string;
}

export class ProgressClock {
  private start = 0;
  private shown = 0;
  /** Each job's last share done (0..1), by job id, for every job seen in this batch. */
  private readonly jobs = new Map<number, number>();

  read(activity: readonly Activity[], now: number): ProgressReading {
    if (activity.length === 0) {
      this.jobs.clear();
      this.shown = 0;
      return { fraction: 1, text: '' };
    }
    if (this.jobs.size === 0) this.start = now;
    const live = new Set(activity.map((a) => a.id));
    // A job that left the activity list finished (or was cancelled): its share is done.
    for (const id of this.jobs.keys()) if (!live.has(id)) this.jobs.set(id, 1);
    for (const a of activity) this.jobs.set(a.id, a.total > 0 ? Math.min(1, a.done / a.total) : 0);
    let sum = 0;
    for (const f of this.jobs.values()) sum += f;
    this.shown = Math.max(this.shown, sum / this.jobs.size);
    const done = activity.reduce((s, a) => s + a.done, 0);
    const total = activity.reduce((s, a) => s + a.total, 0);
    const elapsed = (now - this.start) / 1000;
    // Time left by proportion, once there is enough behind it to mean something.
    const left = this.shown >= 0.03 && elapsed >= 1 ? (elapsed * (1 - this.shown)) / this.shown : null;
    const labels = [...new Set(activity.map((a) => a.label))];
    const head = labels.length > 2 ? `${labels.length} jobs` : labels.join(', ');
    const text = `${head}: ${done} of ${total || '…'}${left === null ? '' : ` · about ${formatSeconds(left)} left`}`;
    return { fraction: this.shown, text };
  }
}

function formatSeconds(s: number): string {
  if (s < 10) return `${Math.max(1, Math.round(s))} s`;
  if (s < 90) return `${Math.round(s / 5) * 5} s`;
  return `${Math.round(s / 60)} min`;
}
