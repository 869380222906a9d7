// Ring buffer of recent filter steps for delayed measurements: per IMU step the time, the
// input (specific force, attitude and its rotation matrix R_wb, built once at push so a
// re-propagated step is only the mean and covariance arithmetic) used to reach it, the state
// and covariance after the step and its updates, and the measurements applied in that step (so
// a re-propagation can re-apply them). Preallocated flat typed arrays and per-slot views;
// nothing is allocated after construction. A slot keeps the state as the filter holds it, x and
// P side by side in one array (n + n² values), so every re-propagated step of a delayed box saves
// (and a rejected box restores) in one copy.
import { rotationMatrixFromQuat } from '../frames/rotationMatrixFromQuat.js';

/** Measurement kinds kept in the history. */
export const EVENT_TIGHT = 1;
export const EVENT_LOOSE = 2;
export const EVENT_ODOMETRY = 3;

/** Most measurements one IMU step can hold (boxes and odometry at up to this multiple of the IMU rate). */
export const EVENTS_PER_STEP = 8;
/** Numbers kept per measurement: a box's centre and size, or centre, width and height; odometry uses 3. */
export const EVENT_DATA = 4;

export class FilterHistory {
  readonly capacity: number;
  readonly time: Float64Array;
  readonly force: Float64Array;
  readonly attitude: Float64Array;
  /** R_wb of each slot's attitude (9 per slot, row-major; NaN for an unknown attitude). */
  readonly rotation: Float64Array;
  /** Per slot x (n) then P (n x n row-major). */
  readonly states: Float64Array;
  readonly eventCount: Int32Array;
  readonly eventKind: Int8Array;
  readonly eventTime: Float64Array;
  readonly eventData: Float64Array;
  private head = -1;
  private size = 0;
  private readonly stateSlots: Float64Array[];
  private readonly stride: number;
  private readonly rotationSlots: Float64Array[];

  constructor(readonly n: number, capacity: number) {
    this.capacity = Math.max(2, capacity);
    const c = this.capacity;
    this.time = new Float64Array(c);
    this.force = new Float64Array(3 * c);
    this.attitude = new Float64Array(4 * c);
    this.rotation = new Float64Array(9 * c);
    const stride = (this.stride = n + n * n);
    this.states = new Float64Array(stride * c);
    this.stateSlots = Array.from({ length: c }, (_, s) => this.states.subarray(s * stride, (s + 1) * stride));
    this.rotationSlots = Array.from({ length: c }, (_, s) => this.rotation.subarray(9 * s, 9 * s + 9));
    this.eventCount = new Int32Array(c);
    this.eventKind = new Int8Array(EVENTS_PER_STEP * c);
    this.eventTime = new Float64Array(EVENTS_PER_STEP * c);
    this.eventData = new Float64Array(EVENT_DATA * EVENTS_PER_STEP * c);
  }

  /** Number of stored steps. */
  get length(): number {
    return this.size;
  }

  clear(): void {
    this.head = -1;
    this.size = 0;
  }

  /** Physical slot of the step `age` steps back from the newest (age 0). */
  slot(age: number): number {
    const s = this.head - age; // age < capacity: one wrap at most (no integer division)
    return s < 0 ? s + this.capacity : s;
  }

  /** Append a step (overwriting the oldest when full) with its state [x, P]; returns its slot. */
  push(t: number, force: ArrayLike<number>, attitude: ArrayLike<number>, state: Float64Array): number {
    this.head = this.head + 1 === this.capacity ? 0 : this.head + 1;
    if (this.size < this.capacity) this.size++;
    const s = this.head;
    this.time[s] = t;
    for (let i = 0; i < 3; i++) this.force[3 * s + i] = force[i]!;
    for (let i = 0; i < 4; i++) this.attitude[4 * s + i] = attitude[i]!;
    rotationMatrixFromQuat(attitude, this.rotationSlots[s]!);
    this.eventCount[s] = 0;
    this.save(s, state);
    return s;
  }

  /** Overwrite a slot's state with [x, P] (n + n² values). */
  save(slot: number, state: Float64Array): void {
    this.states.set(state, slot * this.stride);
  }

  /** Copy a slot's state into [x, P]. */
  restore(slot: number, state: Float64Array): void {
    state.set(this.stateSlots[slot]!);
  }

  /** R_wb stored with a slot (a view; do not write). */
  rotationOf(slot: number): Float64Array {
    return this.rotationSlots[slot]!;
  }

  /** Age of the newest step with time <= t, or -1 when t is older than the oldest step. */
  ageAtOrBefore(t: number): number {
    for (let age = 0; age < this.size; age++) if (this.time[this.slot(age)]! <= t) return age;
    return -1;
  }

  /** Insert a measurement into a slot, keeping time order. Returns false when the slot is full. */
  addEvent(slot: number, kind: number, t: number, d0: number, d1: number, d2: number, d3 = 0): boolean {
    const count = this.eventCount[slot]!;
    if (count >= EVENTS_PER_STEP) return false;
    const base = slot * EVENTS_PER_STEP;
    let k = count;
    while (k > 0 && this.eventTime[base + k - 1]! > t) {
      this.eventKind[base + k] = this.eventKind[base + k - 1]!;
      this.eventTime[base + k] = this.eventTime[base + k - 1]!;
      for (let i = 0; i < EVENT_DATA; i++) this.eventData[EVENT_DATA * (base + k) + i] = this.eventData[EVENT_DATA * (base + k - 1) + i]!;
      k--;
    }
    this.eventKind[base + k] = kind;
    this.eventTime[base + k] = t;
    this.eventData[EVENT_DATA * (base + k)] = d0;
    this.eventData[EVENT_DATA * (base + k) + 1] = d1;
    this.eventData[EVENT_DATA * (base + k) + 2] = d2;
    this.eventData[EVENT_DATA * (base + k) + 3] = d3;
    this.eventCount[slot] = count + 1;
    return true;
  }

  isFull(slot: number): boolean {
    return this.eventCount[slot]! >= EVENTS_PER_STEP;
  }
}
