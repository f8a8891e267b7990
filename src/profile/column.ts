// The streaming accumulator of one column for the profile: emptiness, distinct values, lengths, numeric
// evidence (under the column's own number format, inferred from its head) and, for date-like columns,
// everything grain detection gathers — all in the same single pass. Values arrive as strings (`push`) or as
// a column of a byte batch (`pushBatch`, the fast path), with the same evidence either way.
import { GrainColumn } from '../grain/column.js';
import { asciiString } from '../table/ascii.js';
import { byteFieldString } from '../table/byte-batch.js';
import type { ByteBatch } from '../table/types.js';
import { inferNumberFormat } from '../numbers/infer.js';
import { makeNumberParser } from '../numbers/parse.js';
import { emptyFieldScan, scanField } from './byte-scan.js';
import { DistinctCounter, packShortHi, packShortLo } from './distinct.js';
import { NumericEvidence } from './numeric.js';

/** Non-empty values from the head of the column used to infer its number format. */
export const NUMBER_HEAD = 1_000;
/** Values up to this many bytes are counted through DistinctCounter's cache of short values. */
const SHORT_VALUE = 6;

/**
 * A direct-mapped cache of short plain numbers (keyed as DistinctCounter's cache of short values, by
 * packShortLo and packShortHi, in the same slots): the value and its NumericEvidence.plainShape. Only
 * values addPlainBytes took are kept, so a hit is the same evidence as reading the bytes again.
 */
class ShortNumbers {
  readonly lo = new Int32Array(1024);
  readonly hi = new Int32Array(1024).fill(-1);
  readonly value = new Float64Array(1024);
  readonly shape = new Uint8Array(1024);
}

export class ProfileColumn {
  empty = 0;
  values = 0;
  totalLength = 0;
  readonly distinct = new DistinctCounter();
  readonly grain: GrainColumn;
  numeric: NumericEvidence | null = null;
  /** True when numeric evidence stopped after the head (the head was mostly not numbers). */
  numbersStopped = false;
  private timeMode: boolean | null = null;
  private readonly scan = emptyFieldScan();
  /** Plain numbers of at most SHORT_VALUE bytes seen lately (made on first use). */
  private shortNumbers: ShortNumbers | null = null;
  private head: string[] | null = [];

  constructor(readonly name: string) {
    this.grain = new GrainColumn(name);
  }

  push(text: string, line: number): void {
    if (isBlank(text)) {
      this.empty++;
      this.grain.push(text, line);
      return;
    }
    this.values++;
    this.totalLength += text.length;
    // A date-like column's distinct values are counted by its grain store (as instants): no second table.
    if (!this.timeDistinct()) this.distinct.add(text);
    this.grain.push(text, line);
    const head = this.head;
    if (head !== null) {
      head.push(text);
      if (head.length >= NUMBER_HEAD) this.startNumbers();
      return;
    }
    if (!this.numbersStopped) this.numeric!.add(text);
  }

  /**
   * push() of every value of byte column `c` of a byte batch, in order: the same evidence. The heads are
   * read as strings; after them, grain reads its own bytes (GrainColumn.pushBatch) and this column's
   * counts, distinct values and numbers come from the bytes of an ASCII batch — a string is made only for
   * a distinct value seen for the first time and a number that is not a plain decimal.
   */
  pushBatch(b: ByteBatch, c: number): void {
    const n = b.length;
    let i = 0;
    while (i < n && (this.head !== null || !this.grain.decided)) {
      this.push(byteFieldString(b, c, i), b.lines[i]!);
      i++;
    }
    if (i === n) return;
    // Both heads are read: what a value still needs is known and fixed from here on.
    const timeMode = this.timeDistinct();
    const rest = i === 0 ? b : sliceBatch(b, c, i);
    if (!this.grain.notTime) this.grain.pushBatch(rest, c);
    if (b.ascii) this.restAscii(rest, c, timeMode);
    else this.restStrings(rest, c, timeMode);
  }

