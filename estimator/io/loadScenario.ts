// Node-only adapter (node:fs): read a scenario file, and the CSV of a recorded carrier
// path relative to it. The browser-safe parts are parseScenario / parseRecordedPath.
import { readFileSync } from 'node:fs';
import { basename, dirname, resolve } from 'node:path';
import type { Scenario } from '../sim/Scenario.js';
import { parseRecordedPath } from './parseRecordedPath.js';
import { parseScenario } from './parseScenario.js';
import { ScenarioError } from './ScenarioError.js';
import { validateScenario } from './validateScenario.js';

export { parseScenario } from './parseScenario.js';
export { defaultScenario } from './defaultScenario.js';

function readText(path: string, reportAs: string, field?: string): string {
  try {
    return readFileSync(path, 'utf8');
  } catch (error) {
    const code = (error as { code?: string }).code ?? 'unreadable';
    throw new ScenarioError(reportAs, [`${reportAs}: ${field ? `${field}: ` : ''}cannot read ${path} (${code})`]);
  }
}

/**
 * Load and validate a scenario file. Messages name the file by its base name.
 * @throws ScenarioError (one message per problem), also for an unreadable file.
 */
export function loadScenario(path: string): Scenario {
  const name = basename(path);
  const scenario = parseScenario(readText(path, name), name);
  const carrierPath = scenario.carrier.path;
  if (carrierPath.shape !== 'recorded' || carrierPath.points !== undefined || carrierPath.file === undefined) return scenario;
  const csvPath = resolve(dirname(path), carrierPath.file);
  const points = parseRecordedPath(readText(csvPath, name, 'carrier.path.file'), basename(csvPath));
  const copy = JSON.parse(JSON.stringify(scenario)) as Scenario;
  copy.carrier.path.points = points;
  return validateScenario(copy, name);
}
