// Browser only: one figure on the page. Counts its redraws (data-renders) so a reader, and the
// browser tests, can see that a control redrew only what depends on it. Exports SVG, PNG, CSV.
import type { FigureOutput, StudyFigure } from '../studies/Study.js';
import { downloadBlob, downloadText, svgToPng } from './download.js';
import { escapeXml } from '../figures/svg.js';
import { withCaptions } from '../studies/figureOutput.js';

export class Plate {
  readonly element: HTMLElement;
  renders = 0;
  output: FigureOutput | null = null;
  private readonly body: HTMLElement;
  private readonly numbers: HTMLElement;
  private readonly status: HTMLElement;
  private readonly exports: HTMLElement;

  /** The figure's name in its study (the key of its outputs). */
  get name(): string {
    return this.figure.name;
  }

  constructor(private readonly figure: StudyFigure, private readonly filePrefix: string) {
    const element = document.createElement('figure');
    element.className = figure.wide ? 'plate wide' : 'plate';
    element.dataset.figure = figure.name;
    element.dataset.renders = '0';
    element.dataset.final = 'false';
    element.innerHTML = `<header><h3>${escapeXml(figure.title)}</h3><p>${escapeXml(figure.caption)}</p></header>`;
    this.body = document.createElement('div');
    this.body.className = 'plate-body';
    this.body.textContent = 'waiting for results…';
    this.numbers = document.createElement('dl');
    this.numbers.className = 'numbers';
    const foot = document.createElement('div');
    foot.className = 'plate-foot';
    this.status = document.createElement('span');
    this.status.className = 'status';
    this.exports = document.createElement('span');
    this.exports.className = 'exports';
    foot.append(this.status, this.exports);
    element.append(this.body, this.numbers, foot);
    this.element = element;
  }

  update(output: FigureOutput): void {
    this.renders++;
    this.output = output;
    this.element.dataset.renders = String(this.renders);
    this.element.dataset.final = String(output.final);
    this.body.innerHTML = withCaptions(output.markup, this.figure.title);
    this.numbers.innerHTML = output.numbers
      .map((n) => `<div><dt>${escapeXml(n.label)}</dt><dd data-key="${escapeXml(n.key)}" data-value="${n.value === null ? '' : String(n.value)}">${escapeXml(n.text)}</dd></div>`)
      .join('');
    this.status.textContent = output.status;
    this.renderExports(output);
  }

  fail(message: string): void {
    this.renders++;
    this.element.dataset.renders = String(this.renders);
    this.element.dataset.final = 'true';
    this.body.innerHTML = `<p class="message">${escapeXml(message)}</p>`;
    this.numbers.innerHTML = '';
    this.status.textContent = 'failed';
    this.exports.innerHTML = '';
  }

  markPending(): void {
    this.element.dataset.final = 'false';
  }

  private renderExports(output: FigureOutput): void {
    this.exports.innerHTML = '';
    const name = `${this.filePrefix}-${this.figure.name}`;
    const add = (text: string, title: string, action: () => void): void => {
      const b = document.createElement('button');
      b.type = 'button';
      b.textContent = text;
      b.title = title;
      b.addEventListener('click', action);
      this.exports.append(b);
    };
    if (output.kind === 'svg') {
      add('SVG', `Save ${this.figure.title} as SVG`, () => downloadText(output.markup, `${name}.svg`, 'image/svg+xml'));
      add('PNG', `Save ${this.figure.title} as PNG`, () => {
        svgToPng(output.markup).then((blob) => downloadBlob(blob, `${name}.png`), (error: Error) => (this.status.textContent = error.message));
      });
    }
    const attachment = output.attachment;
    if (attachment) add(attachment.label, `Save ${attachment.fileName}`, () => downloadText(attachment.text, attachment.fileName, attachment.fileName.endsWith('.csv') ? 'text/csv' : 'application/x-ndjson'));
    if (output.csv !== null) add('CSV', `Save the data of ${this.figure.title} as CSV`, () => downloadText(output.csv!, `${name}.csv`, 'text/csv'));
  }
}
