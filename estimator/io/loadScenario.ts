// Node-only adapter (node:fs): read a scenario file, and the CSV of a recorded carrier
// path relative to it. The browser-safe parts are parseScenario / parseRecordedPath.
import { readFileSync, statSync } from 'node:fs';
import { basename, dirname, resolve } from 'node:path';
import type { Scenario } from '../sim/Scenario.js';
import { parseRecordedPath } from './parseRecordedPath.js';
import { parseScenario } from './parseScenario.js';
import { jsonLines } from './jsonPositions.js';
import { ScenarioError } from './ScenarioError.js';
import { validateScenario } from './validateScenario.js';

export { parseScenario } from './parseScenario.js';
export { defaultScenario } from './defaultScenario.js';

/** Largest scenario file read (a scenario is a few kB; inline recorded points make it larger). */
export const MAX_SCENARIO_BYTES = 16 * 1024 * 1024;

function sizeOf(path: string): number {
  try {
    return statSync(path).size;
  } catch {
    return 0; // readText names the real problem
  }
}

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
  const size = sizeOf(path);
  if (size > MAX_SCENARIO_BYTES) throw new ScenarioError(name, [`${name}: ${size} bytes is over the limit of ${MAX_SCENARIO_BYTES} for a scenario file (put a long recorded path in its own CSV file)`]);
  const text = readText(path, name);
  const scenario = parseScenario(text, name);
  const carrierPath = scenario.carrier.path;
  if (carrierPath.shape !== 'recorded' || carrierPath.points !== undefined || carrierPath.file === undefined) return scenario;
  // Problems in the CSV name the scenario line that points to it, then the CSV line.
  const where = `${name}:${jsonLines(text).get('carrier.path.file') ?? 1}`;
  const csvPath = resolve(dirname(path), carrierPath.file);
  let points: number[][];
  try {
    points = parseRecordedPath(readText(csvPath, where, 'carrier.path.file'), basename(csvPath));
  } catch (error) {
    if (error instanceof ScenarioError && error.fileName !== where) throw new ScenarioError(name, error.problems.map((p) => `${where}: carrier.path.file: ${p}`));
    throw error;
  }
  const copy = JSON.parse(JSON.stringify(scenario)) as Scenario;
  copy.carrier.path.points = points;
  return validateScenario(copy, name);
}
