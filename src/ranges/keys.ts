// Endpoint positions as exact integer keys, so a million ranges sort in linear time: every distinct
// endpoint value gets its rank among all values, and key = 2 × rank + side (see range.ts on sides).
import type { Range } from './types.js';
import { highSide, highValue, lowSide, lowValue } from './range.js';

export interface EndKeys {
  /** Low and high key of each range. */
  low: Float64Array;
  high: Float64Array;
  /** The distinct endpoint values in order: value of key k is values[k >> 1], side k & 1. */
  values: Float64Array;
}

/** Rank of x in sorted distinct values (x is present). */
function rankOf(values: Float64Array, x: number): number {
  let lo = 0, hi = values.length - 1;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (values[mid]! < x) lo = mid + 1; else hi = mid;
  }
  return lo;
}

/** Integer keys of every range's ends (and of extra points such as a domain's ends). */
export function endKeys(ranges: readonly Range[], extra: readonly number[] = []): EndKeys {
  const n = ranges.length;
  const all = new Float64Array(2 * n + extra.length);
  for (let i = 0; i < n; i++) { all[2 * i] = lowValue(ranges[i]!); all[2 * i + 1] = highValue(ranges[i]!); }
  all.set(extra, 2 * n);
  all.sort();
  let m = 0;
  for (let i = 0; i < all.length; i++) if (i === 0 || all[i] !== all[m - 1]) all[m++] = all[i]!;
  const values = all.slice(0, m);
  const low = new Float64Array(n), high = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const r = ranges[i]!;
    low[i] = 2 * rankOf(values, lowValue(r)) + lowSide(r);
    high[i] = 2 * rankOf(values, highValue(r)) + highSide(r);
  }
  return { low, high, values };
}

/** The key of a position (v, side) whose value is among `values`. */
export function keyOf(k: EndKeys, v: number, side: number): number {
  return 2 * rankOf(k.values, v) + side;
}

/** Stable counting sort of `order` by integer keys in [0, size). */
function countingSort(order: Uint32Array, key: Float64Array, size: number): Uint32Array {
  const count = new Uint32Array(size + 1);
  for (let i = 0; i < order.length; i++) count[key[order[i]!]! + 1]!++;
  for (let k = 1; k <= size; k++) count[k]! += count[k - 1]!;
  const out = new Uint32Array(order.length);
  for (let i = 0; i < order.length; i++) { const j = order[i]!; out[count[key[j]!]!++] = j; }
  return out;
}

/** Indices in `ids` ordered by low key, then high key, then index (two stable counting sorts). */
export function sortByEnds(ids: Uint32Array, k: EndKeys): Uint32Array {
  const size = 2 * k.values.length;
  return countingSort(countingSort(ids, k.high, size), k.low, size);
}
