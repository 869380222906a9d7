// Scenario validation, once at the boundary: JSON Schema (ajv, every problem reported),
// then defaults from defaultScenario() for omitted sections and fields, then the checks
// that span fields. Result: a deep-frozen Scenario. Browser-safe (no Node APIs).
import type { ErrorObject } from 'ajv';
import type { Scenario } from '../sim/Scenario.js';
import { defaultScenario } from './defaultScenario.js';
import { ScenarioError } from './ScenarioError.js';
import { validateSchema } from './scenarioSchemaCheck.js'; // the page bundles a pre-generated check instead (no eval)

const isObject = (v: unknown): v is Record<string, unknown> => v !== null && typeof v === 'object' && !Array.isArray(v);

/** The value printed after "got": JSON, shortened. */
function shown(value: unknown): string {
  const text = value === undefined ? 'nothing' : JSON.stringify(value);
  return text.length > 40 ? `${text.slice(0, 37)}...` : text;
}

function valueAt(root: unknown, path: string[]): unknown {
  let v: unknown = root;
  for (const key of path) v = isObject(v) || Array.isArray(v) ? (v as Record<string, unknown>)[key] : undefined;
  return v;
}

/** One ajv error as a field path and a message in our words (shared by every schema-checked file). */
export function describeSchemaError(error: ErrorObject, raw: unknown): { path: string; message: string } {
  const parts = error.instancePath.split('/').slice(1).map((p) => p.replace(/~1/g, '/').replace(/~0/g, '~'));
  const path = parts.join('.');
  const got = `, got ${shown(valueAt(raw, parts))}`;
  const params = error.params as Record<string, unknown>;
  const join = (key: string) => (path === '' ? key : `${path}.${key}`);
  switch (error.keyword) {
    case 'additionalProperties': {
      const allowed = Object.keys((error.parentSchema as { properties?: object })?.properties ?? {});
      return { path: join(String(params.additionalProperty)), message: `unknown key (expected one of: ${allowed.join(', ')})` };
    }
    case 'required':
      return { path: join(String(params.missingProperty)), message: 'is required here but missing' };
    case 'enum':
      return { path, message: `must be one of ${(params.allowedValues as unknown[]).map((v) => JSON.stringify(v)).join(', ')}${got}` };
    case 'const':
      return { path, message: `must be ${JSON.stringify(params.allowedValue)}${got}` };
    case 'type':
      return { path, message: `must be ${String(params.type).replace(',', ' or ')}${got}` };
    default:
      return { path, message: `${error.message ?? 'is invalid'}${got}` };
  }
}

function merge(base: Record<string, unknown>, over: Record<string, unknown>): Record<string, unknown> {
  const out: Record<string, unknown> = { ...base };
  for (const [key, value] of Object.entries(over)) {
    out[key] = isObject(value) && isObject(base[key]) ? merge(base[key] as Record<string, unknown>, value) : value;
  }
  return out;
}

function deepFreeze<T>(value: T): T {
  if (value !== null && typeof value === 'object') {
    for (const v of Object.values(value)) deepFreeze(v);
    Object.freeze(value);
  }
  return value;
}

