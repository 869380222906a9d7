// Light helpers shared by the study commands: error translation, shared options,
// paths relative to the working directory. Imports no simulation code.
import { statSync } from 'node:fs';
import { ScenarioError } from '../io/ScenarioError.js';
import { MAX_RESULTS_BYTES, MAX_TRIALS_PER_FILE } from '../study/studyLimits.js';
import { CliError } from './CliError.js';
import type { OptionSpec } from './parseArgs.js';


export const SEED_OPTION: OptionSpec = { name: 'seed', kind: 'value', valueName: 'S', help: 'master seed (default: the scenario\'s seed)' };
export const JSON_OPTION: OptionSpec = { name: 'json', kind: 'flag', help: 'print JSON' };
export const WORKERS_OPTION: OptionSpec = { name: 'workers', kind: 'value', valueName: 'K', help: 'worker threads (default: one per core; 1 = run in this thread)' };

const STUDY_ERRORS = new Set(['StudyLimitError', 'SweepError', 'TrialError', 'DesignError', 'ShardError', 'ResultsError', 'MergeError', 'SummaryError', 'SearchError', 'RequirementError', 'SensitivityError', 'TestCardError']);

/** Library errors are bad input or a failed study: message without stack, exit 2. */
export function asCliError(command: string, error: unknown): never {
  if (error instanceof CliError) throw error;
  if (error instanceof ScenarioError) throw new CliError(error.problems.join('\n'));
  if (error instanceof Error && STUDY_ERRORS.has(error.name)) {
    // A trial that failed by itself (not on refused input) is a defect: exit 70, like main's internal errors.
    const internal = (error as { internal?: unknown }).internal === true;
    throw new CliError(`alight ${command}: ${internal ? 'a trial failed (please report): ' : ''}${error.message}`, internal ? 70 : 2);
  }
  throw error;
}

/** Refuse a results file too large to read whole (see studyLimits.ts), before reading it. */
export function checkResultsSize(command: string, name: string, path: string): void {
  const bytes = statSync(path).size;
  if (bytes > MAX_RESULTS_BYTES) throw new CliError(`alight ${command}: ${name} is ${(bytes / 2 ** 20).toFixed(0)} MB, over the limit of ${MAX_RESULTS_BYTES / 2 ** 20} MB for a results file (a sweep writes at most ${MAX_TRIALS_PER_FILE} trials per file)`);
}

export function resolvePath(cwd: string, path: string): string {
  return path.startsWith('/') ? path : `${cwd}/${path}`;
}
