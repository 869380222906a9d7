// The studies of the page, in menu order.
import type { StudyId } from '../analysis/Analysis.js';
import { carrierStudy } from './carrierStudy.js';
import { detectionStudy } from './detectionStudy.js';
import { landingStudy } from './landingStudy.js';
import { localizationStudy } from './localizationStudy.js';
import { replayStudy } from './replayStudy.js';
import type { Study } from './Study.js';
import { testCardStudy } from './testCardStudy.js';
import { tuningStudy } from './tuningStudy.js';

export const STUDIES: readonly Study[] = [landingStudy, detectionStudy, localizationStudy, tuningStudy, carrierStudy, replayStudy, testCardStudy];

export function studyById(id: StudyId): Study {
  const study = STUDIES.find((s) => s.id === id);
  if (!study) throw new Error(`no study "${id}" in this build`);
  return study;
}
