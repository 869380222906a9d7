import { describe, expect, it } from 'vitest';
import schema from '../../../estimator/io/scenario.schema.json';
import { defaultScenario } from '../../../estimator/io/defaultScenario.js';
import { scenarioFields, type SchemaNode } from '../../../notebooks/host/scenarioFields.js';

describe('scenarioFields', () => {
  const fields = scenarioFields(schema as SchemaNode, defaultScenario());
  const byPath = new Map(fields.map((f) => [f.path, f]));

  it('offers the numbers, choices and switches the schema describes, with its bounds and words', () => {
    expect(byPath.get('detector.pixelNoise')).toMatchObject({ kind: 'number', section: 'detector', value: defaultScenario().detector.pixelNoise, min: 0, description: 'Box centre noise (px, 1 sigma).' });
    expect(byPath.get('detector.dropout')).toMatchObject({ kind: 'number', min: 0, max: 1 });
    expect(byPath.get('camera.width')).toMatchObject({ kind: 'integer', min: 16, max: 20000 });
    expect(byPath.get('filter.cameraUpdate')).toMatchObject({ kind: 'choice', options: ['tight', 'loose'] });
    expect(byPath.get('guidance.feedForward')).toMatchObject({ kind: 'boolean' });
  });

  it('leaves arrays, the version and the scenario seed to the file', () => {
    expect(byPath.has('lander.startOffset')).toBe(false);
    expect(byPath.has('version')).toBe(false);
    expect(byPath.has('seed')).toBe(false);
    expect(fields.every((f) => !f.path.includes('startOffset'))).toBe(true);
    expect(fields.length).toBeGreaterThan(60);
  });
});
