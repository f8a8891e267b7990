// fast-check properties of the range parser and the overlap sweep (src/ranges): no exception escapes on
// any label; a formatted range parses back to itself; the sweep's overlap count and duplicate groups equal
// an all-pairs check written here from the definition of interval intersection (ISO 80000-2 2-7.7 notation).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { checkRanges, formatRange, makeRange, discreteRange, parseDomain, parseRangeLabel, rangeEquals, type Range } from '../../src/ranges/index.js';
import { caseCounter, fuzzRuns } from './runs.js';

const count = caseCounter('ranges');
const labelish = fc.oneof(
  fc.string({ maxLength: 24 }),
  fc.array(fc.constantFrom('0', '1', '5', '9', '-', '+', '.', ',', '[', ']', '(', ')', '<', '>', '=', ' ', 'e', 'inf', 'to', 'and over', 'under', '/', 'P', 'T'), { maxLength: 12 }).map((c) => c.join('')),
);

describe('parseRangeLabel on any text', () => {
  it('never throws, and a range it reads is not reversed', () => {
    fc.assert(fc.property(labelish, fc.constantFrom('auto', 'discrete', 'closed', 'half-open', 'open-closed') as fc.Arbitrary<'auto'>, (text, ends) => {
      count('any label');
      const r = parseRangeLabel(text, { ends });
      if (r !== null && r.low !== null && r.high !== null) expect(r.low).toBeLessThanOrEqual(r.high);
      parseDomain(text);
    }), { numRuns: fuzzRuns(2000) });
  });

  it('formatRange(r) parses back to r, for discrete and continuous ranges, bounded or not', () => {
    const end = fc.option(fc.integer({ min: -1000, max: 1000 }), { nil: null });
    const continuous = fc.tuple(fc.option(fc.double({ min: -1e6, max: 1e6, noNaN: true }), { nil: null }), fc.option(fc.double({ min: -1e6, max: 1e6, noNaN: true }), { nil: null }), fc.boolean(), fc.boolean())
      .filter(([a, b]) => a === null || b === null || a < b)
      .map(([a, b, lc, hc]) => makeRange(a, b, a !== null && lc, b !== null && hc));
    const discrete = fc.tuple(end, end).filter(([a, b]) => a === null || b === null || a <= b).map(([a, b]) => discreteRange(a, b));
    fc.assert(fc.property(fc.oneof(continuous, discrete), (r) => {
      count('label round trip');
      const label = formatRange(r);
      const back = parseRangeLabel(label, { ends: r.discrete ? 'discrete' : 'auto' });
      expect(back, label).not.toBeNull();
      expect(rangeEquals(back!, r), `${label} → ${JSON.stringify(back)} vs ${JSON.stringify(r)}`).toBe(true);
    }), { numRuns: fuzzRuns(2000) });
  });
});

/** Non-empty intersection of two bounded continuous ranges, from the definition. */
function intersect(a: Range, b: Range): boolean {
  const lo = Math.max(a.low!, b.low!);
  const hi = Math.min(a.high!, b.high!);
  if (lo < hi) return true;
  if (lo > hi) return false;
  const loClosed = (a.low! < lo || a.lowClosed) && (b.low! < lo || b.lowClosed);
  const hiClosed = (a.high! > hi || a.highClosed) && (b.high! > hi || b.highClosed);
  return loClosed && hiClosed;
}
const holdsNothing = (r: Range) => r.low! > r.high! || (r.low === r.high && !(r.lowClosed && r.highClosed));
const key = (r: Range) => `${r.low}|${r.high}|${r.lowClosed}|${r.highClosed}`;

describe('checkRanges against all pairs', () => {
  const small = fc.tuple(fc.integer({ min: 0, max: 12 }), fc.integer({ min: 0, max: 6 }), fc.boolean(), fc.boolean())
    .map(([low, len, lc, hc]) => makeRange(low, low + len, lc, hc));

  it('counts the same overlapping pairs among distinct ranges as the all-pairs check', () => {
    fc.assert(fc.property(fc.uniqueArray(small, { selector: key, maxLength: 14 }), (ranges) => {
      count('overlaps = all pairs');
      const live = ranges.filter((r) => !holdsNothing(r));
      let pairs = 0;
      for (let i = 0; i < live.length; i++) for (let j = i + 1; j < live.length; j++) if (intersect(live[i]!, live[j]!)) pairs++;
      const c = checkRanges(Object.freeze(ranges.map((r) => Object.freeze({ ...r }))));
      expect(c.overlapCount, JSON.stringify(ranges)).toBe(pairs);
      expect(c.duplicates).toEqual([]);
      expect(c.empty.length).toBe(ranges.length - live.length);
    }), { numRuns: fuzzRuns(2000) });
  });

  it('groups copies of one range as duplicates, each index once, in input order', () => {
    fc.assert(fc.property(fc.array(small, { maxLength: 20 }), (ranges) => {
      count('duplicates');
      const c = checkRanges(ranges);
      const groups = new Map<string, number[]>();
      ranges.forEach((r, i) => { if (!holdsNothing(r)) groups.set(key(r), [...(groups.get(key(r)) ?? []), i]); });
      const want = [...groups.values()].filter((g) => g.length > 1).map((g) => g.join(',')).sort();
      expect(c.duplicates.map((d) => d.indices.join(',')).sort()).toEqual(want);
    }), { numRuns: fuzzRuns(2000) });
  });
});
