// Rebin's instant tally: for a count with no groups and no measures, the rows whose time is an ISO 8601
// instant (Z or an offset) are counted into their periods in WebAssembly (instant-tally.wat), straight from
// the record kernel's output, with no batch, no JavaScript per row and no string. Every other row (a date,
// a wall-clock time, another shape, a ragged row, an instant outside the table of periods) takes the
// ordinary path of RebinScan.bytes, so the result is the same row for row: the counts add up in the same
// cells, and the extremes (the first and last period, with the line and text of the first row in each)
// are merged by period and then line, which is the order the ordinary path keeps.
//
// The table holds the starts of up to 32,767 consecutive periods, from the calendar (cal.startOf), so a
// period there is exactly cal.index's. It is laid around the first instant met and grown, or moved once
// it has counted as many rows as it holds periods (each move flushes its counts into the cell store).
import type { Calendar } from '../calendar/types.js';
import { asciiString } from '../table/ascii.js';
import { wasmApi, type KernelTally, type RecordKernel } from '../table/structurals.js';
import type { CellStore } from './accumulate.js';
import type { KeyExtremes } from './fill.js';
import { emptyExtremes } from './fill.js';
import { INSTANT_TALLY_WASM } from './instant-tally-wasm.js';

/** Most periods the table holds, and where TALLY, STARTS and COUNTS lie in the kernel's memory. */
export const MAX_TALLY_PERIODS = 32_767;
const TALLY = 5_242_880;
const STARTS = TALLY + 128;
const COUNTS = TALLY + 262_272;
/** i32 slots of TALLY (byte offset / 4) and f64 slots (byte offset / 8). */
const I_INDEX = 4, I_PERIODS = 5, I_MIN = 6, I_MIN_REC = 7, I_MAX = 8, I_MAX_REC = 9, I_WHY = 10, I_NOTED = 11, I_OFFSETS = 12;
const I_MEMO_TAIL = 20;
const F_LO = 0, F_HI = 1, F_MISS = 8;
/** Why `tally` stopped (TALLY+40). */
const enum Why { Done = 0, Shape = 1, Outside = 2, NewOffset = 3, Width = 4 }
/** Offsets noted once every offset is taken (the scan notes no more than four). */
const EVERY_OFFSET = 5;
/** Periods laid on each side of the first instant, and the refusals after which the tally stops. */
const MARGIN = 64;
const REFUSALS = 256;

/** One thread's tally module, on its kernel's memory, and the tally whose table is loaded. */
interface TallyModule {
  tally(from: number, n: number, stride: number, field: number, base: number, width: number): number;
  i32: Int32Array;
  f64: Float64Array;
  starts: Float64Array;
  counts: Float64Array;
  owner: InstantTally | null;
}

const modules = new WeakMap<RecordKernel, TallyModule | null>();

/** The tally module of `kernel`'s thread, made on first use; null where it cannot be made. */
function tallyModule(kernel: RecordKernel): TallyModule | null {
  let m = modules.get(kernel);
  if (m !== undefined) return m;
  try {
    const wasm = wasmApi()!;
    const instance = new wasm.Instance(new wasm.Module(Buffer.from(INSTANT_TALLY_WASM, 'base64')), { kernel: { memory: kernel.memory } });
    const memory = (kernel.memory as { buffer: ArrayBuffer }).buffer;
    m = {
      tally: instance.exports['tally'] as TallyModule['tally'],
      i32: new Int32Array(memory, TALLY, 32),
      f64: new Float64Array(memory, TALLY, 16),
      starts: new Float64Array(memory, STARTS, MAX_TALLY_PERIODS + 1),
      counts: new Float64Array(memory, COUNTS, MAX_TALLY_PERIODS),
      owner: null,
    };
  } catch {
    m = null;
  }
  modules.set(kernel, m);
  return m;
}

