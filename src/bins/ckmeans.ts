// Optimal 1-D k-means (Ckmeans) on weighted points: the dynamic programme of Wang & Song, "Ckmeans.1d.dp:
// Optimal k-means clustering in one dimension by dynamic programming", The R Journal 3(2):29–33, 2011,
// with the divide-and-conquer fill of Ckmeans.1d.dp 3.4.6 as simple-statistics 7.12.1 writes it, and the
// weighted sums of squares of Ckmeans.1d.dp's weighted variant. Run on the distinct values of a column
// with their counts as weights it is exact for the whole column: equal values never need to be split
// between clusters (moving a run of ties to the nearer centre never raises the sum of squares), so
// 10 million ages or amounts cost only as much as their distinct values.

/** How many distinct values ascending data holds. */
export function countDistinctSorted(sorted: ArrayLike<number>): number {
  let m = 0;
  for (let i = 0; i < sorted.length; i++) if (i === 0 || sorted[i] !== sorted[i - 1]) m++;
  return m;
}

/** The distinct values of ascending data, with how many times each occurs. */
export function distinctWithCounts(sorted: ArrayLike<number>): { values: Float64Array; counts: Float64Array } {
  const n = sorted.length;
  const m = countDistinctSorted(sorted);
  const values = new Float64Array(m);
  const counts = new Float64Array(m);
  let k = -1;
  for (let i = 0; i < n; i++) {
    if (i === 0 || sorted[i] !== sorted[i - 1]) values[++k] = sorted[i]!;
    counts[k]!++;
  }
  return { values, counts };
}

interface Sums { w: Float64Array; s: Float64Array; ss: Float64Array }

/** Weighted within-cluster sum of squares of points j..i (simple-statistics's ssq, with weights). */
function ssq(j: number, i: number, p: Sums): number {
  let sji: number;
  if (j > 0) {
    const w = p.w[i]! - p.w[j - 1]!;
    const mu = (p.s[i]! - p.s[j - 1]!) / w;
    sji = p.ss[i]! - p.ss[j - 1]! - w * mu * mu;
  } else {
    sji = p.ss[i]! - (p.s[i]! * p.s[i]!) / p.w[i]!;
  }
  return sji < 0 ? 0 : sji;
}

interface Fill { prev: Float64Array; cur: Float64Array; back: Int32Array[]; p: Sums; n: number }

/** Fills row `cluster` of the cost and backtrack tables for i in [iMin, iMax] (divide and conquer). */
function fillColumn(iMin: number, iMax: number, cluster: number, t: Fill): void {
  if (iMin > iMax) return;
  const { prev, cur, p } = t;
  const back = t.back[cluster]!, backPrev = t.back[cluster - 1]!;
  const i = Math.floor((iMin + iMax) / 2);
  cur[i] = prev[i - 1]!;
  back[i] = i;
  let jlow = cluster;
  if (iMin > cluster) jlow = Math.max(jlow, back[iMin - 1]!);
  jlow = Math.max(jlow, backPrev[i]!);
  let jhigh = i - 1;
  if (iMax < t.n - 1) jhigh = Math.min(jhigh, back[iMax + 1]!);
  for (let j = jhigh; j >= jlow; --j) {
    const sji = ssq(j, i, p);
    if (sji + prev[jlow - 1]! >= cur[i]!) break;
    const sjlowi = ssq(jlow, i, p);
    const ssqjlow = sjlowi + prev[jlow - 1]!;
    if (ssqjlow < cur[i]!) { cur[i] = ssqjlow; back[i] = jlow; }
    jlow++;
    const ssqj = sji + prev[j - 1]!;
    if (ssqj < cur[i]!) { cur[i] = ssqj; back[i] = j; }
  }
  fillColumn(iMin, i - 1, cluster, t);
  fillColumn(i + 1, iMax, cluster, t);
}

/** Prefix sums of weights, weighted values and weighted squares, shifted by the weighted median. */
function prefixSums(values: Float64Array, weights: Float64Array): Sums {
  const n = values.length;
  let total = 0;
  for (let i = 0; i < n; i++) total += weights[i]!;
  // the value at position floor(total / 2) of the expanded data, as simple-statistics shifts by its median
  let shift = values[n - 1]!;
  for (let i = 0, acc = 0; i < n; i++) { acc += weights[i]!; if (acc > Math.floor(total / 2)) { shift = values[i]!; break; } }
  const w = new Float64Array(n), s = new Float64Array(n), ss = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const x = values[i]! - shift, wi = weights[i]!;
    w[i] = (i > 0 ? w[i - 1]! : 0) + wi;
    s[i] = (i > 0 ? s[i - 1]! : 0) + wi * x;
    ss[i] = (i > 0 ? ss[i - 1]! : 0) + wi * x * x;
  }
  return { w, s, ss };
}

/**
 * Optimal clustering of ascending, distinct `values` with positive `weights` into `k` clusters
 * (1 ≤ k ≤ values.length): the index of each cluster's first value, ascending (the first is 0).
 */
export function ckmeansWeighted(values: Float64Array, weights: Float64Array, k: number): Int32Array {
  const n = values.length;
  if (k <= 1 || n <= 1) return Int32Array.of(0);
  const p = prefixSums(values, weights);
  const back = Array.from({ length: k }, () => new Int32Array(n));
  let prev = new Float64Array(n), cur = new Float64Array(n);
  for (let i = 0; i < n; i++) prev[i] = ssq(0, i, p);
  for (let cluster = 1; cluster < k; cluster++) {
    const iMin = cluster < k - 1 ? cluster : n - 1;
    fillColumn(iMin, n - 1, cluster, { prev, cur, back, p, n });
    [prev, cur] = [cur, prev];
  }
  const starts = new Int32Array(k);
  let right = n - 1;
  for (let cluster = k - 1; cluster >= 0; cluster--) {
    const left = back[cluster]![right]!;
    starts[cluster] = left;
    if (cluster > 0) right = left - 1;
  }
  return starts;
}
