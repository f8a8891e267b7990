// Writing every input row with its bucket label and order index as CSV bytes, cell for cell what the
// string path writes with csvRow (src/table/write.ts): RFC 4180 quoting, OWASP neutralisation, ',' and '\n'.
import type { ByteBatch, TableReader } from '../table/index.js';
import { csvRow } from '../table/index.js';
import { CsvByteWriter, cellBytes, isFormulaLikeBytes } from './csv-bytes.js';
import type { BucketSet } from './types.js';
import { RowGather } from './row-gather.js';

/** Where `bucketTableCsv` sends the rows. */
export interface CsvRowsOutput {
  /** Receives the CSV bytes in chunks of whole rows (about 1 MiB); a chunk is valid only until the promise resolves. */
  write(chunk: Uint8Array): Promise<void>;
  /** Neutralise cells a spreadsheet would run as formulas (OWASP CSV Injection); default true. */
  neutraliseFormulas?: boolean;
  /** Name of the label column; default `VALUE_range`. */
  labelColumn?: string;
  /** Name of the order-index column; default `VALUE_range_index`. */
  indexColumn?: string;
  /** Copy whole rows with the WebAssembly loop of row-gather.wat where it is available; default true. */
  wasm?: boolean;
}

const QUOTE = 0x22, COMMA = 0x2c;
/** First bytes of a possibly formula-like cell (OWASP: = + - @ TAB CR LF), as a look-up table. */
const FORMULA_FIRST = new Uint8Array(256);
for (const ch of '=+-@\t\r\n') FORMULA_FIRST[ch.charCodeAt(0)] = 1;

/** True when a field of row i (its bytes in the batch's buffer) is formula-like. */
function formulaIn(b: ByteBatch, i: number): boolean {
  const { starts, ends, buf } = b;
  for (let c = 0; c < starts.length; c++) {
    const s = starts[c]![i]!, e = ends[c]![i]!;
    if (s < e && FORMULA_FIRST[buf[s]!] === 1 && isFormulaLikeBytes(buf, s, e)) return true;
  }
  return false;
}

/**
 * Of the rows of `b` flagged 1 (a field may be formula-like), keeps flagged those with a formula-like field
 * (formulaIn) and clears the others; returns the flags, or null when no row stays flagged.
 */
function keepFormulaRows(b: ByteBatch, flags: Uint8Array): Uint8Array | null {
  let any = 0;
  for (let i = 0; i < b.length; i++) if (flags[i] === 1) { if (formulaIn(b, i)) any = 1; else flags[i] = 0; }
  return any === 0 ? null : flags;
}

/** Encodes rows of byte batches (all columns requested, in header order) and their buckets. */
export class CsvRowEncoder {
  private readonly writer: CsvByteWriter;
  private readonly suffix: Buffer[];
  private readonly none = Buffer.from(',,\n');
  /** Bytes of the longest suffix (label and index cells). */
  private readonly longestSuffix: number;
  /** The WebAssembly row copier, or null (rows are copied in JavaScript). */
  private readonly gather: RowGather | null;
  /** formulaRows' answer, reused batch after batch. */
  private flags = new Uint8Array(0);
  /** The fast CSV engine on comma-separated input: a row whose fields are all unquoted and need no
   *  neutralising is its own input bytes, fields joined by the same ',' (copied in one run). */
  private readonly rawLayout: boolean;
  private readonly neutralise: boolean;

  constructor(output: CsvRowsOutput, reader: TableReader, set: BucketSet, value: string) {
    this.neutralise = output.neutraliseFormulas ?? true;
    this.writer = new CsvByteWriter((chunk) => output.write(chunk), this.neutralise);
    const opts = { neutraliseFormulas: this.neutralise };
    const head = Buffer.from(csvRow([...reader.header, output.labelColumn ?? `${value}_range`, output.indexColumn ?? `${value}_range_index`], opts), 'utf8');
    this.writer.raw(head, 0, head.length);
    this.suffix = set.buckets.map((b, k) => Buffer.concat([Buffer.from(','), cellBytes(b.label, this.neutralise), Buffer.from(','), cellBytes(String(k), this.neutralise), Buffer.from('\n')]));
    this.gather = (output.wasm ?? true) ? RowGather.make([...this.suffix, this.none]) : null;
    this.longestSuffix = Math.max(this.none.length, ...this.suffix.map((x) => x.length));
    this.rawLayout = reader.engine === 'fast' && reader.format !== 'ndjson' && reader.delimiter === ',';
  }

  get full(): boolean { return this.writer.full; }
  flush(): Promise<void> { return this.writer.flush(); }
  end(): Promise<void> { return this.writer.end(); }

  /** Writes the rows of the batch, row i with the bucket ks[i] (negative: no bucket, empty cells). */
  batch(b: ByteBatch, ks: Int32Array): void {
    const n = b.length;
    if (n === 0) return;
    if (this.rawLayout && this.quoteFree(b)) this.plainRows(b, ks);
    else for (let i = 0; i < n; i++) if (!(this.rawLayout && this.rawRow(b, i, ks[i]!))) this.cellRow(b, i, ks[i]!);
  }

  /** True when no byte from the first row's first field to the last row's last field (and the one before) is a quote. */
  private quoteFree(b: ByteBatch): boolean {
    const { starts, ends, buf } = b;
    const a = starts[0]![0]!, z = ends[starts.length - 1]![b.length - 1]!;
    const from = a > 0 ? a - 1 : 0;
    const q = buf.indexOf(QUOTE, from);
    return b.side.length === 0 && (q === -1 || q > z);
  }