/** What the scan must let the tally count: its calendar, cells, key bounds and noted offsets. */
export interface TallyScope {
  cal: Calendar;
  store: CellStore;
  fromKey: number;
  untilKey: number;
  /** The scan's distinct written offsets: an instant with an offset not yet among them is left to the scan. */
  offsets: Set<number>;
}

/** Counts instants into the periods of one rebin scan (see the file's comment). */
export class InstantTally implements KernelTally {
  active = true;
  /** Rows counted, and the extremes of their periods. */
  used = 0;
  readonly extremes: KeyExtremes = emptyExtremes();
  /** Key of the table's first period, its periods, and their starts (loaded into the module when it owns it). */
  private first = 0;
  private periods = 0;
  private starts = new Float64Array(0);
  /** Rows counted since the table was last laid, and records refused. */
  private sinceLaid = 0;
  private refused = 0;
  private module: TallyModule | null = null;

  constructor(private readonly scope: TallyScope) {}

  take(kernel: RecordKernel, buf: Buffer, from: number, n: number, stride: number, slot: number, base: number, line: number, width = -1): number {
    const m = this.module ?? (this.module = tallyModule(kernel));
    if (m === null) {
      this.active = false;
      return from;
    }
    if (m.owner !== this) this.load(m);
    this.noteOffsets(m);
    let r = from;
    for (;;) {
      const t = m.tally(r, n, stride, 8 + 8 * slot, base, width);
      if (t > r) this.counted(m, kernel.output, buf, r, t, stride, slot, line + (r - from));
      if (t >= n) return t;
      const why = m.i32[I_WHY];
      // Not a whole row: the reader's to read, and no refusal of the tally's.
      if (why === Why.Width) return t;
      if (why === Why.Outside && this.lay(m, m.f64[F_MISS]!)) {
        r = t;
        continue;
      }
      if (++this.refused >= REFUSALS && this.refused * 16 > this.used) this.active = false;
      return t;
    }
  }

  /**
   * Ends the tally: its counts go into the store and its extremes and rows into the scan's (by period,
   * then line, as the ordinary path would have kept them).
   */
  finish(x: KeyExtremes): number {
    const m = this.module;
    if (m !== null && m.owner === this) {
      this.flush(m);
      m.owner = null;
    }
    const y = this.extremes;
    if (y.minKey < x.minKey || (y.minKey === x.minKey && y.minLine < x.minLine)) {
      x.minKey = y.minKey;
      x.minLine = y.minLine;
      x.minText = y.minText;
    }
    if (y.maxKey > x.maxKey || (y.maxKey === x.maxKey && y.maxLine < x.maxLine)) {
      x.maxKey = y.maxKey;
      x.maxLine = y.maxLine;
      x.maxText = y.maxText;
    }
    this.active = false;
    return this.used;
  }

  /** Rows r..t-1 were counted (record r on `line`): their number, and the extremes of this call. */
  private counted(m: TallyModule, output: Int32Array, buf: Buffer, r: number, t: number, stride: number, slot: number, line: number): void {
    this.used += t - r;
    this.sinceLaid += t - r;
    const x = this.extremes;
    const lo = m.i32[I_MIN]!;
    const hi = m.i32[I_MAX]!;
    // Within one call the first record of each extreme period is kept; across calls by period, then line.
    const minKey = this.first + lo;
    const minLine = line + (m.i32[I_MIN_REC]! - r);
    if (minKey < x.minKey || (minKey === x.minKey && minLine < x.minLine)) {
      x.minKey = minKey;
      x.minLine = minLine;
      x.minText = fieldText(output, buf, m.i32[I_MIN_REC]!, stride, slot);
    }
    const maxKey = this.first + hi;
    const maxLine = line + (m.i32[I_MAX_REC]! - r);
    if (maxKey > x.maxKey || (maxKey === x.maxKey && maxLine < x.maxLine)) {
      x.maxKey = maxKey;
      x.maxLine = maxLine;
      x.maxText = fieldText(output, buf, m.i32[I_MAX_REC]!, stride, slot);
    }
  }

