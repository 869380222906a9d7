// Property-based fuzzing (fast-check) of every file alight reads: scenario files, log folders
// (camera.json and every CSV), results files, analysis files and permalinks. Each generated
// input is malformed by construction; each must be refused with exit 2 (or, for the page's
// parse functions, a named error) and a file:line message, never a stack trace, never a write
// to an input, and never exit 0 with a silently changed meaning (a bad log row is skipped and
// reported with its file and line, as the README promises). Seeded: the same inputs every run.
import { spawnSync } from 'node:child_process';
import { cpSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { main } from '../../estimator/cli/main.js';
import { AnalysisError } from '../../notebooks/analysis/Analysis.js';
import { parseAnalysis } from '../../notebooks/analysis/parseAnalysis.js';
import { analysisTextFromFragment, PermalinkError, permalinkFragment } from '../../notebooks/analysis/permalink.js';
import { studyById } from '../../notebooks/studies/studies.js';
import { buildBundles, type Bundles } from '../cli/buildBundles.js';
import { fakeIo } from '../cli/fakeIo.js';

const dir = mkdtempSync(join(tmpdir(), 'alight-fuzz-'));
const counts: Record<string, number> = {};
/** The first message seen for each class of bad input, printed with the count (the list the issue asks for). */
const examples = new Map<string, string>();
const note = (kind: string, message: string) => {
  if (!examples.has(kind)) examples.set(kind, message.split('\n')[0]!.slice(0, 200));
};
const SEED = 20261204;
let bundles: Bundles;

afterAll(() => {
  const total = Object.values(counts).reduce((a, b) => a + b, 0);
  console.log(`fuzz: ${total} malformed inputs (${Object.entries(counts).map(([k, n]) => `${k} ${n}`).join(', ')})\n${[...examples].map(([k, m]) => `  ${k}: ${m}`).join('\n')}`);
  rmSync(dir, { recursive: true, force: true });
  if (bundles) rmSync(bundles.dir, { recursive: true, force: true });
});

async function run(...argv: string[]) {
  const io = fakeIo(dir);
  const code = await main(argv, io);
  return { code, out: io.out.join(''), err: io.err.join('') };
}

/** The refusal every bad input must get: exit 2, each line prefixed, a file:line position, no stack. */
function expectRefusal(r: { code: number; err: string }, command: string, file: RegExp, label: string): void {
  expect(r.code, `${label}\n${r.err}`).toBe(2);
  expect(r.err, label).not.toMatch(/internal error|\bat \w+ \(|\n\s+at /);
  for (const line of r.err.trimEnd().split('\n')) if (!/^\s/.test(line)) expect(line, label).toMatch(new RegExp(`^alight ${command}: `));
  expect(r.err, label).toMatch(file);
}

const SCENARIO = readFileSync(resolve('data-demo/survey-rover.scenario.json'), 'utf8');

/** Dotted paths of the number leaves of a JSON value. */
function numberPaths(value: unknown, path = ''): string[] {
  if (typeof value === 'number') return [path];
  if (value === null || typeof value !== 'object') return [];
  return Object.entries(value).flatMap(([k, v]) => numberPaths(v, path ? `${path}.${k}` : k));
}
const SCENARIO_NUMBERS = numberPaths(JSON.parse(SCENARIO)).filter((p) => !/^(version|seed)$/.test(p) && !/\.\d+$/.test(p));

/** Replace the value at a dotted path with raw JSON text (pretty-printed, so lines mean something). */
function withRaw(json: unknown, path: string, raw: string): string {
  const marker = '__FUZZ_MARKER__';
  const copy = JSON.parse(JSON.stringify(json)) as Record<string, unknown>;
  const keys = path.split('.');
  let parent = copy;
  for (const k of keys.slice(0, -1)) parent = parent[k] as Record<string, unknown>;
  parent[keys[keys.length - 1]!] = marker;
  return JSON.stringify(copy, null, 2).replace(`"${marker}"`, raw);
}

/** Malformed scenario texts: each kind is wrong whatever the position or value drawn. */
const badScenario = fc.oneof(
  // cut off anywhere before the closing brace
  fc.integer({ min: 1, max: SCENARIO.trimEnd().length - 1 }).map((n) => ({ kind: 'cut off', text: SCENARIO.slice(0, n) })),
  // a number field given a value of the wrong type
  fc.tuple(fc.constantFrom(...SCENARIO_NUMBERS), fc.constantFrom('"12"', 'true', '[]', '{}', '"NaN"', '""'))
    .map(([p, raw]) => ({ kind: 'wrong type', text: withRaw(JSON.parse(SCENARIO), p, raw) })),
  // a number beyond the double range
  fc.tuple(fc.constantFrom(...SCENARIO_NUMBERS), fc.constantFrom('1e999', '-1e400', '9'.repeat(320)))
    .map(([p, raw]) => ({ kind: 'non-finite', text: withRaw(JSON.parse(SCENARIO), p, raw) })),
  // a key given twice in the same object
  fc.constantFrom(...SCENARIO_NUMBERS).map((p) => {
    const keys = p.split('.');
    const last = keys[keys.length - 1]!;
    return { kind: 'duplicate key', text: withRaw(JSON.parse(SCENARIO), p, `1, "${last}": 2`) };
  }),
  // an unknown key, and nesting beyond any scenario
  fc.tuple(fc.constantFrom(...SCENARIO_NUMBERS), fc.stringMatching(/^[a-z]{3,8}Q$/)).map(([p, key]) => ({ kind: 'unknown key', text: withRaw(JSON.parse(SCENARIO), p.split('.').slice(0, -1).concat(key).join('.') || key, '1') })),
  fc.integer({ min: 70, max: 5000 }).map((n) => ({ kind: 'deep nesting', text: withRaw(JSON.parse(SCENARIO), 'name', '['.repeat(n) + ']'.repeat(n)) })),
  // garbage after the object, and stray characters between tokens
  fc.constantFrom('x', '}', ',', '{}', '"tail"').map((tail) => ({ kind: 'trailing text', text: SCENARIO.trimEnd() + tail })),
);

describe('fuzz: malformed inputs are refused with file:line, never a crash or a write', () => {
  beforeAll(async () => {
    writeFileSync(join(dir, 'short.scenario.json'), JSON.stringify({ version: 1, name: 'short', duration: 3, seed: 5 }));
    expect((await run('record', 'short.scenario.json', '--out', 'log')).code).toBe(0);
    expect((await run('sweep', 'short.scenario.json', '--vary', 'detector.pixelNoise=1,2', '--trials', '2', '--workers', '1', '--out', 'r.jsonl')).code).toBe(0);
    bundles = await buildBundles();
  }, 120_000);

  it('scenario files (alight camera: load and validate only)', async () => {
    await fc.assert(
      fc.asyncProperty(badScenario, async ({ kind, text }) => {
        counts.scenario = (counts.scenario ?? 0) + 1;
        const file = join(dir, 'bad.scenario.json');
        writeFileSync(file, text);
        const r = await run('camera', 'bad.scenario.json');
        expectRefusal(r, 'camera', /bad\.scenario\.json:\d+/, `${kind}:\n${text.slice(0, 300)}`);
        note(`scenario, ${kind}`, r.err);
        expect(readFileSync(file, 'utf8')).toBe(text);
      }),
      { seed: SEED, numRuns: 200 },
    );
  });

  const logFiles = () => readdirSync(join(dir, 'log')).filter((f) => f.endsWith('.csv'));
  /** A bad field or row for a CSV data line: each breaks a rule the README lists. */
  const badRow = fc.oneof(
    fc.tuple(fc.nat(), fc.constantFrom('abc', '', 'NaN', 'Infinity', '-inf', '1e999', '1,5', '--1')).map(([i, v]) => ({ kind: 'bad field', edit: (cells: string[]) => cells.map((c, k) => (k === i % cells.length ? v : c)) })),
    fc.constant({ kind: 'extra field', edit: (cells: string[]) => [...cells, '1'] }),
    fc.constant({ kind: 'missing field', edit: (cells: string[]) => cells.slice(0, -1) }),
    fc.constant({ kind: 'time goes back', edit: (cells: string[]) => ['-5', ...cells.slice(1)] }),
  );

  it('log folders: every CSV and camera.json', async () => {
    await fc.assert(
      fc.asyncProperty(fc.constantFrom(...logFiles()), fc.nat(), badRow, async (file, lineSeed, { kind, edit }) => {
        // A box's capture time may lie far back (a late box, counted unused); its order is by arrival.
        if (kind === 'time goes back' && file === 'boxes.csv') return;
        counts.log = (counts.log ?? 0) + 1;
        const folder = join(dir, 'fuzzed-log');
        rmSync(folder, { recursive: true, force: true });
        cpSync(join(dir, 'log'), folder, { recursive: true });
        const lines = readFileSync(join(folder, file), 'utf8').split('\n');
        const data = lines.map((l, i) => i).filter((i) => i > 0 && lines[i] !== '' && !lines[i]!.startsWith('#'));
        if (data.length === 0) return;
        // Time going back is a fault only after the first row.
        const pool = kind === 'time goes back' ? data.slice(1) : data;
        if (pool.length === 0) return;
        const target = pool[lineSeed % pool.length]!;
        lines[target] = edit(lines[target]!.split(',')).join(',');
        const text = lines.join('\n');
        writeFileSync(join(folder, file), text);
        const r = await run('replay', 'fuzzed-log', '--json');
        const label = `${kind} in ${file}:${target + 1}: ${lines[target]}`;
        expect(readFileSync(join(folder, file), 'utf8')).toBe(text);
        if (r.code === 2) {
          expectRefusal(r, 'replay', new RegExp(`${file.replace('.', '\\.')}(:\\d+)?`), label);
          note(`log ${file}, ${kind} (refused)`, r.err);
          return;
        }
        // Not refused: the row must be skipped and reported with its file and line (exit 0).
        expect(r.code, `${label}\n${r.err}`).toBe(0);
        const report = JSON.parse(r.out) as { problems: { total: number; shown: { file: string; line: number }[] } };
        expect(report.problems.total, label).toBeGreaterThanOrEqual(1);
        const shown = report.problems.shown.find((p) => p.file === file && p.line === target + 1);
        expect(shown, label).toBeDefined();
        note(`log ${file.replace(/\.csv$/, '')} row, ${kind} (skipped, reported)`, `${shown!.file}:${shown!.line} ${(shown as { column?: string }).column ?? ''}: ${(shown as { message?: string }).message ?? ''}`);
      }),
      { seed: SEED, numRuns: 100 },
    );
  });

  it('log folders: a broken camera.json', async () => {
    const camera = readFileSync(join(dir, 'log', 'camera.json'), 'utf8');
    const cameraNumbers = numberPaths(JSON.parse(camera)).filter((p) => !/\.\d+$/.test(p) && p !== 'version');
    const bad = fc.oneof(
      fc.integer({ min: 1, max: camera.trimEnd().length - 1 }).map((n) => camera.slice(0, n)),
      fc.constantFrom(...cameraNumbers).map((p) => withRaw(JSON.parse(camera), p, '"x"')),
      fc.constantFrom(...cameraNumbers).map((p) => withRaw(JSON.parse(camera), p, `1, "${p.split('.').pop()}": 2`)),
      fc.constantFrom(...cameraNumbers).map((p) => withRaw(JSON.parse(camera), p, '1e999')),
    );
    await fc.assert(
      fc.asyncProperty(bad, async (text) => {
        counts.log = (counts.log ?? 0) + 1;
        const folder = join(dir, 'camera-log');
        rmSync(folder, { recursive: true, force: true });
        cpSync(join(dir, 'log'), folder, { recursive: true });
        writeFileSync(join(folder, 'camera.json'), text);
        const r = await run('replay', 'camera-log');
        expectRefusal(r, 'replay', /camera\.json:\d+/, text.slice(0, 200));
        note(`camera.json, ${/not valid JSON: (\w+ \w+)/.exec(r.err)?.[1] ?? 'bad field'}`, r.err);
      }),
      { seed: SEED, numRuns: 40 },
    );
  });

  it('results files (alight summarize)', async () => {
    const text = readFileSync(join(dir, 'r.jsonl'), 'utf8');
    const lines = text.split('\n').slice(0, -1);
    const bad = fc.oneof(
      fc.integer({ min: 1, max: text.length - 2 }).filter((n) => text[n - 1] !== '\n').map((n) => ({ kind: 'cut off', text: text.slice(0, n) })),
      fc.integer({ min: 1, max: lines.length - 1 }).map((i) => ({ kind: 'repeated record', text: [...lines, lines[i]].join('\n') + '\n' })),
      fc.tuple(fc.integer({ min: 1, max: lines.length - 1 }), fc.constantFrom('"outcome":"landed"', '"point":0', '"trial":1', '"missDistance":0.1')).map(([i, field]) => ({
        kind: 'duplicate key', text: lines.map((l, k) => (k === i ? l.replace(/}$/, `,${field}}`) : l)).join('\n') + '\n',
      })),
      fc.tuple(fc.integer({ min: 1, max: lines.length - 1 }), fc.constantFrom('"outcome":"flew away"', '"point":9', '"trial":-1', '"neesMean":"high"', '"v":2')).map(([i, field]) => ({
        kind: 'bad field', text: lines.map((l, k) => (k === i ? l.replace(new RegExp(`"${field.split('"')[1]}":[^,}]*`), field) : l)).join('\n') + '\n',
      })),
      fc.string({ minLength: 1, maxLength: 30 }).filter((s) => !s.includes('\n')).map((junk) => ({ kind: 'foreign line', text: [...lines, junk].join('\n') + '\n' })),
      fc.constantFrom('', '{}', '[1]', '{"kind":"alight-sweep"}').map((head) => ({ kind: 'bad header', text: [head, ...lines.slice(1)].join('\n') + '\n' })),
    );
    await fc.assert(
      fc.asyncProperty(bad, async ({ kind, text: t }) => {
        counts.results = (counts.results ?? 0) + 1;
        writeFileSync(join(dir, 'bad.jsonl'), t);
        const r = await run('summarize', 'bad.jsonl');
        expectRefusal(r, 'summarize', /bad\.jsonl:\d+/, `${kind}:\n${t.slice(-300)}`);
        note(`results, ${kind}`, r.err.split('\n').find((l) => /bad\.jsonl:\d+/.test(l)) ?? r.err);
        expect(readFileSync(join(dir, 'bad.jsonl'), 'utf8')).toBe(t);
      }),
      { seed: SEED, numRuns: 120 },
    );
  });

  const ANALYSIS = readFileSync(resolve('data-demo/analyses/detection.analysis.json'), 'utf8');
  const lookup = (id: Parameters<typeof studyById>[0]) => studyById(id).parameters;
  const badAnalysis = fc.oneof(
    fc.integer({ min: 1, max: ANALYSIS.trimEnd().length - 1 }).map((n) => ANALYSIS.slice(0, n)),
    fc.constantFrom('"weather"', '7', 'null').map((v) => withRaw(JSON.parse(ANALYSIS), 'study', v)),
    fc.constantFrom('-1', '1.5', '"1"', '1e999').map((v) => withRaw(JSON.parse(ANALYSIS), 'seed', v)),
    fc.constantFrom('0', '100000', '"many"', '2.5').map((v) => withRaw(JSON.parse(ANALYSIS), 'parameters.trials', v)),
    fc.constantFrom(...SCENARIO_NUMBERS.filter((p) => p.startsWith('detector.'))).map((p) => withRaw(JSON.parse(ANALYSIS), `scenario.${p}`, '"x"')),
    fc.constant(withRaw(JSON.parse(ANALYSIS), 'seed', '1, "seed": 2')),
  );

  it('analysis files (the page\'s parse and alight report)', async () => {
    await fc.assert(
      fc.asyncProperty(badAnalysis, async (text) => {
        counts.analysis = (counts.analysis ?? 0) + 1;
        let error: unknown;
        try {
          parseAnalysis(text, 'a.json', lookup);
        } catch (e) {
          error = e;
        }
        expect(error, text.slice(0, 200)).toBeInstanceOf(AnalysisError);
        const message = (error as Error).message;
        note(`analysis, ${/not valid JSON: (\w+ \w+)/.exec(message)?.[1] ?? /field "(\w+)"|(parameters)\.|(detector)\./.exec(message)?.slice(1).find(Boolean) ?? 'field'}`, message);
        for (const p of (error as AnalysisError).problems) expect(p).toMatch(/^a\.json:\d+/);
      }),
      { seed: SEED, numRuns: 80 },
    );
    // and a few through the command, which refuses before running any trial
    await fc.assert(
      fc.asyncProperty(badAnalysis, async (text) => {
        counts.analysis = (counts.analysis ?? 0) + 1;
        writeFileSync(join(dir, 'bad.analysis.json'), text);
        expectRefusal(await run('report', 'bad.analysis.json', '--out', 'bad.html'), 'report', /bad\.analysis\.json:\d+/, text.slice(0, 200));
      }),
      { seed: SEED + 1, numRuns: 20 },
    );
  });

  it('permalinks: damaged links and links to malformed analyses', async () => {
    const good = permalinkFragment(ANALYSIS);
    const damaged = fc.oneof(
      fc.integer({ min: '#analysis='.length + 1, max: good.length - 1 }).filter((n) => (n - '#analysis='.length) % 4 === 1).map((n) => good.slice(0, n)),
      fc.tuple(fc.integer({ min: '#analysis='.length, max: good.length - 1 }), fc.constantFrom('%', '!', ' ', '=', '.')).map(([i, c]) => good.slice(0, i) + c + good.slice(i + 1)),
      badAnalysis.map((text) => permalinkFragment(text)),
      fc.uint8Array({ minLength: 1, maxLength: 40 }).map((bytes) => `#analysis=${Buffer.from([0xff, ...bytes]).toString('base64url')}`),
    );
    await fc.assert(
      fc.asyncProperty(damaged, async (fragment) => {
        counts.permalink = (counts.permalink ?? 0) + 1;
        let error: unknown;
        try {
          const text = analysisTextFromFragment(fragment);
          parseAnalysis(text ?? '', 'the link', lookup);
        } catch (e) {
          error = e;
        }
        expect(error instanceof PermalinkError || error instanceof AnalysisError, `${fragment.slice(0, 80)}: ${String(error)}`).toBe(true);
        note(`permalink, ${error instanceof PermalinkError ? (error.message.includes('UTF-8') ? 'not UTF-8' : error.message.includes('whole bytes') ? 'cut' : 'bad character') : 'malformed analysis'}`, `${(error as Error).name}: ${(error as Error).message}`);
        if (error instanceof AnalysisError) for (const p of error.problems) expect(p).toMatch(/^the link:\d+/);
      }),
      { seed: SEED, numRuns: 60 },
    );
  });

  it('a few as real processes: exit status 2 and a message, no stack trace', () => {
    const cases: [string[], RegExp][] = [
      [['camera', 'bad.scenario.json'], /^alight camera: bad\.scenario\.json:\d+/],
      [['summarize', 'bad.jsonl'], /^alight summarize: bad\.jsonl:\d+/],
      [['replay', 'camera-log'], /^alight replay: camera\.json:\d+/],
      [['report', 'bad.analysis.json'], /^alight report: bad\.analysis\.json:\d+/],
      [['simulate', 'bad.scenario.json', '--trace', 'bad.scenario.json'], /^alight simulate: /],
    ];
    for (const [argv, message] of cases) {
      counts.subprocess = (counts.subprocess ?? 0) + 1;
      const r = spawnSync(process.execPath, [bundles.cli, ...argv], { cwd: dir, encoding: 'utf8' });
      expect(r.status, `${argv.join(' ')}\n${r.stderr}`).toBe(2);
      expect(r.stderr).toMatch(message);
      expect(r.stderr).not.toMatch(/\n\s+at /);
      expect(r.stdout).toBe('');
    }
  });
});
