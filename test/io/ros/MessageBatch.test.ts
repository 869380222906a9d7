import { describe, expect, it } from 'vitest';
import { BATCH_BYTES, forEachMessage, MessageBatch } from '../../../estimator/io/ros/MessageBatch.js';

const bytes = (n: number, seed: number) => Uint8Array.from({ length: n }, (_, i) => (i * 31 + seed) & 0xff);

describe('MessageBatch', () => {
  it('gives back every message packed, in order, with its channel, log time and bytes', () => {
    const batch = new MessageBatch();
    const sent = [
      { channelId: 1, logTime: 1_796_000_000_123_456_789n, data: bytes(0, 1) },
      { channelId: 65_535, logTime: 2n ** 64n - 1n, data: bytes(13, 2) }, // the largest uint64: no precision lost
      { channelId: 7, logTime: 0n, data: bytes(16, 3) },
    ];
    for (const m of sent) expect(batch.add(m.channelId, m.logTime, m.data)).toBe(true);
    expect(batch.used).toBe(16 + 0 + (16 + 16) + (16 + 16)); // headers, data padded to 8 bytes
    const got: { channelId: number; logTime: bigint; data: Uint8Array }[] = [];
    forEachMessage(batch.buffer, batch.used, (channelId, logTime, data) => got.push({ channelId, logTime, data: data.slice() }));
    expect(got).toEqual(sent);
  });

  it('refuses a message that does not fit what is left, and takes one larger than a batch when empty', () => {
    const batch = new MessageBatch();
    expect(batch.add(1, 1n, bytes(BATCH_BYTES - 64, 4))).toBe(true);
    expect(batch.add(1, 2n, bytes(100, 5))).toBe(false);
    batch.reset(new ArrayBuffer(BATCH_BYTES));
    const big = bytes(BATCH_BYTES + 5, 6);
    expect(batch.add(2, 3n, big)).toBe(true);
    let seen: Uint8Array | null = null;
    forEachMessage(batch.buffer, batch.used, (_c, _t, data) => (seen = data.slice()));
    expect(seen).toEqual(big);
  });
});
