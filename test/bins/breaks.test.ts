import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { quantile, ticks } from 'd3-array';
import { ckmeans } from 'simple-statistics';
import { buildBuckets, ckmeansExtents, equalWidthEdges, makeBucketer, quantileOfSorted, ruleBinCount, type QuantileType } from '../../src/bins/index.js';

const RUNS = Number(process.env.QUERN_FUZZ_RUNS ?? 300);
/** Within-cluster sum of squares of clusters given as arrays (the Ckmeans objective, Wang & Song 2011). */
function sse(clusters: ArrayLike<number>[]): number {
  let t = 0;
  for (const c of clusters) {
    const a = Array.from(c);
    const m = a.reduce((x, y) => x + y, 0) / a.length;
    t += a.reduce((x, y) => x + (y - m) ** 2, 0);
  }
  return t;
}

function groupBy(values: ArrayLike<number>, key: (v: number) => number): number[][] {
  const m = new Map<number, number[]>();
  for (const v of Array.from(values)) m.set(key(v), [...(m.get(key(v)) ?? []), v]);
  return [...m.values()];
}

/** True when two clusterings of the distinct runs into k groups reach the optimum (brute force over cut points). */
function tiedOptimum(sorted: Float64Array, k: number): boolean {
  const runs = groupBy(sorted, (v) => v);
  const costs: number[] = [];
  const walk = (from: number, left: number, acc: number[][]): void => {
    if (left === 1) { costs.push(sse([...acc, runs.slice(from).flat()])); return; }
    for (let cut = from + 1; cut <= runs.length - left + 1; cut++) walk(cut, left - 1, [...acc, runs.slice(from, cut).flat()]);
  };
  if (k <= 1 || runs.length <= k) return false;
  walk(0, k, []);
  const best = Math.min(...costs);
  return costs.filter((c) => Math.abs(c - best) <= 1e-9 * Math.max(1, best)).length > 1;
}

const range = (a: number, b: number) => Float64Array.from({ length: b - a + 1 }, (_, i) => a + i);

describe('quantileOfSorted(sorted, p, type)', () => {
  // x = 1..10, p = 0.25, worked by hand from the definitions of Hyndman & Fan (1996), section 2
  // (j = floor(np + m), g = np + m − j); the same values R prints for quantile(1:10, 0.25, type = k) (from memory).
  it.each([[1, 3], [2, 3], [3, 2], [4, 2.5], [5, 3], [6, 2.75], [7, 3.25], [8, 2.9166666666666665], [9, 2.9375]] as const)(
    'quantileOfSorted(1..10, 0.25, type %d) is %d', (type, expected) => {
      expect(quantileOfSorted(range(1, 10), 0.25, type as QuantileType)).toBeCloseTo(expected, 12);
    });

  it('quantileOfSorted type 2 averages at a jump: median of 1..10 is 5.5 (Hyndman & Fan 1996, definition 2)', () => {
    expect(quantileOfSorted(range(1, 10), 0.5, 2)).toBe(5.5);
    expect(quantileOfSorted(range(1, 10), 0.5, 1)).toBe(5);
  });

  it('quantileOfSorted types 4–9 agree with d3-array quantile for type 7 and stay within the data (property)', () => {
    fc.assert(fc.property(fc.array(fc.integer({ min: -1000, max: 1000 }), { minLength: 1, maxLength: 60 }), fc.double({ min: 0, max: 1, noNaN: true }), (xs, p) => {
      const sorted = Float64Array.from(xs).sort();
      expect(quantileOfSorted(sorted, p, 7)).toBeCloseTo(quantile(xs, p)!, 9); // d3-array 3.2.5 is R-7
      for (const t of [1, 2, 3, 4, 5, 6, 8, 9] as const) {
        const q = quantileOfSorted(sorted, p, t);
        expect(q).toBeGreaterThanOrEqual(sorted[0]!);
        expect(q).toBeLessThanOrEqual(sorted[sorted.length - 1]!);
      }
    }), { numRuns: RUNS });
  });
});

describe('ruleBinCount(rule, values, min, max)', () => {
  // Worked examples computed with d3-array 3.2.5 (REFERENCES §9).
  it.each([
    ['sturges', range(1, 100), 8], ['scott', range(1, 100), 5], ['freedman-diaconis', range(1, 100), 5],
    ['sturges', Float64Array.from([2, 4, 4, 4, 5, 5, 7, 9]), 4], ['scott', Float64Array.from([2, 4, 4, 4, 5, 5, 7, 9]), 2],
    ['freedman-diaconis', Float64Array.from([2, 4, 4, 4, 5, 5, 7, 9]), 5],
    ['sturges', range(0, 999), 11], ['scott', range(0, 999), 10], ['freedman-diaconis', range(0, 999), 10],
  ] as const)('ruleBinCount(%s) on the REFERENCES §9 data is %d', (rule, data, k) => {
    expect(ruleBinCount(rule, data, data[0]!, data[data.length - 1]!)).toBe(k);
  });

  // Sturges count by n (REFERENCES §9): d3's ceil(log2 n) + 1.
  it.each([[1, 1], [2, 2], [8, 4], [10, 5], [16, 5], [17, 6], [64, 7], [65, 8], [1024, 11], [1025, 12]] as const)(
    'ruleBinCount(sturges) for n = %d is %d', (n, k) => {
      const data = range(1, n);
      expect(ruleBinCount('sturges', data, 1, n)).toBe(k);
    });

  it('Scott (1979) width h = 3.49·s·n^(−1/3): for 1..100, h = 21.8137 and ceil(99 / h) = 5 (REFERENCES §9)', () => {
    const h = 3.49 * 29.0115 * Math.pow(100, -1 / 3);
    expect(h).toBeCloseTo(21.8137, 3);
    expect(Math.ceil(99 / h)).toBe(ruleBinCount('scott', range(1, 100), 1, 100));
  });
});

