// Assigning values to ordered, non-overlapping buckets by binary search: one bucket per value at most.
import type { Bucket } from './types.js';

/** Outcomes of assign() other than a bucket index. */
export const BELOW = -1;
export const ABOVE = -2;
export const BETWEEN = -3;

export interface Bucketer {
  /** The index of the bucket holding x, or BELOW, ABOVE or BETWEEN (in a hole between buckets). */
  assign(x: number): number;
}

function lowOk(b: Bucket, x: number): boolean {
  const r = b.range;
  return r.low === null || (r.lowClosed ? x >= r.low : x > r.low);
}

function highOk(b: Bucket, x: number): boolean {
  const r = b.range;
  return r.high === null || (r.highClosed ? x <= r.high : x < r.high);
}

/**
 * Compiles buckets (ordered and non-overlapping: build them with bucketsFromEdges or check a spec with
 * checkRanges) into a binary-search assigner.
 */
export function makeBucketer(buckets: readonly Bucket[]): Bucketer {
  const bs = [...buckets];
  const n = bs.length;
  return {
    assign(x: number): number {
      if (n === 0) return BETWEEN;
      // first bucket whose high end is not below x
      let lo = 0, hi = n;
      while (lo < hi) {
        const mid = (lo + hi) >> 1;
        if (highOk(bs[mid]!, x)) hi = mid; else lo = mid + 1;
      }
      if (lo === n) return ABOVE;
      if (lowOk(bs[lo]!, x)) return bs[lo]!.index;
      return lo === 0 ? BELOW : BETWEEN;
    },
  };
}
