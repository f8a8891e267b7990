// Overlaps, holes, duplicates, coverage and partition of a set of ranges by one sweep over sorted ends:
// O(n log n + k) for k listed pairs, never a comparison of all pairs.
import type { AllenRelation, Range } from './types.js';
import { allenFromPositions } from './allen.js';
import { highSide, highValue, lowSide, lowValue, rangeFromPositions } from './range.js';
import { KeyHeap } from './heap.js';
import { DISCRETE, rangeColumnsOf, type RangeColumns } from './columns.js';
import { endKeys, keyOf, sortByEnds, type EndKeys } from './keys.js';

/** One overlapping pair: indices into the caller's array, `a` starting no later than `b`. */
export interface OverlapPair { a: number; b: number; relation: AllenRelation }

/** A range written more than once: the indices of its copies in input order (the first `maxListed`), and how many copies there are. */
export interface DuplicateGroup { indices: number[]; count: number }

export interface RangeCheck {
  /** Ranges checked (empty ranges are listed in `empty`, not checked). */
  ranges: number;
  /** Overlapping pairs, at most `maxPairs` of them, between distinct ranges (copies are duplicates). */
  overlaps: OverlapPair[];
  /** Every overlapping pair of distinct ranges, listed or not. */
  overlapCount: number;
  /** The holes in order, at most `maxListed` of them; `holeCount` counts them all. */
  holes: Range[];
  holeCount: number;
  /** Ranges written more than once, at most `maxListed` groups; `duplicateCount` counts all groups. */
  duplicates: DuplicateGroup[];
  duplicateCount: number;
  /** Indices of ranges that hold no value ([5,5)), the first `maxListed`; `emptyCount` counts them all. */
  empty: number[];
  emptyCount: number;
  /** The domain checked: the one given, else from the lowest low end to the highest high end. */
  domain: Range | null;
  /** Indices of ranges reaching outside a given domain, the first `maxListed`; `outsideCount` counts them all. */
  outside: number[];
  outsideCount: number;
  /** Every value of the domain lies in some range. */
  covers: boolean;
  /** Every value of the domain lies in exactly one range, and no range reaches outside it. */
  partition: boolean;
}

export interface RangeCheckOptions {
  domain?: Range;
  /** How many overlapping pairs to list (all are counted); default 1000. */
  maxPairs?: number;
  /**
   * How many holes, duplicate groups, copies per duplicate group, empty and outside ranges to list (all are
   * counted); default all. A million identical ranges then cost a count, not a million-entry list.
   */
  maxListed?: number;
}

/** Positions of the non-empty ranges sorted by ends; positions of empty ones apart (the first `max` listed). */
function sortedOrder(k: EndKeys, max: number): { order: Uint32Array; empty: number[]; emptyCount: number } {
  const empty: number[] = [];
  const n0 = k.low.length;
  const ids = new Uint32Array(n0);
  let n = 0, emptyCount = 0;
  for (let j = 0; j < n0; j++) {
    if (k.low[j]! < k.high[j]!) ids[n++] = j;
    else if (emptyCount++ < max) empty.push(j);
  }
  return { order: sortByEnds(ids.subarray(0, n), k), empty, emptyCount };
}

/** Collapses copies: one representative per distinct range, and the duplicate groups (the first `max`, each listing `max` copies). */
function distinct(order: Uint32Array, k: EndKeys, max: number): { reps: Uint32Array; duplicates: DuplicateGroup[]; duplicateCount: number } {
  const reps = new Uint32Array(order.length);
  let r = 0, duplicateCount = 0;
  const duplicates: DuplicateGroup[] = [];
  for (let i = 0; i < order.length;) {
    const a = order[i]!;
    let j = i + 1;
    while (j < order.length && k.low[order[j]!] === k.low[a] && k.high[order[j]!] === k.high[a]) j++;
    reps[r++] = a;
    // Copies sit in position order (sortByEnds breaks ties by position), so the first `max` are the earliest.
    if (j - i > 1 && duplicateCount++ < max) duplicates.push({ indices: Array.from(order.subarray(i, Math.min(j, i + max))), count: j - i });
    i = j;
  }
  return { reps: reps.subarray(0, r), duplicates, duplicateCount };
}

