// detectGrain: one streaming pass over a table, finding the true resolution, format, zone and cadence of
// every date-like column (or of the columns named).
import { QuernError } from '../errors.js';
import { openTable } from '../table/open.js';
import type { TableOptions } from '../table/types.js';
import { analyseColumn } from './analyse.js';
import { GrainColumn } from './column.js';
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

/** Checks options before any reading: both day orders at once is misuse; an unknown zone throws 'E_ZONE'. */
export function checkGrainOptions(options: GrainOptions): string | undefined {
  if (options.dayFirst && options.monthFirst) {
    throw new QuernError('E_USAGE', 'a column cannot be both day-first and month-first', 'give --day-first or --month-first, not both');
  }
  return options.zone === undefined ? undefined : givenZone(options.zone);
}

/**
 * Reads `file` once and reports, for each date-like column, its format and value counts, grain (unit, step,
 * anchor), zone, level, coverage under the tolerance rule, cadence, and first and last values.
 * Memory grows with distinct values up to a cap per column, never with rows.
 */
export async function detectGrain(file: string, options: GrainOptions = {}): Promise<GrainReport> {
  const zone = checkGrainOptions(options);
  const reader = await openTable(file, options.table);
  const names = options.columns ? [...options.columns] : [...reader.header];
  for (const n of names) reader.columnIndex(n);
  const dayOrder = { dayFirst: options.dayFirst === true, monthFirst: options.monthFirst === true };
  const cols = names.map((n) => new GrainColumn(n, dayOrder));
  for await (const batch of reader.batches(names)) {
    for (let c = 0; c < cols.length; c++) {
      const col = cols[c]!;
      if (col.notTime) continue;
      const values = batch.values[c]!;
      for (let i = 0; i < batch.length; i++) col.push(values[i]!, batch.lines[i]!);
    }
  }
  const summary = reader.summary();
  const report: GrainReport = { file, rows: summary.rowsRead, rejectedRows: summary.rowsRejected, columns: [], skipped: [] };
  for (const col of cols) {
    col.finish();
    const found = analyseColumn(col, zone === undefined ? {} : { zone });
    if (found) report.columns.push(found);
    else report.skipped.push({ name: col.name, reason: col.inference?.reason ?? 'no values' });
  }
  return report;
}
