// Load a scenario file named on the command line; its problems become a CliError (exit 2).
// Shared by the commands that take a scenario, so none of them imports another command.
import { isAbsolute, join } from 'node:path';
import { loadScenario } from '../io/loadScenario.js';
import { ScenarioError } from '../io/ScenarioError.js';
import type { Scenario } from '../sim/Scenario.js';
import { CliError } from './CliError.js';

/** @param usage shown when no file is given; default "alight <command> --help". */
export function loadScenarioForCli(command: string, path: string | undefined, cwd: string, usage = `alight ${command} --help`): Scenario {
  if (!path) throw new CliError(`alight ${command}: give a scenario file (${usage})`);
  try {
    return loadScenario(isAbsolute(path) ? path : join(cwd, path));
  } catch (error) {
    if (error instanceof ScenarioError) throw new CliError(error.problems.join('\n'));
    throw error;
  }
}
