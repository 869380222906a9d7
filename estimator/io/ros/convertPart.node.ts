// Node-only: one part of a conversion — the messages of some mapped topics, opened, decoded and
// written to their own files of the log folder. A two-thread conversion runs one part on the
// main thread and one in a worker (ingestWorker.node.ts); every file comes from exactly one part,
// so the result is the file a single pass writes, byte for byte.
import { folderSink } from '../log/folderSink.node.js';
import { convertMessages } from './convertMessages.js';
import type { IngestRole, IngestStream } from './IngestReport.js';
import { openRecording } from './openRecording.node.js';
import type { RosMap } from './parseRosMap.js';
import { decoderFor, type Route } from './recordingRoutes.js';
import { RosLayoutWriter } from './RosLayoutWriter.js';
import type { RosCamera } from './rosMessages.js';

/** Everything a part needs; plain data, so it crosses to a worker thread as it is. */
export interface PartJob {
  path: string;
  name: string;
  map: RosMap;
  routes: Route[];
  types: [string, { short: string; recorded: string }][];
  camera: RosCamera;
  origin: number;
  folder: string;
  firstCamera: Uint8Array;
}

export interface PartResult {
  streams: Partial<Record<IngestRole, IngestStream>>;
  files: Record<string, number>;
  warnings: string[];
}

export async function convertPart(job: PartJob): Promise<PartResult> {
  const recording = await openRecording(job.path);
  try {
    const topics = [...new Set(job.routes.map((r) => r.topic))];
    const decoders = new Map(topics.map((t) => [t, decoderFor(job.name, job.routes.find((r) => r.topic === t)!, recording.channels.get(t)!)]));
    const layout = new RosLayoutWriter(folderSink(job.folder), { name: job.name, map: job.map, routes: job.routes, types: new Map(job.types), camera: job.camera, origin: job.origin });
    await convertMessages({ name: job.name, recording, topics, decoders, layout, firstCamera: job.firstCamera });
    const files = layout.finish();
    return { streams: layout.streams, files, warnings: layout.warnings };
  } finally {
    await recording.close();
  }
}
