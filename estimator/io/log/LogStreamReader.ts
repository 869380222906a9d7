// Reads one CSV stream of a flight log row by row from text lines (browser-safe: no fs),
// validates each row and hands out the next good one in a reused Float64Array.
// Bad rows are skipped, counted and reported with file, line and column; nothing else is dropped.
// Per row it allocates only the field substrings; values land in preallocated slots.
import { LogLayoutError, ProblemLog } from './LogProblem.js';
import type { StreamSpec } from './logStreams.js';
import { checkRowValues } from './checkRowValues.js';
import { LineBuffer } from './LineBuffer.js';

/** Boxes with the same arrival time remembered for duplicate detection (frames rarely carry more). */
const SAME_TIME_MEMORY = 32;

/** Longest line a log CSV may have (characters). */
export const MAX_LINE_CHARS = 1 << 20;

export class LogStreamReader {
  readonly spec: StreamSpec;
  /** Seconds added to every time of this stream to bring it onto the log's common clock. */
  readonly offset: number;
  /** Current row, normalized: slot 0 = time, then the layout's columns, then optional columns; times on the common clock. */
  readonly values: Float64Array;
  /** Merge key of the current row: the order column plus offset (s). */
  key = -Infinity;
  /** 1-based line number of the current row. */
  line = 0;
  /** Data rows seen / rows skipped for a problem. The consumer counts used rows. */
  read = 0;
  skipped = 0;
  used = 0;
  /** Header columns this stream does not use (reported, never an error). */
  ignoredColumns: string[] = [];
  /** Which accepted layout the header matched (boxes: 0 = corners, 1 = x/y/w/h). */
  layout = 0;
  private readonly lines: LineBuffer;
  private readonly problems: ProblemLog;
  private columnIndex = new Int32Array(0);
  /** For each header field, the value slot it fills (-1: not used). */
  private slotOfField = new Int32Array(0);
  private headerNames: string[] = [];
  private optionalBase = 0;
  private columnNames: string[] = [];
  private orderSlot = 0;
  private timeSlots: number[] = [0];
  private fieldCount = 0;
  private readonly previous: Float64Array;
  private sameTimeRows = 0;

  /**
   * @param input text lines without line ends, or (chunked = true) text chunks that may split lines anywhere
   * @param offset seconds added to this stream's times (camera.json timeOffsets)
   */
  constructor(spec: StreamSpec, input: AsyncIterable<string>, problems: ProblemLog, offset = 0, chunked = false) {
    this.spec = spec;
    this.offset = offset;
    this.problems = problems;
    this.lines = new LineBuffer(input, chunked);
    const slots = 1 + spec.layouts[0]!.length + spec.optional.length;
    this.values = new Float64Array(slots);
    this.previous = new Float64Array(slots * SAME_TIME_MEMORY);
  }

  get file(): string {
    return this.spec.file;
  }

  /** Read the header (first line that is neither blank nor a # comment) and map the columns. */
  async start(): Promise<void> {
    const header = await this.lines.nextLine();
    this.line = this.lines.line;
    if (header === null) throw new LogLayoutError(this.file, null, null, 'empty file: expected a header line naming the columns');
    // A byte-order mark some spreadsheet programs put in front of the first column is not part of its name.
    const names = (header.charCodeAt(0) === 0xfeff ? header.slice(1) : header).split(',').map((s) => s.trim());
    const seen = new Set<string>();
    for (const name of names) {
      if (seen.has(name)) throw new LogLayoutError(this.file, this.line, name, `column "${name}" appears twice in the header`);
      seen.add(name);
    }
    if (!seen.has('time')) throw new LogLayoutError(this.file, this.line, 'time', `missing column "time" (header: ${names.join(',')})`);
    const layoutIndex = this.spec.layouts.findIndex((cols) => cols.every((c) => seen.has(c)));
    if (layoutIndex < 0) {
      const first = this.spec.layouts[0]!;
      const missing = first.filter((c) => !seen.has(c));
      const alternatives = this.spec.layouts.map((l) => l.join(',')).join(' or ');
      throw new LogLayoutError(this.file, this.line, missing[0]!, `missing column${missing.length > 1 ? 's' : ''} ${missing.map((m) => `"${m}"`).join(', ')} (expected time,${alternatives})`);
    }
    this.layout = layoutIndex;
    const wanted = ['time', ...this.spec.layouts[layoutIndex]!];
    const optional = this.spec.optional.map((o) => o.column);
    this.columnNames = [...wanted, ...optional];
    this.columnIndex = new Int32Array(this.columnNames.map((c) => names.indexOf(c)));
    this.orderSlot = this.columnNames.indexOf(this.spec.orderColumn);
    if (this.orderSlot < 0) this.orderSlot = 0;
    this.timeSlots = this.columnNames.flatMap((c, s) => (c === 'time' || c === 'arrival' ? [s] : []));
    this.fieldCount = names.length;
    this.headerNames = names;
    this.slotOfField = new Int32Array(names.length).fill(-1);
    this.columnIndex.forEach((fieldIndex, slot) => {
      if (fieldIndex >= 0) this.slotOfField[fieldIndex] = slot;
    });
    this.optionalBase = wanted.length;
    const known = this.spec.knownPrefix;
    this.ignoredColumns = names.filter((n) => !this.columnNames.includes(n) && !(known !== undefined && n.startsWith(known)));
  }

