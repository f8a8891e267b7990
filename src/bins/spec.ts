// The bucket spec file: a bucket set written once (`--spec-out`) and applied the same way later (`--spec`).
import { QuernError } from '../errors.js';
import { checkRanges, formatRange, makeRange, type Range } from '../ranges/index.js';
import type { Bucket, BucketSet, BucketSpec } from './types.js';

/** The spec of a bucket set for the value column `value`. */
export function bucketSpecOf(set: BucketSet, value: string): BucketSpec {
  return {
    kind: 'quern-bucket-spec', version: 1, value, discrete: set.discrete, closed: set.closed, source: set.source,
    ranges: set.buckets.map((b) => ({
      index: b.index, label: b.label, low: b.range.low, high: b.range.high, lowClosed: b.range.lowClosed, highClosed: b.range.highClosed,
      ...(b.name !== undefined ? { name: b.name } : {}), ...(b.weight !== undefined ? { weight: b.weight } : {}),
    })),
  };
}

function bad(message: string): never {
  throw new QuernError('E_VALUE', `bucket spec: ${message}`, 'write one with quern bucket --spec-out FILE');
}

const isEnd = (x: unknown): x is number | null => x === null || (typeof x === 'number' && Number.isFinite(x));

function rangeOf(r: BucketSpec['ranges'][number], discrete: boolean, i: number): Range {
  if (!isEnd(r.low) || !isEnd(r.high)) bad(`range ${i} has a low or high that is neither a number nor null`);
  if (typeof r.lowClosed !== 'boolean' || typeof r.highClosed !== 'boolean') bad(`range ${i} needs lowClosed and highClosed`);
  const range = makeRange(r.low, r.high, r.lowClosed, r.highClosed);
  if (discrete) {
    if ((r.low !== null && !Number.isInteger(r.low)) || (r.high !== null && !Number.isInteger(r.high)) || range.highClosed || (r.low !== null && !range.lowClosed)) {
      bad(`range ${i} ("${r.label}") is marked discrete but is not half-open on whole numbers`);
    }
    range.discrete = true;
  }
  return range;
}

/** Reads and checks a spec (parsed JSON): ordered, non-overlapping ranges with labels. */
export function bucketsFromSpec(spec: unknown): BucketSet {
  const s = spec as BucketSpec;
  if (typeof s !== 'object' || s === null || s.kind !== 'quern-bucket-spec') bad('not a quern bucket spec (kind "quern-bucket-spec")');
  if (s.version !== 1) bad(`version ${String(s.version)} is not supported (this quern reads version 1)`);
  if (!Array.isArray(s.ranges) || s.ranges.length === 0) bad('no ranges');
  const discrete = s.discrete === true;
  const buckets: Bucket[] = s.ranges.map((r, i) => {
    if (r.index !== i) bad(`range ${i} has index ${String(r.index)}; indices must be 0, 1, 2, … in order`);
    const range = rangeOf(r, discrete, i);
    const b: Bucket = { index: i, label: typeof r.label === 'string' && r.label !== '' ? r.label : formatRange(range), range };
    if (typeof r.name === 'string') b.name = r.name;
    if (typeof r.weight === 'number') b.weight = r.weight;
    return b;
  });
  const check = checkRanges(buckets.map((b) => b.range));
  if (check.overlapCount > 0 || check.duplicates.length > 0 || check.empty.length > 0) bad('ranges overlap, repeat or hold nothing');
  for (let i = 1; i < buckets.length; i++) {
    const a = buckets[i - 1]!.range, b = buckets[i]!.range;
    if ((a.high ?? Infinity) > (b.low ?? -Infinity)) bad(`range ${i} ("${buckets[i]!.label}") comes before range ${i - 1}; list ranges in order`);
  }
  return { buckets, discrete, closed: s.closed === 'right' ? 'right' : 'left', source: typeof s.source === 'string' ? s.source : 'spec', merged: [], notes: [] };
}
