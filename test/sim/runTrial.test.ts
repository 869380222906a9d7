import { describe, expect, it } from 'vitest';
import { setPath, setPaths } from '../../estimator/io/scenarioPath.js';
import { PHASES } from '../../estimator/sim/TrialResult.js';
import { blindHeight, runTrial, type TraceRow } from '../../estimator/sim/runTrial.js';
import type { TrialRecorder } from '../../estimator/io/log/TrialRecorder.js';
import { expectClose } from '../helpers/expectClose.js';
import { demoNames, loadDemo, sensingPerfect } from './demoTrials.js';


describe('runTrial', () => {
  it('is deterministic in (seed, point, trial) and different across trials', () => {
    const s = loadDemo('survey-rover.scenario.json');
    const key = { seed: 5, point: 2, trial: 3 };
    const a = runTrial(s, { key });
    expect(runTrial(s, { key })).toEqual(a);
    expect(runTrial(s, { key: { ...key, trial: 4 } })).not.toEqual(a);
    expect(runTrial(s, { key: { ...key, point: 3 } })).not.toEqual(a);
    // the default key is the scenario's seed, point 0, trial 0
    expect(runTrial(s)).toEqual(runTrial(s, { key: { seed: s.seed, point: 0, trial: 0 } }));
  });

  it.each(demoNames)('lands %s with perfect sensing for several seeds', (name) => {
    const s = sensingPerfect(loadDemo(name));
    for (const seed of [1, 2, 3]) {
      const r = runTrial(s, { key: { seed, point: 0, trial: 0 } });
      expect(r.outcome, `seed ${seed}: miss ${r.missDistance}, closing ${r.closingSpeed}, lateral ${r.lateralSpeed}, tilt ${r.tiltDeg}`).toBe('landed');
      expect(r.missDistance!).toBeLessThanOrEqual(s.envelope.padRadius);
    }
  });

  it('fills every result field consistently', () => {
    const s = loadDemo('delivery-van.scenario.json');
    const r = runTrial(sensingPerfect(s), { key: { seed: 1, point: 0, trial: 0 } });
    expect(r.outcome).toBe('landed');
    expectClose(Math.hypot(r.missX!, r.missY!), r.missDistance!, { rel: 1e-12 }, 'miss = hypot(missX, missY) (round-off)');
    const total = PHASES.reduce((sum, p) => sum + r.phaseTimes[p], 0);
    expectClose(total, r.touchdownTime!, { abs: 1e-6 }, 'phase times add up to the touchdown time (float sum of steps)');
    expect(r.phaseTimes.descend).toBeGreaterThan(0);
    expect(r.phaseTimes.trail + r.phaseTimes.align).toBeGreaterThan(0);
    expect(r.closingSpeed!).toBeGreaterThan(0);
    expect(r.tiltDeg!).toBeGreaterThanOrEqual(0);
    expect(r.positionRmse).toBeGreaterThan(0);
    expect(r.positionRmse).toBeLessThan(1);
    expect(r.velocityRmse).toBeGreaterThan(0);
    expect([r.neesDim, r.nisDim]).toEqual([6, 3]);
    expect(r.neesMean).toBeGreaterThan(0);
    expect(r.nisCount).toBeGreaterThan(100);
    // perfect sensing: at 30 Hz every frame until the deck overflows the image is a box, none false
    expect(r.boxes).toBeGreaterThan(200);
    expect([r.dropped, r.falseBoxes, r.aborts, r.divergence]).toEqual([0, 0, 0, null]);
  });

  it('counts dropped and false boxes and degrades the estimate under heavy impairment', () => {
    const s = loadDemo('survey-rover.scenario.json');
    const clean = runTrial(sensingPerfect(s), { key: { seed: 2, point: 0, trial: 0 } });
    const noisy = runTrial(setPaths(s, { 'detector.dropout': 0.3, 'detector.falseBoxRate': 2, 'detector.pixelNoise': 4 }), { key: { seed: 2, point: 0, trial: 0 } });
    expect(noisy.dropped).toBeGreaterThan(0.15 * (noisy.boxes + noisy.dropped));
    expect(noisy.falseBoxes).toBeGreaterThan(0);
    expect(noisy.positionRmse).toBeGreaterThan(clean.positionRmse);
  });

  it('times out when the carrier is never in view; a latency beyond filter.historyLength still uses every box', () => {
    const s = setPaths(loadDemo('survey-rover.scenario.json'), { 'lander.startOffset': [30, 30, 6], duration: 20 });
    const r = runTrial(s, { key: { seed: 1, point: 0, trial: 0 } });
    expect(r.outcome).toBe('timed-out');
    expect(r.touchdownTime).toBeNull();
    expect(r.missDistance).toBeNull();
    expectClose(r.phaseTimes.acquire, 20, { abs: 0.02 }, 'whole trial in acquire (one step)');
    expect(r.boxes).toBe(0);
    // latency beyond the configured 0.3 s history: the trial's history rises to fit (historyFor),
    // where it used to start nothing and time out
    const late = setPaths(loadDemo('survey-rover.scenario.json'), { 'detector.latency': 0.8, 'detector.latencyJitter': 0, duration: 40 });
    const stale = runTrial(late, { key: { seed: 1, point: 0, trial: 0 } });
    expect(stale.outcome).toBe('landed');
    expect(stale.nisCount).toBeGreaterThan(100);
  });

  it('aborts and re-acquires when the target leaves the image for longer than lostTimeout', () => {
    // a long bursty outage: Gilbert-Elliott with rare entry and slow exit (mean burst 100 frames)
    const s = setPaths(loadDemo('survey-rover.scenario.json'), { 'detector.burst': { enter: 0.01, exit: 0.01 } });
    const results = [1, 2, 3, 4, 5, 6].map((trial) => runTrial(s, { key: { seed: 3, point: 0, trial } }));
    expect(results.some((r) => r.aborts > 0)).toBe(true);
    // a re-start from a false box in the outage, never refuted, ends as a silent divergence
    for (const r of results) if (r.aborts > 0 && r.touchdownTime === null) expect(['aborted', 'diverged', 'silent-divergence']).toContain(r.outcome);
  });

  it('reports each step to onStep and every filter input to the recorder, in time order', () => {
    const s = setPath(loadDemo('harbour-boat.scenario.json'), 'duration', 3);
    const rows: TraceRow[] = [];
    const calls: Record<string, number[]> = { imu: [], attitude: [], odometry: [], box: [], truth: [], estimate: [] };
    const recorder: TrialRecorder = {
      imu: (t) => void calls.imu!.push(t),
      attitude: (t) => void calls.attitude!.push(t),
      odometry: (t) => void calls.odometry!.push(t),
      box: (t) => void calls.box!.push(t),
      truth: (t) => void calls.truth!.push(t),
      estimate: (t) => void calls.estimate!.push(t),
    };
    const result = runTrial(s, { onStep: (row) => void rows.push(row), recorder });
    expect(rows).toHaveLength(300);
    expectClose(rows[299]!.t, 3, { abs: 1e-9 }, 'last step at the duration (float steps)');
    expect(rows[0]!.estimate).toBeNull();
    expect(rows[299]!.estimate).not.toBeNull();
    expect(rows[299]!.sigma!.r[0]).toBeGreaterThan(0);
    expect(rows.filter((r) => r.box !== null).length).toBeGreaterThan(50);
    // every camera update is on a row with a box; its NIS and dimension come with it, and the
    // accepted ones are exactly those the trial result averages
    const updates = rows.flatMap((r) => r.updates);
    expect(updates.length).toBeGreaterThan(50);
    for (const r of rows) {
      if (r.updates.length > 0) expect(r.box).not.toBeNull();
      if (r.updates.length === 0) expect([r.update, r.nis, r.nisDim]).toEqual([null, null, null]);
    }
    for (const u of updates) {
      expect(u.dim).toBe(3);
      if (u.status === 'accepted' || u.status === 'gated') expect(u.nis).toBeGreaterThanOrEqual(0);
    }
    const accepted = updates.filter((u) => u.status === 'accepted');
    expect(accepted.length).toBe(result.nisCount);
    expectClose(accepted.reduce((a, u) => a + u.nis, 0) / accepted.length, result.nisMean, { rel: 1e-12 }, 'mean NIS (summation order)');
    expect(updates.filter((u) => u.status === 'gated').length).toBe(result.gateRejections);
    // the true outline comes with each capture: 30 frames per second, contains no noise, lies in the image
    const outlines = rows.filter((r) => r.outline !== null);
    expect(outlines.length).toBeGreaterThanOrEqual(80);
    expect(outlines.length).toBeLessThanOrEqual(91);
    for (const r of outlines) {
      expect(r.outline!.xMin).toBeGreaterThanOrEqual(0);
      expect(r.outline!.xMax).toBeGreaterThan(r.outline!.xMin);
      expect(r.outline!.yMax).toBeGreaterThan(r.outline!.yMin);
    }
    expect(calls.imu).toHaveLength(300); // IMU at 100 Hz
    expect(calls.odometry).toHaveLength(31); // odometry at 10 Hz: the first step, then 0.1 s ... 3 s
    expect(calls.truth).toHaveLength(300);
    for (const list of Object.values(calls)) for (let i = 1; i < list.length; i++) expect(list[i]!).toBeGreaterThanOrEqual(list[i - 1]!);
  });

  // Heavier box-centre noise must not help: success counts fall and the miss grows
  // (monotone trend over 30 seeded trials per level, not single runs).
  it('degrades monotonically with detector pixel noise over 30 trials per level', () => {
    const base = loadDemo('survey-rover.scenario.json');
    const levels = [0.5, 8, 30].map((pixelNoise) => {
      const s = setPath(base, 'detector.pixelNoise', pixelNoise);
      let landed = 0;
      const misses: number[] = [];
      for (let trial = 0; trial < 30; trial++) {
        const r = runTrial(s, { key: { seed: 7, point: 0, trial } });
        if (r.outcome === 'landed') landed++;
        if (r.missDistance !== null) misses.push(r.missDistance);
      }
      return { landed, meanMiss: misses.reduce((a, b) => a + b, 0) / misses.length };
    });
    expect(levels[0]!.landed).toBeGreaterThanOrEqual(levels[1]!.landed);
    expect(levels[1]!.landed).toBeGreaterThanOrEqual(levels[2]!.landed);
    expect(levels[0]!.landed - levels[2]!.landed).toBeGreaterThanOrEqual(20);
    expect(levels[1]!.meanMiss).toBeGreaterThan(levels[0]!.meanMiss);
  });
});

describe('blindHeight', () => {
  it('is where the longest deck side fills the smaller image side inside the margins (level, centred: pinhole similar triangles)', () => {
    // 3 m * 300 px / (480 - 2 * 4) px
    expectClose(blindHeight({ fx: 300, fy: 280, width: 640, height: 480 }, 3, 1.8, 4), (3 * 300) / 472, { rel: 1e-15 }, 'formula (round-off)');
  });
});
