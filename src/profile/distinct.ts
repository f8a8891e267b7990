// Distinct values of a column: counted exactly (with rows per value) up to a cap, then estimated with a
// HyperLogLog sketch. Past the cap the exact table is frozen (its counts stop) and every value only feeds
// the sketch.
import { HyperLogLog } from './hll.js';

/** Distinct values kept exactly per column. */
export const EXACT_DISTINCT_CAP = 10_000;

export class DistinctCounter {
  readonly counts = new Map<string, number>();
  private sketch: HyperLogLog | null = null;

  constructor(private readonly cap = EXACT_DISTINCT_CAP) {}

  add(value: string): void {
    if (this.sketch !== null) {
      this.sketch.add(value);
      return;
    }
    const c = this.counts.get(value);
    if (c !== undefined) {
      this.counts.set(value, c + 1);
      return;
    }
    if (this.sketch === null) {
      if (this.counts.size < this.cap) {
        this.counts.set(value, 1);
        return;
      }
      this.sketch = new HyperLogLog();
      for (const k of this.counts.keys()) this.sketch.add(k);
    }
    this.sketch.add(value);
  }

  /** True while every distinct value is in `counts`. */
  get exact(): boolean {
    return this.sketch === null;
  }

  /** Distinct values: exact, or the sketch's estimate past the cap. */
  count(): number {
    return this.sketch === null ? this.counts.size : Math.max(this.counts.size, this.sketch.estimate());
  }

  /** The `n` most frequent values (exact while `exact`; past the cap, counts of the first rows only), most frequent first. */
  top(n: number): Array<{ value: string; count: number }> {
    return [...this.counts].sort((a, b) => b[1] - a[1] || a[0].localeCompare(b[0])).slice(0, n).map(([value, count]) => ({ value, count }));
  }
}
