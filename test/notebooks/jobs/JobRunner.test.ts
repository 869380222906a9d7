import { describe, expect, it } from 'vitest';
import { StateChannel } from '../../../notebooks/jobs/JobRunner.js';
import type { JobState } from '../../../notebooks/jobs/JobState.js';

const state = (done: number, final = false): JobState<number> => ({ done, total: 3, value: done, final, cancelled: false, error: null });

describe('StateChannel', () => {
  it('coalesces progress to the latest state but never drops the final one', async () => {
    const channel = new StateChannel<number>(() => {});
    channel.push(state(1));
    channel.push(state(2));
    expect((await channel.next()).value).toEqual(state(2));
    channel.push(state(3, true));
    channel.push(state(9));
    expect((await channel.next()).value).toEqual(state(3, true));
    expect((await channel.next()).done).toBe(true);
  });

  it('hands a state to a waiting reader at once', async () => {
    const channel = new StateChannel<number>(() => {});
    const pending = channel.next();
    channel.push(state(1));
    expect((await pending).value).toEqual(state(1));
  });

  it('cancels the job when the reader returns early, once', async () => {
    let cancels = 0;
    const channel = new StateChannel<number>(() => cancels++);
    const pending = channel.next();
    await channel.return();
    await channel.return();
    expect(cancels).toBe(1);
    expect((await pending).done).toBe(true);
  });
});
