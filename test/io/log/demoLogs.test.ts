import { describe, expect, it } from 'vitest';
import { fileURLToPath } from 'node:url';
import { logSourceFromFolder } from '../../../estimator/io/log/logSourceFromFolder.node.js';
import { replayLog } from '../../../estimator/io/log/replayLog.js';

const demo = (name: string) => fileURLToPath(new URL(`../../../data-demo/logs/${name}`, import.meta.url));

describe('the committed demo logs', () => {
  it('harbour-boat (with truth) replays cleanly: no bad row, NIS and NEES with their bounds', async () => {
    const report = await replayLog(logSourceFromFolder(demo('harbour-boat')));
    expect(report.problems.total).toBe(0);
    expect(report.rows.truth!.read).toBeGreaterThan(500);
    expect(report.nisCount).toBeGreaterThan(100);
    expect(report.nisBounds).not.toBeNull();
    expect(report.neesMean).not.toBeNull();
    expect(report.positionRmse!).toBeLessThan(2); // m: the lander did land on it
    expect(report.divergence).toBeNull();
  });

  it('delivery-van-no-truth replays without truth: consistency from innovations only', async () => {
    const report = await replayLog(logSourceFromFolder(demo('delivery-van-no-truth')));
    expect(report.problems.total).toBe(0);
    expect(report.rows.truth).toBeUndefined();
    expect(report.neesMean).toBeNull();
    expect(report.whiteness.tests.length).toBe(8); // 2 NIS sequences, odometry vx vy vz, box u v s
    expect(report.nisCount).toBeGreaterThan(100);
  });
});
