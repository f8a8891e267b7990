// rebin: events (or source periods) of a table into calendar periods, per group, with aggregates and the
// empty periods filled. Streams the table once; memory grows with periods × groups, not with rows.
import { makeCalendar } from '../calendar/index.js';
import type { Calendar } from '../calendar/types.js';
import { QuernError } from '../errors.js';
import type { ByteBatch, ColumnBatch, ReadSummary, TableReader } from '../table/types.js';
import { byteFieldString } from '../table/byte-batch.js';
import type { KernelTally } from '../table/structurals.js';
import { getZone } from '../time/zone.js';
import type { Zone } from '../time/zone.js';
import { CellStore, DEFAULT_LIMITS } from './accumulate.js';
import { aggColumns, parseAggSpecs } from './aggregates.js';
import type { AggSpec } from './aggregates.js';
import { checkFill, defaultMaxPeriods, fillRange } from './fill.js';
import { GroupIndex } from './groups.js';
import { LocalResolver } from './local-time.js';
import { measureNeeds } from './measures.js';
import { refuseNonAdditive } from './period-source.js';
import { buildRows, occupiedKeys } from './rows.js';
import { RebinScan, requirePolicy } from './scan.js';
import type { ScanCounts, ScanSetup } from './scan.js';
import { SAMPLE, inferFormats, makeSetup } from './setup.js';
import type { ColumnPlan, ReadFormats } from './setup.js';
import type { RebinOptions, RebinResult, RebinSummary } from './types.js';

/**
 * Rebins the rows of `reader` into periods of `options.calendar`: each row's time is parsed (offsets
 * honoured, wall-clock readings placed in the zone by quern's one rule), floored with the calendar, and
 * added to its (period, group) cell. Data problems are counted in the summary; misuse throws QuernError.
 */
export async function rebin(reader: TableReader, options: RebinOptions): Promise<RebinResult> {
  const p = prepareRebin(reader, options);
  const { setup, scan } = await scanTable(reader, options, p, null);
  return finishRebin(reader.summary(), options, p, setup, scan.counts);
}

/** What a rebin fixes before reading any row: aggregates, calendar, zone and the columns to read. */
export interface PreparedRebin {
  aggs: AggSpec[];
  cal: Calendar;
  zone: Zone;
  plan: ColumnPlan;
  /** True when the time column is read from bytes (fast engine, and no --by or measure reads it). */
  bytes: boolean;
}

/** Checks the options against the table's header and fixes what the scan needs (QuernError on misuse). */
export function prepareRebin(reader: TableReader, options: RebinOptions): PreparedRebin {
  const aggs = [...(options.aggregates ?? parseAggSpecs([]))];
  if (options.assign === 'apportion') refuseNonAdditive(aggs);
  const cal = makeCalendar(options.calendar);
  const zone = getZone(cal.zone);
  const by = [...(options.by ?? [])];
  checkOutputNames(by, aggs);
  const measureCols = aggColumns(aggs);
  const columns = uniqueColumns(reader, [options.time, ...by, ...measureCols]);
  const plan: ColumnPlan = { columns, by, measureCols, needs: measureNeeds(measureCols, aggs) };
  // The fast engine reads the time column as bytes, when it is needed nowhere else (a --by or measure
  // on it reads its text); the reference engine keeps the string path, so the two can be compared.
  const bytes = reader.engine === 'fast' && !by.includes(options.time) && !measureCols.includes(options.time);
  return { aggs, cal, zone, plan, bytes };
}

/** A fresh scan setup over empty cells and groups, reading the columns in `formats`. */
export function freshSetup(file: string, options: RebinOptions, p: PreparedRebin, formats: ReadFormats): ScanSetup {
  const store = new CellStore(p.plan.needs, { ...DEFAULT_LIMITS, ...options.limits });
  const groups = new GroupIndex(p.plan.by.length);
  if (p.plan.by.length === 0) groups.idOf1('');
  return makeSetup(file, options, p.cal, p.plan, formats, store, groups, new LocalResolver(p.zone));
}

/**
 * Reads every row of `reader` into a fresh scan. The formats are `formats` when given (a range of a
 * parallel rebin), else inferred from the first rows (the same rows on the byte and the string path).
 */
export async function scanTable(reader: TableReader, options: RebinOptions, p: PreparedRebin,
  formats: ReadFormats | null): Promise<{ setup: ScanSetup; scan: RebinScan }> {
  const toWall = (ms: number): number => p.zone.toWall(ms);
  const make = (first: ColumnBatch): ScanSetup => freshSetup(reader.file, options, p, formats ?? inferFormats(options, p.cal, p.plan, first));
  if (p.bytes) return scanBytes(reader, p.plan.columns, make, toWall);
  let ready: { setup: ScanSetup; scan: RebinScan } | null = null;
  for await (const b of reader.batches(p.plan.columns)) {
    if (ready === null) {
      const setup = make(b);
      ready = { setup, scan: new RebinScan(setup, toWall) };
    }
    ready.scan.batch(b);
  }
  if (ready === null) {
    const setup = make(emptyBatch(p.plan.columns.length));
    ready = { setup, scan: new RebinScan(setup, toWall) };
  }
  return ready;
}

