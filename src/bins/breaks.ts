// Edges computed from the data: equal width on round numbers (d3-array nice/ticks), quantiles
// (Hyndman & Fan 1996), natural breaks by Ckmeans (Wang & Song 2011, via simple-statistics) and bin
// counts from Sturges (1926), Scott (1979) or Freedman–Diaconis (1981) (d3-array thresholds).
import { nice, ticks, thresholdFreedmanDiaconis, thresholdScott, thresholdSturges } from 'd3-array';
import { ckmeans } from 'simple-statistics';
import { QuernError } from '../errors.js';
import { quantileOfSorted, type QuantileType } from './quantile.js';
import type { ClosedSide } from './types.js';

export type BinRule = 'sturges' | 'scott' | 'freedman-diaconis';
export const BIN_RULES: readonly BinRule[] = ['sturges', 'scott', 'freedman-diaconis'];

/** Largest input Ckmeans runs on: its dynamic programme holds 2 × bins × n numbers. */
export const CKMEANS_MAX_VALUES = 2_000_000;

/**
 * `bins` equal-width edges spanning [min, max]. With `round` (default) the span is widened to round
 * numbers and the edges are d3-array's ticks, so the count may differ a little from `bins`.
 */
export function equalWidthEdges(min: number, max: number, bins: number, round = true): number[] {
  if (min === max) return [min];
  if (round) {
    const [lo, hi] = nice(min, max, bins);
    const edges = ticks(lo, hi, bins);
    if (edges[0]! > min) edges.unshift(min);
    if (edges[edges.length - 1]! < max) edges.push(max);
    return edges;
  }
  return Array.from({ length: bins + 1 }, (_, i) => (i === bins ? max : min + (i * (max - min)) / bins));
}

/** Edges at the quantiles 0, 1/bins, …, 1 of sorted data (equal edges are merged later, and reported). */
export function quantileEdges(sorted: Float64Array, bins: number, type: QuantileType = 7): number[] {
  return Array.from({ length: bins + 1 }, (_, i) => quantileOfSorted(sorted, i / bins, type));
}

/** The smallest and largest value of one cluster. */
export interface Extent { min: number; max: number }

/**
 * Clusters of sorted data by Ckmeans (optimal 1-D k-means, Wang & Song, The R Journal 3(2):29–33, 2011,
 * as simple-statistics computes it), as their extents. Clusters that share a value (simple-statistics
 * may split a run of ties) are joined, and `joined` counts them.
 */
export function ckmeansExtents(sorted: Float64Array, bins: number): { extents: Extent[]; joined: number } {
  if (sorted.length === 0) return { extents: [], joined: 0 };
  if (sorted.length > CKMEANS_MAX_VALUES) {
    throw new QuernError('E_DATA', `Ckmeans needs memory for ${bins} × ${sorted.length} values, more than the limit of ${CKMEANS_MAX_VALUES} values`, 'use --method quantile, or bucket a sample');
  }
  const extents: Extent[] = [];
  let joined = 0;
  for (const c of ckmeans(Array.from(sorted), Math.min(bins, sorted.length))) {
    const last = extents[extents.length - 1];
    if (last !== undefined && c[0]! <= last.max) { last.max = Math.max(last.max, c[c.length - 1]!); joined++; }
    else extents.push({ min: c[0]!, max: c[c.length - 1]! });
  }
  return { extents, joined };
}

/** The number of bins a rule suggests, as d3-array 3.2.5 computes it (REFERENCES §9). */
export function ruleBinCount(rule: BinRule, values: ArrayLike<number>, min: number, max: number): number {
  const v = values as unknown as number[];
  const k = rule === 'sturges' ? thresholdSturges(v) : rule === 'scott' ? thresholdScott(v, min, max) : thresholdFreedmanDiaconis(v, min, max);
  return Number.isFinite(k) && k >= 1 ? k : 1;
}
