// Ranges held as columns of typed arrays, so a million of them cost a few bytes each and no objects:
// the form the overlap sweep works on, and the form a table reader fills row by row.
import type { Range } from './types.js';

/** Flag bits of a range in columns. */
export const LOW_CLOSED = 1;
export const HIGH_CLOSED = 2;
export const DISCRETE = 4;

/**
 * Ranges as columns: range i runs from low[i] to high[i] (−Infinity / Infinity when unbounded) with
 * the closedness and kind in flags[i] (LOW_CLOSED | HIGH_CLOSED | DISCRETE). Arrays may be longer
 * than `length`; only the first `length` entries are ranges.
 */
export interface RangeColumns {
  readonly length: number;
  readonly low: Float64Array;
  readonly high: Float64Array;
  readonly flags: Uint8Array;
}

/** The flag byte of a range. */
export function rangeFlags(r: Range): number {
  return (r.lowClosed ? LOW_CLOSED : 0) | (r.highClosed ? HIGH_CLOSED : 0) | (r.discrete ? DISCRETE : 0);
}

/** Range i of columns as a plain Range record (a new object each call). */
export function rangeAt(c: RangeColumns, i: number): Range {
  const lo = c.low[i]!, hi = c.high[i]!, f = c.flags[i]!;
  return {
    low: lo === -Infinity ? null : lo, high: hi === Infinity ? null : hi,
    lowClosed: (f & LOW_CLOSED) !== 0, highClosed: (f & HIGH_CLOSED) !== 0, discrete: (f & DISCRETE) !== 0,
  };
}

/** Columns holding a copy of an array of ranges; the caller's array is only read. */
export function rangeColumnsOf(ranges: readonly Range[]): RangeColumns {
  const b = new RangeColumnsBuilder(ranges.length);
  for (const r of ranges) b.push(r);
  return b;
}

/** Columns that grow as ranges are appended (doubling typed arrays): what a streaming reader fills. */
export class RangeColumnsBuilder implements RangeColumns {
  length = 0;
  low: Float64Array;
  high: Float64Array;
  flags: Uint8Array;

  constructor(capacity = 1024) {
    const n = Math.max(16, capacity);
    this.low = new Float64Array(n);
    this.high = new Float64Array(n);
    this.flags = new Uint8Array(n);
  }

  private grow(): void {
    const n = this.low.length * 2;
    const low = new Float64Array(n), high = new Float64Array(n), flags = new Uint8Array(n);
    low.set(this.low); high.set(this.high); flags.set(this.flags);
    this.low = low; this.high = high; this.flags = flags;
  }

  /** Appends a range given by its parts (null ends unbounded, as in Range); returns its index. */
  pushParts(low: number | null, high: number | null, flags: number): number {
    if (this.length === this.low.length) this.grow();
    const i = this.length++;
    this.low[i] = low === null ? -Infinity : low === 0 ? 0 : low;
    this.high[i] = high === null ? Infinity : high === 0 ? 0 : high;
    this.flags[i] = flags & ((low === null ? 0 : LOW_CLOSED) | (high === null ? 0 : HIGH_CLOSED) | DISCRETE);
    return i;
  }

  /** Appends a range record; returns its index. */
  push(r: Range): number {
    return this.pushParts(r.low, r.high, rangeFlags(r));
  }
}

/** A growable column of whole numbers 0 … 2³²−1 (line numbers, key ids) in a typed array. */
export class IntColumn {
  length = 0;
  data: Uint32Array;
  constructor(capacity = 1024) { this.data = new Uint32Array(Math.max(16, capacity)); }
  push(x: number): void {
    if (this.length === this.data.length) { const d = new Uint32Array(this.data.length * 2); d.set(this.data); this.data = d; }
    this.data[this.length++] = x;
  }
  get(i: number): number { return this.data[i]!; }
}
