import { describe, expect, it } from 'vitest';
import { parseLogCamera, parseLogCameraText } from '../../../estimator/io/log/parseLogCamera.js';

const good = {
  format: 'alight-log',
  version: 1,
  width: 640,
  height: 480,
  intrinsics: { fx: 505, fy: 506, cx: 320, cy: 240 },
  targetSize: 1.8,
};

describe('parseLogCamera', () => {
  it('fills distortion, mount and offsets with their defaults', () => {
    const camera = parseLogCamera(good);
    expect(camera.camera).toEqual({
      fx: 505, fy: 506, cx: 320, cy: 240, width: 640, height: 480,
      distortion: { k1: 0, k2: 0, k3: 0, p1: 0, p2: 0 },
      mount: { offset: [0, 0, 0], rollDeg: 0, pitchDeg: 0, yawDeg: 0 },
    });
    expect(camera.targetSize).toBe(1.8);
    expect(camera.timeOffsets).toEqual({});
  });

  it('reads distortion, mount and per-stream offsets', () => {
    const camera = parseLogCamera({ ...good, distortion: { k1: -0.1, p2: 0.001 }, mount: { offset: [0.1, 0, -0.05], pitchDeg: 10 }, timeOffsets: { boxes: -0.012, odometry: 0.004 } });
    expect(camera.camera.distortion).toEqual({ k1: -0.1, k2: 0, k3: 0, p1: 0, p2: 0.001 });
    expect(camera.camera.mount).toEqual({ offset: [0.1, 0, -0.05], rollDeg: 0, pitchDeg: 10, yawDeg: 0 });
    expect(camera.timeOffsets).toEqual({ boxes: -0.012, odometry: 0.004 });
  });

  it('names the field of every kind of problem', () => {
    const cases: [unknown, string][] = [
      [[], 'camera.json: expected an object, got []'],
      [{ ...good, format: 'other' }, 'camera.json format: expected "alight-log", got "other"'],
      [{ ...good, version: 2 }, 'camera.json version: this alight reads log layout version 1, got 2'],
      [{ ...good, width: 640.5 }, 'camera.json width: expected a positive integer (px), got 640.5'],
      [{ ...good, intrinsics: { fx: 505, fy: 506, cx: 320 } }, 'camera.json intrinsics.cy: expected a number in [0, height=480] (px), got nothing'],
      [{ ...good, intrinsics: { ...good.intrinsics, fy: 'big' } }, 'camera.json intrinsics.fy: expected a positive number (px), got "big"'],
      [{ ...good, intrinsics: { ...good.intrinsics, skew: 0 } }, 'camera.json intrinsics.skew: unknown field (expected one of fx, fy, cx, cy)'],
      [{ ...good, distortion: { k4: 1 } }, 'camera.json distortion.k4: unknown field'],
      [{ ...good, mount: { offset: [0, 0] } }, 'camera.json mount.offset: expected [x, y, z] in body FLU (m), got [0,0]'],
      [{ ...good, mount: { yawDeg: 270 } }, 'camera.json mount.yawDeg: expected an angle in [-180, 180] (deg), got 270'],
      [{ ...good, targetSize: 0 }, 'camera.json targetSize: expected a positive size (m), got 0'],
      [{ ...good, timeOffsets: { lidar: 0 } }, 'camera.json timeOffsets.lidar: unknown field'],
      [{ ...good, timeOffsets: { imu: null } }, 'camera.json timeOffsets.imu: expected a number of seconds, got null'],
      [{ ...good, lens: {} }, 'camera.json lens: unknown field'],
    ];
    for (const [json, message] of cases) expect(() => parseLogCamera(json), message).toThrow(message);
  });

  it('reports text that is not JSON', () => {
    const lined = '{\n "format": "alight-log",\n "version": 1,\n "width": 640, "height": 480,\n "intrinsics": { "fx": 505, "fy": 505,\n   "cx": 320, "cy": 900 },\n "targetSize": 1.84 }';
    expect(() => parseLogCameraText(lined)).toThrow('camera.json:6 intrinsics.cy: expected a number in [0, height=480] (px), got 900');
    expect(() => parseLogCameraText('\uFEFF' + lined.replace('900', '240'))).not.toThrow(); // byte-order mark accepted
    expect(() => parseLogCameraText(lined.replace('"version": 1', '"version": 1, "width": 1'))).toThrow('camera.json:4:2: not valid JSON: duplicate key "width" (first given on line 3)');
    expect(() => parseLogCameraText('{"width": 640,')).toThrow("camera.json:1:15: not valid JSON: expected a string, found end of file");
  });
});
