// Text lines of one log file, from line input (one string per line) or chunk input (text in
// pieces that may split lines anywhere): blank lines and # comments are passed over, the line
// counter keeps counting them. next() is synchronous while buffered text lasts, so readers
// pay one await per chunk, not per line.

export class LineBuffer {
  /** 1-based number of the line last handed out. */
  line = 0;
  /** True once the source is exhausted (buffered lines may remain). */
  done = false;
  private readonly iterator: AsyncIterator<string>;
  private readonly input: AsyncIterable<string>;
  private readonly chunked: boolean;
  private buffer: string[] = [];
  private index = 0;
  private carry = '';

  constructor(input: AsyncIterable<string>, chunked: boolean) {
    this.input = input;
    this.iterator = input[Symbol.asyncIterator]();
    this.chunked = chunked;
  }

  /** Next non-blank, non-comment line without its line end, or undefined when the buffer is empty. */
  next(): string | undefined {
    while (this.index < this.buffer.length) {
      const text = this.buffer[this.index++]!;
      if (this.index === this.buffer.length) {
        this.buffer.length = 0;
        this.index = 0;
      }
      this.line++;
      const end = text.charCodeAt(text.length - 1) === 13 /* \r */ ? text.length - 1 : text.length;
      if (end === 0 || text.charCodeAt(0) === 35 /* # */) continue;
      const first = text.charCodeAt(0);
      if ((first === 32 || first === 9 || first === 13) && text.trim() === '') continue;
      return end === text.length ? text : text.slice(0, end);
    }
    return undefined;
  }

  /** Characters of a line still waiting for its end (chunk input); bounded by the reader. */
  get pendingLength(): number {
    return this.carry.length;
  }

  /** Pull the next line or chunk from the source into the buffer. */
  async fill(): Promise<void> {
    if (this.done) return;
    const next = await this.iterator.next();
    if (next.done) {
      this.done = true;
      if (this.carry.length > 0) this.buffer.push(this.carry);
      this.carry = '';
      return;
    }
    if (!this.chunked) {
      this.buffer.push(next.value);
      return;
    }
    const parts = (this.carry + next.value).split('\n');
    this.carry = parts.pop()!;
    this.buffer = this.index < this.buffer.length ? this.buffer.slice(this.index).concat(parts) : parts;
    this.index = 0;
  }

  /** Let go of the source early (e.g. after a layout error): closes a file stream. */
  async close(): Promise<void> {
    if (this.done) return;
    this.done = true;
    await this.iterator.return?.();
    // A file stream never read from is not closed by return() (the iterator never started):
    // destroy it, or it opens its file later anyway and leaks the handle.
    (this.input as { destroy?: () => void }).destroy?.();
  }

  /** Next line, waiting for the source as needed; null at the end. */
  async nextLine(): Promise<string | null> {
    for (;;) {
      const text = this.next();
      if (text !== undefined) return text;
      if (this.done) return null;
      await this.fill();
    }
  }
}
