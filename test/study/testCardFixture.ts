// A sweep of detector.latency with chosen landing counts, for the test-card tests.
import { defaultScenario } from '../../estimator/io/defaultScenario.js';
import type { SweepHeader, SweepRecord } from '../../estimator/study/resultsFile.js';
import { fakeTrial } from './fakeTrial.js';

// Latency 0.05 .. 0.2 s, 40 trials each, landing 40, 39, 36 and 30 times; the scenario's own latency is 0.08 s.
const LATENCIES = [0.05, 0.1, 0.15, 0.2];
const LANDED = [40, 39, 36, 30];
export const header: SweepHeader = {
  v: 1, kind: 'alight-sweep', tool: '0.1.0', seed: 9, trials: 40, design: 'grid',
  vary: [{ path: 'detector.latency', values: LATENCIES }], points: LATENCIES.map((v) => ({ 'detector.latency': v })), scenario: defaultScenario(),
};
export const records: SweepRecord[] = LATENCIES.flatMap((_, point) =>
  Array.from({ length: 40 }, (_, trial): SweepRecord => ({
    v: 1, point, trial, params: header.points[point]!, ...fakeTrial(defaultScenario(), { seed: 9, point, trial }),
    outcome: trial < LANDED[point]! ? 'landed' : 'aborted', cause: trial < LANDED[point]! ? null : 'dropout-burst', causeChain: [],
  })),
);
