// The unit of a scenario field, read from its description in scenario.schema.json (the one
// place units are written down), so outputs can print "0.12 s" rather than a bare number.
import schema from './scenario.schema.json';

interface SchemaNode {
  description?: string;
  properties?: Record<string, SchemaNode>;
}

/** Tokens accepted as units: short, no spaces (so "(fraction of size, ...)" gives none). */
const UNIT = /^(?:[a-zA-Z]{1,4}(?:\/[a-zA-Z]{1,4})?(?:\^2)?)$/;

/**
 * The unit of the field at a dotted path, '' when it has none or the path is unknown.
 * A key ending in Deg is in degrees.
 * @example scenarioUnit('detector.latency') // 's'
 * @example scenarioUnit('detector.dropout') // ''
 */
export function scenarioUnit(path: string): string {
  if (/Deg$/.test(path)) return 'deg';
  let node: SchemaNode | undefined = schema as SchemaNode;
  for (const key of path.split('.')) node = node?.properties?.[key];
  const inside = /\(([^,;)]+)/.exec(node?.description ?? '');
  const token = inside?.[1]?.trim() ?? '';
  return UNIT.test(token) ? token : '';
}
