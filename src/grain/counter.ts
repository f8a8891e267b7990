// Counts, for every candidate grain, how many values (rows and distinct values) lie on its boundaries,
// keeping the first few values that do not. Fed with wall-clock milliseconds of one reading of the column.
//
// Speed: the candidates are not tested on every value. Each value falls in one of a bounded set of classes
// whose members pass exactly the same candidates (see boundary-classes.ts); a value costs one table look-up
// and two additions, and the candidate tests run once per class. Counts per candidate are summed from the
// class counts when read.
import { MAX_VECTORS, missedBy, passedBy, vectorOf } from './boundary-classes.js';
import { CANDIDATES } from './candidates.js';
import type { ParsedRows } from './parsed-rows.js';
import type { TextAt } from './text-at.js';
import type { ValueExample } from './types.js';

/** How many non-matching examples each candidate keeps. */
export const MAX_EXAMPLES = 5;

export class BoundaryCounter {
  /** Rows and distinct values fed in. */
  rows = 0;
  distinct = 0;
  /** Per candidate, the first values not on it, in the order fed. */
  readonly misses: ValueExample[][];
  /** Rows and distinct values per class vector (see boundary-classes.ts). */
  private readonly vecRows = new Float64Array(MAX_VECTORS);
  private readonly vecDistinct = new Float64Array(MAX_VECTORS);
  /** 1 once every candidate a class misses holds its examples: its values need no more looking at. */
  private readonly saturated = new Uint8Array(MAX_VECTORS);
  private readonly cache = { days: NaN, base: 0 };
  private totals: { rows: Float64Array; distinct: Float64Array } | null = null;

  constructor() {
    this.misses = CANDIDATES.map(() => []);
  }

  /**
   * Adds one wall-clock value standing for `weight` rows (`distinct` true when it is a new distinct value).
   * `line` and `text` describe its first row, for examples.
   */
  add(wallMs: number, weight: number, distinct: boolean, line: number, text: string): void {
    const v = vectorOf(wallMs, this.cache);
    this.rows += weight;
    this.vecRows[v] += weight;
    if (distinct) {
      this.distinct++;
      this.vecDistinct[v] += 1;
    }
    if (this.saturated[v] === 0) this.collect(v, line, text);
    this.totals = null;
  }

  /**
   * Adds one row that is not a new distinct value (`add(wallMs, 1, false, line, text)`), making the text of
   * row `i` of `src` only when a candidate still wants it as an example.
   */
  addRow(wallMs: number, line: number, src: TextAt, i: number): void {
    const v = vectorOf(wallMs, this.cache);
    this.rows += 1;
    this.vecRows[v] += 1;
    if (this.saturated[v] === 0) this.collect(v, line, src.text(i));
    this.totals = null;
  }

  /** `addRow` of the walls [from, p.length) of `p` in order. */
  addRows(p: ParsedRows, from: number): void {
    const walls = p.wall;
    const n = p.length;
    const cache = this.cache;
    const vecRows = this.vecRows;
    const saturated = this.saturated;
    for (let j = from; j < n; j++) {
      const v = vectorOf(walls[j]!, cache);
      vecRows[v] += 1;
      if (saturated[v] === 0) {
        const row = p.row[j]!;
        this.collect(v, p.lines[row]!, p.at.text(row));
      }
    }
    this.rows += n - from;
    this.totals = null;
  }

  /** Rows on each candidate's boundaries (indexed like CANDIDATES). */
  get rowsOn(): Float64Array {
    return this.sum().rows;
  }

  /** Distinct values on each candidate's boundaries (indexed like CANDIDATES). */
  get distinctOn(): Float64Array {
    return this.sum().distinct;
  }

  private collect(v: number, line: number, text: string): void {
    let open = false;
    for (const c of missedBy(v)) {
      const list = this.misses[c]!;
      if (list.length >= MAX_EXAMPLES) continue;
      list.push({ line, value: text });
      if (list.length < MAX_EXAMPLES) open = true;
    }
    if (!open) this.saturated[v] = 1;
  }

  private sum(): { rows: Float64Array; distinct: Float64Array } {
    if (this.totals !== null) return this.totals;
    const rows = new Float64Array(CANDIDATES.length);
    const distinct = new Float64Array(CANDIDATES.length);
    for (let v = 0; v < MAX_VECTORS; v++) {
      const r = this.vecRows[v]!;
      if (r === 0) continue;
      const d = this.vecDistinct[v]!;
      for (const c of passedBy(v)) {
        rows[c] += r;
        distinct[c] += d;
      }
    }
    this.totals = { rows, distinct };
    return this.totals;
  }
}
