// A study's controls: each one a named input of the reactive graph, validated the same way
// in the browser (controls, permalink, upload) and in `alight report` (analysis file).

export type ParameterValue = number | string;

export interface NumberParameter {
  kind: 'number';
  name: string;
  label: string;
  /** Unit shown after the value (may be empty). */
  unit: string;
  min: number;
  max: number;
  step: number;
  default: number;
  /** Integer-valued (trial counts, grid sizes). */
  integer?: boolean;
}

export interface ChoiceParameter {
  kind: 'choice';
  name: string;
  label: string;
  options: readonly { value: string; label: string }[];
  default: string;
}

/** A list of numbers typed as text ("0, 0.1, 0.2"); empty means the study's own default list. */
export interface ListParameter {
  kind: 'list';
  name: string;
  label: string;
  /** Unit of every value (may be empty). */
  unit: string;
  /** Most values a list may hold. */
  maxItems: number;
  default: string;
}

export type Parameter = NumberParameter | ChoiceParameter | ListParameter;

/**
 * The numbers of a list parameter's text, or why it is not one: comma- or space-separated finite
 * numbers, at least two and at most `maxItems`, no repeats. Empty text is the empty list (the
 * study's default). Whether each value suits the scenario field is the scenario validator's call.
 */
export function parseNumberList(text: string, maxItems: number): number[] | string {
  const t = text.trim();
  if (t === '') return [];
  const parts = t.split(/[\s,;]+/).filter((p) => p !== '');
  const values = parts.map(Number);
  const bad = parts.find((p, i) => p === '' || !Number.isFinite(values[i]!));
  if (bad !== undefined) return `${JSON.stringify(bad)} is not a number`;
  if (values.length < 2) return 'a sweep needs at least two values';
  if (values.length > maxItems) return `at most ${maxItems} values, got ${values.length}`;
  if (new Set(values).size !== values.length) return 'a value appears twice';
  return values;
}

/** Why a parameter value was refused: names the parameter and the rule. */
export function parameterProblem(spec: Parameter, value: unknown): string | null {
  if (spec.kind === 'list') {
    if (typeof value !== 'string') return `must be a list of numbers as text, got ${JSON.stringify(value)}`;
    const list = parseNumberList(value, spec.maxItems);
    return typeof list === 'string' ? `${list} (got ${JSON.stringify(value)})` : null;
  }
  if (spec.kind === 'number') {
    if (typeof value !== 'number' || !Number.isFinite(value)) return `must be a finite number, got ${JSON.stringify(value)}`;
    if (value < spec.min || value > spec.max) return `must be within [${spec.min}, ${spec.max}]${spec.unit ? ' ' + spec.unit : ''}, got ${value}`;
    if (spec.integer && !Number.isInteger(value)) return `must be a whole number, got ${value}`;
    return null;
  }
  if (typeof value !== 'string' || !spec.options.some((o) => o.value === value)) {
    return `must be one of ${spec.options.map((o) => JSON.stringify(o.value)).join(', ')}, got ${JSON.stringify(value)}`;
  }
  return null;
}

export function defaultParameters(specs: readonly Parameter[]): Record<string, ParameterValue> {
  return Object.fromEntries(specs.map((s) => [s.name, s.default]));
}

/** Read a control's text back into a parameter value (numbers from range/number inputs). */
export function parameterFromText(spec: Parameter, text: string): ParameterValue {
  return spec.kind === 'number' ? Number(text) : text;
}
