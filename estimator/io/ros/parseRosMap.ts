// The map file of `alight ingest`: which topics and fields of a ROS 2 recording give the
// streams of a flight log (schema: rosMap.schema.json). Validated once here, like a scenario:
// every problem at once, one line each, `map.json:7: boxes.topic: ...`. Browser-safe.
import type { DeckOutline } from '../../models/OutlineBoxModel.js';
import { Ajv } from 'ajv';
import type { CameraMount, FilterSpec } from '../../sim/Scenario.js';
import { jsonLines, JsonSyntaxError } from '../jsonPositions.js';
import { applyFilterSettings, defaultFilterSpec, FilterSettingsError } from '../log/filterSettings.js';
import type { LogStreamName } from '../log/logStreams.js';
import options from '../scenarioSchemaOptions.json';
import { describeSchemaError } from '../validateScenario.js';
import schema from './rosMap.schema.json';
import { mountFromOpticalTransform, type BodyConvention, type WorldConvention } from './rosFrames.js';

export const ROS_MAP_FORMAT = 'alight-ros-map';

/** A frame convention from the map: fixed, or read from each message's frame id. */
export type Convention<T> = T | 'auto';

export interface BoxCorners {
  xMin: string;
  yMin: string;
  xMax: string;
  yMax: string;
}

export interface RosMap {
  note?: string;
  camera: { topic: string; image: 'raw' | 'rectified'; pixelCentres: 'integer' | 'half-integer'; mount: CameraMount };
  targetSize: number;
  /** Deck outline for the outline box model (m), written to camera.json; absent = a flat square deck of targetSize. */
  outline?: DeckOutline;
  boxes: { topic: string; classId?: string; arrival: 'receive' | 'stamp'; stamp: 'header' | 'receive'; list?: string; corners?: BoxCorners; score?: string };
  imu: { topic: string; body: Convention<BodyConvention> };
  /** Absent in the file: the IMU topic's orientation. */
  attitude: { topic: string; world: Convention<WorldConvention>; body: Convention<BodyConvention> };
  odometry?: { topic: string; world: Convention<WorldConvention>; body: Convention<BodyConvention> };
  truth?: { lander: string; carrier: string; maxGap: number };
  resets?: { topic: string };
  timeOrigin?: number;
  timeOffsets: Partial<Record<LogStreamName, number>>;
  /** The partial FilterSpec as written (for filter.json), already checked against the scenario schema. */
  filter?: Partial<FilterSpec>;
}

/** A map file that cannot be used: one message per problem. */
export class RosMapError extends Error {
  readonly problems: readonly string[];
  constructor(problems: readonly string[]) {
    super(problems.join('\n'));
    this.name = 'RosMapError';
    this.problems = problems;
  }
}

const validate = new Ajv(options).compile(schema);

type Raw = Record<string, any>; // eslint-disable-line @typescript-eslint/no-explicit-any -- checked by the schema above

/**
 * Parse and check a map file's text.
 * @throws RosMapError, e.g. `flight.map.json:9: imu.topic: must match pattern "^/", got "imu"`.
 */
