// Filter settings for a replay: the log's filter.json (what the lander flew with) over the
// default FilterSpec, then the user's --filter file over that. Both are partial FilterSpecs,
// validated by the scenario schema, so messages read `settings.json:3: qScale: must be > 0`.
// Browser-safe.
import type { FilterSpec } from '../../sim/Scenario.js';
import { JsonSyntaxError, parseJsonText } from '../jsonPositions.js';
import { ScenarioError } from '../ScenarioError.js';
import { validateScenario } from '../validateScenario.js';
import { defaultScenario } from '../defaultScenario.js';

/** Filter settings that cannot be used: one message per problem, each naming file, line and field. */
export class FilterSettingsError extends Error {
  readonly problems: readonly string[];
  constructor(problems: readonly string[]) {
    super(problems.join('\n'));
    this.name = 'FilterSettingsError';
    this.problems = problems;
  }
}

/** The FilterSpec replay uses when neither the log nor the user says otherwise. */
export function defaultFilterSpec(): FilterSpec {
  return defaultScenario().filter;
}

/**
 * Apply a partial FilterSpec (parsed JSON; `{ "filter": {...} }` accepted too) over `base`.
 * `lines` (from jsonLines of the file text) puts line numbers into messages.
 * @example applyFilterSettings(defaultFilterSpec(), { qScale: 2 }, 'settings.json').qScale // 2
 */
export function applyFilterSettings(base: FilterSpec, partial: unknown, fileName: string, lines?: ReadonlyMap<string, number>): FilterSpec {
  let body = partial;
  let prefix = '';
  if (body !== null && typeof body === 'object' && !Array.isArray(body) && 'filter' in body && Object.keys(body).length === 1) {
    body = (body as { filter: unknown }).filter;
    prefix = 'filter.';
  }
  if (body === null || typeof body !== 'object' || Array.isArray(body)) {
    throw new FilterSettingsError([`${fileName}: expected an object of filter settings (a partial FilterSpec, e.g. {"qScale": 2}), got ${JSON.stringify(body)}`]);
  }
  const scenarioLines = new Map<string, number>();
  for (const [path, line] of lines ?? []) {
    const inner = prefix === '' ? path : path.startsWith('filter') ? path.slice('filter.'.length) : null;
    if (inner !== null) scenarioLines.set(inner === '' ? 'filter' : `filter.${inner}`, line);
  }
  try {
    return { ...validateScenario({ version: 1, filter: { ...base, ...body } }, fileName, scenarioLines).filter };
  } catch (error) {
    if (!(error instanceof ScenarioError)) throw error;
    // The schema speaks of scenario paths ("filter.qScale"); the file holds only the filter part.
    throw new FilterSettingsError(error.problems.map((p) => (prefix === '' ? p.replace(/: filter\.?/, ': ').replace(/:  /, ': ') : p)));
  }
}

/** Settings file text -> FilterSpec over `base`; JSON syntax errors name line and column. */
export function parseFilterSettings(text: string, fileName: string, base: FilterSpec): FilterSpec {
  let parsed: { value: unknown; lines: Map<string, number> };
  try {
    parsed = parseJsonText(text);
  } catch (error) {
    if (error instanceof JsonSyntaxError) throw new FilterSettingsError([`${fileName}:${error.line}:${error.column}: ${error.message}`]);
    throw error;
  }
  return applyFilterSettings(base, parsed.value, fileName, parsed.lines);
}
