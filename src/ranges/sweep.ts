// Overlaps, holes, duplicates, coverage and partition of a set of ranges by one sweep over sorted ends:
// O(n log n + k) for k listed pairs, never a comparison of all pairs.
import type { AllenRelation, Range } from './types.js';
import { allenFromPositions } from './allen.js';
import { highSide, highValue, isEmptyRange, lowSide, lowValue, rangeFromPositions } from './range.js';
import { PositionHeap } from './heap.js';
import { endKeys, keyOf, sortByEnds, type EndKeys } from './keys.js';

/** One overlapping pair: indices into the caller's array, `a` starting no later than `b`. */
export interface OverlapPair { a: number; b: number; relation: AllenRelation }

/** A range written more than once: the indices of every copy, in input order. */
export interface DuplicateGroup { indices: number[] }

export interface RangeCheck {
  /** Ranges checked (empty ranges are listed in `empty`, not checked). */
  ranges: number;
  /** Overlapping pairs, at most `maxPairs` of them, between distinct ranges (copies are duplicates). */
  overlaps: OverlapPair[];
  /** Every overlapping pair of distinct ranges, listed or not. */
  overlapCount: number;
  holes: Range[];
  duplicates: DuplicateGroup[];
  /** Indices of ranges that hold no value ([5,5)). */
  empty: number[];
  /** The domain checked: the one given, else from the lowest low end to the highest high end. */
  domain: Range | null;
  /** Indices of ranges reaching outside a given domain. */
  outside: number[];
  /** Every value of the domain lies in some range. */
  covers: boolean;
  /** Every value of the domain lies in exactly one range, and no range reaches outside it. */
  partition: boolean;
}

export interface RangeCheckOptions {
  domain?: Range;
  /** How many overlapping pairs to list (all are counted); default 1000. */
  maxPairs?: number;
}

/** Non-empty ranges sorted by ends; empty ones apart. */
function sortedOrder(ranges: readonly Range[], k: EndKeys): { order: Uint32Array; empty: number[] } {
  const empty: number[] = [];
  const ids = new Uint32Array(ranges.length);
  let n = 0;
  for (let i = 0; i < ranges.length; i++) if (isEmptyRange(ranges[i]!)) empty.push(i); else ids[n++] = i;
  return { order: sortByEnds(ids.subarray(0, n), k), empty };
}

/** Collapses copies: one representative per distinct range, and the duplicate groups. */
function distinct(order: Uint32Array, k: EndKeys): { reps: number[]; duplicates: DuplicateGroup[] } {
  const reps: number[] = [];
  const duplicates: DuplicateGroup[] = [];
  for (let i = 0; i < order.length;) {
    const a = order[i]!;
    let j = i + 1;
    while (j < order.length && k.low[order[j]!] === k.low[a] && k.high[order[j]!] === k.high[a]) j++;
    reps.push(a);
    if (j - i > 1) duplicates.push({ indices: Array.from(order.subarray(i, j)) });
    i = j;
  }
  return { reps, duplicates };
}

/** The sweep: active ranges in a min-heap by high end; each new range overlaps every one still active. */
function sweepOverlaps(reps: number[], k: EndKeys, maxPairs: number): { pairs: OverlapPair[]; count: number } {
  const heap = new PositionHeap(k.high, new Uint8Array(k.high.length));
  const pairs: OverlapPair[] = [];
  let count = 0;
  for (const b of reps) {
    while (heap.size > 0 && k.high[heap.peek()]! <= k.low[b]!) heap.pop();
    count += heap.size;
    for (let j = 0; j < heap.size && pairs.length < maxPairs; j++) {
      const a = heap.items[j]!;
      pairs.push({ a, b, relation: allenFromPositions(k.low[a]!, 0, k.high[a]!, 0, k.low[b]!, 0, k.high[b]!, 0) });
    }
    heap.push(b);
  }
  pairs.sort((p, q) => p.a - q.a || p.b - q.b);
  return { pairs, count };
}

function positionRange(k: EndKeys, from: number, to: number, discrete: boolean): Range {
  return rangeFromPositions(k.values[from >> 1]!, from & 1, k.values[to >> 1]!, to & 1, discrete);
}

/** Holes between consecutive ranges, clipped to the domain keys [dlo, dhi). */
function findHoles(reps: number[], k: EndKeys, dlo: number, dhi: number, discrete: boolean): Range[] {
  const holes: Range[] = [];
  let reach = dlo; // how far the ranges reach so far
  const hole = (from: number, to: number): void => {
    const a = Math.max(from, dlo), b = Math.min(to, dhi);
    if (a < b) holes.push(positionRange(k, a, b, discrete));
  };
  for (const i of reps) {
    if (k.low[i]! > reach) hole(reach, k.low[i]!);
    if (k.high[i]! > reach) reach = k.high[i]!;
  }
  if (reach < dhi) hole(reach, dhi);
  return holes;
}

/**
 * Checks a set of ranges: every overlapping pair with its Allen relation, the holes between ranges,
 * copies of one range, and whether the ranges cover and partition a domain. Never sorts the caller's array.
 */
export function checkRanges(ranges: readonly Range[], options: RangeCheckOptions = {}): RangeCheck {
  const d = options.domain;
  const k = endKeys(ranges, d === undefined ? [] : [lowValue(d), highValue(d)]);
  const { order, empty } = sortedOrder(ranges, k);
  const { reps, duplicates } = distinct(order, k);
  const { pairs, count } = sweepOverlaps(reps, k, options.maxPairs ?? 1000);
  let dlo = 0, dhi = 0, hasDomain = reps.length > 0;
  if (d !== undefined) { dlo = keyOf(k, lowValue(d), lowSide(d)); dhi = keyOf(k, highValue(d), highSide(d)); hasDomain = true; }
  else if (reps.length > 0) { dlo = k.low[reps[0]!]!; for (const i of reps) dhi = Math.max(dhi, k.high[i]!); }
  let discrete = order.length > 0;
  for (const i of order) if (!ranges[i]!.discrete) { discrete = false; break; }
  const holes = hasDomain ? findHoles(reps, k, dlo, dhi, discrete) : [];
  const outside: number[] = [];
  if (d !== undefined) for (const i of order) if (k.low[i]! < dlo || k.high[i]! > dhi) outside.push(i);
  outside.sort((a, b) => a - b);
  const covers = hasDomain && holes.length === 0;
  return {
    ranges: order.length, overlaps: pairs, overlapCount: count, holes, duplicates, empty,
    domain: hasDomain ? positionRange(k, dlo, dhi, discrete) : null, outside, covers,
    partition: covers && count === 0 && duplicates.length === 0 && outside.length === 0,
  };
}
