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
import { byteFieldString } from '../table/byte-batch.js';
import type { ByteBatch, ColumnBatch } from '../table/types.js';
import { hashBytes, hashString } from './hll.js';
import type { ColumnProfile, TableShape } from './types.js';

export const SHAPE_ROWS = 200_000;
export const MAX_KEY_COLUMNS = 6;
export const MAX_KEY_SIZE = 3;

const NUMBER = /^\s*-?\d+(\.\d+)?\s*$/;
const KEY_ROLES = new Set(['time', 'category', 'code', 'ordered-vocabulary', 'range-label', 'country-code', 'boolean']);
const TOTAL_NAME = /(total|sum|amount|count|cases|number|qty|quantity)/i;

interface Combo {
  cols: number[];
  seen: KeySet | null;
}

/** Combinations of the candidates; a near-unique column (an instant, a row label) only stands alone. */
function combosOf(count: number, nearUnique: readonly boolean[]): Combo[] {
  return subsets(count, MAX_KEY_SIZE)
    .filter((cols) => cols.length === 1 || cols.every((k) => !nearUnique[k]))
    .map((cols) => ({ cols, seen: new KeySet() }));
}

/** A second 32-bit string hash, independent of hashString (murmur-style steps seeded with the length). */
function hash2(s: string): number {
  let h = 0x9747b28c ^ s.length;
  for (let i = 0; i < s.length; i++) h = Math.imul(h ^ s.charCodeAt(i), 0x5bd1e995) ^ (h >>> 15);
  return finish2(h);
}

/** hash2 of the ASCII bytes b[start, end) (for ASCII, byte k is char code k). */
function hash2Bytes(b: Uint8Array, start: number, end: number): number {
  let h = 0x9747b28c ^ (end - start);
  for (let i = start; i < end; i++) h = Math.imul(h ^ b[i]!, 0x5bd1e995) ^ (h >>> 15);
  return finish2(h);
}

