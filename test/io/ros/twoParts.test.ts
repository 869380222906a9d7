import { describe, expect, it } from 'vitest';
import type { Route } from '../../../estimator/io/ros/recordingRoutes.js';
import { splitRoutes } from '../../../estimator/io/ros/twoParts.node.js';

const routes: Route[] = [
  { role: 'camera', topic: '/cam/info' },
  { role: 'boxes', topic: '/det' },
  { role: 'imu', topic: '/imu' },
  { role: 'attitude', topic: '/imu' },
  { role: 'odometry', topic: '/odom' },
  { role: 'truthLander', topic: '/mocap/l' },
  { role: 'truthCarrier', topic: '/mocap/c' },
];

describe('splitRoutes', () => {
  it('balances message counts, keeps the roles of a topic and both truth topics together', () => {
    const counts = new Map([['/cam/info', 30], ['/det', 30], ['/imu', 200], ['/odom', 20], ['/mocap/l', 100], ['/mocap/c', 100]]);
    const [a, b] = splitRoutes(routes, counts)!;
    const topics = (part: Route[]) => part.map((r) => r.topic);
    // Greedy, heaviest first, to the lighter side (ties to the first): imu 200 | truth 200, camera 30 | boxes 30, odometry 20 |: 250 vs 230.
    expect(topics(a)).toEqual(['/imu', '/imu', '/cam/info', '/odom']);
    expect(topics(b)).toEqual(['/mocap/l', '/mocap/c', '/det']);
  });

  it('does not split without message counts (no statistics in the file) or with one topic', () => {
    expect(splitRoutes(routes, new Map())).toBeNull();
    expect(splitRoutes([{ role: 'imu', topic: '/imu' }, { role: 'attitude', topic: '/imu' }], new Map([['/imu', 5]]))).toBeNull();
  });
});
