// Message bytes placed for fast CDR decoding, and a cheap test for a message that repeats another.

/**
 * A reused buffer that holds each message at byte offset 4 (mod 8): CDR aligns 8-byte values
 * relative to the end of its 4-byte encapsulation header, so there they are also aligned in
 * memory and the decoder hands out arrays (covariances) as views instead of copying them value
 * by value. Decoded arrays are therefore only valid until the next message.
 */
export class AlignedBytes {
  private buffer = new ArrayBuffer(1 << 12);

  place(data: Uint8Array): Uint8Array {
    if (data.length + 4 > this.buffer.byteLength) this.buffer = new ArrayBuffer(2 * (data.length + 4));
    const view = new Uint8Array(this.buffer, 4, data.length);
    view.set(data);
    return view;
  }
}

/** Two CDR messages equal after the encapsulation header and header.stamp (4 + 8 bytes). */
export function sameAfterStamp(a: Uint8Array, b: Uint8Array): boolean {
  if (a.length !== b.length) return false;
  for (let i = 12; i < a.length; i++) if (a[i] !== b[i]) return false;
  return true;
}