  /**
   * Relative cost of this column's values from here on, for splitting columns between threads (split.ts): a
   * column grain still reads as time costs about three times a text or number column (CPU profiles of the
   * benchmark's 10M-row file on two threads: about 0.8 s for the timestamps, 0.25 to 0.4 s for each other).
   */
  get splitCost(): number {
    return this.grain.notTime ? 1 : 3;
  }

  /** Counts, distinct values and numbers of an ASCII byte column once the heads are read. */
  private restAscii(b: ByteBatch, c: number, timeMode: boolean): void {
    const distinct = timeMode ? null : this.distinct;
    const numeric = this.numbersStopped ? null : this.numeric!;
    // One loop per kind of work left, so that each loop holds only what its values need.
    if (numeric === null && distinct === null) this.countAscii(b, c);
    else if (numeric === null) this.distinctAscii(b, c, distinct!);
    else this.numbersAscii(b, c, distinct, numeric);
  }

  /** Empty and non-empty values and their lengths (a column whose distinct values and numbers are settled). */
  private countAscii(b: ByteBatch, c: number): void {
    const starts = b.starts[c]!;
    const ends = b.ends[c]!;
    const decoded = b.decoded[c]!;
    let empty = 0;
    let length = 0;
    for (let i = 0; i < b.length; i++) {
      const buf = decoded[i] === 1 ? b.side : b.buf;
      const s = starts[i]!;
      const e = ends[i]!;
      if (s === e || ((buf[s] === 32 || buf[s] === 9) && isBlankBytes(buf, s, e))) empty++;
      else length += e - s;
    }
    this.tally(b.length, empty, length);
  }

  private distinctAscii(b: ByteBatch, c: number, distinct: DistinctCounter): void {
    const starts = b.starts[c]!;
    const ends = b.ends[c]!;
    const decoded = b.decoded[c]!;
    let empty = 0;
    let length = 0;
    for (let i = 0; i < b.length; i++) {
      const buf = decoded[i] === 1 ? b.side : b.buf;
      const s = starts[i]!;
      const e = ends[i]!;
      if (s === e || ((buf[s] === 32 || buf[s] === 9) && isBlankBytes(buf, s, e))) {
        empty++;
        continue;
      }
      length += e - s;
      distinct.addBytes(buf, s, e);
    }
    this.tally(b.length, empty, length);
  }

  private numbersAscii(b: ByteBatch, c: number, distinct: DistinctCounter | null, numeric: NumericEvidence): void {
    const starts = b.starts[c]!;
    const ends = b.ends[c]!;
    const decoded = b.decoded[c]!;
    const scan = this.scan;
    const dot = numeric.dotIsDecimal;
    let empty = 0;
    let length = 0;
    for (let i = 0; i < b.length; i++) {
      const buf = decoded[i] === 1 ? b.side : b.buf;
      const s = starts[i]!;
      const e = ends[i]!;
      if (s === e || ((buf[s] === 32 || buf[s] === 9) && isBlankBytes(buf, s, e))) {
        empty++;
        continue;
      }
      length += e - s;
      if (distinct === null) {
        if (!numeric.addPlainBytes(buf, s, e)) numeric.addOther(asciiString(buf, s, e));
      } else if (e - s <= SHORT_VALUE && !distinct.sketching) {
        // A short value is counted through the distinct counter's cache, without hashing it, and a plain
        // number seen before is taken from this column's cache of short numbers, without reading it again.
        const lo = packShortLo(buf, s, e - s);
        const hi = packShortHi(buf, s, e - s);
        const slot = distinct.addShort(buf, s, e, lo, hi);
        const cache = this.shortNumbers ?? (this.shortNumbers = new ShortNumbers());
        if (cache.lo[slot] === lo && cache.hi[slot] === hi) {
          numeric.addRepeat(cache.value[slot]!, cache.shape[slot]!);
        } else if (numeric.addPlainBytes(buf, s, e)) {
          cache.lo[slot] = lo;
          cache.hi[slot] = hi;
          cache.value[slot] = numeric.plainValue;
          cache.shape[slot] = numeric.plainShape;
        } else {
          numeric.addOther(asciiString(buf, s, e));
        }
      } else {
        // One walk over the bytes hashes the value and reads it as a plain decimal.
        scanField(buf, s, e, dot, scan);
        distinct.addHashed(buf, s, e, scan.hash);
        if (scan.plain) numeric.addScanned(scan, buf, s, e);
        else numeric.addOther(asciiString(buf, s, e));
      }
    }
    this.tally(b.length, empty, length);
  }

