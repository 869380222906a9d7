// A small typed face over @observablehq/runtime 6: named values, their inputs, observers.
// The runtime does the dependency work (one topological pass per change); this file only
// gives it types, our own builtins, and a way to count recomputations per value.
// @ts-expect-error: @observablehq/runtime ships no types; everything it returns is typed below.
import { Runtime } from '@observablehq/runtime';

/** What a value's definition may return: a plain value, a promise, or an (async) generator for progressive results. */
export type Definition = (...inputs: never[]) => unknown;

export interface Observer {
  pending?(): void;
  fulfilled?(value: unknown, name: string | null): void;
  rejected?(error: unknown, name: string | null): void;
}

interface RuntimeVariable {
  define(name: string | null, inputs: string[], definition: (...args: unknown[]) => unknown): RuntimeVariable;
  delete(): void;
}
interface RuntimeModule {
  variable(observer?: Observer): RuntimeVariable;
  redefine(name: string, inputs: string[], definition: () => unknown): RuntimeVariable;
  value(name: string): Promise<unknown>;
}
interface RuntimeInstance {
  module(): RuntimeModule;
  dispose(): void;
}
const RuntimeClass = Runtime as new (builtins: Record<string, unknown>, global?: (name: string) => unknown) => RuntimeInstance;

/**
 * One reactive graph. `define` adds a named value computed from other named values;
 * `set` replaces an input's value, and the runtime recomputes exactly its dependants.
 * Only observed values (and what they need) compute.
 */
export class ReactiveGraph {
  private readonly runtime: RuntimeInstance;
  private readonly module: RuntimeModule;
  private readonly names = new Set<string>();
  /** Times each value's definition ran (tests and the page's debug readout use it). */
  readonly computeCounts = new Map<string, number>();

  /** `builtins` become values every definition may name as an input (e.g. the job runner). */
  constructor(builtins: Record<string, unknown> = {}) {
    // The global resolver is ours too: no window globals leak into studies.
    this.runtime = new RuntimeClass(
      Object.fromEntries(Object.entries(builtins).map(([k, v]) => [k, () => v])),
      () => undefined,
    );
    this.module = this.runtime.module();
  }

  /** Define a named value from named inputs; the observer (if any) sees every new value. */
  define(name: string, inputs: readonly string[], definition: Definition, observer?: Observer): void {
    if (this.names.has(name)) throw new Error(`reactive graph: "${name}" is defined twice`);
    this.names.add(name);
    this.computeCounts.set(name, 0);
    const run = definition as (...args: unknown[]) => unknown;
    const counted = (...args: unknown[]): unknown => {
      this.computeCounts.set(name, (this.computeCounts.get(name) ?? 0) + 1);
      return run(...args);
    };
    // Unobserved values compute only when an observed value needs them.
    if (observer) this.module.variable(observer).define(name, [...inputs], counted);
    else this.module.variable().define(name, [...inputs], counted);
  }

  /** Replace an input value (a constant definition); only its dependants recompute. */
  set(name: string, value: unknown): void {
    if (!this.names.has(name)) throw new Error(`reactive graph: no value named "${name}"`);
    this.computeCounts.set(name, (this.computeCounts.get(name) ?? 0) + 1);
    this.module.redefine(name, [], () => value);
  }

  /** Define an input with a first value. */
  input(name: string, value: unknown, observer?: Observer): void {
    this.define(name, [], () => value, observer);
  }

  /** The current (first settled) value of a named value. */
  value(name: string): Promise<unknown> {
    return this.module.value(name);
  }

  dispose(): void {
    this.runtime.dispose();
  }
}
