// An exact table of distinct strings with a count per string, for the profile's hot loop. A string is hashed
// once (the 32-bit hash of hll.ts, which the sketch then reuses) and found by open addressing with linear
// probing; equality is checked on the string itself, so the table is exact whatever the hash collisions.
// It costs a few typed-array reads per value instead of a Map look-up and update. ASCII fields can be added
// as bytes: they are compared byte by byte with the kept strings and made into a string only when new.
import { asciiString } from '../table/ascii.js';

/** Distinct strings and their rows, in order of first appearance. */
export class StringTable {
  readonly keys: string[] = [];
  rows = new Float64Array(64);
  private hashes = new Int32Array(64);
  /** Open-addressing slots holding an entry index + 1 (0 = empty); kept at most half full. */
  private slots = new Int32Array(128);

  get size(): number {
    return this.keys.length;
  }

  /** Adds one row of `key` (with `hash`, its hashString) and returns true when the key is new. */
  add(key: string, hash: number): boolean {
    const i = this.probe(key, hash);
    const e = this.slots[i]!;
    if (e !== 0) {
      this.rows[e - 1] += 1;
      return false;
    }
    const n = this.keys.length;
    if (n === this.rows.length) this.growEntries();
    this.keys.push(key);
    this.rows[n] = 1;
    this.hashes[n] = hash;
    this.slots[i] = n + 1;
    if (2 * (n + 1) > this.slots.length) this.rehash();
    return true;
  }

  /** Adds one row of `key` when it is in the table already; returns whether it was. */
  addIfPresent(key: string, hash: number): boolean {
    const e = this.slots[this.probe(key, hash)]!;
    if (e === 0) return false;
    this.rows[e - 1] += 1;
    return true;
  }

  /**
   * Adds one row of the ASCII bytes buf[start, end) (with `hash`, their hashBytes — equal to the hashString
   * of the same text) and returns true when they are a new key. The string is made only for a new key.
   */
  addBytes(buf: Uint8Array, start: number, end: number, hash: number): boolean {
    const n = this.keys.length;
    return this.addBytesEntry(buf, start, end, hash) === n;
  }

  /** addBytes() returning the key's entry index (its place in `keys`). */
  addBytesEntry(buf: Uint8Array, start: number, end: number, hash: number): number {
    const i = this.probeBytes(buf, start, end, hash);
    const e = this.slots[i]!;
    if (e !== 0) {
      this.rows[e - 1] += 1;
      return e - 1;
    }
    const n = this.keys.length;
    if (n === this.rows.length) this.growEntries();
    this.keys.push(asciiString(buf, start, end));
    this.rows[n] = 1;
    this.hashes[n] = hash;
    this.slots[i] = n + 1;
    if (2 * (n + 1) > this.slots.length) this.rehash();
    return n;
  }

  /** addIfPresent for ASCII bytes: the entry index counted, or -1 when the key is not in the table. */
  addBytesIfPresent(buf: Uint8Array, start: number, end: number, hash: number): number {
    const e = this.slots[this.probeBytes(buf, start, end, hash)]!;
    if (e === 0) return -1;
    this.rows[e - 1] += 1;
    return e - 1;
  }

  /** Counts one more row of entry `e` (an index addBytesEntry returned). */
  count(e: number): void {
    this.rows[e] += 1;
  }

  /** probe() for ASCII bytes: a key matches when its char codes are the bytes. */
  private probeBytes(buf: Uint8Array, start: number, end: number, hash: number): number {
    const mask = this.slots.length - 1;
    const h = hash | 0;
    const n = end - start;
    let i = h & mask;
    for (;;) {
      const e = this.slots[i]!;
      if (e === 0) return i;
      if (this.hashes[e - 1] === h) {
        const k = this.keys[e - 1]!;
        if (k.length === n) {
          let j = 0;
          while (j < n && k.charCodeAt(j) === buf[start + j]) j++;
          if (j === n) return i;
        }
      }
      i = (i + 1) & mask;
    }
  }

  /** The slot holding `key`, or the empty slot where it would go. */
  private probe(key: string, hash: number): number {
    const mask = this.slots.length - 1;
    const h = hash | 0;
    let i = h & mask;
    for (;;) {
      const e = this.slots[i]!;
      if (e === 0 || (this.hashes[e - 1] === h && this.keys[e - 1] === key)) return i;
      i = (i + 1) & mask;
    }
  }

  private growEntries(): void {
    const rows = new Float64Array(this.rows.length * 2);
    rows.set(this.rows);
    this.rows = rows;
    const hashes = new Int32Array(this.hashes.length * 2);
    hashes.set(this.hashes);
    this.hashes = hashes;
  }

  private rehash(): void {
    const slots = new Int32Array(this.slots.length * 2);
    const mask = slots.length - 1;
    for (let e = 0; e < this.keys.length; e++) {
      let i = this.hashes[e]! & mask;
      while (slots[i] !== 0) i = (i + 1) & mask;
      slots[i] = e + 1;
    }
    this.slots = slots;
  }
}