function finish2(h: number): number {
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

/** A set of 53-bit keys (non-negative integers) by open addressing in a typed array; -1 marks an empty slot. */
class KeySet {
  private slots = new Float64Array(1024).fill(-1);
  private size = 0;

  /** Adds `key` (whose low 32 bits are `a`); returns false when it was there already. */
  add(key: number, a: number): boolean {
    let slots = this.slots;
    let mask = slots.length - 1;
    let i = Math.imul(a, 0x9e3779b1) & mask;
    for (;;) {
      const k = slots[i]!;
      if (k === -1) break;
      if (k === key) return false;
      i = (i + 1) & mask;
    }
    slots[i] = key;
    if (2 * ++this.size > slots.length) {
      this.grow();
      slots = this.slots;
      mask = slots.length - 1;
    }
    return true;
  }

  private grow(): void {
    const old = this.slots;
    const slots = new Float64Array(old.length * 2).fill(-1);
    const mask = slots.length - 1;
    for (let j = 0; j < old.length; j++) {
      const key = old[j]!;
      if (key === -1) continue;
      let i = Math.imul(Math.floor(key / 2 ** 21), 0x9e3779b1) & mask;
      while (slots[i] !== -1) i = (i + 1) & mask;
      slots[i] = key;
    }
    this.slots = slots;
  }
}

export class ShapeTracker {
  private candidates: number[] | null = null;
  private combos: Combo[] = [];
  checkedRows = 0;
  /** Rows held for choosing the candidates, when byte batches are shorter than `chooseRows`. */
  private pending: { lines: number[]; values: string[][] } | null = null;
  private h1: Float64Array[] = [];
  private h2: Float64Array[] = [];

  /**
   * `chooseRows`: rows the candidates are chosen on — the reader's batch size, so that byte batches (which
   * may be cut shorter) choose on the very rows the first string batch holds.
   */
  constructor(private readonly chooseRows = 8192) {}

  /** Reads one batch of every column (values[c] is column c). */
  observe(batch: ColumnBatch): void {
    if (this.candidates === null) this.choose(batch);
    this.hashStrings(batch.values, 0, batch.length);
  }

  /** observe() for a byte batch of every column (byte column c is column c): the same evidence. */
  observeBytes(b: ByteBatch): void {
    let from = 0;
    if (this.candidates === null) {
      const p = (this.pending ??= { lines: [], values: b.starts.map(() => []) });
      from = Math.min(b.length, this.chooseRows - p.lines.length);
      for (let i = 0; i < from; i++) {
        p.lines.push(b.lines[i]!);
        for (let c = 0; c < p.values.length; c++) p.values[c]!.push(byteFieldString(b, c, i));
      }
      if (p.lines.length < this.chooseRows) return;
      this.flush();
    }
    if (from === b.length || this.finished()) return;
    if (!b.ascii) {
      const values = b.starts.map((_, c) => Array.from({ length: b.length - from }, (_, i) => byteFieldString(b, c, from + i)));
      this.hashStrings(values, 0, values[0]?.length ?? 0);
      return;
    }
    const room = this.hashArrays(b.length - from);
    if (room === 0) return;
    this.live().forEach((col, k) => {
      if (col < 0) return;
      const starts = b.starts[col]!;
      const ends = b.ends[col]!;
      const decoded = b.decoded[col]!;
      const h1 = this.h1[k]!;
      const h2 = this.h2[k]!;
      for (let i = 0; i < room; i++) {
        const j = from + i;
        const buf = decoded[j] === 1 ? b.side : b.buf;
        h1[i] = hashBytes(buf, starts[j]!, ends[j]!);
        h2[i] = hash2Bytes(buf, starts[j]!, ends[j]!);
      }
    });
    this.checkCombos(room);
  }

  /** Chooses the candidates on the rows held, if byte batches ended before `chooseRows` rows. */
  flush(): void {
    const p = this.pending;
    if (this.candidates !== null || p === null) return;
    this.pending = null;
    const batch: ColumnBatch = { length: p.lines.length, lines: p.lines, values: p.values };
    this.choose(batch);
    this.hashStrings(batch.values, 0, batch.length);
  }

  private finished(): boolean {
    return SHAPE_ROWS - this.checkedRows <= 0 || this.combos.every((c) => c.seen === null);
  }

  /** Candidate k's column while a live combination uses it, else -1. */
  private live(): number[] {
    const cand = this.candidates!;
    const live = cand.map(() => -1);
    for (const c of this.combos) if (c.seen !== null) for (const k of c.cols) live[k] = cand[k]!;
    return live;
  }

  /** Hash arrays for the next `rows` rows (as many as SHAPE_ROWS leaves room for); returns that room. */
  private hashArrays(rows: number): number {
    const room = Math.max(0, Math.min(rows, SHAPE_ROWS - this.checkedRows));
    const cand = this.candidates!;
    if (this.h1.length !== cand.length || (this.h1[0]?.length ?? 0) < room) {
      this.h1 = cand.map(() => new Float64Array(Math.max(room, this.chooseRows)));
      this.h2 = cand.map(() => new Float64Array(Math.max(room, this.chooseRows)));
    }
    return room;
  }

  private hashStrings(values: string[][], from: number, length: number): void {
    if (this.finished()) return;
    const room = this.hashArrays(length);
    if (room === 0) return;
    this.live().forEach((col, k) => {
      if (col < 0) return;
      const vals = values[col]!;
      const h1 = this.h1[k]!;
      const h2 = this.h2[k]!;
      for (let i = 0; i < room; i++) {
        h1[i] = hashString(vals[from + i]!);
        h2[i] = hash2(vals[from + i]!);
      }
    });
    this.checkCombos(room);
  }

  /** Adds the first `room` rows of the hash arrays to every live combination. */
  private checkCombos(room: number): void {
    for (const combo of this.combos) {
      const seen = combo.seen;
      if (seen === null) continue;
      const cols = combo.cols;
      for (let i = 0; i < room; i++) {
        let a = 17;
        let b = 31;
        for (let j = 0; j < cols.length; j++) {
          const k = cols[j]!;
          a = Math.imul(a ^ this.h1[k]![i]!, 0x01000193) >>> 0;
          b = Math.imul(b ^ this.h2[k]![i]!, 0x85ebca6b) >>> 0;
        }
        const key = a * 2 ** 21 + (b & 0x1fffff);
        if (!seen.add(key, a)) {
          combo.seen = null;
          break;
        }
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
