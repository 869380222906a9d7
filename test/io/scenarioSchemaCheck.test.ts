// The Node side compiles the scenario schema with ajv at load time; the page bundles the same
// check generated ahead of time (ajv standalone, no eval). Both must say exactly the same.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { defaultScenario } from '../../estimator/io/defaultScenario.js';
import { ScenarioError } from '../../estimator/io/ScenarioError.js';
import { validateSchema } from '../../estimator/io/scenarioSchemaCheck.js';
import { scenarioValidatorSource, writeScenarioValidator } from '../../notebooks/scripts/buildScenarioValidator.mjs';

type Check = typeof validateSchema;

const base = () => JSON.parse(JSON.stringify(defaultScenario())) as Record<string, Record<string, unknown>>;
/** Bad scenarios touching every kind of schema message: const, type, minimum, enum, unknown key, required, lengths, nesting. */
const BAD: [string, unknown][] = [
  ['not an object', [1, 2]],
  ['wrong version, unknown top-level key', { ...base(), version: 2, colour: 'red' }],
  ['negative noise, string rate', { ...base(), detector: { ...base().detector, pixelNoise: -1, rate: '30' } }],
  ['unknown path shape', { ...base(), carrier: { ...base().carrier, path: { shape: 'spiral' } } }],
  ['missing version', (() => { const s = base(); delete s.version; return s; })()],
  ['bad vector', { ...base(), lander: { ...base().lander, startOffset: [1, 2] } }],
  ['null section', { ...base(), filter: null }],
];

let dir: string;
let generated: Check;

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'alight-schema-'));
  const file = join(dir, 'scenarioSchemaCheck.mjs');
  await writeScenarioValidator(file);
  generated = ((await import(pathToFileURL(file).href)) as { validateSchema: Check }).validateSchema;
});

afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** Messages of validateScenario with a given schema check in place of the runtime one. */
async function messagesWith(check: Check | null, raw: unknown): Promise<readonly string[]> {
  vi.resetModules();
  if (check) vi.doMock('../../estimator/io/scenarioSchemaCheck.js', () => ({ validateSchema: check }));
  else vi.doUnmock('../../estimator/io/scenarioSchemaCheck.js');
  const { validateScenario } = await import('../../estimator/io/validateScenario.js');
  const { ScenarioError: Thrown } = await import('../../estimator/io/ScenarioError.js');
  try {
    validateScenario(raw, 'bad.scenario.json');
    return [];
  } catch (error) {
    expect(error).toBeInstanceOf(Thrown);
    return (error as ScenarioError).problems;
  }
}

describe('scenario schema check: runtime ajv and the generated standalone code', () => {
  it('is plain code: no eval, no imports left after bundling', async () => {
    const { readFileSync } = await import('node:fs');
    const code = readFileSync(join(dir, 'scenarioSchemaCheck.mjs'), 'utf8');
    expect(code).not.toMatch(/\bnew Function\b|\beval\(/);
    expect(code).not.toMatch(/^\s*import\s/m);
    expect(scenarioValidatorSource()).toContain('export const validateSchema');
  });

  it('accepts the default scenario with both', () => {
    expect(validateSchema(defaultScenario())).toBe(true);
    expect(generated(defaultScenario())).toBe(true);
  });

  it('really swaps the check in (a check that refuses everything changes the messages)', async () => {
    const refuse = Object.assign(() => false, {
      errors: [{ instancePath: '/seed', schemaPath: '#', keyword: 'type', params: { type: 'string' }, message: 'x' }],
    }) as unknown as Check;
    expect(await messagesWith(refuse, defaultScenario())).toEqual(['bad.scenario.json: seed: must be string, got 1']);
  });

  for (const [name, raw] of BAD) {
    it(`gives the same errors and messages: ${name}`, async () => {
      expect(validateSchema(raw)).toBe(false);
      expect(generated(raw)).toBe(false);
      const strip = (errors: Check['errors']) => (errors ?? []).map((e) => ({ path: e.instancePath, keyword: e.keyword, params: e.params, message: e.message }));
      expect(strip(generated.errors)).toEqual(strip(validateSchema.errors));
      const runtime = await messagesWith(null, raw);
      expect(runtime.length).toBeGreaterThan(0);
      expect(await messagesWith(generated, raw)).toEqual(runtime);
    });
  }
});
