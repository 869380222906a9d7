// Tune the filter on flight logs: identify the named noise terms by maximum innovation
// likelihood (identifyLogNoise), then compare the recommended setting with the current one.
// Until version 0.1 this searched three global multipliers (qScale, rScale, gateScale) against a
// consistency score; those fields stay in the result (the multipliers are now held, not searched)
// so scripts that read them keep working.
// Browser-safe (any LogSource whose streams can be opened again for every replay).
import type { FilterSpec } from '../../sim/Scenario.js';
import { identifyLogNoise, type IdentifyLogOptions, type LogNoiseIdentification } from './identifyLogNoise.js';
import type { LogSource } from './LogSource.js';
import { SAFETY_CAUTION } from '../../safetyCaution.js';
import type { ReplayReport } from './replayLog.js';

export type TuneLogOptions = IdentifyLogOptions;

export interface TuneLogResult extends LogNoiseIdentification {
  /** What the recommendation maximises: always the innovation likelihood now ('likelihood'). */
  criterion: 'likelihood';
  /** The multipliers of the recommended setting (held at the current values: no longer searched). */
  recommendedMultipliers: { qScale: number; rScale: number; gateScale: number };
  /** -2 ln L at the optimum and at the current setting (the search's ungated replays). */
  cost: number;
  baseline: { cost: number; report: ReplayReport };
  /** The recommended setting's replay of the first log. */
  best: ReplayReport;
  caution: string;
}

export async function tuneLogSources(sources: readonly LogSource[], options: TuneLogOptions = {}): Promise<TuneLogResult> {
  const result = await identifyLogNoise(sources, options);
  const spec: FilterSpec = result.recommended;
  return {
    ...result,
    criterion: 'likelihood',
    recommendedMultipliers: { qScale: spec.qScale, rScale: spec.rScale, gateScale: spec.gateScale },
    cost: result.identification.minus2LogL,
    baseline: { cost: result.identification.startMinus2LogL, report: result.currentReports[0]! },
    best: result.recommendedReports[0]!,
    caution: SAFETY_CAUTION,
  };
}

export function tuneLogSource(source: LogSource, options: TuneLogOptions = {}): Promise<TuneLogResult> {
  return tuneLogSources([source], options);
}