  /** Advance to the next valid row; false at the end of the stream. */
  async advance(): Promise<boolean> {
    for (;;) {
      const state = this.step();
      if (state >= 0) return state === 1;
      await this.fill();
    }
  }

  /**
   * Synchronous part of advance(): 1 = a valid row is in `values`, 0 = end of stream,
   * -1 = the buffered text is used up: await fill(), then step() again. Lets a merge
   * pay for a promise per chunk instead of per row.
   */
  step(): number {
    for (;;) {
      const text = this.lines.next();
      if (text === undefined) return this.lines.done ? this.finish() : -1;
      this.line = this.lines.line;
      this.read++;
      if (this.parse(text)) return 1;
      this.skipped++;
    }
  }

  /** Release the source (a no-op once it is read to the end). */
  close(): Promise<void> {
    return this.lines.close();
  }

  /** Pull more text from the source (see step()). */
  async fill(): Promise<void> {
    await this.lines.fill();
    // A log row is under 200 characters; megabytes without a line end are not a CSV of this
    // layout, and holding them would grow without bound.
    if (this.lines.pendingLength > MAX_LINE_CHARS) {
      throw new LogLayoutError(this.file, this.lines.line + 1, null, `a line of more than ${MAX_LINE_CHARS} characters without a line end: not a CSV of the flight-log layout`);
    }
  }

  private finish(): number {
    this.key = Infinity;
    return 0;
  }

  /** Parse and check one data row into `values`; on a problem, report it and return false. */
  private parse(text: string): boolean {
    // One pass over the fields with indexOf (no split array); numbers only for used columns.
    const v = this.values;
    const slotOf = this.slotOfField;
    const count = this.fieldCount;
    let start = 0;
    let field = 0;
    let badSlot = -1;
    let badText = '';
    for (;;) {
      let end = text.indexOf(',', start);
      const last = end < 0;
      if (last) end = text.length;
      const slot = field < count ? slotOf[field]! : -1;
      if (slot >= 0 && badSlot < 0) {
        const piece = text.slice(start, end);
        const value = Number(piece);
        if (!Number.isFinite(value) || (value === 0 && piece.trim() === '')) {
          badSlot = slot;
          badText = piece.trim();
        } else v[slot] = value;
      }
      field++;
      if (last) break;
      start = end + 1;
    }
    if (field !== count) {
      const column = field < count ? this.headerNames[field]! : null;
      this.problems.add('field-count', this.file, this.line, column, `${field} fields, header has ${count}; row skipped`);
      return false;
    }
    if (badSlot >= 0) {
      this.problems.add('not-a-number', this.file, this.line, this.columnNames[badSlot]!, `${badText === '' ? 'empty' : `"${badText}"`} is not a finite number; row skipped`);
      return false;
    }
    const base = this.optionalBase;
    for (let o = 0; o < this.spec.optional.length; o++) {
      if (this.columnIndex[base + o]! >= 0) continue;
      const fallback = this.spec.optional[o]!.fallback;
      v[base + o] = fallback === 'time' ? v[0]! : fallback;
    }
    return checkRowValues(this.spec.name, this.layout, v, this.problems, this.file, this.line) && this.checkOrder();
  }

  private checkOrder(): boolean {
    const v = this.values;
    const key = v[this.orderSlot]! + this.offset;
    const column = this.columnNames[this.orderSlot]!;
    if (key < this.key) {
      this.problems.add('unsorted-time', this.file, this.line, column, `${column} ${v[this.orderSlot]} is earlier than the previous row's ${this.key - this.offset} (rows must be in time order); row skipped`);
      return false;
    }
    const slots = v.length;
    if (key === this.key) {
      for (let r = 0; r < Math.min(this.sameTimeRows, SAME_TIME_MEMORY); r++) {
        let same = true;
        for (let s = 0; s < slots && same; s++) same = this.previous[r * slots + s] === v[s];
        if (same) {
          this.problems.add('duplicate-row', this.file, this.line, null, `same values as an earlier row at ${column} ${v[this.orderSlot]}; row skipped`);
          return false;
        }
      }
      if (this.spec.strict) {
        this.problems.add('repeated-time', this.file, this.line, column, `${column} ${v[this.orderSlot]} repeats the previous row's time with other values (one row per time); row skipped`);
        return false;
      }
    } else {
      this.sameTimeRows = 0;
    }
    const r = this.sameTimeRows % SAME_TIME_MEMORY;
    for (let s = 0; s < slots; s++) this.previous[r * slots + s] = v[s]!;
    this.sameTimeRows++;
    this.key = key;
    // Onto the common clock: every time slot (time, arrival) gets the stream's offset.
    if (this.offset !== 0) for (let t = 0; t < this.timeSlots.length; t++) v[this.timeSlots[t]!] += this.offset;
    return true;
  }
}
