import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { discreteRange, formatRange, makeRange, parseRangeLabel, type Range, type TimeEndpoints } from '../../src/ranges/index.js';

const RUNS = Number(process.env.QUERN_FUZZ_RUNS ?? 500);
const D = discreteRange;

describe('parseRangeLabel(text)', () => {
  // Written forms of age groups as published tables write them (common practice; the US 2000 standard
  // population writes 00, 01-04, 05-09 — Census P25-1130, REFERENCES §8).
  it.each([
    ['0-4', D(0, 4)], ['5–9', D(5, 9)], ['5 to 9', D(5, 9)], ['5 - 9', D(5, 9)], ['01-04', D(1, 4)], ['00', D(0, 0)],
    ['85+', D(85, null)], ['85 and over', D(85, null)], ['85 or older', D(85, null)], ['>=85', D(85, null)],
    ['≥85', D(85, null)], ['over 84', D(85, null)], ['<5', D(null, 4)], ['under 5', D(null, 4)], ['<=4', D(null, 4)],
    ['4 and under', D(null, 4)], ['-5 to -1', D(-5, -1)], ['−5 to −1', D(-5, -1)], ['-5--1', D(-5, -1)],
  ] as const)('parseRangeLabel(%j) is the discrete range %o', (text, expected) => {
    expect(parseRangeLabel(text)).toEqual(expected);
  });

  it.each([
    ['[5,10)', makeRange(5, 10, true, false)], ['(5,10]', makeRange(5, 10, false, true)], ['[0, 1]', makeRange(0, 1, true, true)],
    ['[85,)', makeRange(85, null, true, false)], ['(-inf,5)', makeRange(null, 5, false, false)], ['[0,∞)', makeRange(0, null, true, false)],
    ['2.5-7.5', makeRange(2.5, 7.5, true, false)], ['>=2.5', makeRange(2.5, null, true, false)], ['<0.5', makeRange(null, 0.5, false, false)],
    ['(1e-3,2e3]', makeRange(0.001, 2000, false, true)], ['[85,inf)', makeRange(85, null, true, false)],
  ] as const)('parseRangeLabel(%j) is the continuous range %o', (text, expected) => {
    expect(parseRangeLabel(text)).toEqual(expected);
  });

  it.each(['', 'abc', '9-5', '[5,2)', '5-', 'Q1', '1-2-3'])('parseRangeLabel(%j) is null', (text) => {
    expect(parseRangeLabel(text)).toBeNull();
  });

  it.each([
    ['closed', '0-4', makeRange(0, 4, true, true)], ['half-open', '0-5', makeRange(0, 5, true, false)],
    ['open-closed', '0-5', makeRange(0, 5, false, true)], ['discrete', '0-4', D(0, 4)],
  ] as const)('parseRangeLabel with ends %s reads %j as %o', (ends, text, expected) => {
    expect(parseRangeLabel(text, { ends })).toEqual(expected);
  });
});

describe('formatRange(range)', () => {
  it.each([
    [D(0, 4), '0-4'], [D(85, null), '85+'], [D(null, 4), '<5'], [D(7, 7), '7'], [D(-5, -1), '-5 to -1'],
    [makeRange(0, 5, true, false), '[0,5)'], [makeRange(85, null, true, false), '[85,inf)'], [makeRange(null, 5, false, true), '(-inf,5]'],
  ] as const)('formatRange(%o) is %j', (r, label) => {
    expect(formatRange(r)).toBe(label);
  });

  const bound = fc.option(fc.integer({ min: -1000, max: 1000 }), { nil: null });
  const discrete = fc.tuple(bound, bound).filter(([a, b]) => a === null || b === null || a <= b).map(([a, b]) => D(a, b));
  const finite = fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e12, max: 1e12 });
  const continuous = fc.tuple(fc.option(finite, { nil: null }), fc.option(finite, { nil: null }), fc.boolean(), fc.boolean())
    .filter(([a, b]) => a === null || b === null || a < b)
    .map(([a, b, lc, hc]) => makeRange(a, b, lc, hc));

  it('parseRangeLabel(formatRange(r)) equals r for discrete and continuous ranges (property)', () => {
    fc.assert(fc.property(fc.oneof(discrete, continuous), (r: Range) => {
      expect(parseRangeLabel(formatRange(r))).toEqual(r);
    }), { numRuns: RUNS });
  });
});

describe('parseRangeLabel(text, { time })', () => {
  // A toy day calendar for the injected reader: 'dN' is day N (whole), 'tN' the instant N; durations PnD.
  const DAY = 10;
  const time: TimeEndpoints = {
    read: (s) => /^d\d+$/.test(s) ? { start: Number(s.slice(1)) * DAY, end: (Number(s.slice(1)) + 1) * DAY, whole: true }
      : /^t\d+$/.test(s) ? { start: Number(s.slice(1)), end: Number(s.slice(1)), whole: false } : null,
    period: (s) => s === 'Q1' ? { start: 0, end: 90 * DAY } : null,
    addDuration: (ms, d, sign) => /^P\d+D$/.test(d) ? ms + sign * Number(d.slice(1, -1)) * DAY : null,
  };

  it.each([
    ['d1/d3', makeRange(10, 40, true, false)], // whole days inclusive (the default for dates)
    ['t5/t9', makeRange(5, 9, true, false)], // date-times half-open
    ['d1/P3D', makeRange(10, 40, true, false)], // ISO 8601 start/duration
    ['P3D/d3', makeRange(10, 40, true, false)], // ISO 8601 duration/end
    ['Q1', makeRange(0, 900, true, false)], ['d2', makeRange(20, 30, true, false)], ['d1..d3', makeRange(10, 40, true, false)],
  ] as const)('parseRangeLabel(%j) is %o', (text, expected) => {
    expect(parseRangeLabel(text, { time })).toEqual(expected);
  });

  it('parseRangeLabel with ends half-open reads d1/d3 as [d1, d3)', () => {
    expect(parseRangeLabel('d1/d3', { time, ends: 'half-open' })).toEqual(makeRange(10, 30, true, false));
  });

  it('parseRangeLabel is null for a reversed interval', () => {
    expect(parseRangeLabel('d3/d1', { time })).toBeNull();
  });
});

describe('parseRangeLabel on hostile text', () => {
  it('parseRangeLabel never throws on arbitrary text, and what it returns is never reversed (property)', () => {
    fc.assert(fc.property(fc.oneof(fc.string(), fc.stringMatching(/^[\[(]?[-+0-9., ;inf∞]{0,12}[\])]?$/)), (s) => {
      const r = parseRangeLabel(s);
      if (r !== null && r.low !== null && r.high !== null) expect(r.low).toBeLessThanOrEqual(r.high);
    }), { numRuns: RUNS });
  });

  it.each([['9-5'], ['[10,5)'], ['5--'], ['(inf,5)']])('parseRangeLabel(%j) (reversed or malformed) is null', (text) => {
    expect(parseRangeLabel(text)).toBeNull();
  });

  it('parseRangeLabel("[5,5)") is an empty range, kept (and reported by checkRanges) rather than refused', () => {
    expect(parseRangeLabel('[5,5)')).toEqual(makeRange(5, 5, true, false));
  });
});
