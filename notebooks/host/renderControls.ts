// Browser only: the setup rail's controls, one per study parameter, all keyboard reachable
// (native range, select and text inputs with labels). A slider commits once per gesture: at
// release of a drag, or after a pause in arrow-key presses, so holding an arrow key starts one
// computation, not one per step. Screen readers hear the value with its unit.
import type { ListParameter, Parameter, ParameterValue } from '../studies/Parameter.js';
import { parameterFromText, parameterProblem } from '../studies/Parameter.js';
import { seedProblem } from './seedProblem.js';

/** Pause after the last key press on a slider before it commits (ms). */
export const SLIDER_PAUSE_MS = 600;

function formatValue(spec: Parameter, value: ParameterValue): string {
  if (spec.kind === 'choice') return '';
  if (spec.kind === 'list') return value === '' ? 'default' : spec.unit;
  return `${value}${spec.unit ? ' ' + spec.unit : ''}`;
}

/** Put a value into a control without committing it (history: Back restores the controls). */
export function showControlValue(root: ParentNode, spec: Parameter | 'seed', value: ParameterValue): void {
  const name = spec === 'seed' ? 'seed' : spec.name;
  const input = root.querySelector<HTMLInputElement | HTMLSelectElement>(`[data-parameter="${name}"]`);
  if (!input) return;
  input.value = String(value);
  if (spec === 'seed') {
    input.dispatchEvent(new Event('alight:shown'));
    return;
  }
  const output = input.closest('.control')?.querySelector('output');
  if (output) output.textContent = formatValue(spec, value);
  if (spec.kind === 'number') input.setAttribute('aria-valuetext', formatValue(spec, value));
  input.dispatchEvent(new Event('alight:shown'));
}

export function renderControl(spec: Parameter, value: ParameterValue, onChange: (value: ParameterValue) => void): HTMLElement {
  if (spec.kind === 'list') return renderListControl(spec, String(value), onChange);
  const { box, id, label, output } = controlFrame(spec, value);
  let committed = String(value);
  let input: HTMLInputElement | HTMLSelectElement;
  const commit = (): void => {
    if (input.value === committed) return;
    const next = parameterFromText(spec, input.value);
    if (parameterProblem(spec, next) !== null) return;
    committed = input.value;
    output.textContent = formatValue(spec, next);
    onChange(next);
  };
  if (spec.kind === 'number') {
    const range = document.createElement('input');
    range.type = 'range';
    range.min = String(spec.min);
    range.max = String(spec.max);
    range.step = String(spec.step);
    range.value = String(value);
    range.setAttribute('aria-valuetext', formatValue(spec, value));
    let timer: ReturnType<typeof setTimeout> | undefined;
    let dragging = false;
    const later = (): void => {
      clearTimeout(timer);
      timer = setTimeout(commit, SLIDER_PAUSE_MS);
    };
    range.addEventListener('pointerdown', () => (dragging = true));
    range.addEventListener('input', () => {
      const text = formatValue(spec, Number(range.value));
      output.textContent = text;
      range.setAttribute('aria-valuetext', text);
      if (!dragging) later();
    });
    // `change` comes at the release of a drag (commit now) and after every arrow key (wait for a pause).
    range.addEventListener('change', () => {
      if (dragging) {
        dragging = false;
        clearTimeout(timer);
        commit();
      } else later();
    });
    range.addEventListener('blur', () => {
      if (timer !== undefined) {
        clearTimeout(timer);
        commit();
      }
    });
    input = range;
  } else {
    const select = document.createElement('select');
    for (const option of spec.options) {
      const o = document.createElement('option');
      o.value = option.value;
      o.textContent = option.label;
      select.append(o);
    }
    select.value = String(value);
    select.addEventListener('change', commit);
    input = select;
  }
  input.id = id;
  input.name = spec.name;
  input.dataset.parameter = spec.name;
  input.addEventListener('alight:shown', () => (committed = input.value));
  box.append(label, output, input);
  return box;
}

