// Plain data types of table input: batches of columns, never one object per row.
import type { Diagnostic } from '../errors.js';
import type { KernelTally } from './structurals.js';

export type TableFormat = 'csv' | 'tsv' | 'ndjson';

/** Which CSV tokenizer reads the rows: the byte-level fast path, or csv-parse as the reference. */
export type TableEngine = 'fast' | 'reference';

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
  /** CSV/TSV tokenizer; default 'fast'. 'reference' reads through csv-parse (slower, independent). */
  engine?: TableEngine;
  /** Called as input is read: bytes read from the file (compressed bytes for gzip) and the file size
   *  when known (undefined for standard input). */
  onProgress?: (bytesRead: number, totalBytes: number | undefined) => void;
  /** Folder against which a relative file name is resolved; default the process's working folder. */
  cwd?: string;
  /** Bytes per read from the file; default 1 MiB. */
  chunkSize?: number;
  /**
   * Whether the fast engine may find a comma-separated file's delimiters with its WebAssembly SIMD
   * kernel; default true. false keeps to the JavaScript loop (the two give identical results; tests
   * and benchmarks compare them).
   */
  simd?: boolean;
  /**
   * Reads only the records that start in [start, end) of a plain CSV/TSV file (fast engine; QuernError
   * 'E_USAGE' for standard input, gzip, NDJSON or the reference engine). The header is still read from
   * the file's start. `start` 0 is the body right after the header, with the file's line numbers; a
   * `start` > 0 must be a record start just after a line break, at or past `bodyStart`, and line
   * numbers then count from it (its line is line 1). A record starting before `end` is read to its end.
   * `summary().stop` is where the next record starts; `summary().breaks` the line breaks read.
   */
  byteRange?: { start: number; end: number };
}

/** A batch of rows restricted to the requested columns. values[c][i] is row i of requested column c. */
export interface ColumnBatch {
  length: number;
  /** 1-based physical line on which each row starts. */
  lines: ArrayLike<number>;
  values: string[][];
}

/**
 * A batch of rows as bytes, for hot paths that read a field without making a string of it. For row i of
 * requested byte column c the field's bytes are `buf[starts[c][i], ends[c][i])` — or, where
 * `decoded[c][i]` is 1, `side[starts[c][i], ends[c][i])`: a quoted field whose doubled quotes were
 * undone (RFC 4180 §2.7). Quotes around a field are never part of its bytes. Rows, lines and row
 * accounting are exactly those of `batches`; `byteFieldString` gives the very string `batches` gives.
 * The buffers belong to the batch: they are never overwritten, so a batch may be kept.
 */
export interface ByteBatch {
  length: number;
  /** 1-based physical line on which each row starts. */
  lines: ArrayLike<number>;
  /** The input bytes the fields point into. */
  buf: Buffer;
  /** Bytes of fields decoded out of their quoting; empty when no field needed it. */
  side: Buffer;
  /** True when every field of the batch is ASCII (then byte k of a field is its char code k). */
  ascii: boolean;
  starts: Int32Array[];
  ends: Int32Array[];
  decoded: Uint8Array[];
  /** The requested string columns, values[c][i] exactly as `batches` gives them. */
  values: string[][];
}

