import { SAFETY_CAUTION } from '../../estimator/safetyCaution.js';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { main } from '../../estimator/cli/main.js';
import { TRACE_COLUMNS } from '../../estimator/sim/trace.js';

const ROOT = join(import.meta.dirname, '..', '..');
const dir = mkdtempSync(join(tmpdir(), 'alight-simulate-'));

async function run(argv: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  let stdout = '', stderr = '';
  const code = await main(argv, {
    stdout: (t) => void (stdout += t),
    stderr: (t) => void (stderr += t),
    interactive: false,
    cwd: ROOT,
    env: {},
  });
  return { code, stdout, stderr };
}

describe('alight simulate', () => {
  it('prints bit-identical --json for the same scenario and seed, and another result for another seed', async () => {
    const a = await run(['simulate', 'data-demo/harbour-boat.scenario.json', '--seed', '11', '--json']);
    const b = await run(['simulate', 'data-demo/harbour-boat.scenario.json', '--seed', '11', '--json']);
    expect(a.code).toBe(0);
    expect(a.stderr).toBe('');
    expect(b.stdout).toBe(a.stdout);
    expect(a.stdout.trim().split('\n')).toHaveLength(1);
    const result = JSON.parse(a.stdout) as Record<string, unknown>;
    for (const key of ['outcome', 'missDistance', 'closingSpeed', 'lateralSpeed', 'touchdownTime', 'positionRmse', 'neesMean', 'nisMean', 'phaseTimes']) {
      expect(result, key).toHaveProperty(key);
    }
    expect(result.seed).toBe(11);
    expect(result.scenario).toBe('harbour boat');
    const c = await run(['simulate', 'data-demo/harbour-boat.scenario.json', '--seed', '12', '--json']);
    expect(c.stdout).not.toBe(a.stdout);
  });

  it('prints a short summary with the outcome, phase times and the flight-safety caution', async () => {
    const { code, stdout } = await run(['simulate', 'data-demo/survey-rover.scenario.json']);
    expect(code).toBe(0);
    expect(stdout).toMatch(/^alight simulate: survey rover \(seed 101\)\n {2}outcome {4}(landed|off-pad|hard-contact|aborted|timed-out|diverged)/);
    expect(stdout).toMatch(/\n {2}phases {5}acquire [\d.]+ s, trail [\d.]+ s, align [\d.]+ s, descend [\d.]+ s, touchdown [\d.]+ s\n/);
    expect(stdout).toMatch(/field of view 93\.7 x 77\.3 deg/); // fx = 300 px: 2 atan(320 / 300), 2 atan(240 / 300)
    expect(stdout).toContain(SAFETY_CAUTION);
  });

  it('shows the deck-scale estimate when the filter carries it: a summary line, two trace columns, a result field', async () => {
    const scenario = JSON.parse(readFileSync(join(ROOT, 'data-demo/survey-rover.scenario.json'), 'utf8')) as { filter: Record<string, unknown> };
    scenario.filter.deckScaleSigma = 0.05;
    const file = join(dir, 'rover-scale.scenario.json'), trace = join(dir, 'trace-scale.csv');
    writeFileSync(file, JSON.stringify(scenario, null, 2));
    const text = await run(['simulate', file]);
    expect(text.code).toBe(0);
    expect(text.stdout).toMatch(/\n {2}deck scale [+-]\d+\.\d % ± \d+\.\d % \(1 sigma\)/);
    const json = await run(['simulate', file, '--json', '--trace', trace]);
    const result = JSON.parse(json.stdout) as { deckScaleEstimate: { value: number; sigma: number } };
    expect(result.deckScaleEstimate.sigma).toBeGreaterThan(0);
    expect(result.deckScaleEstimate.sigma).toBeLessThanOrEqual(0.05); // never above its prior
    const lines = readFileSync(trace, 'utf8').trim().split('\n');
    expect(lines[0]).toBe([...TRACE_COLUMNS, 'est_deck_scale', 'sigma_deck_scale'].join(','));
    const last = lines[lines.length - 1]!.split(',');
    expect(last).toHaveLength(TRACE_COLUMNS.length + 2);
    expect(Number(last[TRACE_COLUMNS.length + 1])).toBeGreaterThan(0);
    // without the state the summary has no such line
    scenario.filter.deckScaleSigma = 0;
    const plainFile = join(dir, 'rover-no-scale.scenario.json');
    writeFileSync(plainFile, JSON.stringify(scenario, null, 2));
    expect((await run(['simulate', plainFile])).stdout).not.toContain('deck scale');
  });

  it('writes a CSV trace with one row per step until touchdown', async () => {
    const trace = join(dir, 'trace.csv');
    const { code, stdout } = await run(['simulate', 'data-demo/survey-rover.scenario.json', '--trace', trace, '--json']);
    expect(code).toBe(0);
    const touchdown = (JSON.parse(stdout) as { touchdownTime: number }).touchdownTime;
    const lines = readFileSync(trace, 'utf8').trim().split('\n');
    expect(lines[0]).toBe(TRACE_COLUMNS.join(','));
    expect(lines.length - 1).toBe(Math.round(touchdown * 100) - 1); // the contact step itself is judged, not traced
    expect(lines[1]!.split(',')).toHaveLength(TRACE_COLUMNS.length);
    expect(lines[1]!.split(',')[1]).toBe('acquire');
    // the appended columns: camera updates with their NIS, and the true outline of captured frames
    const rows = lines.slice(1).map((l) => l.split(','));
    const col = (name: string) => TRACE_COLUMNS.indexOf(name);
    const result = JSON.parse(stdout) as { nisCount: number; gateRejections: number };
    const counted = rows.reduce((n, r) => n + Number(r[col('updates')]), 0);
    expect(counted).toBeGreaterThanOrEqual(result.nisCount + result.gateRejections); // plus any rejected ones
    const updated = rows.filter((r) => r[col('update')] !== '');
    for (const r of updated) {
      expect(['accepted', 'gated', 'rejected', 'diverged']).toContain(r[col('update')]);
      expect(r[col('nis_dim')]).toBe('3');
      if (r[col('update')] === 'accepted') expect(Number(r[col('nis')])).toBeGreaterThanOrEqual(0);
    }
    const outlines = rows.filter((r) => r[col('outline_xMin')] !== '');
    expect(outlines.length).toBeGreaterThan(rows.length / 10); // 30 frames/s over 100 steps/s, while in view
    for (const r of outlines) expect(Number(r[col('outline_xMax')])).toBeGreaterThan(Number(r[col('outline_xMin')]));
  });

  it('refuses a malformed scenario with one message per problem and exit 2, no stack trace', async () => {
    const bad = join(dir, 'rover.scenario.json');
    writeFileSync(bad, JSON.stringify({
      version: 1,
      detector: { pixelNoise: -1, rate: 30, latencyy: 0.1 },
      lander: { maxTiltDeg: 120 },
      guidance: { law: 'bang-bang' },
    }, null, 2));
    const { code, stdout, stderr } = await run(['simulate', bad]);
    expect(code).toBe(2);
    expect(stdout).toBe('');
    expect(stderr).not.toMatch(/\bat \w+ \(/); // no stack frames
    expect(stderr.trim().split('\n')).toEqual([
      'alight simulate: rover.scenario.json:4:19: detector.pixelNoise: must be >= 0, got -1', // line:column of the value, counted by hand in the 2-space JSON
      'alight simulate: rover.scenario.json:6:17: detector.latencyy: unknown key (expected one of: rate, pixelNoise, sizeNoise, latency, latencyJitter, dropout, burst, falseBoxRate, edgeMargin, script)',
      'alight simulate: rover.scenario.json:9:19: lander.maxTiltDeg: must be < 90, got 120',
      'alight simulate: rover.scenario.json:12:12: guidance.law: must be one of "pid", "lqr", got "bang-bang"',
    ]);
  });

  it('names file, line and column of broken JSON, and a missing file', async () => {
    const broken = join(dir, 'broken.scenario.json');
    writeFileSync(broken, '{\n  "version": 1,\n  "seed": 3\n  "duration": 10\n}\n');
    const a = await run(['simulate', broken]);
    expect(a.code).toBe(2);
    expect(a.stderr).toBe("alight simulate: broken.scenario.json:4:3: not valid JSON: expected ',' or '}', found '\"'\n");
    const b = await run(['simulate', join(dir, 'absent.scenario.json')]);
    expect(b.code).toBe(2);
    expect(b.stderr).toMatch(/^alight simulate: absent\.scenario\.json: cannot read .*absent\.scenario\.json \(ENOENT\)\n$/);
  });

  it('checks its options', async () => {
    expect((await run(['simulate', 'data-demo/survey-rover.scenario.json', '--seed', '-3'])).stderr).toBe('alight simulate: --seed expects a non-negative integer, got "-3"\n');
    expect((await run(['simulate'])).code).toBe(2);
    expect((await run(['simulate', 'a.json', 'b.json'])).stderr).toMatch(/one scenario file please, got 2/);
    const help = await run(['simulate', '--help']);
    expect(help.code).toBe(0);
    expect(help.stdout).toMatch(/^usage: alight simulate <scenario\.json> \[--seed N\] \[--trace FILE\.csv\] \[--json\]/);
    expect(help.stdout).toContain('--trace FILE.csv');
  });
});
