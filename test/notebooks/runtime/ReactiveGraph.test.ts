import { describe, expect, it } from 'vitest';
import { ReactiveGraph } from '../../../notebooks/runtime/ReactiveGraph.js';

function settled(): Promise<void> {
  return new Promise((resolve) => setTimeout(resolve, 30));
}

describe('ReactiveGraph', () => {
  it('recomputes only the dependants of a changed input', async () => {
    const seen: Record<string, unknown[]> = { left: [], right: [] };
    const graph = new ReactiveGraph({ scale: 10 });
    graph.input('a', 1);
    graph.input('b', 2);
    graph.define('left', ['a', 'scale'], (a: number, scale: number) => a * scale, { fulfilled: (v) => seen.left!.push(v) });
    graph.define('right', ['b'], (b: number) => b + 0.5, { fulfilled: (v) => seen.right!.push(v) });
    await settled();
    expect(seen).toEqual({ left: [10], right: [2.5] });
    graph.set('a', 3);
    await settled();
    expect(seen).toEqual({ left: [10, 30], right: [2.5] });
    expect(graph.computeCounts.get('right')).toBe(1);
    expect(graph.computeCounts.get('left')).toBe(2);
    graph.dispose();
  });

  it('computes unobserved values only when an observed value needs them', async () => {
    const graph = new ReactiveGraph();
    graph.input('x', 4);
    graph.define('idle', ['x'], (x: number) => x * 2);
    graph.define('shown', ['x'], (x: number) => x + 1, { fulfilled() {} });
    await settled();
    expect(graph.computeCounts.get('idle')).toBe(0);
    expect(await graph.value('idle')).toBe(8);
    graph.dispose();
  });

  it('passes every value of an async generator to the observer, in order', async () => {
    const seen: unknown[] = [];
    const graph = new ReactiveGraph();
    graph.input('n', 3);
    graph.define('steps', ['n'], async function* (n: number) {
      for (let i = 1; i <= n; i++) yield i;
    }, { fulfilled: (v) => seen.push(v) });
    await settled();
    expect(seen).toEqual([1, 2, 3]);
    graph.dispose();
  });

  it('refuses a name defined twice and a set of an unknown name', () => {
    const graph = new ReactiveGraph();
    graph.input('x', 1);
    expect(() => graph.input('x', 2)).toThrow('"x" is defined twice');
    expect(() => graph.set('y', 2)).toThrow('no value named "y"');
    graph.dispose();
  });
});