/**
 * The formats a whole read of `reader` would infer: from the same first rows (byte or string path).
 * Reads only the first rows; the reader is spent afterwards.
 */
export async function sampleFormats(reader: TableReader, options: RebinOptions, p: PreparedRebin): Promise<ReadFormats> {
  const cols = p.plan.columns;
  if (!p.bytes) {
    for await (const b of reader.batches(cols)) return inferFormats(options, p.cal, p.plan, b);
    return inferFormats(options, p.cal, p.plan, emptyBatch(cols.length));
  }
  const want = Math.min(SAMPLE, reader.batchSize);
  const pending: ByteBatch[] = [];
  let have = 0;
  for await (const b of reader.byteBatches([cols[0]!], cols.slice(1))) {
    pending.push(b);
    have += b.length;
    if (have >= want) break;
  }
  return inferFormats(options, p.cal, p.plan, sampleOf(pending, want, cols.length));
}

function emptyBatch(width: number): ColumnBatch {
  return { length: 0, lines: [], values: Array.from({ length: width }, () => []) };
}

/**
 * Reads the table as byte batches (the time column as bytes, the others as strings) into a RebinScan.
 * The scan is set up from the same first rows that `batches` would give as its first batch, so the
 * inferred time and number formats are the same.
 */
async function scanBytes(reader: TableReader, columns: readonly string[], make: (first: ColumnBatch) => ScanSetup,
  toWall: (ms: number) => number): Promise<{ setup: ScanSetup; scan: RebinScan }> {
  const want = Math.min(SAMPLE, reader.batchSize);
  const pending: ByteBatch[] = [];
  let have = 0;
  let ready: { setup: ScanSetup; scan: RebinScan } | null = null;
  const view = (b: ByteBatch): ColumnBatch => ({ length: b.length, lines: b.lines, values: [[], ...b.values] });
  const start = (): { setup: ScanSetup; scan: RebinScan } => {
    const setup = make(sampleOf(pending, want, columns.length));
    const scan = new RebinScan(setup, toWall);
    for (const p of pending) scan.bytes(p, view(p));
    pending.length = 0;
    return { setup, scan };
  };
  // Once the first rows are scanned no batch is kept: the reader may reuse its buffers.
  // From then on, a count of instants may be tallied straight from the record kernel (RebinScan.startTally).
  // The first buffer's rows come at once (`early`), so the tally is there from the second buffer on.
  const read: { transient: boolean; tally: KernelTally | null; early: boolean } = { transient: false, tally: null, early: true };
  for await (const b of reader.byteBatches([columns[0]!], columns.slice(1), read)) {
    if (ready !== null) {
      ready.scan.bytes(b, view(b));
      continue;
    }
    pending.push(b);
    have += b.length;
    if (have >= want) {
      ready = start();
      read.transient = true;
      read.tally = ready.scan.startTally();
    }
  }
  read.tally = null;
  ready?.scan.finishTally();
  return ready ?? start();
}

/** The first `n` rows of byte batches as a string batch of all columns (time first), for inference. */
function sampleOf(batches: readonly ByteBatch[], n: number, width: number): ColumnBatch {
  const values: string[][] = Array.from({ length: width }, () => []);
  const lines: number[] = [];
  for (const b of batches) {
    for (let i = 0; i < b.length && lines.length < n; i++) {
      lines.push(b.lines[i]!);
      values[0]!.push(byteFieldString(b, 0, i));
      for (let c = 1; c < width; c++) values[c]!.push(b.values[c - 1]![i]!);
    }
  }
  return { length: lines.length, lines, values };
}

/**
 * After the scan (of one read, or the merge of a parallel one): the policy check, the fill range and its
 * guard, the rows and the summary. `read` is the table reader's row accounting.
 */
export function finishRebin(read: ReadSummary, options: RebinOptions, p: PreparedRebin, setup: ScanSetup, c: ScanCounts): RebinResult {
  const { cal, zone, aggs, plan } = p;
  requirePolicy(c, setup.assign, cal);
  const { store, groups } = setup;
  const fill = options.fill ?? true;
  const range = fill ? fillRange(c.extremes, setup.fromKey, setup.untilKey) : null;
  if (range !== null) {
    const explicit = setup.fromKey !== null && setup.untilKey !== null;
    checkFill(range, occupiedKeys(store), c.extremes, options.maxPeriods ?? defaultMaxPeriods(cal.unit, cal.step), cal, explicit);
  }
  const measureOf = aggs.map((a) => (a.column === null ? -1 : plan.measureCols.indexOf(a.column)));
  const quantileType = options.quantileType ?? 7;
  const rows = fill && range === null ? [] : buildRows({ cal, zone, store, groups, aggs, measureOf, quantileType, range });
  const summary = summarize(read, options, setup, c, rows.filter((r) => r.filled).length);
  summary.periods = range !== null ? range.last - range.first + 1 : occupiedKeys(store).length;
  return {
    unit: cal.unit, step: cal.step, zone: cal.zone, weekStart: cal.weekStart, fiscalStart: { ...cal.fiscalStart },
    fiscalLabel: cal.fiscalLabel, quantileType,
    columns: ['period', 'start', 'end', ...plan.by, ...aggs.map((a) => a.name)],
    groupColumns: [...plan.by], aggregates: aggs.map((a) => a.name), rows, summary,
  };
}

