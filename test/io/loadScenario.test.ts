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
    expect(() => loadScenario(join(dir, 'lost.scenario.json'))).toThrow(/^lost\.scenario\.json: carrier\.path\.file: cannot read .*gone\.csv \(ENOENT\)$/);
  });

  it('names the file when it cannot be read', () => {
    expect(() => loadScenario(join(dir, 'absent.json'))).toThrow(/^absent\.json: cannot read .*absent\.json \(ENOENT\)$/);
  });
});
