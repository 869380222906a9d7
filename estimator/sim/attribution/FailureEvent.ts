// The events a trial records for failure attribution, and the cause it is given.
// Kinds are small integers in the trial's event log (FailureLog) and names in results.
import type { Phase } from '../Phase.js';

/**
 * External events that can start a failure ("triggers"), then what follows from them
 * ("symptoms": the estimate leaving the descent funnel, boxes refused by the gate, an abort,
 * a divergence), then markers (the target overflowing the image below the blind height, and
 * each (re-)acquisition of the filter, which starts a new episode).
 */
export const EVENT_NAMES = [
  'dropout-burst', // trigger; value: length of the burst (s)
  'latency-spike', // trigger; value: the longest delay of the run of late frames (s)
  'false-box', // trigger; value: false boxes taken within a second of each other (by the update or to start an acquisition)
  'gust', // trigger; value: peak horizontal gust beyond the mean wind (m/s)
  'gated-boxes', // symptom; value: boxes refused in a row
  'funnel-exit', // symptom; value: peak horizontal estimate error (m)
  'divergence', // symptom; value: 1
  'abort', // symptom; value: 0 target lost, 1 diverged
  'blind', // marker; value: estimated height (m) when the target was expected to overflow the image
  'acquired', // marker; value: 0 first acquisition, 1 re-acquisition
  'silent-divergence', // symptom; value: 1 with a calm NIS (the filter saw nothing), 0 with an alarmed one
] as const;
export type FailureEventName = (typeof EVENT_NAMES)[number];

export const EV_BURST = 0;
export const EV_LATENCY = 1;
export const EV_FALSE_BOX = 2;
export const EV_GUST = 3;
export const EV_GATED = 4;
export const EV_FUNNEL = 5;
export const EV_DIVERGENCE = 6;
export const EV_ABORT = 7;
export const EV_BLIND = 8;
export const EV_ACQUIRED = 9;
export const EV_SILENT = 10;

/** Kinds below this are triggers. */
export const TRIGGER_KINDS = 4;

/** One event as results carry it: time (s), supervisor phase, true height above the deck (m), value (see EVENT_NAMES). */
export interface FailureEvent {
  t: number;
  event: FailureEventName;
  phase: Phase;
  height: number;
  value: number;
}

/**
 * Why a trial that did not land failed: the trigger the attribution rule picked
 * (attributeFailure.ts), 'divergence' for a filter that declared divergence with no trigger
 * before it, 'silent-divergence' for an estimate the simulator found far from the truth with no
 * trigger before it, or 'no-single-cause' (no trigger, or two of different kinds at once).
 */
export type FailureCause = 'dropout-burst' | 'latency-spike' | 'false-box' | 'gust' | 'divergence' | 'silent-divergence' | 'no-single-cause';
export const FAILURE_CAUSES: readonly FailureCause[] = ['dropout-burst', 'latency-spike', 'false-box', 'gust', 'divergence', 'silent-divergence', 'no-single-cause'];
