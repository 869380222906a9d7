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

export function renderSetup(study: Study, analysis: Analysis, actions: SetupActions): HTMLElement {
  const setup = document.createElement('aside');
  setup.className = 'setup';
  setup.setAttribute('aria-label', 'Setup');
  setup.innerHTML = `<h2>Analysis</h2><div class="control"><label for="control-scenario">Scenario</label><span></span><select id="control-scenario" data-parameter="scenario"><option value="">${escapeXml(analysis.scenario.name)}</option></select></div><p class="hint scenario-description">${escapeXml(analysis.scenario.description)}</p><h2>Controls</h2>`;
  const picker = setup.querySelector<HTMLSelectElement>('#control-scenario')!;
  if (![...study.cells, ...study.figures].some((c) => c.inputs.includes('scenario'))) {
    // A study that reads flight logs flies no scenario: say so instead of offering a picker.
    picker.closest('.control')!.remove();
    setup.querySelector('.scenario-description')!.textContent = 'This study replays flight logs; the analysis carries a scenario, but nothing here flies it.';
  }
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
    const hint = setup.querySelector('.scenario-description')!;
    try {
      const text = await (await fetch(`/data-demo/${encodeURIComponent(picker.value)}`)).text();
      const scenario = parseScenario(text, picker.value);
      analysis.scenario = scenario;
      picker.options[0]!.textContent = scenario.name;
      picker.value = '';
      hint.textContent = scenario.description;
      actions.change('scenario', scenario);
    } catch (error) {
      hint.textContent = (error as Error).message;
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
  return setup;
}

