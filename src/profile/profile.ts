// profileTable: one streaming pass over a table giving every column's measurement level and role, and the
// table's shape.
import { openTable } from '../table/open.js';
import type { TableOptions } from '../table/types.js';
import { classifyColumn } from './classify.js';
import { ProfileColumn } from './column.js';
import { ShapeTracker } from './shape.js';
import type { ColumnProfile, ProfileReport } from './types.js';

export interface ProfileOptions {
  table?: TableOptions;
}

/** Latitude/longitude by range: an adjacent pair of fractional measures within ±90 and ±180. */
function pairCoordinates(cols: ColumnProfile[], acc: readonly ProfileColumn[]): void {
  for (let i = 0; i + 1 < cols.length; i++) {
    const a = cols[i]!;
    const b = cols[i + 1]!;
    const na = acc[i]!.numeric?.s;
    const nb = acc[i + 1]!.numeric?.s;
    if (a.role !== 'measure' || b.role !== 'measure' || !na || !nb) continue;
    if (na.maxDecimals < 3 || nb.maxDecimals < 3) continue;
    if (na.min >= -90 && na.max <= 90 && nb.min >= -180 && nb.max <= 180) {
      Object.assign(a, { role: 'latitude', spatial: true, reason: `fractional values within ±90 beside a column within ±180: a latitude` });
      Object.assign(b, { role: 'longitude', spatial: true, reason: `fractional values within ±180 beside a latitude: a longitude` });
      i++;
    }
  }
}

/**
 * Reads `file` once and profiles every column: level of measurement (Stevens 1946: categorical, ordinal,
 * quantitative), role and reason, distinct count (exact up to 10,000, then estimated), time grain for
 * date-like columns; and the table's shape (items or aggregated, with its key).
 */
export async function profileTable(file: string, options: ProfileOptions = {}): Promise<ProfileReport> {
  const reader = await openTable(file, options.table);
  const names = [...reader.header];
  const acc = names.map((n) => new ProfileColumn(n));
  const shape = new ShapeTracker();
  for await (const batch of reader.batches(names)) {
    shape.observe(batch);
    for (let c = 0; c < acc.length; c++) {
      const col = acc[c]!;
      const values = batch.values[c]!;
      for (let i = 0; i < batch.length; i++) col.push(values[i]!, batch.lines[i]!);
    }
  }
  for (const col of acc) col.finish();
  const columns = acc.map(classifyColumn);
  pairCoordinates(columns, acc);
  const summary = reader.summary();
  return { file, rows: summary.rowsRead, rejectedRows: summary.rowsRejected, shape: shape.decide(columns, summary.rowsRead - summary.rowsRejected), columns };
}
