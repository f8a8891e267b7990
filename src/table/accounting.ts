// Row accounting: every data row read is either passed on or rejected with a reason; blank lines
// are counted apart. The summary always adds up: rowsRead === rowsPassed + rowsRejected.
import type { Diagnostic } from '../errors.js';
import { shortValue } from '../errors.js';
import type { ReadSummary, TableEngine, TableFormat } from './types.js';

/** Stable reasons for a rejected row. */
export type RejectReason =
  | 'ragged-row' // wrong number of fields
  | 'undecodable-bytes' // bytes that are not valid UTF-8
  | 'unterminated-quote' // a quoted field still open at the end of the input
  | 'bad-quote' // a quote inside an unquoted field, or text after a closing quote
  | 'bad-json' // an NDJSON line that is not JSON
  | 'not-an-object'; // an NDJSON line that is JSON but not an object

/** Mutable tally of one read; readers own one and callers see it through `summary()`. */
export class RowAccount {
  rowsRead = 0;
  rowsPassed = 0;
  rowsRejected = 0;
  blankLines = 0;
  lines = 0;
  /** Line breaks read after the header (set by the body reader at its end). */
  breaks = 0;
  /** Offset just after the last record read; -1 until the body reader sets it. */
  stop = -1;
  complete = false;
  readonly byReason: Record<string, number> = {};
  readonly examples: Diagnostic[] = [];
  readonly unknownKeys: Record<string, number> = {};

  constructor(
    readonly file: string,
    readonly maxExamples: number,
  ) {}

  /** Counts one passed row. */
  pass(): void {
    this.rowsRead++;
    this.rowsPassed++;
  }

  /** Counts `n` passed rows at once (the fast path tallies per buffer). */
  passMany(n: number): void {
    this.rowsRead += n;
    this.rowsPassed += n;
  }

  /** Counts one rejected row and keeps it as an example while fewer than `maxExamples` are kept. */
  reject(reason: RejectReason, line: number, message: string, value?: string, column?: string): void {
    this.rowsRead++;
    this.rowsRejected++;
    this.byReason[reason] = (this.byReason[reason] ?? 0) + 1;
    if (this.examples.length < this.maxExamples) {
      const d: Diagnostic = { code: reason, file: this.file, line, message };
      if (column !== undefined) d.column = column;
      if (value !== undefined) d.value = shortValue(value);
      this.examples.push(d);
    }
  }

  /** Counts a key that an NDJSON row holds but the header lacks. */
  unknownKey(key: string): void {
    this.unknownKeys[key] = (this.unknownKeys[key] ?? 0) + 1;
  }

  /** A snapshot of the tally (copies, so later reading does not change it). */
  summary(extra: {
    bytesRead: number;
    bytesDecoded: number;
    format: TableFormat;
    delimiter: string;
    engine: TableEngine;
    /** Where the next record starts when the body reader has not said (its reading so far). */
    stop: number;
  }): ReadSummary {
    return {
      file: this.file,
      rowsRead: this.rowsRead,
      rowsPassed: this.rowsPassed,
      rowsRejected: this.rowsRejected,
      rejectedByReason: { ...this.byReason },
      examples: this.examples.map((d) => ({ ...d })),
      bytesRead: extra.bytesRead,
      bytesDecoded: extra.bytesDecoded,
      blankLines: this.blankLines,
      lines: this.lines,
      unknownKeys: { ...this.unknownKeys },
      format: extra.format,
      delimiter: extra.delimiter,
      engine: extra.engine,
      complete: this.complete,
      stop: this.stop >= 0 ? this.stop : extra.stop,
      breaks: this.breaks,
    };
  }
}
