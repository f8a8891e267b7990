// The fast passes of `bucket`: values read from byte batches (TableReader.byteBatches) and parsed from
// their bytes, rows written as CSV bytes. Results are those of the string passes in run.ts (the reference
// path, kept for BucketSink callers): the same number format, decided from the same first `batchSize`
// rows, the same parser acceptance, the same bucket for every value, the same CSV cells.
import { byteFieldString, type ByteBatch, type TableReader } from '../table/index.js';
import { emptyParsedNumber, inferNumberFormat, makeNumberParser, type NumberFormat, type NumberFormatInference, type NumberParser, type ParsedNumber } from '../numbers/index.js';
import { makeNumberBytesParser, type NumberBytesParser } from './number-bytes.js';
import { CsvRowEncoder, type CsvRowsOutput } from './csv-rows.js';
import { BucketTally, NOT_COUNTED } from './tally.js';
import { NumberBuffer } from './values.js';
import type { BucketSet } from './types.js';

/** How a column's numbers are read: the parser and whether its format was inferred. */
export interface NumberReading { parser: NumberParser; format: NumberFormat; inferred: NumberFormatInference | null }

/** The number parser for a column: the given format, or one inferred from the first values (at most 10,000); none inferred without rows. */
export function readingFor(sample: readonly string[], given: Partial<NumberFormat> | undefined): NumberReading {
  if (given !== undefined || sample.length === 0) {
    const parser = makeNumberParser(given);
    return { parser, format: parser.format, inferred: null };
  }
  const inferred = inferNumberFormat(sample.slice(0, 10_000));
  return { parser: makeNumberParser(inferred.format), format: inferred.format, inferred };
}

/** True when every number of the sample that parses is a whole number. */
export function sampleIntegers(values: readonly string[], parser: NumberParser): boolean {
  const out = emptyParsedNumber();
  for (const v of values) if (parser.parse(v, out) === 'ok' && !Number.isInteger(out.value)) return false;
  return true;
}

/**
 * Reads byte batches until `rows` rows are held (or the input ends): the string path decides the number
 * format and whole-number labels from its first batch, which holds `batchSize` rows, while byte batches
 * may be cut shorter at the end of each chunk read.
 */
async function firstRows(it: AsyncIterator<ByteBatch>, col: number, rows: number): Promise<{ held: ByteBatch[]; sample: string[]; done: boolean }> {
  const held: ByteBatch[] = [];
  const sample: string[] = [];
  while (sample.length < rows) {
    const r = await it.next();
    if (r.done === true) return { held, sample, done: true };
    held.push(r.value);
    for (let i = 0; i < r.value.length && sample.length < rows; i++) sample.push(byteFieldString(r.value, col, i));
  }
  return { held, sample, done: false };
}

/** Every byte batch of `columns`, the first ones held back until the sample that settles the format is read. */
async function* withSample(reader: TableReader, columns: readonly string[], col: number, onSample: (sample: string[], held: readonly ByteBatch[]) => void): AsyncGenerator<ByteBatch> {
  // Once the held batches are handed on, each batch is used up before the next is asked for (values are
  // taken as numbers, rows copied out as CSV bytes): the reader may reuse its buffers from then on.
  const read = { transient: false };
  const it = reader.byteBatches(columns, [], read)[Symbol.asyncIterator]();
  try {
    const first = await firstRows(it, col, reader.batchSize);
    onSample(first.sample, first.held);
    yield* first.held;
    read.transient = true;
    if (first.done) return;
    for (;;) {
      const r = await it.next();
      if (r.done === true) return;
      yield r.value;
    }
  } finally {
    await it.return?.();
  }
}

/** The strings of `value` in the first `batchSize` rows: the sample the string path decides formats from. */
export async function firstSample(reader: TableReader, value: string): Promise<string[]> {
  const it = reader.byteBatches([value])[Symbol.asyncIterator]();
  try {
    return (await firstRows(it, 0, reader.batchSize)).sample;
  } finally {
    await it.return?.();
  }
}

/** The bytes of value column `col` of row i: buffer, start and end. */
function fieldBuf(b: ByteBatch, col: number, i: number): Uint8Array {
  return b.decoded[col]![i] === 1 ? b.side : b.buf;
}

/**
 * The number of rows a file of `totalBytes` likely holds, from the bytes between the first rows' value
 * fields in the fast engine's buffers (a batch never spans two buffers), plus 5%; 65,536 when unknown.
 */
export function expectedRows(reader: TableReader, held: readonly ByteBatch[]): number {
  if (reader.engine !== 'fast' || reader.format === 'ndjson' || reader.totalBytes === undefined) return 1 << 16;
  let bytes = 0, rows = 0;
  for (const b of held) {
    if (b.length < 2) continue;
    bytes += b.starts[0]![b.length - 1]! - b.starts[0]![0]!;
    rows += b.length - 1;
  }
  return rows === 0 || bytes <= 0 ? 1 << 16 : Math.ceil((reader.totalBytes / (bytes / rows)) * 1.05) + 1024;
}

