// How much filter history a trial needs so that no box the detector can deliver arrives too
// old to use. A fixed 0.3 s turned latency into a cliff: on the survey rover 0.28 s still
// landed 41 of 50, 0.4 s none (every box older than the history, all trials timed out).
import type { FilterSpec } from '../models/FilterSettings.js';
import type { DetectorSpec } from './Scenario.js';

/** Jitter sigmas covered: the arrival time is latency + jitter n truncated at 0 (n > 4: 3e-5 of frames). */
const JITTER_SIGMAS = 4;

/**
 * The history (s) a box needs: latency + 4 jitter + one frame period (capture falls on the
 * first step after its tick) + |clock offset| + two filter steps:
 *   needed = L + 4 σ_L + 1 / f_det + |Δt_clock| + 2 / f_filter
 */
export function historyNeeded(filter: Pick<FilterSpec, 'rate'>, detector: Pick<DetectorSpec, 'latency' | 'latencyJitter' | 'rate'>, clockOffset: number): number {
  return detector.latency + JITTER_SIGMAS * detector.latencyJitter + 1 / detector.rate + Math.abs(clockOffset) + 2 / filter.rate;
}

/**
 * The filter settings a trial runs with: filter.historyLength raised to historyNeeded() when
 * shorter (the same object when it is long enough). recordTrial writes these settings, so a
 * replay keeps the same history.
 */
export function withHistoryFor(filter: FilterSpec, detector: Pick<DetectorSpec, 'latency' | 'latencyJitter' | 'rate'>, clockOffset: number): FilterSpec {
  const needed = historyNeeded(filter, detector, clockOffset);
  return filter.historyLength >= needed ? filter : { ...filter, historyLength: needed };
}
