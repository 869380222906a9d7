import { describe, expect, it } from 'vitest';
import { ProgressClock } from '../../../notebooks/host/ProgressClock.js';

describe('ProgressClock', () => {
  it('never runs backwards while ten queued jobs start one after another, and says the time left', () => {
    const clock = new ProgressClock();
    const shown: number[] = [];
    // Ten jobs of 4 trials, two at a time, the rest queued with no total yet: the localization study's shape.
    let t = 0;
    for (let first = 0; first < 10; first += 2) {
      for (let done = 0; done <= 4; done++) {
        const activity = Array.from({ length: 10 - first }, (_, k) => ({ id: first + k, label: 'sweep', done: k < 2 ? done : 0, total: k < 2 ? 4 : 0 }));
        shown.push(clock.read(activity, (t += 250)).fraction);
      }
    }
    for (let i = 1; i < shown.length; i++) expect(shown[i]!, `reading ${i}`).toBeGreaterThanOrEqual(shown[i - 1]!);
    expect(shown.at(-1)!).toBe(1);
    const text = clock.read([{ id: 99, label: 'sweep', done: 1, total: 4 }], (t += 2000)).text;
    expect(text).toMatch(/^sweep: 1 of 4 · about \d+ s left$/);
    // Idle resets the batch.
    expect(clock.read([], t).fraction).toBe(1);
    expect(clock.read([{ id: 100, label: 'next', done: 0, total: 10 }], t + 1).fraction).toBe(0);
  });
});
