// Bucketing a table column: one pass for fixed edges, schemes and specs; for methods that need every
// value, a first pass keeps the numbers in a Float64Array and a second pass writes the rows.
import type { ColumnBatch, TableReader } from '../table/types.js';
import { emptyParsedNumber, inferNumberFormat, makeNumberParser, type NumberFormat, type NumberFormatInference, type NumberParser } from '../numbers/index.js';
import { buildBuckets, planNeedsData, type BucketPlan, type BuildOptions } from './build.js';
import { BucketTally, type BucketSummary } from './tally.js';
import { NumberBuffer } from './values.js';
import { assignBytes, collectBytes, type AssignSpec } from './byte-pass.js';
import type { CsvRowsOutput } from './csv-rows.js';
import type { BucketSet } from './types.js';

export interface BucketRunOptions extends BuildOptions {
  value: string;
  plan: BucketPlan;
  /** The column's number format; inferred from the first batch when absent. */
  numberFormat?: Partial<NumberFormat>;
  maxExamples?: number;
}

/** Receives every row with its label and order index ('' for rows in no bucket). */
export interface BucketSink {
  start(header: readonly string[]): Promise<void>;
  batch(batch: ColumnBatch, labels: readonly string[], indices: readonly string[]): Promise<void>;
}

export interface BucketRunResult {
  summary: BucketSummary;
  set: BucketSet;
  /** How the column's numbers were read: inferred (with its evidence) or given. */
  numberFormat: { format: NumberFormat; inferred: NumberFormatInference | null };
  /** 1 for one pass, 2 when the method needed every value first. */
  passes: number;
}

function parserFor(first: ColumnBatch, col: number, given: Partial<NumberFormat> | undefined): BucketRunResult['numberFormat'] & { parser: NumberParser } {
  if (given !== undefined) {
    const parser = makeNumberParser(given);
    return { parser, format: parser.format, inferred: null };
  }
  const inferred = inferNumberFormat(first.values[col]!.slice(0, 10_000));
  return { parser: makeNumberParser(inferred.format), format: inferred.format, inferred };
}

/** Pass one of a data-driven method: every number of the column, sorted, and the number format. */
async function collect(reader: TableReader, o: BucketRunOptions): Promise<{ sorted: Float64Array; integers: boolean; nf: BucketRunResult['numberFormat'] }> {
  const buf = new NumberBuffer();
  const out = emptyParsedNumber();
  let integers = true;
  let nf: (BucketRunResult['numberFormat'] & { parser: NumberParser }) | null = null;
  for await (const batch of reader.batches([o.value])) {
    nf ??= parserFor(batch, 0, o.numberFormat);
    const col = batch.values[0]!;
    for (let i = 0; i < batch.length; i++) {
      if (nf.parser.parse(col[i]!, out) !== 'ok') continue;
      buf.push(out.value);
      if (integers && !Number.isInteger(out.value)) integers = false;
    }
  }
  const format = nf ?? parserFor({ length: 0, lines: [], values: [[]] }, 0, o.numberFormat);
  return { sorted: buf.sortInPlace(), integers, nf: { format: format.format, inferred: format.inferred } };
}

/** True when every number of the batch that parses is a whole number. */
function batchIntegers(values: readonly string[], parser: NumberParser): boolean {
  const out = emptyParsedNumber();
  for (const v of values) if (parser.parse(v, out) === 'ok' && !Number.isInteger(out.value)) return false;
  return true;
}

/**
 * The pass that assigns every row, tallies it and hands the rows to the sink. The bucket set is made
 * from the first batch, so fixed edges get whole-number labels only when the data are whole numbers.
 */
async function assign(reader: TableReader, o: BucketRunOptions, makeSet: (integers: boolean) => BucketSet, given: Partial<NumberFormat> | undefined, sink?: BucketSink) {
  const columns = sink === undefined ? [o.value] : [...reader.header];
  const col = sink === undefined ? 0 : reader.columnIndex(o.value);
  const out = emptyParsedNumber();
  let set: BucketSet | null = null;
  let tally: BucketTally | null = null;
  let labels: string[] = [];
  let nf: (BucketRunResult['numberFormat'] & { parser: NumberParser }) | null = null;
  await sink?.start(reader.header);
  for await (const batch of reader.batches(columns)) {
    const values = batch.values[col]!;
    nf ??= parserFor(batch, col, given);
    if (tally === null) {
      set = makeSet(batchIntegers(values, nf.parser));
      tally = new BucketTally(set, o.maxExamples ?? 5);
      labels = set.buckets.map((b) => b.label);
    }
    const ls: string[] = new Array(batch.length);
    const is: string[] = new Array(batch.length);
    for (let i = 0; i < batch.length; i++) {
      nf.parser.parse(values[i]!, out);
      const k = tally.record(batch.lines[i]!, values[i]!, out);
      ls[i] = k >= 0 ? labels[k]! : '';
      is[i] = k >= 0 ? String(k) : '';
    }
    await sink?.batch(batch, ls, is);
  }
  set ??= makeSet(true);
  tally ??= new BucketTally(set, o.maxExamples ?? 5);
  const s = reader.summary();
  return { set, summary: tally.summary(reader.file, o.value, s.rowsRead, s.rejectedByReason, s.examples), nf };
}