describe('equalWidthEdges(min, max, bins)', () => {
  it('equalWidthEdges(0, 99, 10) are the d3-array ticks of the nice domain 0–100 (d3-array 3.2.5 as oracle)', () => {
    expect(equalWidthEdges(0, 99, 10)).toEqual(ticks(0, 100, 10));
  });
  it('equalWidthEdges(1, 4, 3, round = false) splits the span exactly', () => {
    expect(equalWidthEdges(1, 4, 3, false)).toEqual([1, 2, 3, 4]);
  });
});

describe('ckmeansExtents(sorted, k) and the ckmeans plan', () => {
  // Wang & Song (2011), the Ckmeans.1d.dp test case (REFERENCES §11): sizes (4, 3, 3), ids (1,2,1,2,3,3,3,1,2,1).
  const x = [-1, 2, -1, 2, 4, 5, 6, -1, 2, -1];
  it.each(['left', 'right'] as const)('buildBuckets(ckmeans) on the Wang & Song case with closed %s reproduces the published clusters', (closed) => {
    const sorted = Float64Array.from(x).sort();
    const set = buildBuckets({ kind: 'ckmeans', bins: 3 }, { closed, discrete: false }, { sorted, integers: true });
    const b = makeBucketer(set.buckets);
    expect(x.map((v) => b.assign(v) + 1)).toEqual([1, 2, 1, 2, 3, 3, 3, 1, 2, 1]);
    expect(ckmeansExtents(sorted, 3).extents).toEqual([{ min: -1, max: -1 }, { min: 2, max: 2 }, { min: 4, max: 6 }]); // centres −1, 2, 5
  });

  it('buildBuckets(ckmeans) puts each value with its simple-statistics ckmeans cluster when that clustering keeps ties together and no other is as good (simple-statistics 7.12.1 as oracle, property)', () => {
    fc.assert(fc.property(fc.array(fc.integer({ min: 0, max: 50 }), { minLength: 3, maxLength: 40 }), fc.integer({ min: 2, max: 4 }), (xs, k) => {
      const sorted = Float64Array.from(xs).sort();
      const clusters = ckmeans(xs, Math.min(k, xs.length));
      const set = buildBuckets({ kind: 'ckmeans', bins: k }, { discrete: false }, { sorted, integers: true });
      const b = makeBucketer(set.buckets);
      const ours = sse(groupBy(sorted, (v) => b.assign(v)));
      // Both are optimal: the same within-cluster sum of squares (Wang & Song 2011: Ckmeans is exact).
      expect(ours).toBeCloseTo(sse(clusters), 6);
      // Equal values always share a bucket (simple-statistics may split a run of ties between clusters).
      for (let i = 1; i < sorted.length; i++) if (sorted[i] === sorted[i - 1]) expect(b.assign(sorted[i]!)).toBe(b.assign(sorted[i - 1]!));
      const split = clusters.some((c, i) => i > 0 && clusters[i - 1]!.at(-1) === c[0]);
      if (!split && !tiedOptimum(sorted, Math.min(k, new Set(xs).size))) {
        clusters.forEach((c) => expect(new Set(c.map((v) => b.assign(v))).size).toBe(1));
      }
    }), { numRuns: RUNS });
  });

  it.each(['left', 'right'] as const)('buildBuckets(ckmeans) on [1,2,4,5,7,9,10,20] k = 3, closed %s, keeps the clusters of simple-statistics: [1..5], [7..10], [20] (REFERENCES §11)', (closed) => {
    const data = [1, 2, 4, 5, 7, 9, 10, 20];
    const set = buildBuckets({ kind: 'ckmeans', bins: 3 }, { closed }, { sorted: Float64Array.from(data), integers: true });
    const b = makeBucketer(set.buckets);
    expect(data.map((v) => b.assign(v))).toEqual([0, 0, 0, 0, 1, 1, 1, 2]);
    expect(set.buckets.map((x) => x.label)).toEqual(closed === 'left' ? ['1-6', '7-19', '20'] : ['1-5', '6-10', '11-20']);
  });
});
