// Profiling a subset of a table's columns on its own read of the file: the work a second thread does when
// profile splits a big plain file's columns between threads. Each column's accumulator sees every value of
// its column in file order, exactly as in one thread, so the split changes nothing in the result.
import { openTable } from '../table/open.js';
import type { TableOptions } from '../table/types.js';
import { classifyColumn } from './classify.js';
import { ProfileColumn } from './column.js';
import type { NumericSummary } from './numeric.js';
import type { ColumnProfile } from './types.js';

/** What a column thread is asked: the file, structured-clonable table options, the columns (by header index). */
export interface ColumnsJob {
  file: string;
  table: TableOptions;
  columns: number[];
}

/** A column thread's answer: per asked column, its profile and its numeric summary (for coordinate pairs). */
export interface ColumnsResult {
  profiles: ColumnProfile[];
  numeric: Array<NumericSummary | null>;
}

/** Reads the file once and profiles the asked columns (from their bytes). */
export async function profileColumns(job: ColumnsJob): Promise<ColumnsResult> {
  const reader = await openTable(job.file, job.table);
  const names = job.columns.map((k) => reader.header[k]!);
  const acc = names.map((n) => new ProfileColumn(n));
  // Batches are read to their end and not kept: transient (see profile.ts).
  for await (const b of reader.byteBatches(names, [], { transient: true })) for (let c = 0; c < acc.length; c++) acc[c]!.pushBatch(b, c);
  return finishColumns(acc);
}

/** Ends every accumulator and classifies its column. */
export function finishColumns(acc: readonly ProfileColumn[]): ColumnsResult {
  for (const col of acc) col.finish();
  return { profiles: acc.map(classifyColumn), numeric: acc.map((col) => col.numeric?.s ?? null) };
}
