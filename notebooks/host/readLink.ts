// What a page address asks for: an analysis in the fragment, a study by id, or nothing. A link
// that cannot be used still opens the study it was meant for (when it names one) with the problem
// said in words; the caller keeps the address as it is, so the broken link is not lost.
import { AnalysisError, isStudyId, STUDY_IDS, type Analysis, type StudyId } from '../analysis/Analysis.js';
import { defaultAnalysis } from '../analysis/defaultAnalysis.js';
import { parseAnalysis } from '../analysis/parseAnalysis.js';
import { analysisTextFromFragment, PermalinkError, studyNamedIn } from '../analysis/permalink.js';
import { STUDIES, studyById } from '../studies/studies.js';

export interface LinkReading {
  analysis: Analysis;
  /** Null when the link was used as it is; otherwise why it was not (the page shows it on `analysis.study`). */
  problem: string | null;
}

function fallback(hint: string | null, problem: string): LinkReading {
  const study = isStudyId(hint) ? studyById(hint) : STUDIES[0]!;
  return { analysis: defaultAnalysis(study), problem };
}

export function readLink(fragment: string): LinkReading {
  if (fragment === '' || fragment === '#') return { analysis: defaultAnalysis(STUDIES[0]!), problem: null };
  let text: string | null;
  try {
    text = analysisTextFromFragment(fragment);
  } catch (error) {
    const hint = error instanceof PermalinkError ? error.studyHint : null;
    return fallback(hint, `This link's analysis could not be used: ${(error as Error).message}. The study opens with its defaults; the link is kept in the address bar.`);
  }
  if (text !== null) {
    try {
      return { analysis: parseAnalysis(text, 'the link', (id) => studyById(id).parameters), problem: null };
    } catch (error) {
      const problem = error instanceof AnalysisError ? error.problems.join('\n') : (error as Error).message;
      return fallback(studyNamedIn(text), `This link's analysis could not be used:\n${problem}`);
    }
  }
  const study = /^#study=(.*)$/.exec(fragment);
  if (study) {
    let id = study[1]!;
    try {
      id = decodeURIComponent(id);
    } catch {
      // A malformed escape: show the text as it stands.
    }
    if (isStudyId(id)) return { analysis: defaultAnalysis(studyById(id as StudyId)), problem: null };
    return fallback(null, `This link asks for a study named ${JSON.stringify(id)}, and there is none: the studies are ${STUDY_IDS.join(', ')}.`);
  }
  return fallback(null, `This link's address ends in ${JSON.stringify(fragment.slice(0, 60))}, which names neither a study (#study=…) nor an analysis (#analysis=…).`);
}
