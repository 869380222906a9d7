// A synthetic flight log for tests and the replay benchmark (not a test file): a lander
// trailing a carrier that drives at constant velocity, swaying along x (A sin(wt)), level
// attitude, a nadir camera, boxes projected from the true relative position with seeded
// pixel noise and a fixed latency (arrival on the next IMU step), noisy biased IMU and odometry.
// Files stream to disk in chunks, so a gigabyte log costs no memory to write.
import { closeSync, mkdirSync, openSync, writeFileSync, writeSync } from 'node:fs';
import { join } from 'node:path';
import { boxFromCentreSize } from '../../../estimator/camera/Box.js';
import { boxMeasurement } from '../../../estimator/camera/boxGeometry.js';
import { cameraFromBody, cameraPointFromWorldVector } from '../../../estimator/frames/cameraFromBody.js';
import { RandomStream } from '../../../estimator/random/RandomStream.js';

export interface SyntheticLogOptions {
  /** Log length (s) and stream rates (Hz). */
  duration: number;
  imuRate?: number;
  boxRate?: number;
  odometryRate?: number;
  /** Box latency (s); the box arrives at the first IMU step at or after capture + latency. */
  latency?: number;
  /** Write truth.csv (default true). */
  truth?: boolean;
  seed?: number;
  /** Amplitude (m) of the carrier's sway along x (default 0.5; 0 = constant velocity, the filter's own model). */
  sway?: number;
  /** Error (px) added to each box centre u at capture time t, on top of the white noise (default none). */
  boxUError?: (t: number) => number;
}

export const SYNTHETIC_CAMERA = {
  format: 'alight-log',
  version: 1,
  note: 'synthetic log for tests and benchmarks',
  width: 640,
  height: 480,
  intrinsics: { fx: 500, fy: 500, cx: 320, cy: 240 },
  distortion: { k1: 0, k2: 0, k3: 0, p1: 0, p2: 0 },
  mount: { offset: [0, 0, -0.05] as [number, number, number], rollDeg: 0, pitchDeg: 0, yawDeg: 0 },
  targetSize: 1.8,
};

const G = 9.80665;

class ChunkedFile {
  private text = '';
  bytes = 0;
  private readonly fd: number;
  constructor(path: string, header: string) {
    this.fd = openSync(path, 'w');
    this.line(header);
  }
  line(s: string): void {
    this.text += s + '\n';
    if (this.text.length > 1 << 16) this.flush();
  }
  flush(): void {
    this.bytes += writeSync(this.fd, this.text);
    this.text = '';
  }
  close(): void {
    this.flush();
    closeSync(this.fd);
  }
}

/** Write the log into `folder`; returns its size in bytes. */
export function writeSyntheticLog(folder: string, options: SyntheticLogOptions): number {
  const imuRate = options.imuRate ?? 200, boxRate = options.boxRate ?? 30, odometryRate = options.odometryRate ?? 20;
  const latency = options.latency ?? 0.05;
  const noise = RandomStream.fromKey([options.seed ?? 1, 0, 0, 77]);
  mkdirSync(folder, { recursive: true });
  writeFileSync(join(folder, 'camera.json'), JSON.stringify(SYNTHETIC_CAMERA, null, 2));
  // The filter settings state this generator's own noise and model: white 1.5 px boxes from the exact (flat) size
  // model (so no noise in proportion to the box) and the carrier's sway (0.5 m/s² / √Hz covers it).
  writeFileSync(join(folder, 'filter.json'), JSON.stringify({ rate: imuRate, boxModel: 'flat', pixelNoise: 1.5, sizeNoise: 1.5, pixelNoiseFraction: 0, sizeNoiseFraction: 0, carrierAccelNoise: 0.5, odometryNoise: 0.05, accelNoise: 0.05 }, null, 2));
  const imu = new ChunkedFile(join(folder, 'imu.csv'), 'time,fx,fy,fz');
  const attitude = new ChunkedFile(join(folder, 'attitude.csv'), 'time,qw,qx,qy,qz');
  const boxes = new ChunkedFile(join(folder, 'boxes.csv'), 'time,arrival,xMin,yMin,xMax,yMax,score');
  const odometry = new ChunkedFile(join(folder, 'odometry.csv'), 'time,vx,vy,vz');
  const truth = options.truth === false ? null : new ChunkedFile(join(folder, 'truth.csv'), 'time,rx,ry,rz,vcx,vcy,vcz,vlx,vly,vlz');
  const Rcb = cameraFromBody(SYNTHETIC_CAMERA.mount);
  const identity = [1, 0, 0, 0, 1, 0, 0, 0, 1];
  const camera = { ...SYNTHETIC_CAMERA.intrinsics, width: 640, height: 480, distortion: SYNTHETIC_CAMERA.distortion };
  const pCam = new Float64Array(3), m = new Float64Array(3), r = new Float64Array(3);
  const A = options.sway ?? 0.5, w = (2 * Math.PI) / 20;
  const vC = [2, 0.5, 0];
  const bias = [0.03, -0.02, 0.01];
  const steps = Math.floor(options.duration * imuRate);
  const boxEvery = imuRate / boxRate, odometryEvery = Math.round(imuRate / odometryRate);
  const queue: { capture: number; arrival: number; line: string }[] = [];
  let nextBox = 0;
  for (let k = 0; k <= steps; k++) {
    const t = k / imuRate;
    const s = Math.sin(w * t), c = Math.cos(w * t);
    // r = r0 - A sin(wt) x;  vL = vC + A w cos(wt) x;  aL = -A w^2 sin(wt) x
    r[0] = 0.4 - A * s;
    r[1] = -0.3;
    r[2] = -6;
    const vL = [vC[0]! + A * w * c, vC[1]!, vC[2]!];
    imu.line(`${t},${-A * w * w * s + bias[0]! + 0.02 * noise.gaussian()},${bias[1]! + 0.02 * noise.gaussian()},${G + bias[2]! + 0.02 * noise.gaussian()}`);
    attitude.line(`${t},1,0,0,0`);
    truth?.line(`${t},${r[0]},${r[1]},${r[2]},${vC[0]},${vC[1]},${vC[2]},${vL[0]},${vL[1]},${vL[2]}`);
    if (k % odometryEvery === 0) odometry.line(`${t},${vL[0]! + 0.05 * noise.gaussian()},${vL[1]! + 0.05 * noise.gaussian()},${vL[2]! + 0.05 * noise.gaussian()}`);
    if (k >= nextBox) {
      nextBox += boxEvery;
      cameraPointFromWorldVector(identity, Rcb, SYNTHETIC_CAMERA.mount.offset, r, pCam);
      boxMeasurement(camera, SYNTHETIC_CAMERA.targetSize, pCam, m);
      const b = boxFromCentreSize(m[0]! + 1.5 * noise.gaussian() + (options.boxUError?.(t) ?? 0), m[1]! + 1.5 * noise.gaussian(), m[2]! + 1.5 * noise.gaussian());
      const arrival = Math.ceil((t + latency) * imuRate - 1e-9) / imuRate;
      queue.push({ capture: t, arrival, line: `${t},${arrival},${b.xMin},${b.yMin},${b.xMax},${b.yMax},${Math.round(900 + 99 * noise.uniform()) / 1000}` });
    }
    while (queue.length > 0 && queue[0]!.arrival <= t) boxes.line(queue.shift()!.line);
  }
  let bytes = 0;
  for (const file of [imu, attitude, boxes, odometry, truth]) {
    if (!file) continue;
    file.close();
    bytes += file.bytes;
  }
  return bytes;
}
