// The range task of a parallel rebin: the same scan as one whole read, over the records that start in one
// byte range of a plain file (Contract A: openTable with byteRange), with the formats the main thread
// inferred from the file's first rows. Runs in a worker thread or in the main thread (src/parallel).
import { isQuernError } from '../errors.js';
import type { ByteRange, RangeHooks, RangeOutcome } from '../parallel/types.js';
import { openRange, type RangeReadOptions } from '../parallel/open-range.js';
import type { RebinPartial } from './merge.js';
import { partialOf } from './merge.js';
import { prepareRebin, scanTable } from './rebin.js';
import type { ReadFormats } from './setup.js';
import type { RebinOptions } from './types.js';

/** What every range task of one parallel rebin is handed (structured-clonable). */
export interface RebinRangeOptions extends RangeReadOptions {
  options: RebinOptions;
  formats: ReadFormats;
}

/**
 * Rebins the records of `file` that start in `range` into a partial (lines relative to the range, as the
 * reader gives them). A QuernError met on the way is handed back in the partial, not thrown: a range that
 * starts inside a quoted field is read again by the pool, and its misread rows must not stop the run.
 */
export async function rebinRange(file: string, o: RebinRangeOptions, range: ByteRange, hooks: RangeHooks): Promise<RangeOutcome<RebinPartial>> {
  const reader = await openRange(file, range, o, hooks);
  try {
    let partial: RebinPartial;
    try {
      const p = prepareRebin(reader, o.options);
      const { setup, scan } = await scanTable(reader, o.options, p, o.formats);
      partial = partialOf(setup, scan.counts);
    } catch (e) {
      if (!isQuernError(e)) throw e;
      partial = failed({ code: e.code, message: e.message, ...(e.hint !== undefined ? { hint: e.hint } : {}) });
    }
    const summary = reader.summary();
    return { range, stop: summary.stop, breaks: summary.breaks, summary, partial };
  } finally {
    reader.close();
  }
}

function failed(error: RebinPartial['error']): RebinPartial {
  return {
    error, groups: [], store: { size: 0, group: new Int32Array(0), key: new Float64Array(0), count: new Float64Array(0), measures: [] },
    counts: {
      used: 0, empty: 0, outside: 0, rejected: 0, rejectedByReason: {}, examples: [],
      extremes: { minKey: Infinity, minLine: 0, minText: '', maxKey: -Infinity, maxLine: 0, maxText: '' },
      periodRows: 0, straddling: 0, firstStraddle: null, sourceUnit: null, offsets: [], leapSeconds: 0, firstLeapSecondLine: 0,
    },
    localTime: { nonexistent: 0, repeated: 0 }, measures: [],
  };
}
