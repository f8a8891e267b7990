// The distinct values of one date column, exact up to a cap. Memory grows with distinct values, never rows:
// past the cap the store hands its contents to a streaming boundary counter and a HyperLogLog sketch, keeps
// a reservoir sample for the zone search, and from then on only counts.
import { HyperLogLog } from '../profile/hll.js';
import { BoundaryCounter } from './counter.js';
import type { ParsedRows } from './parsed-rows.js';
import type { TextAt } from './text-at.js';
import { ValueTable } from './value-table.js';
import type { TimedValue } from './zones.js';

/** Distinct values kept exactly per column (then counted in a sketch). */
export const DISTINCT_CAP = 100_000;
/** Size of the uniform reservoir sample (Vitter's algorithm R) kept once the cap is passed. */
export const RESERVOIR_SIZE = 1_024;

/** One distinct value: its key (epoch ms for instants, wall-clock ms otherwise) and its first row. */
export interface StoredValue extends TimedValue {
  /** Wall-clock ms as written: ms plus the written offset for instants, ms itself otherwise. */
  wall: number;
}

export class DistinctStore {
  /** Exact distinct values in order of first appearance; null once the cap was passed. */
  table: ValueTable | null = new ValueTable();
  /** Counter of the as-written wall clock, started when the cap is passed. */
  stream: BoundaryCounter | null = null;
  sketch: HyperLogLog | null = null;
  reservoir: StoredValue[] = [];
  private seen = 0;
  private rng = 0x2545f491;

  constructor(private readonly cap = DISTINCT_CAP) {}

  /** The exact distinct values in order of first appearance (made on each call), or null past the cap. */
  get values(): StoredValue[] | null {
    return this.table === null ? null : this.table.values();
  }

  /** Adds one parsed value, on line `line`; its text is row `i` of `src`, made only where it is kept. */
  add(ms: number, offset: number, line: number, src: TextAt, i: number): void {
    const table = this.table;
    if (table !== null) {
      if (table.add(ms, offset, line, src, i, this.cap) !== 'full') return;
      this.overflow(table);
    }
    const wall = offset !== offset ? ms : ms + offset * 60_000;
    this.stream!.addRow(wall, line, src, i);
    this.sketch!.addNumber(ms);
    const slot = this.slot();
    if (slot >= 0) this.reservoir[slot] = { ms, offset, weight: 1, line, text: src.text(i), wall };
  }

  /** `add` of every value of `p`, in order. */
  addRows(p: ParsedRows): void {
    let from = 0;
    const table = this.table;
    if (table !== null) {
      from = table.addRows(p, 0, this.cap);
      if (from === p.length) return;
      this.overflow(table);
    }
    this.stream!.addRows(p, from);
    const sketch = this.sketch!;
    const ms = p.ms;
    const n = p.length;
    for (let j = from; j < n; j++) sketch.addNumber(ms[j]!);
    for (let j = from; j < n; j++) {
      const slot = this.slot();
      if (slot < 0) continue;
      const row = p.row[j]!;
      this.reservoir[slot] = { ms: ms[j]!, offset: p.offset[j]!, weight: 1, line: p.lines[row]!, text: p.at.text(row), wall: p.wall[j]! };
    }
  }

  /** Exact number of distinct values, or the sketch's estimate past the cap. */
  distinctCount(): { count: number; exact: boolean } {
    if (this.table !== null) return { count: this.table.size, exact: true };
    return { count: this.sketch!.estimate(), exact: false };
  }

  private overflow(table: ValueTable): void {
    const stream = new BoundaryCounter();
    const sketch = new HyperLogLog();
    table.forEach((ms, offset, weight, line, text, wall) => {
      stream.add(wall, weight, false, line, text);
      sketch.addNumber(ms);
      for (let i = 0; i < weight; i++) {
        const slot = this.slot();
        if (slot >= 0) this.reservoir[slot] = { ms, offset, weight: 1, line, text, wall };
      }
    });
    this.stream = stream;
    this.sketch = sketch;
    this.table = null;
  }

  /** Reservoir slot for the next row (Vitter's algorithm R), or -1 when the row is not kept. */
  private slot(): number {
    const seen = (this.seen + 1) >>> 0;
    this.seen = seen;
    if (this.reservoir.length < RESERVOIR_SIZE) return this.reservoir.length;
    const j = this.random() % seen; // both unsigned 32-bit: an integer remainder
    return j < RESERVOIR_SIZE ? j : -1;
  }

  /** xorshift32: a fixed-seed generator, so runs are repeatable. */
  private random(): number {
    let x = this.rng;
    x ^= x << 13;
    x ^= x >>> 17;
    x ^= x << 5;
    this.rng = x | 0; // the same 32 bits, kept as a small integer
    return x >>> 0;
  }
}
