// Fills byte batches: for each requested byte column the start and end offset of every field in the
// input buffer, so a hot path reads values straight from the bytes. A batch never spans two buffers.
import type { CsvScanner } from './csv-scan.js';
import { asciiString } from './ascii.js';
import { decodeStrings, type RowSink } from './row-sink.js';
import type { ByteBatch } from './types.js';

const QUOTE = 0x22;
const EMPTY = Buffer.alloc(0);

/** Collects the offsets of `byteColumns` (and the strings of `stringColumns`) into batches of `size` rows. */
export class ByteBatchBuilder implements RowSink<ByteBatch> {
  private length = 0;
  private buf: Buffer = EMPTY;
  private ascii = true;
  private lines!: Float64Array;
  private starts!: Int32Array[];
  private ends!: Int32Array[];
  private decoded!: Uint8Array[];
  private values!: string[][];
  private side: Buffer = EMPTY;
  private sideLength = 0;
  private readonly done: ByteBatch[] = [];
  /** The arrays of batches sealed since the last hand-over, and those free to fill again. */
  private sealed: BatchArrays[] = [];
  private readonly spare: BatchArrays[] = [];
  readonly fields: readonly number[];

  constructor(
    private readonly byteColumns: readonly number[],
    private readonly stringColumns: readonly number[],
    private readonly size: number,
  ) {
    this.fields = [...byteColumns, ...stringColumns];
    this.fresh();
  }

  private fresh(): void {
    const n = this.size;
    const a = this.spare.pop();
    if (a !== undefined) ({ lines: this.lines, starts: this.starts, ends: this.ends, decoded: this.decoded, values: this.values } = a);
    else {
      this.lines = new Float64Array(n);
      this.starts = this.byteColumns.map(() => new Int32Array(n));
      this.ends = this.byteColumns.map(() => new Int32Array(n));
      this.decoded = this.byteColumns.map(() => new Uint8Array(n));
      this.values = this.stringColumns.map(() => new Array<string>(n));
    }
    this.side = EMPTY;
    this.sideLength = 0;
    this.length = 0;
  }

  begin(buf: Buffer, ascii: boolean): void {
    this.seal();
    this.buf = buf;
    this.ascii = ascii;
  }

  row(buf: Buffer, ascii: boolean, scanner: CsvScanner, line: number): void {
    const n = this.length;
    const cols = this.byteColumns;
    const { starts, ends, escaped } = scanner;
    for (let c = 0; c < cols.length; c++) {
      const k = cols[c]!;
      if (escaped[k] === 1) {
        this.unquote(buf, starts[k]!, ends[k]!, c, n);
      } else {
        this.starts[c]![n] = starts[k]!;
        this.ends[c]![n] = ends[k]!;
        this.decoded[c]![n] = 0;
      }
    }
    if (this.stringColumns.length > 0) decodeStrings(buf, ascii, scanner, this.stringColumns, this.values, n);
    this.lines[n] = line;
    this.length = n + 1;
    if (this.length === this.size) this.seal();
  }

  /** How many byte columns it fills (the first of `fields` is the first of them). */
  get byteColumnCount(): number {
    return this.byteColumns.length;
  }

  /** True when rows may come in blocks from the record kernel (no string columns to decode). */
  get takesBlocks(): boolean {
    return this.stringColumns.length === 0;
  }

  /**
   * Takes `count` records from the record kernel's output (`stride` i32 per record from offset `o`: end,
   * field count, then start and end of each wanted field), all whole, quote-free rows on consecutive lines
   * from `line`. `wanted` lists the kernel's fields. What `row` does for each, a column at a time.
   */
  kernelRows(output: Int32Array, o: number, count: number, stride: number, wanted: Int32Array, line: number): void {
    const cols = this.byteColumns;
    while (count > 0) {
      const n = this.length;
      const m = Math.min(count, this.size - n);
      for (let c = 0; c < cols.length; c++) {
        const at = o + 2 + 2 * wanted.indexOf(cols[c]!);
        const starts = this.starts[c]!, ends = this.ends[c]!;
        for (let r = 0, q = at; r < m; r++, q += stride) {
          starts[n + r] = output[q]!;
          ends[n + r] = output[q + 1]!;
        }
        this.decoded[c]!.fill(0, n, n + m);
      }
      const lines = this.lines;
      for (let r = 0; r < m; r++) lines[n + r] = line + r;
      this.length = n + m;
      if (this.length === this.size) this.seal();
      count -= m;
      o += m * stride;
      line += m;
    }
  }

  /** Copies the field buf[s, e) with each doubled quote made single into the side buffer. */
  private unquote(buf: Buffer, s: number, e: number, c: number, n: number): void {
    if (this.sideLength + (e - s) > this.side.length) {
      const bigger = Buffer.allocUnsafe(Math.max(256, 2 * (this.sideLength + (e - s))));
      this.side.copy(bigger, 0, 0, this.sideLength);
      this.side = bigger;
    }
    const side = this.side;
    const from = this.sideLength;
    let j = from;
    for (let i = s; i < e; i++) {
      const b = buf[i]!;
      side[j++] = b;
      if (b === QUOTE) i++; // the second quote of a pair (the scanner checked they come in pairs)
    }
    this.sideLength = j;
    this.starts[c]![n] = from;
    this.ends[c]![n] = j;
    this.decoded[c]![n] = 1;
  }

  private seal(): void {
    const n = this.length;
    if (n === 0) return;
    const cut = n < this.size;
    this.sealed.push({ lines: this.lines, starts: this.starts, ends: this.ends, decoded: this.decoded, values: this.values });
    this.done.push({
      length: n,
      lines: cut ? this.lines.subarray(0, n) : this.lines,
      buf: this.buf,
      side: this.side.subarray(0, this.sideLength),
      ascii: this.ascii,
      starts: cut ? this.starts.map((a) => a.subarray(0, n)) : this.starts,
      ends: cut ? this.ends.map((a) => a.subarray(0, n)) : this.ends,
      decoded: cut ? this.decoded.map((a) => a.subarray(0, n)) : this.decoded,
      values: cut ? this.values.map((v) => v.slice(0, n)) : this.values,
    });
    this.fresh();
  }

  take(flush: boolean): ByteBatch[] {
    if (flush) this.seal();
    return this.done.splice(0, this.done.length);
  }

  /**
   * The batches taken so far are handed over: with `reuse` their arrays are filled again (saves
   * allocating them), else forgotten (a consumer that keeps batches must not see them overwritten).
   */
  handedOver(reuse: boolean): void {
    // Sealed but not yet taken batches are still to be handed over.
    const kept = this.sealed.splice(this.sealed.length - this.done.length);
    if (reuse) for (const a of this.sealed) this.spare.push(a);
    this.sealed = kept;
  }
}

/** The arrays behind one batch. */
interface BatchArrays {
  lines: Float64Array;
  starts: Int32Array[];
  ends: Int32Array[];
  decoded: Uint8Array[];
  values: string[][];
}

/** The string of row i of byte column c: exactly the string `batches` gives for that field. */
export function byteFieldString(b: ByteBatch, c: number, i: number): string {
  const buf = b.decoded[c]![i] === 1 ? b.side : b.buf;
  const s = b.starts[c]![i]!;
  const e = b.ends[c]![i]!;
  return b.ascii ? asciiString(buf, s, e) : buf.toString('utf8', s, e);
}
