// Distinct values of a column: counted exactly (with rows per value) up to a cap, then estimated with a
// HyperLogLog sketch. Past the cap the exact table is frozen (its counts stop) and every value only feeds
// the sketch. Each value is hashed once: the exact table and the sketch share the same 32-bit hash.
import { HyperLogLog, hashBytes, hashString } from './hll.js';
import { StringTable } from './string-table.js';

/** Distinct values kept exactly per column. */
export const EXACT_DISTINCT_CAP = 10_000;

const SHORT = 6;
const SHORT_SLOTS = 1024;

/** Per length 0..6, the bytes of the first four a value holds, as a mask of packShortLo's big-endian word. */
const LO_MASK = Int32Array.from([0, 0xff000000, 0xffff0000, 0xffffff00, -1, -1, -1]);
/** Per length 0..6, the bytes of the fifth and sixth it holds, in packShortHi's low 16 bits. */
const HI_MASK = Int32Array.from([0, 0, 0, 0, 0, 0xff00, 0xffff]);

/**
 * Bytes 0..3 of a value of `n` ≤ 6 bytes at b[s], big-endian, bytes past its end zeroed. With
 * packShortHi (its length and bytes 4..5) it is the value exactly, in two small integers. Six bytes are
 * read whatever `n` (no branch on the length, which is hard to predict) unless the buffer ends first.
 */
export function packShortLo(b: Uint8Array, s: number, n: number): number {
  if (s + 4 <= b.length) return ((b[s]! << 24) | (b[s + 1]! << 16) | (b[s + 2]! << 8) | b[s + 3]!) & LO_MASK[n]!;
  let lo = 0;
  for (let i = 0; i < 4; i++) lo = (lo << 8) | (i < n ? b[s + i]! : 0);
  return lo;
}

/** The length of a value of `n` ≤ 6 bytes at b[s] (bits 16..18) and its bytes 4..5 (bits 0..15); see packShortLo. */
export function packShortHi(b: Uint8Array, s: number, n: number): number {
  if (s + 6 <= b.length) return (n << 16) | (((b[s + 4]! << 8) | b[s + 5]!) & HI_MASK[n]!);
  return (n << 16) | ((n > 4 ? b[s + 4]! << 8 : 0) | (n > 5 ? b[s + 5]! : 0));
}

/** The slot of a packed short value in a direct-mapped cache of SHORT_SLOTS (1024) entries. */
export function shortSlot(lo: number, hi: number): number {
  return Math.imul(lo ^ Math.imul(hi, 0x85ebca6b), 0x9e3779b1) >>> 22;
}

export class DistinctCounter {
  private readonly table = new StringTable();
  private sketch: HyperLogLog | null = null;
  /**
   * A direct-mapped cache of short values (up to 6 bytes, packed with their length into two integers) to their
   * entry in the table: a repeated short value is counted without hashing or comparing its bytes.
   */
  private readonly shortLo = new Int32Array(SHORT_SLOTS);
  private readonly shortHi = new Int32Array(SHORT_SLOTS).fill(-1);
  private readonly shortEntries = new Int32Array(SHORT_SLOTS);

  constructor(private readonly cap = EXACT_DISTINCT_CAP) {}

  add(value: string): void {
    const hash = hashString(value);
    if (this.sketch !== null) {
      this.sketch.addHash(hash);
      return;
    }
    const table = this.table;
    if (table.size < this.cap) {
      table.add(value, hash);
      return;
    }
    // At the cap: a value already in the table is still counted there; a new one starts the sketch.
    if (!table.addIfPresent(value, hash)) this.startSketch(hash);
  }

  /** add() for the ASCII bytes buf[start, end) of a value: the same counts, no string unless the value is new. */
  addBytes(buf: Uint8Array, start: number, end: number): void {
    const n = end - start;
    if (this.sketch === null && n <= SHORT) {
      this.addShort(buf, start, end, packShortLo(buf, start, n), packShortHi(buf, start, n));
      return;
    }
    this.addHashed(buf, start, end, hashBytes(buf, start, end));
  }

  /**
   * addBytes() of a value of at most six bytes while the exact table runs (not `sketching`), given its
   * packShortLo and packShortHi: a value in the cache is counted without hashing or comparing its bytes.
   * Returns the value's cache slot (shortSlot), for a cache of the caller's kept beside this one.
   */
  addShort(buf: Uint8Array, start: number, end: number, lo: number, hi: number): number {
    const slot = shortSlot(lo, hi);
    if (this.shortLo[slot] === lo && this.shortHi[slot] === hi) {
      this.table.count(this.shortEntries[slot]!);
      return slot;
    }
    const hash = hashBytes(buf, start, end);
    const e = this.table.size < this.cap ? this.table.addBytesEntry(buf, start, end, hash) : this.table.addBytesIfPresent(buf, start, end, hash);
    if (e >= 0) {
      this.shortLo[slot] = lo;
      this.shortHi[slot] = hi;
      this.shortEntries[slot] = e;
    } else {
      this.startSketch(hash);
    }
    return slot;
  }

  /** addBytes() with the bytes' hash (hashBytes) already made. */
  addHashed(buf: Uint8Array, start: number, end: number, hash: number): void {
    if (this.sketch !== null) {
      this.sketch.addHash(hash);
      return;
    }
    const table = this.table;
    if (table.size < this.cap) {
      table.addBytes(buf, start, end, hash);
      return;
    }
    if (table.addBytesIfPresent(buf, start, end, hash) < 0) this.startSketch(hash);
  }

  /** True once the exact table overflowed: from then on a value's hash is all that is kept. */
  get sketching(): boolean {
    return this.sketch !== null;
  }

  /** Adds a hash (hashString of a value) once the sketch has started. */
  addHash(hash: number): void {
    this.sketch!.addHash(hash);
  }

  private startSketch(hash: number): void {
    this.sketch = new HyperLogLog();
    for (const k of this.table.keys) this.sketch.add(k);
    this.sketch.addHash(hash);
  }

  /** Distinct values (first seen first) and their rows; frozen once the cap is passed. */
  get counts(): ReadonlyMap<string, number> {
    const out = new Map<string, number>();
    const { keys, rows } = this.table;
    for (let i = 0; i < keys.length; i++) out.set(keys[i]!, rows[i]!);
    return out;
  }

  /** True while every distinct value is in `counts`. */
  get exact(): boolean {
    return this.sketch === null;
  }

  /** Distinct values: exact, or the sketch's estimate past the cap. */
  count(): number {
    return this.sketch === null ? this.table.size : Math.max(this.table.size, this.sketch.estimate());
  }

  /** The `n` most frequent values (exact while `exact`; past the cap, counts of the first rows only), most frequent first. */
  top(n: number): Array<{ value: string; count: number }> {
    return [...this.counts].sort((a, b) => b[1] - a[1] || a[0].localeCompare(b[0])).slice(0, n).map(([value, count]) => ({ value, count }));
  }
}
