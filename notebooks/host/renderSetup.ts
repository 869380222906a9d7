// Browser only: the setup rail: scenario picker, the study's controls and the seed, the run
// line (progress, cancel / run again) and the sharing buttons (link, download, upload).
import { parseScenario } from '../../estimator/io/parseScenario.js';
import { analysisToText, AnalysisError, type Analysis } from '../analysis/Analysis.js';
import { parseAnalysis } from '../analysis/parseAnalysis.js';
import { escapeXml } from '../figures/svg.js';
import { studyById } from '../studies/studies.js';
import type { Study } from '../studies/Study.js';
import { downloadText } from './download.js';
import { SAFETY_CAUTION } from '../../estimator/safetyCaution.js';
import { renderControl, renderSeed } from './renderControls.js';
import { renderScenarioForm } from './renderScenarioForm.js';
import type { Scenario } from '../../estimator/sim/Scenario.js';

export interface SetupActions {
  /** A graph input changed (parameter, seed or scenario); the analysis object is already updated. */
  change(name: string, value: unknown): void;
  /** The run button: cancel running jobs, or after a cancel run everything again. */
  cancelOrRerun(): void;
  /** An uploaded analysis file was refused: show why. */
  refuse(message: string): void;
  /** An uploaded analysis file was read: show it (a new history entry). */
  open(analysis: Analysis): void;
}

export interface Setup {
  element: HTMLElement;
  /** Replace the analysis's scenario (a demo picked, a file opened or dropped, a field edited). */
  useScenario(scenario: Scenario): void;
}

/** Does this study fly the analysis's scenario (the replay study reads logs instead)? */
export function fliesScenario(study: Study): boolean {
  return [...study.cells, ...study.figures].some((c) => c.inputs.includes('scenario'));
}