/** What every control shows around its input: the box, its label and the current value's output. */
function controlFrame(spec: Parameter, value: ParameterValue): { box: HTMLDivElement; id: string; label: HTMLLabelElement; output: HTMLOutputElement } {
  const box = document.createElement('div');
  box.className = 'control';
  const id = `control-${spec.name}`;
  const label = document.createElement('label');
  label.htmlFor = id;
  label.textContent = spec.label;
  const output = document.createElement('output');
  output.htmlFor.add(id);
  output.textContent = formatValue(spec, value);
  return { box, id, label, output };
}

/** A list of numbers, typed: commits on change or Enter when it reads as one, else names the problem. */
function renderListControl(spec: ListParameter, value: string, onChange: (value: ParameterValue) => void): HTMLElement {
  const { box, id, label, output } = controlFrame(spec, value);
  const input = document.createElement('input');
  input.type = 'text';
  input.id = id;
  input.name = spec.name;
  input.dataset.parameter = spec.name;
  input.value = value;
  input.placeholder = 'default values';
  input.spellcheck = false;
  const problem = document.createElement('p');
  problem.className = 'field-problem';
  problem.id = `${id}-problem`;
  problem.setAttribute('role', 'alert');
  problem.hidden = true;
  let committed = value;
  const check = (): void => {
    const said = parameterProblem(spec, input.value);
    if (said !== null) {
      problem.textContent = `${spec.label}: ${said}. The study still uses ${committed === '' ? 'its default values' : committed}.`;
      problem.hidden = false;
      input.setAttribute('aria-invalid', 'true');
      input.setAttribute('aria-describedby', problem.id);
      return;
    }
    problem.hidden = true;
    input.removeAttribute('aria-invalid');
    input.removeAttribute('aria-describedby');
    if (input.value.trim() === committed) return;
    committed = input.value.trim();
    output.textContent = formatValue(spec, committed);
    onChange(committed);
  };
  input.addEventListener('change', check);
  input.addEventListener('keydown', (event) => {
    if (event.key === 'Enter') check();
  });
  input.addEventListener('alight:shown', () => {
    committed = input.value;
    problem.hidden = true;
    input.removeAttribute('aria-invalid');
  });
  box.append(label, output, input, problem);
  return box;
}

/** The master seed: typed as text so every wrong entry can be named, never silently replaced. */
export function renderSeed(value: number, onChange: (seed: number) => void): HTMLElement {
  const box = document.createElement('div');
  box.className = 'control';
  const label = document.createElement('label');
  label.htmlFor = 'control-seed';
  label.textContent = 'Master seed';
  const input = document.createElement('input');
  input.type = 'text';
  input.inputMode = 'numeric';
  input.autocomplete = 'off';
  input.spellcheck = false;
  input.id = 'control-seed';
  input.value = String(value);
  input.dataset.parameter = 'seed';
  const problem = document.createElement('p');
  problem.className = 'field-problem';
  problem.id = 'seed-problem';
  problem.setAttribute('role', 'alert');
  problem.hidden = true;
  let committed = value;
  const check = (): void => {
    const result = seedProblem(input.value);
    if (typeof result === 'string') {
      problem.textContent = `${result} The study still uses seed ${committed}.`;
      problem.hidden = false;
      input.setAttribute('aria-invalid', 'true');
      input.setAttribute('aria-describedby', problem.id);
      return;
    }
    problem.hidden = true;
    problem.textContent = '';
    input.removeAttribute('aria-invalid');
    input.removeAttribute('aria-describedby');
    if (result !== committed) {
      committed = result;
      onChange(result);
    }
  };
  input.addEventListener('change', check);
  input.addEventListener('keydown', (event) => {
    if (event.key === 'Enter') check();
  });
  input.addEventListener('alight:shown', () => {
    committed = Number(input.value);
    problem.hidden = true;
    input.removeAttribute('aria-invalid');
  });
  box.append(label, document.createElement('span'), input, problem);
  return box;
}
