import { describe, expect, it } from 'vitest';
import { LogRecorder, type LogTextSink } from '../../../estimator/io/log/LogRecorder.js';
import { defaultFilterSpec } from '../../../estimator/io/log/filterSettings.js';
import { parseLogCameraText } from '../../../estimator/io/log/parseLogCamera.js';

function sink() {
  const files = new Map<string, string>();
  let closed = 0;
  const s: LogTextSink = { write: (f, t) => void files.set(f, (files.get(f) ?? '') + t), close: () => void closed++ };
  return { s, files, closed: () => closed };
}

const camera = { fx: 500, fy: 501, cx: 320, cy: 240, width: 640, height: 480, distortion: { k1: 0, k2: 0, k3: 0, p1: 0, p2: 0 }, mount: { offset: [0, 0, -0.05] as [number, number, number], rollDeg: 0, pitchDeg: 0, yawDeg: 0 } };

describe('LogRecorder', () => {
  it('writes the layout with shortest round-trip numbers that read back to the same doubles', () => {
    const { s, files, closed } = sink();
    const r = new LogRecorder(s, { camera, targetSize: 1.7, filter: defaultFilterSpec() });
    const third = 1 / 3;
    r.imu(0.01, [0.1 + 0.2, -third, 9.80665], [1, 0, 0, 0]);
    r.attitude(0.01, [1, 0, 0, 0]); // same time as the IMU step: not written twice
    r.odometry(0.01, [third, 0, 0]);
    r.box(0.09, 0.02, { xMin: 10.25, yMin: 20, xMax: 30, yMax: 40.5 }, 0.9);
    r.box(0.09, 0.005, { xMin: 1, yMin: 2, xMax: 3, yMax: 4 }, 1);
    r.truth(0.01, [1, 2, 3], [4, 5, 6], [7, 8, 9]);
    r.reset(0.05);
    r.estimate(0.01, new Float64Array(12).fill(third), new Float64Array(12).fill(2));
    r.close();
    r.close();
    expect(closed()).toBe(1);
    expect(files.get('imu.csv')).toBe('time,fx,fy,fz\n0.01,0.30000000000000004,-0.3333333333333333,9.80665\n');
    expect(Number(files.get('imu.csv')!.split('\n')[1]!.split(',')[2])).toBe(-third);
    expect(files.get('attitude.csv')).toBe('time,qw,qx,qy,qz\n0.01,1,0,0,0\n');
    expect(files.get('boxes.csv')).toBe('time,arrival,xMin,yMin,xMax,yMax,score\n0.02,0.09,10.25,20,30,40.5,0.9\n0.005,0.09,1,2,3,4,1\n');
    expect(files.get('truth.csv')).toBe('time,rx,ry,rz,vcx,vcy,vcz,vlx,vly,vlz\n0.01,1,2,3,4,5,6,7,8,9\n');
    expect(files.get('onboard.csv')!.split('\n')[0]).toBe('time,rx,ry,rz,vcx,vcy,vcz,vlx,vly,vlz,bax,bay,baz,P_rx,P_ry,P_rz,P_vcx,P_vcy,P_vcz,P_vlx,P_vly,P_vlz,P_bax,P_bay,P_baz');
    expect(parseLogCameraText(files.get('camera.json')!).camera).toEqual(camera);
    expect(JSON.parse(files.get('filter.json')!)).toEqual(defaultFilterSpec());
    expect(files.get('resets.csv')).toBe('time\n0.05\n');
    expect(Object.fromEntries(r.rows)).toEqual({ 'imu.csv': 1, 'attitude.csv': 1, 'odometry.csv': 1, 'boxes.csv': 2, 'truth.csv': 1, 'resets.csv': 1, 'onboard.csv': 1 });
  });

  it('flushes in chunks so a long trial never sits in memory whole', () => {
    const writes: number[] = [];
    const r = new LogRecorder({ write: (f, t) => void (f === 'imu.csv' && writes.push(t.length)), close: () => undefined }, { camera, targetSize: 1, filter: defaultFilterSpec(), truth: false });
    for (let k = 0; k < 50_000; k++) r.imu(k / 200, [0.1, 0.2, 9.8], [1, 0, 0, 0]);
    expect(writes.length).toBeGreaterThan(10); // ~1 MB of rows flushed along the way, before close
    expect(Math.max(...writes)).toBeLessThan(70_000);
    r.close();
  });
});
