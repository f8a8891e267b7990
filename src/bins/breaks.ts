// Edges computed from the data: equal width on round numbers (d3-array nice/ticks), quantiles
// (Hyndman & Fan 1996), natural breaks by Ckmeans (Wang & Song 2011, weighted on distinct values) and bin
// counts from Sturges (1926), Scott (1979) or Freedman–Diaconis (1981) (d3-array thresholds).
import { nice, ticks, thresholdFreedmanDiaconis, thresholdScott, thresholdSturges } from 'd3-array';
import { ckmeansWeighted, countDistinctSorted, distinctWithCounts } from './ckmeans.js';
import { QuernError } from '../errors.js';
import { quantileOfSorted, type QuantileType } from './quantile.js';
import type { ClosedSide } from './types.js';

export type BinRule = 'sturges' | 'scott' | 'freedman-diaconis';
export const BIN_RULES: readonly BinRule[] = ['sturges', 'scott', 'freedman-diaconis'];

/** Most distinct values Ckmeans runs on (its tables hold about 40 bytes a distinct value, plus 4 a cell). */
export const CKMEANS_MAX_VALUES = 2_000_000;
/** Most cells (bins × distinct values) of Ckmeans's backtrack table (4 bytes each: 80 MB). */
export const CKMEANS_MAX_CELLS = 20_000_000;

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
 * Clusters of sorted data by Ckmeans (optimal 1-D k-means, Wang & Song, The R Journal 3(2):29–33, 2011),
 * as their extents. It runs on the distinct values weighted by their counts, which is exact for the whole
 * data (see ckmeans.ts) and keeps equal values together; `joined` (clusters that shared a value and were
 * joined) is therefore 0, kept for callers of earlier versions. Throws QuernError 'E_DATA' beyond
 * CKMEANS_MAX_VALUES distinct values or CKMEANS_MAX_CELLS cells.
 */
export function ckmeansExtents(sorted: Float64Array, bins: number): { extents: Extent[]; joined: number } {
  if (sorted.length === 0) return { extents: [], joined: 0 };
  const m = countDistinctSorted(sorted);
  const k = Math.min(bins, m);
  if (m > CKMEANS_MAX_VALUES || k * m > CKMEANS_MAX_CELLS) {
    throw new QuernError('E_DATA', `Ckmeans needs memory for ${k} × ${m} distinct values, more than the limit of ${m > CKMEANS_MAX_VALUES ? `${CKMEANS_MAX_VALUES} distinct values` : `${CKMEANS_MAX_CELLS} cells`}`, 'use --method quantile, fewer --bins, or round the values (fewer distinct values)');
  }
  const { values, counts } = distinctWithCounts(sorted);
  const starts = ckmeansWeighted(values, counts, k);
  const extents: Extent[] = [];
  for (let c = 0; c < starts.length; c++) {
    const last = c + 1 < starts.length ? starts[c + 1]! - 1 : m - 1;
    extents.push({ min: values[starts[c]!]!, max: values[last]! });
  }
  return { extents, joined: 0 };
}

/** The number of bins a rule suggests, as d3-array 3.2.5 computes it (REFERENCES §9). */
export function ruleBinCount(rule: BinRule, values: ArrayLike<number>, min: number, max: number): number {
  const v = values as unknown as number[];
  const k = rule === 'sturges' ? thresholdSturges(v) : rule === 'scott' ? thresholdScott(v, min, max) : thresholdFreedmanDiaconis(v, min, max);
  return Number.isFinite(k) && k >= 1 ? k : 1;
}
