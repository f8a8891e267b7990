import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { BucketTally, bucketSpecOf, bucketsFromEdges, bucketsFromSpec, buildBuckets, makeBucketer, BELOW, ABOVE } from '../../src/bins/index.js';
import { makeNumberParser, emptyParsedNumber } from '../../src/numbers/index.js';
import { isQuernError } from '../../src/errors.js';

const RUNS = Number(process.env.QUERN_FUZZ_RUNS ?? 300);

describe('bucketsFromEdges(edges, options)', () => {
  it('bucketsFromEdges([0,5,10,15,65], openHigh) labels integer buckets 0-4 … 15-64, 65+ (the issue\'s example)', () => {
    const { buckets, discrete } = bucketsFromEdges([0, 5, 10, 15, 65], { openHigh: true });
    expect(discrete).toBe(true);
    expect(buckets.map((b) => b.label)).toEqual(['0-4', '5-9', '10-14', '15-64', '65+']);
  });

  it('bucketsFromEdges with closed right labels the integers each bucket holds: (0,5] is 1-5', () => {
    const { buckets } = bucketsFromEdges([0, 5, 10], { closed: 'right', openLow: true, openHigh: true });
    expect(buckets.map((b) => b.label)).toEqual(['<1', '1-5', '6-10', '11+']);
  });

  it('bucketsFromEdges with decimal edges uses interval labels', () => {
    const { buckets } = bucketsFromEdges([0, 2.5, 5], { openHigh: true });
    expect(buckets.map((b) => b.label)).toEqual(['[0,2.5)', '[2.5,5)', '[5,inf)']);
  });

  it('bucketsFromEdges merges equal edges and reports them; the caller\'s array is not sorted', () => {
    const edges = Object.freeze([10, 0, 5, 5, 5]);
    const r = bucketsFromEdges(edges);
    expect(r.merged).toEqual([{ value: 5, times: 3 }]);
    expect(r.buckets.map((b) => b.label)).toEqual(['0-4', '5-9']);
  });

  it.each(['left', 'right'] as const)('every value, and every edge value, lands in exactly one bucket under --closed %s (property)', (closed) => {
    fc.assert(fc.property(fc.uniqueArray(fc.integer({ min: -50, max: 50 }), { minLength: 2, maxLength: 8 }), fc.boolean(), fc.integer({ min: -60, max: 60 }),
      (edges, asInts, probe) => {
        const { buckets } = bucketsFromEdges(edges, { closed, openLow: true, openHigh: true, discrete: asInts });
        for (const x of [...edges, probe, probe + 0.5]) {
          if (asInts && !Number.isInteger(x)) continue;
          const holding = buckets.filter((b) => {
            const r = b.range;
            return (r.low === null || (r.lowClosed ? x >= r.low : x > r.low)) && (r.high === null || (r.highClosed ? x <= r.high : x < r.high));
          });
          expect(holding).toHaveLength(1);
          // the edge itself goes to the bucket on the closed side (common practice; R's cut(right =))
          if (edges.includes(x)) {
            const r = holding[0]!.range;
            const edgeIsLow = r.low === x || (asInts && closed === 'right' && r.low === x);
            if (!asInts) expect(closed === 'left' ? r.low === x : r.high === x).toBe(true);
            else expect(edgeIsLow || r.high !== null).toBe(true);
          }
          expect(makeBucketer(buckets).assign(x)).toBe(holding[0]!.index);
        }
      }), { numRuns: RUNS });
  });
});

describe('buildBuckets(quantile) on heavy ties', () => {
  it('buildBuckets merges equal quantile edges and says so instead of leaving empty duplicate buckets', () => {
    const sorted = Float64Array.from([0, 0, 0, 0, 0, 0, 0, 1, 2, 3]);
    const set = buildBuckets({ kind: 'quantile', bins: 4 }, {}, { sorted, integers: true });
    // type-7 quartiles of the data are 0, 0, 0, 0.75, 3 (d3-array quantile): three equal edges at 0.
    expect(set.merged).toEqual([{ value: 0, times: 3 }]);
    expect(set.buckets.map((b) => b.label)).toEqual(['0', '1-3']);
    expect(set.notes.some((n) => n.includes('equal edges merged'))).toBe(true);
  });
});

describe('bucketSpecOf / bucketsFromSpec', () => {
  it('bucketsFromSpec(bucketSpecOf(set)) gives back the same buckets (spec round trip)', () => {
    const set = buildBuckets({ kind: 'scheme', name: 'who-world-2000' });
    const spec = JSON.parse(JSON.stringify(bucketSpecOf(set, 'patient_age')));
    expect(spec.ranges[0]).toEqual({ index: 0, label: '0-4', low: 0, high: 5, lowClosed: true, highClosed: false, weight: 8.86 });
    expect(bucketsFromSpec(spec).buckets).toEqual(set.buckets);
  });

  it.each([
    [{ kind: 'other' }], [{ kind: 'quern-bucket-spec', version: 2, ranges: [] }],
    [{ kind: 'quern-bucket-spec', version: 1, discrete: false, ranges: [{ index: 0, label: 'a', low: 0, high: 10, lowClosed: true, highClosed: false }, { index: 1, label: 'b', low: 5, high: 20, lowClosed: true, highClosed: false }] }],
    [{ kind: 'quern-bucket-spec', version: 1, discrete: true, ranges: [{ index: 0, label: 'a', low: 0.5, high: 10, lowClosed: true, highClosed: false }] }],
  ])('bucketsFromSpec(%j) throws E_VALUE', (spec) => {
    try { bucketsFromSpec(spec); expect.unreachable(); } catch (e) { expect(isQuernError(e, 'E_VALUE')).toBe(true); }
  });
});

describe('BucketTally', () => {
  it('BucketTally accounts for every value: bucketed, below, above, empty, invalid', () => {
    const set = buildBuckets({ kind: 'edges', edges: [0, 5, 10] });
    const t = new BucketTally(set);
    const p = makeNumberParser();
    const out = emptyParsedNumber();
    const values = ['0', '4', '4.5', '5', '9', '10', '-1', '', 'NaN', 'x'];
    const got = values.map((v, i) => { p.parse(v, out); return t.record(i + 2, v, out); });
    expect(got.slice(0, 7)).toEqual([0, 0, 0, 1, 1, ABOVE, BELOW]);
    const s = t.summary('f.csv', 'v', values.length, {});
    expect(s.buckets.map((b) => b.count)).toEqual([3, 2]);
    expect([s.bucketed, s.below.count, s.above.count, s.empty.count, s.invalid.count]).toEqual([5, 1, 1, 1, 2]);
    expect(s.invalid.byReason).toEqual({ 'not-a-number': 1, malformed: 1 });
    expect(s.nonInteger.examples).toEqual([{ line: 4, value: '4.5' }]);
    expect(s.bucketed + s.below.count + s.above.count + s.between.count + s.empty.count + s.invalid.count).toBe(s.rowsRead);
  });
});
