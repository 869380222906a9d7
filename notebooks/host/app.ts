// Browser entry (dist/notebooks/app.js): reads the analysis from the URL (or a study's default),
// builds the study's reactive graph with a Web Worker job runner, and lays out the page. Every
// committed control change is a history entry, so Back undoes it and recomputes only what the
// undone change touched.
import { analysisToText, AnalysisError, type Analysis } from '../analysis/Analysis.js';
import { parseAnalysis } from '../analysis/parseAnalysis.js';
import { permalinkFragment } from '../analysis/permalink.js';
import { WorkerJobRunner, type Activity } from '../jobs/WorkerJobRunner.js';
import { mountStudy, type MountedStudy } from '../runtime/mountStudy.js';
import { STUDIES, studyById } from '../studies/studies.js';
import { escapeXml } from '../figures/svg.js';
import { VERSION } from '../../estimator/version.js';
import { Plate } from './Plate.js';
import { renderSetup, type Setup } from './renderSetup.js';
import { parseScenario } from '../../estimator/io/parseScenario.js';
import { renderDropzone } from './dropzone.js';
import { readLink } from './readLink.js';
import { showControlValue } from './renderControls.js';
import { listenForPageDrops, looksLikeAnalysis, looksLikeScenario } from './pageDrop.js';
import { ProgressClock } from './ProgressClock.js';
import { showRunState } from './showRunState.js';
import { StudyProblems } from './StudyProblems.js';
import { ComparePanel } from './ComparePanel.js';
import { listenForFocusTips } from './focusTips.js';

const runner = new WorkerJobRunner('/worker.js', Math.max(1, navigator.hardwareConcurrency || 2));
let mounted: MountedStudy | null = null;
let current: Analysis | null = null;
let plates = new Map<string, Plate>();
let activity: readonly Activity[] = [];
let problems: StudyProblems | null = null;
let currentSetup: Setup | null = null;
/** The fragment the page shows now: history moves to any other one re-read the link. */
let shownFragment = '';
const clock = new ProgressClock();
const compare = new ComparePanel(
  runner,
  () => {
    const all = [...plates.values()];
    const ready = all.length > 0 && all.every((p) => p.output !== null && p.output.final && p.element.dataset.final === 'true');
    return { analysis: current!, outputs: ready ? new Map(all.map((p) => [p.name, p.output!])) : null };
  },
  (message) => problems?.show('open', message),
);

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

function updateBusy(): void {
  showRunState(activity, [...plates.values()], clock);
}

/** A committed change: a new history entry, so Back returns to the analysis before it. */
function commitToHistory(analysis: Analysis): void {
  shownFragment = permalinkFragment(analysisToText(analysis));
  history.pushState(null, '', shownFragment);
}

/** How a render meets the address bar: replace its entry, add one (Back returns), or keep it as it is. */
type Address = 'replace' | 'push' | 'keep';

