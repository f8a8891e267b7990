// Reading ranges for `quern overlaps`: from start and end columns, from one column of labels, or from a
// bucket spec; every row read becomes a range or a counted rejection with its line and reason.
import {
  QuernError, discreteRange, emptyParsedNumber, formatRange, inferNumberFormat, makeNumberParser, makeRange, parseRangeLabel,
  rangeFromEndpoints, tryParseNumericRange, bucketsFromSpec,
} from '../../src/index.js';
import type { EndsRule, InferHints, Range, TableReader } from '../../src/index.js';
import { makeTimeReaders, type TimeReaders } from './overlaps-time.js';

export type RangeSource = { kind: 'start-end'; start: string; end: string } | { kind: 'range'; column: string } | { kind: 'spec'; spec: unknown };

export interface RangeRows {
  ranges: Range[];
  lines: number[];
  keys: string[];
  /** The range of row i as written (label, or start/end), made on demand so a million rows keep no strings. */
  text(i: number): string;
  kind: 'number' | 'time';
  /** How the ends were read, in words. */
  ends: string;
  rowsRead: number;
  rejected: { count: number; byReason: Record<string, number>; examples: Array<{ line: number; value: string; reason: string }> };
  time: TimeReaders | null;
}

interface Raw { a: string[]; b: string[]; keys: string[]; lines: number[]; rowsRead: number; tableRejected: Record<string, number> }

async function readRaw(reader: TableReader, columns: string[], by: string | undefined): Promise<Raw> {
  const raw: Raw = { a: [], b: [], keys: [], lines: [], rowsRead: 0, tableRejected: {} };
  const cols = by === undefined ? columns : [...columns, by];
  for await (const batch of reader.batches(cols)) {
    for (let i = 0; i < batch.length; i++) {
      raw.a.push(batch.values[0]![i]!);
      if (columns.length > 1) raw.b.push(batch.values[1]![i]!);
      raw.keys.push(by === undefined ? '' : batch.values[columns.length]![i]!);
      raw.lines.push(batch.lines[i]!);
    }
  }
  const s = reader.summary();
  raw.rowsRead = s.rowsRead;
  raw.tableRejected = { ...s.rejectedByReason };
  return raw;
}

function rejecter(out: RangeRows) {
  return (line: number, value: string, reason: string): void => {
    out.rejected.count++;
    out.rejected.byReason[reason] = (out.rejected.byReason[reason] ?? 0) + 1;
    if (out.rejected.examples.length < 5) out.rejected.examples.push({ line, value: value.slice(0, 80), reason });
  };
}

function emptyRows(raw: Raw, kind: 'number' | 'time', ends: string, time: TimeReaders | null): RangeRows {
  const count = Object.values(raw.tableRejected).reduce((x, y) => x + y, 0);
  return { ranges: [], lines: [], keys: [], text: () => '', kind, ends, rowsRead: raw.rowsRead, rejected: { count, byReason: { ...raw.tableRejected }, examples: [] }, time };
}

const sampleOf = (xs: string[]) => xs.filter((x) => x.trim() !== '').slice(0, 2000);

/** Start and end columns holding numbers: integers are whole-number ranges (both ends inclusive) under auto. */
function numericStartEnd(raw: Raw, ends: EndsRule): RangeRows {
  const p = makeNumberParser(inferNumberFormat([...sampleOf(raw.a), ...sampleOf(raw.b)]).format);
  const out = emptyParsedNumber();
  const lo: number[] = [], hi: number[] = [], idx: number[] = [];
  const rows0 = emptyRows(raw, 'number', '', null);
  const reject = rejecter(rows0);
  let ints = true;
  const text = (i: number) => `${raw.a[i]!.trim()}/${raw.b[i]!.trim()}`;
  for (let i = 0; i < raw.a.length; i++) {
    if (p.parse(raw.a[i]!, out) !== 'ok') { reject(raw.lines[i]!, text(i), out.status === 'empty' ? 'empty-start' : 'invalid-start'); continue; }
    const a = out.value;
    if (p.parse(raw.b[i]!, out) !== 'ok') { reject(raw.lines[i]!, text(i), out.status === 'empty' ? 'empty-end' : 'invalid-end'); continue; }
    if (out.value < a) { reject(raw.lines[i]!, text(i), 'reversed-range'); continue; }
    lo.push(a); hi.push(out.value); idx.push(i);
    if (ints && !(Number.isInteger(a) && Number.isInteger(out.value))) ints = false;
  }
  const discrete = ends === 'discrete' || (ends === 'auto' && ints);
  if (ends === 'discrete' && !ints) throw new QuernError('E_DATA', '--ends discrete needs whole numbers in the start and end columns');
  rows0.ends = discrete ? 'whole numbers, both ends inclusive' : ends === 'closed' ? 'closed [start, end]' : ends === 'open-closed' ? '(start, end]' : 'half-open [start, end)';
  const rawIndex: number[] = [];
  for (let k = 0; k < idx.length; k++) {
    const r = discrete ? discreteRange(lo[k]!, hi[k]!) : makeRange(lo[k]!, hi[k]!, ends !== 'open-closed', ends === 'closed' || ends === 'open-closed');
    push(rows0, r, raw, idx[k]!, rawIndex);
  }
  rows0.text = (i) => formatRange(rows0.ranges[i]!);
  return rows0;
}

