// Distinct values of a column: counted exactly (with rows per value) up to a cap, then estimated with a
// HyperLogLog sketch. Past the cap the exact table is frozen (its counts stop) and every value only feeds
// the sketch. Each value is hashed once: the exact table and the sketch share the same 32-bit hash.
import { HyperLogLog, hashBytes, hashString } from './hll.js';
import { StringTable } from './string-table.js';

/** Distinct values kept exactly per column. */
export const EXACT_DISTINCT_CAP = 10_000;

const SHORT = 6;
const SHORT_SLOTS = 1024;

/** Length and bytes of a value of at most 6 bytes as one exact number below 2^51. */
function packShort(b: Uint8Array, s: number, e: number): number {
  let key = e - s;
  for (let i = s; i < e; i++) key = key * 256 + b[i]!;
  return key;
}

function shortSlot(key: number): number {
  const lo = key | 0;
  const hi = (key / 4294967296) | 0;
  return Math.imul(lo ^ Math.imul(hi, 0x85ebca6b), 0x9e3779b1) >>> 22;
}

export class DistinctCounter {
  private readonly table = new StringTable();
  private sketch: HyperLogLog | null = null;
  /**
   * A direct-mapped cache of short values (up to 6 bytes, packed into one number with their length) to their
   * entry in the table: a repeated short value is counted without hashing or comparing its bytes.
   */
  private readonly shortKeys = new Float64Array(SHORT_SLOTS).fill(-1);
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
    if (this.sketch === null && end - start <= SHORT) {
      const key = packShort(buf, start, end);
      const slot = shortSlot(key);
      if (this.shortKeys[slot] === key) {
        this.table.count(this.shortEntries[slot]!);
        return;
      }
      const hash = hashBytes(buf, start, end);
      const e = this.table.size < this.cap ? this.table.addBytesEntry(buf, start, end, hash) : this.table.addBytesIfPresent(buf, start, end, hash);
      if (e >= 0) {
        this.shortKeys[slot] = key;
        this.shortEntries[slot] = e;
      } else {
        this.startSketch(hash);
      }
      return;
    }
    this.addHashed(buf, start, end, hashBytes(buf, start, end));
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
