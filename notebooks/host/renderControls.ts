// Browser only: the setup rail's controls, one per study parameter, all keyboard reachable
// (native range, select and number inputs with labels). Ranges commit on `change`, so a drag
// recomputes once, when released.
import type { Parameter, ParameterValue } from '../studies/Parameter.js';
import { parameterFromText, parameterProblem } from '../studies/Parameter.js';

function formatValue(spec: Parameter, value: ParameterValue): string {
  if (spec.kind === 'choice') return '';
  return `${value}${spec.unit ? ' ' + spec.unit : ''}`;
}

export function renderControl(spec: Parameter, value: ParameterValue, onChange: (value: ParameterValue) => void): HTMLElement {
  const box = document.createElement('div');
  box.className = 'control';
  const id = `control-${spec.name}`;
  const label = document.createElement('label');
  label.htmlFor = id;
  label.textContent = spec.label;
  const output = document.createElement('output');
  output.htmlFor.add(id);
  output.textContent = formatValue(spec, value);
  let input: HTMLInputElement | HTMLSelectElement;
  if (spec.kind === 'number') {
    const range = document.createElement('input');
    range.type = 'range';
    range.min = String(spec.min);
    range.max = String(spec.max);
    range.step = String(spec.step);
    range.value = String(value);
    range.addEventListener('input', () => (output.textContent = formatValue(spec, Number(range.value))));
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
    input = select;
  }
  input.id = id;
  input.name = spec.name;
  input.dataset.parameter = spec.name;
  input.addEventListener('change', () => {
    const next = parameterFromText(spec, input.value);
    if (parameterProblem(spec, next) !== null) return;
    output.textContent = formatValue(spec, next);
    onChange(next);
  });
  box.append(label, output, input);
  return box;
}

export function renderSeed(value: number, onChange: (seed: number) => void): HTMLElement {
  const box = document.createElement('div');
  box.className = 'control';
  const label = document.createElement('label');
  label.htmlFor = 'control-seed';
  label.textContent = 'Master seed';
  const input = document.createElement('input');
  input.type = 'number';
  input.id = 'control-seed';
  input.min = '0';
  input.step = '1';
  input.value = String(value);
  input.dataset.parameter = 'seed';
  input.addEventListener('change', () => {
    const seed = Number(input.value);
    if (Number.isSafeInteger(seed) && seed >= 0) onChange(seed);
  });
  box.append(label, document.createElement('span'), input);
  return box;
}
