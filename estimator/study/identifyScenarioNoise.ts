// Noise identification on simulation: fly trials of a scenario, write each as a flight log in
// memory (what `alight record` writes, seed/point 0/trial i), and identify the named noise terms
// from those logs exactly as from real ones (identifyLogNoise). Browser-safe.
import { identifyLogNoise, type IdentifyLogOptions, type LogNoiseIdentification } from '../io/log/identifyLogNoise.js';
import { logSourceFromFiles, type LogSource } from '../io/log/LogSource.js';
import { recordTrial } from '../io/log/recordTrial.js';
import type { Scenario } from '../sim/Scenario.js';

/** `count` recorded trials of the scenario (keys seed, point 0, trials 0..count-1) as in-memory logs. */
export async function recordedLogs(scenario: Scenario, seed: number, count: number): Promise<LogSource[]> {
  const logs: LogSource[] = [];
  for (let trial = 0; trial < count; trial++) {
    const files = new Map<string, string>();
    recordTrial(scenario, { write: (file, text) => void files.set(file, (files.get(file) ?? '') + text), close: () => undefined }, { key: { seed, point: 0, trial } });
    logs.push(await logSourceFromFiles(files, `${scenario.name} trial ${trial}`));
  }
  return logs;
}

export interface ScenarioIdentifyOptions extends Omit<IdentifyLogOptions, 'filterSource' | 'filterLines'> {
  seed: number;
  /** Recorded trials to identify from (default 3). */
  logs?: number;
}

export async function identifyScenarioNoise(scenario: Scenario, options: ScenarioIdentifyOptions): Promise<LogNoiseIdentification> {
  const logs = await recordedLogs(scenario, options.seed, options.logs ?? 3);
  return identifyLogNoise(logs, { ...options, filterSource: 'scenario' });
}
