// Scenario text -> validated, frozen Scenario. Browser-safe; the Node file reader is
// loadScenario.ts. Bad JSON is reported with file, line and column; schema and cross-field
// problems one per line with file, line, column and field path (see validateScenario).
import type { Scenario } from '../sim/Scenario.js';
import { JsonSyntaxError, parseJsonText } from './jsonPositions.js';
import { ScenarioError } from './ScenarioError.js';
import { validateScenario } from './validateScenario.js';

/**
 * Parse and validate a scenario file's text. A recorded carrier path named by `file`
 * keeps `points` undefined here; loadScenario (Node) reads the CSV into it.
 * @throws ScenarioError — one message per problem, e.g.
 *   `rover.scenario.json:14:19: detector.pixelNoise: must be >= 0, got -1`.
 */
export function parseScenario(text: string, fileName: string): Scenario {
  let parsed: { value: unknown; lines: Map<string, number>; columns: Map<string, number> };
  try {
    parsed = parseJsonText(text);
  } catch (error) {
    if (error instanceof JsonSyntaxError) {
      throw new ScenarioError(fileName, [`${fileName}:${error.line}:${error.column}: not valid JSON: ${error.message}`]);
    }
    throw error;
  }
  return validateScenario(parsed.value, fileName, parsed.lines, parsed.columns);
}
