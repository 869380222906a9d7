// A decoder for ROS 2 message types of fixed layout — every field a number, a string, a
// fixed-length number array or a nested message of the same kind (sensor_msgs/Imu,
// nav_msgs/Odometry, the stamped geometry types) — that reads each message into ONE reused
// object of exactly the shape @foxglove/rosmsg2-serialization's MessageReader returns (same
// field names and values, number arrays as typed arrays of the same kind). The IMU and the
// reference odometry are most of a recording's messages, and decoding them into fresh objects,
// strings and arrays was the largest cost of `alight ingest` after the container's own.
// Hot path: reading a message allocates nothing. The reading code is generated once per type
// from its definition (straight-line field stores, so each store stays monomorphic); every
// number goes through @foxglove/cdr's CdrReader, which keeps alignment and byte order the
// library's; strings are decoded only when their bytes change (frame ids repeat in every
// message); number arrays (covariances) after their first, aligned element are copied from an
// aligned view of the same bytes. Types with sequences, 64-bit integers, wide strings or empty
// messages get no reader (of() returns null), and a message that is not plain little-endian CDR
// or is shorter than its type makes read() return null: the library's MessageReader decodes
// those and stays the reference (test/io/ros/FixedLayoutReader.test.ts).
// The returned object is valid until the next read.
import { CdrReader } from '@foxglove/cdr';
import type { parse } from '@foxglove/rosmsg';
import type { Decoded } from './rosMessages.js';

/** A parsed definition, as @foxglove/rosmsg's parse returns them. */
type MessageDefinition = ReturnType<typeof parse>[number];

/** Plain little-endian CDR (encapsulation kind 1, what ROS 2 writes on every common CPU); other kinds go to the library. */
const CDR_LE = 0x01;
/** Messages sit at this byte of the buffer: CDR aligns to its 4-byte header's end, so values are aligned in memory too. */
const AT = 4;
const HOST_LITTLE_ENDIAN = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1;

/** CdrReader's method and the array kind for each number type the library returns as a number. */
const NUMBERS = {
  int8: [Int8Array, 'int8'], uint8: [Uint8Array, 'uint8'], int16: [Int16Array, 'int16'], uint16: [Uint16Array, 'uint16'],
  int32: [Int32Array, 'int32'], uint32: [Uint32Array, 'uint32'], float32: [Float32Array, 'float32'], float64: [Float64Array, 'float64'],
} as const;
type NumberType = keyof typeof NUMBERS;
type NumberArray = InstanceType<(typeof NUMBERS)[NumberType][0]>;
const SAFE_NAME = /^[A-Za-z_][A-Za-z0-9_]*$/;

/** A string field's last bytes and value: the same bytes give the same string, decoded once. */
interface StringSlot {
  bytes: Uint8Array;
  length: number;
  value: string;
}

/** What the generated code calls: the reader, and helpers for strings and arrays by slot. */
interface ReadContext {
  cdr: CdrReader;
  /** Message length in CdrReader offsets (the end of the message). */
  end: number;
  str(slot: number): string | null;
  arr(slot: number): boolean;
}

const decoder = new TextDecoder();

export class FixedLayoutReader {
  /** The object every read fills. */
  private readonly message: Decoded;
  private readonly code: (c: ReadContext, m: Decoded) => boolean;
  private readonly strings: StringSlot[];
  private readonly arrays: NumberArray[];
  private readonly methods: NumberType[];
  private sources: NumberArray[];
  /** Bytes of the fixed part of the type, plus alignment: a message too short cannot make a read run off the buffer. */
  private readonly slack: number;
  private bytes: Uint8Array;
  private readonly context: ReadContext;

  private constructor(plan: Plan) {
    this.message = plan.message;
    this.strings = plan.strings.map(() => ({ bytes: new Uint8Array(64), length: -1, value: '' }));
    this.arrays = plan.arrays;
    this.methods = plan.methods;
    this.slack = plan.fixedBytes + 64;
    // eslint-disable-next-line @typescript-eslint/no-implied-eval -- generated from a checked definition (field names are identifiers)
    this.code = new Function('c', 'm', `${plan.lines.join('\n')}\nreturn c.cdr.offset <= c.end;`) as (c: ReadContext, m: Decoded) => boolean;
    this.bytes = new Uint8Array(1 << 12);
    this.sources = this.viewsOf(this.bytes);
    this.context = { cdr: readerOver(this.bytes), end: 0, str: (slot) => this.string(slot), arr: (slot) => this.array(slot) };
  }

  /** A reader for the root type of `definitions` (as @foxglove/rosmsg parses a ros2msg schema), or null when its layout is not fixed. */
  static of(definitions: readonly MessageDefinition[]): FixedLayoutReader | null {
    const byName = new Map(definitions.map((d) => [d.name ?? '', d]));
    const root = definitions.find((d) => !(d.definitions.length > 0 && d.definitions.every((f) => f.isConstant === true)));
    if (root === undefined) return null;
    const plan: Plan = { message: {}, lines: [], strings: [], arrays: [], methods: [], fixedBytes: 0 };
    return planFields(root, byName, plan.message, 'm', plan, 0) ? new FixedLayoutReader(plan) : null;
  }

  /** The decoded message (the reused object), or null when this message must go to the library's reader. */
  read(data: Uint8Array): Decoded | null {
    if (data.length < 4 || data[0] !== 0 || data[1] !== CDR_LE) return null;
    if (AT + data.length + this.slack > this.bytes.length) this.grow(data.length);
    this.bytes.set(data, AT);
    const c = this.context;
    c.cdr.offset = 4;
    c.end = data.length;
    return this.code(c, this.message) ? this.message : null;
  }

