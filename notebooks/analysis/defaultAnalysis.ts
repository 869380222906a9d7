// The analysis a study opens with when the URL carries none.
import { defaultScenario } from '../../estimator/io/defaultScenario.js';
import { VERSION } from '../../estimator/version.js';
import type { Study } from '../studies/Study.js';
import { defaultParameters } from '../studies/Parameter.js';
import type { Analysis } from './Analysis.js';

export function defaultAnalysis(study: Study): Analysis {
  return { study: study.id, scenario: defaultScenario(), parameters: defaultParameters(study.parameters), seed: 1, toolVersion: VERSION };
}
