import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { ALLEN_INVERSE, allenRelation, makeRange, type AllenRelation } from '../../src/ranges/index.js';

const RUNS = Number(process.env.QUERN_FUZZ_RUNS ?? 500);

// Endpoint conditions of the 13 relations for A = [a1, a2], B = [b1, b2] with a1 < a2, b1 < b2:
// J. F. Allen, "Maintaining knowledge about temporal intervals", CACM 26(11):832–843, 1983 (REFERENCES §10).
const CONDITIONS: Record<AllenRelation, (a1: number, a2: number, b1: number, b2: number) => boolean> = {
  before: (_a1, a2, b1) => a2 < b1,
  after: (a1, _a2, _b1, b2) => b2 < a1,
  meets: (_a1, a2, b1) => a2 === b1,
  'met-by': (a1, _a2, _b1, b2) => b2 === a1,
  overlaps: (a1, a2, b1, b2) => a1 < b1 && b1 < a2 && a2 < b2,
  'overlapped-by': (a1, a2, b1, b2) => b1 < a1 && a1 < b2 && b2 < a2,
  starts: (a1, a2, b1, b2) => a1 === b1 && a2 < b2,
  'started-by': (a1, a2, b1, b2) => a1 === b1 && b2 < a2,
  during: (a1, a2, b1, b2) => b1 < a1 && a2 < b2,
  contains: (a1, a2, b1, b2) => a1 < b1 && b2 < a2,
  finishes: (a1, a2, b1, b2) => b1 < a1 && a2 === b2,
  'finished-by': (a1, a2, b1, b2) => a1 < b1 && a2 === b2,
  equals: (a1, a2, b1, b2) => a1 === b1 && a2 === b2,
};

// Half-open [a1, a2) ranges: meeting ends touch without sharing a value, as Allen's "meets".
const half = (lo: number, hi: number) => makeRange(lo, hi, true, false);

describe('allenRelation(a, b)', () => {
  // One example per relation; each row satisfies the named condition of Allen (1983), REFERENCES §10.
  it.each([
    ['before', [0, 1], [2, 3]], ['after', [2, 3], [0, 1]], ['meets', [0, 1], [1, 2]], ['met-by', [1, 2], [0, 1]],
    ['overlaps', [0, 2], [1, 3]], ['overlapped-by', [1, 3], [0, 2]], ['starts', [0, 1], [0, 2]],
    ['started-by', [0, 2], [0, 1]], ['during', [1, 2], [0, 3]], ['contains', [0, 3], [1, 2]],
    ['finishes', [1, 2], [0, 2]], ['finished-by', [0, 2], [1, 2]], ['equals', [0, 1], [0, 1]],
  ] as const)('allenRelation is %s for %j and %j', (rel, a, b) => {
    expect(CONDITIONS[rel](a[0], a[1], b[0], b[1])).toBe(true);
    expect(allenRelation(half(a[0], a[1]), half(b[0], b[1]))).toBe(rel);
  });

  it('allenRelation: exactly one of the 13 conditions holds for any pair, and it is the one returned (Allen 1983)', () => {
    const interval = fc.tuple(fc.integer({ min: 0, max: 8 }), fc.integer({ min: 1, max: 4 })).map(([s, l]) => [s, s + l] as const);
    fc.assert(fc.property(interval, interval, ([a1, a2], [b1, b2]) => {
      const holding = (Object.keys(CONDITIONS) as AllenRelation[]).filter((r) => CONDITIONS[r](a1, a2, b1, b2));
      expect(holding).toHaveLength(1);
      expect(allenRelation(half(a1, a2), half(b1, b2))).toBe(holding[0]);
    }), { numRuns: RUNS });
  });

  it('allenRelation(b, a) is the inverse of allenRelation(a, b) (Allen 1983: six pairs of inverses plus equals)', () => {
    const interval = fc.tuple(fc.integer({ min: -5, max: 5 }), fc.integer({ min: 1, max: 4 })).map(([s, l]) => half(s, s + l));
    fc.assert(fc.property(interval, interval, (a, b) => {
      expect(allenRelation(b, a)).toBe(ALLEN_INVERSE[allenRelation(a, b)]);
    }), { numRuns: RUNS });
  });

  it('allenRelation reads closed ends that share a point as overlapping, half-open ones as meeting (common practice)', () => {
    expect(allenRelation(makeRange(0, 5, true, true), makeRange(5, 10, true, true))).toBe('overlaps');
    expect(allenRelation(makeRange(0, 5, true, false), makeRange(5, 10, true, true))).toBe('meets');
    expect(allenRelation(makeRange(0, 5, true, false), makeRange(5, 10, false, true))).toBe('before');
  });

  it('allenRelation handles unbounded ends: <5 starts <10; 85+ finishes 80+', () => {
    expect(allenRelation(makeRange(null, 5, false, false), makeRange(null, 10, false, false))).toBe('starts');
    expect(allenRelation(makeRange(85, null, true, false), makeRange(80, null, true, false))).toBe('finishes');
  });

  it('allenRelation throws a RangeError on an empty range', () => {
    expect(() => allenRelation(half(5, 5), half(0, 1))).toThrow(RangeError);
  });
});