  private grow(length: number): void {
    this.bytes = new Uint8Array(8 * Math.ceil((AT + length + this.slack) / 4)); // twice the need, whole float64s
    this.context.cdr = readerOver(this.bytes);
    this.sources = this.viewsOf(this.bytes);
  }

  /** The string at the reader's offset (uint32 length with its NUL, then the bytes), or null when it runs past the message. */
  private string(slot: number): string | null {
    const cdr = this.context.cdr;
    if (cdr.offset + 4 > this.context.end) return null;
    const length = cdr.uint32();
    const start = cdr.offset;
    if (length > this.context.end - start) return null;
    cdr.offset = start + length;
    const s = this.strings[slot]!, bytes = this.bytes, from = AT + start;
    if (s.length === length) {
      let same = true;
      for (let i = 0; i < length; i++) if (s.bytes[i] !== bytes[from + i]) { same = false; break; }
      if (same) return s.value;
    }
    if (s.bytes.length < length) s.bytes = new Uint8Array(2 * length);
    s.bytes.set(bytes.subarray(from, from + length));
    s.length = length;
    // The value leaves out the closing NUL, as CdrReader.string() does.
    s.value = length <= 1 ? '' : decoder.decode(bytes.subarray(from, from + length - 1));
    return s.value;
  }

  /** Copy the rest of a fixed-length number array whose first element the generated code read (CdrReader aligned it) from an aligned view. */
  private array(slot: number): boolean {
    const out = this.arrays[slot]!, cdr = this.context.cdr, size = out.BYTES_PER_ELEMENT;
    const first = AT + cdr.offset, rest = out.length - 1;
    if (cdr.offset + rest * size > this.context.end) return false;
    if (HOST_LITTLE_ENDIAN) {
      const source = this.sources[slot]!, base = first / size - 1;
      for (let i = 1; i <= rest; i++) out[i] = source[base + i]!;
      cdr.offset += rest * size;
    } else {
      const method = this.methods[slot]!;
      for (let i = 1; i <= rest; i++) out[i] = cdr[method]();
    }
    return true;
  }

  /** Views of the whole buffer, one per array slot, of the slot's number kind. */
  private viewsOf(bytes: Uint8Array): NumberArray[] {
    return this.arrays.map((a) => new (a.constructor as new (b: ArrayBufferLike) => NumberArray)(bytes.buffer));
  }
}

/** A CdrReader over the buffer from byte AT; it takes its byte order from the kind when made, and every message read has that kind. */
function readerOver(bytes: Uint8Array): CdrReader {
  bytes[AT + 1] = CDR_LE;
  return new CdrReader(bytes.subarray(AT));
}

interface Plan {
  message: Record<string, unknown>;
  /** Statements of the generated reading function, in CDR order. */
  lines: string[];
  strings: number[];
  arrays: NumberArray[];
  /** CdrReader's method for each array's elements. */
  methods: NumberType[];
  fixedBytes: number;
}

/**
 * Plan the reads of `definition`'s fields into `target` (reachable as `path` in the generated
 * code), in CDR order, as MessageReader reads them (constants skipped, "time" and "duration" as
 * { sec, nanosec }, bool as a boolean). False when a field has no fixed layout.
 */
function planFields(definition: MessageDefinition, byName: ReadonlyMap<string, MessageDefinition>, target: Record<string, unknown>, path: string, plan: Plan, depth: number): boolean {
  const fields = definition.definitions.filter((f) => f.isConstant !== true);
  if (fields.length === 0 || depth > 32) return false; // an empty message is one padding byte in CDR; a loop of types is broken
  for (const field of fields) {
    if (!SAFE_NAME.test(field.name)) return false;
    const at = `${path}.${field.name}`;
    const array = field.isArray === true;
    if (array && !(field.arrayLength! >= 1)) return false; // a sequence: its length varies per message
    if (field.isComplex === true) {
      const nested = byName.get(field.type);
      if (array || nested === undefined) return false;
      const child = {};
      target[field.name] = child;
      if (!planFields(nested, byName, child, at, plan, depth + 1)) return false;
    } else if (field.type === 'time' || field.type === 'duration') {
      if (array) return false;
      target[field.name] = { sec: 0, nanosec: 0 };
      plan.lines.push(`${at}.sec = c.cdr.int32();`, `${at}.nanosec = c.cdr.uint32();`);
      plan.fixedBytes += 8;
    } else if (field.type === 'string') {
      if (array) return false;
      target[field.name] = '';
      plan.lines.push(`{ const s = c.str(${plan.strings.length}); if (s === null) return false; ${at} = s; }`);
      plan.strings.push(plan.strings.length);
      plan.fixedBytes += 8;
    } else if (field.type === 'bool') {
      if (array) return false; // the library gives a plain array of booleans
      target[field.name] = false;
      plan.lines.push(`${at} = Boolean(c.cdr.int8());`);
      plan.fixedBytes += 1;
    } else if (field.type in NUMBERS) {
      const [kind, method] = NUMBERS[field.type as NumberType];
      if (array) {
        const values = new kind(field.arrayLength!);
        target[field.name] = values;
        plan.lines.push(`${at}[0] = c.cdr.${method}(); if (!c.arr(${plan.arrays.length})) return false;`);
        plan.arrays.push(values);
        plan.methods.push(method);
        plan.fixedBytes += values.byteLength + 8;
      } else {
        target[field.name] = 0;
        plan.lines.push(`${at} = c.cdr.${method}();`);
        plan.fixedBytes += 8;
      }
    } else return false; // 64-bit integers (bigint), wide strings, unknown names
  }
  return true;
}
