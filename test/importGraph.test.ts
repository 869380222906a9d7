// The library's import graph: no file imports its own caller (no cycles), and the filter
// layers (frames, camera, filter, models, stats) never import the simulator, studies, io or CLI.
import { readdirSync, readFileSync, statSync, existsSync } from 'node:fs';
import { dirname, join, normalize, relative } from 'node:path';
import { describe, expect, it } from 'vitest';

const ROOT = join(import.meta.dirname, '..');

function sourceFiles(dir: string, out: string[] = []): string[] {
  for (const name of readdirSync(dir)) {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) sourceFiles(path, out);
    else if (name.endsWith('.ts')) out.push(path);
  }
  return out;
}

/** Relative imports (static `from '...'`) of each file, as file paths. */
function importGraph(files: string[]): Map<string, string[]> {
  const graph = new Map<string, string[]>();
  for (const file of files) {
    const targets: string[] = [];
    for (const m of readFileSync(file, 'utf8').matchAll(/from '(\.[^']+)'/g)) {
      const target = normalize(join(dirname(file), m[1]!)).replace(/\.js$/, '.ts');
      if (existsSync(target)) targets.push(target);
    }
    graph.set(file, targets);
  }
  return graph;
}

/** Strongly connected components with more than one file (Tarjan). */
function cycles(graph: Map<string, string[]>): string[][] {
  let next = 0;
  const index = new Map<string, number>(), low = new Map<string, number>(), stack: string[] = [], onStack = new Set<string>();
  const found: string[][] = [];
  const visit = (v: string): void => {
    index.set(v, next); low.set(v, next); next++; stack.push(v); onStack.add(v);
    for (const w of graph.get(v) ?? []) {
      if (!index.has(w)) { visit(w); low.set(v, Math.min(low.get(v)!, low.get(w)!)); }
      else if (onStack.has(w)) low.set(v, Math.min(low.get(v)!, index.get(w)!));
    }
    if (low.get(v) === index.get(v)) {
      const component: string[] = [];
      let w: string;
      do { w = stack.pop()!; onStack.delete(w); component.push(relative(ROOT, w)); } while (w !== v);
      if (component.length > 1) found.push(component.sort());
    }
  };
  for (const v of graph.keys()) if (!index.has(v)) visit(v);
  return found;
}

describe('estimator import graph', () => {
  const graph = importGraph(sourceFiles(join(ROOT, 'estimator')));

  it('has no import cycles', () => {
    expect(cycles(graph)).toEqual([]);
  });

  it('keeps the filter layers below the simulator, studies, io and CLI', () => {
    const lower = ['frames', 'camera', 'filter', 'models', 'stats'].map((d) => join(ROOT, 'estimator', d));
    const upper = ['sim', 'study', 'io', 'cli'].map((d) => join(ROOT, 'estimator', d));
    const upward: string[] = [];
    for (const [file, targets] of graph) {
      if (!lower.some((d) => file.startsWith(d + '/'))) continue;
      for (const t of targets) if (upper.some((d) => t.startsWith(d + '/'))) upward.push(`${relative(ROOT, file)} -> ${relative(ROOT, t)}`);
    }
    expect(upward).toEqual([]);
  });

  it('finds a cycle when there is one (the check itself can fail)', () => {
    const a = join(ROOT, 'a.ts'), b = join(ROOT, 'b.ts');
    expect(cycles(new Map([[a, [b]], [b, [a]]]))).toEqual([['a.ts', 'b.ts']]);
  });
});
