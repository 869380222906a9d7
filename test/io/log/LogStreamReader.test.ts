import { describe, expect, it } from 'vitest';
import { LogStreamReader } from '../../../estimator/io/log/LogStreamReader.js';
import { LogLayoutError, ProblemLog, formatProblem } from '../../../estimator/io/log/LogProblem.js';
import { linesOfText } from '../../../estimator/io/log/LogSource.js';
import { STREAM_SPECS, type LogStreamName } from '../../../estimator/io/log/logStreams.js';

async function readAll(stream: LogStreamName, text: string, offset = 0) {
  const problems = new ProblemLog();
  const reader = new LogStreamReader(STREAM_SPECS[stream], linesOfText(text), problems, offset);
  await reader.start();
  const rows: number[][] = [];
  const keys: number[] = [];
  while (await reader.advance()) {
    rows.push(Array.from(reader.values));
    keys.push(reader.key);
  }
  return { reader, problems, rows, keys };
}

describe('LogStreamReader', () => {
  it('reads corner boxes with arrival and score in any column order, skipping comments and blank lines', async () => {
    const { rows, keys, reader, problems } = await readAll(
      'boxes',
      '# boxes of a test\nscore,time,xMin,yMin,xMax,yMax,arrival,note\n0.9,1.0,10,20,30,44,1.08,a\n\n1,1.1,11,21,31,45,1.17,b\r\n',
    );
    expect(rows).toEqual([
      [1.0, 10, 20, 30, 44, 1.08, 0.9],
      [1.1, 11, 21, 31, 45, 1.17, 1],
    ]);
    expect(keys).toEqual([1.08, 1.17]);
    expect(reader.ignoredColumns).toEqual(['note']);
    expect([reader.read, reader.skipped, problems.total]).toEqual([2, 0, 0]);
  });

  it('ignores a byte-order mark before the header and CRLF line ends', async () => {
    const { rows, problems } = await readAll('odometry', '\uFEFFtime,vx,vy,vz\r\n0.1,1,2,3\r\n');
    expect(rows).toEqual([[0.1, 1, 2, 3]]);
    expect(problems.total).toBe(0);
  });

  it('accepts x/y/w/h boxes and fills arrival = time and score = 1 when absent', async () => {
    const { rows, reader } = await readAll('boxes', 'time,x,y,w,h\n2,10,20,5,6\n');
    expect(reader.layout).toBe(1);
    expect(rows).toEqual([[2, 10, 20, 15, 26, 2, 1]]);
  });

  it('puts every time of a stream onto the common clock with its offset', async () => {
    const { rows, keys } = await readAll('boxes', 'time,arrival,xMin,yMin,xMax,yMax\n1,1.5,0,0,1,1\n', -0.25);
    expect(rows[0]![0]).toBe(0.75);
    expect(rows[0]![5]).toBe(1.25);
    expect(keys).toEqual([1.25]);
  });

  it('skips and reports unsorted times, duplicated rows, repeated times, NaN and short rows with file, line and column', async () => {
    const text = ['time,fx,fy,fz', '0.00,0,0,9.8', '0.01,0,0,9.8', '0.005,0,0,9.8', '0.01,0,0,9.8', '0.01,1,0,9.8', '0.02,NaN,0,9.8', '0.03,0,,9.8', '0.04,0,0', '0.05,0,0,9.8,7', '0.06,0,0,abc', '0.07,0,0,9.8'].join('\n');
    const { rows, reader, problems } = await readAll('imu', text);
    expect(rows.map((r) => r[0])).toEqual([0, 0.01, 0.07]);
    expect([reader.read, reader.skipped]).toEqual([11, 8]);
    expect(problems.shown.map((p) => [p.kind, p.file, p.line, p.column])).toEqual([
      ['unsorted-time', 'imu.csv', 4, 'time'],
      ['duplicate-row', 'imu.csv', 5, null],
      ['repeated-time', 'imu.csv', 6, 'time'],
      ['not-a-number', 'imu.csv', 7, 'fx'],
      ['not-a-number', 'imu.csv', 8, 'fy'],
      ['field-count', 'imu.csv', 9, 'fz'],
      ['field-count', 'imu.csv', 10, null],
      ['not-a-number', 'imu.csv', 11, 'fz'],
    ]);
    expect(formatProblem(problems.shown[0]!)).toBe("imu.csv:4 time: time 0.005 is earlier than the previous row's 0.01 (rows must be in time order); row skipped");
    expect(formatProblem(problems.shown[4]!)).toBe('imu.csv:8 fy: empty is not a finite number; row skipped');
    expect(problems.byKind).toEqual({ 'unsorted-time': 1, 'duplicate-row': 1, 'repeated-time': 1, 'not-a-number': 3, 'field-count': 2 });
  });

  it('allows several boxes per frame but not the same box twice, nor inverted boxes, early arrivals or bad scores', async () => {
    const text = [
      'time,arrival,xMin,yMin,xMax,yMax,score',
      '1,1.1,10,10,20,20,0.9',
      '1,1.1,50,50,60,60,0.3', // second box of the frame: fine
      '1,1.1,10,10,20,20,0.9', // the first again
      '1.2,1.3,30,10,20,20,1', // xMax < xMin
      '1.2,1.3,10,30,20,20,1', // yMax < yMin
      '1.4,1.35,10,10,20,20,1', // arrives before capture
      '1.5,1.6,10,10,20,20,1.5',
      '1.6,1.7,10,10,20,20,1',
    ].join('\n');
    const { rows, problems } = await readAll('boxes', text);
    expect(rows.map((r) => r[5])).toEqual([1.1, 1.1, 1.7]);
    expect(problems.shown.map((p) => [p.kind, p.line, p.column])).toEqual([
      ['duplicate-row', 4, null],
      ['box-inverted', 5, 'xMax'],
      ['box-inverted', 6, 'yMax'],
      ['capture-after-arrival', 7, 'arrival'],
      ['score-out-of-range', 8, 'score'],
    ]);
    expect(problems.shown[1]!.message).toBe('xMax 20 is less than xMin 30; row skipped');
  });

  it('reports negative w/h on x/y/w/h boxes and non-unit quaternions', async () => {
    const boxes = await readAll('boxes', 'time,x,y,w,h\n1,10,10,-5,4\n');
    expect(boxes.problems.shown.map((p) => [p.kind, p.line, p.column])).toEqual([['box-inverted', 2, 'w']]);
    const attitude = await readAll('attitude', 'time,qw,qx,qy,qz\n0,1,0,0,0\n0.01,0.9,0,0,0\n');
    expect(attitude.rows.length).toBe(1);
    expect(attitude.problems.shown.map((p) => [p.kind, p.line, p.column])).toEqual([['quaternion-not-unit', 3, 'qw']]);
  });

  it('stops with a layout error naming the file and column when a column is missing, doubled, or the file is empty', async () => {
    const start = (stream: LogStreamName, text: string) => new LogStreamReader(STREAM_SPECS[stream], linesOfText(text), new ProblemLog()).start();
    await expect(start('imu', 'time,fx,fy\n')).rejects.toThrow(LogLayoutError);
    await expect(start('imu', 'time,fx,fy\n')).rejects.toThrow('imu.csv:1 fz: missing column "fz" (expected time,fx,fy,fz)');
    await expect(start('boxes', 'time,xMin,yMin,xMax\n')).rejects.toThrow('boxes.csv:1 yMax: missing column "yMax" (expected time,xMin,yMin,xMax,yMax or x,y,w,h)');
    await expect(start('odometry', 'vx,vy,vz\n')).rejects.toThrow('odometry.csv:1 time: missing column "time"');
    await expect(start('odometry', 'time,vx,vy,vz,vx\n')).rejects.toThrow('odometry.csv:1 vx: column "vx" appears twice in the header');
    await expect(start('truth', '# only a comment\n\n')).rejects.toThrow('truth.csv: empty file: expected a header line naming the columns');
  });

  it('keeps every problem counted but only the first ones in full (bounded memory)', async () => {
    const lines = ['time,vx,vy,vz'];
    for (let i = 0; i < 1000; i++) lines.push(`${i},x,0,0`);
    const problems = new ProblemLog(10);
    const reader = new LogStreamReader(STREAM_SPECS.odometry, linesOfText(lines.join('\n')), problems);
    await reader.start();
    while (await reader.advance());
    expect([problems.total, problems.shown.length, reader.skipped, reader.read]).toEqual([1000, 10, 1000, 1000]);
  });
});

describe('LogStreamReader attitude as Euler angles', () => {
  it('reads rollDeg, pitchDeg, yawDeg rows as quaternions', async () => {
    const { rows, reader } = await readAll('attitude', 'time,yawDeg,pitchDeg,rollDeg\n0,0,0,0\n0.01,180,0,0\n');
    expect(reader.layout).toBe(1);
    expect(rows[0]).toEqual([0, 1, 0, 0, 0]);
    expect(rows[1]![0]).toBe(0.01);
    expect(rows[1]![4]).toBeCloseTo(1, 15); // yaw 180 deg: q = [0, 0, 0, 1]
    expect(rows[1]![1]).toBeCloseTo(0, 15);
  });
});
