// Messages packed into one ArrayBuffer, so a batch of thousands crosses between threads as one
// transferable buffer (moved, not copied, and no structured clone of small objects). Each
// message: channel id (uint32), data length (uint32), log time (uint64, ns), the data, padding
// to 8 bytes; little-endian. Browser-safe.

/**
 * Bytes of a batch buffer; a message larger than that gets a buffer of its own. 1 MB batches
 * made the hand-offs between the threads (about a thousand per GB) cost more than 4 MB ones.
 */
export const BATCH_BYTES = 1 << 22;
const HEAD = 16;
const padded = (n: number) => (n + 7) & ~7;

/** Fills one batch buffer. */
export class MessageBatch {
  buffer: ArrayBuffer;
  private view: DataView;
  private bytes: Uint8Array;
  /** Bytes used. */
  used = 0;

  constructor(buffer: ArrayBuffer = new ArrayBuffer(BATCH_BYTES)) {
    this.buffer = buffer;
    this.view = new DataView(buffer);
    this.bytes = new Uint8Array(buffer);
  }

  /** False when the message does not fit in what is left (an empty batch takes any message: it grows). */
  add(channelId: number, logTime: bigint, data: Uint8Array): boolean {
    const size = HEAD + padded(data.length);
    if (this.used + size > this.buffer.byteLength) {
      if (this.used > 0) return false;
      this.reset(new ArrayBuffer(size));
    }
    const at = this.used;
    this.view.setUint32(at, channelId, true);
    this.view.setUint32(at + 4, data.length, true);
    this.view.setBigUint64(at + 8, logTime, true);
    this.bytes.set(data, at + HEAD);
    this.used = at + size;
    return true;
  }

  /** Start over in `buffer` (a batch buffer handed back by the other thread). */
  reset(buffer: ArrayBuffer): void {
    this.buffer = buffer;
    this.view = new DataView(buffer);
    this.bytes = new Uint8Array(buffer);
    this.used = 0;
  }
}

/** Call `each` for every message of a batch, in order; `data` is a view valid during the call. */
export function forEachMessage(buffer: ArrayBuffer, used: number, each: (channelId: number, logTime: bigint, data: Uint8Array) => void): void {
  const view = new DataView(buffer);
  for (let at = 0; at < used;) {
    const length = view.getUint32(at + 4, true);
    each(view.getUint32(at, true), view.getBigUint64(at + 8, true), new Uint8Array(buffer, at + HEAD, length));
    at += HEAD + padded(length);
  }
}