  /** The scan's noted offsets, for the module: an instant with another offset is left to the scan. */
  private noteOffsets(m: TallyModule): void {
    const offsets = this.scope.offsets;
    if (offsets.size >= 4) {
      m.i32[I_NOTED] = EVERY_OFFSET;
      return;
    }
    let k = 0;
    for (const o of offsets) m.i32[I_OFFSETS + k++] = o;
    m.i32[I_NOTED] = k;
  }

  /**
   * Lays the table so that it holds the period of `ms`, when that period is inside the scan's key bounds:
   * grown to it while the whole stays within MAX_TALLY_PERIODS, else moved to it once the table has counted
   * as many rows as it holds periods (so laying it costs at most a few operations a row). False leaves the
   * instant to the scan.
   */
  private lay(m: TallyModule, ms: number): boolean {
    const { cal, fromKey, untilKey } = this.scope;
    const key = cal.index(ms);
    if (!(key >= fromKey && key <= untilKey)) return false;
    let lo: number;
    let hi: number;
    if (this.periods === 0) {
      lo = key - MARGIN;
      hi = key + MARGIN;
    } else {
      const last = this.first + this.periods - 1;
      // Grown by at least its own length on the side of the new key.
      lo = key < this.first ? Math.min(key, this.first - this.periods) - MARGIN : this.first;
      hi = key > last ? Math.max(key, last + this.periods) + MARGIN : last;
      if (hi - lo + 1 > MAX_TALLY_PERIODS) {
        // Periods it holds would be dropped: only once it has counted as many rows as it holds periods.
        if (this.sinceLaid < this.periods) return false;
        if (key - this.first >= MAX_TALLY_PERIODS || last - key >= MAX_TALLY_PERIODS) {
          lo = key - MARGIN;
          hi = key + MARGIN;
        } else if (key > last) lo = hi - MAX_TALLY_PERIODS + 1;
        else hi = lo + MAX_TALLY_PERIODS - 1;
      }
    }
    lo = Math.max(lo, fromKey);
    hi = Math.min(hi, untilKey);
    this.flush(m);
    const n = hi - lo + 1;
    const starts = new Float64Array(n + 1);
    for (let i = 0; i <= n; i++) starts[i] = cal.startOf(lo + i);
    this.first = lo;
    this.periods = n;
    this.starts = starts;
    this.sinceLaid = 0;
    this.load(m);
    return true;
  }

  /** Makes this tally's table the module's: the last owner's counts are flushed into its store first. */
  private load(m: TallyModule): void {
    if (m.owner !== null && m.owner !== this) m.owner.flush(m);
    m.owner = this;
    m.starts.set(this.starts);
    m.counts.fill(0, 0, this.periods);
    m.i32[I_PERIODS] = this.periods;
    m.i32[I_INDEX] = 0;
    m.f64[F_LO] = Infinity;
    m.f64[F_HI] = -Infinity;
    // No date remembered (a memo of zero bytes would match a field of NUL bytes).
    m.i32[I_MEMO_TAIL] = -1;
  }

  /** Adds the table's counts to the store's cells and clears them (the table stays loaded). */
  private flush(m: TallyModule): void {
    if (m.owner !== this) return;
    const { store } = this.scope;
    const counts = m.counts;
    for (let i = 0; i < this.periods; i++) {
      const c = counts[i]!;
      if (c === 0) continue;
      const cell = store.cell(0, this.first + i);
      store.count[cell] += c;
      counts[i] = 0;
    }
  }
}

/** The text of the tally's field in record r: ASCII, since the module read it as an instant. */
function fieldText(output: Int32Array, buf: Buffer, r: number, stride: number, slot: number): string {
  const o = r * stride + 2 + 2 * slot;
  return asciiString(buf, output[o]!, output[o + 1]!);
}
