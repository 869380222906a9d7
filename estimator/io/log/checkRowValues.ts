// Checks of a parsed row's values that its stream's meaning demands: boxes not inverted,
// captured no later than they arrived, scores in [0, 1]; unit attitude quaternions. An x/y/w/h
// box is turned into corners and Euler angles into a quaternion here. Each problem names
// file, line and column. Allocation-free.
import { quatFromEulerDeg } from '../../frames/quatFromEulerDeg.js';
import type { ProblemLog } from './LogProblem.js';
import { BOX_SLOTS, type LogStreamName } from './logStreams.js';

/** |q| may differ from 1 by this much (rounding in a logger's printout), no more. */
const QUATERNION_NORM_TOLERANCE = 1e-3;
const quaternion = new Float64Array(4);

/**
 * @param v normalized row (see logStreams.ts); boxes with layout 1 hold x, y, w, h in slots 1..4
 * @returns false (problem reported) when the row must be skipped
 */
export function checkRowValues(stream: LogStreamName, layout: number, v: Float64Array, problems: ProblemLog, file: string, line: number): boolean {
  if (stream === 'boxes') {
    if (layout === 1) {
      if (v[3]! < 0 || v[4]! < 0) {
        const column = v[3]! < 0 ? 'w' : 'h';
        problems.add('box-inverted', file, line, column, `${column} ${v[column === 'w' ? 3 : 4]} is negative; row skipped`);
        return false;
      }
      // x, y, w, h: top-left corner and size -> corners.
      v[BOX_SLOTS.xMax] = v[1]! + v[3]!;
      v[BOX_SLOTS.yMax] = v[2]! + v[4]!;
    } else if (v[BOX_SLOTS.xMax]! < v[BOX_SLOTS.xMin]! || v[BOX_SLOTS.yMax]! < v[BOX_SLOTS.yMin]!) {
      const x = v[BOX_SLOTS.xMax]! < v[BOX_SLOTS.xMin]!;
      const message = x ? `xMax ${v[BOX_SLOTS.xMax]} is less than xMin ${v[BOX_SLOTS.xMin]}` : `yMax ${v[BOX_SLOTS.yMax]} is less than yMin ${v[BOX_SLOTS.yMin]}`;
      problems.add('box-inverted', file, line, x ? 'xMax' : 'yMax', `${message}; row skipped`);
      return false;
    }
    if (v[BOX_SLOTS.capture]! > v[BOX_SLOTS.arrival]!) {
      problems.add('capture-after-arrival', file, line, 'arrival', `arrival ${v[BOX_SLOTS.arrival]} is before capture time ${v[0]}; row skipped`);
      return false;
    }
    const score = v[BOX_SLOTS.score]!;
    if (score < 0 || score > 1) {
      problems.add('score-out-of-range', file, line, 'score', `score ${score} is outside [0, 1]; row skipped`);
      return false;
    }
  } else if (stream === 'attitude') {
    if (layout === 1) {
      // rollDeg, pitchDeg, yawDeg (ZYX) -> q_wb in slots 1..4.
      quatFromEulerDeg(v[1]!, v[2]!, v[3]!, quaternion);
      for (let i = 0; i < 4; i++) v[1 + i] = quaternion[i]!;
      return true;
    }
    const norm = Math.hypot(v[1]!, v[2]!, v[3]!, v[4]!);
    if (Math.abs(norm - 1) > QUATERNION_NORM_TOLERANCE) {
      problems.add('quaternion-not-unit', file, line, 'qw', `quaternion norm ${norm} differs from 1 by more than ${QUATERNION_NORM_TOLERANCE}; row skipped`);
      return false;
    }
  }
  return true;
}
