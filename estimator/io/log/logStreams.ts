// The CSV streams of a flight log (layout version 1, see README.md, "Flight-log layout"): file names, the column
// sets each accepts, and the normalized row every reader produces. Column order is free;
// the header names the columns. Units: s, m, m/s, m/s^2, px.

export type LogStreamName = 'boxes' | 'imu' | 'attitude' | 'odometry' | 'truth' | 'onboard' | 'resets';
export const LOG_STREAMS: readonly LogStreamName[] = ['boxes', 'imu', 'attitude', 'odometry', 'truth', 'onboard', 'resets'];

/** Streams the filter cannot do without. */
export const REQUIRED_STREAMS: readonly LogStreamName[] = ['boxes', 'imu', 'attitude'];

/** The state columns of onboard.csv and of the replay's estimates CSV, in x order. */
export const STATE_COLUMNS = ['rx', 'ry', 'rz', 'vcx', 'vcy', 'vcz', 'vlx', 'vly', 'vlz', 'bax', 'bay', 'baz', 'acx', 'acy', 'acz'] as const;

export interface StreamSpec {
  name: LogStreamName;
  file: string;
  /**
   * Accepted column sets, tried in order: the first whose columns all appear in the header
   * is used. Each maps header names to value slots 1.. of the normalized row (slot 0 = time).
   */
  layouts: readonly (readonly string[])[];
  /** Optional columns with their default when absent: appended after the layout's slots. */
  optional: readonly { column: string; fallback: 'time' | number }[];
  /** True: times strictly increase (one row per time). False: non-decreasing (boxes: several per frame). */
  strict: boolean;
  /** The column whose value orders the stream and the merge (default "time"). */
  orderColumn: string;
  /** Columns with this prefix are known but unused (not listed as ignored), e.g. onboard.csv's P_ columns. */
  knownPrefix?: string;
}

const box: StreamSpec = {
  name: 'boxes',
  file: 'boxes.csv',
  // time = capture time; corners, or top-left corner + width/height (accepted on import).
  layouts: [
    ['xMin', 'yMin', 'xMax', 'yMax'],
    ['x', 'y', 'w', 'h'],
  ],
  optional: [
    { column: 'arrival', fallback: 'time' },
    { column: 'score', fallback: 1 },
  ],
  strict: false,
  orderColumn: 'arrival',
};

export const STREAM_SPECS: Readonly<Record<LogStreamName, StreamSpec>> = {
  boxes: box,
  imu: { name: 'imu', file: 'imu.csv', layouts: [['fx', 'fy', 'fz']], optional: [], strict: true, orderColumn: 'time' },
  // q_wb, or ZYX Euler angles (deg) turned into q_wb by frames/quatFromEulerDeg.
  attitude: { name: 'attitude', file: 'attitude.csv', layouts: [['qw', 'qx', 'qy', 'qz'], ['rollDeg', 'pitchDeg', 'yawDeg']], optional: [], strict: true, orderColumn: 'time' },
  odometry: { name: 'odometry', file: 'odometry.csv', layouts: [['vx', 'vy', 'vz']], optional: [], strict: true, orderColumn: 'time' },
  truth: {
    name: 'truth',
    file: 'truth.csv',
    layouts: [['rx', 'ry', 'rz', 'vcx', 'vcy', 'vcz', 'vlx', 'vly', 'vlz']],
    optional: [],
    strict: true,
    orderColumn: 'time',
  },
  // Times at which the lander dropped its estimate (e.g. after an abort) to start afresh from the next box.
  resets: { name: 'resets', file: 'resets.csv', layouts: [[]], optional: [], strict: true, orderColumn: 'time' },
  onboard: {
    name: 'onboard',
    file: 'onboard.csv',
    layouts: [STATE_COLUMNS.slice(0, 15), STATE_COLUMNS.slice(0, 12)],
    optional: [],
    strict: true,
    orderColumn: 'time',
    knownPrefix: 'P_',
  },
};

/** Slots of a normalized box row: [capture time, xMin, yMin, xMax, yMax, arrival, score]. */
export const BOX_SLOTS = { capture: 0, xMin: 1, yMin: 2, xMax: 3, yMax: 4, arrival: 5, score: 6 } as const;
