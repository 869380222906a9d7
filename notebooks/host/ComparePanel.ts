// Browser only: the A/B comparison. "Keep as A" pins what the page shows now (analysis and final
// figures); "Compare with a file…" computes another analysis file as A in the page's workers.
// While A is pinned, every time B's figures are all final the panel shows B against A. A stays
// pinned across control changes and studies until "Stop comparing".
import { analysisToText, AnalysisError, type Analysis } from '../analysis/Analysis.js';
import { parseAnalysis } from '../analysis/parseAnalysis.js';
import type { JobRunner } from '../jobs/JobRunner.js';
import { settleFigures } from '../runtime/mountStudy.js';
import { compareOutputs } from '../studies/compareOutputs.js';
import { studyById } from '../studies/studies.js';
import type { FigureOutput } from '../studies/Study.js';
import { comparisonHtml } from './renderComparison.js';

interface Pinned {
  analysis: Analysis;
  outputs: Map<string, FigureOutput>;
  name: string;
}

export interface ShownNow {
  analysis: Analysis;
  /** Figure outputs, or null while any figure is still computing. */
  outputs: Map<string, FigureOutput> | null;
}

export class ComparePanel {
  private pinned: Pinned | null = null;
  private section: HTMLElement | null = null;

  constructor(
    private readonly runner: JobRunner,
    private readonly now: () => ShownNow,
    private readonly refuse: (message: string) => void,
  ) {}

  /** The buttons for the setup rail. */
  controls(): HTMLElement {
    const box = document.createElement('div');
    box.className = 'share compare-controls';
    const file = document.createElement('input');
    file.type = 'file';
    file.accept = '.json,application/json';
    file.hidden = true;
    file.id = 'compare-analysis';
    const add = (text: string, id: string, action: () => void): void => {
      const b = document.createElement('button');
      b.type = 'button';
      b.id = id;
      b.textContent = text;
      b.addEventListener('click', action);
      box.append(b);
    };
    add('Keep as A', 'keep-a', () => this.keep());
    add('Compare with a file…', 'compare-file', () => file.click());
    add('Stop comparing', 'stop-compare', () => {
      this.pinned = null;
      this.draw();
    });
    file.addEventListener('change', async () => {
      const chosen = file.files?.[0];
      file.value = '';
      if (chosen) await this.openAsA(chosen);
    });
    box.append(file);
    return box;
  }

  /** The panel for the study column (a fresh one per page render). */
  attach(section: HTMLElement): void {
    this.section = section;
    this.draw();
  }

  private keep(): void {
    const now = this.now();
    if (!now.outputs) return this.refuse('Keep as A waits for every figure to be final: let the run finish (or run it again) first.');
    this.pinned = { analysis: JSON.parse(analysisToText(now.analysis)) as Analysis, outputs: new Map(now.outputs), name: `the analysis kept at ${new Date().toLocaleTimeString()}` };
    this.draw();
  }

  private async openAsA(file: File): Promise<void> {
    try {
      const analysis = parseAnalysis(await file.text(), file.name, (id) => studyById(id).parameters);
      if (this.section) this.section.hidden = false;
      if (this.section) this.section.innerHTML = `<h2 id="compare-heading">A against B</h2><p class="hint">Computing ${file.name} as A…</p>`;
      const outputs = await settleFigures(studyById(analysis.study), analysis, this.runner);
      this.pinned = { analysis, outputs, name: file.name };
      this.draw();
    } catch (error) {
      this.refuse(error instanceof AnalysisError ? error.problems.join('\n') : (error as Error).message);
    }
  }

  /** Redraw (after any figure of B changed). */
  draw(): void {
    const stop = document.getElementById('stop-compare');
    if (stop) stop.hidden = this.pinned === null;
    const section = this.section;
    if (!section) return;
    section.hidden = this.pinned === null;
    if (!this.pinned) {
      section.innerHTML = '';
      return;
    }
    const now = this.now();
    if (!now.outputs) {
      section.dataset.ready = 'false';
      if (!section.querySelector('.compare-wait')) section.insertAdjacentHTML('beforeend', '<p class="hint compare-wait">B is still computing: the comparison fills in when every figure is final.</p>');
      return;
    }
    section.dataset.ready = 'true';
    section.innerHTML = comparisonHtml(this.pinned.analysis, now.analysis, compareOutputs(this.pinned.outputs, now.outputs), this.pinned.name);
  }
}
