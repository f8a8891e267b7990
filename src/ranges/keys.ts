// Endpoint positions as exact integer keys, so a million ranges sort in linear time: every distinct
// endpoint value gets its rank among all values, and key = 2 × rank + side (see range.ts on sides).
import { HIGH_CLOSED, LOW_CLOSED, type RangeColumns } from './columns.js';

export interface EndKeys {
  /** Low and high key of each checked range, by its position in the checked ids. */
  low: Int32Array;
  high: Int32Array;
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

/** Below this many values a comparison sort and binary searches beat the radix passes. */
const RADIX_MIN = 4096;

/**
 * The order of `values` ascending (stable), by LSD radix sort on their IEEE 754 bits made unsigned-
 * sortable (sign bit flipped, all bits of negatives flipped): four 16-bit passes, skipping a pass where
 * every value has the same digit. No value may be NaN or −0.
 */
function radixOrder(values: Float64Array): Uint32Array {
  const n = values.length;
  const bits = new Uint32Array(values.buffer, values.byteOffset, 2 * n);
  const lo = new Uint32Array(n), hi = new Uint32Array(n);
  for (let i = 0; i < n; i++) {
    const h = bits[2 * i + 1]!, l = bits[2 * i]!;
    if (h & 0x80000000) { hi[i] = ~h >>> 0; lo[i] = ~l >>> 0; } else { hi[i] = (h | 0x80000000) >>> 0; lo[i] = l; }
  }
  let order = new Uint32Array(n), tmp = new Uint32Array(n);
  for (let i = 0; i < n; i++) order[i] = i;
  const count = new Uint32Array(65536);
  for (let pass = 0; pass < 4; pass++) {
    const word = pass < 2 ? lo : hi, shift = pass & 1 ? 16 : 0;
    count.fill(0);
    for (let i = 0; i < n; i++) count[(word[i]! >>> shift) & 0xffff]!++;
    if (count[(word[0]! >>> shift) & 0xffff] === n) continue;
    let sum = 0;
    for (let d = 0; d < 65536; d++) { const c = count[d]!; count[d] = sum; sum += c; }
    for (let j = 0; j < n; j++) { const e = order[j]!; tmp[count[(word[e]! >>> shift) & 0xffff]!++] = e; }
    [order, tmp] = [tmp, order];
  }
  return order;
}

/** Distinct sorted values and the rank of each input value among them. */
function ranks(all: Float64Array): { values: Float64Array; rank: Uint32Array } {
  const order = radixOrder(all);
  const rank = new Uint32Array(all.length);
  const distinct = new Float64Array(all.length);
  let m = 0;
  for (let j = 0; j < order.length; j++) {
    const i = order[j]!, v = all[i]!;
    if (m === 0 || v !== distinct[m - 1]) distinct[m++] = v;
    rank[i] = m - 1;
  }
  return { values: distinct.slice(0, m), rank };
}

/** Integer keys of the ends of ranges ids[0..] of the columns (and of extra points such as a domain's ends). */
export function endKeys(c: RangeColumns, ids: Uint32Array, extra: readonly number[] = []): EndKeys {
  const n = ids.length;
  const all = new Float64Array(2 * n + extra.length);
  // x + 0 reads −0 as 0, which the radix order would otherwise put before 0.
  for (let j = 0; j < n; j++) { const i = ids[j]!; all[2 * j] = c.low[i]! + 0; all[2 * j + 1] = c.high[i]! + 0; }
  for (let e = 0; e < extra.length; e++) all[2 * n + e] = extra[e]! + 0;
  const low = new Int32Array(n), high = new Int32Array(n);
  if (all.length >= RADIX_MIN) {
    const { values, rank } = ranks(all);
    for (let j = 0; j < n; j++) {
      const f = c.flags[ids[j]!]!;
      low[j] = 2 * rank[2 * j]! + (f & LOW_CLOSED ? 0 : 1);
      high[j] = 2 * rank[2 * j + 1]! + (f & HIGH_CLOSED ? 1 : 0);
    }
    return { low, high, values };
  }
  all.sort();
  let m = 0;
  for (let i = 0; i < all.length; i++) if (i === 0 || all[i] !== all[m - 1]) all[m++] = all[i]!;
  const values = all.slice(0, m);
  for (let j = 0; j < n; j++) {
    const i = ids[j]!, f = c.flags[i]!;
    low[j] = 2 * rankOf(values, c.low[i]!) + (f & LOW_CLOSED ? 0 : 1);
    high[j] = 2 * rankOf(values, c.high[i]!) + (f & HIGH_CLOSED ? 1 : 0);
  }
  return { low, high, values };
}

/** The key of a position (v, side) whose value is among `values`. */
export function keyOf(k: EndKeys, v: number, side: number): number {
  return 2 * rankOf(k.values, v) + side;
}

/** Stable LSD radix sort of `order` by integer keys in [0, size): 11-bit digits, as many passes as size needs. */
function radixByKey(order: Uint32Array, key: Int32Array, size: number): Uint32Array {
  let from = order.slice(), to = new Uint32Array(order.length);
  const count = new Uint32Array(2048);
  for (let shift = 0; shift === 0 || size >>> shift > 0; shift += 11) {
    count.fill(0);
    for (let i = 0; i < from.length; i++) count[(key[from[i]!]! >>> shift) & 2047]!++;
    let sum = 0;
    for (let d = 0; d < 2048; d++) { const c = count[d]!; count[d] = sum; sum += c; }
    for (let i = 0; i < from.length; i++) { const j = from[i]!; to[count[(key[j]! >>> shift) & 2047]!++] = j; }
    [from, to] = [to, from];
  }
  return from;
}

/** Positions in `ids` ordered by low key, then high key, then position (two stable radix sorts). */
export function sortByEnds(ids: Uint32Array, k: EndKeys): Uint32Array {
  const size = 2 * k.values.length;
  if (ids.length < 64) return ids.slice().sort((a, b) => k.low[a]! - k.low[b]! || k.high[a]! - k.high[b]! || a - b);
  return radixByKey(radixByKey(ids, k.high, size), k.low, size);
}
