// Where the fast CSV path puts the fields of each record it accepts: strings of the requested columns
// (`batches`), or their byte offsets (`byteBatches`). The scanner and the row accounting stay the same.
import type { CsvScanner } from './csv-scan.js';
import { asciiString } from './ascii.js';
import { BatchBuilder } from './batch.js';
import type { ColumnBatch } from './types.js';

/** Receives the accepted records of the fast path, buffer by buffer, and hands out batches. */
export interface RowSink<B> {
  /** Called before the records of a new buffer; `ascii` says every byte of its records is ASCII. */
  begin(buf: Buffer, ascii: boolean): void;
  /** Takes the requested fields of the record the scanner just found, which starts on `line`. */
  row(buf: Buffer, ascii: boolean, scanner: CsvScanner, line: number): void;
  /** Full batches ready to hand over; with `flush`, the partly filled one too. */
  take(flush: boolean): B[];
  /**
   * Called once the batches taken so far are handed over: with `reuse`, the consumer holds none of them
   * any more and their arrays may be filled again; without, they are the consumer's to keep.
   */
  handedOver?(reuse: boolean): void;
  /** The fields whose bounds `row` reads from the scanner (the others may be left stale). */
  readonly fields: readonly number[];
}

/** Node's own UTF-8 decoder behind Buffer#toString, called directly to skip its argument checks. */
interface DirectSlices {
  utf8Slice(start: number, end: number): string;
}

/** The string of field k of the scanner's record: decoded as UTF-8, doubled quotes undone. */
export function fieldString(buf: Buffer, ascii: boolean, scanner: CsvScanner, k: number): string {
  const s = scanner.starts[k]!;
  const e = scanner.ends[k]!;
  const v = ascii ? asciiString(buf, s, e) : s === e ? '' : (buf as unknown as DirectSlices).utf8Slice(s, e);
  return scanner.escaped[k] === 1 ? v.replaceAll('""', '"') : v;
}

/** Writes the strings of `columns` of the scanner's record into row `n` of `out`. */
export function decodeStrings(buf: Buffer, ascii: boolean, scanner: CsvScanner, columns: readonly number[], out: string[][], n: number): void {
  for (let c = 0; c < columns.length; c++) out[c]![n] = fieldString(buf, ascii, scanner, columns[c]!);
}

/** The sink behind `batches`: one string per requested field. */
export class StringSink implements RowSink<ColumnBatch> {
  private readonly builder: BatchBuilder;

  readonly fields: readonly number[];

  constructor(
    private readonly columns: readonly number[],
    batchSize: number,
  ) {
    this.builder = new BatchBuilder(columns.length, batchSize);
    this.fields = columns;
  }

  begin(): void {}

  row(buf: Buffer, ascii: boolean, scanner: CsvScanner, line: number): void {
    const b = this.builder;
    decodeStrings(buf, ascii, scanner, this.columns, b.columns, b.length);
    b.commit(line);
  }

  take(flush: boolean): ColumnBatch[] {
    return this.builder.take(flush);
  }
}
