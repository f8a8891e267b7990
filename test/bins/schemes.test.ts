import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { BUCKET_SCHEMES, findScheme, makeBucketer } from '../../src/bins/index.js';
import { checkRanges, parseDomain } from '../../src/ranges/index.js';

const RUNS = Number(process.env.QUERN_FUZZ_RUNS ?? 300);
const labelOf = (scheme: string, age: number) => {
  const s = findScheme(scheme)!;
  return s.buckets[makeBucketer(s.buckets).assign(age)]?.label;
};

describe('BUCKET_SCHEMES', () => {
  // Bucketing checks derived from the group definitions (REFERENCES §8; Census P25-1130; Ahmad et al. 2001).
  it.each([
    ['us-2000-19', 0, '00'], ['us-2000-19', 1, '01-04'], ['us-2000-19', 4, '01-04'], ['us-2000-19', 5, '05-09'],
    ['us-2000-19', 84, '80-84'], ['us-2000-19', 85, '85+'], ['us-2000-19', 100, '85+'],
    ['who-world-2000', 0, '0-4'], ['who-world-2000', 4, '0-4'], ['who-world-2000', 5, '5-9'], ['who-world-2000', 84, '80-84'],
    ['who-world-2000', 85, '85-89'], ['who-world-2000', 100, '100+'],
    ['us-2000-11', 0, '0'], ['us-2000-11', 1, '1-4'], ['us-2000-11', 4, '1-4'], ['us-2000-11', 5, '5-14'], ['us-2000-11', 84, '75-84'], ['us-2000-11', 85, '85+'], ['us-2000-11', 100, '85+'],
    ['five-year-85', 0, '0-4'], ['five-year-85', 4, '0-4'], ['five-year-85', 5, '5-9'], ['five-year-85', 84, '80-84'], ['five-year-85', 85, '85+'], ['five-year-85', 100, '85+'],
    ['ten-year', 0, '0-9'], ['ten-year', 89, '80-89'], ['ten-year', 90, '90+'],
    ['life-stages', 17, '0-17'], ['life-stages', 18, '18-64'], ['life-stages', 65, '65+'],
  ] as const)('scheme %s puts age %d in %s', (scheme, age, label) => {
    expect(labelOf(scheme, age)).toBe(label);
  });

  it('who-world-2000 has the 21 groups and percentages of WHO GPE Discussion Paper 31 (Ahmad et al. 2001; REFERENCES §8)', () => {
    const s = findScheme('who-world-2000')!;
    expect(s.buckets).toHaveLength(21);
    expect(s.buckets.map((b) => b.weight)).toEqual([8.86, 8.69, 8.60, 8.47, 8.22, 7.93, 7.61, 7.15, 6.59, 6.04, 5.37, 4.55, 3.72, 2.96, 2.21, 1.52, 0.91, 0.44, 0.15, 0.04, 0.005]);
    // "The WHO percentages add up to 100.035, not 100" (REFERENCES §8, Computed).
    expect(s.buckets.reduce((a, b) => a + b.weight!, 0)).toBeCloseTo(100.035, 6);
  });

  it('us-2000-19 has the 19 groups of Census P25-1130 summing to 274,633,642 (REFERENCES §8)', () => {
    const s = findScheme('us-2000-19')!;
    expect(s.buckets).toHaveLength(19);
    expect(s.buckets.reduce((a, b) => a + b.weight!, 0)).toBe(274_633_642);
    expect(s.buckets[0]!.weight).toBe(3_794_901); // group 00
    expect(s.buckets[18]!.weight).toBe(4_259_173); // group 85+
  });

  it('us-2000-11 has the 11 NCHS groups of Anderson & Rosenberg 1998 (REFERENCES §8)', () => {
    const s = findScheme('us-2000-11')!;
    expect(s.buckets.map((b) => b.label)).toEqual(['0', '1-4', '5-14', '15-24', '25-34', '35-44', '45-54', '55-64', '65-74', '75-84', '85+']);
    expect(s.buckets.map((b) => b.weight)).toEqual([3795, 15192, 39977, 38077, 37233, 44659, 37030, 23961, 18136, 12315, 4259]);
  });

  it('every scheme partitions the ages 0.. (no overlap, no hole, from 0 up)', () => {
    for (const s of BUCKET_SCHEMES) {
      const r = checkRanges(s.buckets.map((b) => b.range), { domain: parseDomain('0..')! });
      expect(r.partition, s.name).toBe(true);
      expect(s.buckets.map((b) => b.index)).toEqual(s.buckets.map((_, i) => i));
    }
  });

  it('every scheme puts every age in exactly one bucket (property; membership checked from the labels\' integer bounds)', () => {
    fc.assert(fc.property(fc.constantFrom(...BUCKET_SCHEMES), fc.integer({ min: 0, max: 130 }), (s, age) => {
      const holding = s.buckets.filter((b) => age >= b.range.low! && (b.range.high === null || age < b.range.high));
      expect(holding).toHaveLength(1);
      expect(makeBucketer(s.buckets).assign(age)).toBe(holding[0]!.index);
    }), { numRuns: RUNS });
  });
});
