import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  checkRangeColumns, checkRanges, makeRange, rangeAt, rangeColumnsOf, RangeColumnsBuilder, IntColumn, DISCRETE, LOW_CLOSED, type Range,
} from '../../src/ranges/index.js';

const RUNS = Number(process.env.QUERN_FUZZ_RUNS ?? 300);

// The oracle: whether two ranges share a value, from the definition of an interval with closed/open,
// possibly unbounded ends (common practice): the larger low end and the smaller high end bound the
// intersection, which holds a value when low < high, or low = high with both of those ends closed.
function share(a: Range, b: Range): boolean {
  const [la, lb] = [a.low ?? -Infinity, b.low ?? -Infinity];
  const [ha, hb] = [a.high ?? Infinity, b.high ?? Infinity];
  const lo = Math.max(la, lb), hi = Math.min(ha, hb);
  if (lo < hi) return true;
  if (lo > hi) return false;
  const loClosed = (la !== lo || a.lowClosed) && (lb !== lo || b.lowClosed);
  const hiClosed = (ha !== hi || a.highClosed) && (hb !== hi || b.highClosed);
  return loClosed && hiClosed && Number.isFinite(lo);
}
function holds(r: Range, x: number): boolean {
  const aboveLow = r.low === null || (r.lowClosed ? x >= r.low : x > r.low);
  const belowHigh = r.high === null || (r.highClosed ? x <= r.high : x < r.high);
  return aboveLow && belowHigh;
}
const keyOf = (r: Range) => `${r.low},${r.high},${r.lowClosed},${r.highClosed}`;

// Small integer ends (many copies, touching and nested ranges), now and then unbounded.
const endArb = fc.integer({ min: -60, max: 60 });
const rangeArb = fc.tuple(endArb, fc.integer({ min: 0, max: 6 }), fc.boolean(), fc.boolean(), fc.integer({ min: 0, max: 40 }))
  .map(([lo, len, lc, hc, u]) => makeRange(u === 0 ? null : lo, u === 1 ? null : lo + len, len === 0 ? true : lc, len === 0 ? true : hc));

describe('rangeColumnsOf(ranges) and rangeAt(columns, i)', () => {
  it('rangeAt(rangeColumnsOf(rs), i) gives back every range (property)', () => {
    fc.assert(fc.property(fc.array(rangeArb, { maxLength: 30 }), (rs) => {
      const c = rangeColumnsOf(Object.freeze(rs));
      expect(c.length).toBe(rs.length);
      rs.forEach((r, i) => expect(rangeAt(c, i)).toEqual(r));
    }), { numRuns: RUNS });
  });

  it('RangeColumnsBuilder.pushParts stores -0 as 0, unbounded ends as open, and grows past its capacity', () => {
    const b = new RangeColumnsBuilder(1);
    for (let i = 0; i < 100; i++) b.pushParts(i === 0 ? -0 : i, null, LOW_CLOSED | DISCRETE | 2);
    expect(b.length).toBe(100);
    expect(Object.is(b.low[0], 0)).toBe(true);
    expect(rangeAt(b, 0)).toEqual({ low: 0, high: null, lowClosed: true, highClosed: false, discrete: true });
    const lines = new IntColumn(1);
    for (let i = 0; i < 40; i++) lines.push(i + 2);
    expect([lines.length, lines.get(39)]).toEqual([40, 41]);
  });
});

describe('checkRangeColumns(columns, ids)', () => {
  it('checkRangeColumns on a subset of ids equals checkRanges on those ranges alone (property)', () => {
    fc.assert(fc.property(fc.array(rangeArb, { maxLength: 30 }), fc.array(fc.boolean(), { maxLength: 30 }), (rs, pick) => {
      const ids = rs.map((_, i) => i).filter((i) => pick[i] ?? false);
      const sub = ids.map((i) => rs[i]!);
      expect(checkRangeColumns(rangeColumnsOf(rs), Uint32Array.from(ids))).toEqual(checkRanges(sub));
    }), { numRuns: RUNS });
  });

  // Above 2048 ranges (4096 ends) the ends are ranked by radix passes instead of a comparison sort:
  // the same all-pairs and grid oracles must hold there, with negative, fractional and huge ends.
  it('checkRanges on thousands of ranges finds exactly the all-pairs overlaps and the grid holes (property)', () => {
    const scaled = fc.tuple(fc.array(rangeArb, { minLength: 2100, maxLength: 2400 }), fc.constantFrom(1, 0.25, 1e9, -1e-3));
    fc.assert(fc.property(scaled, ([base, scale]) => {
      const rs = base.map((r) => (scale > 0
        ? makeRange(r.low === null ? null : r.low * scale, r.high === null ? null : r.high * scale, r.lowClosed, r.highClosed)
        : makeRange(r.high === null ? null : r.high * scale, r.low === null ? null : r.low * scale, r.highClosed, r.lowClosed)));
      const c = checkRanges(rs, { maxPairs: 1e9 });
      // Distinct ranges: copies are duplicate groups, never pairs.
      const firsts = new Map<string, number>();
      rs.forEach((r, i) => { if (!firsts.has(keyOf(r))) firsts.set(keyOf(r), i); });
      const reps = [...firsts.values()].filter((i) => !c.empty.includes(i));
      let count = 0;
      for (let x = 0; x < reps.length; x++) for (let y = x + 1; y < reps.length; y++) if (share(rs[reps[x]!]!, rs[reps[y]!]!)) count++;
      expect(c.overlapCount).toBe(count);
      expect(c.overlaps).toHaveLength(count);
      for (const p of c.overlaps.slice(0, 2000)) expect(share(rs[p.a]!, rs[p.b]!)).toBe(true);
      // Every non-empty range is its distinct range's first copy or one more copy in a duplicate group.
      expect(c.duplicates.reduce((n, d) => n + d.indices.length - 1, 0)).toBe(rs.length - c.empty.length - reps.length);
      // Holes on a half-unit grid inside the domain: a point is in a hole exactly when no range holds it.
      const s = Math.abs(scale);
      for (let g = -70; g <= 70; g += 0.5) {
        const x = g * s;
        if (c.domain === null || !holds(c.domain, x)) continue;
        expect(c.holes.some((h) => holds(h, x))).toBe(!rs.some((r) => holds(r, x)));
      }
    }), { numRuns: Math.max(3, Math.round(RUNS / 30)), endOnFailure: true }); // no shrinking of thousands of ranges
  });
});
