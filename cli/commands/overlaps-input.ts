// Reading ranges for `quern overlaps`: from start and end columns, from one column of labels, or from a
// bucket spec; every row read becomes a range or a counted rejection with its line and reason. Rows are
// read batch by batch into typed columns (ends, lines, key ids): no row keeps a string, except the rare
// row whose text does not come back from its range (kept as bytes), so a million ranges stay small.
import {
  DISCRETE, HIGH_CLOSED, IntColumn, LOW_CLOSED, QuernError, RangeColumnsBuilder, emptyParsedNumber, formatRange, inferNumberFormat,
  makeNumberParser, parseRangeLabel, rangeAt, rangeFromEndpoints, tryParseNumericRange, bucketsFromSpec,
} from '../../src/index.js';
import type { EndsRule, InferHints, Range, RangeColumns, TableReader } from '../../src/index.js';
import { makeTimeReaders, type TimeReaders } from './overlaps-time.js';

export type RangeSource = { kind: 'start-end'; start: string; end: string } | { kind: 'range'; column: string } | { kind: 'spec'; spec: unknown };

export interface RangeRows {
  /** The ranges, as typed columns. */
  ranges: RangeColumns;
  /** Line of range i (the order index for a spec). */
  lines: Uint32Array;
  /** Key id of range i: its key is keyNames[keys[i]] ('' without --by). Ids follow first appearance. */
  keys: Uint32Array;
  keyNames: string[];
  /** True when every range is discrete (whole numbers), and when there is none. */
  allDiscrete: boolean;
  /** Range i as a record. */
  range(i: number): Range;
  /** The range of row i as written (label, or start/end), made on demand so a million rows keep no strings. */
  text(i: number): string;
  kind: 'number' | 'time';
  /** How the ends were read, in words. */
  ends: string;
  rowsRead: number;
  rejected: { count: number; byReason: Record<string, number>; examples: Array<{ line: number; value: string; reason: string }> };
  time: TimeReaders | null;
}

/** Texts of a few rows, as UTF-8 bytes in one growing buffer, looked up by row (rows put in increasing order). */
class TextStore {
  private rows = new IntColumn(16);
  private offsets = new IntColumn(16);
  private bytes = Buffer.alloc(1024);
  private used = 0;
  put(row: number, text: string): void {
    const need = Buffer.byteLength(text);
    if (this.used + need > this.bytes.length) {
      const b = Buffer.alloc(Math.max(this.bytes.length * 2, this.used + need));
      this.bytes.copy(b, 0, 0, this.used);
      this.bytes = b;
    }
    this.rows.push(row); this.offsets.push(this.used);
    this.used += this.bytes.write(text, this.used);
  }
  get(row: number): string | undefined {
    let lo = 0, hi = this.rows.length - 1;
    while (lo <= hi) {
      const mid = (lo + hi) >> 1, r = this.rows.get(mid);
      if (r === row) return this.bytes.toString('utf8', this.offsets.get(mid), mid + 1 < this.rows.length ? this.offsets.get(mid + 1) : this.used);
      if (r < row) lo = mid + 1; else hi = mid - 1;
    }
    return undefined;
  }
}

/** A growable column of doubles. */
class FloatColumn {
  length = 0;
  data = new Float64Array(1024);
  push(x: number): void {
    if (this.length === this.data.length) { const d = new Float64Array(this.data.length * 2); d.set(this.data); this.data = d; }
    this.data[this.length++] = x;
  }
}

/** What every reading mode fills: the columns, the rejections, the keys. */
class Collector {
  cols = new RangeColumnsBuilder(1 << 14);
  lines = new IntColumn(1 << 14);
  keyIds = new IntColumn(1 << 14);
  keyNames: string[] = [];
  private keyIndex = new Map<string, number>();
  texts = new TextStore();
  rejectedCount = 0;
  private reasons: Record<string, number> = {};
  examples: Array<{ line: number; value: string; reason: string }> = [];

  add(low: number | null, high: number | null, flags: number, line: number, key: string): number {
    let id = this.keyIndex.get(key);
    if (id === undefined) { id = this.keyNames.length; this.keyIndex.set(key, id); this.keyNames.push(key); }
    this.keyIds.push(id); this.lines.push(line);
    return this.cols.pushParts(low, high, flags);
  }
  reject(line: number, value: string, reason: string): void {
    this.rejectedCount++;
    this.reasons[reason] = (this.reasons[reason] ?? 0) + 1;
    if (this.examples.length < 5) this.examples.push({ line, value: value.slice(0, 80), reason });
  }
  /** The rows read, with the table's own rejections counted first (as the table reader gives them). */
  finish(rest: Pick<RangeRows, 'kind' | 'ends' | 'time' | 'text'>, rowsRead: number, table: Record<string, number>): RangeRows {
    const byReason: Record<string, number> = { ...table };
    for (const [k, v] of Object.entries(this.reasons)) byReason[k] = (byReason[k] ?? 0) + v;
    const count = Object.values(table).reduce((x, y) => x + y, 0) + this.rejectedCount;
    const cols = this.cols;
    let allDiscrete = true;
    for (let i = 0; i < cols.length; i++) if ((cols.flags[i]! & DISCRETE) === 0) { allDiscrete = false; break; }
    return {
      ranges: cols, lines: this.lines.data.subarray(0, this.lines.length), keys: this.keyIds.data.subarray(0, this.keyIds.length), keyNames: this.keyNames,
      allDiscrete, range: (i) => rangeAt(cols, i), rowsRead, rejected: { count, byReason, examples: this.examples }, ...rest,
    };
  }
}

