// Buffered text rows for the files of a flight log, handed to a LogTextSink (folderSink writes
// them into a folder) in chunks of about 64 kB, so memory stays bounded however long the
// recording. A file is created with its header when its first row comes (or by ensure()).
import type { LogTextSink } from '../log/LogRecorder.js';

const FLUSH_CHARS = 1 << 16;

export class LayoutRows {
  private readonly sink: LogTextSink;
  private readonly buffers = new Map<string, string>();
  private readonly headers: Readonly<Record<string, string>>;
  /** Rows written per file. */
  readonly rows = new Map<string, number>();

  constructor(sink: LogTextSink, headers: Readonly<Record<string, string>>) {
    this.sink = sink;
    this.headers = headers;
  }

  /** Start `file` with its header even if no row ever comes (required files). */
  ensure(file: string): void {
    if (!this.buffers.has(file)) {
      this.buffers.set(file, this.headers[file]! + '\n');
      this.rows.set(file, 0);
    }
  }

  /** Append one CSV line (without its line end). */
  add(file: string, line: string): void {
    this.ensure(file);
    const text = this.buffers.get(file)! + line + '\n';
    this.rows.set(file, this.rows.get(file)! + 1);
    if (text.length >= FLUSH_CHARS) {
      this.sink.write(file, text);
      this.buffers.set(file, '');
    } else this.buffers.set(file, text);
  }

  /** Flush every file and close the sink. */
  close(): void {
    for (const [file, text] of this.buffers) if (text.length > 0) this.sink.write(file, text);
    this.buffers.clear();
    this.sink.close();
  }
}