/** The bucket set maker of a plan: fixed plans at once, data-driven ones after pass one. */
type SetMaker = (integers: boolean) => BucketSet;

/** Pass one for data-driven plans (over bytes, or strings for the reference path). */
async function planSets(open: () => Promise<TableReader>, options: BucketRunOptions, strings: boolean): Promise<{ makeSet: SetMaker; given: Partial<NumberFormat> | undefined; inferred: NumberFormatInference | null; passes: number }> {
  if (!planNeedsData(options.plan)) {
    // fixed edges: whole-number labels when the first batch holds whole numbers (unless options.discrete says)
    const makeSet: SetMaker = (integers) => buildBuckets(options.plan, { ...options, discrete: options.discrete ?? (integers ? undefined : false) });
    return { makeSet, given: options.numberFormat, inferred: null, passes: 1 };
  }
  const first = await open();
  let data;
  try {
    if (strings) data = await collect(first, options);
    else { const d = await collectBytes(first, options.value, options.numberFormat); data = { sorted: d.sorted, integers: d.integers, nf: { format: d.reading.format, inferred: d.reading.inferred } }; }
  } finally { first.close(); }
  const set = buildBuckets(options.plan, options, { sorted: data.sorted, integers: data.integers });
  // the second pass reads numbers exactly as the first did
  return { makeSet: () => set, given: data.nf.format, inferred: data.nf.inferred, passes: 2 };
}

/**
 * Buckets the column `options.value` of a table. `open` is called once, or twice when the method needs
 * every value first (quantiles, Ckmeans, bin-count rules, equal width): the numbers are then held in
 * Float64Arrays (8 bytes a value), never as row objects. Every row read is accounted for in the summary.
 * Without a sink the values are read and parsed as bytes; with a sink (rows as strings) the string path
 * runs, which is the reference the byte path is tested against.
 */
export async function bucketTable(open: () => Promise<TableReader>, options: BucketRunOptions, sink?: BucketSink): Promise<BucketRunResult> {
  const plan = await planSets(open, options, sink !== undefined);
  const reader = await open();
  try {
    if (sink === undefined) return fromBytes(reader, options, plan, await assignBytes(reader, byteSpec(options, plan)));
    const r = await assign(reader, options, plan.makeSet, plan.given, sink);
    const format = r.nf?.format ?? makeNumberParser(plan.given).format;
    return { summary: r.summary, set: r.set, numberFormat: { format, inferred: plan.inferred ?? r.nf?.inferred ?? null }, passes: plan.passes };
  } finally {
    reader.close();
  }
}

/**
 * Buckets the column `options.value` and writes every row with its range label and order index as CSV
 * (the header, then the rows, as csvRow writes them: RFC 4180 quoting, formula cells neutralised unless
 * `output.neutraliseFormulas` is false). Values are read and rows built as bytes; see bucketTable.
 */
export async function bucketTableCsv(open: () => Promise<TableReader>, options: BucketRunOptions, output: CsvRowsOutput): Promise<BucketRunResult> {
  const plan = await planSets(open, options, false);
  const reader = await open();
  try {
    return fromBytes(reader, options, plan, await assignBytes(reader, { ...byteSpec(options, plan), output }));
  } finally {
    reader.close();
  }
}

function byteSpec(options: BucketRunOptions, plan: { makeSet: SetMaker; given: Partial<NumberFormat> | undefined }): AssignSpec {
  return { value: options.value, given: plan.given, makeSet: plan.makeSet, maxExamples: options.maxExamples ?? 5 };
}

function fromBytes(reader: TableReader, options: BucketRunOptions, plan: { inferred: NumberFormatInference | null; passes: number }, r: Awaited<ReturnType<typeof assignBytes>>): BucketRunResult {
  const s = reader.summary();
  const summary = r.tally.summary(reader.file, options.value, s.rowsRead, s.rejectedByReason, s.examples);
  return { summary, set: r.set, numberFormat: { format: r.reading.format, inferred: plan.inferred ?? r.reading.inferred }, passes: plan.passes };
}
