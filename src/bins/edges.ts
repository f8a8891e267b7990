// Buckets from a list of edges: sorted, equal edges merged and reported, each end closed on the chosen
// side, integer labels for integer data, so every value on an edge lands in exactly one bucket.
import type { Bucket, ClosedSide, MergedEdge } from './types.js';
import { discreteRange, formatRange, makeRange, type Range } from '../ranges/index.js';

export interface EdgeOptions {
  closed?: ClosedSide;
  /** Add a first bucket below the lowest edge. */
  openLow?: boolean;
  /** Add a last bucket above the highest edge. */
  openHigh?: boolean;
  /** Close the outer ends too ([a, b] for the last bucket under 'left'), so the data's min and max land
   *  in a bucket; used for edges computed from the data (R's include.lowest, d3's last bin). */
  includeEnds?: boolean;
  /** Label with whole numbers (0-4) when every bucket holds at least one; default true. */
  discrete?: boolean;
}

/** Sorts edges and merges equal ones, reporting each merge; NaN and infinite edges are dropped by the caller. */
export function mergeEdges(edges: readonly number[]): { edges: number[]; merged: MergedEdge[] } {
  const sorted = [...edges].sort((a, b) => a - b);
  const out: number[] = [];
  const merged: MergedEdge[] = [];
  for (let i = 0; i < sorted.length;) {
    let j = i + 1;
    while (j < sorted.length && sorted[j] === sorted[i]) j++;
    out.push(sorted[i] === 0 ? 0 : sorted[i]!);
    if (j - i > 1) merged.push({ value: sorted[i]!, times: j - i });
    i = j;
  }
  return { edges: out, merged };
}

/** The continuous ranges between edges, closed on one side, with the optional open-ended ones. */
function continuousRanges(edges: number[], o: EdgeOptions): Range[] {
  const left = (o.closed ?? 'left') === 'left';
  const out: Range[] = [];
  if (o.openLow) out.push(makeRange(null, edges[0]!, false, !left));
  for (let i = 0; i + 1 < edges.length; i++) {
    const first = i === 0 && !o.openLow;
    const last = i + 2 === edges.length && !o.openHigh;
    out.push(makeRange(edges[i]!, edges[i + 1]!, left || (first && o.includeEnds === true), !left || (last && o.includeEnds === true)));
  }
  if (o.openHigh) out.push(makeRange(edges[edges.length - 1]!, null, left, false));
  if (edges.length === 1 && !o.openLow && !o.openHigh) out.push(makeRange(edges[0]!, edges[0]!, true, true));
  return out;
}

/** The same range as whole numbers [first, last + 1), or null when it holds no whole number. */
export function toDiscrete(r: Range): Range | null {
  const first = r.low === null ? null : r.lowClosed ? Math.ceil(r.low) : Math.floor(r.low) + 1;
  const last = r.high === null ? null : r.highClosed ? Math.floor(r.high) : Math.ceil(r.high) - 1;
  if (first !== null && last !== null && first > last) return null;
  return discreteRange(first, last);
}

/**
 * Buckets from edges. With `discrete` (the default when every edge is a whole number) the buckets hold
 * whole numbers and get inclusive integer labels (0-4, 5-9, 65+); otherwise interval labels ([0,5)).
 */
export function bucketsFromEdges(edges: readonly number[], options: EdgeOptions = {}): { buckets: Bucket[]; merged: MergedEdge[]; discrete: boolean } {
  const { edges: e, merged } = mergeEdges(edges);
  if (e.length === 0) return { buckets: [], merged, discrete: false };
  const ranges = continuousRanges(e, options);
  const wantDiscrete = options.discrete ?? e.every(Number.isInteger);
  const asInts = wantDiscrete ? ranges.map(toDiscrete) : [];
  const discrete = wantDiscrete && asInts.every((r) => r !== null);
  const final = discrete ? (asInts as Range[]) : ranges;
  return { buckets: final.map((range, index) => ({ index, label: formatRange(range), range })), merged, discrete };
}

/**
 * Buckets around clusters given by their extents, so that every value stays with its cluster: under
 * 'left' each bucket runs from its cluster's minimum to the next one's, [min_i, min_i+1), the last one
 * closed at its maximum; under 'right' from the previous cluster's maximum, (max_i-1, max_i], the first
 * one closed at its minimum.
 */
export function bucketsFromExtents(extents: ReadonlyArray<{ min: number; max: number }>, closed: ClosedSide, discrete: boolean): { buckets: Bucket[]; discrete: boolean } {
  const n = extents.length;
  const ranges = extents.map((e, i) => closed === 'left'
    ? (i + 1 < n ? makeRange(e.min, extents[i + 1]!.min, true, false) : makeRange(e.min, e.max, true, true))
    : (i === 0 ? makeRange(e.min, e.max, true, true) : makeRange(extents[i - 1]!.max, e.max, false, true)));
  const asInts = discrete ? ranges.map(toDiscrete) : [];
  const ok = discrete && asInts.every((r) => r !== null);
  const final = ok ? (asInts as Range[]) : ranges;
  return { buckets: final.map((range, index) => ({ index, label: formatRange(range), range })), discrete: ok };
}
