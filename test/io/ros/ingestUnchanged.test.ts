// The conversion's speed work must not change a byte: the whole log folder `alight ingest` writes
// from a generated recording (the import bench's message mix, 20 s) is compared, file by file, with
// SHA-256 sums of the folder the conversion wrote before it (commit dc25826: every message decoded
// by the library's MessageReader), on one thread and on two.
import { createHash } from 'node:crypto';
import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { folderSink } from '../../../estimator/io/log/folderSink.node.js';
import { ingestRosRecording, ingestRosRecordingToFolder, RecordingError } from '../../../estimator/io/ros/ingestRosRecording.node.js';
import { parseRosMap } from '../../../estimator/io/ros/parseRosMap.js';
import { writeSyntheticRecording } from './syntheticRecording.js';

/** The folder dc25826 wrote from writeSyntheticRecording(…, { duration: 20 }) named NAME, with data-demo/ros/flight.map.json. */
const NAME = 'synthetic-20s.mcap';
const RECORDING_SHA256 = '85f673314f3809bc14230076aa68649f94fa93dc0a2ad245d44ec1fcf90e0787';
const BEFORE: Record<string, string> = {
  'attitude.csv': '002256da88a3e84bd3f4c9bf244612b2502506bb37850ec0a8cb8f919d739b30',
  'boxes.csv': '44021da6e2c8dd4061e2a0f0fa6bc4dec8e995c80bb6f990504fc4021afb353a',
  'camera.json': 'b9dd0aec70c2110d582d7d3c8f982cc732c3edb6f5d3b5537ea9324ac249f964',
  'filter.json': '2b1e26a571df1713aac39952802ad862232fcb48798e7c33ca37dd4f57aa42aa',
  'imu.csv': '12d9d935359936f304698c5a2dfc00196f561f2ddc7d7b0ec6863808921472fd',
  'odometry.csv': 'c574bd81e6f8b7e581cda9cd1d51459754ce226cc8314839b056cdecaffcdf96',
  'truth.csv': '07bd6656ce2055728eb62ac97f42afe733c38a8fc71b25050345a1567d16d980',
};

const sha256 = (path: string) => createHash('sha256').update(readFileSync(path)).digest('hex');
const dir = mkdtempSync(join(tmpdir(), 'alight-ingest-unchanged-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('alight ingest output, byte for byte', () => {
  it('is the folder the conversion wrote before the fixed-layout reader, on one thread and on two', async () => {
    const recording = join(dir, NAME);
    await writeSyntheticRecording(recording, { duration: 20 });
    expect(sha256(recording), 'the generated recording changed: record the sums again with the code of dc25826').toBe(RECORDING_SHA256);
    const mapPath = join(__dirname, '../../../data-demo/ros/flight.map.json');
    const map = parseRosMap(readFileSync(mapPath, 'utf8'), mapPath);
    const one = join(dir, 'one'), two = join(dir, 'two');
    await ingestRosRecording(recording, map, folderSink(one), { name: NAME });
    const report = await ingestRosRecordingToFolder(recording, map, two, { name: NAME });
    expect(report.threads, 'dist/ingest-worker.mjs is built by `npm run build`').toBe(2);
    for (const folder of [one, two]) {
      expect(readdirSync(folder).sort()).toEqual(Object.keys(BEFORE));
      for (const file of Object.keys(BEFORE)) expect(sha256(join(folder, file)), `${folder}/${file}`).toBe(BEFORE[file]);
    }
  });

  it('stops on damage in a later chunk with the same message on one thread and on two (the reading thread forwards it)', async () => {
    const recording = join(dir, 'damaged.mcap');
    await writeSyntheticRecording(recording, { duration: 20 }); // 5.4 MB: two 4 MB chunks
    const bytes = readFileSync(recording);
    const g = Buffer.alloc(8);
    g.writeDoubleLE(9.81);
    const at = bytes.indexOf(g, 4.5e6); // an IMU message in the second chunk
    expect(at).toBeGreaterThan(4.5e6);
    bytes[at + 7] ^= 0x01; // 9.81 becomes another number: the chunk's checksum no longer matches
    writeFileSync(recording, bytes);
    const mapPath = join(__dirname, '../../../data-demo/ros/flight.map.json');
    const map = parseRosMap(readFileSync(mapPath, 'utf8'), mapPath);
    const refusal = (error: unknown) => (error instanceof RecordingError ? error.message : `not a RecordingError: ${String(error)}`);
    const one = await ingestRosRecording(recording, map, folderSink(join(dir, 'damaged-one')), { name: NAME }).then(() => 'no error', refusal);
    const two = await ingestRosRecordingToFolder(recording, map, join(dir, 'damaged-two'), { name: NAME }).then(() => 'no error', refusal);
    expect(one).toMatch(/^synthetic-20s\.mcap: the recording is damaged after log time \d+ ns \(Incorrect chunk CRC/);
    expect(two).toBe(one);
  });
});