  private tally(rows: number, empty: number, length: number): void {
    this.empty += empty;
    this.values += rows - empty;
    this.totalLength += length;
  }

  /** restAscii() for a batch with other bytes than ASCII: each value as its string. */
  private restStrings(b: ByteBatch, c: number, timeMode: boolean): void {
    for (let i = 0; i < b.length; i++) {
      const text = byteFieldString(b, c, i);
      if (isBlank(text)) {
        this.empty++;
        continue;
      }
      this.values++;
      this.totalLength += text.length;
      if (!timeMode) this.distinct.add(text);
      if (!this.numbersStopped) this.numeric!.add(text);
    }
  }

  /**
   * True once the head (the first 1,000 values) showed one time format reading at least 95% of it: from then
   * on the grain store counts the distinct values (as instants) and the string table stops. Decided once.
   */
  timeDistinct(): boolean {
    if (this.timeMode === null) {
      if (this.grain.inference === null) return false;
      const r = this.grain.readings.length === 1 ? this.grain.readings[0]! : null;
      this.timeMode = r !== null && r.format.id !== 'iso-year' && r.invalid * 20 <= r.parsed;
    }
    return this.timeMode;
  }

  /** Distinct non-empty values: from the grain store for date-like columns, else from the distinct counter. */
  distinctCount(): { count: number; exact: boolean } {
    if (this.timeMode === true) {
      const r = this.grain.readings[0]!;
      const d = r.store.distinctCount();
      return r.invalid === 0 ? d : { count: d.count + r.invalid, exact: false };
    }
    return { count: this.distinct.count(), exact: this.distinct.exact };
  }

  finish(): void {
    if (this.head !== null) this.startNumbers();
    this.grain.finish();
  }

  private startNumbers(): void {
    const head = this.head!;
    this.head = null;
    const inference = inferNumberFormat(head);
    const numeric = new NumericEvidence(makeNumberParser(inference.format));
    for (const t of head) numeric.add(t);
    // A column whose head is mostly not numbers cannot reach the 95% a quantity needs: stop reading numbers.
    this.numeric = numeric;
    this.numbersStopped = numeric.s.numbers < 0.5 * head.length;
  }
}

/** Rows `from` on of byte column `c` of a batch, as a batch of their own (views, no copy). */
function sliceBatch(b: ByteBatch, c: number, from: number): ByteBatch {
  const cut = <T extends Int32Array | Uint8Array>(a: T, k: number): T => (k === c ? (a.subarray(from) as T) : a);
  return {
    length: b.length - from,
    lines: Float64Array.from({ length: b.length - from }, (_, i) => b.lines[from + i]!),
    buf: b.buf,
    side: b.side,
    ascii: b.ascii,
    starts: b.starts.map(cut),
    ends: b.ends.map(cut),
    decoded: b.decoded.map(cut),
    values: b.values,
  };
}

function isBlankBytes(b: Uint8Array, s: number, e: number): boolean {
  for (let i = s; i < e; i++) {
    const c = b[i]!;
    if (c !== 32 && c !== 9) return false;
  }
  return true;
}

function isBlank(s: string): boolean {
  for (let i = 0; i < s.length; i++) {
    const c = s.charCodeAt(i);
    if (c !== 32 && c !== 9) return false;
  }
  return true;
}
