// Named age schemes with their published sources. Ages are completed years (integers): the schemes are
// discrete, so 0-4 holds ages 0 to 4 and is stored as [0, 5).
import type { Bucket, BucketScheme } from './types.js';
import { discreteRange, formatRange } from '../ranges/index.js';

function groups(bounds: ReadonlyArray<readonly [number, number | null, string?]>, weights?: readonly number[], names?: readonly string[]): Bucket[] {
  return bounds.map(([first, last, label], index) => {
    const range = discreteRange(first, last);
    const b: Bucket = { index, label: label ?? formatRange(range), range };
    if (weights !== undefined) b.weight = weights[index]!;
    if (names !== undefined) b.name = names[index]!;
    return b;
  });
}

function steps(width: number, until: number): Array<[number, number | null]> {
  const out: Array<[number, number | null]> = [];
  for (let a = 0; a < until; a += width) out.push([a, a + width - 1]);
  out.push([until, null]);
  return out;
}

// WHO World Standard population, percent per group (Ahmad et al. 2001, WHO GPE Discussion Paper 31). The
// 0-4 … 80-84 values are sourced (REFERENCES §8); the split of 85+ into 85-89 … 100+ is from memory (fits 0.635).
const WHO_PERCENT = [8.86, 8.69, 8.60, 8.47, 8.22, 7.93, 7.61, 7.15, 6.59, 6.04, 5.37, 4.55, 3.72, 2.96, 2.21, 1.52, 0.91, 0.44, 0.15, 0.04, 0.005];

// US 2000 standard population counts (Census P25-1130; SEER "stdpop.19ages").
const US2000_19 = [3794901, 15191619, 19919840, 20056779, 19819518, 18257225, 17722067, 19511370, 22179956, 22479229,
  19805793, 17224359, 13307234, 10654272, 9409940, 8725574, 7414559, 4900234, 4259173];

// NCHS 11 groups, population in thousands (Anderson & Rosenberg 1998, NVSR 47(3); REFERENCES §8).
const NCHS_11 = [3795, 15192, 39977, 38077, 37233, 44659, 37030, 23961, 18136, 12315, 4259];

const pad = (x: number) => String(x).padStart(2, '0');
const US19_BOUNDS: Array<[number, number | null, string]> = [[0, 0, '00'], [1, 4, '01-04'],
  ...Array.from({ length: 16 }, (_, i): [number, number, string] => [5 * (i + 1), 5 * (i + 1) + 4, `${pad(5 * (i + 1))}-${pad(5 * (i + 1) + 4)}`]),
  [85, null, '85+']];

/** Every named scheme, in the order `--list-schemes` prints them. */
export const BUCKET_SCHEMES: readonly BucketScheme[] = Object.freeze([
  { name: 'five-year-85', title: 'Five-year age groups, 0-4 to 80-84, then 85+', source: 'common practice (the five-year groups of standard populations, closed at 85+ as in the US 2000 standard, Census P25-1130)', buckets: groups(steps(5, 85)) },
  { name: 'ten-year', title: 'Ten-year age groups, 0-9 to 80-89, then 90+', source: 'common practice', buckets: groups(steps(10, 90)) },
  { name: 'who-world-2000', title: 'WHO World Standard Population 2000-2025, 21 groups to 100+', source: 'Ahmad O.B. et al. (2001), Age standardization of rates: a new WHO standard. GPE Discussion Paper Series No. 31, WHO', weights: 'percent of the standard population', buckets: groups(steps(5, 100), WHO_PERCENT) },
  { name: 'us-2000-19', title: 'US 2000 standard population, 19 age groups', source: 'US Census Bureau, Current Population Reports P25-1130 (1996); the NCHS and SEER year 2000 standard', weights: 'persons in the standard population', buckets: groups(US19_BOUNDS, US2000_19) },
  { name: 'us-2000-11', title: 'US 2000 standard population, the 11 groups of NCHS', source: 'Anderson R.N., Rosenberg H.M. (1998), Age standardization of death rates: implementation of the year 2000 standard. National Vital Statistics Reports 47(3)', weights: 'thousands of persons in the standard population', buckets: groups([[0, 0], [1, 4], [5, 14], [15, 24], [25, 34], [35, 44], [45, 54], [55, 64], [65, 74], [75, 84], [85, null]], NCHS_11) },
  { name: 'life-stages', title: 'Broad life stages: children, working-age adults, older adults', source: 'common practice', buckets: groups([[0, 17], [18, 64], [65, null]], undefined, ['children', 'working-age adults', 'older adults']) },
]);

/** The named scheme, or undefined. */
export function findScheme(name: string): BucketScheme | undefined {
  return BUCKET_SCHEMES.find((s) => s.name === name.trim().toLowerCase());
}