export function renderSetup(study: Study, analysis: Analysis, actions: SetupActions): Setup {
  const setup = document.createElement('aside');
  setup.className = 'setup';
  setup.setAttribute('aria-label', 'Setup');
  setup.innerHTML = `<h2>Analysis</h2><div class="control"><label for="control-scenario">Scenario</label><span></span><select id="control-scenario" data-parameter="scenario"><option value="">${escapeXml(analysis.scenario.name)}</option></select></div><p class="hint scenario-description">${escapeXml(analysis.scenario.description)}</p>`;
  const picker = setup.querySelector<HTMLSelectElement>('#control-scenario')!;
  const hint = setup.querySelector<HTMLElement>('.scenario-description')!;
  const scenarioSaid = document.createElement('p');
  scenarioSaid.className = 'field-problem';
  scenarioSaid.id = 'scenario-problem';
  scenarioSaid.setAttribute('role', 'alert');
  scenarioSaid.hidden = true;
  let form: HTMLElement | null = null;
  const useScenario = (scenario: Scenario): void => {
    analysis.scenario = scenario;
    picker.options[0]!.textContent = scenario.name;
    picker.value = '';
    hint.textContent = scenario.description;
    scenarioSaid.hidden = true;
    const next = renderScenarioForm(scenario, (edited) => {
      analysis.scenario = edited;
      actions.change('scenario', edited);
    });
    form?.replaceWith(next);
    form = next;
    actions.change('scenario', scenario);
  };
  const refuseScenario = (message: string): void => {
    scenarioSaid.textContent = message;
    scenarioSaid.hidden = false;
  };
  if (!fliesScenario(study)) {
    // A study that reads flight logs flies no scenario: say so instead of offering a picker.
    picker.closest('.control')!.remove();
    hint.textContent = 'This study replays flight logs; the analysis carries a scenario, but nothing here flies it.';
  } else {
    // An own scenario file, checked by the same validator with the same file:line messages as the CLI.
    const file = document.createElement('input');
    file.type = 'file';
    file.accept = '.json,application/json';
    file.hidden = true;
    file.id = 'open-scenario-file';
    file.addEventListener('change', async () => {
      const chosen = file.files?.[0];
      file.value = '';
      if (!chosen) return;
      try {
        useScenario(parseScenario(await chosen.text(), chosen.name));
      } catch (error) {
        refuseScenario((error as Error).message);
      }
    });
    const open = document.createElement('button');
    open.type = 'button';
    open.id = 'open-scenario';
    open.textContent = 'Open scenario file…';
    open.addEventListener('click', () => file.click());
    form = renderScenarioForm(analysis.scenario, (edited) => {
      analysis.scenario = edited;
      actions.change('scenario', edited);
    });
    setup.append(open, file, scenarioSaid, form);
  }
  setup.insertAdjacentHTML('beforeend', '<h2>Controls</h2>');
  // The demo scenarios the server offers; picking one replaces the analysis's scenario.
  fetch('/data-demo/scenarios.json')
    .then((r) => (r.ok ? (r.json() as Promise<string[]>) : []))
    .then((names) => {
      for (const name of names) {
        const o = document.createElement('option');
        o.value = name;
        o.textContent = `demo: ${name.replace(/\.scenario\.json$/, '')}`;
        picker.append(o);
      }
    }, () => {});
  picker.addEventListener('change', async () => {
    if (picker.value === '') return;
    try {
      const text = await (await fetch(`/data-demo/${encodeURIComponent(picker.value)}`)).text();
      useScenario(parseScenario(text, picker.value));
    } catch (error) {
      refuseScenario((error as Error).message);
    }
  });
  const change = (name: string, value: unknown): void => {
    if (name === 'seed') analysis.seed = value as number;
    else analysis.parameters[name] = value as string | number;
    actions.change(name, value);
  };
  for (const p of study.parameters) setup.append(renderControl(p, analysis.parameters[p.name] ?? p.default, (v) => change(p.name, v)));
  setup.append(renderSeed(analysis.seed, (seed) => change('seed', seed)));

  setup.insertAdjacentHTML('beforeend', `<h2>Run</h2><div class="progress" role="progressbar" aria-label="Trials done" aria-valuemin="0" aria-valuemax="100" aria-valuenow="0"><div></div></div><div class="run-line"><span class="run-text" aria-live="polite"></span><button type="button" id="cancel">Cancel</button></div><h2>Share</h2>`);
  setup.querySelector('#cancel')!.addEventListener('click', actions.cancelOrRerun);
  const share = document.createElement('div');
  share.className = 'share';
  const button = (text: string, id: string, action: () => void): void => {
    const b = document.createElement('button');
    b.type = 'button';
    b.id = id;
    b.textContent = text;
    b.addEventListener('click', action);
    share.append(b);
  };
  button('Copy link', 'copy-link', () => {
    const said = setup.querySelector<HTMLElement>('.share-said')!;
    const clipboard = navigator.clipboard;
    if (!clipboard) {
      said.textContent = 'This browser gives the page no clipboard: copy the address bar instead.';
      return;
    }
    clipboard.writeText(location.href).then(
      () => (said.textContent = `Link copied (${location.href.length} characters): it holds the whole analysis.`),
      () => (said.textContent = 'The browser refused the clipboard: copy the address bar instead.'),
    );
  });
  button('Download analysis', 'download-analysis', () => downloadText(analysisToText(analysis), `${study.id}-analysis.json`, 'application/json'));
  const upload = document.createElement('input');
  upload.type = 'file';
  upload.accept = '.json,application/json';
  upload.hidden = true;
  upload.id = 'upload-analysis';
  upload.addEventListener('change', async () => {
    const file = upload.files?.[0];
    upload.value = ''; // the same file chosen again is a new choice
    if (!file) return;
    try {
      actions.open(parseAnalysis(await file.text(), file.name, (id) => studyById(id).parameters));
    } catch (error) {
      actions.refuse(error instanceof AnalysisError ? error.problems.join('\n') : (error as Error).message);
    }
  });
  button('Open analysis…', 'open-analysis', () => upload.click());
  setup.append(share, upload);
  setup.insertAdjacentHTML('beforeend', '<p class="hint share-said" role="status" aria-live="polite"></p>');
  setup.insertAdjacentHTML(
    'beforeend',
    `<p class="hint">The link holds the whole analysis. Headless: <code>alight report ${study.id}-analysis.json --out report.html</code></p><p class="caution">${escapeXml(SAFETY_CAUTION)}</p>`,
  );
  return { element: setup, useScenario: (scenario) => (fliesScenario(study) ? useScenario(scenario) : refuseScenario('This study flies no scenario.')) };
}