/** One reading mode: takes rows one by one, then finishes into the rows' description. */
interface Mode {
  row(a: string, b: string, line: number, key: string): void;
  finish(): Pick<RangeRows, 'kind' | 'ends' | 'time' | 'text'>;
}

/** Start and end columns holding numbers: integers are whole-number ranges (both ends inclusive) under auto. */
function numericStartEnd(c: Collector, sample: string[], ends: EndsRule): Mode {
  const p = makeNumberParser(inferNumberFormat(sample).format);
  const out = emptyParsedNumber();
  let ints = true;
  return {
    row(sa, sb, line, key) {
      const text = () => `${sa.trim()}/${sb.trim()}`;
      if (p.parse(sa, out) !== 'ok') { c.reject(line, text(), out.status === 'empty' ? 'empty-start' : 'invalid-start'); return; }
      const a = out.value;
      if (p.parse(sb, out) !== 'ok') { c.reject(line, text(), out.status === 'empty' ? 'empty-end' : 'invalid-end'); return; }
      if (out.value < a) { c.reject(line, text(), 'reversed-range'); return; }
      c.add(a, out.value, 0, line, key);
      if (ints && !(Number.isInteger(a) && Number.isInteger(out.value))) ints = false;
    },
    finish() {
      const discrete = ends === 'discrete' || (ends === 'auto' && ints);
      if (ends === 'discrete' && !ints) throw new QuernError('E_DATA', '--ends discrete needs whole numbers in the start and end columns');
      // discreteRange(a, b) is [a, b + 1); makeRange(a, b, …) keeps the ends with the rule's closedness.
      const cols = c.cols;
      const flags = discrete ? LOW_CLOSED | DISCRETE : (ends !== 'open-closed' ? LOW_CLOSED : 0) | (ends === 'closed' || ends === 'open-closed' ? HIGH_CLOSED : 0);
      for (let i = 0; i < cols.length; i++) {
        cols.flags[i] = flags;
        if (discrete) { const h = cols.high[i]! + 1; cols.high[i] = h === 0 ? 0 : h; }
      }
      const words = discrete ? 'whole numbers, both ends inclusive' : ends === 'closed' ? 'closed [start, end]' : ends === 'open-closed' ? '(start, end]' : 'half-open [start, end)';
      return { kind: 'number', ends: words, time: null, text: (i) => formatRange(rangeAt(cols, i)) };
    },
  };
}

/** Start and end columns holding dates or date-times. */
function timeStartEnd(c: Collector, ends: EndsRule, hints: InferHints): Mode {
  const time = makeTimeReaders(hints);
  let whole = 0, instants = 0;
  const starts = new FloatColumn(), stops = new FloatColumn();
  const derived = (a: number, b: number) => `${time.formatPoint(a)}/${time.formatPoint(b)}`;
  return {
    row(sa, sb, line, key) {
      const ta = sa.trim(), tb = sb.trim();
      const text = `${ta}/${tb}`;
      if (ta === '' || tb === '') { c.reject(line, text, ta === '' ? 'empty-start' : 'empty-end'); return; }
      const a = time.read(sa);
      const b = a === null ? null : time.read(sb);
      if (a === null || b === null) { c.reject(line, text, a === null ? 'invalid-start' : 'invalid-end'); return; }
      const r = rangeFromEndpoints(a, b, ends);
      if (r === null) { c.reject(line, text, 'reversed-range'); return; }
      if (b.whole) whole++; else instants++;
      const i = c.add(r.low, r.high, (r.lowClosed ? LOW_CLOSED : 0) | (r.highClosed ? HIGH_CLOSED : 0), line, key);
      starts.push(a.start); stops.push(b.start);
      if (derived(a.start, b.start) !== text) c.texts.put(i, text);
    },
    finish() {
      const words = ends === 'half-open' ? 'half-open [start, end)' : whole >= instants ? 'whole days (or periods), both ends inclusive' : ends === 'closed' ? 'closed [start, end]' : 'date-times, half-open [start, end)';
      return { kind: 'time', ends: words, time, text: (i) => c.texts.get(i) ?? derived(starts.data[i]!, stops.data[i]!) };
    },
  };
}

