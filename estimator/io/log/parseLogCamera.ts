// camera.json of a flight log: the camera as the lander believed it to be (intrinsics,
// distortion, mount, image size), the assumed target size and per-stream clock offsets.
// Validated once here; every problem names the field. Browser-safe (takes parsed JSON).
import type { CameraMount, Distortion } from '../../sim/Scenario.js';
import type { FilterCamera } from '../../models/FilterCamera.js';
import { JsonSyntaxError, parseJsonText } from '../jsonPositions.js';
import type { DeckOutline } from '../../models/OutlineBoxModel.js';
import { LogLayoutError } from './LogProblem.js';
import { LOG_STREAMS, type LogStreamName } from './logStreams.js';

export const LOG_FORMAT = 'alight-log';
export const LOG_VERSION = 1;


export interface LogCamera {
  /** The camera the filter believes in. */
  camera: FilterCamera;
  /** Target size the filter assumes: sqrt(deck length * width) (m). */
  targetSize: number;
  /** Deck outline the filter assumes (m) for the outline box model; absent = a flat square deck of targetSize. */
  outline?: DeckOutline;
  /** Seconds added to each stream's times to bring it onto the common clock (absent = 0). */
  timeOffsets: Partial<Record<LogStreamName, number>>;
}

const FILE = 'camera.json';
const TOP_KEYS = ['format', 'version', 'width', 'height', 'intrinsics', 'distortion', 'mount', 'targetSize', 'outline', 'timeOffsets', 'note'];

/** Lines of the fields of the camera.json being checked (set by parseLogCamera for its call). */
let fieldLines: ReadonlyMap<string, number> | undefined;

/** The line of a field ('mount.offset[0]' is 'mount.offset.0' in jsonLines), else of its parent. */
function lineOf(field: string): number | null {
  for (let path = field.replace(/\[(\d+)\]/g, '.$1'); ; path = path.includes('.') ? path.slice(0, path.lastIndexOf('.')) : '') {
    const line = fieldLines?.get(path);
    if (line !== undefined) return line;
    if (path === '') return null;
  }
}

function fail(field: string, message: string): never {
  throw new LogLayoutError(FILE, lineOf(field), field, message);
}

