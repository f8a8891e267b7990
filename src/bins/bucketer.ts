// Assigning values to ordered, non-overlapping buckets by binary search: one bucket per value at most.
// The bucket ends are compiled into typed arrays once, so the search touches no objects.
import type { Bucket } from './types.js';

/** Outcomes of assign() other than a bucket index. */
export const BELOW = -1;
export const ABOVE = -2;
export const BETWEEN = -3;

/** Marks an open end (null): it holds every value, NaN and infinities included. */
const OPEN = 2;

export interface Bucketer {
  /** The index of the bucket holding x, or BELOW, ABOVE or BETWEEN (in a hole between buckets). */
  assign(x: number): number;
}

/**
 * Compiles buckets (ordered and non-overlapping: build them with bucketsFromEdges or check a spec with
 * checkRanges) into a binary-search assigner.
 */
export function makeBucketer(buckets: readonly Bucket[]): Bucketer {
  const n = buckets.length;
  const low = new Float64Array(n), high = new Float64Array(n);
  const lowClosed = new Uint8Array(n), highClosed = new Uint8Array(n);
  const index = new Int32Array(n);
  buckets.forEach((b, i) => {
    const r = b.range;
    low[i] = r.low ?? -Infinity;
    high[i] = r.high ?? Infinity;
    lowClosed[i] = r.low === null ? OPEN : r.lowClosed ? 1 : 0;
    highClosed[i] = r.high === null ? OPEN : r.highClosed ? 1 : 0;
    index[i] = b.index;
  });
  return {
    assign(x: number): number {
      if (n === 0) return BETWEEN;
      // first bucket whose high end is not below x
      let lo = 0, hi = n;
      while (lo < hi) {
        const mid = (lo + hi) >> 1;
        const h = high[mid]!;
        if (x < h || (x === h && highClosed[mid] === 1) || highClosed[mid] === OPEN) hi = mid; else lo = mid + 1;
      }
      if (lo === n) return ABOVE;
      const l = low[lo]!;
      if (x > l || (x === l && lowClosed[lo] === 1) || lowClosed[lo] === OPEN) return index[lo]!;
      return lo === 0 ? BELOW : BETWEEN;
    },
  };
}
