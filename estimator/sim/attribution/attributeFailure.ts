// The rule that names why a trial did not land, from its event log (FailureLog).
//
//   1. A trial that landed has no cause and an empty chain.
//   2. Episodes: each (re-)acquisition of the filter starts one (its own false box, if it
//      started from one, belongs to it). The deciding episode is the last one that holds a
//      trigger or a symptom; a trial that re-acquired cleanly and then ran out of time is
//      decided by the episode that went wrong before.
//   3. In it, the cause is the earliest trigger (dropout burst, latency spike, false box, gust)
//      followed within CAUSE_WINDOW s by a symptom (estimate outside the descent funnel, boxes
//      refused by the gate, abort, divergence declared by the filter or found by the simulator)
//      or, in the last episode, by the end of the trial.
//   4. A trigger of another kind starting within TIE s of that one makes it 'no-single-cause'
//      (two things at once; neither can be blamed alone).
//   5. No such trigger: 'divergence' when the filter diverged, 'silent-divergence' when the
//      simulator found the estimate far from the truth, otherwise 'no-single-cause'
//      (the trial failed inside the noise: nothing the trial knows stands out).
// The chain is the cause and every event after it (from the deciding episode's start when
// there is no single cause), in time order, at most MAX_CHAIN events.
import type { Outcome } from '../TrialResult.js';
import { EVENT_NAMES, TRIGGER_KINDS, type FailureCause, type FailureEvent } from './FailureEvent.js';

/** s: long enough for a burst to outlast lostTimeout and the estimate to drift (demos: 1.5 s) plus the descent's reaction. */
export const CAUSE_WINDOW = 5;
/** s: triggers this close together are one moment. */
export const TIE = 0.25;
/** Events kept in a chain (a results line stays short). */
export const MAX_CHAIN = 16;

export interface Attribution {
  cause: FailureCause | null;
  causeChain: FailureEvent[];
}

const isTrigger = (e: FailureEvent) => EVENT_NAMES.indexOf(e.event) < TRIGGER_KINDS;
const isSymptom = (e: FailureEvent) =>
  e.event === 'funnel-exit' || e.event === 'gated-boxes' || e.event === 'abort' || e.event === 'divergence' || e.event === 'silent-divergence';

/**
 * Cause and chain of a trial's outcome. `events` in time order; `end` the trial's last time (s).
 * @example attributeFailure([{ t: 10, event: 'dropout-burst', phase: 'descend', height: 3, value: 2 }, { t: 11.5, event: 'abort', phase: 'descend', height: 3, value: 0 }], 'aborted', 20).cause // 'dropout-burst'
 */
export function attributeFailure(events: readonly FailureEvent[], outcome: Outcome, end: number): Attribution {
  if (outcome === 'landed') return { cause: null, causeChain: [] };
  // episodes: [start index, end index) into events
  const starts: number[] = [0];
  events.forEach((e, i) => {
    if (e.event === 'acquired' && i > 0) starts.push(i);
  });
  for (let k = starts.length - 1; k >= 0; k--) {
    const from = starts[k]!, to = k + 1 < starts.length ? starts[k + 1]! : events.length;
    const episode = events.slice(from, to);
    if (!episode.some((e) => isTrigger(e) || isSymptom(e))) continue;
    const last = k === starts.length - 1;
    const consequence = (trigger: FailureEvent) =>
      episode.some((e) => isSymptom(e) && e.t >= trigger.t && e.t <= trigger.t + CAUSE_WINDOW) || (last && end - trigger.t <= CAUSE_WINDOW);
    const cause = episode.find((e) => isTrigger(e) && consequence(e));
    if (cause) {
      const tied = episode.some((e) => isTrigger(e) && e.event !== cause.event && Math.abs(e.t - cause.t) <= TIE);
      if (tied) return { cause: 'no-single-cause', causeChain: chainFrom(events, from) };
      return { cause: cause.event as FailureCause, causeChain: chainFrom(events, events.indexOf(cause)) };
    }
    const diverged = episode.find((e) => e.event === 'divergence' || e.event === 'silent-divergence');
    if (diverged) return { cause: diverged.event as FailureCause, causeChain: chainFrom(events, events.indexOf(diverged)) };
    return { cause: 'no-single-cause', causeChain: chainFrom(events, from) };
  }
  return { cause: 'no-single-cause', causeChain: chainFrom(events, 0) };
}

/** Events from index i on, rounded for the results file (ms, cm, 3 significant decimals). */
function chainFrom(events: readonly FailureEvent[], i: number): FailureEvent[] {
  return events.slice(i, i + MAX_CHAIN).map((e) => ({ t: round(e.t, 3), event: e.event, phase: e.phase, height: round(e.height, 2), value: round(e.value, 3) }));
}

function round(v: number, digits: number): number {
  const f = 10 ** digits;
  return Math.round(v * f) / f;
}
