// The analysis file: the whole state of a study, enough to reproduce every number and
// figure in the browser and in `alight report`. JSON, one object:
//   { "study": "detection", "scenario": {...}, "parameters": {...}, "seed": 7, "toolVersion": "0.1.0" }
// `scenario` is a full scenario (as `alight simulate` reads); `parameters` are the study's
// controls by name; `seed` is the master seed every trial's random streams derive from.
import type { Scenario } from '../../estimator/sim/Scenario.js';
import type { ParameterValue } from '../studies/Parameter.js';

export const STUDY_IDS = ['landing', 'detection', 'localization', 'tuning', 'carrier', 'replay', 'test-card'] as const;
export type StudyId = (typeof STUDY_IDS)[number];

export interface Analysis {
  study: StudyId;
  scenario: Scenario;
  parameters: Record<string, ParameterValue>;
  seed: number;
  toolVersion: string;
}

/** An analysis file that cannot be used; `problems` name the file and each field. */
export class AnalysisError extends Error {
  readonly problems: readonly string[];
  constructor(problems: readonly string[]) {
    super(problems.join('\n'));
    this.name = 'AnalysisError';
    this.problems = problems;
  }
}

export function isStudyId(value: unknown): value is StudyId {
  return typeof value === 'string' && (STUDY_IDS as readonly string[]).includes(value);
}

/** Stable text form: two-space JSON with keys in the documented order, newline-terminated. */
export function analysisToText(analysis: Analysis): string {
  const { study, scenario, parameters, seed, toolVersion } = analysis;
  return JSON.stringify({ study, scenario, parameters, seed, toolVersion }, null, 2) + '\n';
}
