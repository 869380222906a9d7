// Reads an analysis file (text) into a validated Analysis: the study id must be known, the
// scenario must pass the scenario validator, every parameter must be one the study has and
// inside its range; parameters the file omits take the study's defaults.
import { Analysis, AnalysisError, isStudyId, STUDY_IDS } from './Analysis.js';
import { parseScenario } from '../../estimator/io/parseScenario.js';
import { defaultParameters, parameterProblem, type Parameter, type ParameterValue } from '../studies/Parameter.js';

/** The parameter specs of each study (passed in so this file needs no study code). */
export type ParameterLookup = (study: Analysis['study']) => readonly Parameter[];

export function parseAnalysis(text: string, fileName: string, parametersOf: ParameterLookup): Analysis {
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch (error) {
    throw new AnalysisError([`${fileName}: not valid JSON (${(error as Error).message})`]);
  }
  if (raw === null || typeof raw !== 'object' || Array.isArray(raw)) {
    throw new AnalysisError([`${fileName}: an analysis file is one JSON object with study, scenario, parameters, seed, toolVersion`]);
  }
  const record = raw as Record<string, unknown>;
  const problems: string[] = [];
  const known = new Set(['study', 'scenario', 'parameters', 'seed', 'toolVersion']);
  for (const key of Object.keys(record)) if (!known.has(key)) problems.push(`${fileName}: unknown field "${key}"`);

  const study = record.study;
  if (!isStudyId(study)) {
    problems.push(`${fileName}: field "study" must be one of ${STUDY_IDS.join(', ')}, got ${JSON.stringify(study)}`);
    throw new AnalysisError(problems);
  }
  const seed = record.seed;
  if (typeof seed !== 'number' || !Number.isSafeInteger(seed) || seed < 0) {
    problems.push(`${fileName}: field "seed" must be a non-negative whole number, got ${JSON.stringify(seed)}`);
  }
  const toolVersion = record.toolVersion;
  if (typeof toolVersion !== 'string' || toolVersion === '') {
    problems.push(`${fileName}: field "toolVersion" must be a version string, got ${JSON.stringify(toolVersion)}`);
  }

  let scenario: Analysis['scenario'] | null = null;
  if (record.scenario === null || typeof record.scenario !== 'object' || Array.isArray(record.scenario)) {
    problems.push(`${fileName}: field "scenario" must be a scenario object`);
  } else {
    try {
      scenario = parseScenario(JSON.stringify(record.scenario), `${fileName} (field "scenario")`);
    } catch (error) {
      problems.push(...String((error as Error).message).split('\n').filter((line) => line.trim() !== ''));
    }
  }

  const specs = parametersOf(study);
  const parameters: Record<string, ParameterValue> = defaultParameters(specs);
  const given = record.parameters ?? {};
  if (given === null || typeof given !== 'object' || Array.isArray(given)) {
    problems.push(`${fileName}: field "parameters" must be an object of control values`);
  } else {
    for (const [name, value] of Object.entries(given as Record<string, unknown>)) {
      const spec = specs.find((s) => s.name === name);
      if (!spec) {
        problems.push(`${fileName}: parameters.${name} is not a control of the "${study}" study (it has ${specs.map((s) => s.name).join(', ')})`);
        continue;
      }
      const problem = parameterProblem(spec, value);
      if (problem) problems.push(`${fileName}: parameters.${name} ${problem}`);
      else parameters[name] = value as ParameterValue;
    }
  }
  if (problems.length > 0 || scenario === null) throw new AnalysisError(problems);
  return { study, scenario, parameters, seed: seed as number, toolVersion: toolVersion as string };
}
