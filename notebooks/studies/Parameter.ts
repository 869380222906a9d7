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

export type Parameter = NumberParameter | ChoiceParameter;

/** Why a parameter value was refused: names the parameter and the rule. */
export function parameterProblem(spec: Parameter, value: unknown): string | null {
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
