// Buffered rows for the files of a flight log, handed to a LogTextSink (folderSink writes them
// into a folder) in pieces of about 256 kB, so memory stays bounded however long the recording.
// A file is created with its header when its first row comes (or by ensure()).
// Hot path: add() copies each row's characters into the file's reused byte buffer and allocates
// nothing. Rows went through string concatenation before: the sink then flattened and encoded
// every 64 kB string, which cost more than formatting the numbers. Rows are numbers, so ASCII;
// any other character is encoded as UTF-8 all the same. Browser-safe.
import type { LogTextSink } from '../log/LogRecorder.js';

/** Bytes buffered per file before they go to the sink. */
const FLUSH_BYTES = 1 << 18;

interface FileRows {
  file: string;
  bytes: Uint8Array;
  /** Bytes filled. */
  length: number;
}

const encoder = new TextEncoder();
const decoder = new TextDecoder();

export class LayoutRows {
  private readonly sink: LogTextSink;
  private readonly files = new Map<string, FileRows>();
  private readonly headers: Readonly<Record<string, string>>;
  /** Rows written per file. */
  readonly rows = new Map<string, number>();

  constructor(sink: LogTextSink, headers: Readonly<Record<string, string>>) {
    this.sink = sink;
    this.headers = headers;
  }

  /** Start `file` with its header even if no row ever comes (required files). */
  ensure(file: string): FileRows {
    let rows = this.files.get(file);
    if (rows === undefined) {
      rows = { file, bytes: new Uint8Array(FLUSH_BYTES), length: 0 };
      this.files.set(file, rows);
      this.rows.set(file, 0);
      this.append(rows, this.headers[file]!);
    }
    return rows;
  }

  /** Append one CSV line (without its line end). */
  add(file: string, line: string): void {
    const rows = this.files.get(file) ?? this.ensure(file);
    this.append(rows, line);
    this.rows.set(file, this.rows.get(file)! + 1);
  }

  private append(rows: FileRows, line: string): void {
    // UTF-8 needs at most 3 bytes per UTF-16 unit: with that much room no row is cut.
    if (rows.length + 3 * line.length + 1 > rows.bytes.length) {
      this.flush(rows);
      if (3 * line.length + 1 > rows.bytes.length) rows.bytes = new Uint8Array(3 * line.length + 1);
    }
    const bytes = rows.bytes;
    let n = rows.length;
    for (let i = 0; i < line.length; i++) {
      const c = line.charCodeAt(i);
      if (c > 0x7f) {
        n = rows.length + encoder.encodeInto(line, bytes.subarray(rows.length)).written;
        break;
      }
      bytes[n++] = c;
    }
    bytes[n++] = 10; // '\n'
    rows.length = n;
  }

  private flush(rows: FileRows): void {
    if (rows.length === 0) return;
    const piece = rows.bytes.subarray(0, rows.length);
    if (this.sink.writeBytes) this.sink.writeBytes(rows.file, piece);
    else this.sink.write(rows.file, decoder.decode(piece));
    rows.length = 0;
  }

  /** Flush every file and close the sink. */
  close(): void {
    for (const rows of this.files.values()) this.flush(rows);
    this.files.clear();
    this.sink.close();
  }
}
