// The header line of each CSV file of the flight-log layout as alight writes it (README.md,
// "Flight-log layout"): one definition for every writer (alight record, alight ingest), so the
// files they write cannot drift apart. Readers accept more layouts (see logStreams.ts).
export const LOG_FILE_HEADERS = {
  'imu.csv': 'time,fx,fy,fz',
  'attitude.csv': 'time,qw,qx,qy,qz',
  'odometry.csv': 'time,vx,vy,vz',
  'boxes.csv': 'time,arrival,xMin,yMin,xMax,yMax,score',
  'truth.csv': 'time,rx,ry,rz,vcx,vcy,vcz,vlx,vly,vlz',
  'resets.csv': 'time',
} as const;

export type LogFile = keyof typeof LOG_FILE_HEADERS;
