// walkSeries / longestRun / InstantBuckets on generated series with known holes, checked against a
// brute-force walk written here independently (common practice: the obvious quadratic or sorted check).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { InstantBuckets, longestRun, walkSeries } from '../../src/gaps/index.js';
import { FUZZ_RUNS } from '../rebin/helpers.js';

const counts = (keys: number[]) => {
  const m = new Map<number, number>();
  for (const k of keys) m.set(k, (m.get(k) ?? 0) + 1);
  return m;
};

describe('walkSeries(first, last, counts, expected)', () => {
  it('finds the holes of 1..20 without 4, 5, 6 and 15 as two runs, and the duplicate of 9', () => {
    const keys = [1, 2, 3, 7, 8, 9, 9, 10, 11, 12, 13, 14, 16, 17, 18, 19, 20];
    const w = walkSeries(1, 20, counts(keys), () => true);
    expect(w.runs).toEqual([{ first: 4, last: 6, periods: 3, index: 3 }, { first: 15, last: 15, periods: 1, index: 14 }]);
    expect(w.duplicates).toEqual([{ key: 9, count: 2, index: 8 }]);
    expect(w).toMatchObject({ expected: 20, present: 16, unexpected: 0 });
    expect(longestRun(w.runs)).toEqual(w.runs[0]);
  });

  it('does not break a run at periods the calendar skips, and counts rows on them as unexpected', () => {
    // Keys 0..13 as days, 5 and 6 (and 12, 13) a weekend: missing 4, 7, 8 is one gap of 3 expected periods.
    const weekday = (k: number) => k % 7 !== 5 && k % 7 !== 6;
    const w = walkSeries(0, 11, counts([0, 1, 2, 3, 6, 9, 10, 11]), weekday);
    expect(w.runs).toEqual([{ first: 4, last: 8, periods: 3, index: 4 }]);
    expect(w).toMatchObject({ expected: 10, present: 7, unexpected: 1 });
  });

  it('agrees with a brute-force listing of missing keys on random series (property)', () => {
    fc.assert(fc.property(fc.array(fc.integer({ min: 0, max: 80 }), { maxLength: 120 }), fc.integer({ min: 1, max: 5 }), (keys, mod) => {
      const expected = (k: number) => k % mod !== 0 || mod === 1;
      const w = walkSeries(0, 80, counts(keys), expected);
      const have = new Set(keys);
      const missing = [];
      for (let k = 0; k <= 80; k++) if (expected(k) && !have.has(k)) missing.push(k);
      const fromRuns = w.runs.flatMap((r) => {
        const out = [];
        for (let k = r.first; k <= r.last; k++) if (expected(k)) out.push(k);
        return out;
      });
      expect(fromRuns).toEqual(missing);
      expect(w.runs.reduce((a, r) => a + r.periods, 0)).toBe(missing.length);
      expect(w.present + missing.length).toBe(w.expected);
    }), { numRuns: FUZZ_RUNS });
  });
});

describe('InstantBuckets(gapMs).gaps()', () => {
  it('finds a 9 h 15 min outage among 15-minute readings, whatever the row order', () => {
    const b = new InstantBuckets(3600_000);
    const t0 = Date.parse('2024-02-14T00:00:00Z');
    const ts: number[] = [];
    for (let i = 0; i < 96; i++) if (i < 8 || i > 44) ts.push(t0 + i * 900_000); // 02:00 … 11:00 missing
    for (const t of ts.reverse()) b.add(t);
    expect(b.gaps()).toEqual([{ after: t0 + 7 * 900_000, before: t0 + 45 * 900_000, length: 38 * 900_000 }]);
  });

  it('equals the gaps between consecutive sorted instants longer than the duration (property)', () => {
    fc.assert(fc.property(fc.array(fc.integer({ min: 0, max: 1_000_000 }), { maxLength: 200 }), fc.integer({ min: 1, max: 50_000 }), (ts, gap) => {
      const b = new InstantBuckets(gap);
      for (const t of ts) b.add(t);
      const sorted = [...new Set(ts)].sort((x, y) => x - y);
      const expected = [];
      for (let i = 1; i < sorted.length; i++) {
        if (sorted[i]! - sorted[i - 1]! > gap) expected.push({ after: sorted[i - 1]!, before: sorted[i]!, length: sorted[i]! - sorted[i - 1]! });
      }
      expect(b.gaps()).toEqual(expected);
    }), { numRuns: FUZZ_RUNS });
  });
});
