// Fly one simulated trial and write it as a flight log (README.md, "Flight-log layout"): everything the lander's
// sensors gave its filter (artefacts included: noise, dropouts, latency, false boxes, biased
// IMU and odometry, attitude error), the simulator's truth and the filter's own estimates.
// Browser-safe: the text goes to a LogTextSink (folderSink.node.ts writes files).
import { withHistoryFor } from '../../sim/historyFor.js';
import { runTrial, trialStream, type TrialKey } from '../../sim/runTrial.js';
import type { Scenario } from '../../sim/Scenario.js';
import type { TrialResult } from '../../sim/TrialResult.js';
import { LocalizationError } from '../../sim/world/localizationError.js';
import { LogRecorder, type LogTextSink } from './LogRecorder.js';

export interface RecordOptions {
  /** Trial key (default { seed: scenario.seed, point: 0, trial: 0 }, as runTrial). */
  key?: TrialKey;
  /** Write truth.csv (default true). */
  truth?: boolean;
}

export interface RecordResult {
  result: TrialResult;
  /** Data rows written per file. */
  rows: Record<string, number>;
}

export function recordTrial(scenario: Scenario, sink: LogTextSink, options: RecordOptions = {}): RecordResult {
  const key = options.key ?? { seed: scenario.seed, point: 0, trial: 0 };
  // The believed camera, target size and outline carry this trial's drawn focal, size and
  // misalignment errors: the same stream as the trial's own LocalizationError, so the same draws.
  const errors = new LocalizationError(scenario.localization, trialStream(key, 'localization'));
  const recorder = new LogRecorder(sink, {
    camera: errors.believedCamera(scenario.camera),
    targetSize: errors.believedTargetSize(scenario.carrier),
    outline: errors.believedOutline(scenario.carrier),
    filter: withHistoryFor(scenario.filter, scenario.detector, scenario.localization.clockOffset), // the history the trial ran with
    note: `recorded by alight from scenario "${scenario.name}", seed ${key.seed}, point ${key.point}, trial ${key.trial}`,
    truth: options.truth,
  });
  try {
    const result = runTrial(scenario, { key, recorder });
    return { result, rows: Object.fromEntries(recorder.rows) };
  } finally {
    recorder.close();
  }
}
