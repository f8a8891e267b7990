// The exact distinct values of one date column, in typed arrays: open addressing with linear probing on the
// 32-bit hash of the value's epoch milliseconds (hll.ts). No object per distinct value while the file streams;
// the StoredValue records the analysis reads are made once, at the end.
import { hashNumber } from '../profile/hll.js';
import type { ParsedRows } from './parsed-rows.js';
import type { StoredValue } from './store.js';
import type { TextAt } from './text-at.js';

export class ValueTable {
  size = 0;
  private ms = new Float64Array(256);
  private offset = new Float64Array(256);
  private weight = new Float64Array(256);
  private line = new Float64Array(256);
  private text: string[] = [];
  /** Entry index + 1 (0 = empty); kept at most half full. */
  private slots = new Int32Array(512);
  /** Entry of the last value added: runs of equal values (sorted files, dates) skip the probe. */
  private last = -1;

  /**
   * Adds one row of `ms`: counted on its entry, added as a new entry while `size < cap`, else 'full'. The
   * text of row `row` of `src` is made only for a new entry.
   */
  add(ms: number, offset: number, line: number, src: TextAt, row: number, cap: number): 'counted' | 'added' | 'full' {
    const last = this.last;
    if (last >= 0 && this.ms[last] === ms) {
      this.weight[last] += 1;
      return 'counted';
    }
    const mask = this.slots.length - 1;
    let i = hashNumber(ms) & mask;
    for (;;) {
      const e = this.slots[i]!;
      if (e === 0) break;
      if (this.ms[e - 1] === ms) {
        this.weight[e - 1] += 1;
        this.last = e - 1;
        return 'counted';
      }
      i = (i + 1) & mask;
    }
    if (this.size >= cap) return 'full';
    this.append(ms, offset, line, src.text(row), i);
    return 'added';
  }

  /**
   * `add` of the values [from, p.length) of `p` in order; returns the index of the first value that is
   * 'full' (p.length when none is).
   */
  addRows(p: ParsedRows, from: number, cap: number): number {
    const msOf = p.ms;
    const n = p.length;
    for (let j = from; j < n; j++) {
      const ms = msOf[j]!;
      const last = this.last;
      if (last >= 0 && this.ms[last] === ms) {
        this.weight[last] += 1;
        continue;
      }
      const slots = this.slots;
      const mask = slots.length - 1;
      let i = hashNumber(ms) & mask;
      let e = slots[i]!;
      while (e !== 0 && this.ms[e - 1] !== ms) {
        i = (i + 1) & mask;
        e = slots[i]!;
      }
      if (e !== 0) {
        this.weight[e - 1] += 1;
        this.last = e - 1;
        continue;
      }
      if (this.size >= cap) return j;
      const row = p.row[j]!;
      this.append(ms, p.offset[j]!, p.lines[row]!, p.at.text(row), i);
    }
    return n;
  }

  private append(ms: number, offset: number, line: number, text: string, slot: number): void {
    const n = this.size++;
    if (n === this.ms.length) this.grow();
    this.ms[n] = ms;
    this.offset[n] = offset;
    this.weight[n] = 1;
    this.line[n] = line;
    this.text[n] = text;
    this.slots[slot] = n + 1;
    this.last = n;
    if (2 * this.size > this.slots.length) this.rehash();
  }

  /** Calls `visit` with each distinct value in order of first appearance, making no object per value. */
  forEach(visit: (ms: number, offset: number, weight: number, line: number, text: string, wall: number) => void): void {
    for (let e = 0; e < this.size; e++) {
      const ms = this.ms[e]!;
      const offset = this.offset[e]!;
      visit(ms, offset, this.weight[e]!, this.line[e]!, this.text[e]!, Number.isNaN(offset) ? ms : ms + offset * 60_000);
    }
  }

  /** The distinct values in order of first appearance, with their rows. */
  values(): StoredValue[] {
    const out: StoredValue[] = [];
    this.forEach((ms, offset, weight, line, text, wall) => out.push({ ms, offset, weight, line, text, wall }));
    return out;
  }

  private grow(): void {
    const twice = (a: Float64Array): Float64Array<ArrayBuffer> => {
      const b = new Float64Array(a.length * 2);
      b.set(a);
      return b;
    };
    this.ms = twice(this.ms);
    this.offset = twice(this.offset);
    this.weight = twice(this.weight);
    this.line = twice(this.line);
  }

  private rehash(): void {
    const slots = new Int32Array(this.slots.length * 2);
    const mask = slots.length - 1;
    for (let e = 0; e < this.size; e++) {
      let i = hashNumber(this.ms[e]!) & mask;
      while (slots[i] !== 0) i = (i + 1) & mask;
      slots[i] = e + 1;
    }
    this.slots = slots;
  }
}