/** Pass one of a data-driven method over bytes: every number of the column, sorted, and the reading. */
export async function collectBytes(reader: TableReader, value: string, given: Partial<NumberFormat> | undefined): Promise<{ sorted: Float64Array; integers: boolean; reading: NumberReading }> {
  let buf = new NumberBuffer(1);
  const out = emptyParsedNumber();
  let integers = true;
  let reading: NumberReading | null = null;
  let bytes: NumberBytesParser | null = null;
  const start = (sample: string[], held: readonly ByteBatch[]): void => {
    reading = readingFor(sample, given);
    bytes = makeNumberBytesParser(reading.parser);
    buf = new NumberBuffer(expectedRows(reader, held));
  };
  for await (const b of withSample(reader, [value], 0, start)) {
    const p = bytes!;
    const starts = b.starts[0]!, ends = b.ends[0]!;
    for (let i = 0; i < b.length; i++) {
      if (p.parse(fieldBuf(b, 0, i), starts[i]!, ends[i]!, out) !== 'ok') continue;
      buf.push(out.value);
      if (integers && !Number.isInteger(out.value)) integers = false;
    }
  }
  return { sorted: buf.sortInPlace(), integers, reading: reading ?? readingFor([], given) };
}

/** What the assigning pass needs besides the reader. */
export interface AssignSpec {
  value: string;
  given: Partial<NumberFormat> | undefined;
  /** The bucket set, given whether the first rows' numbers are whole. */
  makeSet: (integers: boolean) => BucketSet;
  maxExamples: number;
  /** Where rows go as CSV bytes; counting only when absent. */
  output?: CsvRowsOutput;
}

/** What assignBatch keeps from batch to batch: the small whole numbers' buckets, and counts made with them. */
interface SmallWholes { bucket: Int32Array; counts: Float64Array }

/** Counts (and writes) the rows of one byte batch. */
function assignBatch(b: ByteBatch, col: number, p: NumberBytesParser, tally: BucketTally, out: ParsedNumber, ks: Int32Array, small: SmallWholes): void {
  const starts = b.starts[col]!, ends = b.ends[col]!, decoded = b.decoded[col]!;
  const { bucket, counts } = small;
  for (let i = 0; i < b.length; i++) {
    const buf = decoded[i] === 1 ? b.side : b.buf;
    const s = starts[i]!, e = ends[i]!;
    // Digits only (at most 4: below SMALL_WHOLE): what p.parse reads as that whole number, looked up.
    if (e > s && e - s <= 4) {
      let v = 0, j = s;
      for (; j < e; j++) {
        const d = buf[j]! - 48;
        if (d < 0 || d > 9) break;
        v = v * 10 + d;
      }
      if (j === e) {
        const k = bucket[v]!;
        if (k >= 0) {
          counts[k]!++;
          ks[i] = k;
          continue;
        }
      }
    }
    const st = p.parse(buf, s, e, out);
    let k = st === 'ok' && !out.percent ? tally.tryCount(out.value) : NOT_COUNTED;
    if (k === NOT_COUNTED) k = tally.record(b.lines[i]!, byteFieldString(b, col, i), out);
    ks[i] = k;
  }
}

/**
 * The pass that assigns every row and tallies it, writing the rows with their label and index when an
 * output is given. Every row read is accounted for in the tally and the reader's summary.
 */
export async function assignBytes(reader: TableReader, spec: AssignSpec): Promise<{ set: BucketSet; tally: BucketTally; reading: NumberReading }> {
  const columns = spec.output === undefined ? [spec.value] : [...reader.header];
  const col = spec.output === undefined ? 0 : reader.columnIndex(spec.value);
  const out = emptyParsedNumber();
  let state: { set: BucketSet; tally: BucketTally; reading: NumberReading; bytes: NumberBytesParser; rows: CsvRowEncoder | null; small: SmallWholes } | null = null;
  const start = (sample: string[]): void => {
    const reading = readingFor(sample, spec.given);
    const set = spec.makeSet(sampleIntegers(sample, reading.parser));
    const rows = spec.output === undefined ? null : new CsvRowEncoder(spec.output, reader, set, spec.value);
    const tally = new BucketTally(set, spec.maxExamples);
    const small = { bucket: tally.smallWholes(), counts: new Float64Array(set.buckets.length) };
    state = { set, tally, reading, bytes: makeNumberBytesParser(reading.parser), rows, small };
  };
  let ks = new Int32Array(reader.batchSize);
  for await (const b of withSample(reader, columns, col, start)) {
    const s = state!;
    if (ks.length < b.length) ks = new Int32Array(b.length);
    assignBatch(b, col, s.bytes, s.tally, out, ks, s.small);
    if (s.rows !== null) {
      s.rows.batch(b, ks);
      if (s.rows.full) await s.rows.flush();
    }
  }
  if (state === null) start([]);
  const s = state!;
  s.tally.addCounts(s.small.counts);
  if (s.rows !== null) await s.rows.end();
  return { set: s.set, tally: s.tally, reading: s.reading };
}
