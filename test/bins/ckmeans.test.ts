import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { ckmeans } from 'simple-statistics';
import { ckmeansExtents, ckmeansWeighted, distinctWithCounts, CKMEANS_MAX_CELLS } from '../../src/bins/index.js';
import { QuernError } from '../../src/errors.js';

const RUNS = Number(process.env.QUERN_FUZZ_RUNS ?? 300);

/** Within-cluster sum of squares (the objective Ckmeans minimises, Wang & Song 2011). */
function sse(clusters: number[][]): number {
  let t = 0;
  for (const c of clusters) {
    const m = c.reduce((x, y) => x + y, 0) / c.length;
    t += c.reduce((x, y) => x + (y - m) ** 2, 0);
  }
  return t;
}

/** The clusters of values (expanded by counts) cut at `starts`. */
function cut(values: Float64Array, counts: Float64Array, starts: Int32Array): number[][] {
  return Array.from(starts, (s, c) => {
    const end = c + 1 < starts.length ? starts[c + 1]! : values.length;
    const out: number[] = [];
    for (let i = s; i < end; i++) for (let r = 0; r < counts[i]!; r++) out.push(values[i]!);
    return out;
  });
}

describe('distinctWithCounts(sorted)', () => {
  it('distinctWithCounts([1,1,2,5,5,5]) gives values 1,2,5 with counts 2,1,3 (counted by hand)', () => {
    const d = distinctWithCounts(Float64Array.of(1, 1, 2, 5, 5, 5));
    expect(Array.from(d.values)).toEqual([1, 2, 5]);
    expect(Array.from(d.counts)).toEqual([2, 1, 3]);
  });
});

describe('ckmeansWeighted(values, weights, k)', () => {
  it('ckmeansWeighted on the Wang & Song example -1,2,4,5,6 (weights 4,3,1,1,1), k = 3 gives clusters {-1}, {2}, {4,5,6} (the simple-statistics documentation example)', () => {
    // simple-statistics ckmeans([-1, 2, -1, 2, 4, 5, 6, -1, 2, -1], 3) = [[-1,-1,-1,-1],[2,2,2],[4,5,6]]
    expect(Array.from(ckmeansWeighted(Float64Array.of(-1, 2, 4, 5, 6), Float64Array.of(4, 3, 1, 1, 1), 3))).toEqual([0, 1, 2]);
  });

  it('ckmeansWeighted with weights 1 cuts distinct values exactly where simple-statistics ckmeans does (simple-statistics 7.12.1 as oracle, property)', () => {
    fc.assert(fc.property(fc.uniqueArray(fc.double({ min: -1e6, max: 1e6, noNaN: true, noDefaultInfinity: true }), { minLength: 2, maxLength: 60 }), fc.integer({ min: 1, max: 6 }), (xs, k0) => {
      const values = Float64Array.from(xs.map((x) => (x === 0 ? 0 : x))).sort();
      if (new Set(values).size !== values.length) return;
      const k = Math.min(k0, values.length);
      const oracle = ckmeans(Array.from(values), k);
      const starts = ckmeansWeighted(values, new Float64Array(values.length).fill(1), k);
      const theirs: number[] = [];
      let at = 0;
      for (const c of oracle) { theirs.push(at); at += c.length; }
      expect(Array.from(starts)).toEqual(theirs);
    }), { numRuns: RUNS });
  });

  it('ckmeansWeighted on distinct values with counts reaches the sum of squares of simple-statistics ckmeans on the expanded data (oracle, property)', () => {
    fc.assert(fc.property(fc.array(fc.integer({ min: -30, max: 30 }), { minLength: 2, maxLength: 80 }), fc.integer({ min: 1, max: 6 }), (xs, k0) => {
      const sorted = Float64Array.from(xs).sort();
      const { values, counts } = distinctWithCounts(sorted);
      const k = Math.min(k0, values.length);
      const ours = sse(cut(values, counts, ckmeansWeighted(values, counts, k)));
      const theirs = sse(ckmeans(xs, k));
      expect(ours).toBeCloseTo(theirs, 6);
    }), { numRuns: RUNS });
  });
});

describe('ckmeansExtents(sorted, bins) on repeated values', () => {
  it('ckmeansExtents on 300,000 values with 3 distinct ages 20, 40, 80 gives the three ages as clusters (exact on the distinct values; counted by hand)', () => {
    const sorted = new Float64Array(300_000);
    sorted.fill(20, 0, 100_000); sorted.fill(40, 100_000, 200_000); sorted.fill(80, 200_000);
    expect(ckmeansExtents(sorted, 3).extents).toEqual([{ min: 20, max: 20 }, { min: 40, max: 40 }, { min: 80, max: 80 }]);
  });

  it('ckmeansExtents throws E_DATA when bins × distinct values exceed CKMEANS_MAX_CELLS (its backtrack table), naming the limit', () => {
    const m = Math.ceil(CKMEANS_MAX_CELLS / 100) + 1;
    const sorted = Float64Array.from({ length: m }, (_, i) => i);
    try { ckmeansExtents(sorted, 100); expect.unreachable(); } catch (e) {
      expect(e).toBeInstanceOf(QuernError);
      expect((e as QuernError).code).toBe('E_DATA');
      expect((e as QuernError).message).toContain(`${CKMEANS_MAX_CELLS} cells`);
    }
  });
});
