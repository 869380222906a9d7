import { describe, expect, it } from 'vitest';
import { defaultScenario } from '../../../estimator/io/defaultScenario.js';
import { validateScenario } from '../../../estimator/io/validateScenario.js';
import type { LogTextSink } from '../../../estimator/io/log/LogRecorder.js';
import { logSourceFromFiles } from '../../../estimator/io/log/LogSource.js';
import { recordTrial } from '../../../estimator/io/log/recordTrial.js';
import { replayLog } from '../../../estimator/io/log/replayLog.js';
import type { Scenario } from '../../../estimator/sim/Scenario.js';
import { intrinsicsFromSpec } from '../../../estimator/sim/world/cameraFromSpec.js';
import { expectClose } from '../../helpers/expectClose.js';

function memorySink(): LogTextSink & { files: Map<string, string> } {
  const files = new Map<string, string>();
  return { files, write: (file, text) => void files.set(file, (files.get(file) ?? '') + text), close: () => undefined };
}

function scenario(changes: (s: Scenario) => void): Scenario {
  const s = defaultScenario();
  s.duration = 30;
  changes(s);
  return validateScenario(s, 'test scenario');
}

async function recordAndReplay(s: Scenario, truth = true) {
  const sink = memorySink();
  const { result, rows } = recordTrial(s, sink, { truth });
  const report = await replayLog(await logSourceFromFiles(sink.files));
  return { result, rows, report, files: sink.files };
}

describe('record then replay', () => {
  // Tolerance: exact. The recorder prints every number in JavaScript's shortest round-trip
  // form, so each value read back is the very double the simulator handed its filter; the
  // merge applies the same calls in the same order (IMU step, odometry, then boxes of a step),
  // so the replayed filter repeats the simulator's arithmetic bit for bit.
  it('reproduces the simulator\'s own estimates with false boxes, latency jitter, bursts and a camera clock offset', async () => {
    const s = scenario((x) => {
      x.detector.falseBoxRate = 0.5;
      x.detector.burst = { enter: 0.02, exit: 0.3 };
      x.localization.clockOffset = 0.004;
    });
    const { result, rows, report } = await recordAndReplay(s);
    expect(report.onboard!.compared).toBe(rows['onboard.csv']);
    expect(report.onboard!.compared).toBeGreaterThan(1000);
    expect(report.onboard!.maxStateDifference).toBe(0);
    expect(report.nisCount).toBe(result.nisCount);
    expect(report.nisMean).toBe(result.nisMean);
    expect(report.gateRejections - report.odometry.gated).toBe(result.gateRejections);
    expect(report.neesMean).toBe(result.neesMean);
    // RMS errors: same squares, summed in another order (rounding only).
    expectClose(report.positionRmse!, result.positionRmse, { rel: 1e-12 }, 'position RMSE');
    expectClose(report.velocityRmse!, result.velocityRmse, { rel: 1e-12 }, 'velocity RMSE');
    expect(report.problems.total).toBe(0);
    // Every box that reached the filter is in the log (a few captured last may still be in flight).
    expect(report.rows.boxes!.read).toBe(rows['boxes.csv']);
    expect(rows['boxes.csv']).toBeLessThanOrEqual(result.boxes + result.falseBoxes);
    expect(rows['boxes.csv']).toBeGreaterThanOrEqual(result.boxes + result.falseBoxes - 5);
  });

  it('reproduces a 15-state Singer filter with loose camera updates', async () => {
    const s = scenario((x) => {
      x.filter.carrierModel = 'singer';
      x.filter.cameraUpdate = 'loose';
    });
    const { result, report } = await recordAndReplay(s);
    expect(report.filter.carrierModel).toBe('singer'); // from the log's filter.json
    expect(report.onboard!.maxStateDifference).toBe(0);
    expect(report.nisMean).toBe(result.nisMean);
  });

  it('reproduces a filter with the deck-scale state (16 states: Singer and s), tight and loose', async () => {
    for (const cameraUpdate of ['tight', 'loose'] as const) {
      const s = scenario((x) => {
        x.filter.carrierModel = 'singer';
        x.filter.cameraUpdate = cameraUpdate;
        x.filter.deckScaleSigma = 0.05;
      });
      const { result, report, files } = await recordAndReplay(s);
      expect(report.filter.deckScaleSigma).toBe(0.05); // from the log's filter.json
      // the onboard estimate keeps the layout's 15 states; s is the filter's own
      expect(files.get('onboard.csv')!.split('\n')[0]!.split(',')).toHaveLength(1 + 2 * 15);
      expect(report.onboard!.compared).toBeGreaterThan(1000);
      expect(report.onboard!.maxStateDifference).toBe(0);
      expect(report.nisMean).toBe(result.nisMean);
      // the estimate the replay ends with is the trial's at touchdown (same filter, same last step)
      expect(report.deckScaleEstimate).toEqual(result.deckScaleEstimate);
    }
  });

  it('reproduces a trial whose IMU (50 Hz) is slower than the filter loop (100 Hz)', async () => {
    const s = scenario((x) => {
      x.localization.imuRate = 50;
    });
    const { result, report } = await recordAndReplay(s);
    expect(report.onboard!.compared).toBeGreaterThan(1000);
    expect(report.onboard!.maxStateDifference).toBe(0);
    expect(report.nisMean).toBe(result.nisMean);
    expect(report.problems.total).toBe(0);
  });

  it('reproduces a trial with aborts and re-acquisitions (resets.csv)', async () => {
    const s = scenario((x) => {
      x.seed = 2;
      x.detector.falseBoxRate = 0.5;
      x.detector.burst = { enter: 0.03, exit: 0.02 }; // bursts of ~50 frames: the target is lost, the supervisor aborts
    });
    const { result, rows, report } = await recordAndReplay(s);
    expect(result.aborts).toBeGreaterThan(0);
    // one reset per abort, plus one per start dropped because the boxes after it were all gated
    expect(rows['resets.csv']).toBeGreaterThanOrEqual(result.aborts);
    expect(report.restarts).toBeGreaterThan(0);
    expect(report.onboard!.maxStateDifference).toBe(0);
    expect(report.nisMean).toBe(result.nisMean);
  });

  it('writes the believed camera and no truth.csv when asked', async () => {
    const s = scenario((x) => {
      x.localization.biasDraw = 'fixed'; // the errors as written, so the expected belief is known here
      x.localization.focalError = 0.02;
      x.localization.targetSizeError = 0.1;
    });
    const { files, report } = await recordAndReplay(s, false);
    expect(files.has('truth.csv')).toBe(false);
    expect(report.neesMean).toBeNull();
    const camera = JSON.parse(files.get('camera.json')!);
    expect(camera.intrinsics.fx).toBe(intrinsicsFromSpec(s.camera).fx * 1.02); // the filter's belief, not the true lens
    expectClose(camera.targetSize, Math.sqrt(2 * 1.6) * 1.1, { rel: 1e-15 }, 'target size'); // sqrt(L W)(1 + error)
    expect(camera.format).toBe('alight-log');
  });
});
