// Streaming accumulators: one slot ("cell") per (group, period key), held in growable typed arrays so the
// hot path makes no per-row objects. Sums use Neumaier's compensated summation (Neumaier 1974, "Rundungs-
// fehleranalyse einiger Verfahren zur Summation endlicher Summen", ZAMM 54:39–51), exact medians and
// quantiles keep each cell's values in a Float64Array, distinct counts keep each cell's values in a Set.
import { QuernError } from '../errors.js';

/** What each measure column needs kept. */
export interface MeasureNeeds {
  /** sum, mean, min, max: compensated sum, value count, min and max. */
  numbers: boolean;
  /** median and quantiles: every value, per cell. */
  buffer: boolean;
  /** distinct: every distinct text, per cell. */
  distinct: boolean;
}

/** Limits that keep memory bounded; over them quern stops with E_DATA and a hint. */
export interface AccumulatorLimits {
  /** Values kept for exact medians and quantiles, all cells together; default 20,000,000 (160 MB). */
  maxBuffered: number;
  /** Distinct texts kept for distinct counts, all cells together; default 2,000,000. */
  maxDistinct: number;
}

export const DEFAULT_LIMITS: AccumulatorLimits = { maxBuffered: 20_000_000, maxDistinct: 2_000_000 };

/** Per-measure state, indexed by cell. */
export interface MeasureSlots {
  /** Weighted number of non-empty values (for `count:COL`). */
  present: Float64Array;
  /** Number of valid numbers (for mean). */
  n: Float64Array;
  sum: Float64Array;
  /** Neumaier compensation term of `sum`. */
  comp: Float64Array;
  min: Float64Array;
  max: Float64Array;
  buffers: (Float64Array | undefined)[];
  lengths: Int32Array;
  distinct: (Set<string> | undefined)[];
}

/** One measure's cells as plain data (see CellStore.toPartial). */
export interface MeasurePartial {
  present: Float64Array;
  n: Float64Array;
  sum: Float64Array;
  comp: Float64Array;
  min: Float64Array;
  max: Float64Array;
  /** Values kept per cell for medians and quantiles (null: none). */
  values: (Float64Array | null)[];
  /** Distinct texts per cell, in first-seen order (null: none). */
  distinct: (string[] | null)[];
}

/** A store's cells as plain, structured-clonable data: cell i is (group[i], key[i]). */
export interface StorePartial {
  size: number;
  group: Int32Array;
  key: Float64Array;
  count: Float64Array;
  measures: MeasurePartial[];
}

/** The cells of one rebin: (group, period key) → cell, and the per-cell state. */
export class CellStore {
  /** Number of cells in use. */
  size = 0;
  /** Weighted row count per cell. */
  count: Float64Array = new Float64Array(64);
  /** Group id and period key of each cell. */
  group: Int32Array = new Int32Array(64);
  key: Float64Array = new Float64Array(64);
  readonly measures: MeasureSlots[];
  private readonly needs: readonly MeasureNeeds[];
  private readonly byGroup: Map<number, number>[] = [];
  private readonly limits: AccumulatorLimits;
  private buffered = 0;
  private distinctTotal = 0;
  private lastGroup = -1;
  private lastKey = NaN;
  private lastCell = -1;

  constructor(needs: readonly MeasureNeeds[], limits: AccumulatorLimits = DEFAULT_LIMITS) {
    this.needs = needs;
    this.limits = limits;
    this.measures = needs.map(() => makeSlots(64));
  }

  /** The cell of (group, period key), created on first use. */
  cell(groupId: number, key: number): number {
    if (groupId === this.lastGroup && key === this.lastKey) return this.lastCell;
    let map = this.byGroup[groupId];
    if (map === undefined) {
      map = new Map();
      this.byGroup[groupId] = map;
    }
    let c = map.get(key);
    if (c === undefined) {
      c = this.size++;
      if (c >= this.count.length) this.grow();
      this.group[c] = groupId;
      this.key[c] = key;
      for (const m of this.measures) {
        m.min[c] = Infinity;
        m.max[c] = -Infinity;
      }
      map.set(key, c);
    }
    this.lastGroup = groupId;
    this.lastKey = key;
    this.lastCell = c;
    return c;
  }

  /** The cell of (group, period key), or -1 when no row fell there. */
  find(groupId: number, key: number): number {
    return this.byGroup[groupId]?.get(key) ?? -1;
  }

  /** Adds one number `x` of measure `m` with weight `w` (1, or a day share when apportioning). */
  addNumber(c: number, m: number, x: number, w: number): void {
    const s = this.measures[m]!;
    s.n[c] += 1;
    // Neumaier: keep the low-order bits lost when adding numbers of different magnitude.
    const v = x * w;
    const t = s.sum[c]! + v;
    s.comp[c] += Math.abs(s.sum[c]!) >= Math.abs(v) ? s.sum[c]! - t + v : v - t + s.sum[c]!;
    s.sum[c] = t;
    if (x < s.min[c]!) s.min[c] = x;
    if (x > s.max[c]!) s.max[c] = x;
    if (this.needs[m]!.buffer) this.push(s, c, x);
  }

  /** Adds one distinct text of measure `m`. */
  addDistinct(c: number, m: number, text: string): void {
    const s = this.measures[m]!;
    let set = s.distinct[c];
    if (set === undefined) {
      set = new Set();
      s.distinct[c] = set;
    }
    if (set.has(text)) return;
    if (++this.distinctTotal > this.limits.maxDistinct) {
      throw new QuernError('E_DATA', `distinct counts need more than ${this.limits.maxDistinct.toLocaleString('en-US')} distinct values kept`,
        'a distinct count is exact, so every value is kept per period: use a coarser unit, fewer groups, or raise --max-distinct');
    }
    set.add(text);
  }

