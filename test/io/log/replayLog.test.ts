import { mkdtempSync, readFileSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { replayLog, type ReplayReport } from '../../../estimator/io/log/replayLog.js';
import { logSourceFromFiles } from '../../../estimator/io/log/LogSource.js';
import { logSourceFromFolder } from '../../../estimator/io/log/logSourceFromFolder.node.js';
import { LogLayoutError } from '../../../estimator/io/log/LogProblem.js';
import { FilterSettingsError } from '../../../estimator/io/log/filterSettings.js';
import { averagedChiSquareInterval } from '../../../estimator/stats/chiSquare.js';
import { expectClose } from '../../helpers/expectClose.js';
import { writeSyntheticLog } from './syntheticLog.js';

let folder = '';
let files = new Map<string, string>();
let clean: ReplayReport;

/** The synthetic log's files as texts, with one file changed. */
function withFile(name: string, change: (text: string) => string | undefined): Map<string, string> {
  const copy = new Map(files);
  const text = change(copy.get(name) ?? '');
  if (text === undefined) copy.delete(name);
  else copy.set(name, text);
  return copy;
}

const replayTexts = async (texts: Map<string, string>) => replayLog(await logSourceFromFiles(texts));

function expectRowsAddUp(report: ReplayReport): void {
  for (const [name, rows] of Object.entries(report.rows)) {
    expect(rows.used + rows.skipped + rows.unused, `${name}: read = used + skipped + unused`).toBe(rows.read);
    expect(Object.values(rows.unusedReasons).reduce((a, b) => a + b, 0), `${name}: every unused row has a reason`).toBe(rows.unused);
  }
}

beforeAll(async () => {
  folder = mkdtempSync(join(tmpdir(), 'alight-replay-'));
  writeSyntheticLog(folder, { duration: 20, seed: 3 });
  files = new Map(readdirSync(folder).map((f) => [f, readFileSync(join(folder, f), 'utf8')]));
  clean = await replayLog(logSourceFromFolder(folder));
});

describe('replayLog on a synthetic log with truth', () => {
  it('uses every row it can and accounts for the rest', () => {
    expect(clean.rows.imu).toMatchObject({ read: 4001, skipped: 0 });
    expect(clean.rows.boxes!.read).toBe(files.get('boxes.csv')!.trim().split('\n').length - 1);
    expect(clean.problems.total).toBe(0);
    expect(clean.start).toBe(0.05); // first box: captured at 0, arrives 50 ms later, when the filter starts
    expect(clean.filterSteps).toBe(4001 - 11); // IMU steps after the start at step 10 (t = 0.05)
    expectRowsAddUp(clean);
  });

  it('reports NIS with the chi-square interval for its own count (Bar-Shalom et al. 2001, 5.4)', () => {
    expect(clean.nisDim).toBe(3);
    expect(clean.nisCount).toBeGreaterThan(590);
    const [lo, hi] = averagedChiSquareInterval(clean.nisCount, 3, 0.95);
    expect(clean.nisBounds).toEqual([lo, hi]);
    // Simulated box noise 1.5 px on centre and size, the filter assumes 1.5 px: NIS near 3.
    expectClose(clean.nisMean!, 3, { abs: 0.6 }, 'NIS mean'); // box model and delay add a little
    expect(clean.whiteness.tests.length).toBe(8); // 2 NIS sequences, odometry vx vy vz, box u v s
  });

  it('compares with truth: small errors and a NEES near its dimension', () => {
    expect(clean.neesDim).toBe(6);
    expect(clean.neesCount).toBe(clean.rows.truth!.used);
    expect(clean.positionRmse!).toBeLessThan(0.1); // m, at 6 m with 1.5 px noise
    expect(clean.velocityRmse!).toBeLessThan(0.4); // m/s, includes the start-up transient
    expect(clean.neesMean!).toBeGreaterThan(0.5);
    expect(clean.neesMean!).toBeLessThan(20);
  });

  it('gives the same report from dropped-file texts (browser path) as from the folder (readline/chunks path)', async () => {
    const fromTexts = await replayTexts(files);
    expect(fromTexts.nisMean).toBe(clean.nisMean);
    expect(fromTexts.neesMean).toBe(clean.neesMean);
    expect(fromTexts.rows).toEqual(clean.rows);
  });

  it('streams one estimate per IMU step after the start, then the last state', async () => {
    const times: number[] = [];
    await replayLog(logSourceFromFolder(folder), { onEstimate: (t, x, P, n) => void times.push(t + 0 * x[0]! * P[0]! * n) });
    expect(times.length).toBe(clean.filterSteps + 1);
    expect(times[0]).toBe(0.05);
    expect(times.at(-1)).toBe(20);
  });
});

describe('replayLog callbacks for plotting', () => {
  it('onUpdate sees every evaluated update with its NIS, onTruth every compared truth row', async () => {
    const updates = { boxes: 0, odometry: 0, accepted: 0, nisSum: 0 };
    let truthRows = 0;
    const report = await replayLog(logSourceFromFolder(folder), {
      onUpdate: (time, stream, status, nis) => {
        updates[stream]++;
        if (stream === 'boxes' && status === 'accepted') {
          updates.accepted++;
          updates.nisSum += nis;
        }
        expect(Number.isFinite(time)).toBe(true);
      },
      onTruth: (row) => {
        truthRows++;
        expect(row.length).toBe(10);
      },
    });
    const refused = (s: Record<string, number>) => Object.values(s).reduce((a, b) => a + b, 0);
    expect(updates.boxes).toBe(report.nisCount + report.boxes.gated + refused(report.boxes.refused));
    expect(updates.odometry).toBe(report.odometry.count + report.odometry.gated + refused(report.odometry.refused));
    expectClose(updates.nisSum / updates.accepted, report.nisMean!, { rel: 1e-12 }, 'NIS mean'); // same sum, same order
    expect(truthRows).toBe(report.rows.truth!.used);
  });
});

describe('replayLog validation', () => {
  it('skips and counts bad rows in every stream without losing the rest', async () => {
    const texts = withFile('imu.csv', (t) => {
      const lines = t.split('\n');
      lines.splice(100, 0, lines[100]!); // a duplicated row
      lines[300] = lines[300]!.replace(/,[^,]*$/, ',NaN');
      return lines.join('\n');
    });
    const boxLines = texts.get('boxes.csv')!.split('\n');
    const fields = boxLines[50]!.split(',');
    boxLines[50] = [fields[0], fields[1], fields[4], fields[3], fields[2], fields[5], fields[6]].join(','); // xMax < xMin
    texts.set('boxes.csv', boxLines.join('\n'));
    const report = await replayTexts(texts);
    expect(report.problems.byKind).toEqual({ 'duplicate-row': 1, 'not-a-number': 1, 'box-inverted': 1 });
    expect(report.problems.shown.map((p) => `${p.file}:${p.line} ${p.column}`).sort()).toEqual(['boxes.csv:51 xMax', 'imu.csv:102 null', 'imu.csv:301 fz']);
    expect(report.rows.imu!.skipped).toBe(2);
    expect(report.rows.boxes!.skipped).toBe(1);
    expect(report.rows.imu!.read).toBe(4002);
    expectRowsAddUp(report);
  });

  it('applies a per-stream time offset from camera.json', async () => {
    // Boxes logged on a clock 0.5 s behind: without the offset the filter sees stale boxes.
    const shifted = withFile('boxes.csv', (t) => t.split('\n').map((line, i) => (i === 0 || line === '' ? line : line.split(',').map((v, k) => (k < 2 ? String(Number(v) - 0.5) : v)).join(','))).join('\n'));
    const wrong = await replayTexts(shifted);
    shifted.set('camera.json', JSON.stringify({ ...JSON.parse(files.get('camera.json')!), timeOffsets: { boxes: 0.5 } }));
    const right = await replayTexts(shifted);
    expectClose(right.start!, 0.05, { abs: 1e-12 }, 'start'); // 0.05 - 0.5 + 0.5 in floating point
    // Same boxes; times differ from the clean log only by rounding, which may move a box across an
    // IMU step of equal time: NIS agrees to a fraction of a percent.
    expectClose(right.nisMean!, clean.nisMean!, { rel: 5e-3 }, 'NIS with offset');
    // Without the offset, boxes seem to arrive before there is any attitude to use them with.
    expect(wrong.rows.boxes!.unusedReasons['no-attitude-yet']).toBeGreaterThan(0);
    expect(right.rows.boxes!.unusedReasons['no-attitude-yet']).toBeUndefined();
  });

  it('stops with a layout error naming the file and field', async () => {
    await expect(replayTexts(withFile('camera.json', () => undefined))).rejects.toThrow('camera.json: missing');
    await expect(replayTexts(withFile('camera.json', () => '{"format": "alight-log",'))).rejects.toThrow(/camera.json:1:25: not valid JSON/);
    await expect(replayTexts(withFile('camera.json', (t) => t.replace('"fx": 500', '"fx": -500')))).rejects.toThrow(/^camera.json:\d+ intrinsics.fx: expected a positive number \(px\), got -500$/);
    await expect(replayTexts(withFile('imu.csv', () => undefined))).rejects.toThrow(LogLayoutError);
    await expect(replayTexts(withFile('attitude.csv', () => undefined))).rejects.toThrow('attitude.csv: missing');
    await expect(replayTexts(withFile('odometry.csv', (t) => t.replace('time,vx,vy,vz', 'time,vx,vy')))).rejects.toThrow('odometry.csv:1 vz: missing column "vz"');
    await expect(replayTexts(withFile('filter.json', () => '{"qScale": 0}'))).rejects.toThrow(FilterSettingsError);
    await expect(replayLog(await logSourceFromFiles(files), { filter: { rScale: -1 } })).rejects.toThrow('settings: rScale: must be > 0, got -1');
  });

  it('replays without truth and without odometry', async () => {
    const texts = withFile('truth.csv', () => undefined);
    texts.delete('odometry.csv');
    const report = await replayTexts(texts);
    expect(report.neesMean).toBeNull();
    expect(report.positionRmse).toBeNull();
    expect(report.rows.truth).toBeUndefined();
    expect(report.odometry.count).toBe(0);
    expect(report.nisCount).toBeGreaterThan(590);
    expectRowsAddUp(report);
  });

  it('applies a box stamped between two IMU steps at the filter clock, as the lander does', async () => {
    // Boxes with no arrival column and capture times 2 ms after an IMU step (200 Hz = 5 ms).
    const texts = withFile('boxes.csv', (t) => ['time,xMin,yMin,xMax,yMax', ...t.split('\n').slice(1).filter((l) => l !== '').map((l) => {
      const f = l.split(',');
      return [Number(f[0]) + 0.002, f[2], f[3], f[4], f[5]].join(',');
    })].join('\n'));
    const report = await replayTexts(texts);
    // Stamped ahead of the filter clock: without clamping the filter would refuse each as measurement-after-filter-time.
    expect(report.rows.boxes!.unused).toBe(0);
    expect(report.boxes.refused).toEqual({});
    expect(report.nisCount + report.boxes.gated).toBe(report.rows.boxes!.read - 1); // the first box started the filter
    expectClose(report.nisMean!, clean.nisMean!, { rel: 0.1 }, 'NIS'); // same boxes, 50 ms fresher, 2 ms late
    expectRowsAddUp(report);
  });
});

describe('replayLog streams', () => {
  it('pulls every file only as far as the merge needs: no stream is read ahead of the others', async () => {
    // A source whose line generators note each data row they hand out, in order.
    const pulled: [string, number][] = [];
    const source = await logSourceFromFiles(files);
    const original = source.open.bind(source);
    const watched = { ...source, openChunks: undefined, open: (stream: Parameters<typeof source.open>[0]) => {
      const lines = original(stream);
      if (lines === null) return null;
      return (async function* () {
        for await (const line of lines) {
          const t = Number(line.split(',')[stream === 'boxes' ? 1 : 0]); // boxes merge by arrival
          if (Number.isFinite(t)) pulled.push([stream, t]);
          yield line;
        }
      })();
    } };
    const report = await replayLog(watched);
    expect(report.nisMean).toBe(clean.nisMean);
    // At every pull, the row's time is at most one row ahead of what every other stream has handed out.
    const last = new Map<string, number>();
    let lead = 0;
    const counts = new Map<string, number>();
    for (const [stream, t] of pulled) {
      counts.set(stream, (counts.get(stream) ?? 0) + 1);
      last.set(stream, t);
      for (const [other, tOther] of last) {
        const done = counts.get(other) === report.rows[other as keyof typeof report.rows]!.read;
        if (other !== stream && !done) lead = Math.max(lead, t - tOther);
      }
    }
    expect(new Set(pulled.map(([s]) => s)).size).toBe(5); // boxes, imu, attitude, odometry, truth
    expect(lead).toBeLessThan(0.1); // s: a row or two of the slowest stream (odometry at 20 Hz = 0.05 s)
  });
});

describe('replayLog closes what it opened', () => {
  it('lets go of every file after a layout error in one of them', async () => {
    const texts = withFile('odometry.csv', (t) => t.replace('time,vx,vy,vz', 'time,vx,vy'));
    const source = await logSourceFromFiles(texts);
    const closed: string[] = [];
    const original = source.openChunks!.bind(source);
    const watched = { ...source, openChunks: (stream: Parameters<typeof original>[0]) => {
      const chunks = original(stream);
      if (chunks === null) return null;
      return (async function* () {
        try {
          yield* chunks;
        } finally {
          closed.push(stream);
        }
      })();
    } };
    await expect(replayLog(watched)).rejects.toThrow('odometry.csv:1 vz: missing column "vz"');
    // truth.csv was next in line and never started: a generator that never ran has nothing to
    // close (a file stream is destroyed by return() all the same).
    expect(closed.sort()).toEqual(['attitude', 'boxes', 'imu', 'odometry']);
  });
});

describe('replayLog progress', () => {
  it('reports progress every 65,536 merged rows with the log time reached', async () => {
    const long = mkdtempSync(join(tmpdir(), 'alight-replay-long-'));
    writeSyntheticLog(long, { duration: 170, truth: false, seed: 8 });
    const calls: [number, number][] = [];
    const report = await replayLog(logSourceFromFolder(long), { onProgress: (rows, time) => void calls.push([rows, time]) });
    const total = Object.values(report.rows).reduce((a, r) => a + r.read, 0);
    expect(total).toBeGreaterThan(65_536);
    expect(calls.map(([rows]) => rows)).toEqual(Array.from({ length: Math.floor(total / 65_536) }, (_, i) => (i + 1) * 65_536));
    // rows of the 200 Hz IMU and attitude streams dominate: 65,536 rows reach about 65,536 / 430 Hz of log time
    expect(calls[0]![1]).toBeGreaterThan(100);
    expect(calls[0]![1]).toBeLessThan(170);
  });
});