/** Row accounting of one read: every row is read and then either passed on or rejected. */
export interface ReadSummary {
  file: string;
  /** Data rows read (header excluded), passed on plus rejected. Blank lines are not rows. */
  rowsRead: number;
  /** Data rows passed on in batches; rowsRead === rowsPassed + rowsRejected. */
  rowsPassed: number;
  rowsRejected: number;
  /** Rejected rows counted by reason: 'ragged-row', 'undecodable-bytes', 'unterminated-quote',
   *  'bad-quote', 'bad-json', 'not-an-object'. */
  rejectedByReason: Record<string, number>;
  /** The first few rejected rows, with line and reason. */
  examples: Diagnostic[];
  /** Bytes read from the file as stored (compressed bytes for gzip). */
  bytesRead: number;
  /** Bytes after decompression (equal to bytesRead for plain files). */
  bytesDecoded: number;
  /** Completely empty physical lines (no byte between two line ends), skipped and counted here;
   *  they are not data rows. A line holding only spaces, or `""`, is a data row. */
  blankLines: number;
  /** Physical lines in the input, header and blank lines included (CRLF, LF and lone CR each end one). */
  lines: number;
  /** NDJSON only: keys absent from the header (the first object's keys), with how many rows held each.
   *  Such rows are passed on; the unknown keys' values are not read. */
  unknownKeys: Record<string, number>;
  format: TableFormat;
  delimiter: string;
  engine: TableEngine;
  /** True once `batches` has been read to the end. */
  complete: boolean;
  /** Offset in the (decoded) input just after the last record read: the next record's start. The file
   *  size after a whole read of a plain file; with `byteRange`, where the next range must begin. */
  stop: number;
  /** Line breaks read after the header (blank lines and breaks inside quoted fields included); with
   *  `byteRange`, those of the range's records. */
  breaks: number;
}

/** An open table: its header is known; its rows are read once through `batches`. */
export interface TableReader {
  readonly file: string;
  readonly header: readonly string[];
  readonly format: TableFormat;
  readonly delimiter: string;
  readonly engine: TableEngine;
  /** Size of the input file in bytes as stored; undefined for standard input. */
  readonly totalBytes: number | undefined;
  /** True when `byteRange` reads of this input are possible: a plain file (not standard input, not gzip),
   *  CSV or TSV, read by the fast engine. */
  readonly splittable: boolean;
  /** Offset in the (decoded) input just after the header's line end (a UTF-8 BOM counted): where the
   *  body begins, and the least `byteRange.start` > 0 may be. */
  readonly bodyStart: number;
  /** Physical lines up to the end of the header (blank lines before it included): the line shift of a
   *  range read starting at `bodyStart`. */
  readonly headerLines: number;
  /** Rows per batch of `batches` (every batch but the last is this full); `byteBatches` may cut
   *  batches shorter, at the end of each chunk read. */
  readonly batchSize: number;
  /** Index of a column; throws QuernError 'E_COLUMN' listing the columns and the nearest spelling. */
  columnIndex(name: string): number;
  /** Streams the named columns once, in batches. */
  batches(columns: readonly string[]): AsyncIterable<ColumnBatch>;
  /**
   * Streams the named columns once, as bytes (`byteColumns`) and as strings (`stringColumns`), in
   * batches with the same rows, lines and accounting as `batches`. Only one of `batches` and
   * `byteBatches` may be read per open table. While `read.transient` is true (the caller may set it once
   * it has let go of the first batches it kept), the caller promises to hold no batch, nor its buffer or
   * arrays, once it asks for the next one; the reader then fills its read buffers and batch arrays again
   * instead of allocating new ones (less memory, fewer page faults). While `read.tally` is set and
   * active, the fast CSV path lets it count the whole rows it can straight from the record kernel: those
   * rows are in no batch (the accounting still counts them as passed). With `read.early`, the rows of
   * the first buffer read come as soon as it is walked, in a batch of their own.
   */
  byteBatches(byteColumns: readonly string[], stringColumns?: readonly string[], read?: ByteReadOptions): AsyncIterable<ByteBatch>;
  /** Row accounting; complete once `batches` has been read to the end. */
  summary(): ReadSummary;
  /** Releases the file when the caller stops before the end of `batches`. */
  close(): void;
}

/** The consumer's side of a byte read, read afresh at every buffer (see `byteBatches`). */
export interface ByteReadOptions {
  readonly transient?: boolean;
  readonly tally?: KernelTally | null;
  /**
   * For a consumer that settles how to read on from the first rows (rebin infers its formats from 2,000,
   * then sets `tally`): the first buffer's rows are handed on before the next buffer is walked, not held
   * back until a batch is full (which let the next 1 MiB, 28,000 rows of the benchmark's file, go by
   * before the tally was there).
   */
  readonly early?: boolean;
}
