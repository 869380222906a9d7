// Set-up work that every trial of a study repeats with the same inputs (arc-length tables, LQR
// gains): a few results keyed by their exact inputs, the oldest dropped when full. Sharing is
// safe only for values nothing mutates, so each trial's numbers stay as they were.

export class NewestCache<V> {
  private readonly entries = new Map<string, V>();

  constructor(private readonly size: number) {}

  /** The value for key, computed on first use (and again once dropped). */
  get(key: string, compute: () => V): V {
    let value = this.entries.get(key);
    if (value === undefined) {
      value = compute();
      if (this.entries.size >= this.size) this.entries.delete(this.entries.keys().next().value!);
      this.entries.set(key, value);
    }
    return value;
  }
}