function isRecord(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

function record(v: unknown, field: string, keys: readonly string[]): Record<string, unknown> {
  if (!isRecord(v)) fail(field, `expected an object, got ${JSON.stringify(v) ?? 'nothing'}`);
  for (const k of Object.keys(v)) if (!keys.includes(k)) fail(`${field ? field + '.' : ''}${k}`, `unknown field (expected one of ${keys.join(', ')})`);
  return v;
}

function num(v: unknown, field: string, check: (x: number) => boolean = () => true, expected = 'a finite number'): number {
  if (typeof v !== 'number' || !Number.isFinite(v) || !check(v)) fail(field, `expected ${expected}, got ${JSON.stringify(v) ?? 'nothing'}`);
  return v;
}

const positive = (x: number) => x > 0;

/** Validate camera.json (already parsed from JSON text). Throws LogLayoutError naming the field. */
export function parseLogCamera(json: unknown, lines?: ReadonlyMap<string, number>): LogCamera {
  fieldLines = lines;
  try {
    return checkLogCamera(json);
  } finally {
    fieldLines = undefined;
  }
}

function checkLogCamera(json: unknown): LogCamera {
  const top = record(json, '', TOP_KEYS);
  if (top.format !== LOG_FORMAT) fail('format', `expected "${LOG_FORMAT}", got ${JSON.stringify(top.format) ?? 'nothing'}`);
  if (top.version !== LOG_VERSION) fail('version', `this alight reads log layout version ${LOG_VERSION}, got ${JSON.stringify(top.version) ?? 'nothing'}`);
  const width = num(top.width, 'width', (x) => Number.isInteger(x) && x > 0, 'a positive integer (px)');
  const height = num(top.height, 'height', (x) => Number.isInteger(x) && x > 0, 'a positive integer (px)');
  const k = record(top.intrinsics, 'intrinsics', ['fx', 'fy', 'cx', 'cy']);
  const fx = num(k.fx, 'intrinsics.fx', positive, 'a positive number (px)');
  const fy = num(k.fy, 'intrinsics.fy', positive, 'a positive number (px)');
  const cx = num(k.cx, 'intrinsics.cx', (x) => x >= 0 && x <= width, `a number in [0, width=${width}] (px)`);
  const cy = num(k.cy, 'intrinsics.cy', (x) => x >= 0 && x <= height, `a number in [0, height=${height}] (px)`);
  const distortion: Distortion = { k1: 0, k2: 0, k3: 0, p1: 0, p2: 0 };
  if (top.distortion !== undefined) {
    const d = record(top.distortion, 'distortion', ['k1', 'k2', 'k3', 'p1', 'p2']);
    for (const key of ['k1', 'k2', 'k3', 'p1', 'p2'] as const) if (d[key] !== undefined) distortion[key] = num(d[key], `distortion.${key}`);
  }
  const mount: CameraMount = { offset: [0, 0, 0], rollDeg: 0, pitchDeg: 0, yawDeg: 0 };
  if (top.mount !== undefined) {
    const m = record(top.mount, 'mount', ['offset', 'rollDeg', 'pitchDeg', 'yawDeg']);
    if (m.offset !== undefined) {
      if (!Array.isArray(m.offset) || m.offset.length !== 3) fail('mount.offset', `expected [x, y, z] in body FLU (m), got ${JSON.stringify(m.offset)}`);
      mount.offset = [num(m.offset[0], 'mount.offset[0]'), num(m.offset[1], 'mount.offset[1]'), num(m.offset[2], 'mount.offset[2]')];
    }
    for (const key of ['rollDeg', 'pitchDeg', 'yawDeg'] as const) if (m[key] !== undefined) mount[key] = num(m[key], `mount.${key}`, (x) => Math.abs(x) <= 180, 'an angle in [-180, 180] (deg)');
  }
  const targetSize = num(top.targetSize, 'targetSize', positive, 'a positive size (m)');
  let outline: DeckOutline | undefined;
  if (top.outline !== undefined) {
    const o = record(top.outline, 'outline', ['deckLength', 'deckWidth', 'bodyHeight']);
    outline = {
      deckLength: num(o.deckLength, 'outline.deckLength', positive, 'a positive length (m)'),
      deckWidth: num(o.deckWidth, 'outline.deckWidth', positive, 'a positive width (m)'),
      bodyHeight: o.bodyHeight === undefined ? 0 : num(o.bodyHeight, 'outline.bodyHeight', (x) => x >= 0, 'a non-negative height (m)'),
    };
  }
  const timeOffsets: Partial<Record<LogStreamName, number>> = {};
  if (top.timeOffsets !== undefined) {
    const o = record(top.timeOffsets, 'timeOffsets', LOG_STREAMS);
    for (const [name, value] of Object.entries(o)) timeOffsets[name as LogStreamName] = num(value, `timeOffsets.${name}`, () => true, 'a number of seconds');
  }
  return { camera: { fx, fy, cx, cy, width, height, distortion, mount }, targetSize, ...(outline ? { outline } : {}), timeOffsets };
}

/** camera.json text -> LogCamera; bad JSON is a layout problem too. */
export function parseLogCameraText(text: string): LogCamera {
  let parsed: { value: unknown; lines: Map<string, number> };
  try {
    parsed = parseJsonText(text);
  } catch (error) {
    if (error instanceof JsonSyntaxError) throw new LogLayoutError(`${FILE}:${error.line}:${error.column}`, null, null, `not valid JSON: ${error.message}`);
    throw error;
  }
  return parseLogCamera(parsed.value, parsed.lines);
}