function render(analysis: Analysis, problem: string | null, address: Address): void {
  mounted?.dispose();
  runner.cancelAll();
  current = analysis;
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
      // Choosing a demo log replaces a dropped folder (the select would otherwise be inert).
      if (name === 'log') mounted?.set('logFiles', null);
      commitToHistory(analysis);
      updateBusy();
    },
    cancelOrRerun: () => {
      if (activity.length > 0) runner.cancelAll();
      else mounted?.set('seed', analysis.seed); // same value, new definition: every job reruns
    },
    refuse: (message) => problems?.show('open', message),
    open: (next) => render(next, null, 'push'),
  });
  const main = document.createElement('main');
  main.className = 'study';
  main.id = 'study';
  main.innerHTML = `<h1>${escapeXml(study.title)}</h1><p class="lede">${escapeXml(study.lede)}</p>`;
  problems = new StudyProblems();
  main.querySelector('h1')!.before(problems.element);
  if (problem) problems.show('link', problem);
  else if (analysis.toolVersion !== VERSION) {
    problems.note(`This analysis was made with alight ${analysis.toolVersion}; this page is ${VERSION}, so numbers may differ from the original.`);
  }

  const comparison = document.createElement('section');
  comparison.className = 'comparison';
  comparison.setAttribute('aria-labelledby', 'compare-heading');
  main.append(comparison);
  setup.element.querySelector('.share')!.after(compare.controls());

  plates = new Map(study.figures.map((f) => [f.name, new Plate(f, study.id)]));
  let group: HTMLElement | null = null;
  for (const block of study.blocks) {
    if ('figure' in block) {
      if (!group) {
        group = document.createElement('div');
        group.className = 'plates';
        main.append(group);
      }
      group.append(plates.get(block.figure)!.element);
      continue;
    }
    group = null;
    if ('prose' in block) {
      const p = document.createElement('p');
      p.className = 'prose';
      p.textContent = block.prose;
      main.append(p);
    } else {
      main.append(renderDropzone(block.dropzone, (files) => mounted?.set('logFiles', files)));
    }
  }
  layout.append(setup.element, main);
  currentSetup = setup;
  app.append(masthead, layout);

  const figureProblem = (name: string, message: string): void => {
    // One failed job fails every figure that reads it: say it once, above the figures.
    problems?.show('compute', message);
    plates.get(name)?.fail('Not drawn: see the problem at the top of the study.');
  };
  mounted = mountStudy(study, analysis, runner, {
    figure: (name, output) => {
      if (output.failure) figureProblem(name, output.failure);
      else plates.get(name)?.update(output);
      updateBusy();
      compare.draw();
    },
    failed: (name, message) => {
      figureProblem(name, message);
      updateBusy();
    },
    pending: (name) => {
      plates.get(name)?.markPending();
      problems?.clear('compute');
      updateBusy();
    },
  });
  compare.attach(comparison);
  const graph = mounted;
  window.alight = {
    renders: () => Object.fromEntries([...plates].map(([k, p]) => [k, p.renders])),
    computeCounts: () => Object.fromEntries(graph.graph.computeCounts),
    analysisText: () => analysisToText(analysis),
  };
  // A link that could not be used stays in the address bar, so the reader can see and fix it.
  if (address === 'keep') shownFragment = location.hash;
  else if (address === 'push') commitToHistory(analysis);
  else {
    shownFragment = permalinkFragment(analysisToText(analysis));
    history.replaceState(null, '', shownFragment);
  }
  updateBusy();
}

/** Back/Forward (or an edited address): same study and scenario -> set only what differs. */
function followLocation(): void {
  if (location.hash === shownFragment) return;
  const { analysis, problem } = readLink(location.hash);
  const study = studyById(analysis.study);
  if (problem === null && current && mounted && analysis.study === current.study && JSON.stringify(analysis.scenario) === JSON.stringify(current.scenario) && analysis.toolVersion === current.toolVersion) {
    const root = document.querySelector('.setup')!;
    for (const p of study.parameters) {
      const value = analysis.parameters[p.name] ?? p.default;
      if (current.parameters[p.name] === value) continue;
      current.parameters[p.name] = value;
      showControlValue(root, p, value);
      mounted.set(p.name, value);
    }
    if (analysis.seed !== current.seed) {
      current.seed = analysis.seed;
      showControlValue(root, 'seed', analysis.seed);
      mounted.set('seed', analysis.seed);
    }
    shownFragment = location.hash;
    updateBusy();
    return;
  }
  render(analysis, problem, problem !== null ? 'keep' : 'replace');
}

async function openDroppedFile(file: File): Promise<void> {
  const text = await file.text();
  if (!looksLikeAnalysis(text)) {
    // Not an analysis: a scenario file becomes the study's own scenario, checked like the CLI checks it.
    if (/\.json$/i.test(file.name) && looksLikeScenario(text)) {
      try {
        currentSetup?.useScenario(parseScenario(text, file.name));
        problems?.clear('open');
      } catch (error) {
        problems?.show('open', (error as Error).message);
      }
      return;
    }
    problems?.show('open', `${file.name} is neither an analysis file (a JSON object with study, scenario, parameters, seed and toolVersion) nor a scenario file, so it was not opened.`);
    return;
  }
  try {
    render(parseAnalysis(text, file.name, (id) => studyById(id).parameters), null, 'push');
  } catch (error) {
    problems?.show('open', error instanceof AnalysisError ? error.problems.join('\n') : (error as Error).message);
  }
}

runner.onActivity((list) => {
  activity = list;
  updateBusy();
});
window.addEventListener('popstate', followLocation);
window.addEventListener('hashchange', followLocation);
listenForPageDrops((file) => void openDroppedFile(file));
listenForFocusTips();
const first = readLink(location.hash);
render(first.analysis, first.problem, first.problem !== null ? 'keep' : 'replace');