function push(rows: RangeRows, r: Range, raw: Raw, i: number, rawIndex: number[]): void {
  rows.ranges.push(r); rows.lines.push(raw.lines[i]!); rows.keys.push(raw.keys[i]!); rawIndex.push(i);
}

function timeStartEnd(raw: Raw, ends: EndsRule, hints: InferHints): RangeRows {
  const time = makeTimeReaders(hints);
  const rows = emptyRows(raw, 'time', '', time);
  const reject = rejecter(rows);
  let whole = 0, instants = 0;
  const rawIndex: number[] = [];
  for (let i = 0; i < raw.a.length; i++) {
    const text = `${raw.a[i]!.trim()}/${raw.b[i]!.trim()}`;
    if (raw.a[i]!.trim() === '' || raw.b[i]!.trim() === '') { reject(raw.lines[i]!, text, raw.a[i]!.trim() === '' ? 'empty-start' : 'empty-end'); continue; }
    const a = time.read(raw.a[i]!);
    const b = a === null ? null : time.read(raw.b[i]!);
    if (a === null || b === null) { reject(raw.lines[i]!, text, a === null ? 'invalid-start' : 'invalid-end'); continue; }
    const r = rangeFromEndpoints(a, b, ends);
    if (r === null) { reject(raw.lines[i]!, text, 'reversed-range'); continue; }
    if (b.whole) whole++; else instants++;
    push(rows, r, raw, i, rawIndex);
  }
  rows.text = (k) => `${raw.a[rawIndex[k]!]!.trim()}/${raw.b[rawIndex[k]!]!.trim()}`;
  rows.ends = ends === 'half-open' ? 'half-open [start, end)' : whole >= instants ? 'whole days (or periods), both ends inclusive' : ends === 'closed' ? 'closed [start, end]' : 'date-times, half-open [start, end)';
  return rows;
}

function labelRows(raw: Raw, ends: EndsRule, hints: InferHints): RangeRows {
  const sample = sampleOf(raw.a).slice(0, 200);
  const numeric = sample.filter((s) => tryParseNumericRange(s, ends) !== null).length * 2 >= sample.length;
  const time = numeric ? null : makeTimeReaders(hints);
  const rows = emptyRows(raw, numeric ? 'number' : 'time', numeric ? 'integer labels whole numbers (0-4 holds 0 to 4); interval notation as written' : 'whole days and periods inclusive; date-times half-open', time);
  const reject = rejecter(rows);
  const rawIndex: number[] = [];
  rows.text = (k) => raw.a[rawIndex[k]!]!.trim();
  for (let i = 0; i < raw.a.length; i++) {
    const text = raw.a[i]!.trim();
    if (text === '') { reject(raw.lines[i]!, text, 'empty-label'); continue; }
    const r = numeric ? tryParseNumericRange(text, ends) : parseRangeLabel(text, { ends, time: time! });
    if (r === null) { reject(raw.lines[i]!, text, 'not-a-range'); continue; }
    push(rows, r, raw, i, rawIndex);
  }
  return rows;
}

/** Reads the ranges of a table (or a spec) under an ends rule. */
export async function readRanges(open: (() => Promise<TableReader>) | null, source: RangeSource, by: string | undefined, ends: EndsRule, hints: InferHints): Promise<RangeRows> {
  if (source.kind === 'spec') {
    const set = bucketsFromSpec(source.spec);
    const raw: Raw = { a: [], b: [], keys: [], lines: [], rowsRead: set.buckets.length, tableRejected: {} };
    const rows = emptyRows(raw, 'number', set.discrete ? 'whole numbers (spec)' : 'as the spec gives them', null);
    for (const b of set.buckets) { rows.ranges.push(b.range); rows.lines.push(b.index); rows.keys.push(''); }
    rows.text = (i) => set.buckets[i]!.label;
    return rows;
  }
  const reader = await open!();
  let raw: Raw;
  try {
    raw = await readRaw(reader, source.kind === 'range' ? [source.column] : [source.start, source.end], by);
  } finally {
    reader.close();
  }
  if (source.kind === 'range') return labelRows(raw, ends, hints);
  const sample = [...sampleOf(raw.a), ...sampleOf(raw.b)];
  const nf = inferNumberFormat(sample);
  // Numbers when most of the sample reads as numbers; the rest are then rejected one by one.
  return sample.length > 0 && nf.ok * 2 > sample.length ? numericStartEnd(raw, ends) : timeStartEnd(raw, ends, hints);
}
