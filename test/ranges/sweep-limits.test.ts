// checkRanges(ranges, { maxListed }): every hole, duplicate, empty and outside range is counted, only the
// first `maxListed` of each are listed. Worked examples are counted by hand; the property is a
// differential test of the capped path against the uncapped one (the uncapped lists are held to a
// brute-force oracle in test/ranges/sweep.test.ts and test/fuzz/ranges.test.ts).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { checkRanges, discreteRange, makeRange, parseDomain, type Range } from '../../src/ranges/index.js';

const RUNS = Number(process.env.QUERN_FUZZ_RUNS ?? 300);

describe('checkRanges(ranges, { maxListed })', () => {
  it('checkRanges(0-0, 2-2, … 18-18, { maxListed: 3 }) counts 9 holes and lists 1, 3 and 5', () => {
    // Single whole numbers 0, 2, …, 18 (discrete, inclusive): the odd numbers 1 … 17 are holes (arithmetic).
    const rs = Array.from({ length: 10 }, (_, i) => discreteRange(2 * i, 2 * i));
    const r = checkRanges(rs, { maxListed: 3 });
    expect(r.holeCount).toBe(9);
    expect(r.holes).toEqual([discreteRange(1, 1), discreteRange(3, 3), discreteRange(5, 5)]);
    expect(r.covers).toBe(false);
  });

  it('checkRanges(200,000 copies of [5,10), { maxListed: 4 }) lists indices 0–3 of one group of 200,000', () => {
    const one = makeRange(5, 10, true, false);
    const r = checkRanges(Array.from({ length: 200_000 }, () => one), { maxListed: 4 });
    expect([r.duplicateCount, r.duplicates.length]).toEqual([1, 1]);
    expect(r.duplicates[0]).toEqual({ indices: [0, 1, 2, 3], count: 200_000 });
    expect([r.overlapCount, r.holeCount]).toEqual([0, 0]);
    expect(r.partition).toBe(false); // copies are not a partition (each value lies in 200,000 ranges)
  });

  it('checkRanges caps empty and outside ranges in input order and counts them all', () => {
    // [3,3) holds no value (ISO 80000-2 2-7.7); 50-59 lies outside the domain 0..20.
    const empty = makeRange(3, 3, true, false);
    const rs = [discreteRange(50, 59), empty, discreteRange(0, 20), empty, discreteRange(40, 44), empty, discreteRange(30, 31)];
    const r = checkRanges(rs, { maxListed: 2, domain: parseDomain('0..20')! });
    expect([r.emptyCount, r.empty]).toEqual([3, [1, 3]]);
    expect([r.outsideCount, r.outside]).toEqual([3, [0, 4]]);
    expect(r.partition).toBe(false);
  });

  it('checkRanges with maxListed 0 lists nothing and keeps the verdicts of the uncapped check', () => {
    const rs = [discreteRange(0, 4), discreteRange(6, 9), discreteRange(6, 9)];
    const r = checkRanges(rs, { maxListed: 0, maxPairs: 0 });
    expect([r.holes, r.duplicates, r.empty, r.outside, r.overlaps]).toEqual([[], [], [], [], []]);
    expect([r.holeCount, r.duplicateCount]).toEqual([1, 1]); // the hole 5-5; 6-9 twice
    expect([r.covers, r.partition]).toEqual([false, false]);
  });

  it('the capped lists are the first maxListed items of the uncapped lists, with the same counts (property, differential)', () => {
    const range: fc.Arbitrary<Range> = fc.tuple(fc.integer({ min: -5, max: 30 }), fc.integer({ min: 0, max: 4 }), fc.boolean(), fc.boolean())
      .map(([lo, len, lc, hc]) => makeRange(lo, lo + len, lc, hc));
    fc.assert(fc.property(fc.array(range, { maxLength: 60 }), fc.nat({ max: 6 }), fc.boolean(), (rs, max, withDomain) => {
      const domain = withDomain ? { domain: parseDomain('0..20')! } : {};
      const all = checkRanges(rs, domain);
      const some = checkRanges(rs, { ...domain, maxListed: max });
      expect([some.holeCount, some.duplicateCount, some.emptyCount, some.outsideCount]).toEqual([all.holes.length, all.duplicates.length, all.empty.length, all.outside.length]);
      expect([all.holeCount, all.duplicateCount, all.emptyCount, all.outsideCount]).toEqual([all.holes.length, all.duplicates.length, all.empty.length, all.outside.length]);
      expect(some.holes).toEqual(all.holes.slice(0, max));
      expect(some.empty).toEqual(all.empty.slice(0, max));
      expect(some.outside).toEqual(all.outside.slice(0, max));
      expect(some.duplicates).toEqual(all.duplicates.slice(0, max).map((d) => ({ indices: d.indices.slice(0, max), count: d.indices.length })));
      expect(all.duplicates.every((d) => d.count === d.indices.length)).toBe(true);
      expect([some.covers, some.partition, some.overlapCount]).toEqual([all.covers, all.partition, all.overlapCount]);
    }), { numRuns: RUNS });
  });
});
