// The JSON Schema check of a scenario (scenario.schema.json), compiled by ajv at load time.
// Node and tests use this module. The page's bundles replace it with the same check generated
// ahead of time by ajv's standalone code (notebooks/scripts/buildScenarioValidator.mjs, run by
// build.mjs), because compiling at run time needs eval, which the page's Content-Security-Policy
// forbids. Both use the options in scenarioSchemaOptions.json, so their errors are the same.
import { Ajv, type ValidateFunction } from 'ajv';
import schema from './scenario.schema.json';
import options from './scenarioSchemaOptions.json';

export const validateSchema: ValidateFunction = new Ajv(options).compile(schema);
