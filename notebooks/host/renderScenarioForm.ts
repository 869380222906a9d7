// Browser only: the scenario's fields as a form, one disclosure per section, generated from the
// JSON Schema (scenarioFields). A field commits on change; the new scenario comes from setPath, so
// a refused value is named by the scenario validator's own message beside the field and nothing
// reruns. The edited scenario is the analysis's: it travels in the link and the analysis file.
import schema from '../../estimator/io/scenario.schema.json';
import { setPath } from '../../estimator/io/scenarioPath.js';
import type { Scenario } from '../../estimator/sim/Scenario.js';
import { scenarioFields, type ScenarioField, type SchemaNode } from './scenarioFields.js';

function fieldInput(field: ScenarioField): HTMLInputElement | HTMLSelectElement {
  if (field.kind === 'choice' || field.kind === 'boolean') {
    const select = document.createElement('select');
    const options = field.kind === 'boolean' ? ['true', 'false'] : field.options;
    for (const value of options) {
      const o = document.createElement('option');
      o.value = value;
      o.textContent = field.kind === 'boolean' ? (value === 'true' ? 'yes' : 'no') : value;
      select.append(o);
    }
    select.value = String(field.value);
    return select;
  }
  const input = document.createElement('input');
  input.type = 'text';
  input.inputMode = 'decimal';
  input.value = String(field.value);
  return input;
}

function readValue(field: ScenarioField, text: string): number | boolean | string | null {
  if (field.kind === 'boolean') return text === 'true';
  if (field.kind === 'choice') return text;
  const t = text.trim();
  const value = t === '' ? NaN : Number(t);
  return Number.isFinite(value) ? value : null;
}

export function renderScenarioForm(scenario: Scenario, commit: (next: Scenario) => void): HTMLElement {
  let current = scenario;
  const form = document.createElement('details');
  form.className = 'scenario-form';
  form.innerHTML = '<summary>Edit the scenario’s fields</summary><p class="hint">Each field is checked as the scenario file would be; lists (start offset, mount offset, scripted events, gusts) stay in the file: open an edited file to change them.</p>';
  const sections = new Map<string, HTMLElement>();
  for (const field of scenarioFields(schema as SchemaNode, scenario)) {
    const name = field.section || 'scenario';
    let box = sections.get(name);
    if (!box) {
      const group = document.createElement('details');
      group.className = 'scenario-section';
      group.innerHTML = `<summary>${name}</summary>`;
      box = document.createElement('div');
      group.append(box);
      form.append(group);
      sections.set(name, box);
    }
    const row = document.createElement('div');
    row.className = 'control scenario-field';
    const id = `scenario-${field.path.replace(/\./g, '-')}`;
    const label = document.createElement('label');
    label.htmlFor = id;
    label.textContent = field.path.slice(field.section ? field.section.length + 1 : 0);
    label.title = field.description;
    const input = fieldInput(field);
    input.id = id;
    input.dataset.path = field.path;
    const bounds = field.min !== null || field.max !== null ? ` Range ${field.min ?? '−∞'} to ${field.max ?? '∞'}.` : '';
    input.setAttribute('aria-description', `${field.description}${bounds}`);
    const problem = document.createElement('p');
    problem.className = 'field-problem';
    problem.id = `${id}-problem`;
    problem.setAttribute('role', 'alert');
    problem.hidden = true;
    input.addEventListener('change', () => {
      const value = readValue(field, input.value);
      const refuse = (message: string): void => {
        problem.textContent = `${message}${/[.!?]$/.test(message) ? '' : '.'} The study still uses ${JSON.stringify(field.value)}.`;
        problem.hidden = false;
        input.setAttribute('aria-invalid', 'true');
        input.setAttribute('aria-describedby', problem.id);
      };
      if (value === null) return refuse(`${field.path}: ${JSON.stringify(input.value)} is not a number.`);
      try {
        const next = setPath(current, field.path, value);
        problem.hidden = true;
        input.removeAttribute('aria-invalid');
        input.removeAttribute('aria-describedby');
        current = next;
        field.value = value;
        commit(next);
      } catch (error) {
        refuse((error as Error).message.replace(/^setPath:\s*/, ''));
      }
    });
    row.append(label, document.createElement('span'), input, problem);
    box.append(row);
  }
  return form;
}