  /** The cells as plain (structured-clonable) data, for the merge of a parallel rebin. */
  toPartial(): StorePartial {
    const n = this.size;
    return {
      size: n, group: this.group.slice(0, n), key: this.key.slice(0, n), count: this.count.slice(0, n),
      measures: this.measures.map((s) => ({
        present: s.present.slice(0, n), n: s.n.slice(0, n), sum: s.sum.slice(0, n), comp: s.comp.slice(0, n),
        min: s.min.slice(0, n), max: s.max.slice(0, n),
        values: Array.from({ length: n }, (_, c) => s.buffers[c]?.slice(0, s.lengths[c]) ?? null),
        distinct: Array.from({ length: n }, (_, c) => (s.distinct[c] === undefined ? null : [...s.distinct[c]!])),
      })),
    };
  }

  /**
   * Adds the cells of `p` (another store's, over other rows), its group ids mapped by `groupOf`: counts,
   * compensated sums (the two parts joined by an error-free two-sum, Knuth TAOCP vol. 2 §4.2.2), min, max,
   * kept values and distinct texts, with the limits checked as if the rows had been added here.
   */
  mergePartial(p: StorePartial, groupOf: (id: number) => number): void {
    for (let i = 0; i < p.size; i++) {
      const c = this.cell(groupOf(p.group[i]!), p.key[i]!);
      this.count[c] += p.count[i]!;
      for (let m = 0; m < this.measures.length; m++) this.mergeMeasure(c, m, p.measures[m]!, i);
    }
  }

  private mergeMeasure(c: number, m: number, o: MeasurePartial, i: number): void {
    const s = this.measures[m]!;
    s.present[c] += o.present[i]!;
    s.n[c] += o.n[i]!;
    const a = s.sum[c]!;
    const b = o.sum[i]!;
    const t = a + b;
    s.comp[c] += (Math.abs(a) >= Math.abs(b) ? a - t + b : b - t + a) + o.comp[i]!;
    s.sum[c] = t;
    if (o.min[i]! < s.min[c]!) s.min[c] = o.min[i]!;
    if (o.max[i]! > s.max[c]!) s.max[c] = o.max[i]!;
    const values = o.values[i];
    if (values != null) for (let k = 0; k < values.length; k++) this.push(s, c, values[k]!);
    const texts = o.distinct[i];
    if (texts != null) for (const text of texts) this.addDistinct(c, m, text);
  }

  /** The compensated sum of measure `m` in cell `c`. */
  sumOf(c: number, m: number): number {
    const s = this.measures[m]!;
    return s.sum[c]! + s.comp[c]!;
  }

  /** The values of measure `m` kept in cell `c`, sorted ascending (sorts quern's own buffer in place). */
  sortedValues(c: number, m: number): Float64Array {
    const s = this.measures[m]!;
    const buf = s.buffers[c];
    if (buf === undefined) return new Float64Array(0);
    const view = buf.subarray(0, s.lengths[c]);
    view.sort();
    return view;
  }

  /** The group ids seen, each with its period keys → cells. */
  groups(): ReadonlyArray<Map<number, number> | undefined> {
    return this.byGroup;
  }

  private push(s: MeasureSlots, c: number, x: number): void {
    if (++this.buffered > this.limits.maxBuffered) {
      throw new QuernError('E_DATA', `exact medians and quantiles need more than ${this.limits.maxBuffered.toLocaleString('en-US')} values kept`,
        'they keep every value of a period: use a coarser unit, fewer groups, or raise --max-buffered');
    }
    let buf = s.buffers[c];
    const len = s.lengths[c]!;
    if (buf === undefined) {
      buf = new Float64Array(16);
      s.buffers[c] = buf;
    } else if (len === buf.length) {
      const bigger = new Float64Array(len * 2);
      bigger.set(buf);
      buf = bigger;
      s.buffers[c] = buf;
    }
    buf[len] = x;
    s.lengths[c] = len + 1;
  }

  private grow(): void {
    const n = this.count.length * 2;
    this.count = growF(this.count, n);
    this.key = growF(this.key, n);
    const g = new Int32Array(n);
    g.set(this.group);
    this.group = g;
    for (let i = 0; i < this.measures.length; i++) this.measures[i] = growSlots(this.measures[i]!, n);
  }
}

function makeSlots(n: number): MeasureSlots {
  return {
    present: new Float64Array(n), n: new Float64Array(n), sum: new Float64Array(n), comp: new Float64Array(n),
    min: new Float64Array(n), max: new Float64Array(n), buffers: [], lengths: new Int32Array(n), distinct: [],
  };
}

function growSlots(s: MeasureSlots, n: number): MeasureSlots {
  const lengths = new Int32Array(n);
  lengths.set(s.lengths);
  return {
    present: growF(s.present, n), n: growF(s.n, n), sum: growF(s.sum, n), comp: growF(s.comp, n),
    min: growF(s.min, n), max: growF(s.max, n), buffers: s.buffers, lengths, distinct: s.distinct,
  };
}

function growF(a: Float64Array, n: number): Float64Array {
  const b = new Float64Array(n);
  b.set(a);
  return b;
}
