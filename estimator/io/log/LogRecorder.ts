// Writes a simulated trial in the flight-log layout (README.md, "Flight-log layout") as the simulator runs: the
// TrialRecorder that `alight record` hands to runTrial. Browser-safe: text goes to a
// LogTextSink (the Node adapter writes files); rows are buffered per file and flushed in
// chunks, so memory stays bounded however long the trial. Numbers print in the shortest
// round-trip form: replay reads back exactly the doubles the simulator's filter used.
import type { DeckOutline } from '../../models/OutlineBoxModel.js';
import type { Box } from '../../camera/Box.js';
import type { FilterSpec } from '../../sim/Scenario.js';
import { estimatesHeader, estimatesRowFromDiagonal } from './estimatesCsv.js';
import type { FilterCamera } from '../../models/FilterCamera.js';
import { LOG_FORMAT, LOG_VERSION } from './parseLogCamera.js';
import type { TrialRecorder } from './TrialRecorder.js';
import { LOG_FILE_HEADERS } from './logFileHeaders.js';

/** Receives file text in order: write() may be called many times per file. */
export interface LogTextSink {
  write(file: string, text: string): void;
  /** The same as write() for text already encoded as UTF-8 (optional; the bytes are only valid during the call). */
  writeBytes?(file: string, bytes: Uint8Array): void;
  /** Called once at the end: flush and close everything. */
  close(): void;
}

/** Buffered text per file before it goes to the sink (characters). */
const FLUSH_CHARS = 1 << 16;


export interface LogRecorderOptions {
  /** The camera the filter believes in (focal error included, misalignment not). */
  camera: FilterCamera;
  /** Target size the filter assumes (m). */
  targetSize: number;
  /** Deck outline the filter assumes (m), for the outline box model; absent = a square deck of targetSize. */
  outline?: DeckOutline;
  /** The filter settings flown: written to filter.json so replay uses the same. */
  filter: FilterSpec;
  /** Free text for camera.json's note (e.g. scenario name and seed). */
  note?: string;
  /** Write truth.csv (default true; false makes a log like a flight without a reference). */
  truth?: boolean;
}

export class LogRecorder implements TrialRecorder {
  private readonly sink: LogTextSink;
  private readonly buffers = new Map<string, string>();
  private lastAttitudeTime = -Infinity;
  private readonly withTruth: boolean;
  private closed = false;
  /** Rows written per file. */
  readonly rows = new Map<string, number>();

  constructor(sink: LogTextSink, options: LogRecorderOptions) {
    this.sink = sink;
    this.withTruth = options.truth !== false;
    const camera = {
      format: LOG_FORMAT,
      version: LOG_VERSION,
      ...(options.note !== undefined ? { note: options.note } : {}),
      width: options.camera.width,
      height: options.camera.height,
      intrinsics: { fx: options.camera.fx, fy: options.camera.fy, cx: options.camera.cx, cy: options.camera.cy },
      distortion: options.camera.distortion,
      mount: options.camera.mount,
      targetSize: options.targetSize,
      ...(options.outline !== undefined ? { outline: options.outline } : {}),
      timeOffsets: {},
    };
    sink.write('camera.json', JSON.stringify(camera, null, 2) + '\n');
    sink.write('filter.json', JSON.stringify(options.filter, null, 2) + '\n');
    for (const [file, header] of Object.entries(LOG_FILE_HEADERS)) if (file !== 'truth.csv' || this.withTruth) this.buffers.set(file, header + '\n');
  }

  private append(file: string, line: string): void {
    const text = (this.buffers.get(file) ?? '') + line + '\n';
    this.rows.set(file, (this.rows.get(file) ?? 0) + 1);
    if (text.length >= FLUSH_CHARS) {
      this.sink.write(file, text);
      this.buffers.set(file, '');
    } else {
      this.buffers.set(file, text);
    }
  }

  imu(t: number, f: ArrayLike<number>, q: ArrayLike<number>): void {
    this.append('imu.csv', `${t},${f[0]},${f[1]},${f[2]}`);
    this.attitude(t, q);
  }

  attitude(t: number, q: ArrayLike<number>): void {
    if (t <= this.lastAttitudeTime) return; // imu() already wrote the attitude of this step
    this.lastAttitudeTime = t;
    this.append('attitude.csv', `${t},${q[0]},${q[1]},${q[2]},${q[3]}`);
  }

  odometry(t: number, v: ArrayLike<number>): void {
    this.append('odometry.csv', `${t},${v[0]},${v[1]},${v[2]}`);
  }

  box(tArrival: number, tCapture: number, box: Box, score: number): void {
    this.append('boxes.csv', `${tCapture},${tArrival},${box.xMin},${box.yMin},${box.xMax},${box.yMax},${score}`);
  }

  truth(t: number, r: ArrayLike<number>, vC: ArrayLike<number>, vL: ArrayLike<number>): void {
    if (!this.withTruth) return;
    this.append('truth.csv', `${t},${r[0]},${r[1]},${r[2]},${vC[0]},${vC[1]},${vC[2]},${vL[0]},${vL[1]},${vL[2]}`);
  }

  reset(t: number): void {
    this.append('resets.csv', String(t));
  }

  estimate(t: number, x: ArrayLike<number>, Pdiag: ArrayLike<number>): void {
    if (!this.buffers.has('onboard.csv')) this.buffers.set('onboard.csv', estimatesHeader(x.length) + '\n');
    this.append('onboard.csv', estimatesRowFromDiagonal(t, x, Pdiag, x.length));
  }

  /** Flush every file (each gets at least its header) and close the sink. Idempotent. */
  close(): void {
    if (this.closed) return;
    this.closed = true;
    for (const [file, text] of this.buffers) if (text.length > 0) this.sink.write(file, text);
    this.sink.close();
  }
}