/** The sweep: active ranges in a min-heap by high end; each new range overlaps every one still active. */
function sweepOverlaps(reps: Uint32Array, k: EndKeys, maxPairs: number): { pairs: OverlapPair[]; count: number } {
  const heap = new KeyHeap(k.high, reps.length);
  const pairs: OverlapPair[] = [];
  let count = 0;
  for (let r = 0; r < reps.length; r++) {
    const b = reps[r]!;
    while (heap.size > 0 && k.high[heap.peek()]! <= k.low[b]!) heap.pop();
    count += heap.size;
    for (let j = 0; j < heap.size && pairs.length < maxPairs; j++) {
      const a = heap.at(j);
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

/** Holes between consecutive ranges, clipped to the domain keys [dlo, dhi): all counted, the first `max` listed. */
function findHoles(reps: Uint32Array, k: EndKeys, dlo: number, dhi: number, discrete: boolean, max: number): { holes: Range[]; count: number } {
  const holes: Range[] = [];
  let count = 0;
  let reach = dlo; // how far the ranges reach so far
  const hole = (from: number, to: number): void => {
    const a = Math.max(from, dlo), b = Math.min(to, dhi);
    if (a < b && count++ < max) holes.push(positionRange(k, a, b, discrete));
  };
  for (let r = 0; r < reps.length; r++) {
    const i = reps[r]!;
    if (k.low[i]! > reach) hole(reach, k.low[i]!);
    if (k.high[i]! > reach) reach = k.high[i]!;
  }
  if (reach < dhi) hole(reach, dhi);
  return { holes, count };
}

/** Positions of ranges reaching outside the domain keys [dlo, dhi), in input order: the first `max`, and the count. */
function findOutside(order: Uint32Array, k: EndKeys, dlo: number, dhi: number, max: number): { outside: number[]; count: number } {
  const all = new Uint32Array(order.length);
  let count = 0;
  for (let j = 0; j < order.length; j++) { const i = order[j]!; if (k.low[i]! < dlo || k.high[i]! > dhi) all[count++] = i; }
  const first = all.subarray(0, count).sort();
  return { outside: Array.from(first.subarray(0, Math.min(count, max))), count };
}

/**
 * Checks a set of ranges: every overlapping pair with its Allen relation, the holes between ranges,
 * copies of one range, and whether the ranges cover and partition a domain. Never sorts the caller's array.
 */
export function checkRanges(ranges: readonly Range[], options: RangeCheckOptions = {}): RangeCheck {
  return checkRangeColumns(rangeColumnsOf(ranges), undefined, options);
}

function identity(n: number): Uint32Array {
  const ids = new Uint32Array(n);
  for (let i = 0; i < n; i++) ids[i] = i;
  return ids;
}

/**
 * checkRanges on ranges held as columns: checks ranges ids[0..] of the columns (all of them when ids is
 * not given); the indices in the result are positions in `ids`. Memory grows as typed arrays only.
 */
export function checkRangeColumns(c: RangeColumns, ids: Uint32Array | undefined, options: RangeCheckOptions = {}): RangeCheck {
  const d = options.domain;
  const all = ids ?? identity(c.length);
  const k = endKeys(c, all, d === undefined ? [] : [lowValue(d), highValue(d)]);
  const max = options.maxListed ?? Infinity;
  const { order, empty, emptyCount } = sortedOrder(k, max);
  const { reps, duplicates, duplicateCount } = distinct(order, k, max);
  const { pairs, count } = sweepOverlaps(reps, k, options.maxPairs ?? 1000);
  let dlo = 0, dhi = 0, hasDomain = reps.length > 0;
  if (d !== undefined) { dlo = keyOf(k, lowValue(d), lowSide(d)); dhi = keyOf(k, highValue(d), highSide(d)); hasDomain = true; }
  else if (reps.length > 0) { dlo = k.low[reps[0]!]!; for (let r = 0; r < reps.length; r++) dhi = Math.max(dhi, k.high[reps[r]!]!); }
  let discrete = order.length > 0;
  for (let j = 0; j < order.length; j++) if ((c.flags[all[order[j]!]!]! & DISCRETE) === 0) { discrete = false; break; }
  const { holes, count: holeCount } = hasDomain ? findHoles(reps, k, dlo, dhi, discrete, max) : { holes: [], count: 0 };
  const { outside, count: outsideCount } = d !== undefined ? findOutside(order, k, dlo, dhi, max) : { outside: [], count: 0 };
  const covers = hasDomain && holeCount === 0;
  return {
    ranges: order.length, overlaps: pairs, overlapCount: count, holes, holeCount, duplicates, duplicateCount, empty, emptyCount,
    domain: hasDomain ? positionRange(k, dlo, dhi, discrete) : null, outside, outsideCount, covers,
    partition: covers && count === 0 && duplicateCount === 0 && outsideCount === 0,
  };
}