function checkOutputNames(by: readonly string[], aggs: readonly AggSpec[]): void {
  const seen = new Set(['period', 'start', 'end']);
  for (const name of [...by, ...aggs.map((a) => a.name)]) {
    if (seen.has(name)) {
      throw new QuernError('E_USAGE', `two output columns would be named ${JSON.stringify(name)}`, 'give each --by column once, and rename an input column that is called period, start or end');
    }
    seen.add(name);
  }
}

function uniqueColumns(reader: TableReader, names: readonly string[]): string[] {
  const out: string[] = [];
  for (const n of names) {
    reader.columnIndex(n); // throws E_COLUMN with the nearest spelling
    if (!out.includes(n)) out.push(n);
  }
  return out;
}

function summarize(t: ReadSummary, o: RebinOptions, setup: ScanSetup, c: ScanCounts, filled: number): RebinSummary {
  const rejectedByReason: Record<string, number> = { ...t.rejectedByReason };
  for (const [k, v] of Object.entries(c.rejectedByReason)) rejectedByReason[k] = (rejectedByReason[k] ?? 0) + v;
  const notes: string[] = [];
  if (o.calendar.zone === undefined && c.offsets.size > 0) {
    const offs = [...c.offsets].map(offsetWords).join(', ');
    notes.push(`the values carry offsets (${offs}) but periods were cut in UTC; pass --zone to cut them in local time`);
  }
  if (setup.time.kind === 'local' && o.calendar.zone === undefined) {
    notes.push('the values carry no offset and were read as wall-clock time in UTC; pass --zone to read them in a zone');
  }
  if (c.leapSeconds > 0) {
    notes.push(`${c.leapSeconds} value${c.leapSeconds === 1 ? ' was a leap second' : 's were leap seconds'} (23:59:60, first on line ${c.firstLeapSecondLine}), read as 23:59:59.999 so ${c.leapSeconds === 1 ? 'it stays' : 'they stay'} in ${c.leapSeconds === 1 ? 'its' : 'their'} own minute and day`);
  }
  const summary: RebinSummary = {
    file: t.file, rowsRead: t.rowsRead, rowsUsed: c.used, rowsEmpty: c.empty, rowsRejected: t.rowsRejected + c.rejected,
    rejectedByReason, rowsOutside: c.outside, examples: [...t.examples, ...c.examples].slice(0, o.maxExamples ?? 5),
    periods: 0, groups: setup.groups.size, filledRows: filled,
    localTime: { ...setup.resolver.counts, rule: 'a skipped reading moves forward by the gap; a repeated one takes the earlier instant' },
    timeFormat: { id: setup.time.id, label: setup.time.label, kind: setup.time.kind },
    sourcePeriods: c.periodRows > 0 ? { unit: c.sourceUnit, rows: c.periodRows, straddling: c.straddling, policy: setup.assign } : null,
    measures: setup.measures.map((m) => ({ ...m.summary, rejectedByReason: { ...m.summary.rejectedByReason } })),
    notes,
  };
  if (filled > 0 && summary.rowsRejected > 0) notes.push(rejectedHint(filled, summary.rowsRejected));
  const sum = summary.rowsUsed + summary.rowsEmpty + summary.rowsRejected + summary.rowsOutside;
  if (sum !== summary.rowsRead) {
    throw new QuernError('E_INTERNAL', `row accounting is off: ${sum} rows placed, empty, rejected or outside, but ${summary.rowsRead} read`);
  }
  return summary;
}

// A filled (empty) period next to rejected rows may be empty only because its row was rejected: a rejected
// row has no period quern may place it in, so the note says so rather than naming one.
function rejectedHint(filled: number, rejected: number): string {
  const rows = rejected === 1 ? '1 row was' : `${rejected.toLocaleString('en-US')} rows were`;
  const periods = filled === 1 ? '1 filled row holds' : `${filled.toLocaleString('en-US')} filled rows hold`;
  return `${periods} no source row while ${rows} rejected: a period may be empty only because its row was rejected (see the examples)`;
}

function offsetWords(minutes: number): string {
  const sign = minutes < 0 ? '-' : '+';
  const a = Math.abs(minutes);
  return `${sign}${String(Math.floor(a / 60)).padStart(2, '0')}:${String(a % 60).padStart(2, '0')}`;
}