/** One column of range labels: numeric when most of the first 200 read as numbers, else temporal. */
function labelRows(c: Collector, sample: string[], ends: EndsRule, hints: InferHints): Mode {
  const first = sample.slice(0, 200);
  const numeric = first.filter((s) => tryParseNumericRange(s, ends) !== null).length * 2 >= first.length;
  const time = numeric ? null : makeTimeReaders(hints);
  const derived = (r: Range) => (time === null ? formatRange(r) : time.format!(r));
  return {
    row(sa, _sb, line, key) {
      const text = sa.trim();
      if (text === '') { c.reject(line, text, 'empty-label'); return; }
      const r = time === null ? tryParseNumericRange(text, ends) : parseRangeLabel(text, { ends, time });
      if (r === null) { c.reject(line, text, 'not-a-range'); return; }
      const i = c.add(r.low, r.high, (r.lowClosed ? LOW_CLOSED : 0) | (r.highClosed ? HIGH_CLOSED : 0) | (r.discrete ? DISCRETE : 0), line, key);
      if (derived(r) !== text) c.texts.put(i, text);
    },
    finish() {
      const words = numeric ? 'integer labels whole numbers (0-4 holds 0 to 4); interval notation as written' : 'whole days and periods inclusive; date-times half-open';
      return { kind: numeric ? 'number' : 'time', ends: words, time, text: (i) => c.texts.get(i) ?? derived(rangeAt(c.cols, i)) };
    },
  };
}

function specRows(spec: unknown): RangeRows {
  const set = bucketsFromSpec(spec);
  const c = new Collector();
  for (const b of set.buckets) c.add(b.range.low, b.range.high, (b.range.lowClosed ? LOW_CLOSED : 0) | (b.range.highClosed ? HIGH_CLOSED : 0) | (b.range.discrete ? DISCRETE : 0), b.index, '');
  const ends = set.discrete ? 'whole numbers (spec)' : 'as the spec gives them';
  return c.finish({ kind: 'number', ends, time: null, text: (i) => set.buckets[i]!.label }, set.buckets.length, {});
}

const SAMPLE = 2000;

/** Reads the ranges of a table (or a spec) under an ends rule, streaming its rows. */
export async function readRanges(open: (() => Promise<TableReader>) | null, source: RangeSource, by: string | undefined, ends: EndsRule, hints: InferHints): Promise<RangeRows> {
  if (source.kind === 'spec') return specRows(source.spec);
  const columns = source.kind === 'range' ? [source.column] : [source.start, source.end];
  const two = columns.length > 1;
  const c = new Collector();
  // The first 2000 non-blank values of each column choose how they are read; rows wait until then.
  const sa: string[] = [], sb: string[] = [];
  const pending: Array<{ length: number; lines: ArrayLike<number>; values: string[][] }> = [];
  let mode: Mode | null = null;
  const choose = (): Mode => {
    if (source.kind === 'range') return labelRows(c, sa, ends, hints);
    const sample = [...sa, ...sb];
    // Numbers when most of the sample reads as numbers; the rest are then rejected one by one.
    return sample.length > 0 && inferNumberFormat(sample).ok * 2 > sample.length ? numericStartEnd(c, sample, ends) : timeStartEnd(c, ends, hints);
  };
  const feed = (m: Mode, batch: { length: number; lines: ArrayLike<number>; values: string[][] }): void => {
    const a = batch.values[0]!, b = two ? batch.values[1]! : null, k = by === undefined ? null : batch.values[columns.length]!;
    for (let i = 0; i < batch.length; i++) m.row(a[i]!, b === null ? '' : b[i]!, batch.lines[i]!, k === null ? '' : k[i]!);
  };
  const reader = await open!();
  let rowsRead = 0, table: Record<string, number> = {};
  try {
    for await (const batch of reader.batches(by === undefined ? columns : [...columns, by])) {
      if (mode !== null) { feed(mode, batch); continue; }
      pending.push(batch);
      for (const [col, into] of [[0, sa], [1, sb]] as const) {
        if (col === 1 && !two) continue;
        const vs = batch.values[col]!;
        for (let i = 0; i < batch.length && into.length < SAMPLE; i++) if (vs[i]!.trim() !== '') into.push(vs[i]!);
      }
      if (sa.length >= SAMPLE && (!two || sb.length >= SAMPLE)) { mode = choose(); for (const p of pending.splice(0)) feed(mode, p); }
    }
    const s = reader.summary();
    rowsRead = s.rowsRead;
    table = s.rejectedByReason;
  } finally {
    reader.close();
  }
  if (mode === null) { mode = choose(); for (const p of pending.splice(0)) feed(mode, p); }
  return c.finish(mode.finish(), rowsRead, table);
}