  /**
   * Rows of a batch without a quote: every field is unquoted, so (by the fast engine's rules) none holds
   * a comma, quote, CR or LF, and a row's bytes from its first field to its last are its fields joined by
   * ','. Each row is copied as it is, unless a field is formula-like (then cell by cell).
   */
  private plainRows(b: ByteBatch, ks: Int32Array): void {
    const { starts, ends, buf } = b;
    const w = starts.length, n = b.length;
    const first = starts[0]!, last = ends[w - 1]!;
    // The WebAssembly module holds the batch for both the formula check and the copy, when it can.
    const loaded = this.gather !== null && this.gather.load(buf, first, last, 0, n);
    const flags = !this.neutralise ? null : loaded ? this.formulaRowsLoaded(b) : this.formulaRows(b);
    const inView = new DataView(buf.buffer, buf.byteOffset, buf.byteLength);
    const suffix = this.suffix, none = this.none;
    const wr = this.writer;
    let i = 0;
    while (i < n) {
      if (flags !== null && flags[i] === 1) { this.cellRow(b, i, ks[i]!); i++; continue; }
      // The rows up to the next formula-like one, into room reserved once for all of them.
      let to = i + 1;
      if (flags !== null) while (to < n && flags[to] === 0) to++;
      else to = n;
      if (loaded && this.gather!.copyLoaded(ks, i, to, wr)) { i = to; continue; }
      wr.reserve(last[to - 1]! - first[i]! + (to - i) * this.longestSuffix);
      const out = wr.bytes, ov = wr.view;
      let o = wr.length;
      for (; i < to; i++) {
        const k = ks[i]!;
        const e = last[i]!;
        let j = first[i]!;
        // four bytes at a time through DataViews (unaligned), measured twice as fast as a byte loop
        for (; j + 4 <= e; j += 4, o += 4) ov.setUint32(o, inView.getUint32(j));
        for (; j < e; j++) out[o++] = buf[j]!;
        const suf = k >= 0 ? suffix[k]! : none;
        for (let q = 0; q < suf.length; q++) out[o++] = suf[q]!;
      }
      wr.length = o;
    }
  }

  /**
   * formulaRows() from the batch loaded into the WebAssembly module: its sweep flags the rows with a field
   * starting with = + - @ or TAB, and only those are checked in full here.
   */
  private formulaRowsLoaded(b: ByteBatch): Uint8Array | null {
    const n = b.length;
    if (this.flags.length < n) this.flags = new Uint8Array(n);
    const flags = this.flags;
    return this.gather!.formulaRows(flags) === 0 ? null : keepFormulaRows(b, flags);
  }

  /**
   * For each row of a quote-free batch, 1 when a field is formula-like, else 0; null when none is. A column
   * at a time, the first byte of every field is looked up first (an empty field shows the byte after it,
   * a delimiter or line end, which only sends its row to the full check).
   */
  private formulaRows(b: ByteBatch): Uint8Array | null {
    const n = b.length, buf = b.buf;
    if (this.flags.length < n) this.flags = new Uint8Array(n);
    const flags = this.flags;
    const w = b.starts.length;
    const s0 = b.starts[0]!;
    for (let i = 0; i < n; i++) flags[i] = FORMULA_FIRST[buf[s0[i]!]!]!;
    for (let c = 1; c < w; c++) {
      const s = b.starts[c]!;
      for (let i = 0; i < n; i++) flags[i] |= FORMULA_FIRST[buf[s[i]!]!]!;
    }
    let any = 0;
    for (let i = 0; i < n; i++) any |= flags[i]!;
    return any === 0 ? null : keepFormulaRows(b, flags);
  }

  /**
   * Copies the row's input bytes when they are exactly its CSV output, then its label and index: no field
   * decoded out of doubled quotes, the first not opened by a quote, each next field starting one byte (the
   * ',') after the previous one ends (a quote between them would make it two) — so no field is quoted and,
   * by the fast engine's rules, none holds a comma, quote, CR or LF — and no field formula-like.
   */
  private rawRow(b: ByteBatch, i: number, k: number): boolean {
    const { starts, ends, decoded, buf } = b;
    const w = starts.length;
    const s0 = starts[0]![i]!;
    if (decoded[0]![i] === 1 || (s0 > 0 && buf[s0 - 1] === QUOTE)) return false;
    let prevEnd = ends[0]![i]!;
    for (let c = 1; c < w; c++) {
      if (decoded[c]![i] === 1 || starts[c]![i] !== prevEnd + 1) return false;
      prevEnd = ends[c]![i]!;
    }
    if (this.neutralise && formulaIn(b, i)) return false;
    this.writer.raw(buf, s0, prevEnd);
    const suf = k >= 0 ? this.suffix[k]! : this.none;
    this.writer.raw(suf, 0, suf.length);
    return true;
  }

  /** Writes row i cell by cell (quoting, neutralising), then its label and index. */
  private cellRow(b: ByteBatch, i: number, k: number): void {
    this.cells(b, i);
    const suf = k >= 0 ? this.suffix[k]! : this.none;
    this.writer.raw(suf, 0, suf.length);
  }

  /** Writes the row cell by cell (quoting, neutralising). */
  private cells(b: ByteBatch, i: number): void {
    const w = b.starts.length;
    for (let c = 0; c < w; c++) {
      if (c > 0) this.writer.byte(COMMA);
      this.writer.cell(b.decoded[c]![i] === 1 ? b.side : b.buf, b.starts[c]![i]!, b.ends[c]![i]!);
    }
  }
}
