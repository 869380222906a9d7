import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseRosMap, RosMapError } from '../../../estimator/io/ros/parseRosMap.js';

const problems = (text: string): string[] => {
  try {
    parseRosMap(text, 'flight.map.json');
  } catch (error) {
    expect(error).toBeInstanceOf(RosMapError);
    return [...(error as RosMapError).problems];
  }
  return [];
};

const minimal = { format: 'alight-ros-map', version: 1, camera: { topic: '/cam/info' }, targetSize: 1.8, boxes: { topic: '/det' }, imu: { topic: '/imu' } };

describe('parseRosMap', () => {
  it('fills defaults: ROS pixel centres, raw image, the IMU orientation as attitude, frames from frame ids', () => {
    const map = parseRosMap(JSON.stringify(minimal), 'm.json');
    expect(map.camera).toEqual({ topic: '/cam/info', image: 'raw', pixelCentres: 'integer', mount: { offset: [0, 0, 0], rollDeg: 0, pitchDeg: 0, yawDeg: 0 } });
    expect(map.attitude).toEqual({ topic: '/imu', world: 'auto', body: 'auto' });
    expect(map.boxes).toMatchObject({ topic: '/det', arrival: 'receive', stamp: 'header' });
    expect(map.odometry).toBeUndefined();
  });

  it('reports every problem with file, line and field', () => {
    const text = `{
  "format": "alight-ros-map",
  "version": 1,
  "camera": { "topic": "cam/info", "lens": 3 },
  "targetSize": 0,
  "boxes": { "topic": "/det", "score": "conf" },
  "imu": { "topic": "/imu", "body": "nwu" }
}`;
    expect(problems(text)).toEqual([
      'flight.map.json:4: camera.lens: unknown key (expected one of: topic, image, pixelCentres, mount, opticalTransform)',
      'flight.map.json:4: camera.topic: must match pattern "^/", got "cam/info"',
      'flight.map.json:5: targetSize: must be > 0, got 0',
      'flight.map.json:7: imu.body: must be one of "auto", "flu", "frd", got "nwu"',
    ]);
    expect(problems(JSON.stringify({ ...minimal, boxes: { topic: '/det', score: 'conf' } }))).toEqual(['flight.map.json:1: boxes.score: only for a message of your own: give boxes.corners too']);
  });

  it('checks the filter settings against the scenario schema', () => {
    expect(problems(JSON.stringify({ ...minimal, filter: { qScale: -1 } }, null, 1))).toEqual([expect.stringMatching(/^flight\.map\.json:\d+: filter\.qScale: must be > 0/)]);
  });

  it('says where broken JSON breaks', () => {
    expect(problems('{\n "format": "alight-ros-map",\n "version": 1,,\n}')).toEqual(['flight.map.json:3:15: not valid JSON: expected a string, found \',\'']);
  });

  it('accepts the example map shipped in data-demo/', () => {
    const path = join(__dirname, '../../../data-demo/ros/flight.map.json');
    const map = parseRosMap(readFileSync(path, 'utf8'), path);
    expect(map.truth?.lander).toBe('/mocap/lander/odom');
  });
});
