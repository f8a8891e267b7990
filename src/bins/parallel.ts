// `bucket --summary` over a plain file on several threads: the body is cut into byte ranges (src/parallel),
// each range is counted with the number format and bucket set decided from the file's first rows, and the
// tallies are added in file order, examples shifted to file lines. Counting merges exactly; only fixed
// plans (edges, schemes, specs) on plain CSV/TSV files read by the fast engine go parallel.
import { defaultBytesPerRange, lineBases, mergeSummaries, planRanges, runRanges, siblingModule } from '../parallel/index.js';
import { openTable, type TableOptions } from '../table/index.js';
import { buildBuckets, planNeedsData } from './build.js';
import { firstSample, readingFor, sampleIntegers } from './byte-pass.js';
import { bucketRange, type BucketRangeOptions } from './range-task.js';
import { bucketTable, type BucketRunOptions, type BucketRunResult } from './run.js';
import { BucketTally, type TallyPartial } from './tally.js';

/** How a counting run may use threads. */
export interface BucketThreads {
  /** Threads in all, the main thread included; 1 reads on one thread. */
  threads: number;
  /** Bytes per range; default about two ranges a thread (RANGES_PER_THREAD in src/parallel/plan.ts), at least 8 MiB each. */
  bytesPerRange?: number;
  /** Smallest file read on several threads; default 32 MiB. */
  minBytes?: number;
}

/** The smallest file bucketFile counts on several threads by default. */
export const BUCKET_PARALLEL_MIN_BYTES = 32 << 20;
const READER_EXAMPLES = 5; // the table reader's default maxExamples (src/table)

/**
 * Counts the column `options.value` of `file` into buckets (no rows written) with the result of
 * `bucketTable(() => openTable(file, table), options)`, on up to `threads.threads` threads when the file is
 * a plain CSV/TSV file of at least `minBytes` and the plan is fixed; otherwise on one thread.
 */
export async function bucketFile(file: string, options: BucketRunOptions, table: TableOptions, threads: BucketThreads): Promise<BucketRunResult> {
  const open = () => openTable(file, table);
  const reader = await open();
  let sample: string[];
  try {
    if (!fits(reader.splittable, reader.totalBytes, options, table, threads)) return await bucketTable(open, options);
    reader.columnIndex(options.value);
    sample = await firstSample(reader, options.value);
  } finally {
    reader.close();
  }
  const size = reader.totalBytes!;
  const per = threads.bytesPerRange ?? defaultBytesPerRange(size, threads.threads);
  const ranges = await planRanges(file, size, per, { ...(table.cwd !== undefined ? { cwd: table.cwd } : {}), bodyStart: reader.bodyStart });
  if (ranges.length < 2 || sample.length === 0) return bucketTable(open, options);
  const reading = readingFor(sample, options.numberFormat);
  const integers = sampleIntegers(sample, reading.parser);
  const set = buildBuckets(options.plan, { ...options, discrete: options.discrete ?? (integers ? undefined : false) });
  const task: BucketRangeOptions = {
    value: options.value, format: reading.format, set, maxExamples: options.maxExamples ?? 5,
    ...(table.cwd !== undefined ? { cwd: table.cwd } : {}), ...(table.delimiter !== undefined ? { delimiter: table.delimiter } : {}),
    ...(table.chunkSize !== undefined ? { chunkSize: table.chunkSize } : {}),
  };
  const outcomes = await runRanges<BucketRangeOptions, TallyPartial>({
    moduleUrl: siblingModule(import.meta.url, 'range-task'), exportName: 'bucketRange', task: bucketRange, file, options: task, ranges, threads: threads.threads,
  });
  const bases = lineBases(outcomes);
  const read = mergeSummaries(outcomes, bases, table.maxExamples ?? READER_EXAMPLES);
  const tally = new BucketTally(set, options.maxExamples ?? 5);
  outcomes.forEach((o, k) => tally.absorb(o.partial, bases[k]!));
  return { summary: tally.summary(file, options.value, read.rowsRead, read.rejectedByReason, read.examples), set, numberFormat: { format: reading.format, inferred: reading.inferred }, passes: 1 };
}

function fits(splittable: boolean, size: number | undefined, options: BucketRunOptions, table: TableOptions, t: BucketThreads): boolean {
  if (t.threads < 2 || !splittable || table.byteRange !== undefined || planNeedsData(options.plan)) return false;
  return size !== undefined && size >= (t.minBytes ?? BUCKET_PARALLEL_MIN_BYTES);
}

