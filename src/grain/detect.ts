// detectGrain: one streaming pass over a table, finding the true resolution, format, zone and cadence of
// every date-like column (or of the columns named).
//
// Speed: values are read as bytes (TableReader.byteBatches) and a string is made only for the values kept
// as text. Before the pass, a short look at the head of a file that can be read twice settles which columns
// are not date-like, so the pass does not carry them.
import { QuernError } from '../errors.js';
import { openTable } from '../table/open.js';
import type { TableOptions, TableReader } from '../table/types.js';
import { analyseColumn } from './analyse.js';
import { GrainColumn, type GrainColumnOptions } from './column.js';
import { givenZone } from './zone-resolve.js';
import type { GrainReport } from './types.js';

export interface GrainOptions {
  /** Columns to look at; default every column (those that are not date-like are listed as skipped). */
  columns?: readonly string[];
  /** Read instants in this zone instead of inferring one (IANA name, 'UTC' or an offset such as +05:30). */
  zone?: string;
  /** Numeric day-month dates are day first (05/04/2021 = 5 April). */
  dayFirst?: boolean;
  /** Numeric day-month dates are month first (05/04/2021 = May 4). */
  monthFirst?: boolean;
  /** Options of the table reader (delimiter, format, stdin). */
  table?: TableOptions;
}

/** Rows of the head looked at to set aside columns that are not date-like. */
export const HEAD_ROWS = 65_536;

/** Checks options before any reading: both day orders at once is misuse; an unknown zone throws 'E_ZONE'. */
export function checkGrainOptions(options: GrainOptions): string | undefined {
  if (options.dayFirst && options.monthFirst) {
    throw new QuernError('E_USAGE', 'a column cannot be both day-first and month-first', 'give --day-first or --month-first, not both');
  }
  return options.zone === undefined ? undefined : givenZone(options.zone);
}

function dayOrderOf(options: GrainOptions): GrainColumnOptions {
  return { dayFirst: options.dayFirst === true, monthFirst: options.monthFirst === true };
}

function namesOf(reader: TableReader, options: GrainOptions): string[] {
  const names = options.columns ? [...options.columns] : [...reader.header];
  for (const n of names) reader.columnIndex(n);
  return names;
}

/**
 * The columns whose head sample the start of the file holds, by name, each decided exactly as the full pass
 * would decide it (the same head sample): a column found not date-like is left out of the pass, which changes
 * no result, and the others need not infer their format again. Reads at most HEAD_ROWS rows; standard input,
 * which cannot be read twice, gives none.
 */
async function lookAhead(file: string, names: readonly string[], options: GrainOptions): Promise<Map<string, GrainColumn>> {
  const found = new Map<string, GrainColumn>();
  if (file === '-' || names.length === 0) return found;
  const reader = await openTable(file, options.table);
  const cols = names.map((n) => new GrainColumn(n, dayOrderOf(options)));
  let rows = 0;
  try {
    for await (const b of reader.byteBatches(names)) {
      for (let c = 0; c < cols.length; c++) cols[c]!.pushBatch(b, c);
      rows += b.length;
      if (rows >= HEAD_ROWS || cols.every((c) => c.decided)) break;
    }
  } finally {
    reader.close();
  }
  for (const col of cols) if (col.decided) found.set(col.name, col);
  return found;
}

function reportOf(file: string, reader: TableReader, cols: readonly GrainColumn[], zone: string | undefined): GrainReport {
  const summary = reader.summary();
  const report: GrainReport = { file, rows: summary.rowsRead, rejectedRows: summary.rowsRejected, rejectedExamples: summary.examples, columns: [], skipped: [] };
  for (const col of cols) {
    col.finish();
    const found = analyseColumn(col, zone === undefined ? {} : { zone });
    if (found) report.columns.push(found);
    else report.skipped.push({ name: col.name, reason: col.inference?.reason ?? 'no values' });
  }
  return report;
}

/**
 * Reads `file` once and reports, for each date-like column, its format and value counts, grain (unit, step,
 * anchor), zone, level, coverage under the tolerance rule, cadence, and first and last values.
 * Memory grows with distinct values up to a cap per column, never with rows.
 */
export async function detectGrain(file: string, options: GrainOptions = {}): Promise<GrainReport> {
  const zone = checkGrainOptions(options);
  const reader = await openTable(file, options.table);
  let names: string[];
  let head: Map<string, GrainColumn>;
  try {
    names = namesOf(reader, options);
    head = await lookAhead(file, names, options);
  } catch (e) {
    reader.close();
    throw e;
  }
  const aside = new Map([...head].filter(([, c]) => c.notTime));
  const read = names.filter((n) => !aside.has(n));
  const cols = read.map((n) => new GrainColumn(n, dayOrderOf(options), head.get(n)?.inference ?? null));
  // Each batch is read to its end before the next is asked for, and no column keeps it (values are
  // taken as numbers or strings): the reader may reuse its buffers.
  for await (const b of reader.byteBatches(read, [], { transient: true })) {
    for (let c = 0; c < cols.length; c++) cols[c]!.pushBatch(b, c);
  }
  const byName = new Map(cols.map((c) => [c.name, c]));
  return reportOf(file, reader, names.map((n) => aside.get(n) ?? byName.get(n)!), zone);
}

/**
 * detectGrain through the string batches (`TableReader.batches`), one string per value: the path grain took
 * before the byte path, kept as the oracle the byte path is tested against.
 */
export async function detectGrainFromStrings(file: string, options: GrainOptions = {}): Promise<GrainReport> {
  const zone = checkGrainOptions(options);
  const reader = await openTable(file, options.table);
  const names = namesOf(reader, options);
  const cols = names.map((n) => new GrainColumn(n, dayOrderOf(options)));
  for await (const batch of reader.batches(names)) {
    for (let c = 0; c < cols.length; c++) {
      const col = cols[c]!;
      if (col.notTime) continue;
      const values = batch.values[c]!;
      for (let i = 0; i < batch.length; i++) col.push(values[i]!, batch.lines[i]!);
    }
  }
  return reportOf(file, reader, cols, zone);
}