export function parseRosMap(text: string, fileName: string): RosMap {
  let lines: Map<string, number>;
  try {
    lines = jsonLines(text.charCodeAt(0) === 0xfeff ? text.slice(1) : text);
  } catch (error) {
    if (error instanceof JsonSyntaxError) throw new RosMapError([`${fileName}:${error.line}:${error.column}: not valid JSON: ${error.message}`]);
    throw error;
  }
  const raw = JSON.parse(text.charCodeAt(0) === 0xfeff ? text.slice(1) : text) as unknown;
  const problems: { line: number; text: string }[] = [];
  const add = (path: string, message: string) => {
    let line: number | undefined;
    for (let p = path; line === undefined; p = p.includes('.') ? p.slice(0, p.lastIndexOf('.')) : '') {
      line = lines.get(p);
      if (p === '') break;
    }
    const text = `${fileName}${line !== undefined ? `:${line}` : ''}: ${path === '' ? '(top level)' : path}: ${message}`;
    if (!problems.some((p) => p.text === text)) problems.push({ line: line ?? 0, text });
  };
  if (!validate(raw)) for (const error of validate.errors ?? []) {
    const { path, message } = describeSchemaError(error, raw);
    add(path, message);
  }
  const fail = () => new RosMapError(problems.sort((a, b) => a.line - b.line).map((p) => p.text));
  if (problems.length > 0) throw fail();
  const m = raw as Raw;

  // Checks that span fields.
  if (m.camera.mount !== undefined && m.camera.opticalTransform !== undefined) add('camera.opticalTransform', 'give the camera mount once: camera.mount or camera.opticalTransform, not both');
  const rotation = m.camera.opticalTransform?.rotation as number[] | undefined;
  if (rotation && Math.abs(Math.hypot(...rotation) - 1) > 1e-6) add('camera.opticalTransform.rotation', `must be a unit quaternion (x, y, z, w), got norm ${Math.hypot(...rotation)}`);
  if (m.boxes.corners === undefined) {
    for (const key of ['list', 'score'] as const) if (m.boxes[key] !== undefined) add(`boxes.${key}`, 'only for a message of your own: give boxes.corners too');
  } else if (m.boxes.classId !== undefined) add('boxes.classId', 'only for vision_msgs detections (a message of your own has no class hypotheses)');
  let filter: Partial<FilterSpec> | undefined;
  if (m.filter !== undefined) {
    const filterLines = new Map([...lines].filter(([path]) => path === 'filter' || path.startsWith('filter.')));
    try {
      applyFilterSettings(defaultFilterSpec(), { filter: m.filter }, fileName, filterLines);
      filter = m.filter as Partial<FilterSpec>;
    } catch (error) {
      if (!(error instanceof FilterSettingsError)) throw error;
      for (const p of error.problems) problems.push({ line: Number(/^[^:]*:(\d+):/.exec(p)?.[1] ?? 0), text: p });
    }
  }
  if (problems.length > 0) throw fail();

  const t = m.camera.opticalTransform;
  const mount: CameraMount = t
    ? mountFromOpticalTransform(t.translation, t.rotation)
    : { offset: m.camera.mount?.offset ?? [0, 0, 0], rollDeg: m.camera.mount?.rollDeg ?? 0, pitchDeg: m.camera.mount?.pitchDeg ?? 0, yawDeg: m.camera.mount?.yawDeg ?? 0 };
  const conventions = (section: Raw | undefined) => ({ world: section?.world ?? 'auto', body: section?.body ?? 'auto' });
  return {
    ...(m.note !== undefined ? { note: m.note } : {}),
    camera: { topic: m.camera.topic, image: m.camera.image ?? 'raw', pixelCentres: m.camera.pixelCentres ?? 'integer', mount },
    targetSize: m.targetSize,
    ...(m.outline !== undefined ? { outline: { deckLength: m.outline.deckLength, deckWidth: m.outline.deckWidth, bodyHeight: m.outline.bodyHeight ?? 0 } } : {}),
    boxes: { topic: m.boxes.topic, classId: m.boxes.classId, arrival: m.boxes.arrival ?? 'receive', stamp: m.boxes.stamp ?? 'header', list: m.boxes.list, corners: m.boxes.corners, score: m.boxes.score },
    imu: { topic: m.imu.topic, body: m.imu.body ?? 'auto' },
    attitude: { topic: m.attitude?.topic ?? m.imu.topic, ...conventions(m.attitude) },
    ...(m.odometry ? { odometry: { topic: m.odometry.topic, ...conventions(m.odometry) } } : {}),
    ...(m.truth ? { truth: { lander: m.truth.lander, carrier: m.truth.carrier, maxGap: m.truth.maxGap ?? 0.1 } } : {}),
    ...(m.resets ? { resets: { topic: m.resets.topic } } : {}),
    ...(m.timeOrigin !== undefined ? { timeOrigin: m.timeOrigin } : {}),
    timeOffsets: m.timeOffsets ?? {},
    ...(filter ? { filter } : {}),
  };
}
