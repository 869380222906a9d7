// Reads an analysis file (text) into a validated Analysis: the study id must be known, the
// scenario must pass the scenario validator, every parameter must be one the study has and
// inside its range; parameters the file omits take the study's defaults.
import { Analysis, AnalysisError, isStudyId, STUDY_IDS } from './Analysis.js';
import { JsonSyntaxError, parseJsonText } from '../../estimator/io/jsonPositions.js';
import { validateScenario } from '../../estimator/io/validateScenario.js';
import { defaultParameters, parameterProblem, type Parameter, type ParameterValue } from '../studies/Parameter.js';

/** The parameter specs of each study (passed in so this file needs no study code). */
export type ParameterLookup = (study: Analysis['study']) => readonly Parameter[];

export function parseAnalysis(text: string, fileName: string, parametersOf: ParameterLookup): Analysis {
  let raw: unknown;
  let lines: Map<string, number>;
  try {
    ({ value: raw, lines } = parseJsonText(text));
  } catch (error) {
    if (error instanceof JsonSyntaxError) throw new AnalysisError([`${fileName}:${error.line}:${error.column}: not valid JSON: ${error.message}`]);
    throw error;
  }
  // `file:line` of a field (its parent's line when the field is absent).
  const at = (path: string): string => {
    for (let p = path; ; p = p.includes('.') ? p.slice(0, p.lastIndexOf('.')) : '') {
      const line = lines.get(p);
      if (line !== undefined) return `${fileName}:${line}`;
      if (p === '') return fileName;
    }
  };
  if (raw === null || typeof raw !== 'object' || Array.isArray(raw)) {
    throw new AnalysisError([`${at('')}: an analysis file is one JSON object with study, scenario, parameters, seed, toolVersion`]);
  }
  const record = raw as Record<string, unknown>;
  const problems: string[] = [];
  const known = new Set(['study', 'scenario', 'parameters', 'seed', 'toolVersion']);
  for (const key of Object.keys(record)) if (!known.has(key)) problems.push(`${at(key)}: unknown field "${key}" (expected study, scenario, parameters, seed, toolVersion)`);

  const study = record.study;
  if (!isStudyId(study)) {
    problems.push(`${at('study')}: field "study" must be one of ${STUDY_IDS.join(', ')}, got ${JSON.stringify(study)}`);
    throw new AnalysisError(problems);
  }
  const seed = record.seed;
  if (typeof seed !== 'number' || !Number.isSafeInteger(seed) || seed < 0) {
    problems.push(`${at('seed')}: field "seed" must be a non-negative whole number, got ${JSON.stringify(seed)}`);
  }
  const toolVersion = record.toolVersion;
  if (typeof toolVersion !== 'string' || toolVersion === '') {
    problems.push(`${at('toolVersion')}: field "toolVersion" must be a version string, got ${JSON.stringify(toolVersion)}`);
  }

  let scenario: Analysis['scenario'] | null = null;
  if (record.scenario === null || typeof record.scenario !== 'object' || Array.isArray(record.scenario)) {
    problems.push(`${at('scenario')}: field "scenario" must be a scenario object`);
  } else {
    try {
      // The scenario's own lines in this file: its fields are 'scenario.<path>' here.
      const scenarioLines = new Map([...lines].filter(([p]) => p === 'scenario' || p.startsWith('scenario.')).map(([p, line]) => [p === 'scenario' ? '' : p.slice('scenario.'.length), line]));
      scenario = validateScenario(record.scenario, fileName, scenarioLines);
    } catch (error) {
      problems.push(...String((error as Error).message).split('\n').filter((line) => line.trim() !== ''));
    }
  }

  const specs = parametersOf(study);
  const parameters: Record<string, ParameterValue> = defaultParameters(specs);
  const given = record.parameters ?? {};
  if (given === null || typeof given !== 'object' || Array.isArray(given)) {
    problems.push(`${at('parameters')}: field "parameters" must be an object of control values`);
  } else {
    for (const [name, value] of Object.entries(given as Record<string, unknown>)) {
      const spec = specs.find((s) => s.name === name);
      if (!spec) {
        problems.push(`${at(`parameters.${name}`)}: parameters.${name} is not a control of the "${study}" study (it has ${specs.map((s) => s.name).join(', ')})`);
        continue;
      }
      const problem = parameterProblem(spec, value);
      if (problem) problems.push(`${at(`parameters.${name}`)}: parameters.${name} ${problem}`);
      else parameters[name] = value as ParameterValue;
    }
  }
  if (problems.length > 0 || scenario === null) throw new AnalysisError(problems);
  return { study, scenario, parameters, seed: seed as number, toolVersion: toolVersion as string };
}
