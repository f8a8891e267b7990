import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { checkRanges, discreteRange, makeRange, parseDomain, parseRangeLabel, type Range } from '../../src/ranges/index.js';

const RUNS = Number(process.env.QUERN_FUZZ_RUNS ?? 300);

// The oracle: membership written from the definition of an interval with closed/open ends, checked on
// a half-unit grid (enough for integer endpoints: any non-empty intersection holds a grid point).
function holds(r: Range, x: number): boolean {
  const aboveLow = r.low === null || (r.lowClosed ? x >= r.low : x > r.low);
  const belowHigh = r.high === null || (r.highClosed ? x <= r.high : x < r.high);
  return aboveLow && belowHigh;
}
const GRID = Array.from({ length: 41 }, (_, i) => i / 2 - 5); // -5 … 15

function allPairsOverlapping(rs: Range[]): Set<string> {
  const out = new Set<string>();
  for (let i = 0; i < rs.length; i++) for (let j = i + 1; j < rs.length; j++) {
    if (GRID.some((x) => holds(rs[i]!, x) && holds(rs[j]!, x))) out.add(`${i},${j}`);
  }
  return out;
}
const same = (a: Range, b: Range) => a.low === b.low && a.high === b.high && a.lowClosed === b.lowClosed && a.highClosed === b.highClosed;

const rangeArb = fc.tuple(fc.integer({ min: 0, max: 9 }), fc.integer({ min: 0, max: 4 }), fc.boolean(), fc.boolean())
  .map(([lo, len, lc, hc]) => makeRange(lo, lo + len, len === 0 ? true : lc, len === 0 ? true : hc));

describe('checkRanges(ranges)', () => {
  const labels = ['0-4', '5-9', '10-14', '12-19', '25-29', '30+'];
  const bands = labels.map((l) => parseRangeLabel(l)!);

  it('checkRanges finds the overlap 10-14/12-19 and the hole 20-24 (worked example, common practice)', () => {
    const r = checkRanges(bands);
    expect(r.overlaps).toEqual([{ a: 2, b: 3, relation: 'overlaps' }]);
    expect(r.overlapCount).toBe(1);
    expect(r.holes).toEqual([discreteRange(20, 24)]);
    expect(r.covers).toBe(false);
    expect(r.partition).toBe(false);
  });

  it('checkRanges with domain 0.. on a five-year partition reports covers and partition', () => {
    const five = ['0-4', '5-9', '10-14', '15+'].map((l) => parseRangeLabel(l)!);
    const r = checkRanges(five, { domain: parseDomain('0..')! });
    expect([r.covers, r.partition, r.holes.length, r.overlapCount]).toEqual([true, true, 0, 0]);
  });

  it('checkRanges with domain 0..120 reports the leading hole and a range outside the domain', () => {
    const r = checkRanges(['5-9', '10+'].map((l) => parseRangeLabel(l)!), { domain: parseDomain('0..120')! });
    expect(r.holes).toEqual([discreteRange(0, 4)]);
    expect(r.outside).toEqual([1]);
    expect(r.partition).toBe(false);
  });

  it('checkRanges groups copies as duplicates, not as n² pairs', () => {
    const many = Array.from({ length: 100_000 }, () => discreteRange(0, 4));
    const r = checkRanges([...many, discreteRange(3, 7)]);
    expect(r.duplicates).toHaveLength(1);
    expect(r.duplicates[0]!.indices).toHaveLength(100_000);
    expect(r.overlapCount).toBe(1);
    expect(r.partition).toBe(false);
  });

  it('checkRanges lists empty ranges apart and never sorts the caller\'s array', () => {
    const input = Object.freeze([makeRange(5, 9, true, false), makeRange(3, 3, true, false), makeRange(0, 5, true, false)]);
    const r = checkRanges(input);
    expect(r.empty).toEqual([1]);
    expect(r.ranges).toBe(2);
    expect(r.covers).toBe(true);
  });

  it('checkRanges caps the listed pairs but counts them all', () => {
    const nested = Array.from({ length: 50 }, (_, i) => makeRange(i, 100 - i, true, false));
    const r = checkRanges(nested, { maxPairs: 10 });
    expect(r.overlaps).toHaveLength(10);
    expect(r.overlapCount).toBe(50 * 49 / 2);
  });

  it('checkRanges finds exactly the pairs an all-pairs check finds (property, random closed/open ends)', () => {
    fc.assert(fc.property(fc.array(rangeArb, { maxLength: 25 }), (rs) => {
      const r = checkRanges(rs);
      const found = new Set<string>();
      for (const p of r.overlaps) found.add(p.a < p.b ? `${p.a},${p.b}` : `${p.b},${p.a}`);
      // Copies of one range are reported as duplicate groups: add their pairs and pairs with each copy.
      const expected = allPairsOverlapping(rs);
      for (const key of expected) {
        const [i, j] = key.split(',').map(Number) as [number, number];
        if (same(rs[i]!, rs[j]!)) continue;
        const rep = (k: number) => r.duplicates.find((g) => g.indices.includes(k))?.indices[0] ?? k;
        const [a, b] = [rep(i), rep(j)].sort((x, y) => x - y);
        expect(found.has(`${a},${b}`)).toBe(true);
      }
      const distinctPairs = [...expected].filter((k) => { const [i, j] = k.split(',').map(Number) as [number, number]; return !same(rs[i]!, rs[j]!); });
      const repsOnly = new Set(distinctPairs.map((k) => {
        const [i, j] = k.split(',').map(Number) as [number, number];
        const rep = (x: number) => r.duplicates.find((g) => g.indices.includes(x))?.indices[0] ?? x;
        const [a, b] = [rep(i), rep(j)].sort((x, y) => x - y);
        return `${a},${b}`;
      }));
      expect(r.overlapCount).toBe(repsOnly.size);
      expect(found.size).toBe(repsOnly.size);
    }), { numRuns: RUNS });
  });

  it('checkRanges holes are exactly the grid points no range holds between the lowest and highest end (property)', () => {
    fc.assert(fc.property(fc.array(rangeArb, { minLength: 1, maxLength: 12 }), (rs) => {
      const r = checkRanges(rs);
      const nonEmpty = rs.filter((x) => GRID.some((g) => holds(x, g)));
      const lo = Math.min(...nonEmpty.map((x) => x.low!));
      const hi = Math.max(...nonEmpty.map((x) => x.high!));
      for (const g of GRID) {
        if (g < lo || g > hi) continue;
        const inRange = nonEmpty.some((x) => holds(x, g));
        const inHole = r.holes.some((h) => holds(h, g));
        const inDomain = r.domain !== null && holds(r.domain, g);
        if (inDomain) expect(inHole).toBe(!inRange);
      }
      expect(r.covers).toBe(r.holes.length === 0);
    }), { numRuns: RUNS });
  });
});
