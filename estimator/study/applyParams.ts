// A sweep point's scenario: the base scenario with each varied path set (validated by setPath).
import { setPath } from '../io/scenarioPath.js';
import type { Scenario } from '../sim/Scenario.js';
import type { Params } from './sweepDesign.js';

/** @throws ScenarioError naming the path when a value is unknown or out of range. */
export function applyParams(scenario: Scenario, params: Params): Scenario {
  let s = scenario;
  for (const [path, value] of Object.entries(params)) s = setPath(s, path, value);
  return s;
}
