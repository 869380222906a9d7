// No command writes a file it reads: an output that is an input (by another spelling, a
// symbolic link or a hard link) is refused with exit 2 and the input keeps its bytes; outputs
// appear under their name only when complete.
import { cpSync, existsSync, linkSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { main } from '../../estimator/cli/main.js';
import { checkOutputs, openOutput, writeOutput } from '../../estimator/cli/outputFiles.js';
import { defaultAnalysis } from '../../notebooks/analysis/defaultAnalysis.js';
import { studyById } from '../../notebooks/studies/studies.js';
import { fakeIo } from './fakeIo.js';

const dir = mkdtempSync(join(tmpdir(), 'alight-outputs-'));
afterAll(async () => {
  await new Promise((done) => setTimeout(done, 200)); // file streams of the refused replay finish closing
  rmSync(dir, { recursive: true, force: true });
});

async function run(...argv: string[]) {
  const io = fakeIo(dir);
  const code = await main(argv, io);
  return { code, out: io.out.join(''), err: io.err.join('') };
}

beforeAll(async () => {
  writeFileSync(join(dir, 'sc.json'), JSON.stringify({ version: 1, name: 'short', duration: 2, seed: 3 }, null, 1) + '\n');
  writeFileSync(join(dir, 'road.csv'), 't,x,y,z\n0,0,0,0\n10,10,0,0\n');
  writeFileSync(join(dir, 'recorded.json'), JSON.stringify({ version: 1, duration: 2, carrier: { path: { shape: 'recorded', file: 'road.csv' } } }) + '\n');
  expect((await run('sweep', 'sc.json', '--trials', '2', '--workers', '1', '--out', 'r.jsonl')).code).toBe(0);
  cpSync(resolve('data-demo/logs/harbour-boat'), join(dir, 'log'), { recursive: true });
  writeFileSync(join(dir, 'analysis.json'), JSON.stringify(defaultAnalysis(studyById('detection'))) + '\n');
  symlinkSync(join(dir, 'r.jsonl'), join(dir, 'link.jsonl'));
  linkSync(join(dir, 'sc.json'), join(dir, 'hard.json'));
  mkdirSync(join(dir, 'sub'));
});

describe('outputs never replace inputs', () => {
  const cases: [string, string[], string][] = [
    ['simulate --trace onto its scenario', ['simulate', 'sc.json', '--trace', 'sub/../sc.json'], 'sc.json'],
    ['simulate --trace onto its recorded path', ['simulate', 'recorded.json', '--trace', 'road.csv'], 'road.csv'],
    ['simulate --trace onto a hard link of its scenario', ['simulate', 'sc.json', '--trace', 'hard.json'], 'sc.json'],
    ['summarize --csv onto its input', ['summarize', 'r.jsonl', '--csv', 'r.jsonl'], 'r.jsonl'],
    ['summarize --svg onto a link to its input', ['summarize', 'link.jsonl', '--svg', './r.jsonl'], 'r.jsonl'],
    ['summarize --miss-svg onto its input', ['summarize', 'r.jsonl', '--miss-svg', `${dir}/r.jsonl`], 'r.jsonl'],
    ['sweep --out onto its scenario, even with --resume', ['sweep', 'sc.json', '--trials', '1', '--out', 'sc.json', '--resume'], 'sc.json'],
    ['test-card --html onto its results', ['test-card', 'r.jsonl', '--path', 'detector.pixelNoise', '--up-to', '2', '--rate', '0.9', '--html', './r.jsonl'], 'r.jsonl'],
    ['merge --out onto a shard by another spelling', ['merge', 'r.jsonl', '--out', 'sub/../r.jsonl'], 'r.jsonl'],
    ['require --svg onto its scenario', ['require', 'sc.json', '--param', 'detector.pixelNoise', '--target', '0.9', '--svg', 'sc.json'], 'sc.json'],
    ['sensitivity --svg onto its scenario', ['sensitivity', 'sc.json', '--svg', 'sc.json'], 'sc.json'],
    ['tune --surface onto its scenario', ['tune', 'sc.json', '--surface', 'sc.json'], 'sc.json'],
    ['tune --surface onto a file of its log', ['tune', 'log', '--surface', 'log/camera.json'], 'log/camera.json'],
    ['replay --out onto a file of its log', ['replay', 'log', '--out', 'log/imu.csv'], 'log/imu.csv'],
    ['replay --out onto its --filter file', ['replay', 'log', '--filter', 'log/filter.json', '--out', 'log/filter.json'], 'log/filter.json'],
    ['report --out onto its analysis', ['report', 'analysis.json', '--out', 'analysis.json'], 'analysis.json'],
    ['ingest --out into the folder holding its map as filter.json', ['ingest', 'log/imu.csv', '--map', 'log/filter.json', '--out', 'log', '--force'], 'log/filter.json'],
    ['record --out into the folder holding its scenario as camera.json', ['record', 'log/camera.json', '--out', 'log', '--force'], 'log/camera.json'],
  ];
  for (const [label, argv, input] of cases) {
    it(label, async () => {
      const before = readFileSync(join(dir, input));
      const { code, out, err } = await run(...argv);
      expect(code, err).toBe(2);
      expect(out).toBe('');
      expect(err).toMatch(/^alight [\w-]+: (--\w[\w-]* \S+ is an input of this command|.*camera\.json)/);
      expect(err).not.toMatch(/\bat \w+ \(/);
      expect(readFileSync(join(dir, input))).toEqual(before);
    });
  }

  it('two outputs naming one file are refused', async () => {
    const { code, err } = await run('summarize', 'r.jsonl', '--csv', 'a.out', '--svg', 'sub/../a.out');
    expect(code).toBe(2);
    expect(err).toBe('alight summarize: --csv and --svg name the same file (sub/../a.out); give each output its own file\n');
    expect(existsSync(join(dir, 'a.out'))).toBe(false);
  });

  it('a refused --svg is refused before any trial runs (no other file appears)', async () => {
    const before = readdirSync(dir).sort();
    await run('sensitivity', 'sc.json', '--svg', 'sc.json');
    expect(readdirSync(dir).sort()).toEqual(before);
  });
});

describe('outputs appear whole or not at all', () => {
  it('writeOutput renames a finished temporary file into place and leaves nothing else', () => {
    const target = { option: '--csv', name: 'w.csv', path: join(dir, 'sub', 'w.csv') };
    writeOutput('test', target, 'a,b\n1,2\n');
    expect(readFileSync(target.path, 'utf8')).toBe('a,b\n1,2\n');
    expect(readdirSync(join(dir, 'sub'))).toEqual(['w.csv']);
  });

  it('a failed write names the option and file and leaves no partial file', () => {
    const target = { option: '--svg', name: 'sub', path: join(dir, 'sub') }; // a folder
    expect(() => writeOutput('summarize', target, '<svg/>')).toThrow(/^cannot write --svg sub \(EISDIR\)$|alight summarize: cannot write --svg sub \(EISDIR\)/);
    expect(readdirSync(join(dir, 'sub'))).toEqual(['w.csv']);
  });

  it('a streamed output of a failed run is removed; a finished one replaces the target', () => {
    const target = { option: '--out', name: 'e.csv', path: join(dir, 'sub', 'e.csv') };
    const failed = openOutput('replay', target);
    failed.write('time\n1\n');
    failed.finish(false);
    expect(readdirSync(join(dir, 'sub'))).toEqual(['w.csv']);
    const done = openOutput('replay', target);
    done.write('time\n2\n');
    expect(existsSync(target.path)).toBe(false); // not under its name while being written
    done.finish(true);
    expect(readFileSync(target.path, 'utf8')).toBe('time\n2\n');
  });

  it('replay --out of a log that cannot be replayed leaves no estimates file', async () => {
    cpSync(join(dir, 'log'), join(dir, 'broken-log'), { recursive: true });
    rmSync(join(dir, 'broken-log', 'imu.csv'));
    const { code, err } = await run('replay', 'broken-log', '--out', 'est.csv');
    expect(code).toBe(2);
    expect(err).toMatch(/^alight replay: .*imu\.csv/);
    expect(existsSync(join(dir, 'est.csv'))).toBe(false);
    expect(readdirSync(dir).filter((f) => f.includes('partial'))).toEqual([]);
  });

  it('checkOutputs accepts distinct new files', () => {
    expect(() => checkOutputs('x', [{ option: '--a', name: 'n1', path: join(dir, 'n1') }, { option: '--b', name: 'n2', path: join(dir, 'n2') }], [join(dir, 'sc.json')])).not.toThrow();
  });
});