/** Checks that span several fields, on the merged scenario. Each returns [path, message]. */
function crossFieldProblems(s: Scenario, raw: Record<string, unknown>): [string, string][] {
  const out: [string, string][] = [];
  const rawCamera = raw.camera;
  if (isObject(rawCamera)) {
    const n = Number('intrinsics' in rawCamera) + Number('lens' in rawCamera);
    if (n !== 1) out.push(['camera', `give exactly one of camera.intrinsics or camera.lens, got ${n === 0 ? 'neither' : 'both'}`]);
  }
  const k = s.camera.intrinsics;
  if (k && !(k.cx > 0 && k.cx < s.camera.width)) out.push(['camera.intrinsics.cx', `must lie inside the image (0..${s.camera.width} px), got ${k.cx}`]);
  if (k && !(k.cy > 0 && k.cy < s.camera.height)) out.push(['camera.intrinsics.cy', `must lie inside the image (0..${s.camera.height} px), got ${k.cy}`]);
  const path = s.carrier.path;
  if (path.shape === 'recorded' && path.file === undefined && path.points === undefined) {
    out.push(['carrier.path.file', 'a recorded path needs a file (CSV of t,x,y,z) or inline points']);
  }
  if (path.points) {
    for (let i = 1; i < path.points.length; i++) {
      if (!(path.points[i]![0]! > path.points[i - 1]![0]!)) {
        out.push([`carrier.path.points.${i}.0`, `times must increase, got ${path.points[i]![0]} after ${path.points[i - 1]![0]}`]);
        break;
      }
    }
  }
  if (path.shape === 'rectangle' && 2 * path.cornerRadius > Math.min(path.length, path.width)) {
    out.push(['carrier.path.cornerRadius', `must be <= min(length, width) / 2 = ${Math.min(path.length, path.width) / 2} m for a rectangle, got ${path.cornerRadius}`]);
  }
  if (s.carrier.profile.variation > s.carrier.speed) {
    out.push(['carrier.profile.variation', `must be <= carrier.speed (${s.carrier.speed} m/s), got ${s.carrier.profile.variation}`]);
  }
  if (!(s.lander.startOffset[2] > 0)) out.push(['lander.startOffset.2', `must be > 0 (start above the deck), got ${s.lander.startOffset[2]}`]);
  const rate = s.filter.rate;
  for (const [p, v] of [['detector.rate', s.detector.rate], ['localization.imuRate', s.localization.imuRate], ['localization.odometryRate', s.localization.odometryRate]] as const) {
    if (v > rate) out.push([p, `must be <= filter.rate (${rate} Hz), got ${v}`]);
  }
  (s.detector.script ?? []).forEach((e, i) => {
    if (e.kind === 'latency' && e.latency === undefined) out.push([`detector.script.${i}.latency`, 'a latency event needs its delay "latency" (s)']);
  });
  if (s.guidance.flareHeight >= s.guidance.trailHeight) {
    out.push(['guidance.flareHeight', `must be < guidance.trailHeight (${s.guidance.trailHeight} m), got ${s.guidance.flareHeight}`]);
  }
  return out;
}

/**
 * Validate a parsed scenario object, fill defaults and freeze it. `lines` maps field paths
 * to 1-based lines (from jsonLines) so messages read `file:line: path: problem`; with
 * `columns` too (same paths) they read `file:line:column: path: problem`, the column of the
 * value at fault (or of the nearest enclosing value that is in the file).
 * @throws ScenarioError with one message per problem.
 */
export function validateScenario(raw: unknown, fileName: string, lines?: ReadonlyMap<string, number>, columns?: ReadonlyMap<string, number>): Scenario {
  const where = (path: string): { prefix: string; line: number } => {
    let line: number | undefined;
    let column: number | undefined;
    for (let p = path; line === undefined; p = p.includes('.') ? p.slice(0, p.lastIndexOf('.')) : '') {
      line = lines?.get(p);
      column = columns?.get(p);
      if (p === '') break;
    }
    const at = line === undefined ? '' : column === undefined ? `:${line}` : `:${line}:${column}`;
    return { prefix: `${fileName}${at}: ${path === '' ? '(top level)' : path}`, line: line ?? 0 };
  };
  const found: { line: number; path: string; text: string }[] = [];
  const add = (path: string, message: string): void => {
    const { prefix, line } = where(path);
    const text = `${prefix}: ${message}`;
    if (!found.some((f) => f.text === text)) found.push({ line, path, text });
  };
  if (!validateSchema(raw)) {
    for (const error of validateSchema.errors ?? []) {
      const { path, message } = describeSchemaError(error, raw);
      add(path, message);
    }
  }
  if (!isObject(raw)) throw new ScenarioError(fileName, found.map((f) => f.text));
  const merged = merge(defaultScenario() as unknown as Record<string, unknown>, raw) as unknown as Scenario;
  const rawCamera = raw.camera;
  if (isObject(rawCamera) && 'lens' in rawCamera && !('intrinsics' in rawCamera)) delete merged.camera.intrinsics;
  // Cross-field checks also run when the schema failed, so every problem shows at once;
  // a check touching a field that already has a schema problem is skipped (and may throw).
  const schemaPaths = found.map((f) => f.path);
  const overlaps = (path: string) => schemaPaths.some((p) => p === path || p.startsWith(`${path}.`) || path.startsWith(`${p}.`));
  let crossProblems: [string, string][] = [];
  try {
    crossProblems = crossFieldProblems(merged, raw);
  } catch {
    crossProblems = [];
  }
  for (const [path, message] of crossProblems) if (!overlaps(path)) add(path, message);
  if (found.length > 0) {
    const sorted = found.map((f, i) => ({ ...f, i })).sort((a, b) => a.line - b.line || a.i - b.i);
    throw new ScenarioError(fileName, sorted.map((f) => f.text));
  }
  return deepFreeze(merged);
}
