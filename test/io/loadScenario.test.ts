import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadScenario } from '../../estimator/io/loadScenario.js';

const dir = mkdtempSync(join(tmpdir(), 'alight-load-'));

describe('loadScenario', () => {
  it('reads a recorded path CSV relative to the scenario file', () => {
    writeFileSync(join(dir, 'road.csv'), 't,x,y,z\n0,0,0,0\n10,30,0,0\n20,60,5,0\n');
    writeFileSync(join(dir, 'rec.scenario.json'), '{"version": 1, "carrier": {"path": {"shape": "recorded", "file": "road.csv"}}}');
    const s = loadScenario(join(dir, 'rec.scenario.json'));
    expect(s.carrier.path.points).toEqual([[0, 0, 0, 0], [10, 30, 0, 0], [20, 60, 5, 0]]);
    expect(Object.isFrozen(s.carrier.path.points)).toBe(true);
  });

  it('names the scenario file and field when the CSV is missing', () => {
    writeFileSync(join(dir, 'lost.scenario.json'), '{"version": 1, "carrier": {"path": {"shape": "recorded", "file": "gone.csv"}}}');
    expect(() => loadScenario(join(dir, 'lost.scenario.json'))).toThrow(/^lost\.scenario\.json:1: carrier\.path\.file: cannot read .*gone\.csv \(ENOENT\)$/);
  });

  it('names the scenario file and line, then the CSV file and line, for a bad recorded path row', () => {
    writeFileSync(join(dir, 'bumpy.csv'), 't,x,y,z\n0,0,0,0\n1,2,x,0\n');
    writeFileSync(join(dir, 'bumpy.scenario.json'), '{\n "version": 1,\n "carrier": { "path": {\n  "shape": "recorded",\n  "file": "bumpy.csv" } } }');
    expect(() => loadScenario(join(dir, 'bumpy.scenario.json'))).toThrow('bumpy.scenario.json:5: carrier.path.file: bumpy.csv:3: expected 4 numbers t,x,y,z, got "1,2,x,0"');
  });

  it('accepts a byte-order mark and refuses duplicate keys and 1e999 with line and column', () => {
    writeFileSync(join(dir, 'bom.json'), '\uFEFF{"version": 1, "seed": 4}');
    expect(loadScenario(join(dir, 'bom.json')).seed).toBe(4);
    writeFileSync(join(dir, 'twice.json'), '{\n "version": 1,\n "seed": 4,\n "seed": 5\n}');
    expect(() => loadScenario(join(dir, 'twice.json'))).toThrow('twice.json:4:2: not valid JSON: duplicate key "seed" (first given on line 3); each key may appear once');
    writeFileSync(join(dir, 'huge.json'), '{"version": 1,\n "duration": 1e999}');
    expect(() => loadScenario(join(dir, 'huge.json'))).toThrow('huge.json:2:14: not valid JSON: number 1e999 is not finite (beyond the largest double, about 1.8e308)');
  });

  it('names the file when it cannot be read', () => {
    expect(() => loadScenario(join(dir, 'absent.json'))).toThrow(/^absent\.json: cannot read .*absent\.json \(ENOENT\)$/);
  });
});
