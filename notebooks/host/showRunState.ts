// Browser only: the run line of the setup rail (progress bar, its words, the Cancel / Run again
// button) and the body's busy state the browser tests wait on, from the jobs running and the plates.
import type { Activity } from '../jobs/WorkerJobRunner.js';
import type { Plate } from './Plate.js';
import type { ProgressClock } from './ProgressClock.js';

export function showRunState(activity: readonly Activity[], plates: readonly Plate[], clock: ProgressClock): void {
  const busy = activity.length > 0 || plates.some((p) => p.element.dataset.final !== 'true');
  const cancelled = plates.some((p) => p.output?.status.startsWith('cancelled'));
  document.body.dataset.state = busy ? 'busy' : 'idle';
  const bar = document.querySelector<HTMLElement>('.progress > div');
  const line = document.querySelector<HTMLElement>('.run-text');
  const button = document.querySelector<HTMLButtonElement>('#cancel');
  const reading = clock.read(activity, performance.now());
  const percent = activity.length === 0 ? (cancelled ? 0 : 100) : 100 * reading.fraction;
  document.querySelector('.progress')?.setAttribute('aria-valuenow', String(Math.round(percent)));
  document.querySelector('.progress')?.setAttribute('aria-valuetext', activity.length > 0 ? reading.text : cancelled ? 'cancelled' : 'all results in');
  if (bar) bar.style.width = `${activity.length === 0 ? percent : Math.max(2, percent)}%`;
  if (line) line.textContent = activity.length > 0 ? reading.text : cancelled ? 'cancelled: partial results shown' : 'all results in';
  if (button) {
    // While jobs run the button cancels them; after a cancel it runs the study again.
    button.textContent = activity.length === 0 && cancelled ? 'Run again' : 'Cancel';
    button.disabled = activity.length === 0 && !cancelled;
  }
}
