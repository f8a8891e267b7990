// rebin over a plain file on several threads: the file's body is cut into byte ranges (src/parallel), each
// range is scanned by the range task with the formats inferred from the file's first rows, and the
// partials are merged in file order. Only what merges exactly goes parallel; everything else — standard
// input, gzip, NDJSON, the reference engine, small files, apportioned source periods — is read on one
// thread, and so is the whole file again when a range met an error, so that the error names its true line.
import { defaultBytesPerRange, lineBases, mergeSummaries, planRanges, runRanges, siblingModule, startRangeWorkers } from '../parallel/index.js';
import type { RangeOutcome, RangeWorkers } from '../parallel/index.js';
import { openTable } from '../table/index.js';
import type { TableOptions, TableReader } from '../table/types.js';
import type { RebinPartial } from './merge.js';
import { mergePartials } from './merge.js';
import { rebinRange, type RebinRangeOptions } from './range-task.js';
import { finishRebin, freshSetup, prepareRebin, rebin, sampleFormats } from './rebin.js';
import type { PreparedRebin } from './rebin.js';
import type { ReadFormats } from './setup.js';
import type { RebinOptions, RebinResult } from './types.js';

/** How a rebin of a file may use threads. */
export interface RebinThreads {
  /** Threads in all, the main thread included; 1 reads on one thread. */
  threads: number;
  /** Bytes per range; default about two ranges a thread (RANGES_PER_THREAD in src/parallel/plan.ts), at least 8 MiB each. */
  bytesPerRange?: number;
  /** Smallest file read on several threads; default 32 MiB (smaller files are done before threads start). */
  minBytes?: number;
  /** Told how the read went: the ranges planned, the ranges read again from a mended start, the threads. */
  onPlan?: (plan: RebinPlan) => void;
}

/** How a rebinFile read went. */
export interface RebinPlan {
  /** Threads used (1 when read on one thread). */
  threads: number;
  ranges: number;
  /** Ranges whose planned start fell inside a record (a quoted line break) and were read again. */
  mended: number;
  /** Why the file was read on one thread, or null. */
  serial: 'not-eligible' | 'one-range' | 'range-error' | null;
}

/** The smallest file a rebin reads on several threads by default. */
export const PARALLEL_MIN_BYTES = 32 << 20;

/**
 * Bytes per read in a range: the reader's 1 MiB default. (A quarter of it held fewer spent read buffers
 * per thread before the reader reused its buffers; now it only adds reads and joins.)
 */
const RANGE_CHUNK = 1 << 20;

/** Examples a table reader keeps when not told otherwise (src/table: maxExamples default 5). */
const READER_EXAMPLES = 5;

/**
 * Rebins `file` (opened with `table`) like `rebin(openTable(file, table), options)`, with the same result,
 * on up to `threads.threads` threads when the file is a plain CSV/TSV file of at least `minBytes` read
 * by the fast engine and the options merge exactly (not `--assign apportion`, whose day shares are
 * fractions). Sums are merged as compensated sums and agree to the last digit printed.
 */
export async function rebinFile(file: string, options: RebinOptions, table: TableOptions, threads: RebinThreads): Promise<RebinResult> {
  const reader = await openTable(file, table);
  let formats: ReadFormats;
  let p: PreparedRebin;
  let workers: RangeWorkers | null = null;
  const moduleUrl = siblingModule(import.meta.url, 'range-task');
  try {
    try {
      if (!parallelFits(reader, options, table, threads)) {
        threads.onPlan?.({ threads: 1, ranges: 1, mended: 0, serial: 'not-eligible' });
        return await rebin(reader, options);
      }
      // The workers start now, so that their start-up overlaps the sampling and the planning below.
      workers = startRangeWorkers(moduleUrl, 'rebinRange', threads.threads - 1);
      p = prepareRebin(reader, options);
      formats = await sampleFormats(reader, options, p);
    } finally {
      reader.close();
    }
    const size = reader.totalBytes!;
    const per = threads.bytesPerRange ?? defaultBytesPerRange(size, threads.threads);
    const ranges = await planRanges(file, size, per, { ...(table.cwd !== undefined ? { cwd: table.cwd } : {}), bodyStart: reader.bodyStart });
    if (ranges.length < 2) {
      workers.stop();
      threads.onPlan?.({ threads: 1, ranges: 1, mended: 0, serial: 'one-range' });
      return await oneThread(file, options, table);
    }
    const task: RebinRangeOptions = {
      options, formats, ...(table.cwd !== undefined ? { cwd: table.cwd } : {}), ...(table.delimiter !== undefined ? { delimiter: table.delimiter } : {}),
      chunkSize: table.chunkSize ?? RANGE_CHUNK,
    };
    const outcomes = await runRanges<RebinRangeOptions, RebinPartial>({
      moduleUrl, exportName: 'rebinRange', task: rebinRange, workers, file, options: task, ranges, threads: threads.threads,
      ...(table.onProgress !== undefined ? { onProgress: (b: number) => table.onProgress!(b, size) } : {}),
    });
    // A range that met an error: read the whole file on one thread, so the error is the one a whole read meets.
    const mended = outcomes.filter((o, k) => o.range.start !== ranges[k]!.start).length;
    const error = outcomes.some((o) => o.partial.error !== null);
    threads.onPlan?.({ threads: Math.min(threads.threads, ranges.length), ranges: ranges.length, mended, serial: error ? 'range-error' : null });
    if (error) return await oneThread(file, options, table);
    return merged(reader, options, p, formats, outcomes);
  } finally {
    workers?.stop();
  }
}

function merged(reader: TableReader, options: RebinOptions, p: PreparedRebin, formats: ReadFormats,
  outcomes: ReadonlyArray<RangeOutcome<RebinPartial>>): RebinResult {
  const bases = lineBases(outcomes);
  const read = mergeSummaries(outcomes, bases, READER_EXAMPLES);
  const setup = freshSetup(reader.file, options, p, formats);
  const counts = mergePartials(outcomes.map((o) => o.partial), bases, setup);
  return finishRebin(read, options, p, setup, counts);
}

async function oneThread(file: string, options: RebinOptions, table: TableOptions): Promise<RebinResult> {
  const reader = await openTable(file, table);
  try {
    return await rebin(reader, options);
  } finally {
    reader.close();
  }
}

/** True when the read may be split into byte ranges and its result merged exactly. */
function parallelFits(reader: TableReader, options: RebinOptions, table: TableOptions, t: RebinThreads): boolean {
  if (t.threads < 2 || !reader.splittable || table.byteRange !== undefined || options.assign === 'apportion') return false;
  return reader.totalBytes !== undefined && reader.totalBytes >= (t.minBytes ?? PARALLEL_MIN_BYTES);
}

