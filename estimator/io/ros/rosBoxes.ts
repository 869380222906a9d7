// Boxes out of a detection message: vision_msgs/Detection2DArray (or one Detection2D), or a
// message of the user's own with four corner fields. vision_msgs boxes are a centre and a size
// (px); corners are centre ∓ size/2. `shift` (0.5 for ROS's integer pixel centres) moves them
// into alight's pixel coordinates (Box.ts). Browser-safe.
import { fieldAt, type Decoded } from './rosMessages.js';
import type { BoxCorners } from './parseRosMap.js';

/** Receives one box: corners (px, alight coordinates) and score. */
export type BoxEmitter = (xMin: number, yMin: number, xMax: number, yMax: number, score: number) => void;

/** Detections left out, by reason. */
export interface BoxCounts {
  /** A rotated box (theta != 0): its axis-aligned hull is not what the detector measured. */
  rotated: number;
  /** No hypothesis of the mapped class. */
  otherClass: number;
  /** A corner or score field missing or not a number. */
  badField: number;
}

export const emptyBoxCounts = (): BoxCounts => ({ rotated: 0, otherClass: 0, badField: 0 });

/** The best score among a detection's hypotheses (of `classId` when given); null when none matches; 1 with no hypotheses. */
function hypothesisScore(results: Decoded[] | undefined, classId: string | undefined): number | null {
  if (!results || results.length === 0) return classId === undefined ? 1 : null;
  let best: number | null = null;
  for (const r of results) {
    const h = r.hypothesis ?? r; // vision_msgs 3+: { hypothesis: { class_id, score } }; older: { id, score }
    const id = String(h.class_id ?? h.id ?? '');
    if (classId !== undefined && id !== classId) continue;
    if (best === null || h.score > best) best = h.score;
  }
  return best;
}

function detection(d: Decoded, classId: string | undefined, shift: number, emit: BoxEmitter, counts: BoxCounts): void {
  const score = hypothesisScore(d.results, classId);
  if (score === null) {
    counts.otherClass++;
    return;
  }
  const c = d.bbox.center;
  const p = c.position ?? c; // vision_msgs 4+: Pose2D { position { x, y }, theta }; older: geometry_msgs/Pose2D { x, y, theta }
  if ((c.theta ?? 0) !== 0) {
    counts.rotated++;
    return;
  }
  const hw = d.bbox.size_x / 2, hh = d.bbox.size_y / 2;
  emit(p.x - hw + shift, p.y - hh + shift, p.x + hw + shift, p.y + hh + shift, score);
}

/** Every box of a vision_msgs detection message. */
export function detectionBoxes(type: string, msg: Decoded, classId: string | undefined, shift: number, emit: BoxEmitter, counts: BoxCounts): void {
  if (type === 'vision_msgs/Detection2D') return detection(msg, classId, shift, emit, counts);
  for (const d of msg.detections) detection(d, classId, shift, emit, counts);
}

const number = (v: unknown): number | null => (typeof v === 'number' && Number.isFinite(v) ? v : typeof v === 'bigint' ? Number(v) : null);

/** Every box of a message of the user's own: one box, or one per element of `list`. */
export function cornerBoxes(msg: Decoded, corners: BoxCorners, list: string | undefined, score: string | undefined, shift: number, emit: BoxEmitter, counts: BoxCounts): void {
  const records: unknown = list === undefined ? [msg] : fieldAt(msg, list);
  if (!Array.isArray(records) && !ArrayBuffer.isView(records)) {
    counts.badField++;
    return;
  }
  const all = records as ArrayLike<Decoded>;
  for (let i = 0; i < all.length; i++) {
    const record = all[i];
    const xMin = number(fieldAt(record, corners.xMin)), yMin = number(fieldAt(record, corners.yMin));
    const xMax = number(fieldAt(record, corners.xMax)), yMax = number(fieldAt(record, corners.yMax));
    const s = score === undefined ? 1 : number(fieldAt(record, score));
    if (xMin === null || yMin === null || xMax === null || yMax === null || s === null) {
      counts.badField++;
      continue;
    }
    emit(xMin + shift, yMin + shift, xMax + shift, yMax + shift, s);
  }
}
