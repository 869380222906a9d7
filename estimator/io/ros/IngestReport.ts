// What `alight ingest` did with a recording: per mapped stream, messages read, rows written and
// what was left out and why; the camera found; warnings. Browser-safe types only.

export type IngestRole = 'camera' | 'boxes' | 'imu' | 'attitude' | 'odometry' | 'truthLander' | 'truthCarrier' | 'resets';

export interface IngestStream {
  topic: string;
  /** Message type as recorded. */
  type: string;
  messages: number;
  /** Rows written (boxes: one per detection kept). */
  rows: number;
  /** Messages or detections left out, by reason. */
  left: Record<string, number>;
}

export interface IngestReport {
  recording: string;
  bytes: number;
  /** Read through the file's index (log-time order); false: front to back (no usable summary). */
  indexed: boolean;
  /** Threads that converted it (2: the topics split between the main thread and a worker). */
  threads: number;
  /** Whole seconds subtracted from every stamp. */
  timeOrigin: number;
  camera: { topic: string; frameId: string; width: number; height: number; fx: number; fy: number; cx: number; cy: number };
  streams: Partial<Record<IngestRole, IngestStream>>;
  /** Rows written per file of the layout. */
  files: Record<string, number>;
  /** Topics of the recording the map does not use. */
  otherTopics: string[];
  warnings: string[];
  seconds: number;
}
