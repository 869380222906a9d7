// Browser entry (dist/notebooks/app.js): reads the analysis from the URL (or a study's default),
// builds the study's reactive graph with a Web Worker job runner, and lays out the page.
import { analysisToText, AnalysisError, isStudyId, type Analysis } from '../analysis/Analysis.js';
import { defaultAnalysis } from '../analysis/defaultAnalysis.js';
import { parseAnalysis } from '../analysis/parseAnalysis.js';
import { analysisTextFromFragment, permalinkFragment } from '../analysis/permalink.js';
import { WorkerJobRunner, type Activity } from '../jobs/WorkerJobRunner.js';
import { mountStudy, type MountedStudy } from '../runtime/mountStudy.js';
import { STUDIES, studyById } from '../studies/studies.js';
import { escapeXml } from '../figures/svg.js';
import { VERSION } from '../../estimator/version.js';
import { Plate } from './Plate.js';
import { renderSetup } from './renderSetup.js';
import { renderDropzone } from './dropzone.js';

const runner = new WorkerJobRunner('/worker.js', Math.min(2, navigator.hardwareConcurrency || 2));
let mounted: MountedStudy | null = null;
let plates = new Map<string, Plate>();
let activity: readonly Activity[] = [];

/** Read by the browser tests and handy in the console. */
interface PageProbe {
  renders(): Record<string, number>;
  computeCounts(): Record<string, number>;
  analysisText(): string;
}
declare global {
  interface Window {
    alight?: PageProbe;
  }
}

function analysisFromLocation(): { analysis: Analysis; problem: string | null } {
  const fragment = location.hash;
  try {
    const text = analysisTextFromFragment(fragment);
    if (text !== null) return { analysis: parseAnalysis(text, 'the link', (id) => studyById(id).parameters), problem: null };
  } catch (error) {
    const problem = error instanceof AnalysisError ? error.problems.join('\n') : (error as Error).message;
    return { analysis: defaultAnalysis(STUDIES[0]!), problem: `This link's analysis could not be used:\n${problem}` };
  }
  const match = /^#study=([a-z-]+)$/.exec(fragment);
  const id = match?.[1];
  return { analysis: defaultAnalysis(isStudyId(id) ? studyById(id) : STUDIES[0]!), problem: null };
}

function updateBusy(): void {
  const busy = activity.length > 0 || [...plates.values()].some((p) => p.element.dataset.final !== 'true');
  const cancelled = [...plates.values()].some((p) => p.output?.status.startsWith('cancelled'));
  document.body.dataset.state = busy ? 'busy' : 'idle';
  const bar = document.querySelector<HTMLElement>('.progress > div');
  const line = document.querySelector<HTMLElement>('.run-text');
  const button = document.querySelector<HTMLButtonElement>('#cancel');
  const done = activity.reduce((s, a) => s + a.done, 0);
  const total = activity.reduce((s, a) => s + a.total, 0);
  document.querySelector('.progress')?.setAttribute('aria-valuenow', String(activity.length === 0 ? (cancelled ? 0 : 100) : total > 0 ? Math.round((100 * done) / total) : 0));
  if (bar) bar.style.width = activity.length === 0 ? (cancelled ? '0%' : '100%') : `${total > 0 ? (100 * done) / total : 2}%`;
  if (line) line.textContent = activity.length > 0 ? `${activity.map((a) => a.label).join(', ')}: ${done} of ${total || '…'}` : cancelled ? 'cancelled: partial results shown' : 'all results in';
  if (button) {
    // While jobs run the button cancels them; after a cancel it runs the study again.
    button.textContent = activity.length === 0 && cancelled ? 'Run again' : 'Cancel';
    button.disabled = activity.length === 0 && !cancelled;
  }
}

function setPermalink(analysis: Analysis): void {
  history.replaceState(null, '', permalinkFragment(analysisToText(analysis)));
}

function render(analysis: Analysis, problem: string | null): void {
  mounted?.dispose();
  runner.cancelAll();
  const study = studyById(analysis.study);
  const app = document.getElementById('app')!;
  app.innerHTML = '';
  document.title = `${study.title} · alight`;

  const masthead = document.createElement('header');
  masthead.className = 'masthead';
  masthead.innerHTML = `<div class="wordmark">alight<small>landing studies</small></div><nav aria-label="Studies"><ul class="studies">${STUDIES.map(
    (s) => `<li><a href="#study=${s.id}"${s.id === study.id ? ' aria-current="page"' : ''}>${escapeXml(s.title)}</a></li>`,
  ).join('')}</ul></nav>`;

  const layout = document.createElement('div');
  layout.className = 'layout';
  const setup = renderSetup(study, analysis, {
    change: (name, value) => {
      mounted?.set(name, value);
      setPermalink(analysis);
      updateBusy();
    },
    cancelOrRerun: () => {
      if (activity.length > 0) runner.cancelAll();
      else mounted?.set('seed', analysis.seed); // same value, new definition: every job reruns
    },
    refuse: (message) => render(analysis, message),
  });
  const article = document.createElement('article');
  article.className = 'study';
  article.innerHTML = `<h1>${escapeXml(study.title)}</h1><p class="lede">${escapeXml(study.lede)}</p>`;
  if (problem) article.insertAdjacentHTML('afterbegin', `<p class="message" role="alert">${escapeXml(problem)}</p>`);
  else if (analysis.toolVersion !== VERSION) {
    article.insertAdjacentHTML('afterbegin', `<p class="message">This analysis was made with alight ${escapeXml(analysis.toolVersion)}; this page is ${VERSION}, so numbers may differ from the original.</p>`);
  }

  plates = new Map(study.figures.map((f) => [f.name, new Plate(f, study.id)]));
  let group: HTMLElement | null = null;
  for (const block of study.blocks) {
    if ('figure' in block) {
      if (!group) {
        group = document.createElement('div');
        group.className = 'plates';
        article.append(group);
      }
      group.append(plates.get(block.figure)!.element);
      continue;
    }
    group = null;
    if ('prose' in block) {
      const p = document.createElement('p');
      p.className = 'prose';
      p.textContent = block.prose;
      article.append(p);
    } else {
      article.append(renderDropzone(block.dropzone, (files) => mounted?.set('logFiles', files)));
    }
  }
  layout.append(setup, article);
  app.append(masthead, layout);

  mounted = mountStudy(study, analysis, runner, {
    figure: (name, output) => {
      plates.get(name)?.update(output);
      updateBusy();
    },
    failed: (name, message) => {
      plates.get(name)?.fail(message);
      updateBusy();
    },
    pending: (name) => {
      plates.get(name)?.markPending();
      updateBusy();
    },
  });
  const current = mounted;
  window.alight = {
    renders: () => Object.fromEntries([...plates].map(([k, p]) => [k, p.renders])),
    computeCounts: () => Object.fromEntries(current.graph.computeCounts),
    analysisText: () => analysisToText(analysis),
  };
  setPermalink(analysis);
  updateBusy();
}

runner.onActivity((list) => {
  activity = list;
  updateBusy();
});
window.addEventListener('hashchange', () => {
  const { analysis, problem } = analysisFromLocation();
  render(analysis, problem);
});
const first = analysisFromLocation();
render(first.analysis, first.problem);
