// Buffered rows for the files of a flight log, handed to a LogTextSink (folderSink writes them
// into a folder) in pieces of about 256 kB, so memory stays bounded however long the recording.
// A file is created with its header when its first row comes (or by ensure()).
// Hot path: a row of numbers goes value by value (start, next, end), each number's shortest
// round-trip text (String(x), as a template literal gives it) copied into the file's reused byte
// buffer: no row string is built, joined or encoded. Rows went through string concatenation
// before: the sink then flattened and encoded every 64 kB string, which cost more than
// formatting the numbers. add() takes any text line (UTF-8 outside ASCII). Browser-safe.
import type { LogTextSink } from '../log/LogRecorder.js';

/** Bytes buffered per file before they go to the sink. */
const FLUSH_BYTES = 1 << 18;

interface FileRows {
  file: string;
  bytes: Uint8Array;
  /** Bytes filled. */
  length: number;
}

/** Room for one number's text: the longest is 24 characters ("-2.2250738585072014e-308") and a comma. */
const NUMBER_ROOM = 32;
const COMMA = 44;
const LINE_END = 10;
const encoder = new TextEncoder();
const decoder = new TextDecoder();

export class LayoutRows {
  private readonly sink: LogTextSink;
  private readonly files = new Map<string, FileRows>();
  private readonly headers: Readonly<Record<string, string>>;
  /** Rows written per file. */
  readonly rows = new Map<string, number>();
  /** The file of the row being written (between start and end). */
  private current: FileRows | null = null;

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

  /** Start a row of `file` with its first value; next() adds the others, end() closes it. */
  start(file: string, value: number): this {
    const rows = this.files.get(file) ?? this.ensure(file);
    this.current = rows;
    this.rows.set(file, this.rows.get(file)! + 1);
    this.number(rows, value);
    return this;
  }

  /** The next value of the row, after a comma. */
  next(value: number): this {
    const rows = this.current!;
    rows.bytes[rows.length++] = COMMA; // number() left room for it
    this.number(rows, value);
    return this;
  }

  /** Close the row. */
  end(): void {
    const rows = this.current!;
    rows.bytes[rows.length++] = LINE_END;
    this.current = null;
  }

  /** Copy a number's text; the buffer keeps room for a comma or line end after it (a row may span two pieces: the file is the same). */
  private number(rows: FileRows, value: number): void {
    if (rows.length + NUMBER_ROOM > rows.bytes.length) this.flush(rows);
    const text = String(value), bytes = rows.bytes;
    let n = rows.length;
    for (let i = 0; i < text.length; i++) bytes[n++] = text.charCodeAt(i);
    rows.length = n;
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
