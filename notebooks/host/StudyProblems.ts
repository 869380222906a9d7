// Browser only: the study's problems, said once at the top of the study rather than once per
// figure. Keyed by where they come from (the link, a file opened, a computation), so a new
// problem of one kind replaces the old one and a rerun clears a computation's problem.
export type ProblemSource = 'link' | 'open' | 'compute';

export class StudyProblems {
  readonly element: HTMLElement;
  private readonly messages = new Map<ProblemSource, string>();
  private readonly aside: HTMLElement;

  constructor() {
    this.element = document.createElement('div');
    this.element.className = 'study-problems';
    this.aside = document.createElement('div');
    this.element.append(this.aside);
  }

  show(source: ProblemSource, message: string): void {
    if (this.messages.get(source) === message) return;
    this.messages.set(source, message);
    this.draw();
  }

  clear(source: ProblemSource): void {
    if (this.messages.delete(source)) this.draw();
  }

  /** A remark that is not a problem (an analysis made with another version). */
  note(message: string): void {
    const p = document.createElement('p');
    p.className = 'message';
    p.textContent = message;
    this.element.append(p);
  }

  private draw(): void {
    this.aside.innerHTML = '';
    for (const [source, message] of this.messages) {
      const p = document.createElement('p');
      p.className = 'message';
      p.setAttribute('role', 'alert');
      p.dataset.source = source;
      p.textContent = message;
      this.aside.append(p);
    }
  }
}
