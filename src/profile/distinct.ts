// Distinct values of a column: counted exactly (with rows per value) up to a cap, then estimated with a
// HyperLogLog sketch. Past the cap the exact table is frozen (its counts stop) and every value only feeds
// the sketch. Each value is hashed once: the exact table and the sketch share the same 32-bit hash.
import { HyperLogLog, hashString } from './hll.js';
import { StringTable } from './string-table.js';

/** Distinct values kept exactly per column. */
export const EXACT_DISTINCT_CAP = 10_000;

export class DistinctCounter {
  private readonly table = new StringTable();
  private sketch: HyperLogLog | null = null;

  constructor(private readonly cap = EXACT_DISTINCT_CAP) {}

  add(value: string): void {
    const hash = hashString(value);
    if (this.sketch !== null) {
      this.sketch.addHash(hash);
      return;
    }
    const table = this.table;
    if (table.size < this.cap) {
      table.add(value, hash);
      return;
    }
    // At the cap: a value already in the table is still counted there; a new one starts the sketch.
    if (!table.addIfPresent(value, hash)) {
      this.sketch = new HyperLogLog();
      for (const k of table.keys) this.sketch.add(k);
      this.sketch.addHash(hash);
    }
  }

  /** Distinct values (first seen first) and their rows; frozen once the cap is passed. */
  get counts(): ReadonlyMap<string, number> {
    const out = new Map<string, number>();
    const { keys, rows } = this.table;
    for (let i = 0; i < keys.length; i++) out.set(keys[i]!, rows[i]!);
    return out;
  }

  /** True while every distinct value is in `counts`. */
  get exact(): boolean {
    return this.sketch === null;
  }

  /** Distinct values: exact, or the sketch's estimate past the cap. */
  count(): number {
    return this.sketch === null ? this.table.size : Math.max(this.table.size, this.sketch.estimate());
  }

  /** The `n` most frequent values (exact while `exact`; past the cap, counts of the first rows only), most frequent first. */
  top(n: number): Array<{ value: string; count: number }> {
    return [...this.counts].sort((a, b) => b[1] - a[1] || a[0].localeCompare(b[0])).slice(0, n).map(([value, count]) => ({ value, count }));
  }
}
