// profileTable: one streaming pass over a table giving every column's measurement level and role, and the
// table's shape.
import { openTable } from '../table/open.js';
import type { TableOptions, TableReader } from '../table/types.js';
import { ProfileColumn } from './column.js';
import { finishColumns } from './columns-task.js';
import type { NumericSummary } from './numeric.js';
import { ShapeTracker } from './shape.js';
import { availableParallelism } from 'node:os';
import { SPLIT_MIN_BYTES, autoThreads, cloneableTable, runColumnsWorker, workerColumns, type ColumnsWorker } from './split.js';
import type { ColumnProfile, ProfileReport } from './types.js';

export interface ProfileOptions {
  table?: TableOptions;
  /**
   * Read the fast CSV engine's byte batches (default true): the same report as string batches, made
   * without a string per value. False reads string batches (kept for differential tests).
   */
  bytes?: boolean;
  /**
   * Threads (default 1). With 2 or more, a plain file of at least `splitMinBytes` read by the fast engine
   * has its columns split between the main thread and one worker thread: the same report, in less time
   * where a second core is free. 'auto' takes two threads for a file of at least AUTO_SPLIT_BYTES on a
   * machine with two cores or more (autoThreads), one otherwise.
   */
  threads?: number | 'auto';
  /** Smallest file whose columns are split (default 32 MiB); tests lower it. */
  splitMinBytes?: number;
}

/** Latitude/longitude by range: an adjacent pair of fractional measures within ±90 and ±180. */
function pairCoordinates(cols: ColumnProfile[], numeric: ReadonlyArray<NumericSummary | null>): void {
  for (let i = 0; i + 1 < cols.length; i++) {
    const a = cols[i]!;
    const b = cols[i + 1]!;
    const na = numeric[i];
    const nb = numeric[i + 1];
    if (a.role !== 'measure' || b.role !== 'measure' || !na || !nb) continue;
    if (na.maxDecimals < 3 || nb.maxDecimals < 3) continue;
    if (na.min >= -90 && na.max <= 90 && nb.min >= -180 && nb.max <= 180) {
      Object.assign(a, { role: 'latitude', spatial: true, reason: `fractional values within ±90 beside a column within ±180: a latitude` });
      Object.assign(b, { role: 'longitude', spatial: true, reason: `fractional values within ±180 beside a latitude: a longitude` });
      i++;
    }
  }
}

async function readStrings(reader: TableReader, acc: readonly ProfileColumn[], shape: ShapeTracker): Promise<void> {
  for await (const batch of reader.batches(acc.map((col) => col.name))) {
    shape.observe(batch);
    for (let c = 0; c < acc.length; c++) {
      const col = acc[c]!;
      const values = batch.values[c]!;
      for (let i = 0; i < batch.length; i++) col.push(values[i]!, batch.lines[i]!);
    }
  }
}

/** The byte path: ASCII batches are read from their bytes (see ProfileColumn.pushBatch). Columns without an
 *  accumulator (`null`: read by another thread) only feed the shape. `beforeSecond`, when given, is called
 *  once, when a second batch has come and before it is read (it may set accumulators to null). */
async function readBytes(reader: TableReader, acc: Array<ProfileColumn | null>, shape: ShapeTracker, beforeSecond?: () => void): Promise<void> {
  let batches = 0;
  // Batches are read to their end and not kept (values are taken as numbers or strings): transient.
  for await (const b of reader.byteBatches([...reader.header], [], { transient: true })) {
    if (++batches === 2) beforeSecond?.();
    shape.observeBytes(b);
    for (let c = 0; c < acc.length; c++) acc[c]?.pushBatch(b, c);
  }
  shape.flush();
}

/** True when the columns of this read may be split between threads. */
function splittable(file: string, reader: TableReader, options: ProfileOptions): boolean {
  const threads = options.threads === 'auto' ? autoThreads(reader.totalBytes ?? 0, availableParallelism()) : (options.threads ?? 1);
  return threads > 1 && options.bytes !== false && reader.engine === 'fast' && reader.format !== 'ndjson'
    && file !== '-' && !/\.gz$/i.test(file) && reader.header.length > 1 && (reader.totalBytes ?? 0) >= (options.splitMinBytes ?? SPLIT_MIN_BYTES);
}

/**
 * Reads `file` once and profiles every column: level of measurement (Stevens 1946: categorical, ordinal,
 * quantitative), role and reason, distinct count (exact up to 10,000, then estimated), time grain for
 * date-like columns; and the table's shape (items or aggregated, with its key).
 */
export async function profileTable(file: string, options: ProfileOptions = {}): Promise<ProfileReport> {
  const reader = await openTable(file, options.table);
  const names = [...reader.header];
  const shape = new ShapeTracker(reader.batchSize);
  let columns: ColumnProfile[];
  let numeric: Array<NumericSummary | null>;
  if (splittable(file, reader, options)) {
    ({ columns, numeric } = await readSplit(file, reader, options, shape));
  } else {
    const acc = names.map((n) => new ProfileColumn(n));
    // Byte batches only where the fast engine makes them from its own buffers (the others would encode strings).
    if (options.bytes !== false && reader.engine === 'fast' && reader.format !== 'ndjson') await readBytes(reader, acc, shape);
    else await readStrings(reader, acc, shape);
    ({ profiles: columns, numeric } = finishColumns(acc));
  }
  pairCoordinates(columns, numeric);
  const summary = reader.summary();
  return { file, rows: summary.rowsRead, rejectedRows: summary.rowsRejected, rejectedExamples: summary.examples, shape: shape.decide(columns, summary.rowsRead - summary.rowsRejected), columns };
}

/**
 * Some columns in a worker thread, the others and the shape here; put back in header order. Every column is
 * read here for the first batch, which shows which columns are date-like (the costly ones); then the worker
 * is asked for a share of the columns balanced by cost (workerColumns) and reads them from the start of the
 * file, while this thread drops them. A file of one batch is read here alone (no worker is started).
 */
async function readSplit(file: string, reader: TableReader, options: ProfileOptions, shape: ShapeTracker): Promise<{ columns: ColumnProfile[]; numeric: Array<NumericSummary | null> }> {
  const acc: Array<ProfileColumn | null> = reader.header.map((n) => new ProfileColumn(n));
  const split: { worker: ColumnsWorker | null } = { worker: null };
  const startWorker = (): void => {
    const theirs = workerColumns(acc.map((a) => a!.splitCost));
    const worker = runColumnsWorker({ file, table: cloneableTable(options.table), columns: theirs });
    worker.result.catch(() => undefined); // awaited below; this only keeps an early failure from going unhandled
    for (const k of theirs) acc[k] = null;
    split.worker = worker;
  };
  try {
    await readBytes(reader, acc, shape, startWorker);
  } catch (e) {
    split.worker?.stop();
    throw e;
  }
  const mine = finishColumns(acc.filter((a): a is ProfileColumn => a !== null));
  if (split.worker === null) return { columns: mine.profiles, numeric: mine.numeric };
  const other = await split.worker.result;
  const columns: ColumnProfile[] = [];
  const numeric: Array<NumericSummary | null> = [];
  let m = 0;
  let o = 0;
  for (let k = 0; k < acc.length; k++) {
    const fromWorker = acc[k] === null;
    columns.push(fromWorker ? other.profiles[o]! : mine.profiles[m]!);
    numeric.push(fromWorker ? other.numeric[o++]! : mine.numeric[m++]!);
  }
  return { columns, numeric };
}
