// Table shape: one row per item or event, or an already aggregated table — a combination of categorical
// columns unique on every row with a count- or total-like column beside it.
//
// The check is bounded. After the first batch, up to 6 candidate key columns are chosen (labels, codes, dates
// and low-cardinality integers; long free text excluded), and every combination of 1 to 3 of them is tracked
// (a column unique on most of the first batch — an instant, a row label — only on its own)
// with a set of 53-bit hashes of its values (two independent 32-bit string hashes). A combination dies at its
// first repeated value and frees its set. Hashes are kept for the first 200,000 rows at most; beyond that the
// result is "unique on the first 200,000 rows" and says so. At the end, only combinations whose columns all
// turned out categorical or ordinal (never identifiers or quantities) can be the key.
import type { ColumnBatch } from '../table/types.js';
import { hashString } from './hll.js';
import type { ColumnProfile, TableShape } from './types.js';

export const SHAPE_ROWS = 200_000;
export const MAX_KEY_COLUMNS = 6;
export const MAX_KEY_SIZE = 3;

const NUMBER = /^\s*-?\d+(\.\d+)?\s*$/;
const KEY_ROLES = new Set(['time', 'category', 'code', 'ordered-vocabulary', 'range-label', 'country-code', 'boolean']);
const TOTAL_NAME = /(total|sum|amount|count|cases|number|qty|quantity)/i;

interface Combo {
  cols: number[];
  seen: Set<number> | null;
}

/** Combinations of the candidates; a near-unique column (an instant, a row label) only stands alone. */
function combosOf(count: number, nearUnique: readonly boolean[]): Combo[] {
  return subsets(count, MAX_KEY_SIZE)
    .filter((cols) => cols.length === 1 || cols.every((k) => !nearUnique[k]))
    .map((cols) => ({ cols, seen: new Set<number>() }));
}

/** A second 32-bit string hash, independent of hashString (murmur-style steps seeded with the length). */
function hash2(s: string): number {
  let h = 0x9747b28c ^ s.length;
  for (let i = 0; i < s.length; i++) h = Math.imul(h ^ s.charCodeAt(i), 0x5bd1e995) ^ (h >>> 15);
  h = Math.imul(h ^ (h >>> 16), 0x85ebca6b);
  h = Math.imul(h ^ (h >>> 13), 0xc2b2ae35);
  return (h ^ (h >>> 16)) >>> 0;
}

function subsets(n: number, maxSize: number): number[][] {
  const out: number[][] = [];
  const rec = (start: number, acc: number[]): void => {
    if (acc.length > 0) out.push([...acc]);
    if (acc.length === maxSize) return;
    for (let i = start; i < n; i++) rec(i + 1, [...acc, i]);
  };
  rec(0, []);
  return out;
}

export class ShapeTracker {
  private candidates: number[] | null = null;
  private combos: Combo[] = [];
  checkedRows = 0;

  /** Reads one batch of every column (values[c] is column c). */
  observe(batch: ColumnBatch): void {
    if (this.candidates === null) this.choose(batch);
    const room = Math.min(batch.length, SHAPE_ROWS - this.checkedRows);
    if (room <= 0 || this.combos.every((c) => c.seen === null)) return;
    const cand = this.candidates!;
    const live = new Set<number>();
    for (const c of this.combos) if (c.seen !== null) for (const k of c.cols) live.add(k);
    const h1 = cand.map(() => new Float64Array(room));
    const h2 = cand.map(() => new Float64Array(room));
    cand.forEach((col, k) => {
      if (!live.has(k)) return;
      const vals = batch.values[col]!;
      for (let i = 0; i < room; i++) {
        h1[k]![i] = hashString(vals[i]!);
        h2[k]![i] = hash2(vals[i]!);
      }
    });
    for (const combo of this.combos) {
      const seen = combo.seen;
      if (seen === null) continue;
      for (let i = 0; i < room; i++) {
        let a = 17;
        let b = 31;
        for (const k of combo.cols) {
          a = Math.imul(a ^ h1[k]![i]!, 0x01000193) >>> 0;
          b = Math.imul(b ^ h2[k]![i]!, 0x85ebca6b) >>> 0;
        }
        const key = a * 2 ** 21 + (b & 0x1fffff);
        if (seen.has(key)) {
          combo.seen = null;
          break;
        }
        seen.add(key);
      }
    }
    this.checkedRows += room;
  }

  private choose(batch: ColumnBatch): void {
    const scored: Array<{ col: number; numeric: boolean; distinct: number; nearUnique: boolean }> = [];
    batch.values.forEach((vals, col) => {
      const n = Math.max(1, batch.length);
      let numbers = 0;
      let length = 0;
      const distinct = new Set<string>();
      for (let i = 0; i < batch.length; i++) {
        const v = vals[i]!;
        if (NUMBER.test(v) && !(v.trim().length > 1 && v.trim()[0] === '0')) numbers++;
        length += v.length;
        distinct.add(v);
      }
      if (length / n > 40) return;
      const numeric = numbers > 0.5 * n;
      if (numeric && distinct.size > Math.max(12, n / 10)) return;
      scored.push({ col, numeric, distinct: distinct.size, nearUnique: batch.length >= 100 && distinct.size > 0.5 * n });
    });
    scored.sort((a, b) => Number(a.numeric) - Number(b.numeric) || a.distinct - b.distinct);
    const chosen = scored.slice(0, MAX_KEY_COLUMNS);
    this.candidates = chosen.map((s) => s.col);
    this.combos = combosOf(chosen.length, chosen.map((s) => s.nearUnique));
  }

  /** The shape, once every column has its final role. `rows` is the number of data rows read. */
  decide(columns: readonly ColumnProfile[], rows: number): TableShape {
    const cand = this.candidates ?? [];
    const keyable = (k: number): boolean => {
      const p = columns[cand[k]!]!;
      return KEY_ROLES.has(p.role) && !(p.role === 'time' && p.level !== 'ordinal');
    };
    const unique = this.combos.filter((c) => c.seen !== null && c.cols.every(keyable));
    const measures = columns.filter((p) => p.role === 'count' || (p.role === 'measure' && TOTAL_NAME.test(p.name))).map((p) => p.name);
    const bounded = this.checkedRows < rows ? ` (checked on the first ${this.checkedRows.toLocaleString('en-US')} rows)` : '';
    if (unique.length > 0 && measures.length > 0 && rows > 1) {
      const size = Math.min(...unique.map((c) => c.cols.length));
      const names = (c: Combo): string[] => c.cols.map((k) => cand[k]!).sort((x, y) => x - y).map((i) => columns[i]!.name);
      const best = unique.filter((c) => c.cols.length === size).sort((a, b) => timeFirst(b) - timeFirst(a)).map(names);
      return {
        kind: 'aggregated', key: best[0]!, measures, alternatives: best.slice(1), checkedRows: this.checkedRows,
        reason: `each combination of ${best[0]!.join(' × ')} occurs on exactly one row${bounded}, with ${measures.join(', ')} beside it: the table is already aggregated`,
      };
    }
    const ids = columns.filter((p) => p.role === 'identifier').map((p) => p.name);
    return {
      kind: 'items', key: ids.slice(0, 1), measures: [], alternatives: [], checkedRows: this.checkedRows,
      reason: ids.length > 0
        ? `${ids[0]} names each row and no combination of categories is unique with a count beside it: one row per item or event`
        : 'no combination of categories is unique on every row with a count beside it: one row per item or event',
    };

    function timeFirst(c: Combo): number {
      return c.cols.some((k) => columns[cand[k]!]!.role === 'time') ? 1 : 0;
    }
  }
}
