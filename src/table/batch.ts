// Fills column batches row by row: one string array per requested column and the start line of
// each row, handed over when full.
import type { ColumnBatch } from './types.js';

/** Collects rows of `width` requested columns into batches of `size` rows. */
export class BatchBuilder {
  private lines: Float64Array;
  private values: string[][];
  /** Rows in the batch being filled. */
  length = 0;
  private readonly done: ColumnBatch[] = [];

  constructor(
    private readonly width: number,
    private readonly size: number,
  ) {
    this.lines = new Float64Array(size);
    this.values = this.freshValues();
  }

  private freshValues(): string[][] {
    const v: string[][] = [];
    for (let c = 0; c < this.width; c++) v.push(new Array<string>(this.size));
    return v;
  }

  /** Column arrays of the batch being filled; write values[c][length] before calling `commit`. */
  get columns(): string[][] {
    return this.values;
  }

  /** Ends the current row, which started on `line`. */
  commit(line: number): void {
    this.lines[this.length++] = line;
    if (this.length === this.size) this.seal();
  }

  private seal(): void {
    if (this.length === 0) return;
    const n = this.length;
    const values = this.values;
    if (n < this.size) for (const col of values) col.length = n;
    this.done.push({ length: n, lines: n < this.size ? this.lines.slice(0, n) : this.lines, values });
    this.lines = new Float64Array(this.size);
    this.values = this.freshValues();
    this.length = 0;
  }

  /** Full batches ready to hand over; with `flush`, the partly filled one too. */
  take(flush = false): ColumnBatch[] {
    if (flush) this.seal();
    return this.done.splice(0, this.done.length);
  }
}
