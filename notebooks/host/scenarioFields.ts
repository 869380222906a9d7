// The scenario form's fields, generated from the scenario's JSON Schema (scenario.schema.json):
// every number, whole number, yes/no and choice the schema describes and the scenario holds, by
// dotted path, with the schema's description, bounds and choices. Arrays, nullable sections and
// free text stay in the file (the form says so); everything the form writes goes through setPath,
// so it is validated by the same rules, with the same messages, as a scenario file.
import type { Scenario } from '../../estimator/sim/Scenario.js';

export interface SchemaNode {
  type?: string | string[];
  description?: string;
  properties?: Record<string, SchemaNode>;
  enum?: readonly unknown[];
  minimum?: number;
  maximum?: number;
  exclusiveMinimum?: number;
  exclusiveMaximum?: number;
}

export interface ScenarioField {
  /** Dotted path, e.g. "detector.pixelNoise". */
  path: string;
  /** Top-level section ("detector"), or "" for top-level fields. */
  section: string;
  kind: 'number' | 'integer' | 'boolean' | 'choice';
  value: number | boolean | string;
  description: string;
  min: number | null;
  max: number | null;
  options: readonly string[];
}

export function scenarioFields(schema: SchemaNode, scenario: Scenario): ScenarioField[] {
  const fields: ScenarioField[] = [];
  const walk = (node: SchemaNode, value: unknown, path: string): void => {
    if (node.properties && value !== null && typeof value === 'object' && !Array.isArray(value)) {
      for (const [key, child] of Object.entries(node.properties)) {
        if (!Object.prototype.hasOwnProperty.call(value, key)) continue;
        walk(child, (value as Record<string, unknown>)[key], path ? `${path}.${key}` : key);
      }
      return;
    }
    const section = path.includes('.') ? path.slice(0, path.indexOf('.')) : '';
    const base = { path, section, description: node.description ?? '', min: node.minimum ?? node.exclusiveMinimum ?? null, max: node.maximum ?? node.exclusiveMaximum ?? null, options: [] as string[] };
    if (node.enum && typeof value === 'string') fields.push({ ...base, kind: 'choice', value, options: node.enum.map(String) });
    else if (node.type === 'integer' && typeof value === 'number') fields.push({ ...base, kind: 'integer', value });
    else if (node.type === 'number' && typeof value === 'number') fields.push({ ...base, kind: 'number', value });
    else if (node.type === 'boolean' && typeof value === 'boolean') fields.push({ ...base, kind: 'boolean', value });
  };
  walk(schema, scenario, '');
  // The file's own bookkeeping is not a setting to edit here.
  return fields.filter((f) => f.path !== 'version' && f.path !== 'seed');
}
