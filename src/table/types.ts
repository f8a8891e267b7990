// Plain data types of table input: batches of columns, never one object per row.
import type { Diagnostic } from '../errors.js';

export type TableFormat = 'csv' | 'tsv' | 'ndjson';

export interface TableOptions {
  /** Field delimiter; sniffed among comma, semicolon, tab and pipe when absent. */
  delimiter?: string;
  /** Input format; taken from the file name (.csv, .tsv, .ndjson/.jsonl, with optional .gz) or sniffed. */
  format?: TableFormat;
  /** Rows per batch; default 8192. */
  batchSize?: number;
  /** How many rejected-row examples to keep (all are counted); default 5. */
  maxExamples?: number;
  /** The stream to read when the file is '-'. */
  stdin?: NodeJS.ReadableStream;
}

/** A batch of rows restricted to the requested columns. values[c][i] is row i of requested column c. */
export interface ColumnBatch {
  length: number;
  /** 1-based physical line on which each row starts. */
  lines: ArrayLike<number>;
  values: string[][];
}

/** Row accounting of one read: every row is read and then either passed on or rejected. */
export interface ReadSummary {
  file: string;
  /** Data rows read (header excluded), passed on plus rejected. */
  rowsRead: number;
  rowsRejected: number;
  rejectedByReason: Record<string, number>;
  /** The first few rejected rows, with line and reason. */
  examples: Diagnostic[];
  bytesRead: number;
}

/** An open table: its header is known; its rows are read once through `batches`. */
export interface TableReader {
  readonly file: string;
  readonly header: readonly string[];
  readonly format: TableFormat;
  readonly delimiter: string;
  /** Index of a column; throws QuernError 'E_COLUMN' listing the columns and the nearest spelling. */
  columnIndex(name: string): number;
  /** Streams the named columns once, in batches. */
  batches(columns: readonly string[]): AsyncIterable<ColumnBatch>;
  /** Row accounting; complete once `batches` has been read to the end. */
  summary(): ReadSummary;
}
