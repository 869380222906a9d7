// Scenario fields by dotted path ('detector.pixelNoise', 'lander.startOffset.2'): what
// sweeps vary. setPath never mutates; it returns a validated, frozen copy.
import type { Scenario } from '../sim/Scenario.js';
import { ScenarioError } from './ScenarioError.js';
import { validateScenario } from './validateScenario.js';

const isContainer = (v: unknown): v is Record<string, unknown> => v !== null && typeof v === 'object';

function unknownPath(path: string, at: string, container: unknown): ScenarioError {
  const keys = isContainer(container) ? Object.keys(container) : [];
  const hint = keys.length > 0 ? ` (${at || 'the scenario'} has: ${keys.join(', ')})` : ` (${at} is a value, not a section)`;
  return new ScenarioError('changed scenario', [`unknown scenario field "${path}"${hint}`]);
}

/**
 * The value at a dotted path.
 * @throws ScenarioError for a path that names no field.
 * @example getPath(defaultScenario(), 'detector.rate') // 30
 */
export function getPath(scenario: Scenario, path: string): unknown {
  let value: unknown = scenario;
  let at = '';
  for (const key of path.split('.')) {
    if (!isContainer(value) || !Object.prototype.hasOwnProperty.call(value, key)) throw unknownPath(path, at, value);
    value = value[key];
    at = at ? `${at}.${key}` : key;
  }
  return value;
}

/**
 * A validated copy of `scenario` with the field at `path` set to `value`.
 * @throws ScenarioError for an unknown path, or with one message per problem when the
 *   new value is out of range (`changed scenario: detector.pixelNoise: must be >= 0, got -1`).
 * @example setPath(s, 'detector.pixelNoise', 4).detector.pixelNoise // 4
 */
export function setPath(scenario: Scenario, path: string, value: unknown): Scenario {
  return setPaths(scenario, { [path]: value });
}

/**
 * A validated copy with several fields set at once, checked together — for changes that are
 * only valid jointly (e.g. filter.rate 50 with localization.imuRate 50).
 * @throws ScenarioError as setPath.
 * @example setPaths(s, { 'filter.rate': 50, 'localization.imuRate': 50 })
 */
export function setPaths(scenario: Scenario, values: Readonly<Record<string, unknown>>): Scenario {
  const copy = JSON.parse(JSON.stringify(scenario)) as Record<string, unknown>;
  for (const [path, value] of Object.entries(values)) {
    getPath(scenario, path);
    const keys = path.split('.');
    let parent: Record<string, unknown> = copy;
    for (const key of keys.slice(0, -1)) parent = parent[key] as Record<string, unknown>;
    parent[keys[keys.length - 1]!] = value;
  }
  return validateScenario(copy, 'changed scenario');
}
