import { describe, expect, it } from 'vitest';
import { defaultScenario } from '../../estimator/io/defaultScenario.js';
import schema from '../../estimator/io/scenario.schema.json';
import { validateScenario } from '../../estimator/io/validateScenario.js';

type Node = { properties?: Record<string, Node>; default?: unknown };

/** Every "default" keyword in the published schema, by dotted path. */
function schemaDefaults(node: Node, path: string, out: Map<string, unknown>): Map<string, unknown> {
  if ('default' in node) out.set(path, node.default);
  for (const [key, child] of Object.entries(node.properties ?? {})) schemaDefaults(child, path ? `${path}.${key}` : key, out);
  return out;
}

describe('defaultScenario', () => {
  it('passes its own validation unchanged', () => {
    expect(validateScenario(defaultScenario(), 'default')).toEqual(defaultScenario());
  });

  it('is what the published schema documents as defaults, field by field', () => {
    const defaults = schemaDefaults(schema as Node, '', new Map());
    expect(defaults.size).toBeGreaterThan(100);
    const scenario = defaultScenario() as unknown as Record<string, unknown>;
    for (const [path, value] of defaults) {
      const actual = path.split('.').reduce<unknown>((v, k) => (v as Record<string, unknown>)?.[k], scenario);
      expect(actual, path).toEqual(value);
    }
  });

  it('returns a fresh object each call', () => {
    const a = defaultScenario();
    a.detector.rate = 5;
    expect(defaultScenario().detector.rate).toBe(30);
  });
});
