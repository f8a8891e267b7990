// The range task of a parallel `bucket --summary`: counts the records that start in one byte range of a
// plain file (openTable with byteRange), with the number format and bucket set the main thread decided
// from the file's first rows. Runs in a worker thread or in the main thread (src/parallel).
import type { ByteRange, RangeHooks, RangeOutcome } from '../parallel/types.js';
import { openRange, type RangeReadOptions } from '../parallel/open-range.js';
import type { NumberFormat } from '../numbers/index.js';
import { assignBytes } from './byte-pass.js';
import type { TallyPartial } from './tally.js';
import type { BucketSet } from './types.js';

/** What every range task of one parallel bucket run is handed (structured-clonable). */
export interface BucketRangeOptions extends RangeReadOptions {
  value: string;
  format: NumberFormat;
  set: BucketSet;
  maxExamples: number;
}

/** Counts the value column of the records of `file` that start in `range` (lines relative to the range). */
export async function bucketRange(file: string, o: BucketRangeOptions, range: ByteRange, hooks: RangeHooks): Promise<RangeOutcome<TallyPartial>> {
  const reader = await openRange(file, range, o, hooks);
  try {
    const r = await assignBytes(reader, { value: o.value, given: o.format, makeSet: () => o.set, maxExamples: o.maxExamples });
    const summary = reader.summary();
    return { range, stop: summary.stop, breaks: summary.breaks, summary, partial: r.tally.partial() };
  } finally {
    reader.close();
  }
}
